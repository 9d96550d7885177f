/**
 * Dense LU factorisation with partial pivoting (Doolittle, row interchanges),
 * for the moment-method systems of the 2-D field solver.
 *
 * The matrix is square, row-major in a Float64Array, and is overwritten by its
 * factors: L (unit lower, below the diagonal) and U (on and above it), with
 * `pivot[k]` the row swapped into row k at step k. Partial pivoting bounds the
 * multipliers by 1 (Golub and Van Loan, Matrix Computations, 4th ed., sec. 3.4),
 * which is what makes elimination backward stable in practice.
 *
 * Loop bounds: the factorisation runs n steps; step k updates (n - k - 1)^2
 * entries, so at most n^3 / 3 + O(n^2) inner iterations; each solve is 2 n^2 / 2.
 * Both are reported to countLoop.
 */
import { countLoop } from "./loop-count.js";

export interface LuFactors {
  readonly n: number;
  /** L below the diagonal (unit diagonal implied) and U on and above, row-major. */
  readonly a: Float64Array;
  readonly pivot: Int32Array;
  /** Smallest |U_kk| over largest |A_ij| seen: near 0 for a numerically singular matrix. */
  readonly pivotRatio: number;
}

/**
 * Factorises the n x n row-major matrix `a` in place. `beforeStep(k)`, when given, is
 * called before elimination step k (which updates (n - k - 1)^2 entries): the caller's
 * progress and cancellation point (it may throw).
 */
export function luFactor(a: Float64Array, n: number, beforeStep?: (k: number) => void): LuFactors {
  const pivot = new Int32Array(n);
  let largest = 0;
  for (let i = 0; i < n * n; i++) largest = Math.max(largest, Math.abs(a[i]!));
  let smallestPivot = Infinity;
  let work = 0;
  for (let k = 0; k < n; k++) {
    if (beforeStep !== undefined) beforeStep(k);
    // Row with the largest entry in column k at or below the diagonal.
    let p = k;
    let best = Math.abs(a[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]!);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    pivot[k] = p;
    if (p !== k) {
      const rk = k * n;
      const rp = p * n;
      for (let j = 0; j < n; j++) {
        const t = a[rk + j]!;
        a[rk + j] = a[rp + j]!;
        a[rp + j] = t;
      }
    }
    smallestPivot = Math.min(smallestPivot, best);
    if (best === 0) continue; // singular column: reported through pivotRatio
    const inv = 1 / a[k * n + k]!;
    const rk = k * n;
    for (let i = k + 1; i < n; i++) {
      const ri = i * n;
      const m = a[ri + k]! * inv;
      a[ri + k] = m;
      if (m === 0) continue;
      for (let j = k + 1; j < n; j++) a[ri + j] = a[ri + j]! - m * a[rk + j]!;
      work += n - k - 1;
    }
  }
  countLoop(work + n * n);
  return { n, a, pivot, pivotRatio: largest > 0 ? smallestPivot / largest : 0 };
}

/** Solves A x = b in place in `b` (length n) with the factors of A. */
export function luSolve(f: LuFactors, b: Float64Array): void {
  const { n, a, pivot } = f;
  for (let k = 0; k < n; k++) {
    const p = pivot[k]!;
    if (p !== k) {
      const t = b[k]!;
      b[k] = b[p]!;
      b[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[i]!;
    const ri = i * n;
    for (let j = 0; j < i; j++) s -= a[ri + j]! * b[j]!;
    b[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i]!;
    const ri = i * n;
    for (let j = i + 1; j < n; j++) s -= a[ri + j]! * b[j]!;
    b[i] = s / a[ri + i]!;
  }
  countLoop(n * n);
}
