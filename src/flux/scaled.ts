// Scaled arithmetic for the flux family: products, quotients, sums and powers
// of doubles whose intermediate steps would overflow or underflow although the
// result is a representable double (1e-200 T times 1e200 m^2, f^alpha beyond
// 1e308 times k = 1e-100). Each formula computes its plain expression first
// when every factor is "tame" (see `tame`) and comes here otherwise, so the
// common case pays a few comparisons and nothing else.
//
// A positive value is held as m * 2^e with m in [1, 2) and e an integer that
// may lie far outside the double exponent range. Multiplying or dividing two
// such values rounds once (the mantissa product); the exponent sum is exact.
// `toNumber` rounds once more into a double: a result below the smallest
// normal double comes back as a subnormal within one of its ulps (the policy
// of this family: subnormal results are returned, not refused); one beyond the
// largest double or below the smallest subnormal (2^-1074) comes back as
// Infinity, which the formula reports as `out_of_range`.

import { countLoop } from "../math/loop-count.js";

const MIN_NORMAL = 2.2250738585072014e-308;
/** Most squarings pow uses to bring a power back into range (see pow). */
const SQUARINGS = 16;
const TWO_POW_64 = 18446744073709551616;
const bits = /* @__PURE__ */ new DataView(new ArrayBuffer(8));

/** A positive value m * 2^e, m in [1, 2), e an integer. */
export interface Scaled {
  readonly m: number;
  readonly e: number;
}

// Plain evaluation is safe when every factor lies within 2^-150..2^150 (or is 0):
// then a product or quotient of up to six of them, times constants of this family
// (mu0 ~ 2^-20, eps0 ~ 2^-37), stays within 2^-960..2^960, a normal double at every
// step, so each step rounds once and nothing overflows or underflows.
const TAME_LOW = 2 ** -150;
const TAME_HIGH = 2 ** 150;

/** True when |v| is 0 or within 2^-150..2^150 (see above). */
export function tame(v: number): boolean {
  const a = Math.abs(v);
  return a === 0 || (a >= TAME_LOW && a <= TAME_HIGH);
}

/** v = m * 2^e with m in [1, 2), for positive finite v (subnormals included). */
export function scaled(v: number): Scaled {
  let offset = 0;
  if (v < MIN_NORMAL) {
    v *= TWO_POW_64; // exact: a power of two
    offset = -64;
  }
  bits.setFloat64(0, v);
  const hi = bits.getUint32(0);
  const e = ((hi >>> 20) & 0x7ff) - 1023;
  bits.setUint32(0, (hi & 0x800fffff) | 0x3ff00000);
  return { m: bits.getFloat64(0), e: e + offset };
}

// m * 2^e renormalised, for positive finite m (a mantissa product or sum).
function norm(m: number, e: number): Scaled {
  const s = scaled(m);
  return { m: s.m, e: e + s.e };
}

export function mul(a: Scaled, b: Scaled): Scaled {
  return norm(a.m * b.m, a.e + b.e);
}

export function div(a: Scaled, b: Scaled): Scaled {
  return norm(a.m / b.m, a.e - b.e);
}

/** a + b for positive a, b: the smaller is shifted onto the larger's exponent; one rounding. */
export function add(a: Scaled, b: Scaled): Scaled {
  const [big, small] = a.e >= b.e ? [a, b] : [b, a];
  const shift = small.e - big.e; // <= 0
  // Below 2^-60 the smaller addend is under half an ulp of the larger: it cannot change the sum.
  return shift < -60 ? big : norm(big.m + small.m * pow2(shift), big.e);
}

/** sqrt(a): the exponent made even first, then one correctly rounded sqrt. */
export function sqrt(a: Scaled): Scaled {
  const odd = a.e & 1; // 0 or 1, also for negative e (two's complement)
  return norm(Math.sqrt(odd ? 2 * a.m : a.m), (a.e - odd) / 2);
}

/**
 * x^y for x > 0 and finite y. With x = u 2^k (u in [sqrt(1/2), sqrt 2), k an
 * integer), x^y = u^y 2^(k y): k y is formed exactly as a sum of two doubles
 * (Dekker's product), its integer part goes to the exponent and its fraction r
 * (|r| <= 1/2) to the mantissa as 2^r, so the exponent carries no rounding at
 * all. u^y and 2^r are single Math.pow calls (correctly rounded to within an
 * ulp): about 2 ulp in all for |y| <= 2000, where |y log2 u| <= 1000 keeps u^y a
 * normal double. Beyond (exponents no fitted material has), see the squaring below.
 */
export function pow(x: number, y: number): Scaled {
  let { m: u, e: k } = scaled(x);
  if (u > Math.SQRT2) {
    u /= 2; // exact
    k += 1;
  }
  const [p, pe] = twoProduct(k, y);
  const n = Math.round(p);
  const r = p - n + pe; // p - n is exact (|p - n| <= 1/2 and both near each other)
  if (!Number.isFinite(n) || Math.abs(n) > 2 ** 52) {
    // The power alone is beyond 2^(2^52): keep the exponent, drop the fraction (no double can hold it anyway).
    return { m: 1, e: n };
  }
  // u^y directly while it is a normal double (always for |y| <= 2000, where |y log2 u| <= 1000).
  // Beyond, u^(y / 2^j) is squared j times in scaled form, with j chosen in closed form so that
  // |y log2 u| / 2^j <= 1000 (a normal double): each squaring doubles the relative error, so u^y is
  // within about 2^(j+1) ulp (j = 2 at |y| = 8000). Past j = 16 (|y log2 u| > 6.5e7) squaring no
  // longer beats the direct split u^y = 2^q, q = y log2(u), whose error is about |q| ulp: both have
  // lost more than 1e-10 by then, and the split needs no loop. So the loop runs at most 16 times.
  const t = Math.pow(u, y);
  if (t >= MIN_NORMAL && t <= Number.MAX_VALUE) return mul(norm(t, 0), norm(Math.pow(2, r), n));
  const q = y * Math.log2(u);
  const j = Math.max(1, Math.ceil(Math.log2(Math.abs(q) / 1000)));
  if (j > SQUARINGS) {
    const nq = Math.round(q);
    if (!Number.isFinite(nq) || Math.abs(nq) > 2 ** 52) return { m: 1, e: nq + n };
    return mul(norm(Math.pow(2, q - nq), nq), norm(Math.pow(2, r), n));
  }
  let power = norm(Math.pow(u, y * 2 ** -j), 0); // exact scaling of y; |q| / 2^j <= 1000: a normal double
  for (let i = 0; i < j; i++) power = mul(power, power);
  countLoop(j);
  return mul(power, norm(Math.pow(2, r), n));
}

/** The double nearest m 2^e (times sign), a subnormal below 2^-1022; Infinity when not representable. */
export function toNumber(a: Scaled, sign = 1): number {
  if (!(a.e <= 1023)) return Infinity; // also a NaN exponent (two powers beyond 2^(2^52) of opposite signs)
  if (a.e >= -1022) return sign * a.m * pow2(a.e);
  if (a.e < -1074) return Infinity; // below the smallest subnormal: out_of_range
  // m 2^-1022 is a normal double (exact); the second product rounds once into the subnormals.
  return sign * a.m * pow2(-1022) * pow2(a.e + 1022);
}

/**
 * (product of factors) / (product of divisors), signs kept, with no intermediate
 * overflow or underflow: one rounding per factor and divisor, then one into the
 * result (n/2 + 1 ulp for n factors and divisors). Divisors must be nonzero.
 * A zero factor gives a zero of the product's sign.
 */
export function quotient(factors: readonly number[], divisors: readonly number[] = []): number {
  let sign = 1;
  let acc: Scaled = { m: 1, e: 0 };
  for (const f of factors) {
    if (f < 0) sign = -sign;
    if (f === 0) return sign * 0;
    acc = mul(acc, scaled(Math.abs(f)));
  }
  for (const d of divisors) {
    if (d < 0) sign = -sign;
    acc = div(acc, scaled(Math.abs(d)));
  }
  return toNumber(acc, sign);
}

/** a * b = p + e exactly (Dekker's product with Veltkamp's split); |a| <= 2^11 here. */
function twoProduct(a: number, b: number): [number, number] {
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

// 2^e exactly, for -1022 <= e <= 1023; smaller e (only from `add`, shift >= -60) handled by the caller's range.
function pow2(e: number): number {
  bits.setUint32(0, (e + 1023) << 20);
  bits.setUint32(4, 0);
  return bits.getFloat64(0);
}

/** The product of positive finite values as mantissa and exponent (one rounding per value). */
export function product(...values: number[]): Scaled {
  let acc: Scaled = { m: 1, e: 0 };
  for (const v of values) acc = mul(acc, scaled(v));
  return acc;
}
