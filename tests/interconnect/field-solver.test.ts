/**
 * The 2-D field solver (lineCapacitance) against exact closed forms, its
 * convergence order, invariances, bounded cost and its errors.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EPSILON0 } from "../../src/constants/si.js";
import { coupledLineImpedances, type CrossSection, evaluate, FormulaError, lineCapacitance, lineImpedance, MAX_UNKNOWNS } from "../../src/index.js";
import { ellipticK } from "../../src/math/elliptic.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

const TWO_WIRE = "two parallel cylinders, C' = pi eps / acosh(D/(2a)): W. R. Smythe, Static and Dynamic Electricity, 3rd ed. (1968), sec. 4.13 (from memory)";
const COAX = "coaxial cylinders, C' = 2 pi eps / ln(b/a): J. C. Maxwell, A Treatise on Electricity and Magnetism (1873), art. 126 (from memory)";
const ECCENTRIC = "eccentric cylinders, C' = 2 pi eps / acosh((a^2 + b^2 - e^2)/(2ab)): Smythe (1968), sec. 4.13 (from memory)";
const OVER_GROUND = "cylinder over a grounded plane (its image pair), C' = 2 pi eps / acosh(h/a): Smythe (1968), sec. 4.13 (from memory)";
const COHN = "S. B. Cohn, Characteristic impedance of the shielded-strip transmission line, IRE Trans. MTT-2 (1954) 52-57: C' = 4 eps K(k')/K(k), k = sech(pi w/(2b)) (eq. numbers from memory)";

/** Cohn's exact capacitance of a centred zero-thickness strip of width w between planes b apart (vacuum). */
function cohn(w: number, b: number): number {
  // k = sech(x), k' = tanh(x); m = k^2 and its complement 1 - m = k'^2 formed directly.
  const x = (Math.PI * w) / (2 * b);
  const k = 1 / Math.cosh(x);
  const kp = Math.tanh(x);
  return (4 * EPSILON0 * ellipticK(kp * kp, k * k)) / ellipticK(k * k, kp * kp);
}

function stripline(w: number, b: number): CrossSection {
  return { ground: "two planes", groundSpacing: b, conductors: [{ x: 0, y: b / 2, width: w, thickness: 0 }] };
}

describe("lineCapacitance: round conductors against exact closed forms", () => {
  it("two wires in air and in a dielectric, to 1e-9 (the issue asks 1e-6)", () => {
    for (const [a, D, er] of [[1e-3, 2.05e-3, 1], [1e-3, 3e-3, 1], [1e-3, 1e-2, 2.25], [0.5, 40, 1], [2e-6, 7e-6, 4]] as const) {
      const r = lineCapacitance({ ground: "none", relativePermittivity: er, conductors: [{ x: 0, y: 0, radius: a }, { x: D, y: 0, radius: a }] });
      const exact = (Math.PI * er * EPSILON0) / Math.acosh(D / (2 * a));
      expect(r.size).toBe(2);
      for (const [i, sign] of [[0, 1], [1, -1], [2, -1], [3, 1]] as const) {
        expectClose(r.matrix[i]!, { input: { a, D, er, i }, expected: sign * exact, tolerance: 1e-9, source: TWO_WIRE });
      }
    }
  });

  it("unequal wires, and a wire over a ground plane, to 1e-9", () => {
    // Unequal radii a, b at centre distance D: C' = 2 pi eps / acosh((D^2 - a^2 - b^2)/(2ab)) (Smythe, from memory).
    const [a, b, D] = [1, 2.5, 4.2];
    const r = lineCapacitance({ ground: "none", conductors: [{ x: 0, y: 0, radius: a }, { x: 0, y: D, radius: b }] });
    expectClose(r.matrix[0]!, { input: { a, b, D }, expected: (2 * Math.PI * EPSILON0) / Math.acosh((D * D - a * a - b * b) / (2 * a * b)), tolerance: 1e-9, source: TWO_WIRE });
    for (const [a2, h] of [[1, 1.05], [1, 3], [1e-3, 0.5]] as const) {
      const g = lineCapacitance({ ground: "plane", conductors: [{ x: 0.3, y: h, radius: a2 }] });
      expectClose(g.matrix[0]!, { input: { a2, h }, expected: (2 * Math.PI * EPSILON0) / Math.acosh(h / a2), tolerance: 1e-9, source: OVER_GROUND });
    }
  });

  it("coaxial and eccentric coaxial sections, to 1e-9", () => {
    for (const [a, b, e] of [[1, 3, 0], [1, 1.1, 0], [1e-3, 3.5e-3, 0], [1, 3, 1.2], [1, 3, 1.9], [0.2, 1, 0.5]] as const) {
      const r = lineCapacitance({ ground: "none", relativePermittivity: 2.1, conductors: [{ x: e, y: 0, radius: a }, { x: 0, y: 0, radius: b }] });
      const exact = e === 0 ? (2 * Math.PI * 2.1 * EPSILON0) / Math.log(b / a) : (2 * Math.PI * 2.1 * EPSILON0) / Math.acosh((a * a + b * b - e * e) / (2 * a * b));
      expectClose(r.matrix[0]!, { input: { a, b, e }, expected: exact, tolerance: 1e-9, source: e === 0 ? COAX : ECCENTRIC });
      expectClose(-r.matrix[1]!, { input: { a, b, e }, expected: exact, tolerance: 1e-9, source: e === 0 ? COAX : ECCENTRIC });
    }
  });

  it("gives Z0 = (eta0 / (2 pi sqrt(eps_r))) ln(b/a) for a coaxial line through lineImpedance", () => {
    const p = lineImpedance({ ground: "none", relativePermittivity: 2.25, conductors: [{ x: 0, y: 0, radius: 0.45e-3 }, { x: 0, y: 0, radius: 1.5e-3 }] });
    // eta0 = mu0 c (CODATA 2022 mu0), the vacuum wave impedance.
    const eta0 = 1.25663706127e-6 * 299792458;
    expectClose(p.impedance, { expected: (eta0 / (2 * Math.PI * 1.5)) * Math.log(1.5 / 0.45), tolerance: 1e-9, source: COAX });
    expect(p.effectivePermittivity).toBeCloseTo(2.25, 12);
  });
});

describe("lineCapacitance: strips", () => {
  it("matches Cohn's exact stripline value to 1e-4 (128 panels), 1e-5 after one Richardson step", () => {
    for (const [w, b] of [[1, 1], [0.2, 1], [3e-3, 1e-3]] as const) {
      const exact = cohn(w, b);
      const c128 = lineCapacitance(stripline(w, b), { panels: 128 }).matrix[0]!;
      expectClose(c128, { input: { w, b, panels: 128 }, expected: exact, tolerance: 1e-4, source: COHN });
      const rich = lineCapacitance(stripline(w, b), { panels: 64, extrapolate: true }).matrix[0]!;
      expectClose(rich, { input: { w, b, panels: "64 and 128, extrapolated" }, expected: exact, tolerance: 1e-5, source: COHN });
    }
  });

  it("converges as panels^-2 (measured order 1.9..2.1 from 16 to 128 panels)", () => {
    const exact = cohn(1, 1);
    const err = [16, 32, 64, 128].map((N) => relativeError(lineCapacitance(stripline(1, 1), { panels: N }).matrix[0]!, exact));
    for (let i = 1; i < err.length; i++) {
      const order = Math.log2(err[i - 1]! / err[i]!);
      expect(order).toBeGreaterThan(1.9);
      expect(order).toBeLessThan(2.1);
    }
    // The discretisation error is from below (the charge at the edges is under-resolved).
    expect(lineCapacitance(stripline(1, 1), { panels: 32 }).matrix[0]!).toBeLessThan(exact);
  });

  it("a thick strip between two planes converges at order 2 or better (measured 1.9 to 2.5 from 8 to 64 panels)", () => {
    for (const t of [0.5, 0.02]) {
      const c = [8, 16, 32, 64].map((N) => lineCapacitance({ ground: "two planes", groundSpacing: 2, conductors: [{ x: 0, y: 1 - t / 2, width: 1, thickness: t }] }, { panels: N }).matrix[0]!);
      for (let i = 2; i < c.length; i++) {
        const order = Math.log2((c[i - 1]! - c[i - 2]!) / (c[i]! - c[i - 1]!));
        expect(order).toBeGreaterThan(1.8);
        expect(order).toBeLessThan(2.7);
      }
    }
  });

  it("a microstrip's capacitance converges at order 2 with the interface mesh refined with it", () => {
    const section: CrossSection = { layers: [{ thickness: 1, relativePermittivity: 4.4 }], conductors: [{ x: 0, y: 1, width: 1, thickness: 0 }] };
    const c = [16, 32, 64].map((N) => lineCapacitance(section, { panels: N }).matrix[0]!);
    const order = Math.log2((c[1]! - c[0]!) / (c[2]! - c[1]!));
    expect(order).toBeGreaterThan(1.8);
    expect(order).toBeLessThan(2.2);
  });

  it("a thick strip on a substrate reaches order 2 by 64 panels (measured 1.98 and 2.72 for t/w 0.0175 and 0.2)", () => {
    for (const t of [0.0175, 0.2]) {
      const section: CrossSection = { layers: [{ thickness: 0.8, relativePermittivity: 4.4 }], conductors: [{ x: 0, y: 0.8, width: 1, thickness: t }] };
      const c = [16, 32, 64].map((N) => lineCapacitance(section, { panels: N }).matrix[0]!);
      const order = Math.log2((c[1]! - c[0]!) / (c[2]! - c[1]!));
      expect(order).toBeGreaterThan(1.8);
      expect(order).toBeLessThan(3);
    }
  });

  it("approaches the parallel-plate value for a wide thick strip between two planes", () => {
    // Each face sees a plate gap g: C' -> 2 eps w / g plus fringing of order eps (ln terms), so
    // C' g / (2 eps w) -> 1 as w/g grows (common practice).
    const r = lineCapacitance({ ground: "two planes", groundSpacing: 1.2, conductors: [{ x: 0, y: 0.5, width: 40, thickness: 0.2 }] });
    const plate = (2 * EPSILON0 * 40) / 0.5;
    expect(r.matrix[0]! / plate).toBeGreaterThan(1);
    expect(r.matrix[0]! / plate).toBeLessThan(1.1);
  });
});

describe("lineImpedance: microstrip against Hammerstad and Jensen (1980)", () => {
  // The library's microstripImpedance / microstripEffectivePermittivity implement
  // E. Hammerstad and O. Jensen, Accurate models for microstrip computer-aided design,
  // IEEE MTT-S Digest (1980) 407-409, whose stated accuracy is: Z0 in air better than
  // 0.01 % for w/h <= 1 and 0.03 % for w/h <= 1000; eps_eff better than 0.2 % for
  // eps_r <= 128 and 0.01 <= w/h <= 100. The solver (Richardson over 12 and 24 panels,
  // about 1e-5 from its own limit) must agree within those bounds over w/h 0.1..10 and
  // eps_r 1..12; Z0 = Z0_air / sqrt(eps_eff) inherits 0.03 % + 0.1 %.
  const HJ = "Hammerstad and Jensen (1980), stated accuracy, via the library's microstripImpedance / microstripEffectivePermittivity";
  it("agrees within the paper's stated accuracy over w/h 0.1..10, eps_r 1..12 (25 cases)", () => {
    for (const er of [1, 2.2, 4.4, 9.8, 12]) {
      for (const u of [0.1, 0.3, 1, 3, 10]) {
        const p = lineImpedance({ layers: [{ thickness: 1e-3, relativePermittivity: er }], conductors: [{ x: 0, y: 1e-3, width: u * 1e-3, thickness: 0 }] }, { panels: 12, extrapolate: true });
        const inputs = { width: `${u} mm`, height: "1 mm", relativePermittivity: er };
        const z = evaluate("microstripImpedance", inputs).value as number;
        const e = evaluate("microstripEffectivePermittivity", inputs).value as number;
        const zTol = er === 1 ? (u <= 1 ? 1e-4 : 3e-4) : 1.3e-3;
        expectClose(p.impedance, { input: { u, er }, expected: z, tolerance: zTol, source: HJ });
        expectClose(p.effectivePermittivity, { input: { u, er }, expected: e, tolerance: 2e-3, source: HJ });
      }
    }
  });
});

describe("lineCapacitance: properties", () => {
  it("does not depend on the length unit or on a shift along x; scales with a homogeneous eps_r", () => {
    const base = (s: number, dx: number, er: number): CrossSection => ({
      relativePermittivity: er,
      conductors: [{ x: s * (dx + 0), y: s * 1, width: s * 1, thickness: s * 0.05 }, { x: s * (dx + 1.6), y: s * 0.8, radius: s * 0.2 }],
    });
    const ref = lineCapacitance(base(1, 0, 1), { panels: 12 }).matrix;
    fc.assert(
      fc.property(fc.integer({ min: -5, max: 5 }), fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 1, max: 20, noNaN: true }), (k, dx, er) => {
        const got = lineCapacitance(base(10 ** k, dx, er), { panels: 12 }).matrix;
        for (let i = 0; i < 4; i++) expect(relativeError(got[i]! / er, ref[i]!)).toBeLessThan(1e-9);
      }),
      { numRuns: 20 },
    );
  });

  it("gives a Maxwell matrix: positive diagonal, negative off-diagonal, diagonally dominant over ground, symmetric", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 3, noNaN: true }),
        fc.double({ min: 0.1, max: 3, noNaN: true }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        (w, gap, er, r) => {
          const C = lineCapacitance(
            {
              layers: [{ thickness: 1, relativePermittivity: er }],
              conductors: [{ x: 0, y: 1, width: w, thickness: 0 }, { x: w / 2 + gap + r, y: 1.2 + r, radius: r }],
            },
            { panels: 12 },
          ).matrix;
          expect(C[0]).toBeGreaterThan(0);
          expect(C[3]).toBeGreaterThan(0);
          expect(C[1]).toBeLessThan(0);
          expect(C[2]).toBeLessThan(0);
          expect(C[0]! + C[1]!).toBeGreaterThan(0);
          expect(C[3]! + C[2]!).toBeGreaterThan(0);
          // Reciprocity: the two point-matched couplings are averaged (see symmetrise in field-solver.ts).
          expect(C[1]).toBe(C[2]);
        },
      ),
      { numRuns: 12 },
    );
  });

  it("the symmetrised coupling of unequal strips on a substrate converges with the mesh (order about 2)", () => {
    // Unequal strips on FR-4: point matching alone gives C12 and C21 up to 6e-3 apart at 8 panels, 2e-4 at 32
    // (measured before symmetrising); the average converges to the extrapolated value like the diagonal does.
    const section: CrossSection = {
      layers: [{ thickness: 2e-4, relativePermittivity: 4.4 }],
      conductors: [{ x: 0, y: 2e-4, width: 3e-4, thickness: 3.5e-5 }, { x: 6e-4, y: 2e-4, width: 1e-4, thickness: 0 }],
    };
    // Measured against the 64-panel extrapolated value: 1.4e-2, 3.6e-3, 6.1e-4 at 8, 16, 32 panels.
    const ref = lineCapacitance(section, { panels: 32, extrapolate: true }).matrix[1]!;
    const err = [8, 16].map((panels) => {
      const C = lineCapacitance(section, { panels }).matrix;
      expect(C[1]).toBe(C[2]);
      return relativeError(C[1]!, ref);
    });
    expect(err[1]).toBeLessThan(5e-3);
    expect(err[0]! / err[1]!).toBeGreaterThan(3);
  });

  it("three conductors without ground: symmetric, with rows and columns summing to zero", () => {
    const C = lineCapacitance({
      ground: "none",
      conductors: [{ x: 0, y: 0, radius: 1 }, { x: 3, y: 0.5, width: 2, thickness: 0.3 }, { x: -2, y: 2, width: 1, thickness: 0 }],
    }, { panels: 8 }).matrix;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) expect(C[i * 3 + j]).toBe(C[j * 3 + i]);
      expect(Math.abs(C[i * 3]! + C[i * 3 + 1]! + C[i * 3 + 2]!)).toBeLessThan(1e-12 * C[i * 4]!);
    }
  });

  it("without ground, every conductor's charges add up to zero (columns sum to 0)", () => {
    const C = lineCapacitance({
      ground: "none",
      conductors: [{ x: 0, y: 0, radius: 1 }, { x: 3, y: 0.5, width: 2, thickness: 0.3 }, { x: -2, y: 2, width: 1, thickness: 0 }],
    }).matrix;
    for (let c = 0; c < 3; c++) expect(Math.abs(C[c]! + C[3 + c]! + C[6 + c]!)).toBeLessThan(1e-12 * C[c * 4]!);
  });

  it("a layer of the same permittivity as the medium changes nothing; a high layer under a strip raises C", () => {
    const strip = { x: 0, y: 1, width: 1, thickness: 0.1 };
    const plain = lineCapacitance({ relativePermittivity: 3, conductors: [strip] }, { panels: 16 }).matrix[0]!;
    const same = lineCapacitance({ relativePermittivity: 3, layers: [{ thickness: 1, relativePermittivity: 3 }], conductors: [strip] }, { panels: 16 }).matrix[0]!;
    expect(same).toBe(plain);
    const air = lineCapacitance({ conductors: [strip] }, { panels: 16 }).matrix[0]!;
    const onSubstrate = lineCapacitance({ layers: [{ thickness: 1, relativePermittivity: 3 }], conductors: [strip] }, { panels: 16 }).matrix[0]!;
    expect(onSubstrate).toBeGreaterThan(air);
    expect(onSubstrate).toBeLessThan(plain);
  });

  it("a deep dielectric around a wire over ground gives eps_r times the vacuum value (interface far away)", () => {
    // The interface 1000 wire heights up: its polarisation charge changes C by about (h/T)^2.
    const g = lineCapacitance({ layers: [{ thickness: 1000, relativePermittivity: 5 }], conductors: [{ x: 0, y: 1.5, radius: 1 }] }).matrix[0]!;
    expectClose(g, { expected: (5 * 2 * Math.PI * EPSILON0) / Math.acosh(1.5), tolerance: 1e-5, source: OVER_GROUND });
  });

  it("even and odd modes of a symmetric pair bracket the single line", () => {
    const sub = [{ thickness: 1, relativePermittivity: 4.4 }];
    const single = lineImpedance({ layers: sub, conductors: [{ x: 0, y: 1, width: 1.5, thickness: 0 }] }, { panels: 16 });
    const pair = coupledLineImpedances(
      { layers: sub, conductors: [{ x: -1, y: 1, width: 1.5, thickness: 0 }, { x: 1, y: 1, width: 1.5, thickness: 0 }] },
      { panels: 16 },
    );
    expect(pair.even.impedance).toBeGreaterThan(single.impedance);
    expect(pair.odd.impedance).toBeLessThan(single.impedance);
    expect(pair.even.effectivePermittivity).toBeGreaterThan(pair.odd.effectivePermittivity);
  });
});

describe("lineCapacitance: cost is bounded and counted", () => {
  it("reports its loops: at most n^3/3 + 40 n^2 iterations for n unknowns", () => {
    resetLoopCount();
    const r = lineCapacitance({ layers: [{ thickness: 1, relativePermittivity: 4 }], conductors: [{ x: 0, y: 1, width: 2, thickness: 0.1 }, { x: 3, y: 2, radius: 0.3 }] }, { panels: 24 });
    const n = r.unknowns;
    const { total } = loopCount();
    expect(total).toBeGreaterThan(n * n);
    expect(total).toBeLessThan((n * n * n) / 3 + 40 * n * n);
  });

  it("refuses meshes above MAX_UNKNOWNS before assembling them", () => {
    const many = Array.from({ length: 30 }, (_, i) => ({ x: 3 * i, y: 1, width: 1, thickness: 1 }));
    expect(() => lineCapacitance({ conductors: many }, { panels: 40 })).toThrowError(FormulaError);
    try {
      lineCapacitance({ conductors: many }, { panels: 40 });
    } catch (e) {
      expect((e as FormulaError).code).toBe("invalid_argument");
      expect((e as FormulaError).input).toBe("options.panels");
      expect((e as FormulaError).message).toContain(String(MAX_UNKNOWNS));
    }
  });
});

describe("lineCapacitance: bad input", () => {
  const wire = { x: 0, y: 1, radius: 0.1 };
  const cases: [string, unknown, unknown, string][] = [
    ["no conductors", { conductors: [] }, undefined, "crossSection.conductors"],
    ["not an object", null, undefined, "crossSection"],
    ["NaN radius", { conductors: [{ x: 0, y: 1, radius: Number.NaN }] }, undefined, "crossSection.conductors[0].radius"],
    ["negative width", { conductors: [{ x: 0, y: 1, width: -1, thickness: 0 }] }, undefined, "crossSection.conductors[0].width"],
    ["negative thickness", { conductors: [{ x: 0, y: 1, width: 1, thickness: -1 }] }, undefined, "crossSection.conductors[0].thickness"],
    ["infinite x", { conductors: [{ x: Infinity, y: 1, radius: 1 }] }, undefined, "crossSection.conductors[0].x"],
    ["unknown shape", { conductors: [{ x: 0, y: 1 }] }, undefined, "crossSection.conductors[0]"],
    ["below ground", { conductors: [{ x: 0, y: 0.05, radius: 0.1 }] }, undefined, "crossSection.conductors[0].y"],
    ["above the upper plane", { ground: "two planes", groundSpacing: 1, conductors: [{ x: 0, y: 0.95, radius: 0.1 }] }, undefined, "crossSection.conductors[0].y"],
    ["two planes without spacing", { ground: "two planes", conductors: [wire] }, undefined, "crossSection.groundSpacing"],
    ["lone conductor without ground", { ground: "none", conductors: [wire] }, undefined, "crossSection.conductors"],
    ["layers without a plane", { ground: "none", layers: [{ thickness: 1, relativePermittivity: 2 }], conductors: [wire, { x: 1, y: 1, radius: 0.1 }] }, undefined, "crossSection.layers"],
    ["zero permittivity", { layers: [{ thickness: 1, relativePermittivity: 0 }], conductors: [{ x: 0, y: 2, radius: 0.1 }] }, undefined, "crossSection.layers[0].relativePermittivity"],
    ["bad ground", { ground: "floor", conductors: [wire] }, undefined, "crossSection.ground"],
    ["overlapping", { conductors: [wire, { x: 0.1, y: 1, radius: 0.1 }] }, undefined, "crossSection.conductors[1]"],
    ["wire across an interface", { layers: [{ thickness: 1, relativePermittivity: 2 }], conductors: [wire] }, undefined, "crossSection.conductors[0]"],
    ["strip across an interface", { layers: [{ thickness: 1, relativePermittivity: 2 }], conductors: [{ x: 0, y: 0.9, width: 1, thickness: 0.2 }] }, undefined, "crossSection.conductors[0]"],
    ["sizes 1e7 apart", { conductors: [{ x: 0, y: 1, radius: 1e-8 }, { x: 0, y: 3, radius: 1 }] }, undefined, "crossSection.conductors[0]"],
    ["fractional panels", { conductors: [wire] }, { panels: 2.5 }, "options.panels"],
    ["too many modes", { conductors: [wire] }, { modes: 10000 }, "options.modes"],
  ];
  for (const [name, section, options, input] of cases) {
    it(`refuses ${name}, naming ${input}`, () => {
      let err: unknown;
      try {
        lineCapacitance(section as CrossSection, options as never);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(FormulaError);
      expect((err as FormulaError).code).toBe("invalid_argument");
      expect((err as FormulaError).input).toBe(input);
    });
  }

  it("refuses helper calls that do not fit the section", () => {
    expect(() => lineImpedance({ conductors: [{ x: 0, y: 1, radius: 0.1 }, { x: 1, y: 1, radius: 0.1 }] })).toThrowError(/single line/);
    expect(() => coupledLineImpedances({ conductors: [{ x: 0, y: 1, radius: 0.1 }, { x: 1, y: 1, radius: 0.2 }] })).toThrowError(/symmetric/);
  });
});
