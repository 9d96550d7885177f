import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { mulDiv } from "./shared.js";

// ---- hazard thresholds shared by the two formulas ----

/** Extra-low-voltage limit for ripple-free d.c., V (IEC 61140:2016; 50 V for a.c. r.m.s.). */
const ELV_DC = 120;

/**
 * True when a capacitor charged to v exceeds the discharge limits below which
 * an accessible part is not considered live (IEC 60335-1, clause 8.1.4): above
 * 42.4 V peak, 0.1 uF up to 450 V, 45 uC up to 15 kV, 350 mJ above 15 kV.
 */
function exceedsDischargeLimits(capacitance: number, voltage: number): boolean {
  const v = Math.abs(voltage);
  if (v <= 42.4) return false;
  if (v <= 450) return capacitance > 1e-7;
  if (v <= 15e3) return capacitance * v > 45e-6;
  return 0.5 * capacitance * v * v > 0.35;
}

const GOVERN = "Local codes, standards and licensed practice govern any real installation.";
const HANDLING =
  "Discharge through a bleed resistor and confirm zero voltage with a meter before touching; keep large capacitors shorted while handled, since they can recover charge (dielectric absorption).";

const cautions = [
  {
    code: "hazardous_voltage",
    when: (x: { voltage: number }) => Math.abs(x.voltage) > ELV_DC,
    message: (x: { voltage: number }) =>
      `${formatNumber(Math.abs(x.voltage), 3)} V is above the extra-low-voltage limits (50 V a.c., 120 V ripple-free d.c.; IEC 61140): a shock hazard. ${GOVERN}`,
  },
  {
    code: "stored_charge",
    when: (x: { capacitance: number; voltage: number }) => exceedsDischargeLimits(x.capacitance, x.voltage),
    message:
      `the stored charge exceeds the limits below which a touchable part is not counted as live (IEC 60335-1, clause 8.1.4: above 42.4 V peak, 0.1 uF up to 450 V, 45 uC up to 15 kV, 350 mJ above 15 kV). ${HANDLING} ${GOVERN}`,
  },
] as const;

/**
 * Energy stored in a charged capacitor.
 *
 * W = C V^2 / 2, with W in J, C the capacitance in F, V the voltage across it in V.
 *
 * Validity: a linear capacitor (C independent of V). Ceramic class-2 and
 * electrolytic parts lose capacitance with voltage, and then store less.
 *
 * Cautions: above the extra-low-voltage limits (IEC 61140), above the discharge
 * limits of IEC 60335-1 clause 8.1.4, and above 10 J (common practice) the
 * result carries hazard notes. Local codes and licensed practice govern.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017), Sec. 2.5.4.
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
      when: (_x, w) => (w as number) >= 10,
      message: (_x, w) =>
        `${formatNumber(w as number, 3)} J stored: energies of about 10 J and more can cause burns, arc flash and a fatal shock, even after the supply is off (common practice). ${HANDLING} ${GOVERN}`,
    },
  ],
  source: [
    { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "Sec. 2.5.4" },
    { authors: "IEC", year: 2016, title: "IEC 61140: Protection against electric shock", locator: "extra-low-voltage band" },
    { authors: "IEC", title: "IEC 60335-1: Household and similar electrical appliances - Safety - General requirements", locator: "clause 8.1.4" },
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
 * Cautions: above the extra-low-voltage limits (IEC 61140) and the discharge
 * limits of IEC 60335-1 clause 8.1.4. Local codes and licensed practice govern.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017), Sec. 2.5.4.
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
  source: [
    { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "Sec. 2.5.4" },
    { authors: "IEC", year: 2016, title: "IEC 61140: Protection against electric shock", locator: "extra-low-voltage band" },
    { authors: "IEC", title: "IEC 60335-1: Household and similar electrical appliances - Safety - General requirements", locator: "clause 8.1.4" },
  ],
  // mulDiv: an extreme product must not silently underflow to a wrong tiny value.
  compute: (x) => (x.voltage === 0 ? 0 : Math.sign(x.voltage) * mulDiv(x.capacitance, Math.abs(x.voltage), 1, 1)),
});
