import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { brent, MAX_BRENT_ITERATIONS, signChanges } from "../../src/math/roots.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { expectClose } from "../helpers/reference.js";

describe("Brent's method", () => {
  // Check values: ECMAScript Math constants (Math.SQRT2, Math.LN10), and two classic
  // test roots recalled from numerical-analysis texts ("from memory").
  const cases = [
    { name: "x^2 - 2 on [0, 2] gives sqrt 2", f: (x: number) => x * x - 2, a: 0, b: 2, expected: Math.SQRT2, source: "ECMAScript Math.SQRT2" },
    { name: "e^x - 10 on [0, 5] gives ln 10", f: (x: number) => Math.exp(x) - 10, a: 0, b: 5, expected: Math.LN10, source: "ECMAScript Math.LN10" },
    { name: "cos x - x on [0, 1] gives the Dottie number", f: (x: number) => Math.cos(x) - x, a: 0, b: 1, expected: 0.7390851332151607, source: "from memory (Dottie number)" },
    { name: "x^3 - 2x - 5 on [2, 3] gives Wallis's root", f: (x: number) => x ** 3 - 2 * x - 5, a: 2, b: 3, expected: 2.0945514815423265, source: "from memory (Wallis's cubic)" },
    { name: "a triple root (x - 1)^3 on [0, 3]", f: (x: number) => (x - 1) ** 3, a: 0, b: 3, expected: 1, source: "exact" },
  ];
  for (const c of cases) {
    it(`finds ${c.name}`, () => {
      const r = brent(c.f, c.a, c.b);
      expect(r.converged).toBe(true);
      expectClose(r.x, { name: c.name, input: [c.a, c.b], expected: c.expected, tolerance: c.expected === 1 ? 1e-5 : 1e-14, source: c.source });
    });
  }

  it("converges to the jump of a discontinuous sign change (and leaves the residual large)", () => {
    const r = brent((x) => (x < 0.3 ? -1 : 1), 0, 1);
    expect(r.x).toBeCloseTo(0.3, 12);
    expect(Math.abs(r.fx)).toBe(1);
  });

  it("refuses end values of the same sign", () => {
    expect(() => brent((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });

  it("returns an end point that is already a root", () => {
    expect(brent((x) => x - 2, 2, 5).x).toBe(2);
  });

  it("finds the root of any line through a bracket, to a few ulps", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (root, slope) => {
        const r = brent((x) => slope * (x - root), root - 10 - Math.abs(root), root + 7 + Math.abs(root));
        expect(Math.abs(r.x - root)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(root)));
      }),
    );
  });

  it("takes few evaluations on a smooth function (superlinear, unlike bisection's ~50)", () => {
    let n = 0;
    brent((x) => (n++, Math.exp(x) - 10), 0, 5);
    expect(n).toBeLessThan(20);
  });
});

describe("sign changes of samples", () => {
  it("finds each crossing and each exact zero, and skips pairs across a missing value", () => {
    const xs = [0, 1, 2, 3, 4, 5, 6];
    const fs = [-1, 1, 0, 2, -2, NaN, 3];
    const b = signChanges(xs, fs);
    expect(b.map((x) => [x.lo, x.hi])).toEqual([[0, 1], [2, 2], [3, 4]]);
  });
});

describe("Brent's iteration bound", () => {
  it("accepts an iteration cap from 1 to MAX_BRENT_ITERATIONS and reports its count", () => {
    expect(() => brent((x) => x - 1, 0, 2, { maxIterations: 0 })).toThrow(RangeError);
    expect(() => brent((x) => x - 1, 0, 2, { maxIterations: MAX_BRENT_ITERATIONS + 1 })).toThrow(RangeError);
    expect(() => brent((x) => x - 1, 0, 2, { maxIterations: 2.5 })).toThrow(RangeError);
    resetLoopCount();
    const r = brent((x) => x * x - 2, 0, 2);
    expect(loopCount().total).toBe(r.iterations);
    // A cap of 3 stops a slow bracket unconverged, after exactly 3 iterations.
    resetLoopCount();
    const slow = brent((x) => Math.cbrt(x - 1e-3), -1e300, 1e300, { maxIterations: 3 });
    expect(slow.converged).toBe(false);
    expect(loopCount().total).toBe(3);
  });

  it("converges from brackets spanning the whole double range within the largest cap", () => {
    // atan flattens far from the root, so this is close to plain bisection by value: about
    // 1,000 halvings from 1e308 down to a root at 0 (measured 1,005-1,008), well under the
    // 2,100 the doc comment allows for and the 10,000 cap. The default cap of 200 is for
    // the brackets the library's callers pass (a few decades wide).
    for (const root of [0, 1e-300, -3e-200, 1, 7e150]) {
      const r = brent((x) => Math.atan(x - root) + (x - root) * 1e-300, -1e308, 1.7e308, { maxIterations: MAX_BRENT_ITERATIONS });
      expect(r.converged).toBe(true);
      expect(r.iterations).toBeLessThan(2_100);
      expect(Math.abs(r.x - root)).toBeLessThanOrEqual(16 * Number.EPSILON * Math.abs(root) + 1e-300); // twice tol = 2 (2 xRelTol |x|)
    }
  });
});
