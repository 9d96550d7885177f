import { EPSILON0, MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";
import { AT_LEAST_ONE, NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { scaledProduct } from "../math/scaled.js";

const TWO_PI = 2 * Math.PI;
const MU0_OVER_2PI = MU0 / (2 * Math.PI);

/** One locator for the loss ratio sigma/(omega eps) and the relaxation frequency where it is 1. */
const CHENG = { authors: "D. K. Cheng", year: 1989, title: "Field and Wave Electromagnetics, 2nd ed.", locator: "section 8-3, plane waves in lossy media, loss tangent sigma/(omega eps) (from memory)" } as const;
const ITU_P527 = { authors: "ITU-R", year: 1992, title: "Recommendation ITU-R P.527, Electrical characteristics of the surface of the Earth" } as const;

const GRIFFITHS = { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed." } as const;

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

/**
 * Touch-current caution from 0.5 mA: the body-current limit of energy source
 * class ES1 in IEC 62368-1 (0.5 mA r.m.s. for most waveforms; from memory),
 * measured with the networks of IEC 60990. Below it stray-capacitance current
 * is an interference (EMC) matter, not a shock hazard.
 */
const TOUCH_CURRENT_LIMIT = 0.5e-3;

// In mA where that reads well; in A for large values, where i * 1e3 could overflow.
const amps = (i: number): string => (i < 0.9995 ? `${formatNumber(i * 1e3, 3)} mA` : `${formatNumber(i, 3)} A`);

const TOUCH_CURRENT = {
  code: "touch_current",
  when: (_x: unknown, i: number | readonly number[]) => Math.abs(i as number) >= TOUCH_CURRENT_LIMIT,
  measure: (_x: unknown, i: number | readonly number[]) => Math.abs(i as number),
  message: (_x: unknown, i: number | readonly number[]) =>
    `${amps(Math.abs(i as number))} through the stray capacitance is at or above 0.5 mA, the ES1 touch-current limit of IEC 62368-1 (from memory): ` +
    "if it flows repeatedly (mains frequency, switching) through anything touching the circuit, measure its r.m.s. touch and protective-conductor " +
    `current by IEC 60990 and compare with the product safety standard's limit. ${GOVERN}`,
} as const;

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
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013),
 * section 7.3.2 (Ampere's law with Maxwell's correction; section from memory).
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
  source: { ...GRIFFITHS, locator: "section 7.3.2, eq. for the displacement current (from memory)" },
  // scaledProduct: a flux rate near the ends of the double range must not overflow or
  // underflow in eps0 epsr dPhi/dt before the result does (within 3 ulp, measured in tests/displacement/extremes-accuracy).
  compute: (x) => scaledProduct([EPSILON0, x.relativePermittivity, x.electricFluxRate], []),
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
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013), section 7.3.2 (section from memory).
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
  source: { ...GRIFFITHS, locator: "section 7.3.2, charging capacitor (from memory)" },
  // scaledProduct: one correctly rounded product, but one below 2^-1074 is out_of_range, not 0.
  compute: (x) => scaledProduct([x.capacitance, x.voltageRate], []),
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
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013), section 7.3.5
 * (J_d = dD/dt; section from memory).
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
  validity: [{ code: "dispersion", when: (x) => x.frequency > 1e8, measure: (x) => x.frequency / 1e8, message: DISPERSION_MESSAGE }],
  source: { ...GRIFFITHS, locator: "section 7.3.5, J_d = dD/dt (from memory)" },
  // scaledProduct: f epsr E0 may overflow or underflow in an intermediate step although J_d does not.
  compute: (x) => scaledProduct([TWO_PI, EPSILON0, x.frequency, x.relativePermittivity, x.fieldAmplitude], []),
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
 * (loss tangent; section from memory); ITU-R P.527 for material values.
 *
 * Method: sigma / (2 pi eps0 f epsr) through scaledProduct, so an extreme
 * frequency or conductivity cannot overflow or underflow the denominator
 * first (within 4 ulp, measured in tests/displacement/extremes-accuracy).
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
  validity: [{ code: "dispersion", when: (x) => x.frequency > 1e8, measure: (x) => x.frequency / 1e8, message: DISPERSION_MESSAGE }],
  source: [CHENG, ITU_P527],
  compute: (x) => scaledProduct([x.conductivity], [TWO_PI, EPSILON0, x.frequency, x.relativePermittivity]),
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
 * Method: sigma / (2 pi eps0 epsr) through scaledProduct (within 4 ulp; no
 * intermediate overflow or underflow).
 *
 * Reference: Cheng, Field and Wave Electromagnetics, 2nd ed. (1989), section 8-3
 * (loss tangent; section from memory).
 *
 * @example
 * dielectricRelaxationFrequency({ conductivity: quantity(4, "S/m"), relativePermittivity: 81 }); // ≈ 8.88e8 Hz
 */
export const dielectricRelaxationFrequency = /* @__PURE__ */ defineFormula({
  id: "dielectricRelaxationFrequency",
  title: "Dielectric relaxation frequency",
  category: "displacement",
  description: "Frequency at which conduction and displacement currents are equal in a material (its dielectric relaxation frequency).",
  equation: "f_c = sigma / (2 pi eps0 epsr)",
  inputs: [
    { name: "conductivity", dimension: "Conductivity", description: "Conductivity of the material", domain: POSITIVE, example: 4 },
    { name: "relativePermittivity", ...MATERIAL_PERMITTIVITY },
  ],
  output: { dimension: "Frequency", description: "Frequency at which conduction and displacement currents are equal" },
  validity: [{ code: "dispersion", when: (_x, f) => (f as number) > 1e8, measure: (_x, f) => (f as number) / 1e8, message: DISPERSION_MESSAGE }],
  source: [CHENG, ITU_P527],
  compute: (x) => scaledProduct([x.conductivity], [TWO_PI, EPSILON0, x.relativePermittivity]),
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
 * Derivation: the Ampere-Maxwell law on a circle of radius r about the axis,
 * with the displacement current I spread uniformly over the plate area pi R^2
 * (so the enclosed part is I r^2 / R^2 inside, all of I outside).
 *
 * Method: mu0/(2 pi) I r / R^2 and mu0/(2 pi) I / r through scaledProduct
 * (R^2 is never formed; within 4 ulp, no intermediate overflow or underflow).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013),
 * section 7.3.2 (Ampere's law with Maxwell's correction; section from memory).
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
  source: { ...GRIFFITHS, locator: "section 7.3.2, Ampere's law with Maxwell's correction, on a circle about the axis between the plates (from memory)" },
  compute: (x) =>
    x.radialDistance <= x.plateRadius
      ? scaledProduct([MU0_OVER_2PI, x.current, x.radialDistance], [x.plateRadius, x.plateRadius])
      : scaledProduct([MU0_OVER_2PI, x.current], [x.radialDistance]),
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
  description:
    "Current pushed through a stray capacitance by a voltage edge (switching node to heatsink or chassis). It flows through anything touching the circuit and is common-mode current that radiates and conducts interference (EMC).",
  equation: "I = C dV/dt",
  inputs: [
    { name: "capacitance", dimension: "Capacitance", description: "Stray capacitance", domain: POSITIVE, example: 1e-10 },
    { name: "voltageSlewRate", dimension: "VoltageRate", description: "Slew rate of the voltage across it (signed)", example: 1e10 },
  ],
  output: { dimension: "Current", description: "Peak current during the edge" },
  cautions: [TOUCH_CURRENT],
  source: [
    { authors: "H. W. Ott", year: 2009, title: "Electromagnetic Compatibility Engineering", locator: "ch. 2, capacitive coupling (chapter from memory)" },
    { authors: "IEC", title: "IEC 60990, Methods of measurement of touch current and protective conductor current" },
    { authors: "IEC", title: "IEC 62368-1, Audio/video, information and communication technology equipment - Part 1: Safety requirements", locator: "ES1 touch-current limit 0.5 mA (from memory)" },
  ],
  // scaledProduct: a product below 2^-1074 is out_of_range, not a silent 0.
  compute: (x) => scaledProduct([x.capacitance, x.voltageSlewRate], []),
});
