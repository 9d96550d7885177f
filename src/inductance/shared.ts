import { MU0 } from "../constants/si.js";
import { POSITIVE } from "../core/spec.js";
import { ellipticD, ellipticEMinusOne } from "../math/elliptic.js";

/**
 * Relative permeability of a linear core: 1 for air. The domain is > 0 rather
 * than >= 1: diamagnetic materials (copper, bismuth, superconductors in the
 * ideal limit) have mu_r slightly below 1 and the formulas still hold.
 */
export const RELATIVE_PERMEABILITY = {
  dimension: "Dimensionless",
  description: "Relative permeability of the core (1 for air; linear material assumed)",
  default: 1,
  domain: POSITIVE,
  example: 2000,
} as const;

/**
 * Nagaoka's coefficient K_N for a cylindrical current sheet of radius r and
 * length l, from k^2 = 4r^2/(4r^2 + l^2), k'^2 = l^2/(4r^2 + l^2):
 *   K_N = 4 / (3 pi k') [ (k'^2/k^2) (K - E) + E - k ]        (Nagaoka 1909)
 *       = 4 / (3 pi k') [ k'^2 D(m) + (E - 1) + k'^2/(1 + k) ],
 * since 1 - k = k'^2/(1 + k) and (K - E)/k^2 = D. In the textbook form E - k
 * cancels for short coils (k -> 1: both ~ 1, difference ~ k'^2 ln(4/k')); here
 * every term is positive (E - 1 from its series near m = 1), so no digits are
 * lost at either end. k and k' come from hypot of the geometry, not 1 - k^2.
 */
export function nagaoka(radius: number, length: number): number {
  const h = Math.hypot(2 * radius, length);
  const k = (2 * radius) / h;
  const kc = length / h;
  if (kc < 1e-9) {
    // Pancake limit: K_N = (2/pi) k' (ln(4/k') - 1/2) (1 + O(k'^2 ln k')),
    // from the expansions DLMF 19.12.1-2; below 1e-9 the neglected part is < 1e-16.
    return (2 / Math.PI) * kc * (Math.log(4 / kc) - 0.5);
  }
  const m = k * k;
  const mc = kc * kc;
  const bracket = mc * ellipticD(m, mc) + ellipticEMinusOne(m, mc) + mc / (1 + k);
  return (4 * bracket) / (3 * Math.PI * kc);
}

/**
 * Mutual inductance of two coaxial circular filaments, radii a and b, axial
 * distance d (Maxwell). With r1 = sqrt((a-b)^2 + d^2), r2 = sqrt((a+b)^2 + d^2)
 * and k1 = (r2 - r1)/(r2 + r1) = 4ab/(r1 + r2)^2 (Landen's modulus of k):
 *   M = mu0 sqrt(ab) [ (2/k - k) K(k) - (2/k) E(k) ] = 2 mu0 sqrt(ab) k1^(3/2) D(k1^2).
 * The textbook form subtracts two nearly equal terms when the loops are far
 * apart (M ~ 1/d^3); the Landen form has no subtraction, and 1 - k1 = 2 r1/(r1 + r2)
 * keeps touching loops accurate.
 */
export function maxwellMutual(a: number, b: number, d: number): number {
  const r1 = Math.hypot(a - b, d);
  const r2 = Math.hypot(a + b, d);
  const s = r1 + r2;
  const k1 = ((4 * a) / s) * (b / s);
  const mc1 = ((2 * r1) / s) * (1 + k1);
  return 2 * MU0 * Math.sqrt(a) * Math.sqrt(b) * k1 * Math.sqrt(k1) * ellipticD(k1 * k1, mc1);
}
