import { MU0 } from "../constants/si.js";
import { ellipticByComplement, ellipticD, ellipticEMinusOne } from "../math/elliptic.js";

// ---- scaled arithmetic for extreme magnitudes ----
//
// Every inductance here is a constant times a few lengths (and turns) times a
// dimensionless shape factor. With lengths anywhere from 1e-300 m to 1e300 m,
// squares and products overflow or underflow in an intermediate step although
// the result is representable. Each formula takes a plain fast path when all
// its magnitudes lie inside SAFE (no product of up to six of them can leave
// the normal range), and otherwise multiplies mantissas and binary exponents
// apart (`Scaled`), rounding once per operation.

/** Inputs in [1/SAFE, SAFE] take the plain path: six factors stay within 1e+-300. */
const SAFE = 1e45;
const MIN_NORMAL = 2.2250738585072014e-308;
const TWO_POW_64 = 18446744073709551616;
const bits = new DataView(new ArrayBuffer(8));

/** True when v (> 0) is a moderate magnitude, safe for the plain path. */
export function moderate(v: number): boolean {
  return v < SAFE && v > 1 / SAFE;
}

/**
 * A positive number as m 2^e with m in [1, 2) and an unbounded integer e: the
 * slow path's representation, never overflowing or underflowing. Each product
 * or quotient of mantissas rounds once (relative error at most 2^-53).
 */
export class Scaled {
  private constructor(
    readonly m: number,
    readonly e: number,
  ) {}

  /** v > 0 finite (subnormals exact), or 0 (which stays 0). */
  static of(v: number, e = 0): Scaled {
    if (v === 0) return new Scaled(0, 0);
    let offset = e;
    if (v < MIN_NORMAL) {
      v *= TWO_POW_64; // exact: a power of two
      offset -= 64;
    }
    bits.setFloat64(0, v);
    const hi = bits.getUint32(0);
    const ev = ((hi >>> 20) & 0x7ff) - 1023;
    bits.setUint32(0, (hi & 0x800fffff) | 0x3ff00000);
    return new Scaled(bits.getFloat64(0), ev + offset);
  }

  times(v: number | Scaled): Scaled {
    const s = typeof v === "number" ? Scaled.of(v) : v;
    if (this.m === 0 || s.m === 0) return Scaled.of(0);
    return Scaled.of(this.m * s.m, this.e + s.e); // the product of mantissas is in [1, 4)
  }

  div(v: number | Scaled): Scaled {
    const s = typeof v === "number" ? Scaled.of(v) : v;
    if (this.m === 0) return this;
    return Scaled.of(this.m / s.m, this.e - s.e); // in (1/2, 2)
  }

  /** Square root: sqrt(m) 2^(e/2) for even e, sqrt(2m) 2^((e-1)/2) for odd e (one rounding). */
  sqrt(): Scaled {
    if (this.m === 0) return this;
    const odd = this.e & 1; // 0 or 1 (two's complement: also for negative e)
    return Scaled.of(Math.sqrt(this.m * (odd ? 2 : 1)), (this.e - odd) / 2);
  }

  /** Sum of two non-negative scaled numbers: the smaller is shifted to the larger's exponent. */
  plus(v: Scaled): Scaled {
    if (v.m === 0) return this;
    if (this.m === 0) return v;
    const [big, small] = this.e >= v.e ? [this, v] : [v, this];
    const shift = small.e - big.e; // <= 0; below -60 the smaller term is under half an ulp
    return Scaled.of(big.m + (shift < -60 ? 0 : small.m * 2 ** shift), big.e);
  }

  /** ln of the value; exact construction when it is a normal double (no cancellation of ln m against e ln 2). */
  log(): number {
    if (this.e >= -1022 && this.e <= 1023) return Math.log(this.m * 2 ** this.e);
    return Math.log(this.m) + this.e * Math.LN2; // |e| > 1022: the terms cannot cancel
  }

  /**
   * The value as a double: Infinity above the largest double and below the
   * smallest normal one (a subnormal would keep only part of its digits), which
   * the formula reports as `out_of_range`; exact 0 stays 0.
   */
  toNumber(): number {
    if (this.m === 0) return 0;
    if (this.e > 1023 || this.e < -1022) return Infinity;
    return this.m * 2 ** this.e; // exact: m has 53 bits and the scale is a power of two
  }
}

/** The product of positive finite factors, scaled (see `Scaled.toNumber` for the out-of-range rule). */
export function scaledProduct(...factors: number[]): number {
  let p = Scaled.of(1);
  for (const f of factors) p = p.times(f); // bounded by the argument count
  return p.toNumber();
}

/**
 * ln(b / a) for positive finite a, b, to a few ulp. Near one (a/2 <= b <= 2a)
 * b - a is exact (Sterbenz lemma, subnormals too) and log1p keeps the digits
 * that rounding b/a to a double near 1 would lose; elsewhere ln of the
 * quotient has no cancellation, and where the quotient leaves the double
 * range, ln b - ln a (then the difference exceeds 700 in size).
 */
export function logRatio(b: number, a: number): number {
  if (b <= 2 * a && a <= 2 * b) return Math.log1p((b - a) / a);
  const r = b / a;
  return r <= Number.MAX_VALUE && r >= MIN_NORMAL ? Math.log(r) : Math.log(b) - Math.log(a);
}

/**
 * acosh(u / v) for 0 < v < u, to a few ulp. Near one (u <= 2v),
 * acosh(1 + s) = log1p(s + sqrt(s (2 + s))) with s = (u - v)/v from the exact
 * difference, so touching geometry keeps its digits. Above,
 * acosh(w) = ln w + ln(1 + sqrt(1 - 1/w^2)): two positive terms and no w^2 to overflow.
 */
export function acoshRatio(u: number, v: number): number {
  if (u <= 2 * v) {
    const s = (u - v) / v;
    return Math.log1p(s + Math.sqrt(s * (2 + s)));
  }
  const w = v / u; // in (0, 1/2]; it may underflow to 0 only where the term is ln 2 to the last digit
  return logRatio(u, v) + Math.log(1 + Math.sqrt((1 - w) * (1 + w)));
}

/** a / b for positive a, b, held at the largest double where it would overflow: for notes' measures. */
export function ratio(a: number, b: number): number {
  return Math.min(a / b, Number.MAX_VALUE);
}

/** x 2^k for |k| <= 1100, in two steps so that neither power of two overflows (exact unless the result underflows). */
export function ldexp(x: number, k: number): number {
  const half = k >> 1;
  return x * 2 ** half * 2 ** (k - half);
}

/** The binary exponent of v > 0 (v = m 2^e, m in [1, 2)), subnormals included. */
export function exponentOf(v: number): number {
  return Scaled.of(v).e;
}

/**
 * Nagaoka's coefficient K_N for a cylindrical current sheet of radius r and
 * length l, from k^2 = 4r^2/(4r^2 + l^2), k'^2 = l^2/(4r^2 + l^2):
 *   K_N = 4 / (3 pi k') [ (k'^2/k^2) (K - E) + E - k ]        (Nagaoka 1909)
 *       = 4 / (3 pi k') [ k'^2 D(m) + (E - 1) + k'^2/(1 + k) ],
 * since 1 - k = k'^2/(1 + k) and (K - E)/k^2 = D. In the textbook form E - k
 * cancels for short coils (k -> 1: both ~ 1, difference ~ k'^2 ln(4/k')); here
 * every term is positive (E - 1 from its series near m = 1), so no digits are
 * lost at either end. k and k' come from hypot of the geometry, not 1 - k^2.
 * A plain double that may underflow for the flattest coils (for notes and
 * ratios); `nagaokaScaled` is the form for results.
 */
export function nagaoka(radius: number, length: number): number {
  if (length / radius < PANCAKE) return (length / radius) * ((logRatio(radius, length) + LN8_MINUS_HALF) / Math.PI); // may underflow: for notes
  return nagaokaShape(radius, length);
}

/** Below this length/radius (k' < 1e-9) the pancake expansion is used. */
const PANCAKE = 2e-9;
/** 3 ln 2 - 1/2 = ln 8 - 1/2, to the last digit. */
const LN8_MINUS_HALF = 1.5794415416798359;

/**
 * Pancake limit: K_N = (2/pi) k' (ln(4/k') - 1/2) (1 + O(k'^2 ln k')), from the
 * expansions DLMF 19.12.1-2; below k' = 1e-9 the neglected part is < 1e-16.
 * With k' = l/(2r) (1 + O(k'^2)) this is (l/(pi r)) (ln(8r/l) - 1/2), formed
 * scaled so that a representable coefficient of a very flat coil is not lost.
 */
function pancake(radius: number, length: number): Scaled {
  return Scaled.of(length)
    .times((logRatio(radius, length) + LN8_MINUS_HALF) / Math.PI)
    .div(radius);
}

/** Nagaoka's coefficient as a scaled number: `out_of_range` rather than a subnormal for the flattest coils. */
export function nagaokaScaled(radius: number, length: number): Scaled {
  return length / radius < PANCAKE ? pancake(radius, length) : Scaled.of(nagaokaShape(radius, length));
}

/**
 * pi r K_N / l for l < r (a short coil): ln(8r/l) - 1/2 in the pancake limit
 * (the 1/(pi r) of the expansion cancels), so it never overflows or underflows.
 */
export function shortCoilFactor(radius: number, length: number): number {
  if (length / radius < PANCAKE) return logRatio(radius, length) + LN8_MINUS_HALF;
  return Math.PI * (radius / length) * nagaokaShape(radius, length);
}

// The general branch, for l >= 2e-9 r. Outside moderate magnitudes both
// lengths are first scaled by the power of two that brings l into [1, 2)
// (exact), so 2r and the hypot neither overflow nor underflow; r may underflow only when r/l < 2^-1022, where K = 1
// to the last digit.
function nagaokaShape(radius: number, length: number): number {
  let r = radius;
  let l = length;
  if (!(moderate(r) && moderate(l))) {
    const s = -exponentOf(length);
    r = ldexp(radius, s);
    l = ldexp(length, s);
  }
  const h = Math.hypot(2 * r, l);
  const k = (2 * r) / h;
  const kc = l / h;
  const m = k * k;
  const mc = kc * kc;
  const bracket = mc * ellipticD(m, mc) + ellipticEMinusOne(m, mc) + mc / (1 + k);
  return (4 * bracket) / (3 * Math.PI * kc);
}

/** Scratch for ellipticByComplement's [K, E, D, E - 1]. */
const ELLIPTIC = /* @__PURE__ */ new Float64Array(4);

/**
 * Mutual inductance of two coaxial circular filaments, radii a and b, axial
 * distance d (Maxwell), in Landen's form M = 2 mu0 sqrt(ab) k1^(3/2) D(k1^2), with
 * r1 = hypot(a - b, d), r2 = hypot(a + b, d) and k1 = 4ab/(r1 + r2)^2: the
 * textbook form subtracts two nearly equal terms when the loops are far apart
 * (M ~ 1/d^3); this one has no subtraction. Evaluated for any magnitudes. Half-lengths keep r1 + r2 finite for
 * radii near the largest double; k1 = (a/h)(b/h) with h = (r1 + r2)/2 <= 2 max.
 * The complement of k1^2 is k1'^2 = (1 - k1)(1 + k1) with 1 - k1 = r1/h: for
 * circles 1e-321 m apart with 1 km radii r1/h underflows, so ln(1/k1') is then
 * taken from logarithms of r1 and h, which is all D's logarithmic form needs
 * (D ~ ln(4/k1') - 1, DLMF 19.12). M ~ mu0 a (ln(8a/d) - 2) there, 0.94 H.
 */
export function maxwellMutual(a: number, b: number, d: number): number {
  const r1 = Math.hypot(a - b, d);
  const h = 0.5 * r1 + Math.hypot(0.5 * a + 0.5 * b, 0.5 * d);
  const k1 = (a / h) * (b / h);
  const t = r1 / h; // 1 - k1 without cancellation
  const kc1 = Math.sqrt(t) * Math.sqrt(1 + k1);
  // Below 2^-1000 t has lost bits (or is 0): take the logarithm from r1 and h instead.
  const lnInvKc = t < 2 ** -1000 ? 0.5 * (Math.log(h) - Math.log(r1) - Math.log1p(k1)) : undefined;
  ellipticByComplement(kc1, ELLIPTIC, lnInvKc);
  // (sqrt(a) sqrt(b) k1) first: when k1^(3/2) alone would underflow, this product has not yet.
  return 2 * MU0 * (Math.sqrt(a) * Math.sqrt(b) * k1) * Math.sqrt(k1) * ELLIPTIC[2]!;
}
