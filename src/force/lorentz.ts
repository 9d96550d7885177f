import { ELEMENTARY_CHARGE, MU0, SPEED_OF_LIGHT } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { norm } from "../math/vec3.js";
import { crossPlus, scaledVector } from "./cross.js";
import { strongFieldCaution, GOVERN } from "../core/hazards.js";
import { formatNumber } from "../core/format.js";
import { scaledProduct } from "../math/scaled.js";
import { CHARGE, faultCurrentCaution } from "./shared.js";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);
const TWO_MU0 = 2 * MU0;

/** IEC 60865-1, the standard for the mechanical effects of short-circuit currents. */
const IEC_60865_1 = {
  authors: "IEC", year: 2011,
  title: "IEC 60865-1:2011, Short-circuit currents - Calculation of effects - Part 1: Definitions and calculation methods (3rd ed.; edition from memory)",
} as const;

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
 * Method: each component of E + v x B is summed from exact products (no
 * overflow, underflow or cancellation loss, even where a velocity filter
 * nearly balances), then multiplied by q: within 3 ulp per component (a
 * component below the normal range is returned subnormal or zero).
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013),
 * section 5.1.2 (Lorentz force law; section from memory).
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
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.1.2, Lorentz force law (from memory)" },
  // crossPlus: E + v x B component by component with exact products and an accurate sum, so a
  // velocity filter's near-balance keeps its digits and no product overflows or underflows;
  // then one multiplication by q. Each component within 3 ulp unless it cancels below 1e-45
  // of its largest term (see cross.ts).
  compute: (x) => scaledVector(x.charge, crossPlus(x.velocity, x.fluxDensity, x.electricField)),
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
 * Cautions: fault-current forces from 1 kA (common practice; IEC 60865-1:2011
 * for short-circuit forces) and the strong-field rule on B (ICNIRP).
 *
 * Method: the product through scaledProduct (no intermediate overflow or
 * underflow; within 3 ulp of I l B sin(theta) for the double inputs).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013), section 5.1.3 (currents; section from memory).
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
    faultCurrentCaution((x: { readonly current: number }) => Math.abs(x.current)),
    strongFieldCaution((x: { readonly fluxDensity: number }) => x.fluxDensity),
  ],
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.1.3, F = I (l x B) (from memory)" },
  // scaledProduct: I l B may overflow or underflow in an intermediate step although F does not;
  // sin of the double angle is taken as is (sin(pi as a double) is 1.2e-16, not 0).
  compute: (x) => scaledProduct([x.current, x.length, x.fluxDensity, Math.sin(x.angle)], []),
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
 * small against d (flat busbars) need a shape factor (IEC 60865-1:2011).
 *
 * Cautions: from 1 kA (geometric mean of the two currents; common practice) the
 * fault-current caution points to IEC 60865-1:2011 for short-circuit forces.
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013), section 5.2.2
 * (force between parallel wires; section from memory); IEC 60865-1:2011 for busbars; the same law defined the ampere before 2019 (2e-7 N per metre
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
      measure: (x) => x.separation / x.length,
      message: (x) => {
        const r = x.separation / x.length;
        // 1 - (sqrt(1 + r^2) - r), with sqrt(1 + r^2) - r = 1 / (sqrt(1 + r^2) + r) (no cancellation)
        const over = 1 - 1 / (Math.hypot(1, r) + r);
        return `separation is ${(100 * r).toPrecision(2)} % of the length: for two straight segments of this length ` +
          `the infinite-wire formula overstates the force by about ${(100 * over).toPrecision(2)} %`;
      },
    },
  ],
  // The geometric mean of the two currents (as a product of square roots: no overflow) is the
  // current of two equal conductors with the same force.
  cautions: [faultCurrentCaution((x: { readonly current1: number; readonly current2: number }) =>
    Math.sqrt(Math.abs(x.current1)) * Math.sqrt(Math.abs(x.current2)))],
  source: [
    { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 5.2.2, parallel wires (from memory)" },
    IEC_60865_1,
  ],
  // scaledProduct: no intermediate overflow or underflow (1e200 A with 1e-200 A is fine), within
  // 4 ulp; swapping the currents changes at most the last digits, reversing one flips the sign exactly.
  compute: (x) => scaledProduct([MU0_OVER_2PI, x.current1, x.current2, x.length], [x.separation]),
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
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2013), section 8.1.2
 * (field energy density, magnetic part B^2/(2 mu0)); Jackson, Classical
 * Electrodynamics, 3rd ed. (1999), section 5.16 (energy in the magnetic field); sections from memory.
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
      // From one atmosphere (0.1 MPa, reached at about 0.5 T) the field pushes on windings as hard as
      // a pressure vessel's contents: common practice, not a figure from a standard.
      when: (_x, p) => (p as number) >= 1e5,
      measure: (_x, p) => p as number,
      message: (_x, p) =>
        `magnetic pressure of ${formatNumber((p as number) / 1e6, 3)} MPa, at least atmospheric pressure (0.1 MPa; common practice), acts on the windings: ` +
        `coils and their reinforcement must carry it, and pulsed or superconducting magnets can fail violently. ${GOVERN}`,
    },
    strongFieldCaution((x: { readonly fluxDensity: number }) => Math.abs(x.fluxDensity)),
  ],
  source: [
    { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed.", locator: "section 8.1.2, energy density B^2/(2 mu0) (from memory)" },
    { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed.", locator: "section 5.16 (from memory)" },
  ],
  // scaledProduct: B B / (2 mu0) with no intermediate overflow or underflow of B^2; within 2 ulp
  // (2 mu0 is an exact doubling).
  compute: (x) => scaledProduct([x.fluxDensity, x.fluxDensity], [TWO_MU0]),
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
 * (Hall effect: Hall coefficient R_H = 1/(n q), -1/(n e) for electrons; chapter from memory).
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
  source: { authors: "N. W. Ashcroft, N. D. Mermin", year: 1976, title: "Solid State Physics", locator: "ch. 1, Hall effect (from memory)" },
  // scaledProduct: n q t and I B may overflow or underflow in an intermediate step although V_H does not;
  // within 3 ulp.
  compute: (x) => scaledProduct([x.current, x.fluxDensity], [x.carrierDensity, x.carrierCharge, x.thickness]),
});
