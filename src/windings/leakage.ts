import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber, formatPercent } from "../core/format.js";
import { NON_NEGATIVE, POSITIVE, TURNS } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate } from "../math/scaled.js";

/**
 * Total radial width (both builds and the spacing) over the winding height above which the
 * one-dimensional field is warned: Rogowski's factor 1 - (1 - e^(-pi h / w)) w / (pi h) is then
 * below 0.95 (the MMF-diagram result is 5 % or more high).
 */
const WIDE_WINDINGS = 0.157;

/** Rogowski's factor for a total radial width w over a winding height h (ratio r = w / h > 0). */
export function rogowskiFactor(widthOverHeight: number): number {
  const r = widthOverHeight;
  // -expm1(-pi/r) = 1 - e^(-pi/r), kept to its digits for large r; for r beyond the doubles' range the factor is 0.
  return 1 + (Math.expm1(-Math.PI / r) * r) / Math.PI;
}

function widthOverHeight(x: { innerBuild: number; outerBuild: number; spacing: number; windingHeight: number }): number {
  // Each part over the height first, so no sum of lengths overflows.
  return x.innerBuild / x.windingHeight + x.outerBuild / x.windingHeight + x.spacing / x.windingHeight;
}

/**
 * Leakage inductance of two concentric layered windings, from the MMF diagram.
 *
 * L = mu0 N^2 MLT (a1 / 3 + a2 / 3 + g) / h, L in H referred to the winding of N turns: MLT the mean
 * length of a turn (over both windings) in m, h the height of the windings along the core leg in m,
 * a1 and a2 the radial builds of the inner and outer winding and g the radial spacing between them,
 * in m. The leakage field between the windings is axial and uniform over h; it rises linearly across
 * each winding (hence the thirds: the energy of a field growing from 0 across a build) and is flat
 * across the spacing. Refer to the other winding by (N2 / N1)^2.
 *
 * Assumptions: both windings have the same height h and carry balanced ampere-turns; a core of
 * infinite permeability; low frequency (uniform current in the conductors; at high frequency the
 * field inside the windings falls and so does the leakage); the field's end effects neglected.
 *
 * Validity: where the total radial width w = a1 + a2 + g is not small against h, the field fringes
 * at the winding ends and the result is high by about 1 / K_R, Rogowski's factor
 * K_R = 1 - (1 - e^(-pi h / w)) w / (pi h) (e.g. S. V. Kulkarni and S. A. Khaparde, Transformer
 * Engineering (2004), ch. 3; from memory). A warning when K_R is below 0.95 (w above 0.157 h), with
 * the factor.
 *
 * Accuracy: within 4 ulp (a scaled product; the builds and spacing are summed as positive terms).
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), winding
 * capacitance and leakage inductance, L = (4 pi MLT N^2 / b)(c + (a1 + a2) / 3) 1e-9 H in cm (chapter
 * and equation number from memory); the same MMF-diagram result in M. K. Kazimierczuk, High-Frequency
 * Magnetic Components (2009) (from memory).
 *
 * @example
 * leakageInductance({ turns: 40, meanTurnLength: quantity(8, "cm"), windingHeight: quantity(25, "mm"), innerBuild: quantity(1.5, "mm"), outerBuild: quantity(1.5, "mm"), spacing: quantity(0.5, "mm") }); // ≈ 9.65 uH
 */
export const leakageInductance = /* @__PURE__ */ defineFormula({
  id: "leakageInductance",
  title: "Leakage inductance of two concentric windings",
  category: "winding",
  description:
    "Leakage inductance of two concentric layered windings of equal height from the MMF diagram (uniform axial leakage field, " +
    "rising linearly across each winding's build and flat across the spacing), referred to the winding whose turns are given. " +
    "Low frequency; core permeability taken as infinite.",
  equation: "L = mu0 N^2 MLT (a1/3 + a2/3 + g) / h",
  inputs: [
    { name: "turns", ...TURNS, description: "Number of turns of the winding the result is referred to", example: 40 },
    { name: "meanTurnLength", dimension: "Length", description: "Mean length of one turn, over both windings", domain: POSITIVE, example: 0.08 },
    { name: "windingHeight", dimension: "Length", description: "Height of the windings along the core leg (both the same)", domain: POSITIVE, example: 0.025 },
    { name: "innerBuild", dimension: "Length", description: "Radial build (thickness) of the inner winding", domain: POSITIVE, example: 1.5e-3 },
    { name: "outerBuild", dimension: "Length", description: "Radial build (thickness) of the outer winding", domain: POSITIVE, example: 1.5e-3 },
    { name: "spacing", dimension: "Length", description: "Radial distance between the two windings (insulation and clearance)", domain: NON_NEGATIVE, example: 0.5e-3 },
  ],
  output: { dimension: "Inductance", description: "Leakage inductance referred to the given winding" },
  validity: [
    {
      code: "wide_windings",
      when: (x) => widthOverHeight(x) > WIDE_WINDINGS,
      measure: (x) => cappedRatio(widthOverHeight(x), WIDE_WINDINGS),
      message: (x) => {
        const k = rogowskiFactor(widthOverHeight(x));
        return (
          `the builds and spacing together are ${formatNumber(widthOverHeight(x), 3)} of the winding height: the leakage field fringes at the winding ends ` +
          `and the MMF-diagram result is high by about ${formatPercent(cappedRatio(1, k) - 1)} (Rogowski's factor ${formatNumber(k, 3)}; from memory); ` +
          "multiply by the factor or use a two-dimensional field calculation"
        );
      },
    },
  ],
  source: [
    {
      authors: "C. W. T. McLyman",
      year: 2004,
      title: "Transformer and Inductor Design Handbook, 3rd ed.",
      locator: "winding capacitance and leakage inductance, L = (4 pi MLT N^2 / b)(c + (a1 + a2)/3) 1e-9 H, lengths in cm (chapter and equation from memory)",
    },
    { authors: "M. K. Kazimierczuk", year: 2009, title: "High-Frequency Magnetic Components (Wiley)", locator: "leakage inductance of concentric windings from the MMF diagram (from memory)" },
    { authors: "S. V. Kulkarni, S. A. Khaparde", year: 2004, title: "Transformer Engineering (Marcel Dekker)", locator: "ch. 3, Rogowski's factor for the end fringing (from memory)" },
  ],
  // a1/3 + a2/3 + g as (a1 + a2)/3 + g of non-negative terms (no cancellation), then mu0 N^2 MLT (...) / h:
  // plain while every factor is moderate, otherwise held as mantissa and exponent (no overflow of N^2 or the sum).
  compute: (x) => {
    const N = x.turns;
    if (moderate(N) && moderate(x.meanTurnLength) && moderate(x.windingHeight) && moderate(x.innerBuild) && moderate(x.outerBuild) && moderate(x.spacing)) {
      return (MU0 * N * N * x.meanTurnLength * ((x.innerBuild + x.outerBuild) / 3 + x.spacing)) / x.windingHeight;
    }
    const width = Scaled.of(x.innerBuild).plus(x.outerBuild).div(3).plus(x.spacing);
    return Scaled.of(MU0).times(N).times(N).times(x.meanTurnLength).times(width).div(x.windingHeight).toNumber();
  },
});
