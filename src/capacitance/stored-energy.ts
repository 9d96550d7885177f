import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { GOVERN, HAZARDOUS_ENERGY, voltageCautions } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { mulDiv } from "../math/scaled.js";

// ---- hazard rules shared by the two formulas ----

/**
 * How far a capacitor charged to v is past the discharge limits below which an
 * accessible part is not considered live (IEC 60335-1, clause 8.1.4; the
 * figures were seen only quoted second-hand, so from memory): above 42.4 V
 * peak, 0.1 uF up to 450 V, 45 uC up to 15 kV, 350 mJ above 15 kV. Returns the
 * ratio of the quantity that band limits to its limit (above 1 = past it), and
 * 0 at or below 42.4 V. Each ratio is formed as a quotient first, so it does
 * not overflow for any representable charge or energy (capped at the largest double).
 */
function dischargeLimitRatio(capacitance: number, voltage: number): number {
  const v = Math.abs(voltage);
  if (v <= 42.4) return 0;
  if (v <= 450) return capacitance / 1e-7;
  const r = v <= 15e3 ? (capacitance / 45e-6) * v : ((capacitance / 0.7) * v) * v;
  return Math.min(r, Number.MAX_VALUE);
}

const HANDLING =
  "Discharge through a bleed resistor and confirm zero voltage with a meter before touching; keep large capacitors shorted while handled, since they can recover charge (dielectric absorption).";

const cautions = [
  // The IEC 61140 / IEC 60449 d.c. bands (120 V ripple-free d.c., 1500 V d.c.), as everywhere in the library.
  ...voltageCautions("dc", (x: { readonly voltage: number }) => Math.abs(x.voltage)),
  {
    code: "stored_charge",
    when: (x: { readonly capacitance: number; readonly voltage: number }) => dischargeLimitRatio(x.capacitance, x.voltage) > 1,
    measure: (x: { readonly capacitance: number; readonly voltage: number }) => dischargeLimitRatio(x.capacitance, x.voltage),
    message: (x: { readonly capacitance: number; readonly voltage: number }) =>
      `the stored charge is ${formatNumber(dischargeLimitRatio(x.capacitance, x.voltage), 3)} times the limit below which a touchable part is not counted as live ` +
      `(IEC 60335-1, clause 8.1.4, from memory: above 42.4 V peak, 0.1 uF up to 450 V, 45 uC up to 15 kV, 350 mJ above 15 kV). ${HANDLING} ${GOVERN}`,
  },
] as const;

const SOURCES = [
  { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed.", locator: "sec. 6.2, capacitors (section from memory)" },
  { authors: "IEC", year: 2016, title: "IEC 61140: Protection against electric shock - Common aspects for installation and equipment", locator: "voltage bands of IEC 60449 (from memory)" },
  { authors: "IEC", title: "IEC 60335-1: Household and similar electrical appliances - Safety - Part 1: General requirements", locator: "clause 8.1.4 (from memory, quoted second-hand)" },
] as const;

/**
 * Energy stored in a charged capacitor.
 *
 * W = C V^2 / 2, with W in J, C the capacitance in F, V the voltage across it in V.
 *
 * Validity: a linear capacitor (C independent of V). Ceramic class-2 and
 * electrolytic parts lose capacitance with voltage, and then store less.
 *
 * Cautions: above the extra-low-voltage band (120 V ripple-free d.c.) and above
 * 1500 V d.c. (IEC 61140 / IEC 60449 bands), above the discharge limits of
 * IEC 60335-1 clause 8.1.4, and from 20 J stored (the hazardous energy level
 * of IEC 60950-1:2005, from memory) the result carries hazard notes. Local
 * codes and licensed practice govern.
 *
 * Method: mulDiv forms C V^2 / 2 with no intermediate overflow or underflow;
 * within 1.5 ulp of the exact value of the double inputs; a subnormal result
 * within one of its ulps, one below 2^-1074 out_of_range (src/math/scaled.ts).
 *
 * Reference: C. K. Alexander, M. N. O. Sadiku, Fundamentals of Electric
 * Circuits, 5th ed. (2013), sec. 6.2 (energy stored in a capacitor; section from memory).
 *
 * @example
 * capacitorEnergy({ capacitance: quantity(100, "uF"), voltage: quantity(400, "V") }); // ≈ 8 J
 */
export const capacitorEnergy = /* @__PURE__ */ defineFormula({
  id: "capacitorEnergy",
  title: "Energy stored in a capacitor",
  category: "capacitance",
  description: "Energy stored in a linear capacitor charged to a voltage (capacitance independent of voltage).",
  equation: "W = C V^2 / 2",
  inputs: [
    { name: "capacitance", dimension: "Capacitance", description: "Capacitance", domain: POSITIVE, example: 1e-4 },
    { name: "voltage", dimension: "Voltage", description: "Voltage across the capacitor", example: 400 },
  ],
  output: { dimension: "Energy", description: "Stored energy" },
  cautions: [
    ...cautions,
    {
      code: "stored_energy",
      when: (_x, w) => (w as number) >= HAZARDOUS_ENERGY,
      measure: (_x, w) => w as number,
      message: (_x, w) =>
        `${formatNumber(w as number, 3)} J stored, at or above the ${HAZARDOUS_ENERGY} J hazardous energy level (IEC 60950-1:2005, 1.2.8.10, now IEC 62368-1; from memory): ` +
        `a discharge can burn, start an arc or stop the heart, even after the supply is off. ${HANDLING} ${GOVERN}`,
    },
  ],
  source: [
    ...SOURCES,
    { authors: "IEC", year: 2005, title: "IEC 60950-1: Information technology equipment - Safety - Part 1: General requirements", locator: "1.2.8.10, hazardous energy level 20 J (from memory)" },
  ],
  // mulDiv: V^2 must not overflow (V = 1e200 V) nor C V^2 underflow in an intermediate step.
  compute: (x) => mulDiv(x.capacitance, Math.abs(x.voltage), Math.abs(x.voltage), 2),
});

/**
 * Charge on a capacitor at a voltage.
 *
 * Q = C V, with Q in C (signed like V), C the capacitance in F, V the voltage in V.
 *
 * Validity: a linear capacitor (C independent of V).
 *
 * Cautions: above the extra-low-voltage band (120 V ripple-free d.c.) and above
 * 1500 V d.c. (IEC 61140 / IEC 60449 bands), and above the discharge limits of
 * IEC 60335-1 clause 8.1.4. Local codes and licensed practice govern.
 *
 * Method: one product through mulDiv (half an ulp; a subnormal result within
 * one of its ulps, one below 2^-1074 out_of_range, never a silent zero).
 *
 * Reference: C. K. Alexander, M. N. O. Sadiku, Fundamentals of Electric
 * Circuits, 5th ed. (2013), sec. 6.2 (q = C v; section from memory).
 *
 * @example
 * capacitorCharge({ capacitance: quantity(100, "uF"), voltage: quantity(400, "V") }); // ≈ 0.04 C
 */
export const capacitorCharge = /* @__PURE__ */ defineFormula({
  id: "capacitorCharge",
  title: "Charge on a capacitor",
  category: "capacitance",
  description: "Charge held by a linear capacitor at a voltage; the sign follows the voltage.",
  equation: "Q = C V",
  inputs: [
    { name: "capacitance", dimension: "Capacitance", description: "Capacitance", domain: POSITIVE, example: 1e-4 },
    { name: "voltage", dimension: "Voltage", description: "Voltage across the capacitor", example: 400 },
  ],
  output: { dimension: "Charge", description: "Charge on the positive plate" },
  cautions,
  source: SOURCES,
  // mulDiv: an extreme product must not silently underflow to a wrong tiny value.
  compute: (x) => (x.voltage === 0 ? 0 : Math.sign(x.voltage) * mulDiv(x.capacitance, Math.abs(x.voltage), 1, 1)),
});
