import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate, scaledProduct } from "../math/scaled.js";
import { nagaoka, nagaokaScaled, shortCoilFactor } from "./shared.js";

const NAGAOKA_SOURCE = {
  authors: "H. Nagaoka",
  year: 1909,
  title: "The inductance coefficients of solenoids, J. Coll. Sci. Tokyo 27, art. 6",
  locator: "eq. for the coefficient K; tabulated in F. W. Grover, Inductance Calculations (1946), single-layer coils (from memory)",
} as const;

const WHEELER_1928 = {
  authors: "H. A. Wheeler",
  year: 1928,
  title: "Simple inductance formulas for radio coils, Proc. IRE 16(10), 1398-1400 (volume and pages from memory)",
} as const;

/** One inch in metres (exact), for Wheeler's published inch coefficients. */
const INCH = 0.0254;
/** Wheeler's coefficients in SI: 1e-7 H per 0.0254 m (single layer), 0.8e-6 H per 0.0254 m (multilayer). */
const WHEELER_SINGLE = 1e-7 / INCH;
const WHEELER_MULTI = 0.8e-6 / INCH;

/**
 * Nagaoka's coefficient: the ratio of a finite cylindrical current sheet's
 * inductance to that of the same sheet cut from an infinitely long one.
 *
 * K = 4/(3 pi k') [ (k'^2/k^2)(K(k) - E(k)) + E(k) - k ], k = 2r/sqrt(4r^2 + l^2),
 * k' = l/sqrt(4r^2 + l^2); r the coil radius in m, l the winding length in m;
 * K(k), E(k) complete elliptic integrals. Dimensionless, 0 < K < 1.
 *
 * Exact for a uniform current sheet. Computed without cancellation for very
 * long and very short coils (see `nagaoka` in shared.ts); a coefficient below
 * the normal range comes back subnormal, and below 2^-1074 (length/radius below
 * about 2e-326) it is `out_of_range`.
 *
 * Reference: Nagaoka (1909); Grover, Inductance Calculations (1946), single-layer
 * coils (locators from memory).
 *
 * @example
 * nagaokaCoefficient({ radius: quantity(1, "cm"), length: quantity(2, "cm") }); // ≈ 0.6884
 */
export const nagaokaCoefficient = /* @__PURE__ */ defineFormula({
  id: "nagaokaCoefficient",
  title: "Nagaoka coefficient",
  category: "inductance",
  description: "Correction factor K (0 < K < 1) for a finite single-layer solenoid (current sheet) relative to the long-solenoid formula.",
  equation: "K = 4/(3 pi k') [ (k'^2/k^2)(K(k) - E(k)) + E(k) - k ], k^2 = 4r^2/(4r^2 + l^2)",
  inputs: [
    { name: "radius", dimension: "Length", description: "Coil radius (to the wire centre)", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 0.02 },
  ],
  output: { dimension: "Dimensionless", description: "Nagaoka coefficient" },
  source: NAGAOKA_SOURCE,
  compute: (x) => nagaokaScaled(x.radius, x.length).toNumber(),
});

/**
 * Inductance of a single-layer solenoid treated as a uniform current sheet.
 *
 * L = mu0 N^2 pi r^2 K / l, with N turns, r the radius and l the length in m,
 * K Nagaoka's coefficient, mu0 in H/m (CODATA 2022); L in H.
 *
 * Exact for a current sheet; a real winding of round wire differs by Rosa's
 * correction for the wire's size and spacing (below 1-2 % for closely wound
 * coils of many turns). Low-frequency current distribution assumed.
 *
 * Reference: Nagaoka (1909); Grover, Inductance Calculations (1946), single-layer
 * coils (locators from memory).
 *
 * @example
 * solenoidInductance({ turns: 100, radius: quantity(1, "cm"), length: quantity(2, "cm") }); // ≈ 136 µH
 */
export const solenoidInductance = /* @__PURE__ */ defineFormula({
  id: "solenoidInductance",
  title: "Single-layer solenoid inductance (current sheet)",
  category: "inductance",
  description: "Inductance of a finite single-layer solenoid as a uniform cylindrical current sheet, exact through Nagaoka's coefficient, for any length-to-diameter ratio.",
  equation: "L = mu0 N^2 pi r^2 K(2r/l) / l",
  inputs: [
    { name: "turns", ...TURNS, example: 100 },
    { name: "radius", dimension: "Length", description: "Coil radius (to the wire centre)", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 0.02 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  validity: [
    {
      code: "few_turns",
      when: (x) => x.turns < 10,
      measure: (x) => 10 / x.turns,
      message: (x) => `${x.turns} turns: a sparse winding is not a uniform current sheet; Rosa's wire-size correction is no longer small`,
    },
  ],
  source: NAGAOKA_SOURCE,
  // L = mu0 N^2 r F with F = pi r K / l. For a short coil F comes from
  // shortCoilFactor (ln(8r/l) - 1/2 in the pancake limit, where r/l would
  // overflow and K underflow); for a long one r/l <= 1 and K is in (0.7, 1].
  // Plain products while the magnitudes are moderate, scaled otherwise.
  compute: (x) => {
    const N = x.turns;
    const r = x.radius;
    const l = x.length;
    if (l < r) {
      const F = shortCoilFactor(r, l); // in [0.79, 1500]
      return moderate(N) && moderate(r) ? MU0 * N * N * r * F : scaledProduct([MU0, N, N, r, F]);
    }
    const K = nagaoka(r, l);
    if (moderate(N) && moderate(r) && moderate(l)) return MU0 * Math.PI * N * N * r * (r / l) * K;
    return Scaled.of(MU0 * Math.PI).times(N).times(N).times(r).times(r).times(K).div(l).toNumber();
  },
});

/**
 * Inductance of an ideal (infinitely long) solenoid, applied to a length l.
 *
 * L = mu0 N^2 pi r^2 / l, with N turns, r and l in m; L in H.
 *
 * Overestimates a real coil by the factor 1/K (Nagaoka): about 0.85 r/l
 * relative for long coils; a warning gives the error when above 1 %. Scaled
 * for extreme magnitudes: every representable result to a few ulp,
 * `out_of_range` beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Reference: any electromagnetics text, e.g. D. J. Griffiths, Introduction to
 * Electrodynamics, 4th ed. (Pearson, 2013), ch. 7 (from memory).
 *
 * @example
 * longSolenoidInductance({ turns: 1000, radius: quantity(1, "cm"), length: quantity(1, "m") }); // ≈ 395 µH
 */
export const longSolenoidInductance = /* @__PURE__ */ defineFormula({
  id: "longSolenoidInductance",
  title: "Long-solenoid inductance",
  category: "inductance",
  description: "Inductance of a solenoid from the infinitely long solenoid's uniform field; end effects neglected.",
  equation: "L = mu0 N^2 pi r^2 / l",
  inputs: [
    { name: "turns", ...TURNS, example: 1000 },
    { name: "radius", dimension: "Length", description: "Coil radius", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  validity: [
    {
      code: "short_coil",
      when: (x) => overestimate(x) > 0.01,
      measure: (x) => overestimate(x),
      message: (x) =>
        `coil is not long (length/radius = ${(x.length / x.radius).toPrecision(3)}): this overestimates the current-sheet inductance by ${formatPercent(overestimate(x))} (Nagaoka); use solenoidInductance`,
    },
  ],
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson)", locator: "ch. 7, inductance of a long solenoid (from memory)" },
  compute: (x) => {
    const N = x.turns;
    const r = x.radius;
    const l = x.length;
    if (moderate(N) && moderate(r) && moderate(l)) return MU0 * N * N * Math.PI * r * (r / l);
    return Scaled.of(MU0 * Math.PI).times(N).times(N).times(r).times(r).div(l).toNumber();
  },
});

/**
 * How much the long-solenoid formula overestimates the current sheet: 1/K - 1,
 * as (1 - K)/K. For very flat coils K underflows and the overestimate is then
 * reported as the largest double (it is beyond any useful figure).
 */
function overestimate(x: { radius: number; length: number }): number {
  const K = nagaoka(x.radius, x.length);
  return K >= 1e-300 ? (1 - K) / K : Number.MAX_VALUE;
}

function formatPercent(f: number): string {
  return f < 1e6 ? `${(100 * f).toPrecision(3)} %` : `a factor of ${f.toPrecision(3)}`;
}

/**
 * Wheeler's approximate inductance of a single-layer air-core coil.
 *
 * L = r^2 N^2 / (9 r + 10 l) microhenry with r, l in inches (Wheeler 1928);
 * in SI L = (1e-7 H / 0.0254 m) N^2 r^2 / (l + 0.9 r), r the radius and l the
 * length in m, N turns; L in H. Coefficients as published, inch converted exactly.
 *
 * Stated accuracy: within 1 % for l > 0.8 r (measured here against the exact
 * current sheet: within 0.6 % over that range).
 *
 * Reference: H. A. Wheeler, Proc. IRE 16 (1928) 1398, single-layer formula (from memory).
 *
 * @example
 * wheelerSolenoidInductance({ turns: 100, radius: quantity(1, "cm"), length: quantity(2, "cm") }); // ≈ 135 µH
 */
export const wheelerSolenoidInductance = /* @__PURE__ */ defineFormula({
  id: "wheelerSolenoidInductance",
  title: "Single-layer coil inductance (Wheeler)",
  category: "inductance",
  description: "Wheeler's simple approximation for a single-layer air-core coil; within 1 % when the length exceeds 0.8 radius.",
  equation: "L = (1e-7 H/0.0254 m) N^2 r^2 / (l + 0.9 r)",
  inputs: [
    { name: "turns", ...TURNS, example: 100 },
    { name: "radius", dimension: "Length", description: "Coil radius (to the wire centre)", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 0.02 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  validity: [
    {
      code: "short_coil",
      when: (x) => x.length <= 0.8 * x.radius,
      measure: (x) => cappedRatio(0.8 * x.radius, x.length),
      message: (x) =>
        `length/radius = ${(x.length / x.radius).toPrecision(3)} is below 0.8: Wheeler's stated 1 % accuracy no longer applies; use solenoidInductance`,
    },
  ],
  source: { ...WHEELER_1928, locator: "formula for single-layer coils (from memory)" },
  // Plain while the magnitudes are moderate; otherwise the numerator and the
  // sum in the denominator are scaled (no r^2 or l + 0.9 r to overflow).
  compute: (x) => {
    const N = x.turns;
    const r = x.radius;
    const l = x.length;
    if (moderate(N) && moderate(r) && moderate(l)) return (WHEELER_SINGLE * N * N * r * r) / (l + 0.9 * r);
    const den = Scaled.of(l).plus(Scaled.of(r).times(0.9));
    return Scaled.of(WHEELER_SINGLE).times(N).times(N).times(r).times(r).div(den).toNumber();
  },
});

/**
 * Wheeler's approximate inductance of a multilayer air-core coil of
 * rectangular winding section.
 *
 * L = 0.8 a^2 N^2 / (6 a + 9 b + 10 c) microhenry with a the mean radius, b the
 * winding length and c the winding depth in inches (Wheeler 1928); in SI
 * L = (0.8e-6 H / 0.0254 m) N^2 a^2 / (6a + 9b + 10c), lengths in m, L in H.
 *
 * Stated accuracy: about 1 % when the three terms 6a, 9b and 10c are roughly
 * equal; a warning is given when they differ by more than a factor of 3.
 *
 * Reference: H. A. Wheeler, Proc. IRE 16 (1928) 1398, multilayer formula (from memory).
 *
 * @example
 * multilayerCoilInductance({ turns: 200, meanRadius: quantity(1, "cm"), length: quantity(1, "cm"), depth: quantity(6, "mm") }); // ≈ 600 µH
 */
export const multilayerCoilInductance = /* @__PURE__ */ defineFormula({
  id: "multilayerCoilInductance",
  title: "Multilayer coil inductance (Wheeler)",
  category: "inductance",
  description: "Wheeler's approximation for a multilayer air-core coil of rectangular winding section; about 1 % when 6a, 9b and 10c are comparable.",
  equation: "L = (0.8e-6 H/0.0254 m) N^2 a^2 / (6a + 9b + 10c)",
  inputs: [
    { name: "turns", ...TURNS, example: 200 },
    { name: "meanRadius", dimension: "Length", description: "Mean radius of the winding", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length (axial)", domain: POSITIVE, example: 0.01 },
    { name: "depth", dimension: "Length", description: "Winding depth (radial build)", domain: POSITIVE, example: 0.006 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [
    { rule: "depth < 2 meanRadius (the winding's inner radius meanRadius - depth/2 must be positive)", holds: (x) => x.depth < 2 * x.meanRadius },
  ],
  validity: [
    {
      code: "unbalanced_shape",
      when: (x) => imbalance(x) > 3,
      measure: (x) => imbalance(x),
      message: (x) =>
        `the terms 6a = ${(6 * x.meanRadius).toPrecision(3)} m, 9b = ${(9 * x.length).toPrecision(3)} m, 10c = ${(10 * x.depth).toPrecision(3)} m differ by more than a factor of 3: Wheeler's stated ~1 % accuracy holds when they are about equal`,
    },
  ],
  source: { ...WHEELER_1928, locator: "formula for multilayer coils (from memory)" },
  compute: (x) => {
    const N = x.turns;
    const a = x.meanRadius;
    const b = x.length;
    const c = x.depth;
    if (moderate(N) && moderate(a) && moderate(b) && moderate(c)) return (WHEELER_MULTI * N * N * a * a) / (6 * a + 9 * b + 10 * c);
    const den = Scaled.of(a).times(6).plus(Scaled.of(b).times(9)).plus(Scaled.of(c).times(10));
    return Scaled.of(WHEELER_MULTI).times(N).times(N).times(a).times(a).div(den).toNumber();
  },
});

/** The largest of Wheeler's terms 6a, 9b, 10c over the smallest (ratios, so no term overflows). */
function imbalance(x: { meanRadius: number; length: number; depth: number }): number {
  const t = [6 * (x.meanRadius / x.depth), 9 * (x.length / x.depth), 10];
  return cappedRatio(Math.max(...t), Math.min(...t));
}
