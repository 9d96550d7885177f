import { defineFormula } from "../core/formula.js";
import { formatNumber, formatPercent } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE, RELATIVE_PERMEABILITY } from "../core/spec.js";
import { HOT_CORE_DENSITY } from "../flux/losses.js";
import { cappedRatio } from "../math/ratios.js";
import { scaledProduct } from "../math/scaled.js";
import { radiusOverSkinDepth } from "./ac-resistance.js";

const PI2_OVER_6 = (Math.PI * Math.PI) / 6;
/**
 * Thickness over skin depth above which the classical loss exceeds the exact one-dimensional
 * (linear, uniform-permeability) solution by more than 1 %: 1/F(xi) - 1 = 0.01 at xi = 1.587
 * (F below; from its series 1 - xi^4/630 + ... and checked against the closed form).
 */
const THIN_LIMIT = 1.59;
/**
 * Default relative permeability for the thin-lamination check: toward the high end of the amplitude
 * permeability of silicon-iron laminations at working flux densities (non-oriented grades about
 * 1,000 to 10,000, grain-oriented higher; common practice, from memory), so that the check errs
 * toward warning. The classical loss itself does not depend on it.
 */
const DEFAULT_LAMINATION_PERMEABILITY = 10_000;

/**
 * Ratio F of the eddy loss of a linear lamination (uniform permeability, one-dimensional field)
 * to the classical thin-lamination loss at the same mean peak flux density, for a thickness of
 * xi >= 1 skin depths: F = (3 / xi) (sinh xi - sin xi) / (cosh xi - cos xi), with numerator and
 * denominator divided by cosh-like e^xi so nothing overflows (e^-xi underflows to 0 for xi > 745,
 * leaving 3 / xi). Below xi = 1 it is not needed (1/F - 1 < 0.16 %). The denominator stays above
 * 1 - 2 e^-1 |cos| > 0.2 for xi >= 1: no cancellation.
 */
export function thickLaminationRatio(xi: number): number {
  const e1 = Math.exp(-xi);
  const e2 = e1 * e1;
  return ((3 / xi) * (-Math.expm1(-2 * xi) - 2 * Math.sin(xi) * e1)) / (1 + e2 - 2 * Math.cos(xi) * e1);
}

/** Thickness over skin depth d / delta = d sqrt(pi f mu0 mur sigma) (the shared scaled root). */
function thicknessOverSkinDepth(x: { thickness: number; frequency: number; relativePermeability: number; conductivity: number }): number {
  return 2 * radiusOverSkinDepth(x.thickness, x.frequency, x.relativePermeability, x.conductivity);
}

/**
 * Classical eddy-current loss in a stack of thin laminations under sinusoidal flux.
 *
 * P = pi^2 d^2 f^2 B^2 sigma V / 6, P in W, d the lamination thickness in m, f the frequency in Hz,
 * B the peak flux density in T (uniform across the thickness), sigma the conductivity of the sheet
 * in S/m and V the volume of the laminations in m^3. From Faraday's law across a sheet much wider
 * than it is thick, with the field of the eddy currents neglected.
 *
 * Validity: the sheet must be thin against the skin depth delta = 1/sqrt(pi f mu0 mur sigma), so
 * that the flux stays uniform across it. That check needs the sheet's permeability, which the
 * loss itself does not: `relativePermeability` is optional, default 10,000, toward the high end of
 * silicon-iron amplitude permeabilities (common practice, from memory) so that the check errs
 * toward warning; give the material's value for a sharper check. A warning when d / delta exceeds
 * 1.59, where the classical value exceeds the exact one-dimensional solution for a linear sheet,
 * (3 / xi) (sinh xi - sin xi) / (cosh xi - cos xi) times it (xi = d / delta), by more than 1 %;
 * the message gives the overestimate.
 *
 * Assumptions (always, hence not warned): classical loss only, without hysteresis and excess
 * (domain-wall) loss, which in real electrical steel add as much again or more; insulated sheets;
 * sinusoidal flux.
 *
 * Accuracy: within 5 ulp of the formula for every input whose result is a double (a scaled
 * product of nine factors; tests/windings/lamination.test.ts against a decimal.js oracle).
 *
 * Reference: G. Bertotti, Hysteresis in Magnetism (1998), ch. 12, classical eddy-current loss of a
 * lamination and its skin-effect form (chapter and equations from memory); R. M. Bozorth,
 * Ferromagnetism (1951), eddy-current loss in sheets (from memory).
 *
 * @example
 * laminationEddyLoss({ thickness: quantity(0.35, "mm"), conductivity: quantity(2.08, "MS/m"), frequency: quantity(50, "Hz"), peakFluxDensity: quantity(1.5, "T"), volume: quantity(1000, "cm^3") }); // ≈ 2.36 W
 */
export const laminationEddyLoss = /* @__PURE__ */ defineFormula({
  id: "laminationEddyLoss",
  title: "Classical eddy-current loss in laminations",
  category: "winding",
  description:
    "Classical eddy-current loss of thin insulated laminations under sinusoidal flux, with the flux uniform across each sheet. " +
    "Hysteresis and excess (domain-wall) loss are not included: real electrical steel loses more. " +
    "The optional relative permeability (default 10,000) is used only to check that the sheet is thin against the skin depth.",
  equation: "P = pi^2 d^2 f^2 B^2 sigma V / 6",
  inputs: [
    { name: "thickness", dimension: "Length", description: "Thickness d of one lamination", domain: POSITIVE, example: 0.35e-3 },
    { name: "conductivity", dimension: "Conductivity", description: "Conductivity of the sheet (3 % silicon steel about 2 MS/m; from memory)", domain: POSITIVE, example: 2.08e6 },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the sinusoidal flux", domain: POSITIVE, example: 50 },
    { name: "peakFluxDensity", dimension: "FluxDensity", description: "Peak flux density in the sheet", domain: NON_NEGATIVE, example: 1.5 },
    { name: "volume", dimension: "Volume", description: "Volume of the laminations (iron only, without the insulation)", domain: POSITIVE, example: 1e-3 },
    {
      name: "relativePermeability",
      ...RELATIVE_PERMEABILITY,
      description: "Relative (amplitude) permeability of the sheet, used only for the thin-sheet check (default 10,000; common practice)",
      default: DEFAULT_LAMINATION_PERMEABILITY,
      example: DEFAULT_LAMINATION_PERMEABILITY,
    },
  ],
  output: { dimension: "Power", description: "Classical eddy-current loss" },
  validity: [
    {
      code: "not_thin_against_skin_depth",
      when: (x) => thicknessOverSkinDepth(x) > THIN_LIMIT,
      measure: (x) => cappedRatio(thicknessOverSkinDepth(x), THIN_LIMIT),
      message: (x) => {
        const xi = thicknessOverSkinDepth(x);
        const over = cappedRatio(1, thickLaminationRatio(xi)) - 1;
        return (
          `the sheet is ${formatNumber(xi, 3)} skin depths thick (relative permeability ${formatNumber(x.relativePermeability, 3)}): the flux crowds toward the surfaces, ` +
          `and the classical formula overestimates the eddy loss of a linear sheet by ${formatPercent(over)} (exact one-dimensional solution, ` +
          "(3/xi)(sinh xi - sin xi)/(cosh xi - cos xi)); use thinner sheets or the skin-effect solution"
        );
      },
    },
  ],
  cautions: [
    {
      code: "hot_core",
      when: (x, p) => cappedRatio(p as number, x.volume) > HOT_CORE_DENSITY,
      measure: (x, p) => cappedRatio(p as number, x.volume),
      message: (x, p) =>
        `eddy loss density ${formatNumber(cappedRatio(p as number, x.volume) / 1e3, 3)} kW/m^3 is above about 500 kW/m^3, where a core in still air ` +
        "runs well beyond a 40 K rise (common practice): burn risk and possible damage to the insulation; check the temperature rise. " +
        GOVERN,
    },
  ],
  source: [
    { authors: "G. Bertotti", year: 1998, title: "Hysteresis in Magnetism (Academic Press)", locator: "ch. 12, classical eddy-current loss of a lamination, P = pi^2 sigma d^2 B^2 f^2 / 6 per volume, and its skin-effect form (chapter from memory)" },
    { authors: "R. M. Bozorth", year: 1951, title: "Ferromagnetism (Van Nostrand)", locator: "eddy-current loss in sheets (section from memory)" },
  ],
  // Nine positive factors: a plain product while every step stays a normal double, otherwise
  // mantissas and exponents apart (scaledProduct), so d^2 f^2 B^2 never overflows or underflows on
  // its own. A zero flux density gives an exact zero.
  compute: (x) => scaledProduct([PI2_OVER_6, x.thickness, x.thickness, x.frequency, x.frequency, x.peakFluxDensity, x.peakFluxDensity, x.conductivity, x.volume]),
});
