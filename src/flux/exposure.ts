import { GOVERN, IMPLANT_STATIC_FIELD } from "../core/hazards.js";
import { LOW_FREQUENCY_GUIDELINE_TOP, REFERENCE_LEVEL_MAX_FREQUENCY, referenceLevel, STATIC_BELOW } from "../core/exposure.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";

/** The table row a result was read from (the domain and relation guarantee there is one). */
function label(x: { readonly frequency: number; readonly group: "public" | "occupational"; readonly quantity: "fluxDensity" | "electricField" }): string {
  return referenceLevel(x.frequency, x.group, x.quantity)?.label ?? "no reference level";
}

/**
 * Exposure reference level of people in a low-frequency or static field: the
 * field, flux density (T) or electric field (V/m), up to which exposure of the
 * public or of workers complies with the guideline without further assessment.
 *
 * 1 Hz to 10 MHz: ICNIRP 2010, Table 3 (occupational) and Table 4 (general
 * public), unperturbed r.m.s. values; e.g. at 50 Hz 200 uT and 5 kV/m for the
 * public, 1 mT and 10 kV/m for workers. The tables are piecewise in f (Hz):
 * constant, 1/f or 1/f^2 by row; a frequency on a row edge takes the lower
 * value. Below 1 Hz (static): the ICNIRP 2009 static magnetic-field limits,
 * 400 mT for the public and 2 T for workers (head and trunk); ICNIRP sets no
 * static electric-field level, so an electric field below 1 Hz is refused.
 *
 * The output's dimension follows `quantity`: a FluxDensity for "fluxDensity",
 * an ElectricField for "electricField" (the typed call returns the one asked for).
 *
 * Validity: above 100 kHz the radio-frequency guidelines (heating) apply as
 * well; between 0 and 1 Hz the static limit is returned, while time-varying
 * fields below 1 Hz have their own guideline (ICNIRP 2014), not covered here.
 *
 * Reference: ICNIRP, Health Physics 99(6) (2010) 818-836, Tables 3 and 4;
 * ICNIRP, Health Physics 96(4) (2009) 504-514 (static magnetic fields).
 *
 * @example
 * exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "public", quantity: "fluxDensity" }); // 200e-6 T
 */
export const exposureReferenceLevel = /* @__PURE__ */ defineFormula({
  id: "exposureReferenceLevel",
  title: "Exposure reference level",
  category: "exposure",
  description:
    "ICNIRP reference level for exposure of the public or of workers to a magnetic flux density (T) or an electric field (V/m) " +
    "from 1 Hz to 10 MHz (ICNIRP 2010), and the static magnetic-field limits below 1 Hz (ICNIRP 2009). " +
    "A reference level is a screening value for the unperturbed field where people are, not a safety assessment: exceeding it calls for " +
    "assessment against the basic restrictions. Local codes, standards and licensed practice govern.",
  equation: "B_RL(f), E_RL(f) = coefficient / f^n by table row (n = 0, 1, 2); static B limit below 1 Hz",
  inputs: [
    { name: "frequency", dimension: "Frequency", description: "Frequency of the field (0 for a static field)", domain: { min: 0, max: REFERENCE_LEVEL_MAX_FREQUENCY }, example: 50 },
    { name: "group", choices: ["public", "occupational"], description: "Exposed group: the general public or workers (occupational)", example: "public" },
    { name: "quantity", choices: ["fluxDensity", "electricField"], description: "The field the level is for: magnetic flux density (T) or electric field (V/m)", example: "fluxDensity" },
  ],
  output: {
    dimension: "FluxDensity",
    description: "Reference level (r.m.s.), in T for a flux density or V/m for an electric field",
    byChoice: { input: "quantity", dimensions: { fluxDensity: "FluxDensity", electricField: "ElectricField" } },
  },
  relations: [
    {
      rule: "quantity = fluxDensity below 1 Hz (ICNIRP sets no static electric-field level)",
      holds: (x) => x.quantity === "fluxDensity" || x.frequency >= STATIC_BELOW,
    },
  ],
  validity: [
    {
      code: "radio_frequency_range",
      when: (x) => x.frequency > LOW_FREQUENCY_GUIDELINE_TOP,
      measure: (x) => x.frequency / LOW_FREQUENCY_GUIDELINE_TOP,
      message: (x) =>
        `at ${formatNumber(x.frequency / 1e3, 3)} kHz, above 100 kHz, the level protects against nerve stimulation only: ` +
        "heating is limited by the radio-frequency guidelines (ICNIRP 2020), which apply as well (ICNIRP 2010, note to Tables 3 and 4)",
    },
    {
      code: "below_one_hertz",
      when: (x) => x.frequency > 0 && x.frequency < STATIC_BELOW,
      measure: (x) => x.frequency,
      message: (x) =>
        `at ${formatNumber(x.frequency, 3)} Hz the static-field limit is returned; fields varying below 1 Hz (and movement in a static field) ` +
        "have their own guideline (ICNIRP 2014, Health Physics 106(3) 418-425), not covered here",
    },
  ],
  // A reference level is a screening value, not a safety assessment: that always holds, so the description
  // says it. The caution fires where the level itself is a hazard: a flux density that meets it can
  // still be above the 0.5 mT line for implanted medical devices.
  cautions: [
    {
      code: "implant_line",
      when: (x, v) => x.quantity === "fluxDensity" && (v as number) >= IMPLANT_STATIC_FIELD,
      measure: (_x, v) => (v as number) / IMPLANT_STATIC_FIELD,
      message: (x, v) =>
        `${label(x)}: ${formatNumber((v as number) * 1e3, 3)} mT is at or above the 0.5 mT (5 G) line for pacemakers and other ` +
        "implanted medical devices (ICNIRP 2009 static-field guideline): a field within the reference level can still affect them. " +
        `A reference level is a screening value, not a safety assessment. ${GOVERN}`,
    },
  ],
  source: [
    { authors: "ICNIRP", year: 2010, title: "Guidelines for limiting exposure to time-varying electric and magnetic fields (1 Hz to 100 kHz), Health Physics 99(6), 818-836", locator: "Tables 3 and 4" },
    { authors: "ICNIRP", year: 2009, title: "Guidelines on limits of exposure to static magnetic fields, Health Physics 96(4), 504-514", locator: "limits of exposure (400 mT public; 2 T, limbs 8 T, occupational)" },
  ],
  // A table lookup: one division or two by f, within an ulp or two of the printed coefficient / f^n.
  compute: (x) => referenceLevel(x.frequency, x.group, x.quantity)?.value ?? Number.NaN,
});
