// High-precision oracles (decimal.js, 60 digits, any exponent) for the improved generalized
// Steinmetz equation, written from the paper's own form (not the library's rearrangement):
//   P = V (1/T) int k_i |dB/dt|^alpha dB_pp^(beta - alpha) dt,
//   k_i = k / ((2 pi)^(alpha - 1) int_0^{2 pi} |cos t|^alpha 2^(beta - alpha) dt)
// (K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca, IEEE COMPEL 2002), with the
// integral of |cos|^alpha from the Beta function and ln Gamma from Stirling's series.
import Decimal from "decimal.js";
import { exactDecimal } from "../helpers/exact-decimal.js";

export const W = Decimal.clone({ precision: 60, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
export type WDec = Decimal;
export const WPI = W.acos(-1);

/** The exact value of a double as a decimal (its full binary expansion). */
export function exactW(x: number): WDec {
  return exactDecimal(x, W);
}

/** B_2 .. B_30, the Bernoulli numbers (exact rationals; DLMF Table 24.2.1). */
const BERNOULLI: readonly [number, number][] = [
  [1, 6], [-1, 30], [1, 42], [-1, 30], [5, 66], [-691, 2730], [7, 6], [-3617, 510], [43867, 798], [-174611, 330],
  [854513, 138], [-236364091, 2730], [8553103, 6], [-23749461029, 870], [8615841276005, 14322],
];

/**
 * ln Gamma(z) for z > 0: the recurrence ln Gamma(z) = ln Gamma(z + 1) - ln z up to z >= 20, then
 * Stirling's series (z - 1/2) ln z - z + ln(2 pi)/2 + sum B_2k / (2k (2k - 1) z^(2k - 1))
 * (Abramowitz and Stegun 1964, eq. 6.1.40; DLMF 5.11.1) to B_30: the first omitted term is below
 * 1e-30 at z = 20, far below the 2e-16 of a double's ulp.
 */
export function lnGamma(z: WDec): WDec {
  let shift = new W(0);
  let x = z;
  for (let i = 0; i < 100 && x.lt(20); i++) {
    shift = shift.plus(x.ln());
    x = x.plus(1);
  }
  let s = x.minus(0.5).times(x.ln()).minus(x).plus(WPI.times(2).ln().div(2));
  const x2 = x.times(x);
  let xp = x; // z^(2k - 1)
  BERNOULLI.forEach(([num, den], i) => {
    const k = i + 1;
    s = s.plus(new W(num).div(new W(den).times(2 * k).times(2 * k - 1).times(xp)));
    xp = xp.times(x2);
  });
  return s.minus(shift);
}

/** int_0^{2 pi} |cos t|^alpha dt = 4 int_0^{pi/2} cos^alpha = 2 B(1/2, (alpha + 1)/2) = 2 sqrt(pi) Gamma((alpha + 1)/2) / Gamma(alpha/2 + 1) (A&S 6.2.1). */
export function cosinePowerIntegral(alpha: WDec): WDec {
  return WPI.sqrt().times(2).times(lnGamma(alpha.plus(1).div(2)).minus(lnGamma(alpha.div(2).plus(1))).exp());
}

/** k_i / k of the iGSE: 1 / ((2 pi)^(alpha - 1) 2^(beta - alpha) int_0^{2 pi} |cos t|^alpha dt). */
export function kiOverK(alpha: WDec, beta: WDec): WDec {
  return new W(1).div(WPI.times(2).pow(alpha.minus(1)).times(new W(2).pow(beta.minus(alpha))).times(cosinePowerIntegral(alpha)));
}

/**
 * The iGSE loss of n equally spaced samples joined by straight lines over one period T = 1/f:
 * on segment j dB/dt = (B_{j+1} - B_j) / (T/n), so
 * P = V k_i dB_pp^(beta - alpha) (1/T) sum_j |B_{j+1} - B_j|^alpha (T/n)^(1 - alpha), from exact inputs.
 */
export function waveformLossOracle(k: number, alpha: number, beta: number, f: number, waveform: readonly number[], volume: number): WDec {
  const a = exactW(alpha);
  const bt = exactW(beta);
  const b = waveform.map(exactW);
  const n = b.length;
  let hi = b[0]!;
  let lo = b[0]!;
  for (const v of b) {
    if (v.gt(hi)) hi = v;
    if (v.lt(lo)) lo = v;
  }
  const pp = hi.minus(lo);
  if (pp.isZero()) return new W(0);
  let sum = new W(0);
  for (let j = 0; j < n; j++) {
    const d = b[(j + 1) % n]!.minus(b[j]!).abs();
    if (!d.isZero()) sum = sum.plus(d.pow(a));
  }
  const period = new W(1).div(exactW(f));
  const dt = period.div(n);
  return exactW(volume).times(exactW(k)).times(kiOverK(a, bt)).times(pp.pow(bt.minus(a))).times(sum).times(dt.pow(new W(1).minus(a))).div(period);
}
