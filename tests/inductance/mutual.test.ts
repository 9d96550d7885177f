import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MU0 } from "../../src/constants/si.js";
import {
  coaxialCoilsMutualInductance, coaxialLoopsMutualInductance, couplingCoefficient, evaluate, solenoidInductance,
  type Inductance, type Length,
} from "../../src/index.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { dec, ellipticKE, exact } from "../math/decimal-elliptic.js";

const m = (v: number) => v as Length;

/** Maxwell's formula as written, mu0 sqrt(ab) [(2/k - k) K - (2/k) E], in decimal.js. */
function maxwellOracle(a: number, b: number, d: number): number {
  const A = exact(a, 120);
  const B = exact(b, 120);
  const Dd = exact(d, 120);
  const far = Math.max(1, (d + Math.abs(a - b)) / Math.min(a, b));
  const digits = 60 + Math.ceil(4 * Math.log10(far));
  const D = dec(digits);
  const num = A.times(B).times(4);
  const r2sq = A.plus(B).pow(2).plus(Dd.pow(2));
  const r1sq = A.minus(B).pow(2).plus(Dd.pow(2));
  const mm = new D(num).div(r2sq);
  const mc = new D(r1sq).div(r2sq);
  const { K, E } = ellipticKE(mm, mc, digits);
  const k = mm.sqrt();
  const bracket = new D(2).div(k).minus(k).times(K).minus(new D(2).div(k).times(E));
  return exact(MU0, digits).times(new D(A.times(B)).sqrt()).times(bracket).toNumber();
}

describe("coaxialLoopsMutualInductance", () => {
  it("matches a decimal.js oracle of Maxwell's formula, far apart and nearly touching", () => {
    const cases: [number, number, number][] = [
      [1, 1, 1], [1, 2, 0], [1, 2, 3], [1, 1, 1e3], [1, 1, 1e6], [1, 3, 1e5], [1, 1, 1e-3], [1, 1, 1e-9], [1, 1 + 1e-9, 0], [1, 1.5, 1e-12],
    ];
    for (const [a, b, d] of cases) {
      expectClose(coaxialLoopsMutualInductance({ radius1: m(a), radius2: m(b), distance: m(d) }), {
        input: { a, b, d }, expected: maxwellOracle(a, b, d), tolerance: 1e-13, source: "decimal.js oracle of Maxwell (1873) art. 701 (K, E by AGM)",
      });
    }
  });

  it("matches the oracle at random geometry (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -6, max: 5, noNaN: true }), (lb, ld) => {
        const b = Math.pow(10, lb);
        const d = Math.pow(10, ld);
        expectClose(coaxialLoopsMutualInductance({ radius1: m(1), radius2: m(b), distance: m(d) }), {
          input: { b, d }, expected: maxwellOracle(1, b, d), tolerance: 1e-13, source: "decimal.js oracle",
        });
      }),
      { numRuns: 60 },
    );
  });

  it("is reciprocal, scales linearly with all lengths and falls off as the dipole limit", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        (a, b, d, s) => {
          // Away from touching: there M depends on the tiny gap, which scaling rounds.
          fc.pre(Math.hypot(a - b, d) > 1e-3 * (a + b));
          const M = coaxialLoopsMutualInductance({ radius1: m(a), radius2: m(b), distance: m(d) });
          expect(relativeError(coaxialLoopsMutualInductance({ radius1: m(b), radius2: m(a), distance: m(d) }), M)).toBeLessThan(1e-15);
          expect(relativeError(coaxialLoopsMutualInductance({ radius1: m(s * a), radius2: m(s * b), distance: m(s * d) }), s * M)).toBeLessThan(1e-12);
        },
      ),
    );
    // Far apart: M -> mu0 pi a^2 b^2 / (2 d^3) (magnetic dipoles), correction O((a^2 + b^2)/d^2).
    const M = coaxialLoopsMutualInductance({ radius1: m(0.01), radius2: m(0.02), distance: m(100) });
    expectClose(M, { expected: (MU0 * Math.PI * 1e-4 * 4e-4) / (2 * 1e6), tolerance: 1e-7, source: "dipole limit" });
  });

  it("refuses coincident circles", () => {
    expect(() => evaluate("coaxialLoopsMutualInductance", { radius1: 1, radius2: 1, distance: 0 })).toThrow(/must not coincide/);
  });
});

describe("coaxialCoilsMutualInductance", () => {
  const base = { turns1: 100, radius1: m(0.01), length1: m(0.02), turns2: 50, radius2: m(0.015), length2: m(0.01), distance: m(0.03) };

  it("of a coil with itself equals the Nagaoka self-inductance", () => {
    for (const [r, l] of [[0.01, 0.02], [0.01, 1e-4], [0.01, 3], [1, 1]] as const) {
      const M = coaxialCoilsMutualInductance({ turns1: 20, radius1: m(r), length1: m(l), turns2: 20, radius2: m(r), length2: m(l), distance: m(0) });
      expectClose(M, { input: { r, l }, expected: solenoidInductance({ turns: 20, radius: m(r), length: m(l) }), tolerance: 1e-12, source: "Nagaoka's closed form (solenoidInductance, checked against its own decimal oracle)" });
    }
  });

  it("of two coincident coils a few subnormal steps apart still equals the Nagaoka self-inductance", () => {
    // Once a NaN: a Gauss node of a subnormal piece rounded onto the filament singularity.
    const self = solenoidInductance({ turns: 10, radius: m(1), length: m(1e-5) });
    for (const d of [5e-324, 1e-320, 1e-310, 1e-300]) {
      const M = coaxialCoilsMutualInductance({ turns1: 10, radius1: m(1), length1: m(1e-5), turns2: 10, radius2: m(1), length2: m(1e-5), distance: m(d) });
      expectClose(M, { input: { d }, expected: self, tolerance: 1e-12, source: "Nagaoka's closed form (solenoidInductance, checked against its own decimal oracle)" });
    }
  });

  it("is reciprocal and scales with N1 N2 and with all lengths", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.002, max: 0.05, noNaN: true }), fc.double({ min: 0.002, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 0.1, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }),
        (r2, l2, d, s) => {
          const x = { ...base, radius2: m(r2), length2: m(l2), distance: m(d) };
          const M = coaxialCoilsMutualInductance(x);
          const swapped = { turns1: x.turns2, radius1: x.radius2, length1: x.length2, turns2: x.turns1, radius2: x.radius1, length2: x.length1, distance: x.distance };
          expect(relativeError(coaxialCoilsMutualInductance(swapped), M)).toBeLessThan(1e-12);
          const scaled = { ...x, radius1: m(s * x.radius1), length1: m(s * x.length1), radius2: m(s * r2), length2: m(s * l2), distance: m(s * d) };
          expect(relativeError(coaxialCoilsMutualInductance(scaled), s * M)).toBeLessThan(1e-12);
          expect(relativeError(coaxialCoilsMutualInductance({ ...x, turns1: 300 }), 3 * M)).toBeLessThan(1e-14);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("tends to N1 N2 times Maxwell's filament formula for short coils", () => {
    const short = { ...base, length1: m(1e-7), length2: m(1e-7) };
    const filaments = 100 * 50 * (coaxialLoopsMutualInductance({ radius1: m(0.01), radius2: m(0.015), distance: m(0.03) }) as number);
    expectClose(coaxialCoilsMutualInductance(short), { expected: filaments, tolerance: 1e-9, source: "Maxwell (1873) filament limit" });
  });

  it("gives a coupling coefficient at most 1 with the coils' self-inductances", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.005, max: 0.03, noNaN: true }), fc.double({ min: 0, max: 0.05, noNaN: true }), (r2, d) => {
        const x = { ...base, radius2: m(r2), distance: m(d) };
        const M = coaxialCoilsMutualInductance(x);
        const L1 = solenoidInductance({ turns: x.turns1, radius: x.radius1, length: x.length1 });
        const L2 = solenoidInductance({ turns: x.turns2, radius: x.radius2, length: x.length2 });
        const k = couplingCoefficient({ mutualInductance: M, inductance1: L1, inductance2: L2 });
        expect(k).toBeGreaterThan(0);
        expect(k).toBeLessThanOrEqual(1);
      }),
      { numRuns: 30 },
    );
  });
});

describe("couplingCoefficient", () => {
  it("is M / sqrt(L1 L2) and warns above 1", () => {
    const H = (v: number) => v as Inductance;
    expect(couplingCoefficient({ mutualInductance: H(5e-6), inductance1: H(1e-5), inductance2: H(1e-5) })).toBe(0.5);
    const r = evaluate("couplingCoefficient", { mutualInductance: "12 uH", inductance1: "10 uH", inductance2: "10 uH" });
    expect(r.warnings.map((w) => w.code)).toContain("coupling_above_one");
  });
});
