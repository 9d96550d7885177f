import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { seriesOf } from "../core/series.js";
import { POSITIVE } from "../core/spec.js";
import { meanAbsCosinePower } from "../math/gamma-ratio.js";
import { countLoop } from "../math/loop-count.js";
import { Scaled, exponentOf, ldexp, pow } from "../math/scaled.js";
import { CORE_VOLUME, HOT_CORE, STEINMETZ_EXPONENTS, STEINMETZ_PARAMETERS } from "./losses.js";

/** Most samples a waveform may have: a sweep or tolerance run evaluates the whole waveform at every point. */
export const WAVEFORM_MAX_SAMPLES = 10_000;

/**
 * The iGSE in the form computed here (derivation in the doc comment of coreLossForWaveform):
 * P = k f^alpha V (dB/2)^beta * mean_j |s_j|^alpha / mean |cos|^alpha, with s_j the slope of
 * segment j normalised so that a sine of the same peak-to-peak swing has slopes cos(theta).
 *
 * Every magnitude is taken relative to the waveform's largest sample (a power of two, so the
 * scaling is exact), so samples near the largest double neither overflow in their differences
 * nor lose their digits when tiny; the powers are held as mantissa and exponent (Scaled), so a
 * representable loss is returned even where f^alpha or dB^beta alone is not.
 */
function waveformLoss(k: number, alpha: number, beta: number, f: number, b: readonly number[], volume: number): number {
  const n = b.length;
  let hi = b[0]!;
  let lo = hi;
  for (let i = 1; i < n; i++) {
    const v = b[i]!;
    if (v > hi) hi = v;
    else if (v < lo) lo = v;
  }
  countLoop(n - 1);
  if (hi === lo) return 0; // constant flux density: no change, no loss
  // u = b 2^shift lies in (-2, 2): exact (a power of two), and steps of u cannot overflow.
  const top = exponentOf(Math.max(Math.abs(hi), Math.abs(lo)));
  const shift = -top;
  const swing = ldexp(hi, shift) - ldexp(lo, shift); // peak-to-peak of u, in (0, 4)
  // The largest step |u_{j+1} - u_j| over the period (the last sample joins the first).
  let step = 0;
  let prev = ldexp(b[n - 1]!, shift);
  for (let i = 0; i < n; i++) {
    const u = ldexp(b[i]!, shift);
    const d = Math.abs(u - prev);
    if (d > step) step = d;
    prev = u;
  }
  countLoop(n);
  // mean_j (|step_j| / step)^alpha: every term is at most 1 and one is exactly 1, so the sum lies
  // in [1, n]; terms far below 1 underflow harmlessly to 0 when alpha is large.
  let sum = 0;
  prev = ldexp(b[n - 1]!, shift);
  for (let i = 0; i < n; i++) {
    const u = ldexp(b[i]!, shift);
    sum += Math.pow(Math.abs(u - prev) / step, alpha);
    prev = u;
  }
  countLoop(n);
  // The largest normalised slope: n step / (pi swing) (1 for a finely sampled sine).
  const slope = (n * step) / (Math.PI * swing);
  const shape = (sum / n) / meanAbsCosinePower(alpha);
  return Scaled.of(k)
    .times(volume)
    .times(pow(f, alpha))
    .times(pow(slope, alpha))
    .times(pow(swing / 2, beta))
    .times(pow(2 ** top, beta))
    .times(shape)
    .toNumber();
}

/**
 * Direction reversals of a periodic sampled waveform: the number of turning points
 * (flat runs skipped). A waveform with only a major loop has 2; each minor loop adds 2.
 */
export function reversals(b: readonly number[]): number {
  const n = b.length;
  // Direction of the last step of the period that moves (the one before the first sample's).
  let dir = 0;
  for (let i = 0; i < n; i++) {
    const s = Math.sign(b[(i + 1) % n]! - b[i]!);
    if (s !== 0) dir = s;
  }
  countLoop(n);
  let count = 0;
  for (let i = 0; i < n; i++) {
    const s = Math.sign(b[(i + 1) % n]! - b[i]!);
    if (s !== 0 && s !== dir) {
      count++;
      dir = s;
    }
  }
  countLoop(n);
  return count;
}

/**
 * Core loss for an arbitrary periodic flux waveform by the improved generalized Steinmetz
 * equation (iGSE).
 *
 * P = V (1/T) int_0^T k_i |dB/dt|^alpha (dB_pp)^(beta - alpha) dt, with
 * k_i = k / ((2 pi)^(alpha - 1) int_0^{2 pi} |cos theta|^alpha 2^(beta - alpha) d theta),
 * where P is the loss in W, V the core volume in m^3, T = 1/f the period in s, B(t) the flux
 * density in T, dB_pp its peak-to-peak swing, and k, alpha, beta the material's Steinmetz
 * parameters (W/m^3 for f in Hz and B in T, as for coreLoss).
 *
 * The waveform is n samples B_0 .. B_{n-1} equally spaced over one period, joined by straight
 * lines, the last back to the first. On each segment dB/dt is constant, so the integral is the
 * sum P/V = k_i dB_pp^(beta - alpha) f^alpha n^(alpha - 1) sum_j |B_{j+1} - B_j|^alpha (closed
 * form, no quadrature). The integral in k_i is 2 pi times the mean of |cos|^alpha,
 * Gamma((alpha + 1)/2) / (sqrt(pi) Gamma(alpha/2 + 1)), evaluated as one ratio of Gamma
 * functions (src/math/gamma-ratio.ts). Rearranged, the result is the Steinmetz loss
 * k f^alpha (dB_pp/2)^beta V times the mean of |slope|^alpha over the mean of |cos|^alpha, with
 * slopes normalised so that a sine's are cos(theta): for a sine the two means agree and
 * coreLoss is recovered exactly in the limit of fine sampling.
 *
 * Minor loops: dB_pp is the major loop's peak-to-peak swing for every segment. The paper
 * splits a waveform with minor loops into loops each with its own swing; that splitting is
 * not done here, and a waveform that reverses more than twice per period is warned on
 * (with beta > alpha the minor loops' loss is then overstated).
 *
 * Assumptions: the Steinmetz parameters' own (sinusoidal, fitted frequency and flux range);
 * no DC bias effect and no relaxation after a flat stretch (the paper's later extensions).
 *
 * Accuracy: the paper's piecewise-linear sum to within 6 + 5 (alpha + beta) ulp for every input
 * whose loss is a double (measured against a decimal.js oracle in tests/flux/waveform-loss.test.ts:
 * worst 4 ulp for exponents 0.1 to 4, 171 ulp for exponents up to 300, where a rounding in a slope
 * is raised to the power alpha); the
 * waveform's own sampling error is the user's: a sine in n samples reads about alpha (pi/n)^2 / 6 low.
 *
 * Reference: K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca, "Accurate prediction of
 * ferrite core loss with nonsinusoidal waveforms using only Steinmetz parameters", IEEE
 * Workshop on Computers in Power Electronics (COMPEL) 2002, pp. 36-41 (the iGSE and its
 * piecewise-linear sum; equation numbers not checked).
 *
 * @example
 * // a 100 kHz triangle of 0.2 T peak-to-peak, 50 % duty
 * coreLossForWaveform({ coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: quantity(100, "kHz"),
 *   waveform: [0, 0.1, 0, -0.1].map((b) => quantity(b, "T")), volume: quantity(5, "cm^3") }); // ≈ 0.22 W
 */
export const coreLossForWaveform = /* @__PURE__ */ defineFormula({
  id: "coreLossForWaveform",
  title: "Core loss for a flux waveform (improved generalized Steinmetz equation)",
  category: "flux",
  description:
    "Power lost in a magnetic core whose flux density follows any periodic waveform, given as samples over one period joined by straight lines, " +
    "from the material's sinusoidal Steinmetz parameters (iGSE). Equals the Steinmetz core loss for a sine. " +
    "Uses the major loop's peak-to-peak swing throughout (minor loops are not split); DC bias and temperature change the loss.",
  equation: "P = V/T int k_i |dB/dt|^alpha dB_pp^(beta - alpha) dt,  k_i = k / ((2 pi)^(alpha-1) int_0^2pi |cos t|^alpha 2^(beta-alpha) dt)",
  inputs: [
    ...STEINMETZ_PARAMETERS,
    { name: "frequency", dimension: "Frequency", description: "Repetition frequency of the waveform (one period per cycle)", domain: POSITIVE, example: 100e3 },
    {
      name: "waveform",
      dimension: "FluxDensity",
      description: `Flux density over one period: samples equally spaced in time, joined by straight lines, the last back to the first (2 to ${WAVEFORM_MAX_SAMPLES} samples)`,
      series: seriesOf(2, WAVEFORM_MAX_SAMPLES),
      // A symmetric triangle of 0.2 T peak-to-peak.
      example: [0, 0.05, 0.1, 0.05, 0, -0.05, -0.1, -0.05],
    },
    CORE_VOLUME,
  ],
  output: { dimension: "Power", description: "Core loss" },
  validity: [
    STEINMETZ_EXPONENTS,
    {
      code: "minor_loops",
      when: (x) => reversals(x.waveform) > 2,
      // Loops per period (major plus minor): 1 for a plain waveform, larger is further from the method's case.
      measure: (x) => reversals(x.waveform) / 2,
      message: (x) =>
        `the waveform turns ${formatNumber(reversals(x.waveform), 3)} times per period, so it has minor loops; the major loop's peak-to-peak swing is used for all of it ` +
        "(the iGSE without its minor-loop splitting), which overstates the minor loops' loss when beta > alpha",
    },
  ],
  cautions: [HOT_CORE],
  source: [
    {
      authors: "K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca",
      year: 2002,
      title: "Accurate prediction of ferrite core loss with nonsinusoidal waveforms using only Steinmetz parameters, IEEE COMPEL 2002, 36-41",
      locator: "iGSE and its piecewise-linear form (equation numbers not checked)",
    },
    { authors: "M. Abramowitz, I. A. Stegun", year: 1964, title: "Handbook of Mathematical Functions", locator: "eq. 6.2.1 (Beta integral), 6.1.42 (Stirling series)" },
  ],
  compute: (x) => waveformLoss(x.coefficient, x.frequencyExponent, x.fluxExponent, x.frequency, x.waveform, x.volume),
});
