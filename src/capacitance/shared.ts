import { AT_LEAST_ONE } from "../core/spec.js";

/** The dielectric's relative permittivity: 1 for vacuum (and, to 0.06 %, dry air). */
export const RELATIVE_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the dielectric (1 for vacuum)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 4.4,
} as const;

// ---- numerics shared by the capacitance formulas ----
//
// Every geometry here reduces to C = (constant * epsr * length) / (a logarithm
// or a ratio). Two things can go wrong in floating point: the logarithm of a
// ratio near one loses digits when the ratio is formed first, and products of
// extreme magnitudes (1e-200 m, 1e200 m) overflow or underflow in an
// intermediate step although the result is representable. The helpers below
// handle both; tests/capacitance/extremes-accuracy.test.ts checks every formula
// against a decimal.js oracle to 4 ulp (6 through a logarithm; measured worst 1.6).

const MIN_NORMAL = 2.2250738585072014e-308;
const TWO_POW_64 = 18446744073709551616;
const bits = new DataView(new ArrayBuffer(8));

/**
 * ln(b / a) for 0 < a < b, accurate to a few ulp everywhere.
 * Near one (b <= 2a) the difference b - a is exact (Sterbenz lemma, also for
 * subnormals), so log1p((b - a) / a) keeps every digit that ln(b / a) would lose
 * by rounding b / a to a double near 1. Where b / a overflows, ln b - ln a has
 * no cancellation (the difference exceeds 700).
 */
export function logOfRatio(b: number, a: number): number {
  if (b <= 2 * a) return Math.log1p((b - a) / a);
  const r = b / a;
  return r <= Number.MAX_VALUE ? Math.log(r) : Math.log(b) - Math.log(a);
}

/**
 * acosh(u / v) for 0 < v < u, accurate to a few ulp everywhere.
 * Near one (u <= 2v) it is acosh(1 + s) = log1p(s + sqrt(s (2 + s))) with
 * s = (u - v) / v formed from the exact difference (Sterbenz), so touching
 * geometry keeps its digits. Above, acosh(w) = ln w + ln(1 + sqrt(1 - 1/w^2)):
 * two positive terms (no cancellation) and no w^2 to overflow.
 */
export function acoshOfRatio(u: number, v: number): number {
  if (u <= 2 * v) {
    const s = (u - v) / v;
    return Math.log1p(s + Math.sqrt(s * (2 + s)));
  }
  const w = v / u; // 1/(u/v) in (0, 1/2]; 0 only when u/v overflows, where the term is ln 2
  return logOfRatio(u, v) + Math.log(1 + Math.sqrt((1 - w) * (1 + w)));
}

/**
 * (a * b * c) / d for non-negative finite a, b, c and positive finite d, with no
 * intermediate overflow or underflow. The plain product is used when every
 * step stays a normal double (then each step is correctly rounded); otherwise
 * mantissas and exponents are multiplied apart. A result beyond the largest
 * double, or below the smallest normal one (where digits would be lost),
 * returns Infinity, which the formula reports as `out_of_range`.
 */
export function mulDiv(a: number, b: number, c: number, d: number): number {
  const ab = a * b;
  const abc = ab * c;
  const r = abc / d;
  if (ab >= MIN_NORMAL && abc >= MIN_NORMAL && r >= MIN_NORMAL && r <= Number.MAX_VALUE) return r;
  // The rare path lives in its own function so this one stays small enough for
  // the engine to inline into callers (measured: several times faster typed calls).
  return mulDivScaled(a, b, c, d);
}

function mulDivScaled(a: number, b: number, c: number, d: number): number {
  if (a === 0 || b === 0 || c === 0) return 0;
  const [ma, ea] = split(a);
  const [mb, eb] = split(b);
  const [mc, ec] = split(c);
  const [md, ed] = split(d);
  // Each mantissa is in [1, 2): the quotient is in (1/2, 8), far from any limit.
  const [m, em] = split((ma * mb * mc) / md);
  const e = ea + eb + ec - ed + em;
  if (e > 1023 || e < -1022) return Infinity;
  return m * pow2(e);
}

/**
 * The signed product of `factors` divided by the product of `divisors`, for
 * finite factors and non-zero finite divisors, with no intermediate overflow
 * or underflow: the general form of `mulDiv`, used by the displacement and
 * force families (signed inputs, more factors). A zero factor gives 0. A
 * result beyond the largest double or below the smallest normal one returns
 * Infinity, which the formula reports as `out_of_range` (subnormal results
 * are refused rather than returned with lost digits).
 *
 * Error: one rounding per factor and divisor (each at most half an ulp), so
 * for n factors and k divisors the result is within (n + k) / 2 ulp of the
 * exact value of the double inputs, whichever path runs.
 *
 * Loops: one pass over each list (bounded by its length).
 */
export function scaledProduct(factors: readonly number[], divisors: readonly number[]): number {
  let p = 1;
  let normal = true;
  for (let i = 0; i < factors.length; i++) {
    p *= factors[i]!;
    const m = Math.abs(p);
    if (!(m >= MIN_NORMAL && m <= Number.MAX_VALUE)) normal = false;
  }
  for (let i = 0; i < divisors.length; i++) {
    p /= divisors[i]!;
    const m = Math.abs(p);
    if (!(m >= MIN_NORMAL && m <= Number.MAX_VALUE)) normal = false;
  }
  if (normal) return p;
  return scaledProductSlow(factors, divisors);
}

function scaledProductSlow(factors: readonly number[], divisors: readonly number[]): number {
  if (factors.includes(0)) {
    // An exact zero, signed as IEEE arithmetic would sign it (-0 for an odd count of negative signs).
    let negative = false;
    for (const v of [...factors, ...divisors]) if (v < 0 || Object.is(v, -0)) negative = !negative;
    return negative ? -0 : 0;
  }
  let sign = 1;
  let m = 1;
  let e = 0;
  // Mantissas in [1, 2): after each step m is renormalised to [1, 2), so no
  // intermediate can leave the range; only the exponent sum grows.
  for (let i = 0; i < factors.length; i++) {
    const f = factors[i]!;
    if (f < 0) sign = -sign;
    const [mf, ef] = split(Math.abs(f));
    const [mm, em] = split(m * mf);
    m = mm;
    e += ef + em;
  }
  for (let i = 0; i < divisors.length; i++) {
    const d = divisors[i]!;
    if (d === 0) return Infinity; // callers' domains exclude it; reported as out_of_range, never NaN
    if (d < 0) sign = -sign;
    const [md, ed] = split(Math.abs(d));
    const [mm, em] = split(m / md);
    m = mm;
    e += em - ed;
  }
  if (e > 1023 || e < -1022) return Infinity;
  return sign * m * pow2(e);
}

// v = m * 2^e with m in [1, 2), for positive finite v (subnormals included).
function split(v: number): [number, number] {
  let offset = 0;
  if (v < MIN_NORMAL) {
    v *= TWO_POW_64; // exact: a power of two
    offset = -64;
  }
  bits.setFloat64(0, v);
  const hi = bits.getUint32(0);
  const e = ((hi >>> 20) & 0x7ff) - 1023;
  bits.setUint32(0, (hi & 0x800fffff) | 0x3ff00000);
  return [bits.getFloat64(0), e + offset];
}

// 2^e exactly, for -1022 <= e <= 1023.
function pow2(e: number): number {
  bits.setUint32(0, (e + 1023) << 20);
  bits.setUint32(4, 0);
  return bits.getFloat64(0);
}
