/**
 * Gauss-Legendre quadrature on [-1, 1] and on intervals.
 *
 * Method: the nodes are the roots of the Legendre polynomial P_n, found by
 * Newton's method from Tricomi's initial estimate cos(pi (i - 1/4)/(n + 1/2))
 * (DLMF 18.16, A&S 22.16.6), with P_n and P_n' from the three-term recurrence
 * (DLMF 18.9.1); the weights are w_i = 2 / ((1 - x_i^2) P_n'(x_i)^2)
 * (A&S 25.4.29). Newton converges quadratically from that start (Tricomi's
 * estimate is within O(n^-2) of the root, well inside the basin): the loop
 * stops when the correction is at most 1e-16, and is capped at NEWTON_CAP = 10
 * steps per node. Measured over every node of every order 1..4096: at most 6
 * steps (tests/math/quadrature.test.ts re-measures orders 1..300 and a few up to
 * 4096). Computed once per order and cached.
 */
import { countLoop } from "./loop-count.js";

/** Newton steps allowed per node; at most 6 are ever taken (measured, see above). */
export const NEWTON_CAP = 10;

export interface GaussRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
  /** Most Newton steps any node of this rule took (at most NEWTON_CAP). */
  readonly maxNewtonSteps: number;
}

const cache = new Map<number, GaussRule>();

/** The n-point Gauss-Legendre rule on [-1, 1] (exact for polynomials of degree <= 2n - 1). */
export function gaussLegendre(n: number): GaussRule {
  if (!Number.isInteger(n) || n < 1 || n > 4096) throw new RangeError(`gaussLegendre: order must be a whole number 1..4096, got ${n}`);
  const hit = cache.get(n);
  if (hit) return hit;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  let steps = 0;
  for (let i = 0; i < half; i++) {
    // Tricomi's first approximation to the i-th largest root.
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let iter = 0;
    while (iter < NEWTON_CAP) {
      iter++;
      const [p, dp] = legendre(n, x);
      const dx = p / dp;
      x -= dx;
      if (Math.abs(dx) <= 1e-16) break;
    }
    countLoop(iter);
    steps = Math.max(steps, iter);
    // P_n' at the final node for the weight.
    const dp = legendre(n, x)[1];
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  if (n % 2 === 1) nodes[(n - 1) / 2] = 0; // the middle node is exactly 0
  const rule = { nodes, weights, maxNewtonSteps: steps };
  cache.set(n, rule);
  return rule;
}

/** [P_n(x), P_n'(x)] by the three-term recurrence; (1 - x^2) P_n' = n (P_{n-1} - x P_n). */
function legendre(n: number, x: number): [number, number] {
  let p0 = 1;
  let p1 = x;
  for (let k = 2; k <= n; k++) {
    const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
    p0 = p1;
    p1 = p2;
  }
  if (n === 1) p0 = 1;
  return [p1, (n * (p0 - x * p1)) / (1 - x * x)];
}

/** Integral of f over [a, b] with the n-point Gauss-Legendre rule. */
export function integrate(f: (x: number) => number, a: number, b: number, n = 20): number {
  const { nodes, weights } = gaussLegendre(n);
  const c = 0.5 * (a + b);
  const h = 0.5 * (b - a);
  let s = 0;
  for (let i = 0; i < n; i++) s += weights[i]! * f(c + h * nodes[i]!);
  return s * h;
}
