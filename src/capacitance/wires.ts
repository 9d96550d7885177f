import { EPSILON0 } from "../constants/si.js";
import { formatPercent } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { acoshOfRatio } from "../math/ratios.js";
import { mulDiv } from "../math/scaled.js";
import { RELATIVE_PERMITTIVITY } from "./shared.js";

const PI_EPSILON0 = Math.PI * EPSILON0;
const TWO_PI_EPSILON0 = 2 * Math.PI * EPSILON0;

const DIELECTRIC_NOTE =
  "relativePermittivity is taken to fill all the space around the conductors; for insulated wires in air the effective value lies between 1 and the insulation's and must be estimated separately (common practice)";

/**
 * Capacitance between two parallel round wires (a two-wire line).
 *
 * C = pi eps0 epsr l / acosh(D / (2a)), with C in F, a the wire radius in m,
 * D the centre-to-centre separation in m, l the length in m, epsr the relative
 * permittivity of the surrounding medium, eps0 in F/m (CODATA 2022).
 *
 * Validity: exact for infinitely long wires in a uniform medium, proximity
 * effect included (no thin-wire assumption; for D >> a it tends to
 * pi eps0 epsr l / ln(D / a)). The ends of a short pair add fringing of
 * relative size about D / l, warned about above 1 %.
 *
 * Method: acosh(1 + s) = log1p(s + sqrt(s (2 + s))) with s = (D - 2a) / (2a)
 * formed from the exact difference (Sterbenz lemma), so nearly touching wires
 * keep full precision.
 *
 * Reference: D. M. Pozar, Microwave Engineering, 4th ed. (2012), Table 2.1 (two-wire line; table from memory).
 *
 * @example
 * twoWireCapacitance({ wireRadius: quantity(0.5, "mm"), separation: quantity(5, "mm"),
 *   length: quantity(1, "m") }); // ≈ 1.21e-11 F
 */
export const twoWireCapacitance = /* @__PURE__ */ defineFormula({
  id: "twoWireCapacitance",
  title: "Two-wire line capacitance",
  category: "capacitance",
  description:
    "Capacitance between two parallel round wires of equal radius in a uniform dielectric; exact for long wires, end effects neglected.",
  equation: "C = pi eps0 epsr l / acosh(D / (2 a))",
  inputs: [
    { name: "wireRadius", dimension: "Length", description: "Radius of each wire", domain: POSITIVE, example: 5e-4 },
    { name: "separation", dimension: "Length", description: "Distance between the wire axes (centre to centre)", domain: POSITIVE, example: 5e-3 },
    { name: "length", dimension: "Length", description: "Length of the wire pair", domain: POSITIVE, example: 1 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Capacitance between the two wires" },
  // 2a is exact (or overflows to Infinity, which fails correctly since D is finite).
  relations: [{ rule: "wireRadius < separation / 2", holds: (x) => 2 * x.wireRadius < x.separation }],
  validity: [
    {
      code: "end_effects",
      when: (x) => x.separation > 0.01 * x.length,
      measure: (x) => x.separation / x.length,
      message: (x) =>
        `the separation is ${formatPercent(x.separation / x.length)} of the length; fringing at the ends adds capacitance of about that relative size, which this formula neglects (common practice)`,
    },
    { code: "dielectric", when: (x) => x.relativePermittivity > 1, measure: (x) => x.relativePermittivity, message: DIELECTRIC_NOTE },
  ],
  source: { authors: "D. M. Pozar", year: 2012, title: "Microwave Engineering, 4th ed.", locator: "Table 2.1 (two-wire line) (from memory)" },
  // acoshOfRatio: digits kept for nearly touching wires; mulDiv: no intermediate overflow.
  compute: (x) =>
    mulDiv(PI_EPSILON0, x.relativePermittivity, x.length, acoshOfRatio(x.separation, 2 * x.wireRadius)),
});

/**
 * Capacitance between a round wire and a parallel conducting ground plane.
 *
 * C = 2 pi eps0 epsr l / acosh(h / a), with C in F, a the wire radius in m,
 * h the height of the wire's axis above the plane in m, l the length in m,
 * epsr the relative permittivity of the surrounding medium, eps0 in F/m
 * (CODATA 2022).
 *
 * Validity: exact for an infinitely long wire over an infinite plane in a
 * uniform medium (the plane must extend several heights beyond the wire);
 * for h >> a it tends to 2 pi eps0 epsr l / ln(2h / a). The ends of a short
 * wire add fringing of relative size about h / l, warned about above 1 %.
 *
 * Method: the method of images turns this into half of a two-wire line of
 * separation 2h; acosh(1 + s) with s = (h - a) / a from the exact difference,
 * so a wire nearly touching the plane keeps full precision.
 *
 * Reference: D. M. Pozar, Microwave Engineering, 4th ed. (2012), Table 2.1
 * (two-wire line; table from memory), with the wire's image in the plane.
 *
 * @example
 * wireOverPlaneCapacitance({ wireRadius: quantity(0.5, "mm"), height: quantity(10, "mm"),
 *   length: quantity(1, "m") }); // ≈ 1.51e-11 F
 */
export const wireOverPlaneCapacitance = /* @__PURE__ */ defineFormula({
  id: "wireOverPlaneCapacitance",
  title: "Wire-over-ground-plane capacitance",
  category: "capacitance",
  description:
    "Capacitance between a round wire and a parallel infinite conducting plane in a uniform dielectric; exact for a long wire, end effects neglected.",
  equation: "C = 2 pi eps0 epsr l / acosh(h / a)",
  inputs: [
    { name: "wireRadius", dimension: "Length", description: "Radius of the wire", domain: POSITIVE, example: 5e-4 },
    { name: "height", dimension: "Length", description: "Distance from the wire's axis to the ground plane", domain: POSITIVE, example: 1e-2 },
    { name: "length", dimension: "Length", description: "Length of the wire", domain: POSITIVE, example: 1 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Capacitance between the wire and the plane" },
  relations: [{ rule: "wireRadius < height", holds: (x) => x.wireRadius < x.height }],
  validity: [
    {
      code: "end_effects",
      when: (x) => x.height > 0.01 * x.length,
      measure: (x) => x.height / x.length,
      message: (x) =>
        `the height is ${formatPercent(x.height / x.length)} of the length; fringing at the ends adds capacitance of about that relative size, which this formula neglects (common practice)`,
    },
    { code: "dielectric", when: (x) => x.relativePermittivity > 1, measure: (x) => x.relativePermittivity, message: DIELECTRIC_NOTE },
  ],
  source: {
    authors: "D. M. Pozar", year: 2012, title: "Microwave Engineering, 4th ed.",
    locator: "Table 2.1 (two-wire line), with the method of images (from memory)",
  },
  // acoshOfRatio: digits kept for a wire nearly touching the plane; mulDiv: no intermediate overflow.
  compute: (x) =>
    mulDiv(TWO_PI_EPSILON0, x.relativePermittivity, x.length, acoshOfRatio(x.height, x.wireRadius)),
});
