// c + a x b for 3-vectors, accurate component by component.
//
// A component of a x b is a difference of two products, a_j b_k - a_k b_j,
// and adding c_i can cancel further (a velocity filter: E + v x B = 0). Formed
// plainly, a component that nearly cancels keeps no correct digits, and the
// products overflow or underflow for extreme magnitudes. Here the vectors are
// first scaled by powers of two (exact), each product is split exactly into
// a sum hi + lo (Dekker's product with Veltkamp's split), and the five terms
// c_i + hi1 + lo1 - hi2 - lo2 are added by three passes of error-free
// transformations (Ogita, Rump and Oishi, "Accurate sum and dot product",
// SIAM J. Sci. Comput. 26 (2005), Algorithm 4.8, SumK with K = 3; from memory).
//
// Error bound (ORO 2005, Prop. 4.10, from memory): |result - exact| <=
// eps |exact| + 2 (3 eps)^3 sum |terms|, so a component is within about one ulp
// unless it cancels below 1e-45 of its largest term. Terms far below the
// largest one (by more than 2^-1000 after scaling) are lost to underflow,
// which stays below that bound relative to the largest term.

/** The value of component i is `mantissa[i] * 2^exponent`; mantissas are at most about 16. */
export interface Scaled3 {
  readonly mantissa: [number, number, number];
  readonly exponent: number;
}

const SPLIT = 134217729; // 2^27 + 1

/** Exponent e with x / 2^e in [1, 2) for x > 0 (log2 may round up at the top of a binade; then [0.5, 1)). */
function exponentOf(x: number): number {
  return Math.floor(Math.log2(x));
}

/** x * 2^k, exact whenever the result is normal, for any integer k in [-2200, 2200]. */
export function timesPow2(x: number, k: number): number {
  // Three steps of at most 2^±734 each: every power is representable.
  const k1 = Math.trunc(k / 3);
  const k2 = Math.trunc((k - k1) / 2);
  const k3 = k - k1 - k2;
  return x * 2 ** k1 * 2 ** k2 * 2 ** k3;
}

function maxAbs(v: readonly number[]): number {
  return Math.max(Math.abs(v[0]!), Math.abs(v[1]!), Math.abs(v[2]!));
}

// Error-free sum: a + b = s + e exactly (Knuth's TwoSum).
function twoSum(a: number, b: number, out: number[], i: number): number {
  const s = a + b;
  const z = s - a;
  out[i] = a - (s - z) + (b - z);
  return s;
}

/** Sum of the terms, SumK with K = 3 (three error-free passes, then a plain sum). Loops: 3 passes of n - 1 steps. */
function accurateSum(t: number[]): number {
  const n = t.length;
  for (let pass = 0; pass < 2; pass++) {
    // VecSum: after it, t[n-1] is the float sum and t[0..n-2] the exact errors.
    for (let i = 1; i < n; i++) t[i] = twoSum(t[i - 1]!, t[i]!, t, i - 1);
  }
  let s = 0;
  for (let i = 0; i < n - 1; i++) s += t[i]!;
  return t[n - 1]! + s;
}

/** a b = hi + lo exactly, for |a|, |b| < 2^996 with no underflow in lo. */
function twoProduct(a: number, b: number, out: number[], i: number): void {
  const p = a * b;
  const ca = SPLIT * a;
  const ahi = ca - (ca - a);
  const alo = a - ahi;
  const cb = SPLIT * b;
  const bhi = cb - (cb - b);
  const blo = b - bhi;
  out[i] = p;
  out[i + 1] = alo * blo - (p - ahi * bhi - alo * bhi - ahi * blo);
}

/**
 * c + a x b (c optional: zero), component by component, as scaled mantissas
 * and one exponent. Every input component is finite.
 */
export function crossPlus(a: readonly number[], b: readonly number[], c?: readonly number[]): Scaled3 {
  const ma = maxAbs(a);
  const mb = maxAbs(b);
  const mc = c ? maxAbs(c) : 0;
  if (ma === 0 || mb === 0) {
    // No cross part: c itself (or zero), scaled to its own exponent.
    if (mc === 0) return { mantissa: [0, 0, 0], exponent: 0 };
    const ec = exponentOf(mc);
    return { mantissa: [timesPow2(c![0]!, -ec), timesPow2(c![1]!, -ec), timesPow2(c![2]!, -ec)], exponent: ec };
  }
  const ea = exponentOf(ma);
  const eb = exponentOf(mb);
  const as = [timesPow2(a[0]!, -ea), timesPow2(a[1]!, -ea), timesPow2(a[2]!, -ea)];
  const bs = [timesPow2(b[0]!, -eb), timesPow2(b[1]!, -eb), timesPow2(b[2]!, -eb)];
  // Common exponent: the larger of the cross part's (ea + eb) and c's.
  const eab = ea + eb;
  const ec = mc > 0 ? exponentOf(mc) : eab;
  const e = Math.max(eab, ec);
  const shift = eab - e; // <= 0: the cross terms' scale relative to the common one
  const t = [0, 0, 0, 0, 0];
  const out: [number, number, number] = [0, 0, 0];
  for (let i = 0; i < 3; i++) {
    const j = (i + 1) % 3;
    const k = (i + 2) % 3;
    twoProduct(as[j]!, bs[k]!, t, 0);
    twoProduct(-as[k]!, bs[j]!, t, 2);
    // Cross terms scaled to the common exponent (exact unless they fall below 2^-1000 of it).
    for (let m = 0; m < 4; m++) t[m] = timesPow2(t[m]!, shift);
    t[4] = c ? timesPow2(c[i]!, -e) : 0;
    out[i] = accurateSum(t);
  }
  return { mantissa: out, exponent: e };
}

/**
 * The components factor * mantissa[i] * 2^exponent as doubles, for a vector
 * result: each normal component within one more rounding of the mantissa; a
 * component below the normal range comes back subnormal (or zero below the
 * smallest subnormal, an absolute error under 2^-1074), so one tiny component
 * does not refuse the whole vector. Infinity (out_of_range) when a component
 * overflows, or when every component of a non-zero exact result underflows to
 * zero (nothing representable is left).
 */
export function scaledVector(factor: number, s: Scaled3): [number, number, number] {
  const out: [number, number, number] = [0, 0, 0];
  if (factor === 0) return out;
  const ef = exponentOf(Math.abs(factor));
  const f = timesPow2(factor, -ef); // in [1, 2) in magnitude: exact
  let nonzero = false;
  let allZero = true;
  for (let i = 0; i < 3; i++) {
    const m = s.mantissa[i]!;
    if (m === 0) continue;
    nonzero = true;
    const v = timesPow2(f * m, ef + s.exponent);
    if (v !== 0) allZero = false;
    out[i] = v;
  }
  if (nonzero && allZero) return [Infinity, Infinity, Infinity];
  return out;
}
