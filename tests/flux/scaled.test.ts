// The scaled arithmetic behind the flux formulas' extreme inputs (src/flux/scaled.ts):
// its range policy (subnormal results returned, results below 2^-1074 or above the
// largest double refused) and the bound on its one loop.
import { describe, expect, it } from "vitest";
import { pow, quotient, toNumber } from "../../src/flux/scaled.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

describe("scaled products", () => {
  it("return a subnormal result within one of its ulps, where the plain product would lose it on the way", () => {
    // 1e-300 * 1e-10 / 1 = 1e-310 (a subnormal); the double nearest 1e-310 is what a correctly rounded product gives.
    expect(quotient([1e-300, 1e-10])).toBe(1e-310);
    // 1e-300 * 1e-300 underflows to 0 on the way; times 1e300 the exact result is 1e-300.
    expect(Math.abs(quotient([1e-300, 1e-300, 1e300]) - 1e-300)).toBeLessThanOrEqual(2 * 2 ** -52 * 1e-300);
    expect(1e-300 * 1e-300 * 1e300).toBe(0); // the silent zero the scaled form avoids
  });

  it("refuse (Infinity, reported as out_of_range) results beyond the largest double or below the smallest subnormal", () => {
    expect(quotient([1e300, 1e10])).toBe(Infinity);
    expect(quotient([1e-300, 1e-30])).toBe(Infinity); // 1e-330 < 2^-1074 = 4.9e-324
    expect(toNumber({ m: 1, e: -1074 })).toBe(5e-324); // the smallest subnormal itself is kept
  });

  it("keep signs and exact zeros", () => {
    expect(quotient([-2, 3], [-4])).toBe(1.5);
    expect(Object.is(quotient([-2, 0]), -0)).toBe(true);
  });
});

describe("scaled powers", () => {
  it("are exact in the exponent: 2^(1e10) / 2^(1e10) and (1/2)^2000 * 2^2000 give exactly 1", () => {
    const a = pow(2, 1e10);
    const b = pow(0.5, 1e10);
    expect(toNumber({ m: a.m * b.m, e: a.e + b.e })).toBe(1);
    const c = pow(0.5, 2000);
    expect(c).toEqual({ m: 1, e: -2000 });
  });

  it("square a power back into range in at most 1100 halvings and as many squarings (counted, no timer)", () => {
    resetLoopCount();
    pow(1.4, 3000); // 1.4^3000 = 2^1456 overflows; 1.4^1500 = 2^728 does not: one halving
    expect(loopCount().largest).toBe(1);
    resetLoopCount();
    pow(1.4, 1e300); // the mantissa's power alone is astronomically large
    expect(loopCount().largest).toBeLessThanOrEqual(1100);
  });
});
