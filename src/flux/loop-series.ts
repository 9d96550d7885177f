import { carlsonRD, carlsonRF } from "../math/elliptic.js";

/**
 * The loop-field kernel f(m) = E(m)/2 - (1 - m) D(m), with D = (K - E)/m, and E(m).
 *
 * With it the field of a circular loop (Smythe; Jackson) takes a form without the
 * cancellations of the textbook expression near the axis and far away:
 *   B_z   = mu0 I / (pi a) * (E - 2 r f) / (alpha^2 beta)
 *   B_rho = mu0 I / (pi a) * 2 zeta f / (alpha^2 beta)
 * (lengths scaled by the loop radius a; see loopField). f(m) = 3 pi m / 32 + O(m^2).
 *
 * For m >= SERIES_LIMIT (0.2) the closed form E/2 - mc D loses at most a factor 1/(4m)
 * (a few ulp); below it f is summed from its Maclaurin series, whose
 * coefficients follow from the hypergeometric series of K and E (DLMF 19.5.1, 19.5.2).
 */
export const SERIES_LIMIT = 0.2;
const TERMS = 28; // 0.2^27 ~ 1.3e-19 relative to the first term: below an ulp

// k_n = ((1/2)_n / n!)^2: K = pi/2 sum k_n m^n; E = pi/2 sum k_n/(1-2n) m^n.
const F_COEFFS: Float64Array = /* @__PURE__ */ (() => {
  const k: number[] = [1];
  for (let n = 1; n <= TERMS + 2; n++) k.push(k[n - 1]! * ((n - 0.5) / n) ** 2);
  const e = (n: number) => k[n]! / (1 - 2 * n);
  const d = (n: number) => (n < 0 ? 0 : (k[n + 1]! * (2 * n + 2)) / (2 * n + 1)); // D = pi/2 sum d_n m^n
  const c = new Float64Array(TERMS + 1);
  for (let n = 0; n <= TERMS; n++) c[n] = (Math.PI / 2) * (e(n) / 2 - d(n) + d(n - 1));
  c[0] = 0; // exactly zero: 1/2 - 2 k_1
  return c;
})();

/**
 * Writes [f, E, mc D] for parameter m and its complement mc (taken from the geometry)
 * into `out`. E and D share Carlson's R_D(0, mc, 1): E = R_F - m R_D / 3, D = R_D / 3
 * (DLMF 19.25.1), so one R_F and one R_D serve both.
 */
export function loopKernel(m: number, mc: number, out: Float64Array): void {
  const rf = carlsonRF(0, mc, 1);
  const rd = carlsonRD(0, mc, 1);
  const e = rf - (m * rd) / 3;
  if (m < SERIES_LIMIT) {
    // Horner from the top; c_0 = 0 so f = m * (c_1 + m (c_2 + ...)).
    let s = F_COEFFS[TERMS]!;
    for (let n = TERMS - 1; n >= 1; n--) s = s * m + F_COEFFS[n]!;
    const f = s * m;
    out[0] = f;
    out[1] = e;
    out[2] = e / 2 - f; // mc D = E/2 - f: f is small here, so no digits are lost
    return;
  }
  const mcD = (mc * rd) / 3;
  out[0] = e / 2 - mcD;
  out[1] = e;
  out[2] = mcD;
}
