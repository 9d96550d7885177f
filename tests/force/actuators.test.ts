// Forces for actuators: coaxial loops and coils, magnet gaps, electrostatic
// actuators. Check values come from decimal.js oracles of the published
// expressions (Babic and Akyel 2008 for the loops, as written with K and E),
// from the mutual inductance and capacitance formulas' derivatives (the force
// is the derivative of the co-energy), and from physical limits (parallel
// wires, magnetic dipoles).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MU0 } from "../../src/constants/si.js";
import {
  coaxialCoilsForce, coaxialCoilsMutualInductance, coaxialLoopsForce, coaxialLoopsMutualInductance, combDriveForce,
  electrostaticForce, evaluate, gapPullForce, gappedCoreInductance, gappedCorePullForce, magneticPressure,
  parallelPlateCapacitance, parallelWiresForce, pullInVoltage,
  type Area, type Current, type FluxDensity, type Length, type Stiffness, type Voltage,
} from "../../src/index.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { codeOf } from "../helpers/errors.js";
import { dec } from "../math/decimal-elliptic.js";
import { loopsForceOracle } from "./loops-oracle.js";

const m = (v: number) => v as Length;
const A = (v: number) => v as Current;
const m2 = (v: number) => v as Area;
const V = (v: number) => v as Voltage;

const loops = (i1: number, i2: number, a: number, b: number, d: number) =>
  coaxialLoopsForce({ current1: A(i1), current2: A(i2), radius1: m(a), radius2: m(b), distance: m(d) });

describe("coaxialLoopsForce", () => {
  it("matches a decimal.js oracle of Babic and Akyel's closed form to 1e-14, from nearly touching to far apart", () => {
    const cases: [number, number, number][] = [
      [1, 1, 1], [0.05, 0.05, 0.01], [1, 2, 0.5], [1, 2, 3], [1, 1, 1e3], [1, 1, 1e6], [1, 3, 1e5], [1, 1, 1e-3], [1, 1, 1e-9],
      [1, 1 + 1e-9, 1e-9], [1, 1.5, 1e-12], [1e-3, 1, 0.2], [1, 1e-3, 0.2], [1, 1, 1e-15],
    ];
    for (const [a, b, d] of cases) {
      expectClose(loops(3, -2, a, b, d), {
        input: { a, b, d }, expected: loopsForceOracle(3, -2, a, b, d), tolerance: 1e-14,
        source: "decimal.js oracle of Babic and Akyel (2008), filament force with K, E by AGM",
      });
    }
  });

  it("is I1 I2 times minus the derivative of Maxwell's mutual inductance (Richardson difference of coaxialLoopsMutualInductance)", () => {
    for (const [a, b, d] of [[0.05, 0.03, 0.02], [1, 1, 0.3], [0.2, 1, 1.5]] as const) {
      const M = (z: number) => coaxialLoopsMutualInductance({ radius1: m(a), radius2: m(b), distance: m(z) }) as number;
      const h = 1e-3 * d;
      const d1 = (M(d + h) - M(d - h)) / (2 * h);
      const d2 = (M(d + 2 * h) - M(d - 2 * h)) / (4 * h);
      const derivative = (4 * d1 - d2) / 3; // Richardson: error O(h^4)
      expectClose(loops(2, 5, a, b, d), { input: { a, b, d }, expected: -10 * derivative, tolerance: 1e-8, source: "numerical derivative of Maxwell's M (the force law F = I1 I2 dM/dz)" });
    }
  });

  it("tends to the parallel-wire force on the circumference when the loops nearly touch", () => {
    const a = 0.1, d = 1e-7;
    const wires = parallelWiresForce({ current1: A(7), current2: A(7), separation: m(d), length: m(2 * Math.PI * a) });
    // The curvature correction is O((d/a) ln(a/d)) ~ 1e-5.
    expect(relativeError(loops(7, 7, a, a, d), wires)).toBeLessThan(1e-4);
  });

  it("tends to the force between two magnetic dipoles, 3 mu0 m1 m2 / (2 pi d^4), far apart", () => {
    // Griffiths (2013), problem 6.3 (from memory): F = 3 mu0 m1 m2 / (2 pi r^4) on the axis, m = I pi a^2.
    const a = 0.01, b = 0.02, d = 100;
    const m1 = 2 * Math.PI * a * a, m2m = 3 * Math.PI * b * b;
    const dipole = (3 * MU0 * m1 * m2m) / (2 * Math.PI * d ** 4);
    expect(relativeError(loops(2, 3, a, b, d), dipole)).toBeLessThan(1e-6); // correction O((a^2 + b^2)/d^2) = 5e-8 times a coefficient of a few
  });

  it("obeys Newton's third law and is scale-free: swapping the loops or scaling all lengths by 2^k changes nothing", () => {
    fc.assert(fc.property(
      fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-4, max: 1e4, noNaN: true }),
      fc.integer({ min: -200, max: 200 }),
      (a, b, d, k) => {
        const f = loops(1.5, -4, a, b, d);
        expect(relativeError(loops(-4, 1.5, b, a, d), f)).toBeLessThan(4 * Number.EPSILON); // the product's order changes
        expect(loops(1.5, -4, a * 2 ** k, b * 2 ** k, d * 2 ** k)).toBe(f);
        expect(f).toBeLessThan(0); // opposite currents repel
      },
    ));
  });

  it("is zero for loops in one plane, and refuses coinciding loops", () => {
    expect(loops(1, 1, 1, 2, 0)).toBe(0);
    expect(codeOf(() => loops(1, 1, 1, 1, 0))).toBe("out_of_domain");
    expect(codeOf(() => loops(1, 1, -1, 1, 1))).toBe("out_of_domain");
    expect(codeOf(() => loops(1, 1, 1, 1, Number.NaN))).toBe("not_finite");
  });

  it("cautions about pinch points from 140 N and fault currents from 1 kA, through evaluate", () => {
    const r = evaluate("coaxialLoopsForce", { current1: "2 kA", current2: "2 kA", radius1: "10 cm", radius2: "10 cm", distance: "1 mm" });
    expect(r.cautions.map((c) => c.code).sort()).toEqual(["fault_current_force", "pinch_point"]);
    expect(r.value as number).toBeGreaterThan(140);
  });
});

const coilBase = { turns1: 100, radius1: 0.01, length1: 0.02, turns2: 50, radius2: 0.015, length2: 0.01 };
const coils = (x: Partial<typeof coilBase> & { distance: number; current1?: number; current2?: number }) => {
  const y = { ...coilBase, current1: 1, current2: 1, ...x };
  return coaxialCoilsForce({
    current1: A(y.current1), turns1: y.turns1, radius1: m(y.radius1), length1: m(y.length1),
    current2: A(y.current2), turns2: y.turns2, radius2: m(y.radius2), length2: m(y.length2), distance: m(y.distance),
  }) as number;
};
const coilsM = (x: typeof coilBase & { distance: number }) =>
  coaxialCoilsMutualInductance({
    turns1: x.turns1, radius1: m(x.radius1), length1: m(x.length1), turns2: x.turns2, radius2: m(x.radius2), length2: m(x.length2), distance: m(x.distance),
  }) as number;

describe("coaxialCoilsForce", () => {
  it("is minus the derivative of coaxialCoilsMutualInductance (Richardson difference), apart, touching, overlapping and nested", () => {
    const shapes = [
      coilBase,
      { ...coilBase, radius2: 0.01 }, // equal radii: the filament force is singular where turns meet
      { turns1: 20, radius1: 0.02, length1: 0.05, turns2: 30, radius2: 0.005, length2: 0.01 }, // nested
    ];
    for (const s of shapes) {
      for (const d of [0.1, 0.03, 0.015, 0.005, 0.0021]) {
        const h = 1e-4 * Math.min(d, 0.01);
        const M = (z: number) => coilsM({ ...s, distance: z });
        const d1 = (M(d + h) - M(d - h)) / (2 * h);
        const d2 = (M(d + 2 * h) - M(d - 2 * h)) / (4 * h);
        expectClose(coils({ ...s, distance: d }), {
          input: { ...s, d }, expected: -(4 * d1 - d2) / 3, tolerance: 2e-7,
          source: "numerical derivative of coaxialCoilsMutualInductance (F = I1 I2 dM/dz)",
        });
      }
    }
  });

  it("tends to N1 N2 times the loop force for very short coils", () => {
    const a = 0.03, b = 0.02, d = 0.01;
    const short = coils({ turns1: 10, radius1: a, length1: 1e-7, turns2: 20, radius2: b, length2: 1e-7, distance: d });
    expect(relativeError(short, 200 * (loops(1, 1, a, b, d) as number))).toBeLessThan(1e-9);
  });

  it("is zero for concentric coils, odd in one current and the same on either coil (Newton's third law)", () => {
    expect(coils({ distance: 0 })).toBe(0);
    const f = coils({ distance: 0.012, current1: 2, current2: -3 });
    expect(f).toBeLessThan(0);
    const swapped = coils({ turns1: 50, radius1: 0.015, length1: 0.01, turns2: 100, radius2: 0.01, length2: 0.02, distance: 0.012, current1: -3, current2: 2 });
    expect(relativeError(swapped, f)).toBeLessThan(1e-13);
  });

  it("keeps its digits for coils far apart (the dipole limit) and tiny or huge coils", () => {
    const far = coils({ distance: 1e4 });
    const m1 = 100 * Math.PI * 0.01 ** 2, m2m = 50 * Math.PI * 0.015 ** 2;
    expect(relativeError(far, (3 * MU0 * m1 * m2m) / (2 * Math.PI * 1e16))).toBeLessThan(1e-9);
    const s = 2 ** -600;
    expect(coils({ radius1: 0.01 * s, length1: 0.02 * s, radius2: 0.015 * s, length2: 0.01 * s, distance: 0.03 * s })).toBe(coils({ distance: 0.03 }));
  });
});

describe("gapPullForce and gappedCorePullForce", () => {
  it("gapPullForce is the magnetic pressure times the pole area, B^2 A / (2 mu0)", () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 3, noNaN: true }), fc.double({ min: 1e-6, max: 1, noNaN: true }), (b, area) => {
      const f = gapPullForce({ fluxDensity: b as FluxDensity, poleArea: m2(area) }) as number;
      expect(relativeError(f, (magneticPressure({ fluxDensity: b as FluxDensity }) as number) * area)).toBeLessThan(4 * Number.EPSILON);
    }));
    // 1 T on 1 cm^2: 1e-4 / (2 mu0) = 39.788735... N (decimal: 1e-4 / (2 x 1.25663706127e-6)).
    const d = dec(40);
    expectClose(gapPullForce({ fluxDensity: 1 as FluxDensity, poleArea: m2(1e-4) }) as number, {
      expected: new d("1e-4").div(new d("2.51327412254e-6")).toNumber(), tolerance: 2 * Number.EPSILON, source: "decimal.js, mu0 CODATA 2022",
    });
  });

  it("gappedCorePullForce is I^2/2 times minus the derivative of gappedCoreInductance with the gap (co-energy)", () => {
    for (const [N, I, area, g, l, mur] of [[500, 1, 1e-4, 1e-3, 0.1, 2000], [20, 3, 4e-4, 5e-4, 0.3, 500], [1000, 0.2, 1e-5, 1e-4, 0.05, 8000]] as const) {
      const L = (gap: number) => gappedCoreInductance({ turns: N, pathLength: m(l), area: m2(area), relativePermeability: mur, gapLength: m(gap) }) as number;
      const h = 1e-4 * g;
      const d1 = (L(g + h) - L(g - h)) / (2 * h);
      const d2 = (L(g + 2 * h) - L(g - 2 * h)) / (4 * h);
      const f = gappedCorePullForce({ turns: N, current: A(I), poleArea: m2(area), gapLength: m(g), pathLength: m(l), relativePermeability: mur });
      expectClose(f as number, { input: { N, I, area, g, l, mur }, expected: -(I * I / 2) * (4 * d1 - d2) / 3, tolerance: 1e-9, source: "numerical derivative of the gapped-core inductance (co-energy method)" });
    }
  });

  it("warns of fringing and saturation and cautions about pinch points where the pull is large", () => {
    const r = evaluate("gappedCorePullForce", { turns: 1000, current: "5 A", poleArea: "4 cm^2", gapLength: "3 mm", pathLength: "20 cm", relativePermeability: 3000 });
    expect(r.warnings.map((w) => w.code).sort()).toEqual(["core_saturation", "fringing"]);
    expect(r.cautions.map((c) => c.code)).toContain("pinch_point");
    const small = evaluate("gappedCorePullForce", { turns: 100, current: "0.1 A", poleArea: "1 cm^2", gapLength: "0.5 mm", pathLength: "10 cm", relativePermeability: 2000 });
    expect(small.warnings).toEqual([]);
    expect(small.cautions.map((c) => c.code)).not.toContain("pinch_point");
  });
});

describe("electrostatic actuators", () => {
  it("electrostaticForce is V^2/2 times the derivative of the parallel-plate capacitance with the gap", () => {
    for (const [area, g, v, er] of [[1e-6, 2e-6, 10, 1], [1e-4, 1e-5, 200, 3.9]] as const) {
      const C = (gap: number) => parallelPlateCapacitance({ area: m2(area), gap: m(gap), relativePermittivity: er }) as number;
      const h = 1e-4 * g;
      const d1 = (C(g + h) - C(g - h)) / (2 * h);
      const d2 = (C(g + 2 * h) - C(g - 2 * h)) / (4 * h);
      const f = electrostaticForce({ area: m2(area), gap: m(g), voltage: V(v), relativePermittivity: er }) as number;
      expectClose(f, { input: { area, g, v, er }, expected: -(v * v / 2) * (4 * d1 - d2) / 3, tolerance: 1e-9, source: "numerical derivative of C(g) = eps A / g (energy method)" });
    }
  });

  it("pullInVoltage is where the spring's equilibrium disappears: at V_PI the plate balances at a third of the gap with equal stiffnesses", () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-7, max: 1e-4, noNaN: true }), fc.double({ min: 1e-10, max: 1e-6, noNaN: true }), (k, g, area) => {
      const v = pullInVoltage({ springConstant: k as Stiffness, gap: m(g), area: m2(area) }) as number;
      // Senturia (2001), ch. 6: force balance k x = eps A V^2 / (2 (g - x)^2) at x = g/3, and the
      // electrostatic stiffness eps A V^2 / (g - x)^3 equals k there.
      const fe = electrostaticForce({ area: m2(area), gap: m((2 * g) / 3), voltage: V(v) }) as number;
      expect(relativeError(fe, (k * g) / 3)).toBeLessThan(1e-14);
      expect(relativeError((2 * fe) / ((2 * g) / 3), k)).toBeLessThan(1e-14);
    }));
  });

  it("combDriveForce is V^2/2 times dC/dx with C = 2 n eps0 t x / g, independent of the engagement", () => {
    const d = dec(40);
    const eps0 = new d("8.8541878188e-12"); // CODATA 2022
    const want = eps0.times(100).times("2e-6").times(400).div("2e-6");
    expectClose(combDriveForce({ fingers: 100, thickness: m(2e-6), gap: m(2e-6), voltage: V(20) }) as number, {
      expected: want.toNumber(), tolerance: 3 * Number.EPSILON, source: "decimal.js, n eps0 t V^2 / g with eps0 CODATA 2022",
    });
  });

  it("cautions about voltages above the extra-low-voltage band", () => {
    expect(evaluate("combDriveForce", { fingers: 50, thickness: "20 um", gap: "3 um", voltage: "150 V" }).cautions.map((c) => c.code)).toEqual(["above_extra_low_voltage"]);
    expect(evaluate("pullInVoltage", { springConstant: "100 N/m", gap: "30 um", area: "1 mm^2" }).cautions.map((c) => c.code)).toEqual(["above_extra_low_voltage"]);
    expect(codeOf(() => pullInVoltage({ springConstant: -1 as Stiffness, gap: m(1e-6), area: m2(1e-8) }))).toBe("out_of_domain");
  });
});
