import { countLoop } from "./loop-count.js";

// Gamma(x + 1/2) / Gamma(x + 1) for x >= 0: the mean of |cos|^alpha over a period is
// this ratio at x = alpha / 2 divided by sqrt(pi) (see meanAbsCosinePower). Written as
// one ratio, never as two Gamma values: each alone overflows past x = 171, and their
// quotient, a number near x^-1/2, is representable for every double x.

/** Above this x the asymptotic series alone is accurate to well under an ulp (see below). */
const SERIES_FROM = 10;

/**
 * Coefficients c_n of ln(Gamma(x + 1/2) / Gamma(x + 1)) + (1/2) ln x = sum c_n x^-n,
 * odd n only (the even ones vanish): c_n = (-1)^(n+1) (B_{n+1}(1/2) - B_{n+1}(1)) / (n (n + 1)),
 * from the Stirling series with Bernoulli polynomials (Abramowitz and Stegun 1964, eq. 6.1.42
 * is the Stirling series; the shifted form is from memory). Exact rationals: -1/8, 1/192,
 * -1/640, 17/14336, -31/18432, 691/180224, -5461/425984, 929569/15728640.
 * The first omitted term, -3202291/8912896 x^-17, is below 4e-18 for x >= 10: a fortieth of
 * an ulp of the result's logarithm's effect (the result is exp(sum) / sqrt(x), so an absolute
 * error e in the sum is a relative error e in the result).
 */
const C = [-1 / 8, 1 / 192, -1 / 640, 17 / 14336, -31 / 18432, 691 / 180224, -5461 / 425984, 929569 / 15728640];

/**
 * Gamma(x + 1/2) / Gamma(x + 1) for finite x >= 0, within about 4 ulp.
 *
 * For x >= 10: exp(sum c_n x^-n) / sqrt(x) with the odd series above (|sum| <= 0.0125, so
 * exp adds at most an ulp). Below: the recurrence Gamma(z + 1) = z Gamma(z) upward,
 * G(x) = G(x + K) prod_{i<K} (x + i + 1) / (x + i + 1/2), with K = ceil(10 - x) <= 10, the
 * products of numerators and denominators formed apart (all factors in [1/2, 11], no
 * overflow) and divided once. G(0) = sqrt(pi), and x that underflows to 0 is that limit.
 *
 * Loop: at most 10 steps (K <= 10 because x >= 0), counted through countLoop.
 */
export function gammaHalfRatio(x: number): number {
  if (x >= SERIES_FROM) return seriesRatio(x);
  const steps = Math.ceil(SERIES_FROM - x); // 1..10 for 0 <= x < 10
  let num = 1;
  let den = 1;
  for (let i = 0; i < steps; i++) {
    num *= x + i + 1;
    den *= x + i + 0.5;
  }
  countLoop(steps);
  return (seriesRatio(x + steps) * num) / den;
}

function seriesRatio(x: number): number {
  const t = 1 / x;
  const t2 = t * t;
  // Horner in t^2, smallest terms first; t <= 1/10 so every term is below the one before.
  let s = C[7]!;
  for (let i = 6; i >= 0; i--) s = s * t2 + C[i]!;
  countLoop(7);
  return Math.exp(s * t) / Math.sqrt(x);
}

/** sqrt(pi): the mean of |cos|^alpha at alpha = 0 times sqrt(pi), i.e. Gamma(1/2) / Gamma(1). */
export const SQRT_PI = 1.7724538509055159;

/**
 * The mean of |cos theta|^alpha over a period, for alpha >= 0:
 * (1/2 pi) int_0^{2 pi} |cos theta|^alpha d theta = Gamma((alpha + 1)/2) / (sqrt(pi) Gamma(alpha/2 + 1))
 * (the Beta-function integral int_0^{pi/2} cos^alpha = B(1/2, (alpha + 1)/2) / 2; Abramowitz and
 * Stegun 1964, eq. 6.2.1 with 6.2.2). 1 at alpha = 0, 2/pi at 1, 1/2 at 2, about
 * sqrt(2 / (pi alpha)) for large alpha. Within about 5 ulp.
 */
export function meanAbsCosinePower(alpha: number): number {
  return gammaHalfRatio(alpha / 2) / SQRT_PI;
}
