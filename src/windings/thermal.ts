import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate, pow } from "../math/scaled.js";

/** Exponent and coefficient of McLyman's fit: rise in K for a surface dissipation in W/cm^2. */
const EXPONENT = 0.826;
const COEFFICIENT = 450;
/** Surface dissipation (W/m^2) beyond which the fit is extrapolated: 0.1 W/cm^2, about a 67 K rise (from memory). */
const FIT_HIGH = 1000;
/**
 * A rise above 45 K puts a surface in a 25 degC room above 70 degC, where touching it briefly
 * can burn (touch-temperature limits for accessible parts, e.g. IEC 62368-1 Table 38; from memory),
 * and approaches the limits of the common insulation classes (IEC 60085: class 105 (A) 105 degC; from memory).
 */
const HOT_RISE = 45;

/**
 * Temperature rise of a transformer or inductor from its loss and surface area (empirical).
 *
 * dT = 450 (P / A_t)^0.826, dT in K, P the total loss in W, A_t the exposed surface area in cm^2
 * (the formula converts from SI): McLyman's fit to natural-convection cooling of transformers in
 * still air at sea level, surface dissipation up to about 0.1 W/cm^2 (warned beyond; from memory).
 *
 * Accuracy (of the fit as written, not of the physics): within 6 ulp over 1e-300..1e300 of the
 * fit with the exponent as the double nearest 0.826 (which differs from 0.826 by under 2^-54:
 * relative |ln psi| * 5e-17 more, immaterial for a three-figure fit); measured by
 * tests/windings/thermal.test.ts.
 *
 * Empirical: a design estimate, not a thermal model; mounting, enclosure, altitude and forced air
 * change it. Check a prototype.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004),
 * chapter on temperature rise (equation number from memory).
 *
 * @example
 * temperatureRise({ loss: quantity(2, "W"), surfaceArea: quantity(60, "cm^2") }); // ≈ 27 K
 */
export const temperatureRise = /* @__PURE__ */ defineFormula({
  id: "temperatureRise",
  title: "Temperature rise of a magnetic component (McLyman, empirical)",
  category: "winding",
  description:
    "Temperature rise of a transformer or inductor in still air from its total loss over its exposed surface area, by McLyman's empirical fit " +
    "for natural convection (a design estimate; mounting, enclosure, altitude and air flow change it).",
  equation: "dT = 450 (P / A_t)^0.826  (dT in K, P in W, A_t in cm^2)",
  inputs: [
    { name: "loss", dimension: "Power", description: "Total loss (winding plus core)", domain: POSITIVE, example: 2 },
    { name: "surfaceArea", dimension: "Area", description: "Exposed surface area of the component", domain: POSITIVE, example: 60e-4 },
  ],
  output: { dimension: "Temperature", description: "Temperature rise above ambient" },
  validity: [
    {
      code: "outside_fitted_range",
      when: (x) => cappedRatio(x.loss, x.surfaceArea) > FIT_HIGH,
      measure: (x) => cappedRatio(x.loss, x.surfaceArea) / FIT_HIGH,
      message: "surface dissipation above 0.1 W/cm^2, beyond the natural-convection data McLyman's fit was made from (from memory): the rise is extrapolated; consider forced cooling and measure",
    },
  ],
  cautions: [
    {
      code: "hot_surface",
      when: (_x, t) => (t as number) > HOT_RISE,
      measure: (_x, t) => t as number,
      message: (_x, t) =>
        `a rise of ${formatNumber(t as number, 3)} K puts the surface above about 70 degC in a 25 degC room: brief contact can burn ` +
        "(touch-temperature limits, e.g. IEC 62368-1; from memory), and the winding may exceed its insulation class (IEC 60085); check the hottest spot. " +
        GOVERN,
    },
  ],
  // (P/A)^0.826 with A ~ size^2: size^-1.652 under geometric similarity.
  geometricExponent: -2 * EXPONENT,
  source: { authors: "C. W. T. McLyman", year: 2004, title: "Transformer and Inductor Design Handbook, 3rd ed.", locator: "temperature rise, dT = 450 psi^0.826 (empirical; chapter and equation from memory)" },
  // psi in W/cm^2 = 1e-4 P / A. Plain while both are moderate; otherwise P^0.826 and A^0.826 as
  // scaled powers (src/math/scaled.ts `pow`, exponent exact), so a quotient that alone overflows
  // still gives its representable rise.
  compute: (x) => {
    // Scaled pow on the plain path too: the split psi = u 2^k (k y exact) keeps it to a few ulp.
    if (moderate(x.loss) && moderate(x.surfaceArea)) return pow((1e-4 * x.loss) / x.surfaceArea, EXPONENT).times(COEFFICIENT).toNumber();
    return pow(x.loss, EXPONENT).div(pow(x.surfaceArea, EXPONENT)).times(COEFFICIENT * Math.pow(1e-4, EXPONENT)).toNumber();
  },
});
