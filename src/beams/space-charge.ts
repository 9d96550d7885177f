import { BOLTZMANN, ELECTRON_MASS, ELEMENTARY_CHARGE, EPSILON0, SPEED_OF_LIGHT } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { voltageCautions } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { Scaled } from "../math/scaled.js";
import { beamCautionFor, CHARGE, PARTICLE_MASS } from "../force/shared.js";

const C2 = SPEED_OF_LIGHT * SPEED_OF_LIGHT;
const TWO_PI = 2 * Math.PI;

/** Charge and mass inputs that default to the electron's (formulas about electrons). */
const ELECTRON_CHARGE = { ...CHARGE, default: -ELEMENTARY_CHARGE } as const;
const ELECTRON_MASS_INPUT = { ...PARTICLE_MASS, default: ELECTRON_MASS } as const;

const CHEN = {
  authors: "F. F. Chen",
  year: 2016,
  title: "Introduction to Plasma Physics and Controlled Fusion, 3rd ed.",
} as const;

/** |q| V / (m c^2): the kinetic energy gained across the gap in units of the rest energy (scaled: no overflow). */
function energyRatio(x: { readonly voltage: number; readonly charge: number; readonly mass: number }): number {
  return Scaled.of(x.charge).times(x.voltage).div(Scaled.of(x.mass).times(C2)).toNumber();
}

/**
 * Space-charge-limited current density of a planar diode (Child-Langmuir law).
 *
 * J = (4 eps0 / 9) sqrt(2 |q| / m) V^(3/2) / d^2, with J in A/m^2, V the
 * anode-cathode voltage in V, d the gap in m, q and m the charge (C) and mass
 * (kg) of the carriers (default: the electron's), eps0 in F/m (CODATA 2022).
 * For electrons J = 2.33e-6 V^(3/2) / d^2 A/m^2.
 *
 * Validity: planar, infinite electrodes, carriers leaving the cathode at rest,
 * non-relativistic: a warning when |q| V passes 1 % of m c^2 (5.1 kV for
 * electrons; common practice), where the relativistic correction starts to show.
 *
 * Cautions: voltage bands (IEC 61140); a beam from 5 keV (common practice).
 *
 * Reference: C. D. Child, Phys. Rev. (Series I) 32 (1911) 492; I. Langmuir,
 * Phys. Rev. 2 (1913) 450 (both from memory).
 *
 * @example
 * childLangmuirCurrentDensity({ voltage: quantity(1, "kV"), gap: quantity(1, "cm") }); // ≈ 738 A/m^2
 */
export const childLangmuirCurrentDensity = /* @__PURE__ */ defineFormula({
  id: "childLangmuirCurrentDensity",
  title: "Child-Langmuir current density",
  category: "beam",
  description: "Space-charge-limited current density of a planar diode (Child-Langmuir law), non-relativistic; electrons by default.",
  equation: "J = (4 eps0 / 9) sqrt(2 |q| / m) V^(3/2) / d^2",
  inputs: [
    { name: "voltage", dimension: "Voltage", description: "Anode-cathode voltage (accelerating)", domain: POSITIVE, example: 1000 },
    { name: "gap", dimension: "Length", description: "Anode-cathode gap", domain: POSITIVE, example: 0.01 },
    { name: "charge", ...ELECTRON_CHARGE },
    { name: "mass", ...ELECTRON_MASS_INPUT },
  ],
  output: { dimension: "CurrentDensity", description: "Space-charge-limited current density" },
  relations: [{ rule: "charge != 0", holds: (x) => x.charge !== 0 }],
  validity: [
    {
      code: "relativistic_energy",
      when: (x) => energyRatio(x) > 0.01,
      measure: (x) => energyRatio(x),
      message: (x) =>
        `the carriers gain ${(100 * energyRatio(x)).toPrecision(3)} % of their rest energy across the gap (above 1 %, common practice): ` +
        "the non-relativistic Child-Langmuir law no longer holds to that order; use a relativistic diode model",
    },
  ],
  cautions: [
    ...voltageCautions("dc", (x: { readonly voltage: number }) => x.voltage),
    beamCautionFor((x: { readonly voltage: number; readonly charge: number }) => Scaled.of(x.charge).times(x.voltage).toNumber()),
  ],
  source: [
    { authors: "C. D. Child", year: 1911, title: "Discharge from hot CaO, Phys. Rev. (Series I) 32, 492", locator: "space-charge-limited current (from memory)" },
    { authors: "I. Langmuir", year: 1913, title: "The effect of space charge and residual gases on thermionic currents in high vacuum, Phys. Rev. 2, 450", locator: "eq. for plane electrodes (from memory)" },
  ],
  // Scaled: 2|q|/m, V^(3/2) and d^2 may each overflow or underflow while J does not; within a few ulp.
  compute: (x) =>
    Scaled.of((4 * EPSILON0) / 9).times(Scaled.of(x.charge).times(2).div(x.mass).sqrt())
      .times(x.voltage).times(Math.sqrt(x.voltage)).div(x.gap).div(x.gap).toNumber(),
});

/**
 * Plasma frequency of a species (electrons by default), in Hz.
 *
 * f_p = (1 / (2 pi)) sqrt(n q^2 / (eps0 m)), with n the number density in
 * 1/m^3, q the charge in C, m the mass in kg, eps0 in F/m (CODATA 2022).
 * For electrons f_pe = 8.98 sqrt(n) Hz (n in 1/m^3). The angular frequency is 2 pi f_p.
 *
 * Validity: cold, uniform plasma; with thermal motion the oscillation
 * disperses (Bohm-Gross), which this leaves out.
 *
 * Reference: Chen, Introduction to Plasma Physics and Controlled Fusion, 3rd ed.
 * (2016), section 4.3 (from memory).
 *
 * @example
 * plasmaFrequency({ density: quantity(1e18, "1/m^3") }); // ≈ 8.98e9 Hz
 */
export const plasmaFrequency = /* @__PURE__ */ defineFormula({
  id: "plasmaFrequency",
  title: "Plasma frequency",
  category: "beam",
  description: "Plasma (oscillation) frequency of a species in cycles per second; electrons by default.",
  equation: "f_p = (1/(2 pi)) sqrt(n q^2 / (eps0 m))",
  inputs: [
    { name: "density", dimension: "NumberDensity", description: "Number density of the species", domain: POSITIVE, example: 1e18 },
    { name: "charge", ...ELECTRON_CHARGE },
    { name: "mass", ...ELECTRON_MASS_INPUT },
  ],
  output: { dimension: "Frequency", description: "Plasma frequency (cycles per second)" },
  source: { ...CHEN, locator: "section 4.3, omega_p = sqrt(n e^2 / (eps0 m)) (from memory)" },
  // Scaled: n q^2 may underflow while f_p does not; within a few ulp.
  compute: (x) => Scaled.of(x.density).div(EPSILON0).div(x.mass).sqrt().times(x.charge).div(TWO_PI).toNumber(),
});

/**
 * Debye length of a plasma from its electron temperature and density.
 *
 * lambda_D = sqrt(eps0 k_B T_e / (n e^2)), with T_e the electron temperature in K,
 * n the electron density in 1/m^3, k_B in J/K and e in C (exact, SI 2019); lambda_D in m.
 * 1 eV corresponds to 11604.5 K.
 *
 * Validity: a plasma needs many particles in a Debye sphere; the electron
 * Debye length only (ions cold).
 *
 * Reference: Chen (2016), section 1.4 (from memory).
 *
 * @example
 * debyeLength({ temperature: quantity(11604.5, "K"), density: quantity(1e18, "1/m^3") }); // ≈ 7.43e-6 m
 */
export const debyeLength = /* @__PURE__ */ defineFormula({
  id: "debyeLength",
  title: "Debye length",
  category: "beam",
  description: "Electron Debye length of a plasma from the electron temperature (kelvin) and density.",
  equation: "lambda_D = sqrt(eps0 k_B T_e / (n e^2))",
  inputs: [
    { name: "temperature", dimension: "Temperature", description: "Electron temperature in kelvin", domain: POSITIVE, example: 11604.518 },
    { name: "density", dimension: "NumberDensity", description: "Electron density", domain: POSITIVE, example: 1e18 },
  ],
  output: { dimension: "Length", description: "Debye length" },
  source: { ...CHEN, locator: "section 1.4, lambda_D = (eps0 K T_e / (n e^2))^(1/2) (from memory)" },
  // Scaled: T / n may overflow or underflow while lambda_D does not; within a few ulp.
  compute: (x) => Scaled.of(EPSILON0 * BOLTZMANN).times(x.temperature).div(x.density).sqrt().div(ELEMENTARY_CHARGE).toNumber(),
});

/**
 * Perveance of a space-charge-limited gun or diode: its current per voltage to the 3/2.
 *
 * K = I / V^(3/2), with I the beam current in A, V the accelerating voltage in V,
 * K in A/V^1.5 (SI exponents m^-3 kg^-1.5 s^4.5 A^2.5). By the Child-Langmuir law
 * the current of a space-charge-limited gun grows as V^(3/2), so K depends on
 * the gun's geometry alone; for a planar diode of area A and gap d,
 * K = (4 eps0 / 9) sqrt(2 e / m) A / d^2 (2.334e-6 A/d^2 A/V^1.5 for electrons).
 * Guns are quoted in microperveance, K in units of 1e-6 A/V^1.5: "1.5 uA/V^1.5".
 *
 * Validity: a definition; it says something about the gun where the current
 * is space-charge limited (not temperature limited) and non-relativistic.
 *
 * Cautions: voltage bands (IEC 61140); a beam of singly charged particles from 5 keV (common practice).
 *
 * Reference: J. R. Pierce, Theory and Design of Electron Beams, 2nd ed. (1954), the
 * perveance of a gun (from memory).
 *
 * @example
 * perveance({ current: quantity(414, "A"), voltage: quantity(350, "kV") }); // ≈ 2.0e-6 A/V^1.5
 */
export const perveance = /* @__PURE__ */ defineFormula({
  id: "perveance",
  title: "Perveance",
  category: "beam",
  description: "Perveance I / V^(3/2) of a space-charge-limited gun or diode: a property of its geometry, in A/V^1.5 (microperveance is 1e-6 A/V^1.5).",
  equation: "K = I / V^(3/2)",
  inputs: [
    { name: "current", dimension: "Current", description: "Beam (cathode) current", domain: POSITIVE, example: 414 },
    { name: "voltage", dimension: "Voltage", description: "Accelerating (anode-cathode) voltage", domain: POSITIVE, example: 350e3 },
  ],
  output: { dimension: "Perveance", description: "Perveance, current per voltage^(3/2)" },
  cautions: [
    ...voltageCautions("dc", (x: { readonly voltage: number }) => x.voltage),
    beamCautionFor((x: { readonly voltage: number }) => Scaled.of(ELEMENTARY_CHARGE).times(x.voltage).toNumber()),
  ],
  source: { authors: "J. R. Pierce", year: 1954, title: "Theory and Design of Electron Beams, 2nd ed.", locator: "perveance I/V^(3/2) of a gun (from memory)" },
  // Scaled: V^(3/2) overflows past 1e205 V and underflows below 1e-205 V while K may not; sqrt(V) itself
  // never does. Three roundings and a correctly rounded sqrt: within a few ulp.
  compute: (x) => Scaled.of(x.current).div(x.voltage).div(Math.sqrt(x.voltage)).toNumber(),
});
