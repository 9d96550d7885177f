import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE, TURNS } from "../core/spec.js";
import { loopKernel, SERIES_LIMIT } from "./loop-series.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate, scaledProduct } from "../math/scaled.js";

/**
 * The one strong-field rule (src/core/hazards.ts): ICNIRP 2010 power-frequency
 * reference levels and the ICNIRP 2009 static-field and implant lines, on |B|.
 */
const STRONG_FIELD = strongFieldCaution();
const TWO_PI = 2 * Math.PI; // exact: a power-of-two multiple of Math.PI
/** (4/5)^(3/2) mu0: two roundings, within 1 ulp. */
const HELMHOLTZ_MU0 = Math.pow(0.8, 1.5) * MU0;

const CURRENT = { dimension: "Current", description: "Current in the conductor", example: 10 } as const;
/** Scratch for loopKernel's [f/m, E, k' D, f]: no allocation per call. */
const KERNEL = /* @__PURE__ */ new Float64Array(4);
const GRIFFITHS = { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson; reissued by Cambridge University Press, 2017)" } as const;

/**
 * Flux density at a distance from a long straight wire.
 *
 * B = mu0 * I / (2 pi d), with B in T, I in A, d the distance from the wire's axis in m.
 * (1 A at 1 m gives 2e-7 T: the basis of the former SI definition of the ampere.)
 *
 * Validity: the wire is straight and much longer than d, and d is outside the conductor.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), Example 5.5 (from memory).
 *
 * @example
 * wireField({ current: quantity(100, "A"), distance: quantity(10, "cm") }); // ≈ 2e-4 T
 */
export const wireField = /* @__PURE__ */ defineFormula({
  id: "wireField",
  title: "Field of a long straight wire",
  category: "magnetic field",
  description: "Flux density around a long straight current-carrying wire (Biot-Savart law, infinite wire).",
  equation: "B = mu0 * I / (2 pi d)",
  inputs: [
    { name: "current", ...CURRENT },
    { name: "distance", dimension: "Length", description: "Distance from the wire's axis", domain: POSITIVE, example: 0.1 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density (circling the wire; sign follows the current)" },
  cautions: [STRONG_FIELD],
  source: { ...GRIFFITHS, locator: "Example 5.5, B = mu0 I / (2 pi s) (from memory)" },
  // Plain when both inputs are moderate (3 roundings); scaled otherwise (2.2e-308 m gives 9e300 T, a double).
  compute: (x) =>
    moderate(x.current) && moderate(x.distance) ? (MU0 * x.current) / (TWO_PI * x.distance) : scaledProduct([MU0, x.current], [TWO_PI, x.distance]),
});

/**
 * Flux density on the axis of a circular current loop.
 *
 * B = mu0 * I * R^2 / (2 (R^2 + z^2)^(3/2)), with B in T (along the axis), I in A,
 * R the loop radius and z the axial distance from the loop's centre, in m.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), Example 5.6 (from memory).
 *
 * @example
 * loopAxialField({ current: quantity(1, "A"), radius: quantity(0.1, "m"), axialDistance: quantity(0, "m") }); // ≈ 6.28e-6 T
 */
export const loopAxialField = /* @__PURE__ */ defineFormula({
  id: "loopAxialField",
  title: "Field on the axis of a circular loop",
  category: "magnetic field",
  description: "Axial flux density of a single circular current loop at a point on its axis.",
  equation: "B = mu0 * I * R^2 / (2 (R^2 + z^2)^(3/2))",
  inputs: [
    { name: "current", ...CURRENT },
    { name: "radius", dimension: "Length", description: "Loop radius", domain: POSITIVE, example: 0.1 },
    { name: "axialDistance", dimension: "Length", description: "Distance along the axis from the loop's centre", default: 0, example: 0.05 },
  ],
  output: { dimension: "FluxDensity", description: "Axial flux density" },
  cautions: [STRONG_FIELD],
  source: { ...GRIFFITHS, locator: "Example 5.6 (from memory)" },
  // hypot avoids overflow of R^2 + z^2; (R/h)^2 / h keeps every factor in range.
  compute: (x) => {
    const h = Math.hypot(x.radius, x.axialDistance);
    const q = x.radius / h;
    return ((MU0 * x.current) / (2 * h)) * q * q;
  },
});

/**
 * Flux density of a circular current loop at any point (exact, off the axis).
 *
 * With a the loop radius, rho the radial and z the axial distance of the point (m),
 * alpha^2 = (a - rho)^2 + z^2, beta^2 = (a + rho)^2 + z^2, m = 4 a rho / beta^2 and
 * mc = 1 - m = alpha^2 / beta^2 (taken from the geometry):
 *   B_z   = mu0 I a (a E - 2 rho f) / (pi alpha^2 beta)
 *   B_rho = 2 mu0 I a z f / (pi alpha^2 beta)
 * where f(m) = E/2 - mc (K - E)/m. This is Smythe's expression
 *   B_z = mu0 I / (2 pi beta) [K + (a^2 - rho^2 - z^2) E / alpha^2],
 *   B_rho = mu0 I z / (2 pi rho beta) [-K + (a^2 + rho^2 + z^2) E / alpha^2]
 * rearranged so that nothing cancels on the axis (f = 3 pi m / 32 + ..., summed as a
 * series for m < 0.2) or far away. Finite and smooth on the axis (B_rho = 0 at rho = 0).
 *
 * Validity: a filament (wire thickness small against its distance from the point).
 *
 * Reference: W. R. Smythe, Static and Dynamic Electricity, 3rd ed. (1968), sec. 7.10;
 * J. D. Jackson, Classical Electrodynamics, 3rd ed. (1999), sec. 5.5.
 *
 * @example
 * loopField({ current: quantity(1, "A"), radius: quantity(0.1, "m"), radialDistance: quantity(0.05, "m"), axialDistance: quantity(0.05, "m") }); // ≈ [1.62e-6, 4.35e-6] T
 */
export const loopField = /* @__PURE__ */ defineFormula({
  id: "loopField",
  title: "Field of a circular loop anywhere",
  category: "magnetic field",
  description: "Radial and axial flux density of a circular current filament at any point, exact with elliptic integrals.",
  equation: "B_z = mu0 I a (a E - 2 rho f) / (pi alpha^2 beta); B_rho = 2 mu0 I a z f / (pi alpha^2 beta); f = E/2 - (1 - m)(K - E)/m",
  inputs: [
    { name: "current", ...CURRENT },
    { name: "radius", dimension: "Length", description: "Loop radius", domain: POSITIVE, example: 0.1 },
    { name: "radialDistance", dimension: "Length", description: "Distance of the point from the loop's axis", domain: NON_NEGATIVE, example: 0.05 },
    { name: "axialDistance", dimension: "Length", description: "Distance of the point along the axis from the loop's plane", example: 0.05 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density components", components: ["radial", "axial"] },
  relations: [
    {
      rule: "the point is not on the wire (radialDistance = radius with axialDistance = 0)",
      holds: (x) => !(x.radialDistance === x.radius && x.axialDistance === 0),
    },
  ],
  cautions: [STRONG_FIELD],
  source: [
    { authors: "W. R. Smythe", year: 1968, title: "Static and Dynamic Electricity, 3rd ed.", locator: "sec. 7.10 (from memory)" },
    { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed.", locator: "sec. 5.5" },
  ],
  compute: (x) => {
    const a = x.radius;
    const rho = x.radialDistance;
    const z = x.axialDistance;
    // a - rho is exact next to the wire (Sterbenz), so alpha keeps its digits there;
    // hypot keeps alpha and beta finite for any distances.
    const alpha = Math.hypot(a - rho, z);
    const beta = Math.hypot(a + rho, z);
    const ua = a / beta; // <= 1
    const ur = rho / beta; // <= 1
    const m = 4 * ua * ur;
    // k' = alpha/beta from the geometry: 1 - m would lose digits next to the wire, and
    // mc = k'^2 underflows 1e-200 m from a 1 m loop where k' itself does not.
    const kc = alpha / beta;
    loopKernel(m, kc, KERNEL);
    const fm = KERNEL[0]!; // f/m
    const e = KERNEL[1]!;
    const kcD = KERNEL[2]!; // k' D
    const f = KERNEL[3]!;
    // B = mu0 I a (..) / (pi alpha^2 beta) as a product of ratios each at most about 1,
    // with one division by alpha early: nothing overflows or underflows before the
    // result does (a field 1e-200 m from the wire is 2e193 T and is returned).
    const c = ((MU0 * x.current) / Math.PI) * ua / alpha;
    // Radial: 2 mu0 I a z f / (pi alpha^2 beta) = 2 c (z/alpha) f, f = m (f/m) = 4 ua ur (f/m).
    const radial = 2 * c * (z / alpha) * (m < SERIES_LIMIT ? ua * (4 * ur * fm) : f);
    // Axial bracket (a E - 2 rho f) / alpha. Inside the loop's radius, and next to the wire, use the
    // equal form 2 a mc D + 2 (a - rho) f (E - 2 f = 2 mc D), divided by alpha as
    // 2 ua k' D + 2 ((a - rho)/alpha) f: its terms do not cancel there and stay bounded,
    // while a E - 2 rho f loses digits as E and 2 rho f / a both tend to 1. Far outside,
    // where m is small, a (E - 2 (rho/a) f) / alpha = (ua/k') (E - 8 (f/m) ur^2) has no cancellation.
    const axial = rho <= a || m > 0.5 ? 2 * ua * kcD + 2 * ((a - rho) / alpha) * f : (ua / kc) * (e - 8 * fm * ur * ur);
    return [radial, c * axial];
  },
});

/**
 * Flux density on the axis of a finite solenoid (current-sheet model).
 *
 * B = mu0 N I / (2 l) * [(z + l/2) / sqrt((z + l/2)^2 + R^2) - (z - l/2) / sqrt((z - l/2)^2 + R^2)],
 * with B in T, N turns, I in A, l the winding length, R its radius and z the position on
 * the axis measured from the centre, all in m.
 *
 * Validity: a uniform current sheet; the turns' ripple on the axis is about exp(-2 pi R / p)
 * for pitch p = l/N, warned when the pitch exceeds the radius.
 *
 * Accuracy: within 6 ulp for every input whose result is a double (two hypot calls,
 * two cosines and a dozen products; measured 2.5 ulp at worst by
 * tests/flux/extremes-accuracy.test.ts for lengths from 1e-300 m to 1e300 m).
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 5.2, the Biot-Savart law applied to a winding of coaxial loops (from memory).
 *
 * @example
 * solenoidAxialField({ current: quantity(1, "A"), turns: 1000, radius: quantity(1, "cm"), length: quantity(10, "cm"), axialPosition: quantity(0, "m") }); // ≈ 1.23e-2 T
 */
export const solenoidAxialField = /* @__PURE__ */ defineFormula({
  id: "solenoidAxialField",
  title: "Field on the axis of a finite solenoid",
  category: "magnetic field",
  description: "Axial flux density of a single-layer solenoid treated as a uniform current sheet, at any point of its axis.",
  equation: "B = mu0 N I / (2 l) * [cos(theta1) - cos(theta2)]",
  inputs: [
    { name: "current", ...CURRENT, example: 1 },
    { name: "turns", ...TURNS, example: 1000 },
    { name: "radius", dimension: "Length", description: "Winding radius", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 0.1 },
    { name: "axialPosition", dimension: "Length", description: "Position on the axis measured from the solenoid's centre", default: 0, example: 0.02 },
  ],
  output: { dimension: "FluxDensity", description: "Axial flux density" },
  validity: [
    {
      code: "coarse_pitch",
      when: (x) => x.length / x.turns > x.radius,
      measure: (x) => cappedRatio(x.length / x.turns, x.radius), // pitch / radius, past 1 when warned
      message: "the turn pitch exceeds the radius: the current-sheet model misses the per-turn ripple (about exp(-2 pi R / pitch)); sum loopAxialField over the turns instead",
    },
  ],
  cautions: [STRONG_FIELD],
  source: { ...GRIFFITHS, locator: "sec. 5.2, Biot-Savart law, integrated over a winding of coaxial loops (from memory)" },
  compute: (x) => {
    const R = x.radius;
    const l = x.length;
    const z = Math.abs(x.axialPosition); // B is even in z
    if (moderate(x.turns) && moderate(x.current) && nearUnit(R) && nearUnit(l) && (z === 0 || nearUnit(z))) {
      const u1 = z + l / 2;
      const u2 = z - l / 2;
      const h1 = Math.hypot(u1, R);
      const h2 = Math.hypot(u2, R);
      // Outside the ends both cosines are near 1: use the exact difference
      // cos1 - cos2 = 2 R^2 l z / (h1 h2 (u1 h2 + u2 h1)), free of cancellation.
      // Inside, u2 <= 0: the terms add.
      const diff = u2 > 0 ? (((2 * R) / h1) * (R / h2) * l * z) / (u1 * h2 + u2 * h1) : u1 / h1 - u2 / h2;
      return ((MU0 * x.turns * x.current) / (2 * l)) * diff;
    }
    return solenoidScaled(x.current, x.turns, R, l, z);
  },
});

/**
 * Flux density at the centre of a Helmholtz pair.
 *
 * B = (4/5)^(3/2) * mu0 * N * I / R, with B in T, N turns per coil, I in A, R the
 * coil radius in m; the coils are coaxial and spaced by R.
 *
 * Validity: thin coils (winding cross-section small against R). The field is uniform
 * to fourth order about the centre.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 5.2, the on-axis field of a loop summed for two coils a radius apart (from memory).
 *
 * @example
 * helmholtzCenterField({ current: quantity(1, "A"), turns: 100, radius: quantity(0.1, "m") }); // ≈ 8.99e-4 T
 */
export const helmholtzCenterField = /* @__PURE__ */ defineFormula({
  id: "helmholtzCenterField",
  title: "Field at the centre of a Helmholtz pair",
  category: "magnetic field",
  description: "Flux density midway between two coaxial coils spaced by their radius (Helmholtz coil).",
  equation: "B = (4/5)^(3/2) * mu0 * N * I / R",
  inputs: [
    { name: "current", ...CURRENT, example: 1 },
    { name: "turns", ...TURNS, description: "Turns of each of the two coils", example: 100 },
    { name: "radius", dimension: "Length", description: "Coil radius (also the spacing)", domain: POSITIVE, example: 0.1 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density at the centre, along the axis" },
  cautions: [STRONG_FIELD],
  source: { ...GRIFFITHS, locator: "sec. 5.2, on-axis loop field summed for two coils a radius apart (from memory)" },
  compute: (x) =>
    moderate(x.turns) && moderate(x.current) && moderate(x.radius)
      ? (HELMHOLTZ_MU0 * x.turns * x.current) / x.radius
      : scaledProduct([HELMHOLTZ_MU0, x.turns, x.current], [x.radius]),
});

/**
 * Flux density inside a toroidal winding.
 *
 * B = mu0 * N * I / (2 pi r), with B in T, N turns, I in A and r the distance from
 * the toroid's axis in m (inside the winding, in air or a non-magnetic core).
 *
 * Validity: evenly spread turns; r between the winding's inner and outer radius.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), Example 5.10 (from memory).
 *
 * @example
 * toroidField({ current: quantity(1, "A"), turns: 100, radius: quantity(5, "cm") }); // ≈ 4e-4 T
 */
export const toroidField = /* @__PURE__ */ defineFormula({
  id: "toroidField",
  title: "Field inside a toroid",
  category: "magnetic field",
  description: "Flux density inside an evenly wound toroid at a given distance from its axis (Ampere's law).",
  equation: "B = mu0 * N * I / (2 pi r)",
  inputs: [
    { name: "current", ...CURRENT, example: 1 },
    { name: "turns", ...TURNS, example: 100 },
    { name: "radius", dimension: "Length", description: "Distance from the toroid's axis, inside the winding", domain: POSITIVE, example: 0.05 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density inside the winding (circumferential)" },
  source: { ...GRIFFITHS, locator: "Example 5.10 (from memory)" },
  compute: (x) =>
    moderate(x.turns) && moderate(x.current) && moderate(x.radius)
      ? (MU0 * x.turns * x.current) / (TWO_PI * x.radius)
      : scaledProduct([MU0, x.turns, x.current], [TWO_PI, x.radius]),
});

// Lengths within 2^-60..2^60 m: the plain solenoid expression then keeps every step a normal double.
function nearUnit(v: number): boolean {
  return v >= 2 ** -60 && v <= 2 ** 60;
}

/**
 * The solenoid's axial field held as mantissa and exponent, for inputs where the
 * plain expression could overflow or underflow on the way (z >= 0):
 *   inside (u2 <= 0):  B = (mu0 N I / 2) (u1 / (h1 l) + |u2| / (h2 l))
 *   outside (u2 > 0):  B = mu0 N I R^2 z / (h1^2 h2^2 (u1/h1 + u2/h2))
 * (the second is (mu0 N I / 2l)(cos1 - cos2) with cos1 - cos2 = 2 R^2 l z / (h1 h2 (u1 h2 + u2 h1))
 * and u1 h2 + u2 h1 = h1 h2 (cos1 + cos2)). Every term is positive: no cancellation.
 */
function solenoidScaled(current: number, turns: number, R: number, l: number, z: number): number {
  if (current === 0) return 0;
  const u2 = z - l / 2; // |z - l/2| <= max(z, l/2): never overflows
  let u1 = z + l / 2;
  let u1Scale = 0; // u1 = (held value) * 2^u1Scale
  if (u1 > Number.MAX_VALUE) {
    u1 = z / 2 + l / 4; // z > 2^1022 here: z / 2 exact; l / 4 rounds only where it cannot change the sum
    u1Scale = 1;
  }
  const s1 = hypotScaled(u1, R, u1Scale);
  const prefix = Scaled.of(MU0).times(turns).times(current);
  let b: Scaled;
  if (u2 <= 0) {
    const lS = Scaled.of(l);
    let sum = s1.u.div(s1.h.times(lS));
    if (u2 < 0) {
      const s2 = hypotScaled(-u2, R, 0);
      sum = sum.plus(s2.u.div(s2.h.times(lS)));
    }
    b = prefix.times(Scaled.of(sum.m, sum.e - 1));
  } else {
    const s2 = hypotScaled(u2, R, 0);
    const cosSum = s1.u.div(s1.h).plus(s2.u.div(s2.h));
    const num = prefix.times(Scaled.of(R).times(R).times(z));
    b = num.div(s1.h.times(s1.h).times(s2.h.times(s2.h).times(cosSum)));
  }
  return b.toNumber(Math.sign(current));
}

/**
 * hypot(u 2^k, R) and u 2^k as mantissa and exponent (u > 0, k = 0 or 1). Where
 * the hypotenuse would overflow, both legs are halved first: they are then above
 * 2^1020 or negligible against the other leg, so halving changes no digit that matters.
 */
function hypotScaled(u: number, R: number, k: number): { u: Scaled; h: Scaled } {
  const us = Scaled.of(u, k);
  if (k === 0) {
    const h = Math.hypot(u, R);
    if (h <= Number.MAX_VALUE) return { u: us, h: Scaled.of(h) };
    return { u: us, h: Scaled.of(Math.hypot(u / 2, R / 2), 1) };
  }
  // u is already halved: halve R to match.
  return { u: us, h: Scaled.of(Math.hypot(u, R / 2), 1) };
}
