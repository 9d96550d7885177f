import ellipe from "@stdlib/math-base-special-ellipe";
import ellipk from "@stdlib/math-base-special-ellipk";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  carlsonRD, carlsonRF, ellipticD, ellipticE, ellipticEMinusOne, ellipticK, ellipticMaxwell,
} from "../../src/math/elliptic.js";
import { checkCases, expectClose, type ReferenceCase } from "../helpers/reference.js";
import { dec, ellipticKE } from "./decimal-elliptic.js";

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
  const M = p.m !== undefined ? new D(p.m) : new D(1).minus(p.mc!);
  const MC = p.mc !== undefined ? new D(p.mc) : new D(1).minus(p.m!);
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
});
