import { EPSILON0, MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { AT_LEAST_ONE, NON_NEGATIVE, POSITIVE } from "../core/spec.js";

const GRIFFITHS = { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed." } as const;

/** Relative permittivity of the medium the field is in (1 for vacuum). */
const MEDIUM_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the medium (1 for vacuum)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 1,
} as const;

/** Relative permittivity of a material (water about 80). */
const MATERIAL_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the material at the frequency of interest",
  domain: AT_LEAST_ONE,
  example: 81,
} as const;

const DISPERSION_MESSAGE =
  "conductivity and relative permittivity depend on frequency (dispersion) and on temperature, salinity and moisture: " +
  "use values measured near this frequency (ITU-R P.527 gives curves for ground and water); for water the " +
  "permittivity falls and the losses rise from about 1 GHz up";

const LEAKAGE_MESSAGE =
  "current through stray capacitance flows through anything touching the circuit: touch and protective-conductor " +
  "current are measured by IEC 60990 and limited by the product safety standard; it is also common-mode current " +
  "that radiates and conducts interference (EMC). Local codes and licensed practice govern";

/**
 * Displacement current through a surface from the rate of change of the
 * electric flux through it (Maxwell's term in the Ampere-Maxwell law).
 *
 * I_d = eps0 epsr dPhi_E/dt, with I_d in A, Phi_E = integral of E . dA the
 * electric flux in V m, its rate in V m/s, epsr the relative permittivity
 * (linear, isotropic medium) and eps0 in F/m (CODATA 2022).
 *
 * Validity: a linear, isotropic, non-dispersive medium filling the surface; in
 * a dispersive medium use epsr at the frequency of the change.
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017),
 * section 7.3.2 (Ampere's law with Maxwell's correction), and section 7.3.5
 * (in matter, J_d = dD/dt).
 *
 * @example
 * displacementCurrent({ electricFluxRate: 1e12 as ElectricFluxRate }); // ≈ 8.854 A
 */
export const displacementCurrent = /* @__PURE__ */ defineFormula({
  id: "displacementCurrent",
  title: "Displacement current from electric flux rate",
  category: "displacement",
  description: "Maxwell's displacement current through a surface, from the rate of change of the electric flux through it.",
  equation: "I_d = eps0 epsr dPhi_E/dt",
  inputs: [
    { name: "electricFluxRate", dimension: "ElectricFluxRate", description: "Rate of change of the electric flux through the surface (signed)", example: 1e12 },
    { name: "relativePermittivity", ...MEDIUM_PERMITTIVITY },
  ],
  output: { dimension: "Current", description: "Displacement current through the surface" },
  source: { ...GRIFFITHS, locator: "section 7.3.2, eq. for the displacement current" },
  compute: (x) => EPSILON0 * x.relativePermittivity * x.electricFluxRate,
});

/**
 * Displacement current between the plates of a capacitor whose voltage changes;
 * it equals the conduction current in the leads.
 *
 * I_d = C dV/dt, with I_d in A, C the capacitance in F and dV/dt in V/s. For
 * parallel plates, I_d = eps0 epsr A dE/dt with E = V/d gives the same C dV/dt.
 *
 * Validity: quasi-static (plate size small against the wavelength at the rate of change).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), section 7.3.2.
 *
 * @example
 * capacitorDisplacementCurrent({ capacitance: quantity(1, "uF"), voltageRate: quantity(1, "V/us") }); // ≈ 1 A
 */
export const capacitorDisplacementCurrent = /* @__PURE__ */ defineFormula({
  id: "capacitorDisplacementCurrent",
  title: "Displacement current in a capacitor",
  category: "displacement",
  description: "Displacement current between the plates of a capacitor with changing voltage, equal to the current in its leads.",
  equation: "I_d = C dV/dt",
  inputs: [
    { name: "capacitance", dimension: "Capacitance", description: "Capacitance", domain: POSITIVE, example: 1e-6 },
    { name: "voltageRate", dimension: "VoltageRate", description: "Rate of change of the voltage across it (signed)", example: 1e6 },
  ],
  output: { dimension: "Current", description: "Displacement current (= conduction current in the leads)" },
  source: { ...GRIFFITHS, locator: "section 7.3.2, charging capacitor" },
  compute: (x) => x.capacitance * x.voltageRate,
});

/**
 * Peak displacement current density of a sinusoidal electric field.
 *
 * J_d = omega eps0 epsr E0 = 2 pi f eps0 epsr E0, with J_d in A/m^2, f the
 * frequency in Hz, E0 the peak field in V/m and epsr the relative permittivity.
 *
 * Validity: linear medium; epsr taken at frequency f (warning above 100 MHz,
 * where many wet materials disperse).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), section 7.3.5
 * (J_d = dD/dt); D. K. Cheng, Field and Wave Electromagnetics, 2nd ed. (1989),
 * section 7-2 (ratio to conduction current; locator from memory).
 *
 * @example
 * displacementCurrentDensity({ relativePermittivity: 81, frequency: quantity(1, "MHz"),
 *   fieldAmplitude: quantity(1, "V/m") }); // ≈ 4.506e-3 A/m^2
 */
export const displacementCurrentDensity = /* @__PURE__ */ defineFormula({
  id: "displacementCurrentDensity",
  title: "Displacement current density (sinusoidal)",
  category: "displacement",
  description: "Peak displacement current density of a sinusoidal electric field in a linear medium.",
  equation: "J_d = 2 pi f eps0 epsr E0",
  inputs: [
    { name: "relativePermittivity", ...MATERIAL_PERMITTIVITY },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the field", domain: NON_NEGATIVE, example: 1e6 },
    { name: "fieldAmplitude", dimension: "ElectricField", description: "Peak electric field", domain: NON_NEGATIVE, example: 1 },
  ],
  output: { dimension: "CurrentDensity", description: "Peak displacement current density" },
  validity: [{ code: "dispersion", when: (x) => x.frequency > 1e8, message: DISPERSION_MESSAGE }],
  source: { ...GRIFFITHS, locator: "section 7.3.5, J_d = dD/dt" },
  compute: (x) => 2 * Math.PI * x.frequency * EPSILON0 * x.relativePermittivity * x.fieldAmplitude,
});

/**
 * Ratio of conduction to displacement current density in a lossy medium at a
 * frequency (the loss tangent from conductivity): > 1 conductor-like, < 1
 * dielectric-like.
 *
 * ratio = sigma / (omega eps0 epsr) = sigma / (2 pi f eps0 epsr), with sigma
 * the conductivity in S/m, f in Hz, epsr the relative permittivity.
 *
 * Validity: sigma and epsr at frequency f (they disperse; warning above 100 MHz).
 *
 * Reference: D. K. Cheng, Field and Wave Electromagnetics, 2nd ed. (1989), section 8-3
 * (good conductors and good insulators, from memory); ITU-R P.527 for material values.
 *
 * @example
 * conductionDisplacementRatio({ conductivity: quantity(4, "S/m"), relativePermittivity: 81,
 *   frequency: quantity(1, "MHz") }); // ≈ 888
 */
export const conductionDisplacementRatio = /* @__PURE__ */ defineFormula({
  id: "conductionDisplacementRatio",
  title: "Conduction to displacement current ratio",
  category: "displacement",
  description: "Ratio sigma/(omega eps) of conduction to displacement current in a lossy medium at one frequency.",
  equation: "ratio = sigma / (2 pi f eps0 epsr)",
  inputs: [
    { name: "conductivity", dimension: "Conductivity", description: "Conductivity at the frequency of interest", domain: NON_NEGATIVE, example: 4 },
    { name: "relativePermittivity", ...MATERIAL_PERMITTIVITY },
    { name: "frequency", dimension: "Frequency", description: "Frequency", domain: POSITIVE, example: 1e6 },
  ],
  output: { dimension: "Dimensionless", description: "Conduction current over displacement current" },
  validity: [{ code: "dispersion", when: (x) => x.frequency > 1e8, message: DISPERSION_MESSAGE }],
  source: [
    { authors: "D. K. Cheng", year: 1989, title: "Field and Wave Electromagnetics, 2nd ed.", locator: "section 8-3 (from memory)" },
    { authors: "ITU-R", year: 1992, title: "Recommendation ITU-R P.527, Electrical characteristics of the surface of the Earth" },
  ],
  // sigma / (2 pi f) / (eps0 epsr): two quotients of moderate size, no overflow of the product 2 pi f eps0 epsr.
  compute: (x) => x.conductivity / (2 * Math.PI * x.frequency) / (EPSILON0 * x.relativePermittivity),
});

/**
 * Frequency at which conduction and displacement currents in a material are
 * equal (the dielectric relaxation frequency 1/(2 pi tau), tau = eps/sigma).
 *
 * f_c = sigma / (2 pi eps0 epsr), with f_c in Hz, sigma in S/m, epsr the
 * relative permittivity and eps0 in F/m (CODATA 2022).
 *
 * Validity: sigma and epsr constant up to f_c; real materials disperse, so check
 * the values at f_c (warning when f_c is above 100 MHz).
 *
 * Reference: Cheng, Field and Wave Electromagnetics, 2nd ed. (1989), section 8-3 (from memory).
 *
 * @example
 * crossoverFrequency({ conductivity: quantity(4, "S/m"), relativePermittivity: 81 }); // ≈ 8.88e8 Hz
 */
export const crossoverFrequency = /* @__PURE__ */ defineFormula({
  id: "crossoverFrequency",
  title: "Conduction-displacement crossover frequency",
  category: "displacement",
  description: "Frequency at which conduction and displacement currents are equal in a material (its dielectric relaxation frequency).",
  equation: "f_c = sigma / (2 pi eps0 epsr)",
  inputs: [
    { name: "conductivity", dimension: "Conductivity", description: "Conductivity of the material", domain: POSITIVE, example: 4 },
    { name: "relativePermittivity", ...MATERIAL_PERMITTIVITY },
  ],
  output: { dimension: "Frequency", description: "Crossover frequency" },
  validity: [{ code: "dispersion", when: (_x, f) => (f as number) > 1e8, message: DISPERSION_MESSAGE }],
  source: [
    { authors: "D. K. Cheng", year: 1989, title: "Field and Wave Electromagnetics, 2nd ed.", locator: "section 8-3 (from memory)" },
    { authors: "ITU-R", year: 1992, title: "Recommendation ITU-R P.527, Electrical characteristics of the surface of the Earth" },
  ],
  compute: (x) => x.conductivity / (2 * Math.PI) / (EPSILON0 * x.relativePermittivity),
});

/**
 * Magnetic flux density between the circular plates of a charging capacitor,
 * from the Ampere-Maxwell law with a uniform displacement current.
 *
 * B = mu0 I r / (2 pi R^2) for r <= R, B = mu0 I / (2 pi r) for r >= R, with B
 * the azimuthal flux density in T (sign follows the current by the right-hand
 * rule), I the charging current in A, R the plate radius in m, r the distance
 * from the axis in m and mu0 in H/m (CODATA 2022). Continuous at r = R.
 *
 * Validity: gap much smaller than R (uniform field between the plates, fringing
 * neglected), quasi-static (R much smaller than the wavelength at the rate of
 * change), leads along the axis; outside (r > R) the field is taken in the mid-plane.
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017),
 * Problem 7.34 (fat wire with a narrow gap; problem number from memory).
 *
 * @example
 * chargingCapacitorField({ current: quantity(1, "A"), plateRadius: quantity(5, "cm"),
 *   radialDistance: quantity(2.5, "cm") }); // ≈ 2e-6 T
 */
export const chargingCapacitorField = /* @__PURE__ */ defineFormula({
  id: "chargingCapacitorField",
  title: "Magnetic field in a charging capacitor",
  category: "displacement",
  description: "Azimuthal flux density between circular capacitor plates carrying a charging current, from the Ampere-Maxwell law.",
  equation: "B = mu0 I r / (2 pi R^2) (r <= R); mu0 I / (2 pi r) (r >= R)",
  inputs: [
    { name: "current", dimension: "Current", description: "Charging current in the leads (signed)", example: 1 },
    { name: "plateRadius", dimension: "Length", description: "Radius of the circular plates", domain: POSITIVE, example: 0.05 },
    { name: "radialDistance", dimension: "Length", description: "Distance from the axis (0 allowed)", domain: NON_NEGATIVE, example: 0.025 },
  ],
  output: { dimension: "FluxDensity", description: "Azimuthal flux density" },
  source: { ...GRIFFITHS, locator: "Problem 7.34 (number from memory)" },
  // Inside: (r/R)/R keeps the ratio near 1 before dividing once more; outside: one quotient.
  compute: (x) =>
    x.radialDistance <= x.plateRadius
      ? ((MU0 / (2 * Math.PI)) * x.current * (x.radialDistance / x.plateRadius)) / x.plateRadius
      : ((MU0 / (2 * Math.PI)) * x.current) / x.radialDistance,
});

/**
 * Current driven through a stray (parasitic) capacitance by a voltage edge:
 * the common EMC and leakage check for switching nodes, heatsinks and
 * transformer interwinding capacitance.
 *
 * I = C dV/dt, with I in A, C the stray capacitance in F and dV/dt the slew
 * rate of the voltage across it in V/s.
 *
 * Validity: the current flows only during the edge; its average over a
 * switching period is C dV f for a step dV at frequency f. The return path's
 * impedance limits the peak when it is not small against 1/(omega C).
 *
 * Reference: H. W. Ott, Electromagnetic Compatibility Engineering (2009),
 * ch. 2 (capacitive coupling; chapter from memory); IEC 60990 (measurement of
 * touch current and protective conductor current).
 *
 * @example
 * parasiticCouplingCurrent({ capacitance: quantity(100, "pF"), voltageSlewRate: quantity(10, "V/ns") }); // ≈ 1 A
 */
export const parasiticCouplingCurrent = /* @__PURE__ */ defineFormula({
  id: "parasiticCouplingCurrent",
  title: "Parasitic coupling current",
  category: "displacement",
  description: "Current pushed through a stray capacitance by a voltage edge (switching node to heatsink or chassis).",
  equation: "I = C dV/dt",
  inputs: [
    { name: "capacitance", dimension: "Capacitance", description: "Stray capacitance", domain: POSITIVE, example: 1e-10 },
    { name: "voltageSlewRate", dimension: "VoltageRate", description: "Slew rate of the voltage across it (signed)", example: 1e10 },
  ],
  output: { dimension: "Current", description: "Peak current during the edge" },
  cautions: [{ code: "leakage_and_emc", message: LEAKAGE_MESSAGE }],
  source: [
    { authors: "H. W. Ott", year: 2009, title: "Electromagnetic Compatibility Engineering", locator: "ch. 2, capacitive coupling (chapter from memory)" },
    { authors: "IEC", title: "IEC 60990, Methods of measurement of touch current and protective conductor current" },
  ],
  compute: (x) => x.capacitance * x.voltageSlewRate,
});
