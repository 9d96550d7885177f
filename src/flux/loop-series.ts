import { ellipticD, ellipticE } from "../math/elliptic.js";

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

/** f(m) = E/2 - mc D and E(m), given m and its complement mc (from geometry). */
export function loopKernel(m: number, mc: number): { f: number; e: number } {
  if (m < SERIES_LIMIT) {
    // Horner from the top; c_0 = 0 so f = m * (c_1 + m (c_2 + ...)).
    let s = F_COEFFS[TERMS]!;
    for (let n = TERMS - 1; n >= 1; n--) s = s * m + F_COEFFS[n]!;
    return { f: s * m, e: ellipticE(m, mc) };
  }
  const e = ellipticE(m, mc);
  return { f: e / 2 - mc * ellipticD(m, mc), e };
}
