// The library's scaled arithmetic (src/math/scaled.ts) and ratio helpers
// (src/math/ratios.ts): exact exponents, the range policy (subnormal results
// returned within one of their ulps; below 2^-1074 or beyond the largest double
// refused as Infinity, which formulas report as out_of_range), the bound on the
// one loop (through countLoop, no timer), and each function's stated error
// bound against a decimal.js oracle of the exact value of its double inputs
// (the oracle evaluates the operation itself: x * y, x / y, sqrt x, x^y, ln(b/a),
// acosh(u/v) at 60 digits from the exact binary values, never the library's code).
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { acoshOfRatio, cappedRatio, logOfRatio } from "../../src/math/ratios.js";
import { exponentOf, ldexp, moderate, mulDiv, pow, Scaled, scaledProduct, twoProduct } from "../../src/math/scaled.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { dec, exact, type Dec } from "./decimal-elliptic.js";

const D = dec(60);
const EPS = 2 ** -52;
const MIN_NORMAL = 2.2250738585072014e-308;
const MIN_SUB = 2 ** -1074; // exact: a power of two within range
const TWO = new D(2);
/** Half the smallest subnormal, plus 1e-30 of itself for the oracle's 60-digit rounding of a tie. */
const HALF_SUB = exact(MIN_SUB).div(2).times(new D(1).plus("1e-30"));
/** True when two decimals agree to 1e-45 relative: equal for doubles and double-double sums (2^-106 = 1e-32). */
const same = (a: Dec, b: Dec): boolean => a.minus(b).abs().lte(b.abs().times(1e-45));

/** The exact value of a scaled number, as a decimal. */
const value = (s: Scaled): Dec => exact(s.m).times(TWO.pow(s.e));
/** Relative error of `got` against `want`, in units of eps = 2^-52. */
const relEps = (got: Dec, want: Dec): number => got.minus(want).abs().div(want.abs()).div(EPS).toNumber();
/**
 * Error of a double result in its own ulps: relative to eps |want| for a normal
 * result, to 2^-1074 for a subnormal one (the range policy's unit).
 */
function ulps(got: number, want: Dec): number {
  const unit = want.abs().lt(MIN_NORMAL) ? exact(MIN_SUB) : want.abs().times(EPS);
  return exact(got).minus(want).abs().div(unit).toNumber();
}

/** Worst error per function (in ulps or eps as each check states), printed at the end for the record. */
const worst = new Map<string, number>();
/** Record `err` as a candidate worst case for `id`, and return it. */
function note(id: string, err: number): number {
  worst.set(id, Math.max(worst.get(id) ?? 0, err));
  return err;
}
afterAll(() => {
  console.log([...worst].map(([k, v]) => `${k}: ${v.toFixed(2)}`).join("\n"));
});

/** A positive double 10^p, p spread over the whole range (subnormals included). */
const anyMagnitude = fc.double({ min: -323, max: 308, noNaN: true }).map((p) => 10 ** p).filter((v) => v > 0 && Number.isFinite(v));
/** A scaled value with an exponent far outside the double range. */
const anyScaled = fc.tuple(fc.double({ min: 1, max: 2, maxExcluded: true, noNaN: true }), fc.integer({ min: -5000, max: 5000 })).map(([m, e]) => Scaled.of(m, e));

describe("moderate inputs (the plain-path test)", () => {
  it("accepts 0 and magnitudes within 2^-150..2^150 of either sign, and nothing else", () => {
    for (const v of [0, -0, 2 ** -150, -(2 ** -150), 1, -1e30, 2 ** 150]) expect(moderate(v), String(v)).toBe(true);
    for (const v of [2 ** 150 * (1 + EPS), 2 ** -150 * (1 - EPS / 2), 1e300, -1e-300, 5e-324, Infinity, NaN]) expect(moderate(v), String(v)).toBe(false);
  });
});

describe("scaled values", () => {
  it("read mantissa and exponent exactly from the bits, subnormals and signs included", () => {
    const cases: [number, number, number][] = [
      [1, 1, 0],
      [3, 1.5, 1],
      [-6, 1.5, 2], // the magnitude: signs are the caller's
      [0.75, 1.5, -1],
      [5e-324, 1, -1074],
      [3 * 2 ** -1074, 1.5, -1073],
      [MIN_NORMAL, 1, -1022],
      [Number.MAX_VALUE, 2 - EPS, 1023],
    ];
    for (const [v, m, e] of cases) {
      expect(Scaled.of(v), String(v)).toMatchObject({ m, e });
      expect(exponentOf(v)).toBe(e);
    }
    expect(Scaled.of(3, 2000)).toMatchObject({ m: 1.5, e: 2001 });
    expect(Scaled.of(0)).toBe(Scaled.ZERO);
    expect(Scaled.of(-0, 5)).toMatchObject({ m: 0, e: 0 });
  });

  it("multiply, divide and add with one rounding (within 2^-53 relative), at exponents far beyond the double range", () => {
    fc.assert(
      fc.property(anyScaled, anyScaled, (a, b) => {
        const [va, vb] = [value(a), value(b)];
        expect(note("times (eps)", relEps(value(a.times(b)), va.times(vb)))).toBeLessThanOrEqual(0.5);
        expect(note("div (eps)", relEps(value(a.div(b)), va.div(vb)))).toBeLessThanOrEqual(0.5);
        expect(note("plus (eps)", relEps(value(a.plus(b)), va.plus(vb)))).toBeLessThanOrEqual(0.5);
        expect(note("sqrt (eps)", relEps(value(a.sqrt()), va.sqrt()))).toBeLessThanOrEqual(0.5);
      }),
    );
  });

  it("keep zero exact: times zero and zero divided give zero, plus zero changes nothing", () => {
    const a = Scaled.of(3, -4000);
    expect(a.times(0)).toBe(Scaled.ZERO);
    expect(Scaled.ZERO.div(a)).toBe(Scaled.ZERO);
    expect(a.plus(0)).toBe(a);
    expect(Scaled.ZERO.plus(a)).toBe(a);
    expect(Scaled.ZERO.sqrt()).toBe(Scaled.ZERO);
  });

  it("give the natural logarithm within 2 ulp, inside and far outside the double range", () => {
    fc.assert(
      fc.property(anyScaled, (a) => {
        const want = value(a).ln();
        const got = a.log();
        if (want.isZero()) expect(got).toBe(0);
        else expect(note("log (eps)", relEps(new D(got), want))).toBeLessThanOrEqual(2);
      }),
    );
  });
});

describe("the range policy (toNumber)", () => {
  it("returns a normal result exactly and refuses one beyond the largest double", () => {
    expect(Scaled.of(2 - EPS, 1023).toNumber()).toBe(Number.MAX_VALUE);
    expect(Scaled.of(1, 1024).toNumber()).toBe(Infinity);
    expect(Scaled.of(1.5, -1022).toNumber(-1)).toBe(-1.5 * MIN_NORMAL);
    expect(Scaled.of(1, 1).div(0).toNumber()).toBe(Infinity); // a zero divisor: out_of_range, never NaN
  });

  it("returns a subnormal result as the nearest subnormal, within half of its ulp of the scaled value", () => {
    expect(Scaled.of(1, -1074).toNumber()).toBe(5e-324); // the smallest subnormal itself is kept
    expect(Scaled.of(1.5, -1074).toNumber()).toBe(1e-323); // 1.5 * 2^-1074: a tie, to even (2 * 2^-1074)
    fc.assert(
      fc.property(fc.double({ min: 1, max: 2, maxExcluded: true, noNaN: true }), fc.integer({ min: -1074, max: -1023 }), (m, e) => {
        const s = Scaled.of(m, e);
        const got = s.toNumber();
        // At most half an ulp (a tie is exactly half; the slack covers the oracle's own 60-digit rounding).
        expect(exact(got).minus(value(s)).abs().lte(HALF_SUB)).toBe(true);
      }),
    );
  });

  it("refuses (Infinity, reported as out_of_range) a result below the smallest subnormal", () => {
    expect(Scaled.of(1.99, -1075).toNumber()).toBe(Infinity);
    expect(Scaled.of(1, -5000).toNumber()).toBe(Infinity);
  });

  it("gives a zero of the caller's sign for an exact zero", () => {
    expect(Object.is(Scaled.ZERO.toNumber(-1), -0)).toBe(true);
    expect(Object.is(Scaled.ZERO.toNumber(), 0)).toBe(true);
  });
});

describe("scaled products and quotients", () => {
  it("return a subnormal result within one of its ulps where the plain product would lose it on the way", () => {
    // 1e-300 * 1e-10 = 1e-310 (a subnormal); 1e-300 * 1e-300 underflows to 0 on the way, times 1e300 it is 1e-300.
    expect(ulps(scaledProduct([1e-300, 1e-10]), exact(1e-300).times(exact(1e-10)))).toBeLessThanOrEqual(1);
    expect(ulps(scaledProduct([1e-300, 1e-300, 1e300]), exact(1e-300).pow(2).times(exact(1e300)))).toBeLessThanOrEqual(1.5);
    expect(1e-300 * 1e-300 * 1e300).toBe(0); // the silent zero the scaled form avoids
  });

  it("refuse (Infinity) results beyond the largest double or below the smallest subnormal", () => {
    expect(scaledProduct([1e300, 1e10])).toBe(Infinity);
    expect(scaledProduct([1e-300, 1e-30])).toBe(Infinity); // 1e-330 < 2^-1074 = 4.9e-324
    expect(scaledProduct([1], [0])).toBe(Infinity); // callers' domains exclude it; never NaN
    expect(mulDiv(1e200, 1e200, 1, 1e-10)).toBe(Infinity);
    expect(mulDiv(1e-300, 1e-30, 1, 1)).toBe(Infinity);
  });

  it("keep signs and give exact zeros signed as IEEE arithmetic signs them", () => {
    expect(scaledProduct([-2, 3], [-4])).toBe(1.5);
    expect(scaledProduct([-1e-300, 1e-300], [1e-300])).toBe(-1e-300);
    expect(Object.is(scaledProduct([-2, 0]), -0)).toBe(true);
    expect(Object.is(scaledProduct([-2, 1e300, 0], [1e-300]), -0)).toBe(true);
    expect(Object.is(scaledProduct([-2, 0], [-1]), 0)).toBe(true);
    expect(Object.is(mulDiv(0, 1e300, 1e300, 1e-300), 0)).toBe(true);
  });

  it("are within (n + k) / 2 ulp for n factors and k divisors over the whole range (plus half a subnormal ulp below it)", () => {
    const signed = fc.tuple(anyMagnitude, fc.boolean()).map(([v, neg]) => (neg ? -v : v));
    fc.assert(
      fc.property(fc.array(signed, { minLength: 1, maxLength: 5 }), fc.array(signed, { maxLength: 3 }), (factors, divisors) => {
        let want = new D(1);
        for (const f of factors) want = want.times(exact(f));
        for (const d of divisors) want = want.div(exact(d));
        const got = scaledProduct(factors, divisors);
        const mag = want.abs();
        if (mag.gt(exact(Number.MAX_VALUE).times(1 + 1e-14)) || mag.lt(exact(MIN_SUB).times(1 - 1e-14))) {
          expect(got, `exact ${want.toExponential(5)} is not a double`).toBe(Infinity);
          return;
        }
        if (got === Infinity) {
          // Only at the edges, where the rounded scaled value may cross the limit.
          expect(mag.gt(exact(Number.MAX_VALUE).times(1 - 1e-14)) || mag.lt(exact(MIN_SUB).times(1 + 1e-14))).toBe(true);
          return;
        }
        const bound = (factors.length + divisors.length) / 2 + (mag.lt(MIN_NORMAL) ? 0.5 : 0);
        expect(note("scaledProduct (ulp)", ulps(got, want)), `${factors} / ${divisors}: got ${got}`).toBeLessThanOrEqual(bound);
      }),
      { numRuns: 500 },
    );
  });

  it("mulDiv is within 2 ulp of a b c / d on its plain path and its scaled one", () => {
    fc.assert(
      fc.property(anyMagnitude, anyMagnitude, anyMagnitude, anyMagnitude, (a, b, c, d) => {
        const want = exact(a).times(exact(b)).times(exact(c)).div(exact(d));
        const got = mulDiv(a, b, c, d);
        if (got === Infinity) {
          expect(want.gt(exact(Number.MAX_VALUE).times(1 - 1e-14)) || want.lt(exact(MIN_SUB).times(1 + 1e-14))).toBe(true);
          return;
        }
        expect(note("mulDiv (ulp)", ulps(got, want)), `${a} ${b} ${c} / ${d}: got ${got}`).toBeLessThanOrEqual(want.lt(MIN_NORMAL) ? 1 : 2);
      }),
      { numRuns: 500 },
    );
    expect(mulDiv(1.5, 2, 3, 4)).toBe(2.25); // the plain path: exact here
  });
});

describe("scaled powers", () => {
  it("are exact in the exponent: 2^(1e10) / 2^(1e10) and (1/2)^2000 * 2^2000 give exactly 1", () => {
    expect(pow(2, 1e10).div(pow(2, 1e10)).toNumber()).toBe(1);
    expect(pow(2, 1e10).times(pow(0.5, 1e10)).toNumber()).toBe(1);
    expect(pow(0.5, 2000)).toMatchObject({ m: 1, e: -2000 });
    expect(pow(3, 0)).toMatchObject({ m: 1, e: 0 });
  });

  it("are within 3 ulp of x^y for |y| <= 2000 across the double range of x", () => {
    fc.assert(
      fc.property(anyMagnitude, fc.double({ min: -2000, max: 2000, noNaN: true }), (x, y) => {
        // x^y = exp(y ln x), at 80 digits: |y ln x| < 2000 * 745 keeps 70 correct digits.
        const want = exact(x, 80).ln().times(exact(y, 80)).exp();
        expect(note("pow, |y| <= 2000 (eps)", relEps(value(pow(x, y)), want)), `${x}^${y}`).toBeLessThanOrEqual(3);
      }),
      { numRuns: 300 },
    );
  });

  it("stay within about 2^(j+1) ulp when j squarings bring the mantissa's power back into range", () => {
    // 1.4^3000 = 2^1456.3: one squaring (j = 1), within 4 ulp; the oracle takes the double nearest 1.4 exactly.
    const want = exact(1.4, 80).ln().times(3000).exp();
    expect(relEps(value(pow(1.4, 3000)), want)).toBeLessThanOrEqual(4);
  });

  it("square a power back into range in at most 16 squarings (counted, no timer)", () => {
    resetLoopCount();
    pow(1.4, 3000); // 1.4^3000 = 2^1456 overflows as a double; 1.4^1500 = 2^728 does not: one squaring
    expect(loopCount().largest).toBe(1);
    resetLoopCount();
    pow(1.4, 8e6); // |y log2 u| = 8e6 * 0.485 = 3.9e6: j = 12
    expect(loopCount().largest).toBe(12);
    for (const y of [1e300, -1e300, 6.5e7 * 2.1, 1e9, 1e15]) {
      resetLoopCount();
      const p = pow(1.4, y); // beyond j = 16 the direct split runs, no loop
      expect(Number.isFinite(p.m)).toBe(true);
      expect(loopCount().largest, String(y)).toBeLessThanOrEqual(16);
    }
  });
});

describe("exact helpers", () => {
  it("ldexp scales by 2^k exactly for |k| up to 2200, rounding only into the subnormals", () => {
    expect(ldexp(MIN_SUB, 2097)).toBe(2 ** 1023);
    expect(ldexp(Number.MAX_VALUE, -2097)).toBe(2 * MIN_SUB); // (2 - 2^-52) 2^-1074 rounds to 2^-1073
    expect(ldexp(3, -1075)).toBe(2 * MIN_SUB); // 1.5 * 2^-1074: a tie, to even
    expect(ldexp(1, 1024)).toBe(Infinity);
    fc.assert(
      fc.property(anyMagnitude, fc.integer({ min: -2200, max: 2200 }), (x, k) => {
        const want = exact(x).times(TWO.pow(k));
        const got = ldexp(x, k);
        if (want.gt(exact(Number.MAX_VALUE))) expect(got).toBe(Infinity);
        else if (want.gte(MIN_NORMAL)) expect(same(exact(got), want)).toBe(true);
        else expect(exact(got).minus(want).abs().lte(HALF_SUB)).toBe(true);
      }),
    );
  });

  it("twoProduct gives a b as p + err exactly, also for b beyond 2^900", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: -1e300, max: 1e300, noNaN: true }), (a, b) => {
        fc.pre(a === 0 || b === 0 || Math.abs(a * b) > 2 ** -969);
        const [p, err] = twoProduct(a, b);
        expect(p).toBe(a * b);
        expect(same(exact(p).plus(exact(err)), exact(a).times(exact(b)))).toBe(true);
      }),
    );
  });
});

describe("logarithms and acosh of ratios", () => {
  /** b from a: nearly equal (a few ulps), close, or orders of magnitude apart, either side. */
  const pair = fc.tuple(
    anyMagnitude,
    fc.oneof(fc.integer({ min: -64, max: 64 }).map((k) => 1 + k * EPS), fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: -300, max: 300, noNaN: true }).map((p) => 10 ** p)),
  ).map(([a, r]) => [a, a * r] as const).filter(([a, b]) => b > 0 && Number.isFinite(b) && a !== b);

  it("ln(b / a) is within 2 ulp everywhere, nearly equal lengths and ratios beyond the double range included", () => {
    fc.assert(
      fc.property(pair, ([a, b]) => {
        const want = exact(b).div(exact(a)).ln();
        expect(note("logOfRatio (ulp)", ulps(logOfRatio(b, a), want)), `ln(${b} / ${a})`).toBeLessThanOrEqual(2);
      }),
      { numRuns: 500 },
    );
    expect(logOfRatio(1e300, 1e-300)).toBeCloseTo(600 * Math.LN10, 12); // the quotient overflows
  });

  it("acosh(u / v) is within 3 ulp everywhere for u > v, touching geometry included", () => {
    fc.assert(
      fc.property(pair, ([a, b]) => {
        const [v, u] = a < b ? [a, b] : [b, a];
        const w = exact(u).div(exact(v));
        const want = w.plus(w.times(w).minus(1).sqrt()).ln(); // acosh w = ln(w + sqrt(w^2 - 1))
        expect(note("acoshOfRatio (ulp)", ulps(acoshOfRatio(u, v), want)), `acosh(${u} / ${v})`).toBeLessThanOrEqual(3);
      }),
      { numRuns: 500 },
    );
  });

  it("cappedRatio holds an overflowing ratio at the largest double (a finite measure)", () => {
    expect(cappedRatio(1e300, 1e-300)).toBe(Number.MAX_VALUE);
    expect(cappedRatio(3, 4)).toBe(0.75);
  });
});
