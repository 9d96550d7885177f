import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, RELATIVE_PERMEABILITY, TURNS } from "../core/spec.js";
import { logOfRatio } from "../math/ratios.js";
import { Scaled, exponentOf, ldexp, moderate, scaledProduct } from "../math/scaled.js";

/** The core's permeability, as both toroid formulas take it. */
const CORE_PERMEABILITY = {
  ...RELATIVE_PERMEABILITY,
  description: "Relative permeability of the core (1 for air; a linear material assumed)",
} as const;

/**
 * Said in the description rather than as a note: it holds for every call. Any
 * mu_r > 0 is accepted (a diamagnetic or air core included): the winding, not
 * the material, confines the flux, so nothing in the derivation needs mu_r >= 1.
 */
const LINEAR_CORE =
  " The core is taken as linear with constant relative permeability: real magnetic cores vary with flux density, frequency and temperature and saturate, so check the flux density against the material's limit.";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);

/**
 * Inductance of a toroidal winding on a core of rectangular cross-section.
 *
 * L = mu0 mur N^2 h ln(b/a) / (2 pi), with N turns, a and b the inner and outer
 * radii of the core in m, h its height (axial thickness) in m, mur the core's
 * relative permeability; L in H.
 *
 * Exact for a closely wound uniform winding (all flux inside the core region)
 * and a linear core; any mu_r > 0. ln(b/a) is computed as log1p((b - a)/a) for
 * thin cores, and the product is scaled for extreme magnitudes: every
 * representable result is returned to a few ulp (measured in
 * tests/inductance/extremes-accuracy.test.ts), results beyond the double range
 * or below the smallest subnormal (2^-1074; a subnormal result is returned) are `out_of_range`.
 *
 * Reference: any electromagnetics text, e.g. D. J. Griffiths, Introduction to
 * Electrodynamics, 4th ed. (Pearson, 2013), ch. 7 (from memory).
 *
 * @example
 * toroidInductance({ turns: 50, innerRadius: quantity(1, "cm"), outerRadius: quantity(2, "cm"), height: quantity(1, "cm") }); // ≈ 3.47 µH
 */
export const toroidInductance = /* @__PURE__ */ defineFormula({
  id: "toroidInductance",
  title: "Toroid inductance (rectangular section)",
  category: "inductance",
  description: "Inductance of a closely wound toroid on a core of rectangular cross-section, exact for a uniform winding and a linear core." + LINEAR_CORE,
  equation: "L = mu0 mur N^2 h ln(b/a) / (2 pi)",
  inputs: [
    { name: "turns", ...TURNS, example: 50 },
    { name: "innerRadius", dimension: "Length", description: "Inner radius of the core", domain: POSITIVE, example: 0.01 },
    { name: "outerRadius", dimension: "Length", description: "Outer radius of the core", domain: POSITIVE, example: 0.02 },
    { name: "height", dimension: "Length", description: "Height (axial thickness) of the core", domain: POSITIVE, example: 0.01 },
    { name: "relativePermeability", ...CORE_PERMEABILITY },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson)", locator: "ch. 7, toroidal coil of rectangular section (from memory)" },
  // logRatio keeps thin cores (b close to a) accurate; the plain product is
  // safe while every factor is moderate, otherwise it is scaled.
  compute: (x) => {
    const ln = logOfRatio(x.outerRadius, x.innerRadius); // in [1e-16, 1500]: always moderate
    if (moderate(x.relativePermeability) && moderate(x.turns) && moderate(x.height)) {
      return MU0_OVER_2PI * x.relativePermeability * x.turns * x.turns * x.height * ln;
    }
    return scaledProduct([MU0_OVER_2PI, x.relativePermeability, x.turns, x.turns, x.height, ln]);
  },
});

/**
 * Inductance of a toroidal winding on a core of circular cross-section.
 *
 * L = mu0 mur N^2 (R - sqrt(R^2 - r^2)), with N turns, R the major radius (axis
 * to the centre of the section) and r the minor radius (of the section) in m,
 * mur the relative permeability; L in H.
 *
 * Exact for a closely wound uniform winding (the flux of B = mu N I/(2 pi rho)
 * through a circle) and a linear core; any mu_r > 0. Computed as
 * r^2 / (R + sqrt((R - r)(R + r))): the textbook difference R - sqrt(R^2 - r^2)
 * loses digits for thin sections (r << R). Scaled for extreme magnitudes: every
 * representable result to a few ulp, `out_of_range` beyond the double range or
 * below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Reference: F. W. Grover, Inductance Calculations (1946), toroidal coils
 * (from memory); the integral is elementary.
 *
 * @example
 * circularToroidInductance({ turns: 50, majorRadius: quantity(2, "cm"), minorRadius: quantity(5, "mm") }); // ≈ 2.0 µH
 */
export const circularToroidInductance = /* @__PURE__ */ defineFormula({
  id: "circularToroidInductance",
  title: "Toroid inductance (circular section)",
  category: "inductance",
  description: "Inductance of a closely wound toroid on a core of circular cross-section, exact for a uniform winding and a linear core." + LINEAR_CORE,
  equation: "L = mu0 mur N^2 (R - sqrt(R^2 - r^2))",
  inputs: [
    { name: "turns", ...TURNS, example: 50 },
    { name: "majorRadius", dimension: "Length", description: "Radius from the toroid's axis to the centre of the cross-section", domain: POSITIVE, example: 0.02 },
    { name: "minorRadius", dimension: "Length", description: "Radius of the circular cross-section", domain: POSITIVE, example: 0.005 },
    { name: "relativePermeability", ...CORE_PERMEABILITY },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [{ rule: "minorRadius < majorRadius", holds: (x) => x.minorRadius < x.majorRadius }],
  source: { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables", locator: "toroidal coils (from memory)" },
  // r^2/(R + sqrt((R-r)(R+r))) avoids the cancellation of R - sqrt(R^2 - r^2) for r << R.
  compute: (x) => {
    const R = x.majorRadius;
    const r = x.minorRadius;
    const mu = x.relativePermeability;
    if (moderate(R) && moderate(r) && moderate(mu) && moderate(x.turns)) {
      return MU0 * mu * x.turns * x.turns * r * (r / (R + Math.sqrt((R - r) * (R + r))));
    }
    // Scale both radii by the power of two that brings R into [1, 2): the
    // denominator is then in [1, 4) and cannot overflow; r may underflow only
    // where it no longer changes the denominator.
    const s = -exponentOf(R);
    const Rs = ldexp(R, s);
    const rs = ldexp(r, s);
    const den = Scaled.of(Rs + Math.sqrt((Rs - rs) * (Rs + rs)), -s);
    return Scaled.of(MU0).times(mu).times(x.turns).times(x.turns).times(r).times(r).div(den).toNumber();
  },
});
