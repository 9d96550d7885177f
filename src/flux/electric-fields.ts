import { EPSILON0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { moderate, scaledProduct } from "../math/scaled.js";
import { BREAKDOWN_CAUTION, MEDIUM_PERMITTIVITY } from "./shared.js";

const GRIFFITHS = { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson; reissued by Cambridge University Press, 2017)" } as const;
const FOUR_PI_EPS0 = 4 * Math.PI * EPSILON0; // one rounding (4 pi is exact in binary scaling)
const TWO_PI_EPS0 = 2 * Math.PI * EPSILON0;

/** Q / (4 pi eps0 epsr r^2): plain when all three are moderate (r^2 never formed alone); scaled otherwise. */
function coulomb(q: number, epsr: number, r: number): number {
  return moderate(q) && moderate(epsr) && moderate(r) ? q / (FOUR_PI_EPS0 * epsr * r * r) : scaledProduct([q], [FOUR_PI_EPS0, epsr, r, r]);
}

/**
 * Electric field of a point charge (Coulomb's law).
 *
 * E = Q / (4 pi eps0 epsr r^2), with E in V/m (radial, positive pointing away from a
 * positive charge), Q in C, r in m, epsr the medium's relative permittivity.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), eq. (2.4) (from memory).
 *
 * @example
 * pointChargeField({ charge: quantity(1, "nC"), distance: quantity(1, "m") }); // ≈ 8.99 V/m
 */
export const pointChargeField = /* @__PURE__ */ defineFormula({
  id: "pointChargeField",
  title: "Field of a point charge",
  category: "electric field",
  description: "Radial electric field at a distance from a point charge in a uniform medium (Coulomb's law).",
  equation: "E = Q / (4 pi eps0 epsr r^2)",
  inputs: [
    { name: "charge", dimension: "Charge", description: "Charge (sign kept)", example: 1e-9 },
    { name: "distance", dimension: "Length", description: "Distance from the charge", domain: POSITIVE, example: 1 },
    { name: "relativePermittivity", ...MEDIUM_PERMITTIVITY },
  ],
  output: { dimension: "ElectricField", description: "Radial electric field (positive outward)" },
  cautions: [BREAKDOWN_CAUTION],
  source: { ...GRIFFITHS, locator: "eq. (2.4) (from memory)" },
  // r^2 can overflow or underflow where E is finite: see coulomb.
  compute: (x) => coulomb(x.charge, x.relativePermittivity, x.distance),
});

/**
 * Electric field of a long straight line charge.
 *
 * E = lambda / (2 pi eps0 epsr d), with E in V/m (radial), lambda in C/m, d in m.
 *
 * Validity: the line is straight and much longer than d.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 2.2
 * (the field of a line charge, by direct integration over a long line segment and
 * by Gauss's law; section and examples from memory).
 *
 * @example
 * lineChargeField({ chargePerLength: quantity(1, "nC/m"), distance: quantity(10, "cm") }); // ≈ 180 V/m
 */
export const lineChargeField = /* @__PURE__ */ defineFormula({
  id: "lineChargeField",
  title: "Field of a line charge",
  category: "electric field",
  description: "Radial electric field at a distance from a long uniform line charge (Gauss's law).",
  equation: "E = lambda / (2 pi eps0 epsr d)",
  inputs: [
    { name: "chargePerLength", dimension: "LineChargeDensity", description: "Charge per unit length (sign kept)", example: 1e-9 },
    { name: "distance", dimension: "Length", description: "Distance from the line", domain: POSITIVE, example: 0.1 },
    { name: "relativePermittivity", ...MEDIUM_PERMITTIVITY },
  ],
  output: { dimension: "ElectricField", description: "Radial electric field (positive outward)" },
  cautions: [BREAKDOWN_CAUTION],
  source: { ...GRIFFITHS, locator: "sec. 2.2, field of a long line charge (Gauss's law; section from memory)" },
  compute: (x) =>
    moderate(x.chargePerLength) && moderate(x.relativePermittivity) && moderate(x.distance)
      ? x.chargePerLength / (TWO_PI_EPS0 * x.relativePermittivity * x.distance)
      : scaledProduct([x.chargePerLength], [TWO_PI_EPS0, x.relativePermittivity, x.distance]),
});

/**
 * Electric field of a charged conducting sphere, inside and outside.
 *
 * E = 0 for r < a (inside the conductor); E = Q / (4 pi eps0 epsr r^2) for r >= a
 * (at r = a, the field just outside the surface). E in V/m, Q in C, a and r in m,
 * epsr the permittivity of the medium around the sphere.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 2.5 (conductors; from memory).
 *
 * @example
 * chargedSphereField({ charge: quantity(1, "nC"), radius: quantity(1, "cm"), distance: quantity(1, "m") }); // ≈ 8.99 V/m
 */
export const chargedSphereField = /* @__PURE__ */ defineFormula({
  id: "chargedSphereField",
  title: "Field of a charged conducting sphere",
  category: "electric field",
  description: "Radial electric field of a charged conducting sphere: zero inside the conductor, Coulomb field from the surface outward.",
  equation: "E = 0 (r < a); E = Q / (4 pi eps0 epsr r^2) (r >= a)",
  inputs: [
    { name: "charge", dimension: "Charge", description: "Charge on the sphere (sign kept)", example: 1e-9 },
    { name: "radius", dimension: "Length", description: "Radius of the conducting sphere", domain: POSITIVE, example: 0.01 },
    { name: "distance", dimension: "Length", description: "Distance from the sphere's centre", domain: POSITIVE, example: 1 },
    { name: "relativePermittivity", ...MEDIUM_PERMITTIVITY },
  ],
  output: { dimension: "ElectricField", description: "Radial electric field (positive outward)" },
  cautions: [BREAKDOWN_CAUTION],
  source: { ...GRIFFITHS, locator: "sec. 2.5.1, field inside a conductor (from memory)" },
  compute: (x) => (x.distance < x.radius ? 0 : coulomb(x.charge, x.relativePermittivity, x.distance)),
});
