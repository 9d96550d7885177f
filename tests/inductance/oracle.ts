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
export function nagaokaOracle(r: number | Dec, l: number | Dec, extraDigits = 0): Dec {
  const ratio = Number(typeof r === "number" ? r : r.toNumber()) / Number(typeof l === "number" ? l : l.toNumber());
  const digits = digitsFor(2 * ratio, 2 * ratio) + extraDigits;
  const D = dec(digits);
  const R = typeof r === "number" ? exact(r, digits) : new D(r);
  const L = typeof l === "number" ? exact(l, digits) : new D(l);
  const four_r2 = R.times(2).pow(2);
  const l2 = L.pow(2);
  const S = four_r2.plus(l2);
  const m = four_r2.div(S);
  const mc = l2.div(S);
  const { K, E } = ellipticKE(m, mc, digits);
  const k = m.sqrt();
  const kc = mc.sqrt();
  const bracket = mc.div(m).times(K.minus(E)).plus(E).minus(k);
  return bracket.times(4).div(D.acos(-1).times(3).times(kc));
}

/**
 * Mutual inductance of two coaxial current sheets of equal radius a (lengths
 * l1, l2, centre distance d, N1 and N2 turns), from the self-inductance of a
 * single sheet: with S(z) = mu0 pi a^2 z K_N(a, z) (the double integral of
 * Maxwell's filament formula over a sheet of length z with itself, Nagaoka),
 * F(z) = S(|z|)/2 has F'' = M0, and integrating twice over both windings gives
 *   M = N1 N2/(l1 l2) [ F(d + h1 + h2) - F(d + h2 - h1) - F(d - h2 + h1) + F(d - h1 - h2) ],
 * h = l/2 (the classical difference-of-Nagaoka-coils form, as in Grover (1946)
 * for equal-radius coaxial coils; from memory). The four terms cancel like
 * (l/d)^4 for distant coils, so the precision grows with 4 log10(d/l).
 */
export function coaxialSheetsOracle(a: number, l1: number, l2: number, d: number, n1 = 1, n2 = 1): Dec {
  const span = Math.max(1, d / Math.min(l1, l2, a));
  const digits = Math.min(1000, 60 + Math.ceil(6 * Math.log10(span)) + digitsFor(span / a, span / a));
  const D = dec(digits);
  const A = exact(a, digits);
  const h1 = exact(l1, digits).div(2);
  const h2 = exact(l2, digits).div(2);
  const dd = exact(d, digits);
  const F = (z: Dec): Dec => {
    const az = z.abs();
    if (az.isZero()) return new D(0);
    return mu0(digits).times(D.acos(-1)).times(A.pow(2)).times(az).times(nagaokaOracle(A, az, digits - 50)).div(2);
  };
  const sum = F(dd.plus(h1).plus(h2)).minus(F(dd.plus(h2).minus(h1))).minus(F(dd.minus(h2).plus(h1))).plus(F(dd.minus(h1).minus(h2)));
  return sum.times(n1).times(n2).div(exact(l1, digits).times(exact(l2, digits)));
}
