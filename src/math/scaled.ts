// Scaled arithmetic for the whole library: products, quotients, sums, square
// roots and powers of doubles whose intermediate steps would overflow or
// underflow although the result is a representable double (1e-200 T times
// 1e200 m^2, V^2 for V = 1e200 V, f^alpha beyond 1e308 times k = 1e-100).
// Every formula keeps its plain arithmetic for moderate inputs (see
// `moderate`) and comes here only otherwise, so the common case pays a few
// comparisons and nothing else.
//
// Representation: a non-negative value m * 2^e with m in [1, 2) (or m = 0 for
// an exact zero) and e an integer that may lie far outside the double exponent
// range. Signs are kept by the caller and given back to `toNumber`. Each
// product or quotient of two scaled values rounds once (the mantissa product,
// relative error at most 2^-53); the exponent sum is exact.
//
// Range policy (the one rule for the library): `toNumber` returns every result
// whose magnitude is at least the smallest subnormal double, 2^-1074. A result
// below the smallest normal double (2^-1022) comes back as the subnormal
// nearest the scaled value, so within one of its ulps (2^-1074) of the exact
// value: the project's rule is that a representable result is returned, and a
// subnormal is representable. A result beyond the largest double or below
// 2^-1074 comes back as Infinity, which `defineFormula` reports as
// `out_of_range`. An exact zero stays zero (signed).

import { countLoop } from "./loop-count.js";

const MIN_NORMAL = 2.2250738585072014e-308;
const TWO_POW_64 = 18446744073709551616;
/** Most squarings `pow` uses to bring a power back into range (see pow). */
const SQUARINGS = 16;
const bits = /* @__PURE__ */ new DataView(new ArrayBuffer(8));

// Plain evaluation is safe when every factor lies within 2^-150..2^150 (or is 0):
// then a product or quotient of up to six of them, times constants of the library
// (mu0 ~ 2^-20, eps0 ~ 2^-37), stays within 2^-960..2^960, a normal double at every
// step, so each step rounds once and nothing overflows or underflows.
const MODERATE_LOW = 2 ** -150;
const MODERATE_HIGH = 2 ** 150;

/**
 * True when |v| is 0 or within 2^-150..2^150: up to six such values (with the
 * library's constants) multiply and divide in plain doubles without leaving
 * the normal range, so a formula may take its plain path. Exact (comparisons only).
 */
export function moderate(v: number): boolean {
  // Comparisons only, positive values first, zero last: this sits on every
  // formula's fast branch; the Math.abs form made a typed longSolenoidInductance
  // call 13.8 ns instead of 5.2 ns (bench/typed.ts, 2026-12-02).
  return (v >= MODERATE_LOW && v <= MODERATE_HIGH) || (v <= -MODERATE_LOW && v >= -MODERATE_HIGH) || v === 0;
}

/**
 * A non-negative value m * 2^e, m in [1, 2) (or 0 for zero), e an integer of
 * any size: it never overflows or underflows. Immutable.
 */
export class Scaled {
  /** The exact zero. */
  static readonly ZERO: Scaled = /* @__PURE__ */ new Scaled(0, 0);

  private constructor(
    /** The mantissa, in [1, 2), or 0 for an exact zero. */
    readonly m: number,
    /** The binary exponent, an integer (0 for zero). */
    readonly e: number,
  ) {}

  /**
   * |v| * 2^e for finite v (subnormals included) and an integer e. Exact: the
   * mantissa and exponent are read from the bits (subnormals first scaled by
   * 2^64, also exact). Zero gives the scaled zero.
   */
  static of(v: number, e = 0): Scaled {
    if (v === 0) return Scaled.ZERO;
    const m = mantissa(v);
    return new Scaled(m, frexpExponent + e);
  }

  /** this * v: one rounding (relative error at most 2^-53), or none when v is a power of two. */
  times(v: number | Scaled): Scaled {
    const s = typeof v === "number" ? Scaled.of(v) : v;
    if (this.m === 0 || s.m === 0) return Scaled.ZERO;
    return Scaled.of(this.m * s.m, this.e + s.e); // mantissa product in [1, 4): no overflow
  }

  /** this / v for v nonzero: one rounding (relative error at most 2^-53). A zero divisor gives Infinity's scaled form (e = Infinity). */
  div(v: number | Scaled): Scaled {
    const s = typeof v === "number" ? Scaled.of(v) : v;
    if (s.m === 0) return new Scaled(1, Infinity); // callers' domains exclude it; toNumber gives Infinity (out_of_range), never NaN
    if (this.m === 0) return Scaled.ZERO;
    return Scaled.of(this.m / s.m, this.e - s.e); // in (1/2, 2)
  }

  /**
   * this + v (both non-negative): the smaller is shifted onto the larger's
   * exponent; one rounding (relative error at most 2^-53, no cancellation).
   */
  plus(v: number | Scaled): Scaled {
    const s = typeof v === "number" ? Scaled.of(v) : v;
    if (s.m === 0) return this;
    if (this.m === 0) return s;
    const [big, small] = this.e >= s.e ? [this, s] : [s, this];
    const shift = small.e - big.e; // <= 0
    // Below 2^-60 the smaller addend is under 2^-8 of the larger's ulp (2^-52 of m >= 1): it cannot change the sum.
    return shift < -60 ? big : Scaled.of(big.m + small.m * 2 ** shift, big.e);
  }

  /** Square root: the exponent made even first, then one correctly rounded sqrt (half an ulp). */
  sqrt(): Scaled {
    if (this.m === 0) return this;
    const odd = this.e & 1; // 0 or 1, also for negative e (two's complement)
    return Scaled.of(Math.sqrt(odd ? 2 * this.m : this.m), (this.e - odd) / 2);
  }

  /**
   * ln of the value (nonzero): within an ulp or two. Inside the double range it
   * is Math.log of the exact double; outside, ln m + e ln 2 with |e| > 1022,
   * where the two terms cannot cancel (ln m < 0.7).
   */
  log(): number {
    if (this.e >= -1022 && this.e <= 1023) return Math.log(this.m * pow2(this.e));
    return Math.log(this.m) + this.e * Math.LN2;
  }

  /**
   * The double nearest sign * m * 2^e (see the range policy at the top of the
   * file): exact for a normal result, within half a subnormal ulp (2^-1075) of
   * the scaled value for a subnormal one, Infinity (out_of_range) beyond the
   * largest double or below 2^-1074; a zero gives a zero of the sign.
   */
  toNumber(sign = 1): number {
    return compose(sign, this.m, this.e);
  }
}

/**
 * (product of factors) / (product of divisors), signs kept, for finite factors
 * and nonzero finite divisors, with no intermediate overflow or underflow.
 * The plain product is used when every step stays a normal double (then each
 * step is correctly rounded); otherwise mantissas and exponents are multiplied
 * apart. Either way the result is within (n + k) / 2 ulp for n factors and k
 * divisors (one rounding each), plus half a subnormal ulp for a subnormal
 * result; beyond the range policy (top of file) it is Infinity. A zero factor
 * gives an exact zero signed as IEEE arithmetic signs it.
 *
 * Loops: one pass over each list (bounded by its length), twice at most.
 */
export function scaledProduct(factors: readonly number[], divisors: readonly number[] = []): number {
  let p = 1;
  let normal = true;
  for (let i = 0; i < factors.length; i++) {
    p *= factors[i]!;
    const a = Math.abs(p);
    if (!(a >= MIN_NORMAL && a <= Number.MAX_VALUE)) normal = false;
  }
  for (let i = 0; i < divisors.length; i++) {
    p /= divisors[i]!;
    const a = Math.abs(p);
    if (!(a >= MIN_NORMAL && a <= Number.MAX_VALUE)) normal = false;
  }
  if (normal) return p;
  // The rare path lives in its own function so this one stays small enough to inline.
  return scaledProductSlow(factors, divisors);
}

// Without the Scaled class, so that a bundle of one typed formula does not carry
// it (bundle (a) of scripts/check-package.mjs): the same steps as Scaled's
// times, div and toNumber, one rounding per factor, the exponent summed exactly.
function scaledProductSlow(factors: readonly number[], divisors: readonly number[]): number {
  let negative = false;
  let m = 1; // in [1, 2), or 0 once a factor is zero
  let e = 0;
  for (const f of factors) {
    if (f < 0 || Object.is(f, -0)) negative = !negative;
    if (f === 0) m = 0;
    if (m === 0) continue;
    m *= mantissa(f); // [1, 4)
    e += frexpExponent;
    if (m >= 2) { m /= 2; e++; } // exact
  }
  for (const d of divisors) {
    if (d < 0 || Object.is(d, -0)) negative = !negative;
    if (d === 0) return Infinity; // callers' domains exclude it: out_of_range, never NaN
    if (m === 0) continue;
    m /= mantissa(d); // (1/2, 2)
    e -= frexpExponent;
    if (m < 1) { m *= 2; e--; } // exact
  }
  return compose(negative ? -1 : 1, m, e);
}

/**
 * (a * b * c) / d for finite a, b, c and nonzero finite d: `scaledProduct` of
 * three factors and one divisor, in a function small enough for the engine to
 * inline into the capacitance formulas' hot path (measured: several times
 * faster typed calls). The plain path serves positive operands whose every
 * step is a normal double; zeros, signed operands and extreme magnitudes take
 * the scaled path (correct, only slower). Within 2 ulp (one rounding per
 * operation); subnormal and out-of-range results as `scaledProduct`.
 */
export function mulDiv(a: number, b: number, c: number, d: number): number {
  const ab = a * b;
  const abc = ab * c;
  const r = abc / d;
  if (ab >= MIN_NORMAL && abc >= MIN_NORMAL && r >= MIN_NORMAL && r <= Number.MAX_VALUE) return r;
  return scaledProductSlow([a, b, c], [d]);
}

/**
 * x^y as a scaled value, for x > 0 and finite y. With x = u 2^k (u in
 * [sqrt(1/2), sqrt 2), k an integer), x^y = u^y 2^(k y): k y is formed exactly
 * as a sum of two doubles (Dekker's product), its integer part goes to the
 * exponent and its fraction r (|r| <= 1/2) to the mantissa as 2^r, so the
 * exponent carries no rounding at all. u^y and 2^r are single Math.pow calls
 * (within an ulp each): about 3 ulp in all for |y| <= 2000, where
 * |y log2 u| <= 1000 keeps u^y a normal double. Beyond (exponents no fitted
 * material has), u^(y / 2^j) is squared j times (see below), about 2^(j+1) ulp.
 *
 * Loop: at most 16 squarings, counted through countLoop.
 */
export function pow(x: number, y: number): Scaled {
  const s = Scaled.of(x);
  let u = s.m;
  let k = s.e;
  if (u > Math.SQRT2) {
    u /= 2; // exact
    k += 1;
  }
  const [p, pe] = twoProduct(k, y);
  const n = Math.round(p);
  const r = p - n + pe; // p - n is exact (|p - n| <= 1/2 and both near each other)
  if (!Number.isFinite(n) || Math.abs(n) > 2 ** 52) {
    // The power alone is beyond 2^(2^52): keep the exponent, drop the fraction (no double can hold it anyway).
    return Scaled.of(1, n);
  }
  // u^y directly while it is a normal double (always for |y| <= 2000, where |y log2 u| <= 1000).
  // Beyond, u^(y / 2^j) is squared j times in scaled form, with j chosen in closed form so that
  // |y log2 u| / 2^j <= 1000 (a normal double): each squaring doubles the relative error, so u^y is
  // within about 2^(j+1) ulp (j = 2 at |y| = 8000). Past j = 16 (|y log2 u| > 6.5e7) squaring no
  // longer beats the direct split u^y = 2^q, q = y log2(u), whose error is about |q| ulp: both have
  // lost more than 1e-10 by then, and the split needs no loop. So the loop runs at most 16 times.
  const t = Math.pow(u, y);
  if (t >= MIN_NORMAL && t <= Number.MAX_VALUE) return Scaled.of(t).times(Scaled.of(Math.pow(2, r), n));
  const q = y * Math.log2(u);
  const j = Math.max(1, Math.ceil(Math.log2(Math.abs(q) / 1000)));
  if (j > SQUARINGS) {
    const nq = Math.round(q);
    if (!Number.isFinite(nq) || Math.abs(nq) > 2 ** 52) return Scaled.of(1, nq + n);
    return Scaled.of(Math.pow(2, q - nq), nq).times(Scaled.of(Math.pow(2, r), n));
  }
  let power = Scaled.of(Math.pow(u, y * 2 ** -j)); // exact scaling of y; |q| / 2^j <= 1000: a normal double
  for (let i = 0; i < j; i++) power = power.times(power);
  countLoop(j);
  return power.times(Scaled.of(Math.pow(2, r), n));
}

/**
 * x * 2^k for finite x and an integer |k| <= 2200, in three steps of at most
 * 2^+-734 each so that no power of two overflows or underflows: exact unless
 * the result is subnormal (then one rounding, half a subnormal ulp) or beyond
 * the double range (then 0 or Infinity).
 */
export function ldexp(x: number, k: number): number {
  const a = Math.trunc(k / 3);
  const b = Math.trunc((k - a) / 2);
  return x * 2 ** a * 2 ** b * 2 ** (k - a - b);
}

/** The binary exponent of v != 0 (|v| = m 2^e, m in [1, 2)), subnormals included. Exact. */
export function exponentOf(v: number): number {
  return Scaled.of(v).e;
}

/**
 * a * b as an unevaluated sum p + err with p the rounded product, exactly
 * (Dekker's product with Veltkamp's split), for |a| <= 2^995 and any finite b
 * whose product with a neither overflows nor falls below 2^-969 (where err
 * itself would underflow).
 */
export function twoProduct(a: number, b: number): [number, number] {
  // Scale b into a range where the split cannot overflow; powers of two are exact.
  const big = Math.abs(b) > 2 ** 900;
  const bs = big ? b * 2 ** -200 : b;
  const p = a * bs;
  const [ah, al] = split27(a);
  const [bh, bl] = split27(bs);
  const err = ah * bh - p + ah * bl + al * bh + al * bl;
  return big ? [p * 2 ** 200, err * 2 ** 200] : [p, err];
}

function split27(a: number): [number, number] {
  const c = 134217729 * a; // 2^27 + 1
  const hi = c - (c - a);
  return [hi, a - hi];
}

// The mantissa of finite nonzero v, in [1, 2), with its binary exponent left in
// frexpExponent (a module variable, not a returned pair: no allocation). Exact:
// read from the bits, subnormals first scaled by 2^64 (a power of two).
let frexpExponent = 0;
function mantissa(v: number): number {
  let a = Math.abs(v);
  let offset = 0;
  if (a < MIN_NORMAL) {
    a *= TWO_POW_64;
    offset = -64;
  }
  bits.setFloat64(0, a);
  const hi = bits.getUint32(0);
  frexpExponent = ((hi >>> 20) & 0x7ff) - 1023 + offset;
  bits.setUint32(0, (hi & 0x000fffff) | 0x3ff00000);
  return bits.getFloat64(0);
}

// The double nearest sign * m * 2^e (Scaled.toNumber's contract, the range
// policy at the top of the file).
function compose(sign: number, m: number, e: number): number {
  if (m === 0) return sign * 0;
  if (!(e <= 1023)) return Infinity; // also a NaN exponent (two powers beyond 2^(2^52) of opposite signs)
  if (e >= -1022) return sign * m * pow2(e);
  if (e < -1074) return Infinity; // below the smallest subnormal: out_of_range
  // m 2^-1022 is a normal double (exact); the second product rounds once into the subnormals.
  return sign * m * pow2(-1022) * pow2(e + 1022);
}

// 2^e exactly, for -1022 <= e <= 1023.
function pow2(e: number): number {
  bits.setUint32(0, (e + 1023) << 20);
  bits.setUint32(4, 0);
  return bits.getFloat64(0);
}
