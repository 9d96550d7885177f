import { SPEED_OF_LIGHT } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { dot, norm, type V3 } from "../math/vec3.js";
import { crossPlus, scaledVector } from "./cross.js";
import { strongFieldCaution } from "../core/hazards.js";
import { ldexp, scaledProduct } from "../math/scaled.js";
import { beamCaution, CHARGE, PARTICLE_MASS, lorentzFactor } from "./shared.js";

const C = SPEED_OF_LIGHT;
const C2 = C * C;

const TWO_PI = 2 * Math.PI;

/** The library's one strong-field rule on the flux-density input, a static field (ICNIRP 2009 lines). */
const STRONG_FIELD = strongFieldCaution((x: { readonly fluxDensity: number }) => x.fluxDensity, "static");

// 2^600 and 2^-600: exact scalings that bring a sum of two tiny or two huge
// positive numbers into the normal range without changing its digits.
const UP = 2 ** 600;
const DOWN = 2 ** -600;

/**
 * gamma m = m + T / c2 (c2 = c^2 unless given) for m > 0, T >= 0, returned as [value, factor] with
 * the true value = value * factor, so the sum keeps its digits where m and T
 * are so small that T / c^2 would underflow, or so large that the sum would
 * overflow. A sum of two positive terms: no cancellation (half an ulp each step).
 */
function relativisticMass(m: number, t: number, c2: number = C2): [number, number] {
  if (m >= 1e-280 && m <= 1e300) return [m + t / c2, 1];
  if (m < 1e-280) {
    const tm = (t * DOWN) / c2; // t / c2 * 2^-600: finite for every finite t
    if (tm >= 1e-300) return [m + t / c2, 1]; // T dominates, no underflow in t / c2
    return [m * UP + (t * UP) / c2, DOWN];
  }
  return [m * DOWN + (t * DOWN) / c2, UP];
}

const JACKSON = { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed." } as const;

/**
 * Cyclotron (gyro) frequency of a charged particle in a uniform magnetic field.
 *
 * f = |q| B / (2 pi gamma m), with f in Hz, q the charge in C, B the flux
 * density in T, m the rest mass in kg and gamma = 1 + T/(m c^2) from the
 * kinetic energy T in J (default 0: the non-relativistic frequency, which does
 * not depend on the speed). The angular frequency is 2 pi f.
 *
 * Presets: `cyclotronFrequency({ charge: proton.charge, mass: proton.mass, fluxDensity })`.
 *
 * Validity: exact for a uniform static B (with T the particle's kinetic energy);
 * in a non-uniform field it is the local value.
 *
 * Reference: J. D. Jackson, Classical Electrodynamics, 3rd ed. (1999), section 12.2,
 * omega_B = e B / (gamma m) in SI (section from memory).
 *
 * @example
 * cyclotronFrequency({ charge: proton.charge, mass: proton.mass, fluxDensity: quantity(1, "T") }); // ≈ 1.5245e7 Hz
 */
export const cyclotronFrequency = /* @__PURE__ */ defineFormula({
  id: "cyclotronFrequency",
  title: "Cyclotron frequency",
  category: "particle",
  description: "Gyration frequency of a charged particle in a uniform magnetic field; relativistic when a kinetic energy is given.",
  equation: "f = |q| B / (2 pi gamma m), gamma = 1 + T / (m c^2)",
  inputs: [
    { name: "charge", ...CHARGE },
    { name: "mass", ...PARTICLE_MASS },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density of the uniform field", domain: NON_NEGATIVE, example: 0.1 },
    { name: "kineticEnergy", dimension: "Energy", description: "Kinetic energy (0 = non-relativistic limit)", domain: NON_NEGATIVE, default: 0, example: 0 },
  ],
  output: { dimension: "Frequency", description: "Cyclotron frequency (cycles per second)" },
  cautions: [STRONG_FIELD],
  source: { ...JACKSON, locator: "section 12.2, gyration frequency (from memory)" },
  // gamma m = m + T/c^2: no subtraction, exact at T = 0; scaledProduct: no intermediate overflow or
  // underflow in |q| B / (2 pi gamma m); within 4 ulp.
  compute: (x) => {
    const [gm, factor] = relativisticMass(x.mass, x.kineticEnergy);
    return scaledProduct([Math.abs(x.charge), x.fluxDensity], [TWO_PI, gm, factor]);
  },
});

/**
 * Gyroradius (Larmor radius) of a non-relativistic charged particle.
 *
 * r = m v / (|q| B), with r in m, m the rest mass in kg, v the speed
 * perpendicular to B in m/s, q the charge in C and B the flux density in T.
 *
 * Validity: non-relativistic. The true radius is gamma times larger, so this
 * one is low by 1 - 1/gamma: 0.5 % at 0.1 c, 13 % at 0.5 c; a warning gives
 * the figure above 0.1 c (use relativisticGyroradius there).
 *
 * Reference: Jackson, Classical Electrodynamics, 3rd ed. (1999), section 12.2 (section from memory).
 *
 * @example
 * gyroradius({ mass: electron.mass, speed: quantity(1e6, "m/s"), charge: electron.charge,
 *   fluxDensity: quantity(1, "mT") }); // ≈ 5.686e-3 m
 */
export const gyroradius = /* @__PURE__ */ defineFormula({
  id: "gyroradius",
  title: "Gyroradius (non-relativistic)",
  category: "particle",
  description: "Radius of the circular motion of a charged particle in a uniform magnetic field, for speeds well below c.",
  equation: "r = m v / (|q| B)",
  inputs: [
    { name: "mass", ...PARTICLE_MASS },
    { name: "speed", dimension: "Velocity", description: "Speed perpendicular to B", domain: NON_NEGATIVE, example: 1e6 },
    { name: "charge", ...CHARGE },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density of the uniform field", domain: POSITIVE, example: 1e-3 },
  ],
  output: { dimension: "Length", description: "Gyroradius" },
  relations: [
    { rule: "charge != 0", holds: (x) => x.charge !== 0 },
    { rule: "speed < c (speed of light)", holds: (x) => x.speed < C },
  ],
  validity: [
    {
      code: "relativistic_speed",
      when: (x) => x.speed > 0.1 * C,
      measure: (x) => x.speed / C,
      message: (x) => {
        const g = lorentzFactor(x.speed);
        return `speed is ${(x.speed / C).toPrecision(3)} c: the non-relativistic radius is ${(100 * (1 - 1 / g)).toPrecision(2)} % ` +
          `too small (true radius is gamma = ${g.toPrecision(4)} times larger); use relativisticGyroradius`;
      },
    },
  ],
  cautions: [STRONG_FIELD],
  source: { ...JACKSON, locator: "section 12.2, gyration radius (gamma = 1) (from memory)" },
  // scaledProduct: m v / (|q| B) with no intermediate overflow or underflow, within 2 ulp.
  compute: (x) => scaledProduct([x.mass, x.speed], [Math.abs(x.charge), x.fluxDensity]),
});

/**
 * Gyroradius of a charged particle of any energy, from its kinetic energy.
 *
 * r = p / (|q| B), p c = sqrt(T (T + 2 m c^2)), with r in m, p the momentum in
 * kg m/s, T the kinetic energy in J (of motion perpendicular to B), m the rest
 * mass in kg, q the charge in C, B the flux density in T and c in m/s.
 *
 * For a pitch angle alpha between the velocity and B, multiply by sin(alpha).
 * Written as sqrt(T) sqrt(T + 2 m c^2), p c has no cancellation for small T (it
 * tends to sqrt(2 m T) c, the non-relativistic momentum) and does not overflow
 * for large T.
 *
 * Reference: Jackson, Classical Electrodynamics, 3rd ed. (1999), section 12.2
 * (a = c p / (e B) in Gaussian units; r = p/(|q| B) in SI; section from memory).
 *
 * @example
 * relativisticGyroradius({ mass: electron.mass, kineticEnergy: quantity(1, "MeV"),
 *   charge: electron.charge, fluxDensity: quantity(0.1, "T") }); // ≈ 4.744e-2 m
 */
export const relativisticGyroradius = /* @__PURE__ */ defineFormula({
  id: "relativisticGyroradius",
  title: "Gyroradius (relativistic)",
  category: "particle",
  description: "Radius of the circular motion of a charged particle in a uniform magnetic field from its kinetic energy, valid at any energy.",
  equation: "r = sqrt(T (T + 2 m c^2)) / (c |q| B)",
  inputs: [
    { name: "mass", ...PARTICLE_MASS },
    { name: "kineticEnergy", dimension: "Energy", description: "Kinetic energy of the motion perpendicular to B", domain: NON_NEGATIVE, example: 1.602176634e-13 },
    { name: "charge", ...CHARGE },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density of the uniform field", domain: POSITIVE, example: 0.1 },
  ],
  output: { dimension: "Length", description: "Gyroradius" },
  relations: [{ rule: "charge != 0", holds: (x) => x.charge !== 0 }],
  cautions: [beamCaution, STRONG_FIELD],
  source: { ...JACKSON, locator: "section 12.2, gyration radius (from memory)" },
  compute: (x) => {
    // p c = sqrt(T) sqrt(T + 2 m c^2), a product of square roots: no cancellation as T -> 0 and no
    // T^2. T + 2 m c^2 = 2 c^2 (gamma m as in cyclotronFrequency, with T/2): scaled so that it
    // neither overflows nor underflows; scaledProduct then divides by c |q| B (within 4 ulp).
    const [half, factor] = relativisticMass(x.mass, x.kineticEnergy, 2 * C2); // (T + 2 m c^2) / (2 c^2) / factor
    return scaledProduct([Math.sqrt(x.kineticEnergy), Math.sqrt(half), Math.sqrt(2 * factor)], [Math.abs(x.charge), x.fluxDensity]);
  },
});

/**
 * E x B drift velocity of the guiding centre of a charged particle in crossed
 * uniform electric and magnetic fields.
 *
 * v_d = E x B / B^2, with v_d in m/s (vector), E in V/m and B in T (vectors).
 * The same for every charge and mass. Its magnitude is E/B for perpendicular fields.
 *
 * Validity: uniform static fields with |E_perp| < c |B|. v_d is the velocity of
 * the frame in which E vanishes, exact also relativistically; when |E_perp| >= c |B|
 * no such frame exists and the particle is accelerated without bound (warning).
 * A component of E along B accelerates the particle along B (warning).
 *
 * Reference: Jackson, Classical Electrodynamics, 3rd ed. (1999), section 12.3 (section from memory).
 *
 * @example
 * driftVelocity({ electricField: [1e3, 0, 0] as Vec3<ElectricField>,
 *   fluxDensity: [0, 0, 0.01] as Vec3<FluxDensity> }); // ≈ [0, -1e5, 0] m/s
 */
export const driftVelocity = /* @__PURE__ */ defineFormula({
  id: "driftVelocity",
  title: "E x B drift velocity",
  category: "particle",
  description: "Guiding-centre drift velocity E x B / B^2 of a charged particle in crossed electric and magnetic fields, independent of charge and mass.",
  equation: "v_d = E x B / B^2",
  inputs: [
    { name: "electricField", dimension: "ElectricField", description: "Uniform electric field", vector: true, example: [1e3, 0, 0] },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Uniform magnetic flux density (not zero)", vector: true, example: [0, 0, 0.01] },
  ],
  output: { dimension: "Velocity", description: "Drift velocity of the guiding centre", components: ["x", "y", "z"] },
  relations: [{ rule: "|fluxDensity| > 0", holds: (x) => norm(x.fluxDensity) > 0 }],
  validity: [
    {
      code: "no_drift_frame",
      when: (_x, v) => norm(v as V3) >= C,
      measure: (_x, v) => norm(v as V3) / C,
      message: (_x, v) =>
        `E_perp / B = ${(norm(v as V3) / C).toPrecision(3)} c is not below c: no frame exists in which E vanishes, ` +
        "so the particle does not drift but is accelerated without bound; this result does not apply",
    },
    {
      code: "relativistic_drift",
      when: (_x, v) => norm(v as V3) > 0.1 * C && norm(v as V3) < C,
      measure: (_x, v) => norm(v as V3) / C,
      message: (_x, v) =>
        `drift speed is ${(norm(v as V3) / C).toPrecision(3)} c: E x B / B^2 is still the guiding-centre velocity, ` +
        "but the gyration is relativistic and its lab-frame orbit is distorted; trace the particle to see it",
    },
    {
      code: "parallel_electric_field",
      when: (x) => Math.abs(dot(x.electricField, unit(x.fluxDensity))) > 1e-6 * norm(x.electricField),
      // The fraction of E along B (0 for E = 0).
      measure: (x) => { const e = norm(x.electricField); return e > 0 ? Math.abs(dot(x.electricField, unit(x.fluxDensity))) / e : 0; },
      message: (x) =>
        `E has a component of ${dot(x.electricField, unit(x.fluxDensity)).toPrecision(3)} V/m along B: it accelerates ` +
        "the particle along B; the drift given is that of the perpendicular part only",
    },
  ],
  source: { ...JACKSON, locator: "section 12.3, crossed E and B fields (from memory)" },
  // E x B component by component from exact products (crossPlus), over |B|^2 formed from B
  // scaled by a power of two (no overflow or underflow); within 6 ulp per component.
  compute: (x) => {
    const B = x.fluxDensity;
    const eb = Math.floor(Math.log2(Math.max(Math.abs(B[0]), Math.abs(B[1]), Math.abs(B[2]))));
    const b0 = ldexp(B[0], -eb), b1 = ldexp(B[1], -eb), b2 = ldexp(B[2], -eb);
    const b2sum = b0 * b0 + b1 * b1 + b2 * b2; // in [0.25, 12): a sum of squares of scaled components
    const s = crossPlus(x.electricField, B);
    const shift = -2 * eb;
    return scaledVector(1 / b2sum, { mantissa: s.mantissa, exponent: [s.exponent[0] + shift, s.exponent[1] + shift, s.exponent[2] + shift] });
  },
});

function unit(v: V3): V3 {
  const n = norm(v);
  return [v[0] / n, v[1] / n, v[2] / n];
}
