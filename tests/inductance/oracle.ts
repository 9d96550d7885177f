// High-precision oracles for the inductance closed forms: decimal.js at a
// working precision chosen per call (enough for the cancellation in each
// textbook expression as written), from the exact binary values of the double
// inputs and the CODATA 2022 string for mu0. Each oracle names the published
// expression it evaluates; none reuses the library's rewritten forms.
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { dec, ellipticKE, exact, type Dec } from "../math/decimal-elliptic.js";

export type { Dec };
export { dec, exact };

/** mu0 (CODATA 2022) at `digits`. */
export function mu0(digits: number): Dec {
  return constantDecimal(constant("vacuumPermeability"), dec(digits));
}

export function pi(digits: number): Dec {
  return dec(digits).acos(-1);
}

/** Digits needed to see a ratio's small part: 50 plus the decimal orders of magnitude it spans. */
export function digitsFor(...ratios: number[]): number {
  let d = 50;
  for (const r of ratios) d += Math.ceil(Math.abs(Math.log10(r)));
  return Math.min(d, 1000); // decimal.js's ln and acos stop near 1025 digits
}

/**
 * Nagaoka's coefficient from Nagaoka's (1909) expression as written:
 *   K = 4/(3 pi k') [ (k'^2/k^2)(K(k) - E(k)) + E(k) - k ], k^2 = 4r^2/(4r^2 + l^2).
 * E - k cancels like k'^2 ln(4/k') for short coils and K - E like k^2 for long
 * ones, so the working precision grows with twice the orders of magnitude of 2r/l.
 */
export function nagaokaOracle(r: number, l: number, extraDigits = 0): Dec {
  const digits = digitsFor((2 * r) / l, (2 * r) / l) + extraDigits;
  const D = dec(digits);
  const four_r2 = exact(r, digits).times(2).pow(2);
  const l2 = exact(l, digits).pow(2);
  const S = four_r2.plus(l2);
  const m = four_r2.div(S);
  const mc = l2.div(S);
  const { K, E } = ellipticKE(m, mc, digits);
  const k = m.sqrt();
  const kc = mc.sqrt();
  const bracket = mc.div(m).times(K.minus(E)).plus(E).minus(k);
  return bracket.times(4).div(D.acos(-1).times(3).times(kc));
}
