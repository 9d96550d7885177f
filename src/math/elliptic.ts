/**
 * Complete elliptic integrals of the first and second kind, K(m) and E(m),
 * with parameter m = k^2, through Carlson's symmetric integrals R_F and R_D.
 *
 * Method: Carlson's duplication algorithm with the fifth-order Taylor
 * correction, B. C. Carlson, "Numerical computation of real or complex
 * elliptic integrals", Numerical Algorithms 10 (1995) 13-26; also DLMF
 * sections 19.25(i) (K, E in terms of R_F, R_D) and 19.36(i) (the algorithm).
 * The relative error is a few ulp over the whole range.
 *
 * Each function takes the complementary parameter mc = 1 - m as an optional
 * second argument. Near m = 1 (touching loops, thin wires) pass mc computed
 * directly from the geometry: 1 - m formed in floating point loses digits.
 */

const TOL_F = Math.pow(3 * Number.EPSILON, -1 / 6);
const TOL_D = Math.pow(Number.EPSILON / 4, -1 / 6);

/** Carlson's R_F(x, y, z) for x, y, z >= 0, at most one of them zero. DLMF 19.16.1. */
export function carlsonRF(x: number, y: number, z: number): number {
  const a0 = (x + y + z) / 3;
  const q = TOL_F * Math.max(Math.abs(a0 - x), Math.abs(a0 - y), Math.abs(a0 - z));
  let xt = x;
  let yt = y;
  let zt = z;
  let a = a0;
  let f = 1; // 4^-n
  while (q * f >= Math.abs(a)) {
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
  const X = ((a0 - x) * f) / a;
  const Y = ((a0 - y) * f) / a;
  const Z = -(X + Y);
  const e2 = X * Y - Z * Z;
  const e3 = X * Y * Z;
  return (1 - e2 / 10 + e3 / 14 + (e2 * e2) / 24 - (3 * e2 * e3) / 44) / Math.sqrt(a);
}

/** Carlson's R_D(x, y, z) for x, y >= 0 (not both zero), z > 0. DLMF 19.16.5. */
export function carlsonRD(x: number, y: number, z: number): number {
  const a0 = (x + y + 3 * z) / 5;
  const q = TOL_D * Math.max(Math.abs(a0 - x), Math.abs(a0 - y), Math.abs(a0 - z));
  let xt = x;
  let yt = y;
  let zt = z;
  let a = a0;
  let f = 1;
  let sum = 0;
  while (q * f >= Math.abs(a)) {
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
  const X = ((a0 - x) * f) / a;
  const Y = ((a0 - y) * f) / a;
  const Z = -(X + Y) / 3;
  const xy = X * Y;
  const z2 = Z * Z;
  const e2 = xy - 6 * z2;
  const e3 = (3 * xy - 8 * z2) * Z;
  const e4 = 3 * (xy - z2) * z2;
  const e5 = xy * z2 * Z;
  const series =
    1 - (3 * e2) / 14 + e3 / 6 + (9 * e2 * e2) / 88 - (3 * e4) / 22 - (9 * e2 * e3) / 52 + (3 * e5) / 26;
  return (f * series) / (a * Math.sqrt(a)) + 3 * sum;
}

/** K(m) = R_F(0, 1 - m, 1), for m < 1. DLMF 19.25.1. */
export function ellipticK(m: number, mc: number = 1 - m): number {
  return carlsonRF(0, mc, 1);
}

/**
 * E(m) = mc R_F(0, mc, 1) + (m mc / 3) R_D(0, 1, mc), for m <= 1 (DLMF 19.25.1,
 * from E - k'^2 K = (k^2 k'^2 / 3) R_D(0, 1, k'^2)). Both terms are positive:
 * the form R_F - (m/3) R_D(0, mc, 1) subtracts two values of size ln(4/k') and
 * loses about log10(ln(4/k')) digits as m -> 1 (5e-15 at mc = 1e-15).
 */
export function ellipticE(m: number, mc: number = 1 - m): number {
  if (mc === 0) return 1;
  return mc * carlsonRF(0, mc, 1) + ((m * mc) / 3) * carlsonRD(0, 1, mc);
}

/**
 * D(m) = (K(m) - E(m)) / m = R_D(0, mc, 1) / 3, without the cancellation of
 * K - E at small m (DLMF 19.2.6, 19.25.1). D(0) = pi/4.
 */
export function ellipticD(m: number, mc: number = 1 - m): number {
  return carlsonRD(0, mc, 1) / 3;
}

/**
 * E(m) - 1 without the cancellation of E(m) ≈ 1 near m = 1 (short coils,
 * touching filaments). For mc <= 1/4 it sums the logarithmic series in the
 * complementary modulus, DLMF 19.12.2:
 *   E = 1 + (1/2) sum_j [(1/2)_j (3/2)_j / ((2)_j j!)] k'^(2j+2) [ln(1/k') + d(j) - 1/((2j+1)(2j+2))],
 *   d(j) = psi(1+j) - psi(1/2+j), d(0) = ln 4, d(j+1) = d(j) + 1/(j+1) - 2/(2j+1);
 * every term is positive there, so no digits cancel. Elsewhere E - 1 has no
 * cancellation worth the name (E >= 1.21 for mc >= 1/4).
 */
export function ellipticEMinusOne(m: number, mc: number = 1 - m): number {
  if (mc > 0.25) return ellipticE(m, mc) - 1;
  if (mc === 0) return 0;
  const lnInvKc = -0.5 * Math.log(mc);
  let coef = 1; // (1/2)_j (3/2)_j / ((2)_j j!)
  let d = 2 * Math.LN2; // d(0) = ln 4
  let pow = mc; // k'^(2j+2)
  let sum = 0;
  for (let j = 0; j < 200; j++) {
    const term = coef * pow * (lnInvKc + d - 1 / ((2 * j + 1) * (2 * j + 2)));
    sum += term;
    if (term <= 1e-17 * sum) break;
    coef *= ((j + 0.5) * (j + 1.5)) / ((j + 2) * (j + 1));
    d += 1 / (j + 1) - 2 / (2 * j + 1);
    pow *= mc;
  }
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
 * (m -> 0, and mc -> 0 given directly) keep full precision.
 */
export function ellipticMaxwell(m: number, mc: number = 1 - m): number {
  const k = Math.sqrt(m);
  const kc = Math.sqrt(mc);
  const k1 = m / ((1 + kc) * (1 + kc));
  const mc1 = ((2 * kc) / (1 + kc)) * (1 + k1);
  return 2 * k * k1 * Math.sqrt(k1) * ellipticD(k1 * k1, mc1);
}
