import { EPSILON0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { mulDiv } from "../math/scaled.js";
import { RELATIVE_PERMITTIVITY } from "./shared.js";

const FOUR_PI_EPSILON0 = 4 * Math.PI * EPSILON0;

/**
 * Capacitance between two concentric spherical conductors.
 *
 * C = 4 pi eps0 epsr a b / (b - a), with C in F, a the inner sphere's radius in
 * m, b the outer shell's inner radius in m, epsr the relative permittivity of
 * the dielectric between them, eps0 in F/m (CODATA 2022).
 *
 * Validity: exact for concentric spheres; an off-centre inner sphere has a
 * larger capacitance.
 *
 * Method: written as 4 pi eps0 epsr a / ((b - a) / b). For b <= 2a the
 * difference b - a is exact (Sterbenz lemma), so a thin gap keeps full
 * precision; the product a b, which could overflow, is never formed.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013),
 * Sec. 2.5.4 (concentric spherical shells; section from memory).
 *
 * @example
 * sphericalCapacitance({ innerRadius: quantity(10, "cm"), outerRadius: quantity(20, "cm") }); // ≈ 2.225e-11 F
 */
export const sphericalCapacitance = /* @__PURE__ */ defineFormula({
  id: "sphericalCapacitance",
  title: "Concentric-sphere capacitance",
  category: "capacitance",
  description: "Capacitance between a conducting sphere and a concentric conducting spherical shell around it.",
  equation: "C = 4 pi eps0 epsr a b / (b - a)",
  inputs: [
    { name: "innerRadius", dimension: "Length", description: "Radius of the inner sphere", domain: POSITIVE, example: 0.1 },
    { name: "outerRadius", dimension: "Length", description: "Inner radius of the outer spherical shell", domain: POSITIVE, example: 0.2 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Capacitance between the sphere and the shell" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: {
    authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.",
    locator: "Sec. 2.5.4 (concentric spherical shells) (from memory)",
  },
  // (b - a) / b is in [2^-53, 1): exact difference near contact, no a*b overflow.
  compute: (x) =>
    mulDiv(FOUR_PI_EPSILON0, x.relativePermittivity, x.innerRadius, (x.outerRadius - x.innerRadius) / x.outerRadius),
});

/**
 * Self-capacitance of an isolated conducting sphere (the other electrode at
 * infinity).
 *
 * C = 4 pi eps0 epsr a, with C in F, a the radius in m, epsr the relative
 * permittivity of the surrounding medium, eps0 in F/m (CODATA 2022).
 *
 * Validity: other conductors (including the ground) must be many radii away;
 * a conductor at distance d raises C by roughly a / d (common practice).
 *
 * Reference: the outer radius -> infinity limit of the concentric spheres in
 * D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), Sec. 2.5.4 (section from memory).
 *
 * @example
 * isolatedSphereCapacitance({ radius: quantity(10, "cm") }); // ≈ 1.113e-11 F
 */
export const isolatedSphereCapacitance = /* @__PURE__ */ defineFormula({
  id: "isolatedSphereCapacitance",
  title: "Isolated-sphere capacitance",
  category: "capacitance",
  description: "Self-capacitance of a conducting sphere far from every other conductor.",
  equation: "C = 4 pi eps0 epsr a",
  inputs: [
    { name: "radius", dimension: "Length", description: "Radius of the sphere", domain: POSITIVE, example: 0.1 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY },
  ],
  output: { dimension: "Capacitance", description: "Self-capacitance" },
  source: {
    authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.",
    locator: "Sec. 2.5.4 (concentric shells, outer radius to infinity) (from memory)",
  },
  // mulDiv: a radius of 1e-300 m must not underflow in eps0 * a.
  compute: (x) => mulDiv(FOUR_PI_EPSILON0, x.relativePermittivity, x.radius, 1),
});
