import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { RELATIVE_PERMEABILITY } from "./shared.js";

const CORE_NONLINEAR = {
  code: "core_linearity",
  when: (x: { relativePermeability: number }) => x.relativePermeability > 1,
  message:
    "a magnetic core is taken as linear with constant relative permeability: real cores vary with flux density, frequency and temperature and saturate; check the flux density against the material's limit",
} as const;

/**
 * Inductance of a toroidal winding on a core of rectangular cross-section.
 *
 * L = mu0 mur N^2 h ln(b/a) / (2 pi), with N turns, a and b the inner and outer
 * radii of the core in m, h its height (axial thickness) in m, mur the core's
 * relative permeability; L in H.
 *
 * Exact for a closely wound uniform winding (all flux inside the core region);
 * ln(b/a) is computed as log1p((b - a)/a) so thin cores keep full precision.
 *
 * Reference: any electromagnetics text, e.g. D. J. Griffiths, Introduction to
 * Electrodynamics, 4th ed. (2017), sec. 7.2.3.
 *
 * @example
 * toroidInductance({ turns: 50, innerRadius: quantity(1, "cm"), outerRadius: quantity(2, "cm"), height: quantity(1, "cm") }); // ≈ 3.47 µH
 */
export const toroidInductance = /* @__PURE__ */ defineFormula({
  id: "toroidInductance",
  title: "Toroid inductance (rectangular section)",
  category: "inductance",
  description: "Inductance of a closely wound toroid on a core of rectangular cross-section, exact for a uniform winding and a linear core.",
  equation: "L = mu0 mur N^2 h ln(b/a) / (2 pi)",
  inputs: [
    { name: "turns", ...TURNS, example: 50 },
    { name: "innerRadius", dimension: "Length", description: "Inner radius of the core", domain: POSITIVE, example: 0.01 },
    { name: "outerRadius", dimension: "Length", description: "Outer radius of the core", domain: POSITIVE, example: 0.02 },
    { name: "height", dimension: "Length", description: "Height (axial thickness) of the core", domain: POSITIVE, example: 0.01 },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  validity: [CORE_NONLINEAR],
  source: { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "sec. 7.2.3 (inductance), toroidal coil of rectangular section" },
  // log1p of the exact difference keeps thin cores (b close to a) accurate.
  compute: (x) =>
    (MU0 * x.relativePermeability * x.turns * x.turns * x.height * Math.log1p((x.outerRadius - x.innerRadius) / x.innerRadius)) /
    (2 * Math.PI),
});

/**
 * Inductance of a toroidal winding on a core of circular cross-section.
 *
 * L = mu0 mur N^2 (R - sqrt(R^2 - r^2)), with N turns, R the major radius (axis
 * to the centre of the section) and r the minor radius (of the section) in m,
 * mur the relative permeability; L in H.
 *
 * Exact for a closely wound uniform winding (the flux of B = mu N I/(2 pi rho)
 * through a circle). Computed as r^2 / (R + sqrt((R - r)(R + r))): the textbook
 * difference R - sqrt(R^2 - r^2) loses digits for thin sections (r << R).
 *
 * Reference: F. W. Grover, Inductance Calculations (1946), toroidal coils;
 * the integral is elementary.
 *
 * @example
 * circularToroidInductance({ turns: 50, majorRadius: quantity(2, "cm"), minorRadius: quantity(5, "mm") }); // ≈ 2.0 µH
 */
export const circularToroidInductance = /* @__PURE__ */ defineFormula({
  id: "circularToroidInductance",
  title: "Toroid inductance (circular section)",
  category: "inductance",
  description: "Inductance of a closely wound toroid on a core of circular cross-section, exact for a uniform winding and a linear core.",
  equation: "L = mu0 mur N^2 (R - sqrt(R^2 - r^2))",
  inputs: [
    { name: "turns", ...TURNS, example: 50 },
    { name: "majorRadius", dimension: "Length", description: "Radius from the toroid's axis to the centre of the cross-section", domain: POSITIVE, example: 0.02 },
    { name: "minorRadius", dimension: "Length", description: "Radius of the circular cross-section", domain: POSITIVE, example: 0.005 },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [{ rule: "minorRadius < majorRadius", holds: (x) => x.minorRadius < x.majorRadius }],
  validity: [CORE_NONLINEAR],
  source: { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables", locator: "toroidal coils" },
  // r^2/(R + sqrt((R-r)(R+r))) avoids the cancellation of R - sqrt(R^2 - r^2) for r << R.
  compute: (x) => {
    const R = x.majorRadius;
    const r = x.minorRadius;
    return MU0 * x.relativePermeability * x.turns * x.turns * r * (r / (R + Math.sqrt((R - r) * (R + r))));
  },
});
