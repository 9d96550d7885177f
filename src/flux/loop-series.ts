import { ellipticByComplement } from "../math/elliptic.js";

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
 * Writes [f/m, E, k' D, f] for parameter m and complementary modulus kc = k'
 * (taken from the geometry, alpha/beta for a loop) into `out`.
 * Below SERIES_LIMIT f/m is the Maclaurin series (28 terms, straight-line Horner)
 * and E comes from Carlson's integrals (mc >= 0.8 there); k' D = (E/2 - f)/k'
 * (E - 2f = 2 mc D). Above it K, E, D come from ellipticByComplement, which
 * switches to the logarithmic forms in ln(1/k') as k' -> 0, so nothing
 * underflows or loops when the point is next to the filament (mc = k'^2 may
 * be 0 there while k' is not); f = E/2 - k' (k' D) then loses at most a factor
 * 1/(4m) (a few ulp).
 */
export function loopKernel(m: number, kc: number, out: Float64Array): void {
  ellipticByComplement(kc, SCRATCH);
  const e = SCRATCH[1]!;
  if (m < SERIES_LIMIT) {
    // Horner from the top; c_0 = 0 so f = m * (c_1 + m (c_2 + ...)).
    let s = F_COEFFS[TERMS]!;
    for (let n = TERMS - 1; n >= 1; n--) s = s * m + F_COEFFS[n]!;
    const f = s * m;
    out[0] = s;
    out[1] = e;
    out[2] = (e / 2 - f) / kc; // f is small here, so no digits are lost; kc >= 0.89
    out[3] = f;
    return;
  }
  const kcD = kc * SCRATCH[2]!;
  const f = e / 2 - kc * kcD;
  out[0] = f / m;
  out[1] = e;
  out[2] = kcD;
  out[3] = f;
}

const SCRATCH = /* @__PURE__ */ new Float64Array(4);
