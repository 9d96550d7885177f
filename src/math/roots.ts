/**
 * Root finding on a bracket: Brent's method (inverse quadratic interpolation and
 * secant steps, safeguarded by bisection), plus a sign-change scan over sample points.
 *
 * Method: R. P. Brent, Algorithms for Minimization without Derivatives
 * (Prentice-Hall, 1973), ch. 4, procedure "zero". The step logic below is written
 * from that description: keep a bracket [b, c] with f(b) f(c) <= 0 and |f(b)| <= |f(c)|;
 * try interpolation, accept it only if it lands well inside the bracket and shrinks
 * the step fast enough, otherwise bisect. Convergence is guaranteed for any
 * continuous function with a sign change, superlinear for smooth ones.
 * The loop runs at most `maxIterations` times (default 200, at most
 * MAX_BRENT_ITERATIONS) and reports its count to countLoop.
 */
import { countLoop } from "./loop-count.js";

export interface BrentOptions {
  /** Absolute tolerance on x (added to the relative one). Default 0. */
  readonly xAbsTol?: number;
  /** Relative tolerance on x. Default 4 * machine epsilon. */
  readonly xRelTol?: number;
  /** Iteration cap, a whole number 1..MAX_BRENT_ITERATIONS. Default 200. */
  readonly maxIterations?: number;
}

/**
 * Largest iteration cap brent accepts. Brent (1973, ch. 4) bounds the steps by
 * about the square of the bisections needed; bisection by value over the whole
 * double range to a relative tolerance of 4 eps needs at most about 2,100
 * halvings, so 10,000 is generous for any bracket a caller can pass, and keeps
 * a call to a few milliseconds times the cost of f.
 */
export const MAX_BRENT_ITERATIONS = 10_000;

export interface BrentResult {
  /** The root estimate. */
  readonly x: number;
  /** f at the root estimate. */
  readonly fx: number;
  readonly iterations: number;
  /** True when the tolerance was met (or f(x) == 0) before the iteration cap. */
  readonly converged: boolean;
}

/**
 * Find x in [a, b] with f(x) = 0, given f(a) and f(b) of opposite signs (or one zero).
 * Throws RangeError when the end values do not bracket a root or are not finite.
 *
 * @example
 * brent((x) => x * x - 2, 0, 2).x; // ≈ 1.41421356237
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  options: BrentOptions = {},
  fa0?: number,
  fb0?: number,
): BrentResult {
  const absTol = options.xAbsTol ?? 0;
  const relTol = options.xRelTol ?? 4 * Number.EPSILON;
  const maxIter = options.maxIterations ?? 200;
  if (!Number.isInteger(maxIter) || maxIter < 1 || maxIter > MAX_BRENT_ITERATIONS) {
    throw new RangeError(`brent: maxIterations must be a whole number 1..${MAX_BRENT_ITERATIONS}, got ${maxIter}`);
  }
  let fa = fa0 ?? f(a);
  let fb = fb0 ?? f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) throw new RangeError("brent: f is not finite at the bracket ends");
  if (fa === 0) return { x: a, fx: 0, iterations: 0, converged: true };
  if (fb === 0) return { x: b, fx: 0, iterations: 0, converged: true };
  if ((fa > 0) === (fb > 0)) throw new RangeError("brent: f(a) and f(b) have the same sign");

  // c is the previous iterate on the other side of the root; d the last step, e the one before.
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 1; iter <= maxIter; iter++) {
    if ((fb > 0) === (fc > 0)) {
      // Keep the root between b and c.
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      // b is always the best estimate so far.
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol = 2 * relTol * Math.abs(b) + 0.5 * absTol;
    const m = 0.5 * c - 0.5 * b; // halves first: c - b overflows for brackets wider than 1.8e308
    if (Math.abs(m) <= tol || fb === 0) {
      countLoop(iter);
      return { x: b, fx: fb, iterations: iter, converged: true };
    }

    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // Interpolate: secant when a == c, inverse quadratic otherwise.
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      // Accept when the step stays inside 3/4 of the bracket and is under half the step before last.
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) {
      countLoop(iter);
      throw new RangeError("brent: f is not finite inside the bracket");
    }
  }
  countLoop(maxIter);
  return { x: b, fx: fb, iterations: maxIter, converged: false };
}

/** A sign change between two neighbouring samples, or a sample where f is exactly zero. */
export interface Bracket {
  readonly lo: number;
  readonly hi: number;
  readonly flo: number;
  readonly fhi: number;
  /** Index of the sample at `lo`. */
  readonly index: number;
}

/**
 * Sign changes of sampled values: pairs of neighbouring samples whose values have
 * opposite signs, and samples where the value is exactly zero (lo === hi).
 * Samples whose value is not finite (not computed) break the chain: no bracket
 * spans them.
 */
export function signChanges(xs: ArrayLike<number>, fs: ArrayLike<number>): Bracket[] {
  const out: Bracket[] = [];
  for (let i = 0; i < xs.length; i++) {
    const fi = fs[i]!;
    if (!Number.isFinite(fi)) continue;
    if (fi === 0) {
      out.push({ lo: xs[i]!, hi: xs[i]!, flo: 0, fhi: 0, index: i });
      continue;
    }
    if (i + 1 < xs.length) {
      const fj = fs[i + 1]!;
      if (Number.isFinite(fj) && fj !== 0 && (fi > 0) !== (fj > 0)) {
        out.push({ lo: xs[i]!, hi: xs[i + 1]!, flo: fi, fhi: fj, index: i });
      }
    }
  }
  return out;
}
