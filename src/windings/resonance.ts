import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { Scaled, moderate } from "../math/scaled.js";

const TWO_PI = 2 * Math.PI;
const ONE = /* @__PURE__ */ Scaled.of(1);

const RESONANCE_INPUTS = [
  { name: "inductance", dimension: "Inductance", description: "Inductance L of the tank", domain: POSITIVE, example: 100e-6 },
  { name: "capacitance", dimension: "Capacitance", description: "Capacitance C of the tank", domain: POSITIVE, example: 10e-9 },
] as const;

const LC_SOURCE = {
  authors: "F. E. Terman",
  year: 1943,
  title: "Radio Engineers' Handbook",
  locator: "sec. 3, resonant circuits: omega0 = 1/sqrt(LC), Z0 = sqrt(L/C), Q = omega0 L / R (section from memory)",
} as const;

/**
 * Resonant frequency of an inductance and a capacitance.
 *
 * f0 = 1 / (2 pi sqrt(L C)), f0 in Hz, L in H, C in F: the frequency at which the
 * reactances omega L and 1/(omega C) are equal (series or lossless parallel tank).
 *
 * Accuracy: within 3 ulp. sqrt(L) sqrt(C) is formed root by root when the inputs are
 * moderate; otherwise L C is a scaled product, so it never overflows or underflows.
 *
 * Reference: F. E. Terman, Radio Engineers' Handbook (1943), resonant circuits (from memory).
 *
 * @example
 * resonantFrequency({ inductance: quantity(100, "uH"), capacitance: quantity(10, "nF") }); // ≈ 159 kHz
 */
export const resonantFrequency = /* @__PURE__ */ defineFormula({
  id: "resonantFrequency",
  title: "LC resonant frequency",
  category: "winding",
  description: "Frequency at which an inductance and a capacitance resonate (their reactances are equal); for a parallel tank with loss the frequency of unity power factor differs slightly.",
  equation: "f0 = 1 / (2 pi sqrt(L C))",
  inputs: RESONANCE_INPUTS,
  output: { dimension: "Frequency", description: "Resonant frequency" },
  source: LC_SOURCE,
  compute: (x) =>
    moderate(x.inductance) && moderate(x.capacitance)
      ? 1 / (TWO_PI * Math.sqrt(x.inductance * x.capacitance))
      : ONE.div(Scaled.of(x.inductance).times(x.capacitance).sqrt().times(TWO_PI)).toNumber(),
});

/**
 * Characteristic impedance of an LC tank.
 *
 * Z0 = sqrt(L / C), in ohm: the reactance of either element at resonance.
 *
 * Accuracy: within 2 ulp (scaled quotient outside the moderate range).
 *
 * @example
 * lcCharacteristicImpedance({ inductance: quantity(100, "uH"), capacitance: quantity(10, "nF") }); // = 100 ohm
 */
export const lcCharacteristicImpedance = /* @__PURE__ */ defineFormula({
  id: "lcCharacteristicImpedance",
  title: "LC characteristic impedance",
  category: "winding",
  description: "Characteristic impedance of an inductance and a capacitance, sqrt(L/C): the reactance of each at resonance.",
  equation: "Z0 = sqrt(L / C)",
  inputs: RESONANCE_INPUTS,
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  source: LC_SOURCE,
  compute: (x) =>
    moderate(x.inductance) && moderate(x.capacitance)
      ? Math.sqrt(x.inductance / x.capacitance)
      : Scaled.of(x.inductance).div(x.capacitance).sqrt().toNumber(),
});

/**
 * Quality factor of a series RLC circuit.
 *
 * Q = (1 / R) sqrt(L / C) = omega0 L / R, dimensionless, R in ohm the total series resistance
 * at the resonant frequency (winding AC resistance, capacitor ESR).
 *
 * Accuracy: within 3 ulp (scaled outside the moderate range).
 *
 * @example
 * seriesQualityFactor({ resistance: quantity(2, "ohm"), inductance: quantity(100, "uH"), capacitance: quantity(10, "nF") }); // = 50
 */
export const seriesQualityFactor = /* @__PURE__ */ defineFormula({
  id: "seriesQualityFactor",
  title: "Series RLC quality factor",
  category: "winding",
  description: "Quality factor of a series resonant circuit, the characteristic impedance over the total series resistance at resonance.",
  equation: "Q = sqrt(L / C) / R",
  inputs: [
    { name: "resistance", dimension: "Resistance", description: "Total series resistance at the resonant frequency", domain: POSITIVE, example: 2 },
    ...RESONANCE_INPUTS,
  ],
  output: { dimension: "Dimensionless", description: "Quality factor Q" },
  source: LC_SOURCE,
  compute: (x) =>
    moderate(x.inductance) && moderate(x.capacitance) && moderate(x.resistance)
      ? Math.sqrt(x.inductance / x.capacitance) / x.resistance
      : Scaled.of(x.inductance).div(x.capacitance).sqrt().div(x.resistance).toNumber(),
});
