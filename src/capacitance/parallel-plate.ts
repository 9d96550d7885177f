import { EPSILON0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatPercent } from "../core/format.js";
import { POSITIVE } from "../core/spec.js";
import { mulDiv } from "../math/scaled.js";
import { RELATIVE_PERMITTIVITY } from "./shared.js";

/**
 * Capacitance of two parallel plates with the field confined between them.
 *
 * C = eps0 * epsr * A / d, with C in F, A the plate area in m^2, d the gap in m,
 * epsr the relative permittivity of the dielectric, eps0 in F/m (CODATA 2022).
 *
 * Validity: fringing at the plate edges is neglected; the error grows as the gap
 * approaches the plate's width (warning when d exceeds 1 % of sqrt(A)).
 *
 * Reference: any electromagnetics text, e.g. D. J. Griffiths, Introduction to
 * Electrodynamics, 4th ed. (2013), Sec. 2.5.4 (section from memory).
 *
 * @example
 * parallelPlateCapacitance({ area: quantity(1, "cm^2"), gap: quantity(0.1, "mm") }); // ≈ 8.854e-12 F
 */
export const parallelPlateCapacitance = /* @__PURE__ */ defineFormula({
  id: "parallelPlateCapacitance",
  title: "Parallel-plate capacitance",
  category: "capacitance",
  description: "Capacitance of two parallel conducting plates of equal area, fringing neglected.",
  equation: "C = eps0 * epsr * A / d",
  inputs: [
    { name: "area", dimension: "Area", description: "Area of one plate (overlap area)", domain: POSITIVE, example: 1e-4 },
    { name: "gap", dimension: "Length", description: "Distance between the plates", domain: POSITIVE, example: 1e-4 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Capacitance" },
  validity: [
    {
      code: "fringing",
      // Edge fields add roughly (d / w) * ln(w / d) relative capacitance (common practice);
      // past d = 1 % of the plate size that is above a few per cent.
      when: (x) => x.gap > 0.01 * Math.sqrt(x.area),
      measure: (x) => x.gap / Math.sqrt(x.area),
      message: (x) =>
        `gap is ${formatPercent(x.gap / Math.sqrt(x.area))} of the plate size; fringing adds capacitance this formula neglects (above about 1 % it is no longer small)`,
    },
  ],
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.", locator: "Sec. 2.5.4, Capacitors (from memory)" },
  // mulDiv: a tiny area or huge gap must not underflow in an intermediate product.
  compute: (x) => mulDiv(EPSILON0, x.relativePermittivity, x.area, x.gap),
});
