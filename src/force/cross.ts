// c + a x b for 3-vectors, accurate component by component.
//
// A component of a x b is a difference of two products, a_j b_k - a_k b_j,
// and adding c_i can cancel further (a velocity filter: E + v x B = 0). Formed
// plainly, a component that nearly cancels keeps no correct digits, and the
// products overflow or underflow for extreme magnitudes. Here each factor is
// first scaled by its own power of two (exact), each product is split exactly
// into a sum hi + lo (Dekker's product with Veltkamp's split), and the five terms
// c_i + hi1 + lo1 - hi2 - lo2 are added by three passes of error-free
// transformations (Ogita, Rump and Oishi, "Accurate sum and dot product",
// SIAM J. Sci. Comput. 26 (2005), Algorithm 4.8, SumK with K = 3; from memory).
//
// Error bound (ORO 2005, Prop. 4.10, from memory): |result - exact| <=
// eps |exact| + 2 (3 eps)^3 sum |terms|, so a component is within about one ulp
// unless it cancels below 1e-45 of its largest term. Terms far below the
// largest one of their component (by 2^-1000 and more) are lost to underflow,
// which stays below that bound relative to the largest term.

// exponentOf (exact, from the bits) and ldexp (x 2^k in three exact steps) are the library's scaled-arithmetic helpers.
import { exponentOf, ldexp as timesPow2 } from "../math/scaled.js";

/** The value of component i is `mantissa[i] * 2^exponent[i]`; mantissas are at most about 16. */
export interface Scaled3 {
  readonly mantissa: [number, number, number];
  readonly exponent: [number, number, number];
}

const SPLIT = 134217729; // 2^27 + 1

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
 * and exponents. Every input component is finite. Each factor is scaled by its
 * own power of two (exact), so every product a_j b_k is split exactly (its low
 * part cannot underflow), whatever the magnitudes; the terms of a component
 * are then brought to the exponent of its largest term.
 */
export function crossPlus(a: readonly number[], b: readonly number[], c?: readonly number[]): Scaled3 {
  const mantissa: [number, number, number] = [0, 0, 0];
  const exponent: [number, number, number] = [0, 0, 0];
  const t = [0, 0, 0, 0, 0];
  const e = [0, 0, 0, 0, 0]; // exponent of each term
  for (let i = 0; i < 3; i++) {
    const j = (i + 1) % 3;
    const k = (i + 2) % 3;
    product(a[j]!, b[k]!, t, e, 0);
    product(-a[k]!, b[j]!, t, e, 2);
    const ci = c ? c[i]! : 0;
    if (ci === 0) {
      t[4] = 0;
      e[4] = -Infinity;
    } else {
      e[4] = exponentOf(Math.abs(ci));
      t[4] = timesPow2(ci, -e[4]);
    }
    const top = Math.max(e[0]!, e[2]!, e[4]!);
    if (top === -Infinity) continue; // every term zero
    // Terms far below the largest (2^-1000 and less) underflow here: below the stated bound.
    for (let m = 0; m < 5; m++) t[m] = t[m] === 0 ? 0 : timesPow2(t[m]!, e[m]! - top);
    mantissa[i] = accurateSum(t);
    exponent[i] = top;
  }
  return { mantissa, exponent };
}

/** x y = (t[i] + t[i+1]) 2^e[i] exactly, each factor scaled to [1, 2) first; zero terms get exponent -Infinity. */
function product(x: number, y: number, t: number[], e: number[], i: number): void {
  if (x === 0 || y === 0) {
    t[i] = 0;
    t[i + 1] = 0;
    e[i] = -Infinity;
    e[i + 1] = -Infinity;
    return;
  }
  const ex = exponentOf(Math.abs(x));
  const ey = exponentOf(Math.abs(y));
  twoProduct(timesPow2(x, -ex), timesPow2(y, -ey), t, i);
  e[i] = ex + ey;
  e[i + 1] = ex + ey;
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
    const v = timesPow2(f * m, ef + s.exponent[i]!);
    if (v !== 0) allZero = false;
    out[i] = v;
  }
  if (nonzero && allZero) return [Infinity, Infinity, Infinity];
  return out;
}
