// Logarithms and inverse hyperbolic cosines of ratios of lengths, to a few ulp
// everywhere: forming the ratio first rounds away the digits that matter when
// it is near one (nearly touching conductors), and overflows or underflows when
// the lengths are far apart. Used by the capacitance, flux and inductance formulas.

const MIN_NORMAL = 2.2250738585072014e-308;

/**
 * ln(b / a) for positive finite a, b, within 2 ulp (absolute 2^-1074 where the
 * result is 0 or subnormal). Near one (a/2 <= b <= 2a) b - a is exact (Sterbenz
 * lemma, subnormals too) and log1p keeps the digits that rounding b/a to a double
 * near 1 would lose; elsewhere ln of the quotient has no cancellation, and where
 * the quotient leaves the normal range, ln b - ln a (then the difference
 * exceeds 700 in size, so the subtraction loses nothing).
 */
export function logOfRatio(b: number, a: number): number {
  if (b <= 2 * a && a <= 2 * b) return Math.log1p((b - a) / a);
  const r = b / a;
  return r <= Number.MAX_VALUE && r >= MIN_NORMAL ? Math.log(r) : Math.log(b) - Math.log(a);
}

/**
 * acosh(u / v) for 0 < v < u (finite), within 3 ulp. Near one (u <= 2v),
 * acosh(1 + s) = log1p(s + sqrt(s (2 + s))) with s = (u - v)/v from the exact
 * difference (Sterbenz), so touching geometry keeps its digits. Above,
 * acosh(w) = ln w + ln(1 + sqrt(1 - 1/w^2)): two positive terms (no
 * cancellation) and no w^2 to overflow.
 */
export function acoshOfRatio(u: number, v: number): number {
  if (u <= 2 * v) {
    const s = (u - v) / v;
    return Math.log1p(s + Math.sqrt(s * (2 + s)));
  }
  const w = v / u; // in (0, 1/2]; it may underflow to 0 only where the term is ln 2 to the last digit
  return logOfRatio(u, v) + Math.log(1 + Math.sqrt((1 - w) * (1 + w)));
}

/**
 * a / b for positive a, b, held at the largest double where it would
 * overflow: a condition's measure ("how far past the threshold") must stay
 * finite for bulk tools to compare points. One rounding.
 */
export function cappedRatio(a: number, b: number): number {
  return Math.min(a / b, Number.MAX_VALUE);
}
