import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { nagaoka } from "./shared.js";

const NAGAOKA_SOURCE = {
  authors: "H. Nagaoka",
  year: 1909,
  title: "The inductance coefficients of solenoids, J. Coll. Sci. Tokyo 27, art. 6",
  locator: "eq. for the coefficient K; tabulated in F. W. Grover, Inductance Calculations (1946), single-layer coils",
} as const;

const WHEELER_1928 = {
  authors: "H. A. Wheeler",
  year: 1928,
  title: "Simple inductance formulas for radio coils, Proc. IRE 16(10), 1398-1400",
} as const;

/** One inch in metres (exact), for Wheeler's published inch coefficients. */
const INCH = 0.0254;

/**
 * Nagaoka's coefficient: the ratio of a finite cylindrical current sheet's
 * inductance to that of the same sheet cut from an infinitely long one.
 *
 * K = 4/(3 pi k') [ (k'^2/k^2)(K(k) - E(k)) + E(k) - k ], k = 2r/sqrt(4r^2 + l^2),
 * k' = l/sqrt(4r^2 + l^2); r the coil radius in m, l the winding length in m;
 * K(k), E(k) complete elliptic integrals. Dimensionless, 0 < K < 1.
 *
 * Exact for a uniform current sheet. Computed without cancellation for very
 * long and very short coils (see `nagaoka` in shared.ts).
 *
 * Reference: Nagaoka (1909); Grover, Inductance Calculations (1946), single-layer coils.
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
  compute: (x) => nagaoka(x.radius, x.length),
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
 * Reference: Nagaoka (1909); Grover, Inductance Calculations (1946), single-layer coils.
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
      message: (x) => `${x.turns} turns: a sparse winding is not a uniform current sheet; Rosa's wire-size correction is no longer small`,
    },
  ],
  source: NAGAOKA_SOURCE,
  // (pi r)(r / l) keeps r^2 from overflowing or underflowing before the division.
  compute: (x) => MU0 * x.turns * x.turns * Math.PI * x.radius * (x.radius / x.length) * nagaoka(x.radius, x.length),
});

/**
 * Inductance of an ideal (infinitely long) solenoid, applied to a length l.
 *
 * L = mu0 N^2 pi r^2 / l, with N turns, r and l in m; L in H.
 *
 * Overestimates a real coil by the factor 1/K (Nagaoka): about 0.85 r/l
 * relative for long coils; a warning gives the error when above 1 %.
 *
 * Reference: any electromagnetics text, e.g. D. J. Griffiths, Introduction to
 * Electrodynamics, 4th ed. (2017), sec. 7.2.3.
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
      when: (x) => 1 / nagaoka(x.radius, x.length) - 1 > 0.01,
      message: (x) =>
        `coil is not long (length/radius = ${(x.length / x.radius).toPrecision(3)}): this overestimates the current-sheet inductance by ${(100 * (1 / nagaoka(x.radius, x.length) - 1)).toPrecision(3)} % (Nagaoka); use solenoidInductance`,
    },
  ],
  source: { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "sec. 7.2.3 (inductance), long solenoid" },
  compute: (x) => MU0 * x.turns * x.turns * Math.PI * x.radius * (x.radius / x.length),
});

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
 * Reference: H. A. Wheeler, Proc. IRE 16 (1928) 1398, single-layer formula.
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
      message: (x) =>
        `length/radius = ${(x.length / x.radius).toPrecision(3)} is below 0.8: Wheeler's stated 1 % accuracy no longer applies; use solenoidInductance`,
    },
  ],
  source: { ...WHEELER_1928, locator: "formula for single-layer coils" },
  compute: (x) => ((1e-7 / INCH) * x.turns * x.turns * x.radius * x.radius) / (x.length + 0.9 * x.radius),
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
 * Reference: H. A. Wheeler, Proc. IRE 16 (1928) 1398, multilayer formula.
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
      when: (x) => {
        const t = [6 * x.meanRadius, 9 * x.length, 10 * x.depth];
        return Math.max(...t) > 3 * Math.min(...t);
      },
      message: (x) =>
        `the terms 6a = ${(6 * x.meanRadius).toPrecision(3)} m, 9b = ${(9 * x.length).toPrecision(3)} m, 10c = ${(10 * x.depth).toPrecision(3)} m differ by more than a factor of 3: Wheeler's stated ~1 % accuracy holds when they are about equal`,
    },
  ],
  source: { ...WHEELER_1928, locator: "formula for multilayer coils" },
  compute: (x) =>
    ((0.8e-6 / INCH) * x.turns * x.turns * x.meanRadius * x.meanRadius) / (6 * x.meanRadius + 9 * x.length + 10 * x.depth),
});
