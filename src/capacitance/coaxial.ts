import { EPSILON0 } from "../constants/si.js";
import { formatPercent } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { logOfRatio } from "../math/ratios.js";
import { mulDiv } from "../math/scaled.js";
import { RELATIVE_PERMITTIVITY } from "./shared.js";

const TWO_PI_EPSILON0 = 2 * Math.PI * EPSILON0;

/**
 * Capacitance of a coaxial line: a round inner conductor inside a concentric
 * round outer conductor, the dielectric filling the space between them.
 *
 * C = 2 pi eps0 epsr l / ln(b / a), with C in F, a the inner conductor's
 * (outer) radius in m, b the outer conductor's inner radius in m, l the length
 * in m, epsr the dielectric's relative permittivity, eps0 in F/m (CODATA 2022).
 *
 * Validity: exact for an infinitely long line (per unit length); the open ends
 * of a short piece add fringing capacitance of relative size about
 * (b - a) / l, which is warned about above 1 %.
 *
 * Method: ln(b / a) is computed as log1p((b - a) / a) when b <= 2a, with b - a
 * exact, so a thin dielectric (b within 1e-9 of a) keeps full precision.
 *
 * Reference: D. M. Pozar, Microwave Engineering, 4th ed. (2012), Table 2.1 (table from memory).
 *
 * @example
 * coaxialCapacitance({ innerRadius: quantity(0.45, "mm"), outerRadius: quantity(1.47, "mm"),
 *   length: quantity(1, "m"), relativePermittivity: 2.25 }); // ≈ 1.06e-10 F
 */
export const coaxialCapacitance = /* @__PURE__ */ defineFormula({
  id: "coaxialCapacitance",
  title: "Coaxial capacitance",
  category: "capacitance",
  description:
    "Capacitance between the inner and outer conductors of a coaxial line filled with one dielectric; end effects neglected.",
  equation: "C = 2 pi eps0 epsr l / ln(b / a)",
  inputs: [
    { name: "innerRadius", dimension: "Length", description: "Radius of the inner conductor", domain: POSITIVE, example: 4.5e-4 },
    { name: "outerRadius", dimension: "Length", description: "Inner radius of the outer conductor (shield)", domain: POSITIVE, example: 1.47e-3 },
    { name: "length", dimension: "Length", description: "Length of the line", domain: POSITIVE, example: 1 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Capacitance between the conductors" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  validity: [
    {
      code: "end_effects",
      // Fringing at each open end is of order eps (b - a) per end (common practice).
      when: (x) => x.outerRadius - x.innerRadius > 0.01 * x.length,
      measure: (x) => (x.outerRadius - x.innerRadius) / x.length,
      message: (x) =>
        `the gap between the conductors is ${formatPercent((x.outerRadius - x.innerRadius) / x.length)} of the length; fringing at the open ends adds capacitance of about that relative size, which this formula neglects (common practice)`,
    },
  ],
  source: { authors: "D. M. Pozar", year: 2012, title: "Microwave Engineering, 4th ed.", locator: "Table 2.1 (coaxial line) (from memory)" },
  // logOfRatio keeps digits for b near a; mulDiv keeps extreme lengths from
  // overflowing or underflowing in an intermediate product.
  compute: (x) =>
    mulDiv(TWO_PI_EPSILON0, x.relativePermittivity, x.length, logOfRatio(x.outerRadius, x.innerRadius)),
});
