import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE, TURNS } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { exponentOf, ldexp, moderate, scaledProduct } from "../math/scaled.js";
import { currentSheetField } from "./current-sheet.js";

/** Scratch for the sheet kernel's [F_rho, F_z]: no allocation per call. */
const SHEET = /* @__PURE__ */ new Float64Array(2);

export const DERBY_OLBERT = {
  authors: "N. Derby and S. Olbert",
  year: 2010,
  title: "Cylindrical magnets and ideal solenoids",
  locator: "Am. J. Phys. 78 (2010) 229-235: B_rho and B_z of an ideal solenoid in terms of Bulirsch's cel; appendix, the cel algorithm",
} as const;

/**
 * The sheet's [F_rho, F_z] for lengths of any size: all four are scaled by one power of
 * two (exact) so the largest is in [1, 2); the field depends only on their ratios.
 */
export function sheetField(radius: number, length: number, rho: number, z: number): Float64Array {
  const s = -exponentOf(Math.max(radius, length, rho, Math.abs(z)));
  currentSheetField(ldexp(radius, s), ldexp(length, s - 1), ldexp(rho, s), ldexp(z, s), SHEET);
  return SHEET;
}

/** The rim of the sheet (rho = R, |z| = L/2): B_rho is logarithmically infinite there. `ends` names them. */
export function notOnRim(ends: string) {
  return {
    rule: `the point is not on the rim of the ${ends} (radialDistance = radius with |axialDistance| = length/2), where the radial field is infinite`,
    holds: (x: { radius: number; length: number; radialDistance: number; axialDistance: number }) =>
      !(x.radialDistance === x.radius && Math.abs(x.axialDistance) === x.length / 2),
  };
}

/**
 * Flux density of a finite solenoid (current sheet) at any point, off the axis too.
 *
 * With K = N I / l the sheet's current per length (A/m), R its radius and l its length (m),
 * the point at radial distance rho and signed axial distance z from the winding's centre (m),
 * z+- = z +- l/2, h+- = sqrt(z+-^2 + (R + rho)^2), k+- = sqrt(z+-^2 + (R - rho)^2) / h+-,
 * gamma = (R - rho)/(R + rho):
 *   B_rho = (mu0 K / pi) [R/h+ cel(k+, 1, 1, -1) - R/h- cel(k-, 1, 1, -1)]
 *   B_z   = (mu0 K / pi) R/(R + rho) [z+/h+ cel(k+, gamma^2, 1, gamma) - z-/h- cel(k-, gamma^2, 1, gamma)]
 * in T, with cel Bulirsch's generalized complete elliptic integral.
 *
 * On the winding itself (rho = R, |z| < l/2) B_rho is finite and B_z jumps by mu0 K from
 * inside to outside: the value returned is the mean of the two sides. The rim of
 * either end (rho = R, |z| = l/2) is refused (out_of_domain): B_rho is infinite there.
 * Far away (beyond 4 half-diagonals), and at least a radius from the winding, the same field
 * is summed from loops of current K dz' (Gauss-Legendre, 24 nodes a panel, panels graded
 * away from the point), where the closed form cancels (see src/flux/current-sheet.ts).
 *
 * Validity: a uniform current sheet; the turns' ripple is missed where the pitch l/N is
 * not small against the radius or against the distance to the winding (warnings).
 *
 * Accuracy: measured against a 60-digit decimal.js evaluation of the same published
 * expression (tests/flux/solenoid-field.test.ts): within 20 eps of |B| for lengths / radius
 * 0.1..10 (random sizes and points out to 1e4 sizes), within 1e-12 for 1e-3..100, and within
 * 1e-13 just outside and beside windings 100 and 1000 radii long (the ends' terms there are
 * summed as the fields of the end faces' disks, src/flux/current-sheet.ts).
 *
 * Reference: N. Derby and S. Olbert, Am. J. Phys. 78 (2010) 229, eqs. for B_rho and B_z with cel.
 *
 * @example
 * solenoidField({ current: quantity(1, "A"), turns: 1000, radius: quantity(1, "cm"), length: quantity(10, "cm"), radialDistance: quantity(5, "mm"), axialDistance: quantity(2, "cm") }); // ≈ [4.37e-5, 1.22e-2] T
 */
export const solenoidField = /* @__PURE__ */ defineFormula({
  id: "solenoidField",
  title: "Field of a finite solenoid anywhere",
  category: "magnetic field",
  description: "Radial and axial flux density of a single-layer solenoid (uniform current sheet) at any point, on or off the axis, inside or outside, exact with Bulirsch's generalized complete elliptic integral.",
  equation: "B_rho = (mu0 N I / (pi l)) [R/h+ cel(k+,1,1,-1) - R/h- cel(k-,1,1,-1)]; B_z = (mu0 N I / (pi l)) R/(R+rho) [z+/h+ cel(k+,g^2,1,g) - z-/h- cel(k-,g^2,1,g)]",
  inputs: [
    { name: "current", dimension: "Current", description: "Current in the winding", example: 1 },
    { name: "turns", ...TURNS, example: 1000 },
    { name: "radius", dimension: "Length", description: "Winding radius", domain: POSITIVE, example: 0.01 },
    { name: "length", dimension: "Length", description: "Winding length", domain: POSITIVE, example: 0.1 },
    { name: "radialDistance", dimension: "Length", description: "Distance of the point from the winding's axis", domain: NON_NEGATIVE, example: 0.005 },
    { name: "axialDistance", dimension: "Length", description: "Signed distance of the point along the axis from the winding's centre", example: 0.02 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density components (radial outward, axial along the winding's field for positive current)", components: ["radial", "axial"] },
  relations: [notOnRim("winding's ends")],
  validity: [
    {
      code: "coarse_pitch",
      when: (x) => x.length / x.turns > x.radius,
      measure: (x) => cappedRatio(x.length / x.turns, x.radius), // pitch / radius, past 1 when warned
      message: "the turn pitch exceeds the radius: the current-sheet model misses the per-turn ripple; sum loopField over the turns instead",
    },
    {
      code: "near_winding",
      when: (x) => nearWinding(x) > 1,
      measure: (x) => nearWinding(x), // pitch / distance to the winding, past 1 when warned
      message: "the point is closer to the winding than the turn pitch: the real field there ripples from turn to turn (and the wire's own field dominates); the current-sheet value is the average over a pitch",
    },
  ],
  cautions: [strongFieldCaution()],
  source: DERBY_OLBERT,
  compute: (x) => {
    const f = sheetField(x.radius, x.length, x.radialDistance, x.axialDistance);
    // B = mu0 (N I / l) F: plain while every factor is moderate, scaled otherwise.
    if (moderate(x.turns) && moderate(x.current) && moderate(x.length)) {
      const k = (MU0 * x.turns * x.current) / x.length;
      return [k * f[0]!, k * f[1]!];
    }
    return [component(x.turns, x.current, x.length, f[0]!), component(x.turns, x.current, x.length, f[1]!)];
  },
});

/**
 * mu0 N I f / l scaled. A component whose true size is below the smallest subnormal
 * (the radial one next to the axis, say) is 0 rather than out of range: the range policy's
 * Infinity for an underflow would make the whole vector fail while the other component is a
 * good double. An overflow stays Infinity (out_of_range).
 */
function component(turns: number, current: number, length: number, f: number): number {
  const v = scaledProduct([MU0, turns, current, f], [length]);
  if (v === Infinity || v === -Infinity) {
    const log2 = Math.log2(MU0) + Math.log2(turns) + Math.log2(Math.abs(current)) + Math.log2(Math.abs(f)) - Math.log2(length);
    if (log2 < -1074) return 0;
  }
  return v;
}

/** Turn pitch over the distance from the point to the winding's surface (0 when the pitch is 0 relative). */
function nearWinding(x: { turns: number; radius: number; length: number; radialDistance: number; axialDistance: number }): number {
  const dr = x.radialDistance - x.radius;
  const dz = Math.max(0, Math.abs(x.axialDistance) - x.length / 2);
  const d = Math.hypot(dr, dz);
  return d > 0 ? cappedRatio(x.length / x.turns, d) : Number.MAX_VALUE; // on the winding: as close as it gets
}
