import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { nagaoka, shortCoilFactor } from "../inductance/shared.js";
import { countLoop } from "../math/loop-count.js";
import { cappedRatio, logOfRatio } from "../math/ratios.js";
import { Scaled, moderate } from "../math/scaled.js";

/** ln(2 pi) - 3/2: Rosa's mutual correction for infinitely many turns. */
const B_INFINITE = 0.3378770664093455;
/** 2 zeta'(-1) = 1/6 - 2 ln A (A Glaisher's constant): the 1/N coefficient of the expansion. */
const B_ONE_OVER_N = -0.3308422874009019;
/**
 * Coefficients of 1/N^3, 1/N^5, ..., 1/N^15 in the expansion of B: B_2k / (2k (k - 1)) for
 * k = 2..8 (Bernoulli numbers B_4 = -1/30, ..., B_16 = -3617/510).
 */
const B_ODD = [-1 / 120, 1 / 504, -1 / 720, 1 / 528, -691 / 163800, 1 / 72, -3617 / 57120] as const;
/** From this many turns on the expansion is used; below, Rosa's sum term by term. */
const EXPANSION_FROM = 10;
/** g(1) = 3/2 - 2 ln 2: Rosa's correction between adjacent turns. */
const G1 = 1.5 - 2 * Math.LN2;
/** Most terms of the series for g(s), s >= 2: the k-th is below 4^-k / (4 k^3); at k = 30 under 1e-22 of g(2). */
const G_TERMS = 30;
/** 5/4 - ln 2: Rosa's self-inductance correction A = 5/4 - ln(2 p / d) for d = p. */
const A_TOUCHING = 1.25 - Math.LN2;
/** Pitch over radius above which the corrections' straight-wire picture is warned (see the warning). */
const COARSE_PITCH = 0.3;

/**
 * Rosa's correction between two turns s pitches apart, against two bands of the current sheet:
 * g(s) = ln s - ln(GMD of the two bands / p) = 3/2 + ln s - [(s+1)^2 ln(s+1) + (s-1)^2 ln(s-1) - 2 s^2 ln s] / 2.
 * Written out, the bracket cancels to ~1/(12 s^2); here, for s >= 2, the equal series with positive
 * terms only, g(s) = sum over k >= 1 of 1 / ((2k+2)(2k+1) k s^(2k)) (Taylor series of the logarithms
 * in 1/s), so no digit is lost.
 */
function rosaPairCorrection(s: number): number {
  if (s === 1) return G1;
  const x2 = 1 / (s * s);
  let term = x2;
  let sum = 0;
  let k = 1;
  for (; k <= G_TERMS; k++) {
    const t = term / ((2 * k + 2) * (2 * k + 1) * k);
    sum += t;
    if (t < 1e-18 * sum) break;
    term *= x2;
  }
  countLoop(Math.min(k, G_TERMS));
  return sum;
}

/**
 * Rosa's mutual-inductance correction B(N) (called H by some authors) for N turns: the difference
 * between the mutual inductances of N round-wire turns and of the N bands of the current sheet, in
 * units of mu0 a N, B(N) = (2/N) sum over s = 1..N-1 of (N - s) g(s) (Rosa 1906, Grover 1946
 * p. 150 table). Below 10 turns the sum itself (at most 8 terms); from 10 on its asymptotic
 * expansion, derived here from Stirling's series for ln Gamma and the Euler-Maclaurin series of
 * sum s ln s (the sum telescopes to 3(N-1)/2 + 2 ln Gamma(N) - (2/N) sum_{s<N} s ln s - N ln N):
 *   B(N) = ln(2 pi) - 3/2 - ln N / (6N) + 2 zeta'(-1) / N + sum_{k>=2} B_2k / (2k (k-1) N^(2k-1)),
 * whose first terms are the series Grover gave (1929); truncated after 1/N^15 its error at N = 10 is
 * below 4e-18 (the next term, 0.38 / N^17). Within 2e-16 of the exact sum for every N
 * (tests/windings/solenoid.test.ts, decimal.js).
 */
export function rosaMutualCorrection(turns: number): number {
  if (turns < EXPANSION_FROM) {
    let sum = 0;
    for (let s = 1; s < turns; s++) sum += (turns - s) * rosaPairCorrection(s);
    countLoop(turns);
    return (2 * sum) / turns;
  }
  const u = 1 / (turns * turns);
  let odd = 0;
  for (let i = B_ODD.length - 1; i >= 0; i--) odd = odd * u + B_ODD[i]!;
  // ln N / N underflows gracefully: for N near 1e308 the terms after the constant are below 1e-305.
  return B_INFINITE - Math.log(turns) / (6 * turns) + (B_ONE_OVER_N + odd * u) / turns;
}

/**
 * Rosa's self-inductance correction A = 5/4 - ln(2 p / d): the self-inductance of one round-wire
 * turn against one band of the current sheet, in units of mu0 a. p = l / N.
 */
function rosaSelfCorrection(turns: number, length: number, wireDiameter: number): number {
  // ln(p / d) >= 0 (the relation d <= p); logOfRatio keeps its digits when p is near d.
  const lnPitchOverDiameter = moderate(length) && moderate(turns) && moderate(wireDiameter)
    ? logOfRatio(length / turns, wireDiameter)
    : Scaled.of(length).div(turns).div(wireDiameter).log();
  return A_TOUCHING - lnPitchOverDiameter;
}

/**
 * N F with F = L_sheet / (mu0 N^2 r), the current sheet of solenoidInductance: pi r K / l for a
 * long coil (K Nagaoka's coefficient), shortCoilFactor for l < r (its pancake limit included).
 * Scaled, so a very long coil's r / l does not underflow before N brings it back.
 */
function turnsTimesSheetFactor(turns: number, radius: number, length: number): Scaled {
  if (length < radius) return Scaled.of(shortCoilFactor(radius, length)).times(turns);
  return Scaled.of(Math.PI * nagaoka(radius, length)).times(radius).div(length).times(turns);
}

/**
 * Inductance of a single-layer solenoid of round wire: the current sheet with Rosa's corrections.
 *
 * L = L_s - mu0 a N (A + B), L in H: L_s = mu0 N^2 pi a^2 K / l the current-sheet inductance
 * (Nagaoka's coefficient K, as solenoidInductance) for N turns of radius a (to the wire centre) over
 * the winding length l = N p (p the pitch), all in m; A = 5/4 - ln(2 p / d) Rosa's correction for the
 * self-inductance of a round wire of diameter d against a band of the sheet, and B(N) his correction
 * for the mutual inductances of the turns (tabulated by Grover 1946, p. 150; here the exact sum below
 * 10 turns and its asymptotic expansion above, within 2e-16 of the sum).
 *
 * Assumptions: uniform current over each wire's section (low frequency: at high frequency the
 * proximity of the turns moves the current and changes the inductance), turns as coaxial circles
 * (the helix's pitch angle neglected), non-magnetic surroundings.
 *
 * Validity: Rosa's corrections treat neighbouring turns as straight parallel wires, so the pitch must
 * be small against the radius; refused when p >= a. Measured here against the sum over N coaxial
 * round-wire loops (Maxwell's mutual inductance and Kirchhoff's ring self-inductance), the result
 * agrees within about 0.05 (p/a)^2: 4e-6 at p = 0.01 a, 0.05 % at 0.1 a, 0.4 % at 0.3 a, 5 % at
 * 0.9 a, for 1 to 30 turns and d / p from 0.1 to 1. A warning above p = 0.3 a. The number of turns
 * and closeness of the wires (d up to p) are not limits: B(N) is exact for any N, and A holds for
 * touching wires at low frequency.
 *
 * Accuracy of the evaluation: a few ulp of the expression with the exact B(N) (the bracket
 * N F - A - B stays above 1 under the relations, so the subtraction loses at most a couple of bits).
 *
 * Reference: E. B. Rosa, "The self and mutual inductances of linear conductors" and "Calculation of
 * the self-inductance of single-layer coils", Bull. Bureau of Standards 2 (1906) (titles and pages
 * from memory); E. B. Rosa and F. W. Grover, Bull. Bureau of Standards 8 (1912) (formulas and tables);
 * F. W. Grover, Inductance Calculations (1946), single-layer coils of round wire, corrections A and B,
 * p. 150 table (page as reproduced).
 *
 * @example
 * solenoidInductanceRoundWire({ turns: 20, radius: quantity(1, "cm"), length: quantity(2, "cm"), wireDiameter: quantity(0.8, "mm") }); // ≈ 5.28 uH
 */
export const solenoidInductanceRoundWire = /* @__PURE__ */ defineFormula({
  id: "solenoidInductanceRoundWire",
  title: "Single-layer solenoid inductance (round wire, Rosa's corrections)",
  category: "winding",
  description:
    "Inductance of a single-layer solenoid of round wire at low frequency: the current-sheet value (Nagaoka) minus Rosa's corrections " +
    "for the self-inductance of round wire (A, from pitch over wire diameter) and for the mutual inductance of discrete turns (B, from the number of turns). " +
    "Turns as coaxial circles; uniform current in each wire.",
  equation: "L = mu0 N^2 pi a^2 K(2a/l) / l - mu0 a N (A + B(N)), A = 5/4 - ln(2 p / d), p = l / N",
  inputs: [
    { name: "turns", ...TURNS, example: 20 },
    { name: "radius", dimension: "Length", description: "Coil radius, axis to wire centre", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length, turns times pitch", domain: POSITIVE, example: 0.02 },
    { name: "wireDiameter", dimension: "Length", description: "Diameter of the bare round wire", domain: POSITIVE, example: 0.8e-3 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance at low frequency" },
  relations: [
    { rule: "wireDiameter <= length / turns (the turns fit side by side)", holds: (x) => x.wireDiameter <= x.length / x.turns },
    { rule: "length / turns < radius (the pitch below the radius, where Rosa's corrections apply)", holds: (x) => x.length / x.turns < x.radius },
  ],
  validity: [
    {
      code: "coarse_pitch",
      when: (x) => x.length / x.turns > COARSE_PITCH * x.radius,
      measure: (x) => cappedRatio(x.length / x.turns, COARSE_PITCH * x.radius),
      message: (x) =>
        `the pitch is ${formatNumber(x.length / x.turns / x.radius, 3)} of the radius: Rosa's corrections treat neighbouring turns as straight wires, ` +
        "and against the sum over coaxial round-wire loops the result differs by about 0.4 % at 0.3 and 5 % at 0.9 of the radius (measured here); sum the loops instead",
    },
  ],
  source: [
    { authors: "E. B. Rosa", year: 1906, title: "Calculation of the self-inductance of single-layer coils, Bull. Bureau of Standards 2", locator: "corrections A (wire size and spacing) and B (number of turns) to the current sheet (title and volume from memory)" },
    { authors: "E. B. Rosa, F. W. Grover", year: 1912, title: "Formulas and tables for the calculation of mutual and self-inductance, Bull. Bureau of Standards 8", locator: "single-layer coils, tables of A and B (from memory)" },
    { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations (Van Nostrand)", locator: "single-layer coils of round wire, L = L_s - 0.004 pi a N (A + B), table of B p. 150" },
  ],
  // mu0 a N [N F - A - B]: the bracket from the dimensionless parts (no cancellation to speak of:
  // N F exceeds A + B by 1 or more under the relations), then a scaled product. Where N F is
  // beyond 2^75, A + B (|A + B| < 2^11) cannot change it.
  compute: (x) => {
    const nf = turnsTimesSheetFactor(x.turns, x.radius, x.length);
    const correction = rosaSelfCorrection(x.turns, x.length, x.wireDiameter) + rosaMutualCorrection(x.turns);
    const bracket = nf.e > 75 ? nf : Scaled.of(nf.toNumber() - correction);
    return Scaled.of(MU0).times(x.radius).times(x.turns).times(bracket).toNumber();
  },
});
