import ellipe from "@stdlib/math-base-special-ellipe";
import ellipk from "@stdlib/math-base-special-ellipk";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  carlsonRD, carlsonRF, DUPLICATION_BOUND, ellipticByComplement, ellipticD, ellipticE, ellipticEMinusOne, ellipticK,
  ellipticMaxwell, LOG_FORM_LIMIT,
} from "../../src/math/elliptic.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { checkCases, expectClose, relativeError, type ReferenceCase } from "../helpers/reference.js";
import { carlsonDecimal, dec, ellipticKE, exact } from "./decimal-elliptic.js";

const ULP = Number.EPSILON;

/**
 * Oracle values for parameter m. Below m = 1/2 the double m is exact and mc = 1 - m
 * (exact in decimal); above, the double mc is exact and m = 1 - mc. The library
 * gets the same pair as doubles (the other one rounded), as a caller would.
 */
function oracle(p: { m?: number; mc?: number }) {
  const m = p.m ?? 1 - p.mc!;
  const digits = 60 + Math.ceil(Math.max(0, -2 * Math.log10(m), p.mc !== undefined ? -Math.log10(p.mc) : 0));
  const D = dec(digits);
  // exact(): the double's exact value (new D(5e-324) would read the string "5e-324", 1 % off the double).
  const M = p.m !== undefined ? exact(p.m, digits) : new D(1).minus(exact(p.mc!, digits));
  const MC = p.mc !== undefined ? exact(p.mc, digits) : new D(1).minus(exact(p.m!, digits));
  const { K, E } = ellipticKE(M, MC, digits);
  return {
    m: p.m ?? 1 - p.mc!,
    mc: p.mc ?? 1 - p.m!,
    K: K.toNumber(),
    E: E.toNumber(),
    D: K.minus(E).div(M).toNumber(),
    Em1: E.minus(1).toNumber(),
    maxwell: new D(2).minus(M).times(K).minus(E.times(2)).toNumber(),
  };
}

// Parameters across (0, 1), with both ends: m -> 0 (1e-300, 1e-20) and m -> 1 (mc passed directly).
const PARAMS: { m?: number; mc?: number }[] = [
  { m: 1e-300 }, { m: 1e-20 }, { m: 1e-8 }, { m: 1e-3 }, { m: 0.1 }, { m: 0.3 }, { m: 0.5 },
  { mc: 0.3 }, { mc: 0.1 }, { mc: 1e-3 }, { mc: 1e-8 }, { mc: 1e-15 }, { mc: 1e-100 },
];

describe("complete elliptic integrals", () => {
  it("K and E match Abramowitz & Stegun Table 17.1", () => {
    // A&S (1964) Table 17.1 (K(m), E(m) to 15 decimals), values from memory.
    const src = "Abramowitz & Stegun (1964) Table 17.1, from memory";
    const kCases: ReferenceCase<number>[] = [
      { input: 0, expected: Math.PI / 2, tolerance: 2 * ULP, source: "K(0) = pi/2, DLMF 19.6.1" },
      { input: 0.1, expected: 1.6124413487202194, tolerance: 1e-15, source: src },
      { input: 0.5, expected: 1.8540746773013719, tolerance: 1e-15, source: src },
      { input: 0.9, expected: 2.5780921133481733, tolerance: 1e-15, source: src },
    ];
    const eCases: ReferenceCase<number>[] = [
      { input: 0, expected: Math.PI / 2, tolerance: 2 * ULP, source: "E(0) = pi/2, DLMF 19.6.1" },
      { input: 0.1, expected: 1.5307576368977633, tolerance: 1e-15, source: src },
      { input: 0.5, expected: 1.3506438810476755, tolerance: 1e-15, source: src },
      { input: 0.9, expected: 1.1047747327040733, tolerance: 1e-15, source: src },
      { input: 1, expected: 1, tolerance: 0, source: "E(1) = 1, DLMF 19.6.1" },
    ];
    checkCases(kCases, (m) => ellipticK(m));
    checkCases(eCases, (m) => ellipticE(m));
  });

  it("K and E agree with @stdlib ellipk and ellipe to a few ulp", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 0.999999, noNaN: true }), (m) => {
        expectClose(ellipticK(m), { input: m, expected: ellipk(m), tolerance: 8 * ULP, source: "@stdlib/math-base-special-ellipk" });
        expectClose(ellipticE(m), { input: m, expected: ellipe(m), tolerance: 8 * ULP, source: "@stdlib/math-base-special-ellipe" });
      }),
      { numRuns: 500 },
    );
  });

  it("K, E and D match a 60-digit decimal.js AGM oracle to 3 ulp, including m -> 0 and m -> 1", () => {
    for (const p of PARAMS) {
      const o = oracle(p);
      const src = "decimal.js AGM oracle, DLMF 19.8.1 and 19.8.6";
      expectClose(ellipticK(o.m, o.mc), { input: p, expected: o.K, tolerance: 3 * ULP, source: src });
      expectClose(ellipticE(o.m, o.mc), { input: p, expected: o.E, tolerance: 3 * ULP, source: src });
      expectClose(ellipticD(o.m, o.mc), { input: p, expected: o.D, tolerance: 3 * ULP, source: src });
    }
  });

  it("K, E and D match the decimal oracle at random parameters (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -300, max: -0.302, noNaN: true }), fc.boolean(), (lg, nearOne) => {
        const x = Math.pow(10, lg); // in (1e-300, 0.5)
        const p = nearOne ? { mc: x } : { m: x };
        const o = oracle(p);
        const src = "decimal.js AGM oracle";
        expectClose(ellipticK(o.m, o.mc), { input: p, expected: o.K, tolerance: 4 * ULP, source: src });
        expectClose(ellipticE(o.m, o.mc), { input: p, expected: o.E, tolerance: 4 * ULP, source: src });
        expectClose(ellipticD(o.m, o.mc), { input: p, expected: o.D, tolerance: 4 * ULP, source: src });
      }),
      { numRuns: 150 },
    );
  });

  it("E - 1 keeps full relative precision as m -> 1 (series DLMF 19.12.2)", () => {
    for (const p of PARAMS) {
      const o = oracle(p);
      expectClose(ellipticEMinusOne(o.m, o.mc), { input: p, expected: o.Em1, tolerance: 10 * ULP, source: "decimal.js AGM oracle of E - 1" });
    }
    // the plain difference would lose everything here
    expect(Math.abs(ellipticE(1 - 1e-15, 1e-15) - 1 - oracle({ mc: 1e-15 }).Em1) / oracle({ mc: 1e-15 }).Em1).toBeGreaterThan(1e-3);
  });

  it("Maxwell's (2 - m) K - 2 E keeps full relative precision for small m (Landen form)", () => {
    for (const p of PARAMS) {
      const o = oracle(p);
      expectClose(ellipticMaxwell(o.m, o.mc), { input: p, expected: o.maxwell, tolerance: 6 * ULP, source: "decimal.js oracle of (2 - m)K - 2E at 60 + 2 log10(1/m) digits" });
    }
    // Small m down to 1e-150: below about 1e-154 the value (about (pi/16) m^2) is
    // subnormal, where no relative precision exists (checked apart below).
    fc.assert(
      fc.property(fc.double({ min: -150, max: -0.302, noNaN: true }), fc.boolean(), (lg, nearOne) => {
        const x = Math.pow(10, lg);
        const o = oracle(nearOne ? { mc: x } : { m: x });
        expectClose(ellipticMaxwell(o.m, o.mc), { input: { lg, nearOne }, expected: o.maxwell, tolerance: 8 * ULP, source: "decimal.js oracle" });
      }),
      { numRuns: 100 },
    );
  });

  it("Maxwell's (2 - m) K - 2 E is right to the last subnormal step where the value underflows", () => {
    // m = 10^-160.86... was a counterexample of the relative check above: 4e-323 against 3.5e-323.
    const SUBNORMAL_STEP = 5e-324;
    for (const lg of [-160.86209198488118, -155, -158.5, -161.5, -200]) {
      const o = oracle({ m: Math.pow(10, lg) });
      const got = ellipticMaxwell(o.m, o.mc);
      expect(Math.abs(got - o.maxwell), `m = 1e${lg}: got ${got}, expected ${o.maxwell}`).toBeLessThanOrEqual(SUBNORMAL_STEP);
    }
  });

  it("Carlson R_F and R_D satisfy their closed-form special values", () => {
    // DLMF 19.20.1: R_F(x, x, x) = x^(-1/2); R_F(0, 1, 1) = pi/2. DLMF 19.20.18: R_D(x, x, x) = x^(-3/2).
    expectClose(carlsonRF(4, 4, 4), { expected: 0.5, tolerance: 2 * ULP, source: "DLMF 19.20.1" });
    expectClose(carlsonRF(0, 1, 1), { expected: Math.PI / 2, tolerance: 2 * ULP, source: "DLMF 19.20.1" });
    expectClose(carlsonRD(4, 4, 4), { expected: 0.125, tolerance: 2 * ULP, source: "DLMF 19.20.18" });
    // Homogeneity R_F(lx, ly, lz) = l^(-1/2) R_F(x, y, z) (DLMF 19.16.1)
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), (y, z) => {
        expectClose(carlsonRF(0, 4 * y, 4 * z), { input: { y, z }, expected: carlsonRF(0, y, z) / 2, tolerance: 4 * ULP, source: "DLMF 19.16.1 homogeneity" });
      }),
    );
  });

  it("Legendre's relation E K' + E' K - K K' = pi/2 holds", () => {
    // DLMF 19.7.1
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.999, noNaN: true }), (m) => {
        const mc = 1 - m;
        const v = ellipticE(m, mc) * ellipticK(mc, m) + ellipticE(mc, m) * ellipticK(m, mc) - ellipticK(m, mc) * ellipticK(mc, m);
        expectClose(v, { input: m, expected: Math.PI / 2, tolerance: 1e-14, source: "DLMF 19.7.1" });
      }),
    );
  });

  /** Worst errors in ulp (units of eps relative), kept for the summary test. */
  const worst = { K: 0, E: 0, D: 0, Em1: 0, maxwell: 0 };

  // mc from 1 down to the smallest subnormal, log-spread, with both sides of the
  // branch edges (mc = 1/2 for E's form, 1/4 for E - 1's series, LOG_FORM_LIMIT for
  // the logarithmic forms); then m from 1/2 down to 1e-300 (mc = 1 - m).
  const MCS = [
    5e-324, 1e-323, 1e-315, 2.2250738585072014e-308, 1e-300, 1e-250, 1e-200, 1e-154, 1e-150, 1e-100, 1e-60, 1e-33,
    1e-20, 1e-17, 1e-10, LOG_FORM_LIMIT * (1 - ULP), LOG_FORM_LIMIT, LOG_FORM_LIMIT * (1 + 2 * ULP), 1e-7, 1e-5, 1e-3,
    0.01, 0.1, 0.25 * (1 - ULP), 0.25, 0.25 * (1 + 2 * ULP), 0.4, 0.5 * (1 - ULP), 0.5, 0.5 * (1 + 2 * ULP), 0.7, 0.9,
  ];
  const MS = [1e-300, 1e-200, 1e-100, 1e-40, 1e-20, 1e-10, 1e-5, 1e-3, 0.01, 0.05, 0.1, 0.2, 0.3];

  it("K, E, D, E - 1 and Maxwell's combination are within a few ulp of the oracle from m = 1e-300 to mc = 5e-324", () => {
    const src = "decimal.js AGM oracle, DLMF 19.8.1 and 19.8.6, at 60 + log10(1/mc) digits";
    const tol = { K: 3, E: 3, D: 3, Em1: 6, maxwell: 6 };
    const cases = [...MCS.map((mc) => ({ mc })), ...MS.map((m) => ({ m }))];
    for (const p of cases) {
      const o = oracle(p);
      const got = {
        K: ellipticK(o.m, o.mc),
        E: ellipticE(o.m, o.mc),
        D: ellipticD(o.m, o.mc),
        Em1: ellipticEMinusOne(o.m, o.mc),
        maxwell: ellipticMaxwell(o.m, o.mc),
      };
      for (const key of ["K", "E", "D", "Em1", "maxwell"] as const) {
        const expected = o[key];
        // Maxwell's value and E - 1 are subnormal or 0 at the far ends: no relative precision there.
        if (Math.abs(expected) < 1e-300) continue;
        const ulps = relativeError(got[key], expected) / ULP;
        worst[key] = Math.max(worst[key], ulps);
        expectClose(got[key], { name: key, input: p, expected, tolerance: tol[key] * ULP, source: src });
      }
    }
  });

  it("E(1) = 1 while K(1) and D(1) are infinite, for mc = 0 given directly", () => {
    // DLMF 19.6.1: E(1) = 1, K(k) -> infinity as k -> 1. The caller decides what an infinite K means.
    expect(ellipticE(1, 0)).toBe(1);
    expect(ellipticEMinusOne(1, 0)).toBe(0);
    expect(ellipticK(1, 0)).toBe(Infinity);
    expect(ellipticD(1, 0)).toBe(Infinity);
    expect(ellipticMaxwell(1, 0)).toBe(Infinity);
    const out = new Float64Array(4);
    ellipticByComplement(0, out);
    expect([...out]).toEqual([Infinity, 1, Infinity, 0]);
  });

  it("takes the complementary modulus where mc = k'^2 underflows, and ln(1/k') where k' does too", () => {
    // k' = 1e-200: mc = 1e-400 is not a double. K = ln(4/k') + O(k'^2 ln) (DLMF 19.12.1), E = 1 + O(k'^2 ln)
    // (DLMF 19.12.2), D = (K - E)/m = ln(4/k') - 1 to far below an ulp; the oracle evaluates ln(4e200) at 40 digits.
    const D = dec(40);
    const lnTerm = (kc: number) => new D(4).div(exact(kc, 40)).ln();
    const out = new Float64Array(4);
    for (const kc of [1e-200, 2 ** -1074, 1e-160]) {
      ellipticByComplement(kc, out);
      const L = lnTerm(kc);
      const src = "DLMF 19.12.1-2 leading terms, ln(4/k') at 40 digits";
      expectClose(out[0]!, { input: kc, expected: L.toNumber(), tolerance: 2 * ULP, source: src });
      expect(out[1]).toBe(1);
      expectClose(out[2]!, { input: kc, expected: L.minus(1).toNumber(), tolerance: 2 * ULP, source: src });
    }
    // k' = 5e-325 is below the smallest subnormal: pass ln(1/k') instead.
    const lnInv = Math.log(2) + 324 * Math.LN10; // ln(1/5e-325) to rounding
    ellipticByComplement(0, out, lnInv);
    expectClose(out[0]!, { expected: lnInv + 2 * Math.LN2, tolerance: 2 * ULP, source: "DLMF 19.12.1 leading term" });
    expectClose(out[2]!, { expected: lnInv + 2 * Math.LN2 - 1, tolerance: 2 * ULP, source: "DLMF 19.12.1-2 leading terms" });
  });

  const carlsonWorst = { F: 0, D: 0, steps: 0 };

  it("Carlson's R_F and R_D stay within a few ulp and 12 duplication steps for arguments from 1e-320 to 1e300", () => {
    // Oracle: the duplication theorem (DLMF 19.26.18, 19.26.20) iterated at 50 digits (carlsonDecimal).
    const E = [-320, -300, -150, -40, -34, -33, -8, 0, 8, 100, 300];
    const cases: [number, number, number][] = [];
    for (const a of E) for (const b of E) cases.push([1.3 * 10 ** a, 0.7 * 10 ** b, 1]);
    for (const a of E) cases.push([0, 10 ** a, 2.5], [10 ** a, 10 ** a, 1e-30], [3, 10 ** a, 10 ** a]);
    let k = 0;
    for (const [x, y, z] of cases) {
      if (k++ % 2 === 1) continue; // every other case: enough spread, half the time
      resetLoopCount();
      const f = carlsonRF(x, y, z);
      const d = carlsonRD(x, y, z);
      carlsonWorst.steps = Math.max(carlsonWorst.steps, loopCount().largest);
      const of = carlsonDecimal("F", x, y, z, 50).toNumber();
      const od = carlsonDecimal("D", x, y, z, 50).toNumber();
      const src = "duplication theorem DLMF 19.26.18/19.26.20 at 50 digits";
      carlsonWorst.F = Math.max(carlsonWorst.F, relativeError(f, of) / ULP);
      expectClose(f, { name: "R_F", input: [x, y, z], expected: of, tolerance: 4 * ULP, source: src });
      if (od < 1e300) {
        carlsonWorst.D = Math.max(carlsonWorst.D, relativeError(d, od) / ULP);
        expectClose(d, { name: "R_D", input: [x, y, z], expected: od, tolerance: 4 * ULP, source: src });
      } else {
        expect(d > 1e300).toBe(true); // beyond the doubles: Infinity is right
      }
    }
    expect(carlsonWorst.steps).toBeLessThanOrEqual(DUPLICATION_BOUND);
  });

  it("Carlson's R_F and R_D return at once for zero, infinite and extreme arguments", () => {
    for (const [x, y, z] of [[0, 0, 1], [0, 1, 0], [1, 0, 0]] as const) expect(carlsonRF(x, y, z)).toBe(Infinity);
    expect(carlsonRD(1, 1, 0)).toBe(Infinity);
    expect(carlsonRD(0, 0, 1)).toBe(Infinity);
    expect(carlsonRF(1, 2, Infinity)).toBe(0);
    expect(carlsonRD(1, 2, Infinity)).toBe(0);
    resetLoopCount();
    for (const v of [5e-324, 1e-308, 1e308, 1.7976931348623157e308]) {
      expect(Number.isFinite(carlsonRF(v, v, v))).toBe(true);
      carlsonRD(0, v, 1);
      carlsonRD(1, v, v);
    }
    expect(loopCount().largest).toBeLessThanOrEqual(DUPLICATION_BOUND);
  });

  it("E - 1's series stops within its proven 30 terms", () => {
    let most = 0;
    for (const mc of [0.25, 0.2, 0.1, 1e-3, 1e-6, LOG_FORM_LIMIT]) {
      resetLoopCount();
      ellipticEMinusOne(1 - mc, mc);
      most = Math.max(most, loopCount().largest);
    }
    expect(most).toBeLessThanOrEqual(30); // proven bound
    expect(most).toBe(26); // measured at mc = 1/4, as the doc comment states
  });

  it("reports the worst errors measured", () => {
    console.log(`elliptic worst ulp: ${JSON.stringify(worst)}; Carlson R_F ${carlsonWorst.F.toFixed(2)}, R_D ${carlsonWorst.D.toFixed(2)} ulp, at most ${carlsonWorst.steps} duplication steps`);
    expect(worst.K).toBeGreaterThanOrEqual(0);
  });
});
