import { SPEED_OF_LIGHT } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { Scaled, scaledProduct } from "../math/scaled.js";
import { beamCaution, CHARGE, PARTICLE_MASS } from "../force/shared.js";

const C = SPEED_OF_LIGHT;
const C2 = C * C; // 8.987551787368176e16: rounded once (c^2 is not a double)

const JACKSON = { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed." } as const;
const WIEDEMANN = { authors: "H. Wiedemann", year: 2015, title: "Particle Accelerator Physics, 4th ed." } as const;

const KINETIC_ENERGY = {
  dimension: "Energy",
  description: "Kinetic energy of the particle",
  domain: NON_NEGATIVE,
  example: 1.602176634e-13, // 1 MeV
} as const;

/**
 * Rest energy m c^2 as a scaled number: m may be as small as 1e-300 kg or as
 * large as 1e300 kg while the ratios below stay representable.
 */
function restEnergy(m: number): Scaled {
  return Scaled.of(m).times(C2);
}

/**
 * Lorentz factor of a particle from its kinetic energy.
 *
 * gamma = 1 + T / (m c^2), with T the kinetic energy in J, m the rest mass in
 * kg and c in m/s (exact in SI). Presets: `mass: electron.mass`.
 *
 * Exact at any energy: gamma - 1 = T/(m c^2) is formed directly, so a particle
 * at 1e-12 of its rest energy has gamma = 1 + 1e-12 to the last digit of the
 * sum (no speed is squared and subtracted from 1).
 *
 * Reference: Jackson, Classical Electrodynamics, 3rd ed. (1999), section 11.5,
 * E = gamma m c^2 (section from memory).
 *
 * @example
 * lorentzFactor({ kineticEnergy: quantity(1, "MeV"), mass: electron.mass }); // ≈ 2.957
 */
export const lorentzFactor = /* @__PURE__ */ defineFormula({
  id: "lorentzFactor",
  title: "Lorentz factor",
  category: "beam",
  description: "Lorentz factor gamma = 1 + T/(m c^2) of a particle of given kinetic energy and rest mass.",
  equation: "gamma = 1 + T / (m c^2)",
  inputs: [
    { name: "kineticEnergy", ...KINETIC_ENERGY },
    { name: "mass", ...PARTICLE_MASS },
  ],
  output: { dimension: "Dimensionless", description: "Lorentz factor gamma (at least 1)" },
  cautions: [beamCaution],
  source: { ...JACKSON, locator: "section 11.5, E = gamma m c^2 (from memory)" },
  // T/(m c^2) scaled (m c^2 may overflow or underflow on its own), then one addition: within 2 ulp.
  // Below 2^-60 the ratio cannot change the sum (and may be below the smallest subnormal): gamma = 1.
  compute: (x) => {
    const t = Scaled.of(x.kineticEnergy).div(restEnergy(x.mass));
    return t.m === 0 || t.e < -60 ? 1 : 1 + t.toNumber();
  },
});

/**
 * Speed of a particle from its kinetic energy.
 *
 * v = c sqrt(t (2 + t)) / (1 + t), t = T / (m c^2) (so that gamma = 1 + t and
 * beta = sqrt(1 - 1/gamma^2) without the cancellation of 1 - 1/gamma^2 at low
 * energy), with v in m/s, T in J, m in kg. Written on scaled numbers as
 * v = c sqrt(T (T + 2 m c^2)) / (T + m c^2): sums of positive terms only.
 *
 * Reference: Jackson (1999), section 11.5 (from memory).
 *
 * @example
 * particleSpeed({ kineticEnergy: quantity(1, "MeV"), mass: electron.mass }); // ≈ 2.821e8 m/s (0.941 c)
 */
export const particleSpeed = /* @__PURE__ */ defineFormula({
  id: "particleSpeed",
  title: "Particle speed from kinetic energy",
  category: "beam",
  description: "Speed of a particle of given kinetic energy and rest mass, relativistically exact and without cancellation at low energy.",
  equation: "v = c sqrt(t (2 + t)) / (1 + t), t = T / (m c^2)",
  inputs: [
    { name: "kineticEnergy", ...KINETIC_ENERGY },
    { name: "mass", ...PARTICLE_MASS },
  ],
  output: { dimension: "Velocity", description: "Speed (below c)" },
  cautions: [beamCaution],
  source: { ...JACKSON, locator: "section 11.5, beta = sqrt(1 - 1/gamma^2) (from memory)" },
  // Scaled sums of positive terms (no cancellation) and one square root: within 4 ulp. Far above the
  // rest energy the ratio rounds to 1 and v to the double nearest c, still below c as a limit.
  compute: (x) => {
    const t = Scaled.of(x.kineticEnergy);
    const e0 = restEnergy(x.mass);
    return t.times(t.plus(e0.times(2))).sqrt().div(t.plus(e0)).times(C).toNumber();
  },
});

/**
 * Momentum of a particle from its kinetic energy.
 *
 * p = sqrt(T (T + 2 m c^2)) / c = m c sqrt(t (2 + t)), t = T/(m c^2), with p in
 * kg m/s, T in J, m in kg. Divide by the elementary charge and multiply by c
 * for eV/c.
 *
 * Reference: Jackson (1999), section 11.5, E^2 = (p c)^2 + (m c^2)^2 (from memory).
 *
 * @example
 * particleMomentum({ kineticEnergy: quantity(1, "MeV"), mass: electron.mass }); // ≈ 7.59e-22 kg m/s (1.42 MeV/c)
 */
export const particleMomentum = /* @__PURE__ */ defineFormula({
  id: "particleMomentum",
  title: "Particle momentum from kinetic energy",
  category: "beam",
  description: "Momentum of a particle of given kinetic energy and rest mass, relativistically exact.",
  equation: "p = sqrt(T (T + 2 m c^2)) / c",
  inputs: [
    { name: "kineticEnergy", ...KINETIC_ENERGY },
    { name: "mass", ...PARTICLE_MASS },
  ],
  output: { dimension: "Momentum", description: "Momentum" },
  cautions: [beamCaution],
  source: { ...JACKSON, locator: "section 11.5, E^2 = (pc)^2 + (mc^2)^2 (from memory)" },
  // Scaled: T (T + 2 m c^2) may overflow or underflow while p does not; within 3 ulp.
  compute: (x) => {
    const t = Scaled.of(x.kineticEnergy);
    return t.times(t.plus(restEnergy(x.mass).times(2))).sqrt().div(C).toNumber();
  },
});

/**
 * Magnetic rigidity of a beam: momentum per charge.
 *
 * B rho = p / |q|, in T m, with p the momentum in kg m/s and q the charge in C.
 * For unit charge, B rho = 3.3356 T m per GeV/c (1e9 / c, c exact).
 *
 * Reference: Wiedemann, Particle Accelerator Physics, 4th ed. (2015), ch. 6
 * (beam rigidity; chapter from memory).
 *
 * @example
 * magneticRigidity({ momentum: quantity(5.344286e-19, "kg m/s"), charge: proton.charge }); // ≈ 3.3356 T m (1 GeV/c)
 */
export const magneticRigidity = /* @__PURE__ */ defineFormula({
  id: "magneticRigidity",
  title: "Magnetic rigidity",
  category: "beam",
  description: "Magnetic rigidity B rho = p/|q| of a charged particle: the field times bending radius that holds it on a circle.",
  equation: "B rho = p / |q|",
  inputs: [
    { name: "momentum", dimension: "Momentum", description: "Momentum of the particle", domain: NON_NEGATIVE, example: 5.344285992678308e-19 },
    { name: "charge", ...CHARGE, example: 1.602176634e-19 },
  ],
  output: { dimension: "MagneticRigidity", description: "Magnetic rigidity" },
  relations: [{ rule: "charge != 0", holds: (x) => x.charge !== 0 }],
  source: { ...WIEDEMANN, locator: "ch. 6, beam rigidity B rho = p/e (from memory)" },
  // One division: correctly rounded (scaledProduct only guards the range).
  compute: (x) => scaledProduct([x.momentum], [Math.abs(x.charge)]),
});

/**
 * Bending radius of a charged particle in a uniform magnetic field.
 *
 * rho = p / (|q| B), with rho in m, p the momentum in kg m/s (perpendicular
 * to B), q the charge in C and B the flux density in T; exact at any energy.
 *
 * Reference: Wiedemann (2015), ch. 6 (from memory).
 *
 * @example
 * bendingRadius({ momentum: quantity(5.344286e-19, "kg m/s"), charge: proton.charge, fluxDensity: quantity(1, "T") }); // ≈ 3.3356 m
 */
export const bendingRadius = /* @__PURE__ */ defineFormula({
  id: "bendingRadius",
  title: "Bending radius",
  category: "beam",
  description: "Radius of curvature of a charged particle's path in a uniform magnetic field, from its momentum (any energy).",
  equation: "rho = p / (|q| B)",
  inputs: [
    { name: "momentum", dimension: "Momentum", description: "Momentum perpendicular to the field", domain: NON_NEGATIVE, example: 5.344285992678308e-19 },
    { name: "charge", ...CHARGE, example: 1.602176634e-19 },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density of the bending field", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Length", description: "Bending radius" },
  relations: [{ rule: "charge != 0", holds: (x) => x.charge !== 0 }],
  // A bending magnet's field is static: the ICNIRP 2009 lines.
  cautions: [strongFieldCaution((x: { readonly fluxDensity: number }) => x.fluxDensity, "static")],
  source: { ...WIEDEMANN, locator: "ch. 6, rho = p/(e B) (from memory)" },
  compute: (x) => scaledProduct([x.momentum], [Math.abs(x.charge), x.fluxDensity]),
});

/**
 * Focal length of a thin quadrupole lens.
 *
 * f = B rho / (g l), with f in m, B rho the beam's magnetic rigidity in T m,
 * g the field gradient in T/m and l the quadrupole's effective length in m.
 * The lens focuses in one transverse plane and defocuses (focal length -f) in
 * the other.
 *
 * Validity: thin lens, l small against f; the thick lens differs by terms of
 * order (l/f)^2 (a warning from l > 0.1 f, common practice).
 *
 * Reference: Wiedemann (2015), ch. 7 (quadrupole thin-lens approximation, from memory).
 *
 * @example
 * quadrupoleFocalLength({ rigidity: quantity(3.3356, "T m"), gradient: quantity(10, "T/m"), length: quantity(0.2, "m") }); // ≈ 1.668 m
 */
export const quadrupoleFocalLength = /* @__PURE__ */ defineFormula({
  id: "quadrupoleFocalLength",
  title: "Quadrupole focal length (thin lens)",
  category: "beam",
  description: "Focal length of a quadrupole magnet as a thin lens: focusing in one plane, defocusing in the other.",
  equation: "f = B rho / (g l)",
  inputs: [
    { name: "rigidity", dimension: "MagneticRigidity", description: "Magnetic rigidity of the beam", domain: POSITIVE, example: 3.3356 },
    { name: "gradient", dimension: "FluxDensityGradient", description: "Field gradient of the quadrupole", domain: POSITIVE, example: 10 },
    { name: "length", dimension: "Length", description: "Effective (magnetic) length of the quadrupole", domain: POSITIVE, example: 0.2 },
  ],
  output: { dimension: "Length", description: "Focal length" },
  validity: [
    {
      code: "thick_lens",
      when: (x, f) => x.length > 0.1 * (f as number),
      measure: (x, f) => x.length / (f as number),
      message: "the quadrupole is longer than a tenth of its focal length: the thin-lens focal length is off by a few per cent or more; use the thick-lens matrix (common practice)",
    },
  ],
  source: { ...WIEDEMANN, locator: "ch. 7, thin-lens quadrupole 1/f = k l, k = g/(B rho) (from memory)" },
  compute: (x) => scaledProduct([x.rigidity], [x.gradient, x.length]),
});
