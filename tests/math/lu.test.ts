/**
 * Dense LU with partial pivoting (src/math/lu.ts) against mathjs's general
 * lusolve (a general-purpose reference library) and exact small systems.
 */
import fc from "fast-check";
import { lusolve } from "mathjs";
import { describe, expect, it } from "vitest";
import { luFactor, luSolve } from "../../src/math/lu.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

function solve(rows: number[][], b: number[]): Float64Array {
  const n = rows.length;
  const f = luFactor(Float64Array.from(rows.flat()), n);
  const x = Float64Array.from(b);
  luSolve(f, x);
  return x;
}

describe("luFactor / luSolve", () => {
  it("pivots past a zero leading entry (exact small system)", () => {
    // [0 1; 1 0] x = [2; 3] -> x = [3, 2]; without row interchanges this divides by 0.
    expect(Array.from(solve([[0, 1], [1, 0]], [2, 3]))).toEqual([3, 2]);
    // [2 1 1; 4 3 3; 8 7 9] x = [4; 10; 24] has x = [1, 1, 1].
    const x = solve([[2, 1, 1], [4, 3, 3], [8, 7, 9]], [4, 10, 24]);
    for (const v of x) expect(v).toBeCloseTo(1, 14);
  });

  it("agrees with mathjs lusolve on random well-conditioned systems to 1e-12", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 24 }), fc.integer({ min: 0, max: 1e6 }), (n, seed) => {
        let s = seed + 1;
        const rnd = (): number => {
          s = (s * 16807) % 2147483647;
          return s / 2147483647 - 0.5;
        };
        // Random entries plus n on the diagonal: diagonally dominant on average, condition modest.
        const rows = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => rnd() + (i === j ? n * 0.5 : 0)));
        const b = Array.from({ length: n }, rnd);
        const x = solve(rows, b);
        const ref = (lusolve(rows, b) as number[][]).map((r) => r[0]!);
        for (let i = 0; i < n; i++) expect(Math.abs(x[i]! - ref[i]!)).toBeLessThan(1e-12 * (1 + Math.abs(ref[i]!)));
      }),
      { numRuns: 60 },
    );
  });

  it("reports a singular matrix through pivotRatio and counts its loops within n^3/3 + 2 n^2", () => {
    expect(luFactor(Float64Array.from([1, 2, 2, 4]), 2).pivotRatio).toBe(0);
    const n = 40;
    const a = new Float64Array(n * n).map((_, k) => ((k * 7919) % 101) / 101 + (k % (n + 1) === 0 ? 5 : 0));
    resetLoopCount();
    const f = luFactor(a, n);
    luSolve(f, new Float64Array(n).fill(1));
    expect(loopCount().total).toBeLessThanOrEqual((n * n * n) / 3 + 2 * n * n);
    expect(f.pivotRatio).toBeGreaterThan(0);
  });
});
