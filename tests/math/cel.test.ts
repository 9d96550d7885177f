// Bulirsch's cel against Carlson's K and E (its special cases), against a
// decimal.js oracle of the same transformation at 60 digits, and that oracle
// against the defining integral (periodic trapezoid rule in decimal) and the
// decimal AGM values of K and E.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cel, CEL_CAP } from "../../src/math/cel.js";
import { ellipticE, ellipticK, ellipticMaxwell } from "../../src/math/elliptic.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { relativeError } from "../helpers/reference.js";
import { celDecimal } from "./decimal-cel.js";
import { dec, ellipticKE, exact } from "./decimal-elliptic.js";

const ULP = Number.EPSILON;
// Weights c, s: zero or normal doubles (a subnormal weight carries few digits of its own).
const coef = fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 4, noNaN: true }));
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((e) => 10 ** e);

/**
 * The definition, int_0^(pi/2) (c cos^2 + s sin^2) / ((cos^2 + p sin^2) sqrt(cos^2 + kc^2 sin^2)) dt,
 * by the trapezoid rule over a period of the even, pi-periodic integrand (exponentially
 * convergent for an analytic periodic integrand), in decimal.js at 40 digits.
 */
function celByQuadrature(kc: number, p: number, c: number, s: number, n = 400) {
  const D = dec(40);
  const pi = D.acos(-1);
  const K2 = exact(kc, 40).pow(2), P = exact(p, 40), C = exact(c, 40), S = exact(s, 40);
  let sum = new D(0);
  for (let j = 0; j < n; j++) {
    const t = pi.times(j).div(n);
    const co = D.cos(t).pow(2), si = D.sin(t).pow(2);
    sum = sum.plus(C.times(co).plus(S.times(si)).div(co.plus(P.times(si)).times(co.plus(K2.times(si)).sqrt())));
  }
  return sum.times(pi).div(n).div(2); // (1/2) int_0^pi
}

describe("cel, Bulirsch's generalized complete elliptic integral", () => {
  it("the decimal oracle equals the defining integral (periodic trapezoid rule, 40 digits)", () => {
    for (const [kc, p, c, s] of [[0.3, 0.5, 1, 0.7], [0.8, 0.2, 1, -0.45], [0.5, 1, 1, -1], [0.6, 0.9, 2, 3]] as const) {
      const q = celByQuadrature(kc, p, c, s);
      expect(celDecimal(kc, p, c, s).minus(q).abs().div(q.abs()).toNumber()).toBeLessThan(1e-30);
    }
  });

  it("the decimal oracle gives the AGM values of K and E (DLMF 19.8.1, 19.8.6) for cel(kc,1,1,1) and cel(kc,1,1,kc^2)", () => {
    for (const kc of [1, 0.9, 0.5, 1e-3, 1e-20]) {
      const D = dec(60);
      const mc = exact(kc, 60).pow(2);
      const { K, E } = ellipticKE(new D(1).minus(mc), mc, 60);
      expect(celDecimal(kc, 1, 1, 1).minus(K).abs().div(K).toNumber()).toBeLessThan(1e-40);
      expect(celDecimal(kc, 1, 1, mc).minus(E).abs().div(E).toNumber()).toBeLessThan(1e-40);
    }
  });

  it("cel(kc,1,1,1) = K and cel(kc,1,1,kc^2) = E within 4 ulp of Carlson's forms (DLMF 19.25.1)", () => {
    fc.assert(fc.property(decades(-150, 0), (kc) => {
      const mc = kc * kc;
      expect(relativeError(cel(kc, 1, 1, 1), ellipticK(1 - mc, mc))).toBeLessThan(4 * ULP);
      expect(relativeError(cel(kc, 1, 1, mc), ellipticE(1 - mc, mc))).toBeLessThan(4 * ULP);
    }), { numRuns: 300 });
  });

  it("cel(kc,1,1,-1) = -((2 - m) K - 2 E) / m, Maxwell's combination, in absolute terms of K", () => {
    fc.assert(fc.property(decades(-12, 0), (kc) => {
      const mc = kc * kc;
      const m = 1 - mc;
      fc.pre(m > 0);
      const want = -ellipticMaxwell(m, mc) / m;
      expect(Math.abs(cel(kc, 1, 1, -1) - want)).toBeLessThan(8 * ULP * ellipticK(m, mc));
    }), { numRuns: 200 });
  });

  it("is within 6 ulp of the 60-digit oracle for 0 < p <= 1 and non-negative c, s", () => {
    let worst = 0;
    fc.assert(fc.property(decades(-300, 0), decades(-30, 0), coef, coef, (kc, p, c, s) => {
      fc.pre(c + s > 0);
      const want = celDecimal(kc, p, c, s).toNumber();
      const err = relativeError(cel(kc, p, c, s), want);
      worst = Math.max(worst, err);
      expect(err).toBeLessThan(6 * ULP);
    }), { numRuns: 400 });
    console.log(`cel worst relative error (c, s >= 0): ${(worst / ULP).toFixed(2)} ulp`);
  });

  it("with the solenoid's arguments cel(kc, g^2, 1, g), |g| <= 1, it is within 8 ulp of the oracle in absolute terms of cel(kc, g^2, 1, |g|)", () => {
    let worst = 0;
    fc.assert(fc.property(decades(-300, 0), decades(-300, 0), fc.boolean(), (kc, ag, neg) => {
      const g = neg ? -ag : ag;
      const want = celDecimal(kc, g * g, 1, g).toNumber();
      const scale = celDecimal(kc, g * g, 1, ag).toNumber();
      fc.pre(g * g > 0);
      const err = Math.abs(cel(kc, g * g, 1, g) - want) / scale;
      worst = Math.max(worst, err);
      expect(err).toBeLessThan(8 * ULP);
    }), { numRuns: 400 });
    console.log(`cel worst error (solenoid arguments, relative to the positive-s value): ${(worst / ULP).toFixed(2)} ulp`);
  });

  it("runs a bounded number of steps: at most 14 (the proof in src/math/cel.ts), under its cap", () => {
    let largest = 0;
    for (const kc of [1, 0.5, 1e-3, 1e-30, 1e-300, 5e-324, -0.25]) {
      resetLoopCount();
      expect(Number.isFinite(cel(kc, 0.3, 1, 0.5))).toBe(true);
      largest = Math.max(largest, loopCount().largest);
    }
    expect(largest).toBeLessThanOrEqual(14);
    expect(largest).toBeLessThan(CEL_CAP);
  });

  it("refuses kc = 0, |kc| > 1, p <= 0 and non-finite arguments with a RangeError", () => {
    expect(() => cel(0, 1, 1, 1)).toThrow(RangeError);
    expect(() => cel(2, 1, 1, 1)).toThrow(RangeError);
    expect(() => cel(0.5, 0, 1, 1)).toThrow(RangeError);
    expect(() => cel(0.5, -0.5, 1, 1)).toThrow(RangeError);
    expect(() => cel(NaN, 1, 1, 1)).toThrow(RangeError);
    expect(() => cel(0.5, Infinity, 1, 1)).toThrow(RangeError);
  });
});
