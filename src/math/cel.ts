/**
 * Bulirsch's generalized complete elliptic integral
 *   cel(kc, p, c, s) = int_0^(pi/2) (c cos^2 t + s sin^2 t) / ((cos^2 t + p sin^2 t) sqrt(cos^2 t + kc^2 sin^2 t)) dt,
 * for 0 < |kc| <= 1 and p > 0. Special cases: cel(kc, 1, 1, 1) = K, cel(kc, 1, 1, kc^2) = E,
 * cel(kc, p, 1, 1) = Pi(1 - p, k) (the third kind), with m = k^2 = 1 - kc^2.
 *
 * Method: R. Bulirsch, "Numerical calculation of elliptic integrals and elliptic
 * functions. III", Numer. Math. 13 (1969) 305-315, algorithm cel, as restated by
 * N. Derby and S. Olbert, "Cylindrical magnets and ideal solenoids", Am. J. Phys.
 * 78 (2010) 229-235, appendix: a Gauss (arithmetic-geometric mean) transformation
 * that carries p, c and s along. Every step is a sum, product or quotient of
 * positive terms when p > 0 and c, s >= 0; with s < 0 the last step's s + c em may
 * cancel (the result is then small against |c| + |s| and accurate in absolute terms).
 *
 * p <= 0 (the Cauchy principal value of Bulirsch's other branch) is refused: the
 * fields of coils and magnets need only 0 < p <= 1.
 *
 * Loop bound. The pair (em, k) runs as twice the arithmetic and geometric means
 * of AGM(1, |kc|) (em <- em + k, k <- 2 sqrt(k em)). With r_n = b_n / a_n of that
 * AGM, r_(n+1) = 2 sqrt(r_n) / (1 + r_n) >= sqrt(r_n), so r_n >= |kc|^(2^-n); for
 * |kc| >= 2^-1074 (the smallest double) r_11 >= 2^(-1074/2048) > 0.69. Below that,
 * 1 - r_(n+1) = (1 - sqrt r_n)^2 / (1 + r_n) <= (1 - r_n)^2 / 4.6, so the gaps after
 * step 11 are at most 0.31, 0.021, 9.5e-5, 2e-9, under the stop tolerance 2^-27
 * (7.5e-9) by step 14; the test runs once more. The cap (20) only guards against
 * a flaw in this argument.
 * Measured (tests/math/cel.test.ts): 12 iterations at |kc| = 1e-300 and 5e-324, 4 at 0.5.
 *
 * Accuracy: the stop tolerance 2^-27 leaves a relative error of the mean of about
 * (2^-27)^2 / 8 < 2^-57 (quadratic convergence), under half an ulp; measured against a
 * 60-digit decimal.js evaluation and against Carlson's K, E: a few ulp.
 */
import { countLoop } from "./loop-count.js";

/** Stop when the two means agree to this relative difference (the error left is its square). */
const TOLERANCE = 2 ** -27;
/** Most AGM steps (14 by the bound above, plus margin). */
export const CEL_CAP = 20;

/**
 * cel(kc, p, c, s) for 0 < |kc| <= 1 and p > 0 (finite). Throws RangeError
 * otherwise: the callers in the library pass geometry that keeps them so
 * (kc = k' of a ratio of distances, p = a squared ratio of radii).
 */
export function cel(kc: number, p: number, c: number, s: number): number {
  if (!(kc !== 0 && Math.abs(kc) <= 1)) throw new RangeError(`cel: kc must satisfy 0 < |kc| <= 1, got ${kc}`);
  if (!(p > 0 && p < Infinity)) throw new RangeError(`cel: p must be positive and finite (the principal value for p <= 0 is not provided), got ${p}`);
  let k = Math.abs(kc);
  let pp = Math.sqrt(p);
  let ss = s / pp;
  let cc = c;
  let em = 1;
  // First step, as in the published algorithm.
  let f = cc;
  cc = cc + ss / pp;
  let g = k / pp;
  ss = 2 * (ss + f * g);
  pp = g + pp;
  g = em;
  em = k + em;
  let kk = k;
  let n = 0;
  for (; n < CEL_CAP && Math.abs(g - k) > g * TOLERANCE; n++) {
    k = 2 * Math.sqrt(kk);
    kk = k * em;
    f = cc;
    cc = cc + ss / pp;
    g = kk / pp;
    ss = 2 * (ss + f * g);
    pp = g + pp;
    g = em;
    em = k + em;
  }
  countLoop(n);
  return (Math.PI / 2) * ((ss + cc * em) / (em * (em + pp)));
}
