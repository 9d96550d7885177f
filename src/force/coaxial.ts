import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { COUNT, NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { exponentOf, ldexp, scaledProduct } from "../math/scaled.js";
import { coaxialSheetsAttraction, loopForceTerms } from "./coaxial-kernel.js";
import { faultCurrentCaution, pinchCaution } from "./shared.js";

const BABIC_AKYEL = {
  authors: "S. Babic, C. Akyel",
  year: 2008,
  title: "Magnetic force calculation between thin coaxial circular coils in air, IEEE Trans. Magn. 44(4) 445-452",
  locator: "filament force F = mu0 I1 I2 z k / (4 sqrt(ab)) [2K - (2 - k^2) E / (1 - k^2)] (equation number from memory)",
} as const;

const MAXWELL = {
  authors: "J. C. Maxwell",
  year: 1873,
  title: "A Treatise on Electricity and Magnetism, vol. 2",
  locator: "art. 701, mutual inductance of two coaxial circles; the force is I1 I2 dM/dz (from memory)",
} as const;

/** The geometric mean of two currents' magnitudes, as a product of roots (no overflow). */
const meanCurrent = (x: { readonly current1: number; readonly current2: number }): number =>
  Math.sqrt(Math.abs(x.current1)) * Math.sqrt(Math.abs(x.current2));

/**
 * Axial force between two coaxial circular filaments (thin loops).
 *
 * F = -I1 I2 dM/dd = mu0 I1 I2 d k / (4 sqrt(ab)) [(2 - k^2) E(k) / (1 - k^2) - 2 K(k)],
 * k^2 = 4ab / ((a + b)^2 + d^2), with a and b the radii and d the axial distance
 * between the planes of the loops in m, I1 and I2 the signed currents in A
 * (same sign = same sense of circulation), K and E complete elliptic
 * integrals; F in N.
 *
 * Sign convention: positive F is attraction (the loops pull towards each
 * other; currents circulating in the same sense), negative is repulsion. The
 * forces on the two loops are equal and opposite (Newton's third law).
 *
 * Method: the derivative of Maxwell's mutual inductance in Landen's form,
 * -dM/dd = 2 mu0 sqrt(ab) k1^(3/2) (d / (r1 r2)) [2 E(k1) / k1'^2 - D(k1)],
 * k1 = 4ab/(r1 + r2)^2, r1, r2 the least and greatest distances between the
 * circles (derivation in src/force/coaxial-kernel.ts): all terms positive, so
 * distant loops (F ~ 1/d^4, where the textbook bracket cancels like k^4) and
 * nearly touching ones (F -> mu0 I1 I2 a / d, the parallel-wire force on the
 * circumference) keep full precision.
 *
 * Validity: exact for filaments. Real wires of radius comparable to the
 * spacing need the wires' geometric mean distance (a warning within 1 % of a radius).
 *
 * Reference: Babic and Akyel, IEEE Trans. Magn. 44(4) (2008) 445-452; Maxwell,
 * Treatise (1873), art. 701 (both from memory as to equation numbers).
 *
 * @example
 * coaxialLoopsForce({ current1: quantity(10, "A"), current2: quantity(10, "A"),
 *   radius1: quantity(5, "cm"), radius2: quantity(5, "cm"), distance: quantity(1, "cm") }); // ≈ 6.02e-4 N (attraction)
 */
export const coaxialLoopsForce = /* @__PURE__ */ defineFormula({
  id: "coaxialLoopsForce",
  title: "Force between coaxial loops",
  category: "force",
  description: "Axial force between two coaxial circular filaments, exact (derivative of Maxwell's mutual inductance); positive is attraction.",
  equation: "F = mu0 I1 I2 d k / (4 sqrt(ab)) [(2 - k^2) E / (1 - k^2) - 2 K], k^2 = 4ab/((a+b)^2 + d^2)",
  inputs: [
    { name: "current1", dimension: "Current", description: "Current in the first loop (signed)", example: 10 },
    { name: "current2", dimension: "Current", description: "Current in the second loop (signed; same sign = same sense of circulation)", example: 10 },
    { name: "radius1", dimension: "Length", description: "Radius of the first loop", domain: POSITIVE, example: 0.05 },
    { name: "radius2", dimension: "Length", description: "Radius of the second loop", domain: POSITIVE, example: 0.05 },
    { name: "distance", dimension: "Length", description: "Axial distance between the planes of the loops", domain: NON_NEGATIVE, example: 0.01 },
  ],
  output: { dimension: "Force", description: "Axial force on either loop; positive = attraction" },
  relations: [
    { rule: "the loops must not coincide (distance > 0 or radius1 != radius2)", holds: (x) => x.distance > 0 || x.radius1 !== x.radius2 },
  ],
  validity: [
    {
      code: "thin_filaments",
      when: (x) => Math.hypot(x.radius1 - x.radius2, x.distance) < 0.01 * Math.min(x.radius1, x.radius2),
      measure: (x) => cappedRatio(0.01 * Math.min(x.radius1, x.radius2), Math.hypot(x.radius1 - x.radius2, x.distance)),
      message: "the loops are within 1 % of a radius of each other: real wires of comparable radius are not filaments there, and the filament force grows without bound as they touch",
    },
  ],
  cautions: [faultCurrentCaution(meanCurrent), pinchCaution()],
  source: [BABIC_AKYEL, MAXWELL],
  // The force is scale-free in the lengths: bring the largest to [1, 2) by a power of two (exact),
  // then multiply the positive terms with scaledProduct (no intermediate overflow or underflow).
  compute: (x) => {
    const s = -exponentOf(Math.max(x.radius1, x.radius2, x.distance));
    const { factors, divisors } = loopForceTerms(ldexp(x.radius1, s), ldexp(x.radius2, s), ldexp(x.distance, s));
    return scaledProduct([MU0, x.current1, x.current2, ...factors], divisors);
  },
});

/**
 * Axial force between two coaxial single-layer coils (current sheets).
 *
 * F = -I1 I2 dM/dd = (mu0 N1 N2 I1 I2 / (l1 l2)) int int A(a, b, z2 - z1) dz1 dz2,
 * with A = -dM0/dz / mu0 the filament attraction (see coaxialLoopsForce), a, b
 * the coil radii, l1, l2 the winding lengths and d the distance between the
 * coils' centres in m, N1, N2 the turns and I1, I2 the signed currents in A; F in N.
 *
 * Sign convention: positive F is attraction (coils pulled towards each other;
 * same sense of circulation), negative is repulsion. Zero for concentric coils
 * (d = 0) by symmetry.
 *
 * Method: Maxwell's formula integrated over both windings and differentiated
 * under the integral, by graded Gauss-Legendre quadrature of the closed-form
 * filament force (src/force/coaxial-kernel.ts); overlapping windings are
 * folded about u = 0 so that the principal value of equal-radius sheets is
 * integrated without cancellation; the overlap weight is interpolated from
 * exact corner values, so nested, nearly concentric and very unequal coils keep
 * their digits. Checked against a numerical derivative of
 * coaxialCoilsMutualInductance, for short coils against coaxialLoopsForce, and
 * against a decimal.js oracle of the double integral of the filament force
 * (tests/force/coils-accuracy.test.ts): 1.2e-15 relative at worst, touching to
 * 1e6 lengths apart, nested to 1e-8 of a length off centre, radii and lengths
 * 1e4 apart; and for nearly concentric coils (tests/force/coils-offset.test.ts,
 * Maxwell's M integrated over windows of width 2d) 8.4e-16 from 1e-2 to 1e-200
 * of a length off centre, and subnormal offsets to within a subnormal step.
 * Near d = 0 the force falls as d, except for identical radii and lengths, where
 * it falls as d ln(1/d) (the turns of the two coils meet everywhere). Known limit:
 * overlapping coils of equal radii shorter than about 1e-300 of the radius are
 * refused as out_of_range (the filament attraction passes the largest double
 * inside the quadrature), although the force is representable.
 *
 * Validity: uniform current sheets; a warning below 10 turns.
 *
 * Reference: Babic and Akyel (2008) (thin coils, from memory); Maxwell,
 * Treatise (1873), art. 701 (from memory).
 *
 * @example
 * coaxialCoilsForce({ current1: quantity(1, "A"), turns1: 100, radius1: quantity(1, "cm"), length1: quantity(2, "cm"),
 *   current2: quantity(1, "A"), turns2: 50, radius2: quantity(1.5, "cm"), length2: quantity(1, "cm"), distance: quantity(3, "cm") }); // ≈ 5.12e-4 N
 */
export const coaxialCoilsForce = /* @__PURE__ */ defineFormula({
  id: "coaxialCoilsForce",
  title: "Force between coaxial coils",
  category: "force",
  description: "Axial force between two coaxial single-layer coils treated as uniform current sheets; positive is attraction.",
  equation: "F = (mu0 N1 N2 I1 I2/(l1 l2)) int int A(a, b, z2 - z1) dz1 dz2, A = -dM0/dz / mu0",
  inputs: [
    { name: "current1", dimension: "Current", description: "Current in the first coil (signed)", example: 1 },
    { name: "turns1", dimension: "Dimensionless", description: "Turns of the first coil", domain: COUNT, example: 100 },
    { name: "radius1", dimension: "Length", description: "Radius of the first coil", domain: POSITIVE, example: 0.01 },
    { name: "length1", dimension: "Length", description: "Winding length of the first coil", domain: POSITIVE, example: 0.02 },
    { name: "current2", dimension: "Current", description: "Current in the second coil (signed; same sign = same sense of circulation)", example: 1 },
    { name: "turns2", dimension: "Dimensionless", description: "Turns of the second coil", domain: COUNT, example: 50 },
    { name: "radius2", dimension: "Length", description: "Radius of the second coil", domain: POSITIVE, example: 0.015 },
    { name: "length2", dimension: "Length", description: "Winding length of the second coil", domain: POSITIVE, example: 0.01 },
    { name: "distance", dimension: "Length", description: "Axial distance between the coils' centres", domain: NON_NEGATIVE, example: 0.03 },
  ],
  output: { dimension: "Force", description: "Axial force on either coil; positive = attraction" },
  validity: [
    {
      code: "few_turns",
      when: (x) => x.turns1 < 10 || x.turns2 < 10,
      measure: (x) => 10 / Math.min(x.turns1, x.turns2),
      message: "a coil of fewer than 10 turns is not a uniform current sheet; near the windings the result is no longer accurate",
    },
  ],
  cautions: [
    faultCurrentCaution(meanCurrent),
    pinchCaution(),
  ],
  source: [BABIC_AKYEL, MAXWELL],
  // Scale-free in the lengths: integrate at unit size (a power of two, exact) so the quadrature's
  // products neither underflow nor overflow; scaledProduct for the currents and turns. Scaling down
  // would round a subnormal distance (nearly concentric coils: the force is proportional to it, and
  // a distance 4 lengths below 2^-1074 came out 0): the distance keeps its bits, at a scale of up to
  // 2^60 (where the quadrature's products are still far from the double range's ends). Past that,
  // distances below 2^-1074 of the lengths are rounded at unit scale.
  compute: (x) => {
    let s = -exponentOf(Math.max(x.radius1, x.radius2, x.length1, x.length2, x.distance));
    if (s < 0 && x.distance > 0) s = Math.min(s + 60, Math.max(s, Math.min(0, -1022 - exponentOf(x.distance))));
    const { factors, divisors } = coaxialSheetsAttraction(ldexp(x.radius1, s), ldexp(x.length1, s), ldexp(x.radius2, s), ldexp(x.length2, s), ldexp(x.distance, s));
    return scaledProduct([MU0, x.current1, x.current2, x.turns1, x.turns2, ...factors], divisors);
  },
});
