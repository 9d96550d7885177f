import { ELEMENTARY_CHARGE, MU0, SPEED_OF_LIGHT } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { cross, norm } from "../math/vec3.js";
import { CHARGE, FAULT_FORCE_MESSAGE, IMPLANT_FIELD_LIMIT, IMPLANT_FIELD_MESSAGE } from "./shared.js";

/**
 * Lorentz force on a point charge moving through electric and magnetic fields.
 *
 * F = q (E + v x B), with F in N (vector), q the signed charge in C, E the
 * electric field in V/m, v the velocity in m/s and B the flux density in T, all
 * Cartesian 3-vectors [x, y, z] at the charge's position.
 *
 * Validity: exact for a point charge in given external fields (the charge's own
 * field excluded); F is the rate of change of the relativistic momentum, so it
 * holds at any speed below c. Use the particle presets for q: `electron.charge`.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017),
 * section 5.1.2 (Lorentz force law).
 *
 * @example
 * lorentzForce({ charge: proton.charge, electricField: [0, 0, 0] as Vec3<ElectricField>,
 *   velocity: [1e6, 0, 0] as Vec3<Velocity>, fluxDensity: [0, 0, 1] as Vec3<FluxDensity> });
 * // ≈ [0, -1.602e-13, 0] N
 */
export const lorentzForce = /* @__PURE__ */ defineFormula({
  id: "lorentzForce",
  title: "Lorentz force on a moving charge",
  category: "force",
  description: "Force on a point charge moving with velocity v through an electric field E and a magnetic flux density B.",
  equation: "F = q (E + v x B)",
  inputs: [
    { name: "charge", ...CHARGE },
    { name: "electricField", dimension: "ElectricField", description: "Electric field at the charge", vector: true, example: [1e3, 0, 0] },
    { name: "velocity", dimension: "Velocity", description: "Velocity of the charge (speed below c)", vector: true, example: [0, 1e5, 0] },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Magnetic flux density at the charge", vector: true, example: [0, 0, 0.01] },
  ],
  output: { dimension: "Force", description: "Force on the charge", components: ["x", "y", "z"] },
  relations: [{ rule: "|velocity| < c (speed of light)", holds: (x) => norm(x.velocity) < SPEED_OF_LIGHT }],
  source: { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.1.2, Lorentz force law" },
  // E + v x B first, then one multiplication by q: no cancellation beyond the sum itself.
  compute: (x) => {
    const vb = cross(x.velocity, x.fluxDensity);
    const q = x.charge;
    return [q * (x.electricField[0] + vb[0]), q * (x.electricField[1] + vb[1]), q * (x.electricField[2] + vb[2])];
  },
});

/**
 * Force on a straight current-carrying wire in a uniform magnetic field
 * (voice coils, busbars crossing a field, motor conductors).
 *
 * F = I l B sin(theta), with F in N, I the current in A (its sign carries into F),
 * l the length in the field in m, B the flux density in T and theta the angle
 * between the wire (current direction) and B in rad (default 90 deg).
 *
 * Validity: B uniform over the length and the wire straight; the wire's own
 * field exerts no net force on it. For a coil of N turns use l = N times the
 * turn length in the gap.
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), section 5.1.3 (currents).
 *
 * @example
 * wireForce({ current: quantity(2, "A"), length: quantity(5, "m"), fluxDensity: quantity(1, "T") }); // ≈ 10 N
 */
export const wireForce = /* @__PURE__ */ defineFormula({
  id: "wireForce",
  title: "Force on a current-carrying wire",
  category: "force",
  description: "Force on a straight wire carrying current I across a uniform magnetic flux density B at angle theta to it (F = B l I for a voice coil).",
  equation: "F = I l B sin(theta)",
  inputs: [
    { name: "current", dimension: "Current", description: "Current in the wire (signed)", example: 2 },
    { name: "length", dimension: "Length", description: "Length of wire inside the field", domain: POSITIVE, example: 5 },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density of the uniform field", domain: { min: 0 }, example: 1 },
    { name: "angle", dimension: "Angle", description: "Angle between the wire (current direction) and B, 0 to 180 deg", default: Math.PI / 2, example: Math.PI / 2 },
  ],
  output: { dimension: "Force", description: "Force on the wire, perpendicular to both the wire and B" },
  cautions: [
    { code: "fault_current_force", message: FAULT_FORCE_MESSAGE },
    {
      code: "strong_field",
      when: (x) => x.fluxDensity > IMPLANT_FIELD_LIMIT,
      message: IMPLANT_FIELD_MESSAGE,
    },
  ],
  source: { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.1.3, F = I (l x B)" },
  compute: (x) => x.current * x.length * x.fluxDensity * Math.sin(x.angle),
});

/**
 * Force between two long parallel straight wires.
 *
 * F = mu0 I1 I2 l / (2 pi d), with F in N on the length l (m) of one wire,
 * I1 and I2 the signed currents in A (same sign = same direction), d the
 * centre-to-centre separation in m and mu0 in H/m (CODATA 2022).
 *
 * Sign convention: positive F is attraction (currents in the same direction),
 * negative is repulsion (opposite directions).
 *
 * Validity: infinitely long, thin, straight wires. For two straight segments of
 * equal length l side by side, the exact force is mu0 I1 I2 (sqrt(l^2 + d^2) - d) / (2 pi d),
 * so this formula overstates it by a fraction 1 - (sqrt(1 + r^2) - r) ≈ r for r = d/l;
 * a warning gives that fraction when d > 1 % of l. Conductors whose width is not
 * small against d (flat busbars) need a shape factor (IEC 60865-1).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), section 5.2.2
 * (force between parallel wires); IEC 60865-1 for busbars; the same law defined the ampere before 2019 (2e-7 N per metre
 * between 1 A wires 1 m apart, 9th CGPM 1948).
 *
 * @example
 * parallelWiresForce({ current1: quantity(1, "A"), current2: quantity(1, "A"),
 *   separation: quantity(1, "m"), length: quantity(1, "m") }); // ≈ 2e-7 N
 */
export const parallelWiresForce = /* @__PURE__ */ defineFormula({
  id: "parallelWiresForce",
  title: "Force between parallel wires",
  category: "force",
  description: "Force per given length between two long straight parallel wires; positive is attraction (like-directed currents).",
  equation: "F = mu0 I1 I2 l / (2 pi d)",
  inputs: [
    { name: "current1", dimension: "Current", description: "Current in the first wire (signed)", example: 1000 },
    { name: "current2", dimension: "Current", description: "Current in the second wire (signed; same sign = same direction)", example: -1000 },
    { name: "separation", dimension: "Length", description: "Centre-to-centre distance between the wires", domain: POSITIVE, example: 0.1 },
    { name: "length", dimension: "Length", description: "Length of wire on which the force acts", domain: POSITIVE, example: 10 },
  ],
  output: { dimension: "Force", description: "Force on the length l of one wire; positive = attractive" },
  validity: [
    {
      code: "finite_length",
      when: (x) => x.separation > 0.01 * x.length,
      message: (x) => {
        const r = x.separation / x.length;
        // 1 - (sqrt(1 + r^2) - r), with sqrt(1 + r^2) - r = 1 / (sqrt(1 + r^2) + r) (no cancellation)
        const over = 1 - 1 / (Math.hypot(1, r) + r);
        return `separation is ${(100 * r).toPrecision(2)} % of the length: for two straight segments of this length ` +
          `the infinite-wire formula overstates the force by about ${(100 * over).toPrecision(2)} %`;
      },
    },
  ],
  cautions: [{ code: "fault_current_force", message: FAULT_FORCE_MESSAGE }],
  source: [
    { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.2.2, parallel wires" },
    { authors: "IEC", year: 2020, title: "IEC 60865-1, Short-circuit currents - Calculation of effects - Part 1: Definitions and calculation methods" },
  ],
  // I1 I2 as one product makes the result exactly symmetric in the currents; it overflows only
  // beyond 1e154 A^2 (reported as out_of_range).
  compute: (x) => (((MU0 / (2 * Math.PI)) * (x.current1 * x.current2)) / x.separation) * x.length,
});

/**
 * Magnetic pressure of a flux density: the force per area a field exerts on a
 * conductor that excludes it (coil windings, pulsed magnets, busbars).
 *
 * p = B^2 / (2 mu0), with p in Pa, B in T and mu0 in H/m (CODATA 2022).
 * Numerically equal to the magnetic energy density in J/m^3.
 *
 * Validity: the field on one side of a surface and (nearly) none on the other;
 * where the field differs on the two sides, p = (B1^2 - B2^2) / (2 mu0).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), section 8.1.2
 * (field energy density, magnetic part B^2/(2 mu0)); Jackson, Classical
 * Electrodynamics, 3rd ed. (1999), section 5.16 (energy in the magnetic field).
 *
 * @example
 * magneticPressure({ fluxDensity: quantity(1, "T") }); // ≈ 3.979e5 Pa
 */
export const magneticPressure = /* @__PURE__ */ defineFormula({
  id: "magneticPressure",
  title: "Magnetic pressure",
  category: "force",
  description: "Pressure B^2/(2 mu0) a magnetic field exerts on a conducting boundary that excludes it; equal to the field's energy density.",
  equation: "p = B^2 / (2 mu0)",
  inputs: [
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density at the surface (its sign does not matter)", example: 1 },
  ],
  output: { dimension: "Pressure", description: "Magnetic pressure" },
  cautions: [
    {
      code: "coil_pressure",
      when: (_x, p) => (p as number) >= 1e5,
      message: (_x, p) =>
        `magnetic pressure of ${((p as number) / 1e6).toPrecision(3)} MPa (at least atmospheric pressure) acts on the windings: ` +
        "coils and their reinforcement must carry it, and pulsed or superconducting magnets can fail violently; local codes and licensed practice govern",
    },
    { code: "strong_field", when: (x) => Math.abs(x.fluxDensity) > IMPLANT_FIELD_LIMIT, message: IMPLANT_FIELD_MESSAGE },
  ],
  source: [
    { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 8.1.2, energy density B^2/(2 mu0)" },
    { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed.", locator: "section 5.16" },
  ],
  // (B / sqrt(2 mu0))^2 would round twice; B * B overflows only beyond 1e154 T, reported as out_of_range.
  compute: (x) => (x.fluxDensity * x.fluxDensity) / (2 * MU0),
});

/**
 * Hall voltage across a thin conducting strip carrying a current in a
 * perpendicular magnetic field (Hall sensors, carrier-density measurement).
 *
 * V_H = I B / (n q t), with V_H in V, I the current in A, B the flux density
 * perpendicular to the strip in T, n the carrier density in 1/m^3, q the
 * signed carrier charge in C (default +e, holes; pass -e for electrons) and t
 * the strip thickness along B in m.
 *
 * Sign convention: V_H is the potential of the edge lying in the direction of
 * I x B minus that of the opposite edge. Carriers of either sign are pushed
 * toward that edge, so V_H > 0 for positive carriers (p-type) and < 0 for
 * electrons (n-type, metals).
 *
 * Validity: one carrier type, uniform current, strip long against its width;
 * in semiconductors a Hall scattering factor of about 1 to 2 multiplies V_H
 * (from memory: 3 pi / 8 ≈ 1.18 for lattice scattering), and contact geometry
 * shorts part of it for short strips.
 *
 * Reference: N. W. Ashcroft, N. D. Mermin, Solid State Physics (1976), ch. 1
 * (Hall effect: Hall coefficient R_H = 1/(n q), -1/(n e) for electrons).
 *
 * @example
 * hallVoltage({ current: quantity(1, "mA"), fluxDensity: quantity(0.1, "T"),
 *   carrierDensity: quantity(1e22, "1/m^3"), thickness: quantity(1, "um") }); // ≈ 6.24e-2 V
 */
export const hallVoltage = /* @__PURE__ */ defineFormula({
  id: "hallVoltage",
  title: "Hall voltage",
  category: "force",
  description: "Transverse voltage across a thin strip carrying current in a perpendicular magnetic field, for one carrier type.",
  equation: "V_H = I B / (n q t)",
  inputs: [
    { name: "current", dimension: "Current", description: "Current along the strip (signed)", example: 1e-3 },
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density perpendicular to the strip (signed)", example: 0.1 },
    { name: "carrierDensity", dimension: "NumberDensity", description: "Density of charge carriers", domain: POSITIVE, example: 1e22 },
    { name: "thickness", dimension: "Length", description: "Strip thickness along B", domain: POSITIVE, example: 1e-6 },
    {
      name: "carrierCharge",
      dimension: "Charge",
      description: "Signed charge of one carrier: +e for holes (default), -e for electrons",
      default: ELEMENTARY_CHARGE,
      example: -ELEMENTARY_CHARGE,
    },
  ],
  output: { dimension: "Voltage", description: "Hall voltage: edge toward I x B minus the opposite edge" },
  relations: [{ rule: "carrierCharge != 0", holds: (x) => x.carrierCharge !== 0 }],
  source: { authors: "N. W. Ashcroft, N. D. Mermin", year: 1976, title: "Solid State Physics", locator: "ch. 1, Hall effect" },
  // I/(n q t) first (a current per area of the order of a drift speed times charge), then times B.
  compute: (x) => (x.current / (x.carrierDensity * x.carrierCharge * x.thickness)) * x.fluxDensity,
});
