/**
 * Complete elliptic integrals of the first and second kind, K(m) and E(m),
 * with parameter m = k^2, through Carlson's symmetric integrals R_F and R_D,
 * and through the logarithmic expansions in the complementary modulus near m = 1.
 *
 * Method: Carlson's duplication algorithm with the fifth-order Taylor
 * correction, B. C. Carlson, "Numerical computation of real or complex
 * elliptic integrals", Numerical Algorithms 10 (1995) 13-26; also DLMF
 * sections 19.25(i) (K, E in terms of R_F, R_D) and 19.36(i) (the algorithm).
 * For mc = 1 - m below 2^-24 the expansions of DLMF 19.12.1 and 19.12.2 in
 * k' = sqrt(mc) and ln(4/k') are used instead, to three terms (the first term
 * left out is below 1e-22 relative); they need only ln(1/k'), so they stay exact
 * when mc = k'^2 underflows (a point 1e-200 m from a 1 m loop).
 * Measured against a decimal.js oracle (tests/math/elliptic.test.ts): a few ulp
 * over the whole range, mc from the smallest subnormal to 1.
 *
 * Each function takes the complementary parameter mc = 1 - m as an optional
 * second argument. Near m = 1 (touching loops, thin wires) pass mc computed
 * directly from the geometry: 1 - m formed in floating point loses digits.
 * Where even mc underflows, pass the complementary modulus k' itself to
 * ellipticByComplement (and ln(1/k') when k' underflows too).
 */
import { countLoop } from "./loop-count.js";
import { ldexp } from "./scaled.js";

const TOL_F = Math.pow(3 * Number.EPSILON, -1 / 6);
const TOL_D = Math.pow(Number.EPSILON / 4, -1 / 6);

/**
 * Most duplication steps either R_F or R_D can take (proof at `duplicationBound`
 * below); the loops' cap adds a margin of three.
 */
export const DUPLICATION_BOUND = 12;
const DUPLICATION_CAP = DUPLICATION_BOUND + 3;

/**
 * Below this ratio of the middle to the largest argument R_F and R_D are taken
 * from their logarithmic asymptotes: the neglected part is O(ratio ln(1/ratio)),
 * under 1e-31 relative, and the duplication would otherwise work on arguments
 * that underflow once scaled.
 */
const ASYMPTOTIC_RATIO = 2 ** -110;

/** Below this ratio of z to the smaller of x, y, R_D is 3 / sqrt(x y z) to 2^-60. */
const SINGULAR_RATIO = 2 ** -120;

/** Below this mc the series of DLMF 19.12 replace Carlson's integrals. */
export const LOG_FORM_LIMIT = 2 ** -24;

const LN4 = 2 * Math.LN2;

/** j with 4^-j x near 1 for finite x > 0 (Math.log2 may be off by one next to a power of two: harmless). */
function halfExponent(x: number): number {
  return Math.floor(Math.log2(x) / 2);
}

/*
 * duplicationBound: why neither loop runs more than 12 steps.
 * The count does not depend on the scale (the stop test compares A_n with the
 * spread, both scaled alike), so take the largest argument M_0 = 1; the
 * asymptotic branch has taken every case where the middle one is below 2^-110 M_0.
 * (Arguments beyond 2^+-500 are scaled by an exact power of 4 first, which keeps
 * every sum and product of the loop finite and the middle argument normal.) Write m_n <= M_n for the least and greatest of the three
 * after n steps and r_n = m_n / M_n. One step maps each argument to (t + lam)/4
 * with lam = sqrt(xy) + sqrt(xz) + sqrt(yz), so
 *   - differences shrink exactly by 4: x_n - y_n = 4^-n (x_0 - y_0);
 *   - lam >= m + 2 sqrt(m M), lam <= M + 2 sqrt(m M), hence r_{n+1} >= sqrt(r_n),
 *     m_n never decreases and M_n never increases;
 *   - lam_0 >= sqrt(mid_0 M_0) >= 2^-55 M_0, so every argument after one step is
 *     at least 2^-57 M_0 while M_1 <= M_0: r_1 >= 2^-57, r_n >= 2^(-57 / 2^(n-1)), r_7 > 0.5;
 *   - M_{n+1} >= (M_n + 3 m_n)/4 and M_1 >= M_0 / 4, so
 *     M_7 >= 4^-7 M_0 (1 + 3 r_3)(1 + 3 r_4)(1 + 3 r_5)(1 + 3 r_6) > 1.4e-4 M_0,
 *     and m_n >= m_7 > 7e-5 M_0 for n >= 7.
 * The loop stops once TOL max|A_0 - x_j| 4^-n < A_n, and A_n >= m_n, while
 * max|A_0 - x_j| <= M_0. So it stops by the first n >= 7 with 4^n > TOL / 7e-5:
 * TOL_F = 337 needs 4^n > 4.8e6, TOL_D = 512 needs 4^n > 7.3e6; 4^12 = 1.7e7, so n <= 12
 * for both. The cap (15) only guards against a flaw in this argument.
 * Measured (tests/math/elliptic.test.ts, tests/reliability/termination.test.ts): at most 10.
 */

/**
 * Carlson's R_F(x, y, z) for x, y, z >= 0, at most one of them zero (DLMF 19.16.1).
 * Infinity when two are zero; 0 when one is infinite. Any magnitudes: R_F is
 * homogeneous of degree -1/2, so the arguments are scaled by a power of two
 * (exactly) before the duplication and the result scaled back.
 */
export function carlsonRF(x: number, y: number, z: number): number {
  // Sort: lo <= mid <= hi.
  let lo = x;
  let mid = y;
  let hi = z;
  if (lo > mid) [lo, mid] = [mid, lo];
  if (mid > hi) [mid, hi] = [hi, mid];
  if (lo > mid) [lo, mid] = [mid, lo];
  if (!(lo >= 0)) return NaN; // negative or NaN: outside the domain (callers never pass it)
  if (hi === Infinity) return 0;
  if (mid === 0) return Infinity;
  if (mid / hi < ASYMPTOTIC_RATIO) {
    // R_F = z^-1/2 [ln(4 sqrt(z) / (sqrt(x) + sqrt(y))) + O((y/z) ln)], x <= y << z: Carlson's
    // logarithmic asymptote (cf. DLMF 19.27(ii), from memory); x = 0 gives K ~ ln(4/k') of
    // DLMF 19.12.1, x = y gives R_C's acosh. Checked against the duplication theorem at 50
    // digits in tests/math/elliptic.test.ts.
    return logRatio(hi, lo, mid) / Math.sqrt(hi);
  }
  // Scale by 4^-j (exact) when the largest argument is beyond 2^+-500, where the
  // products and sums below could overflow or the sum term underflow.
  const j = hi > 2 ** 500 || hi < 2 ** -500 ? halfExponent(hi) : 0;
  const x0 = j === 0 ? x : ldexp(x, -2 * j);
  const y0 = j === 0 ? y : ldexp(y, -2 * j);
  const z0 = j === 0 ? z : ldexp(z, -2 * j);
  const a0 = (x0 + y0 + z0) / 3;
  const q = TOL_F * Math.max(Math.abs(a0 - x0), Math.abs(a0 - y0), Math.abs(a0 - z0));
  let xt = x0;
  let yt = y0;
  let zt = z0;
  let a = a0;
  let f = 1; // 4^-n
  let n = 0;
  for (; n < DUPLICATION_CAP && q * f >= a; n++) {
    const sx = Math.sqrt(xt);
    const sy = Math.sqrt(yt);
    const sz = Math.sqrt(zt);
    const lam = sx * sy + sx * sz + sy * sz;
    xt = (xt + lam) / 4;
    yt = (yt + lam) / 4;
    zt = (zt + lam) / 4;
    a = (a + lam) / 4;
    f /= 4;
  }
  countLoop(n);
  const X = ((a0 - x0) * f) / a;
  const Y = ((a0 - y0) * f) / a;
  const Z = -(X + Y);
  const e2 = X * Y - Z * Z;
  const e3 = X * Y * Z;
  const r = (1 - e2 / 10 + e3 / 14 + (e2 * e2) / 24 - (3 * e2 * e3) / 44) / Math.sqrt(a);
  return j === 0 ? r : ldexp(r, -j); // R_F(x) = 2^-j R_F(4^-j x) (degree -1/2)
}

/**
 * ln(4 sqrt(hi) / (sqrt(lo) + sqrt(mid))) without overflow: one logarithm of
 * the ratio when it is representable (error half an ulp of the ratio), else the
 * difference of two logarithms, which are then above 700 and lose nothing that shows.
 */
function logRatio(hi: number, lo: number, mid: number): number {
  const den = Math.sqrt(lo) + Math.sqrt(mid);
  const ratio = Math.sqrt(hi) / den;
  if (ratio < 1e300) return LN4 + Math.log(ratio);
  return LN4 + 0.5 * Math.log(hi) - Math.log(den);
}

/**
 * Carlson's R_D(x, y, z) for x, y >= 0 (not both zero), z > 0 (DLMF 19.16.5).
 * Infinity when z = 0 or x = y = 0; 0 when an argument is infinite. Homogeneous
 * of degree -3/2: scaled by a power of two before the duplication.
 */
export function carlsonRD(x: number, y: number, z: number): number {
  if (!(x >= 0 && y >= 0 && z >= 0)) return NaN;
  if (x === Infinity || y === Infinity || z === Infinity) return 0;
  if (z === 0 || (x === 0 && y === 0)) return Infinity;
  let lo = x;
  let mid = y;
  let hi = z;
  if (lo > mid) [lo, mid] = [mid, lo];
  if (mid > hi) [mid, hi] = [hi, mid];
  if (lo > mid) [lo, mid] = [mid, lo];
  if (mid / hi < ASYMPTOTIC_RATIO) {
    if (hi === z) {
      // x, y << z: R_D = 3 z^-3/2 [ln(4 sqrt(z) / (sqrt(x) + sqrt(y))) - 1] (1 + O((y/z) ln)),
      // the analogue of D = (K - E)/m ~ ln(4/k') - 1 (DLMF 19.12.1-2, 19.25.1).
      return ((3 / z / Math.sqrt(z)) * (logRatio(z, lo, mid) - 1));
    }
    // z and one of x, y (w) small against the other (h): the integral
    // (3/2) int dt / ((t+w)^1/2 (t+h)^1/2 (t+z)^3/2) is dominated by t << h, where
    // int_0^inf (t+w)^-1/2 (t+z)^-3/2 dt = 2 / (sqrt(z) (sqrt(w) + sqrt(z))).
    const w = hi === x ? y : x; // the small one of x, y
    return 3 / Math.sqrt(hi) / Math.sqrt(z) / (Math.sqrt(w) + Math.sqrt(z));
  }
  if (z === lo && z / mid < SINGULAR_RATIO) {
    // z << x <= y: the same integral near t = 0 gives 3 / sqrt(x y z), relative
    // error O(sqrt(z / mid)) < 2^-60. Scaled with the others, z would underflow.
    return 3 / Math.sqrt(hi) / Math.sqrt(mid) / Math.sqrt(z);
  }
  const j = hi > 2 ** 500 || hi < 2 ** -500 ? halfExponent(hi) : 0;
  const x0 = j === 0 ? x : ldexp(x, -2 * j);
  const y0 = j === 0 ? y : ldexp(y, -2 * j);
  const z0 = j === 0 ? z : ldexp(z, -2 * j);
  const a0 = (x0 + y0 + 3 * z0) / 5;
  const q = TOL_D * Math.max(Math.abs(a0 - x0), Math.abs(a0 - y0), Math.abs(a0 - z0));
  let xt = x0;
  let yt = y0;
  let zt = z0;
  let a = a0;
  let f = 1;
  let sum = 0;
  let n = 0;
  for (; n < DUPLICATION_CAP && q * f >= a; n++) {
    const sx = Math.sqrt(xt);
    const sy = Math.sqrt(yt);
    const sz = Math.sqrt(zt);
    const lam = sx * sy + sx * sz + sy * sz;
    sum += f / (sz * (zt + lam));
    xt = (xt + lam) / 4;
    yt = (yt + lam) / 4;
    zt = (zt + lam) / 4;
    a = (a + lam) / 4;
    f /= 4;
  }
  countLoop(n);
  const X = ((a0 - x0) * f) / a;
  const Y = ((a0 - y0) * f) / a;
  const Z = -(X + Y) / 3;
  const xy = X * Y;
  const z2 = Z * Z;
  const e2 = xy - 6 * z2;
  const e3 = (3 * xy - 8 * z2) * Z;
  const e4 = 3 * (xy - z2) * z2;
  const e5 = xy * z2 * Z;
  const series =
    1 - (3 * e2) / 14 + e3 / 6 + (9 * e2 * e2) / 88 - (3 * e4) / 22 - (9 * e2 * e3) / 52 + (3 * e5) / 26;
  // R_D(x) = 2^(-3j) R_D(4^-j x) (degree -3/2).
  const r = (f * series) / (a * Math.sqrt(a)) + 3 * sum;
  return j === 0 ? r : ldexp(r, -3 * j);
}

/**
 * K, E and D near m = 1 from the expansions in k' (DLMF 19.12.1, 19.12.2), with
 * L = ln(4/k'), to the k'^4 terms; the first term left out is below
 * (25/256) mc^3 L, under 1e-22 relative for mc < 2^-24:
 *   K = L + (mc/4)(L - 1) + (9/64) mc^2 (L - 7/6)
 *   E - 1 = (mc/2)(L - 1/2) + (3/16) mc^2 (L - 13/12)
 *   D = (K - E)/(1 - mc) = (L - 1) + mc (3L/4 - 1) + mc^2 (45L/64 - 123/128)
 * (D's coefficients by dividing K - E by 1 - mc). mc = 0 and L = Infinity give
 * K = D = Infinity, E = 1.
 */
function logForms(mc: number, lnInvKc: number, out: Float64Array): void {
  const L = LN4 + lnInvKc;
  if (L === Infinity) {
    out[0] = Infinity;
    out[1] = 1;
    out[2] = Infinity;
    out[3] = 0;
    return;
  }
  const em1 = mc * (0.5 * (L - 0.5) + mc * ((3 / 16) * (L - 13 / 12)));
  out[0] = L + mc * (0.25 * (L - 1) + mc * ((9 / 64) * (L - 7 / 6)));
  out[1] = 1 + em1;
  out[2] = L - 1 + mc * (0.75 * L - 1 + mc * ((45 / 64) * L - 123 / 128));
  out[3] = em1;
}

/**
 * K, E, D = (K - E)/m and E - 1 for the complementary modulus k' = sqrt(1 - m) in
 * [0, 1], written to out[0..3]. Give k' straight from the geometry (a ratio of
 * hypot distances, say): it stays representable where mc = k'^2 underflows.
 * When even k' underflows, pass lnInvKc = ln(1/k') from logarithms of the
 * geometry; it is all the limit needs (mc is then below any term that shows).
 * K and D are Infinity at k' = 0 (the caller decides what that means); E(1) = 1.
 */
export function ellipticByComplement(kc: number, out: Float64Array, lnInvKc?: number): void {
  const mc = kc * kc;
  if (mc < LOG_FORM_LIMIT) {
    logForms(mc, lnInvKc ?? -Math.log(kc), out);
    return;
  }
  carlsonForms(mc, out);
}

/**
 * E by Carlson for mc >= LOG_FORM_LIMIT (m = 1 - mc is then exact enough), given
 * rf = R_F(0, mc, 1) and, for mc >= 1/2, rd = R_D(0, mc, 1).
 */
function carlsonE(mc: number, rf: number, rd: number): number {
  const m = 1 - mc;
  if (mc >= 0.5) return rf - (m * rd) / 3; // m D <= 0.3 K here: no cancellation
  // E = mc R_F(0, mc, 1) + (m mc / 3) R_D(0, 1, mc) (DLMF 19.25.1, from
  // E - k'^2 K = (k^2 k'^2 / 3) R_D(0, 1, k'^2)): both terms positive, while
  // K - m D subtracts two values of size ln(4/k').
  return mc * rf + ((m * mc) / 3) * carlsonRD(0, 1, mc);
}

/** K, E, D, E - 1 by Carlson for mc >= LOG_FORM_LIMIT. */
function carlsonForms(mc: number, out: Float64Array): void {
  const rf = carlsonRF(0, mc, 1);
  const rd = carlsonRD(0, mc, 1);
  const e = carlsonE(mc, rf, rd);
  out[0] = rf;
  out[1] = e;
  out[2] = rd / 3;
  out[3] = e - 1; // E >= 1.21 for mc >= 1/4; below that ellipticEMinusOne sums its series
}

const SCRATCH = /* @__PURE__ */ new Float64Array(4);

function byParameter(mc: number): Float64Array {
  if (mc < LOG_FORM_LIMIT) logForms(mc, -0.5 * Math.log(mc), SCRATCH);
  else carlsonForms(mc, SCRATCH);
  return SCRATCH;
}

/** K(m) = R_F(0, 1 - m, 1), for m <= 1 (DLMF 19.25.1); Infinity at m = 1 (mc = 0). */
export function ellipticK(m: number, mc: number = 1 - m): number {
  if (mc < LOG_FORM_LIMIT) return byParameter(mc)[0]!;
  return carlsonRF(0, mc, 1);
}

/**
 * E(m) for m <= 1: by Carlson (DLMF 19.25.1) with both terms positive, and from
 * DLMF 19.12.2 near m = 1; E(1) = 1.
 */
export function ellipticE(m: number, mc: number = 1 - m): number {
  if (mc < LOG_FORM_LIMIT) return byParameter(mc)[1]!;
  // Two Carlson integrals, not three: R_D(0, mc, 1) only where E's form uses it.
  return carlsonE(mc, carlsonRF(0, mc, 1), mc >= 0.5 ? carlsonRD(0, mc, 1) : 0);
}

/**
 * D(m) = (K(m) - E(m)) / m = R_D(0, mc, 1) / 3, without the cancellation of
 * K - E at small m (DLMF 19.2.6, 19.25.1). D(0) = pi/4; Infinity at m = 1.
 */
export function ellipticD(m: number, mc: number = 1 - m): number {
  if (mc < LOG_FORM_LIMIT) return byParameter(mc)[2]!;
  return carlsonRD(0, mc, 1) / 3;
}

/**
 * E(m) - 1 without the cancellation of E(m) ≈ 1 near m = 1 (short coils,
 * touching filaments). For LOG_FORM_LIMIT <= mc <= 1/4 it sums the logarithmic
 * series in the complementary modulus, DLMF 19.12.2:
 *   E = 1 + (1/2) sum_j [(1/2)_j (3/2)_j / ((2)_j j!)] k'^(2j+2) [ln(1/k') + d(j) - 1/((2j+1)(2j+2))],
 *   d(j) = psi(1+j) - psi(1/2+j), d(0) = ln 4, d(j+1) = d(j) + 1/(j+1) - 2/(2j+1);
 * every term is positive there, so no digits cancel. Below LOG_FORM_LIMIT the
 * series' first two terms (logForms). Elsewhere E - 1 has no cancellation worth
 * the name (E >= 1.21 for mc >= 1/4).
 *
 * Loop bound: the coefficients are at most 1, d(j) <= ln 4 and the log factor of
 * term j is at most (L + 1.4)/(L - 0.5) <= 2.2 times that of term 0 (L = ln(4/k') >= 2.08),
 * so term_j / term_0 <= 2.2 mc^j <= 2.2 4^-j, below 1e-17 from j = 29 on:
 * at most 30 terms (cap 32). Measured: at most 26, at mc = 1/4.
 */
export function ellipticEMinusOne(m: number, mc: number = 1 - m): number {
  if (mc > 0.25) return ellipticE(m, mc) - 1;
  if (mc < LOG_FORM_LIMIT) return byParameter(mc)[3]!;
  const lnInvKc = -0.5 * Math.log(mc);
  let coef = 1; // (1/2)_j (3/2)_j / ((2)_j j!)
  let d = LN4; // d(0) = ln 4
  let pow = mc; // k'^(2j+2)
  let sum = 0;
  let j = 0;
  while (j < 32) {
    const term = coef * pow * (lnInvKc + d - 1 / ((2 * j + 1) * (2 * j + 2)));
    sum += term;
    j++;
    if (term <= 1e-17 * sum) break;
    coef *= ((j - 0.5) * (j + 0.5)) / ((j + 1) * j);
    d += 1 / j - 2 / (2 * j - 1);
    pow *= mc;
  }
  countLoop(j);
  return 0.5 * sum;
}

/**
 * Maxwell's combination (2 - m) K(m) - 2 E(m), which appears in the mutual
 * inductance of coaxial circles. Written directly it loses all digits for small
 * m (it is pi m^2 / 16 + ..., a difference of two O(1) terms). The descending
 * Landen transformation k1 = (1 - k')/(1 + k') (DLMF 19.8.12, K(k) = (1 + k1) K(k1),
 * E(k) = (2 E(k1) - (1 - k1^2) K(k1)) / (1 + k1), k = 2 sqrt(k1)/(1 + k1)) gives
 *   (2/k - k) K(k) - (2/k) E(k) = 2 (K(k1) - E(k1)) / sqrt(k1) = 2 k1^(3/2) D(k1^2),
 * so (2 - m) K - 2 E = 2 k k1^(3/2) D(k1^2),
 * all factors positive, no subtraction. k1 = m / (1 + k')^2 and
 * 1 - k1 = 2 k' / (1 + k') are formed without cancellation, so both ends
 * (m -> 0, and mc -> 0 given directly) keep full precision. Infinity at m = 1.
 */
export function ellipticMaxwell(m: number, mc: number = 1 - m): number {
  const k = Math.sqrt(m);
  const kc = Math.sqrt(mc);
  const k1 = m / ((1 + kc) * (1 + kc));
  const mc1 = ((2 * kc) / (1 + kc)) * (1 + k1);
  return 2 * k * k1 * Math.sqrt(k1) * ellipticD(k1 * k1, mc1);
}
