import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { DERBY_OLBERT, notOnRim, sheetField } from "../flux/solenoid-field.js";
import { exponentOf, ldexp, scaledProduct } from "../math/scaled.js";

const FURLANI = {
  authors: "E. P. Furlani",
  year: 2001,
  title: "Permanent Magnet and Electromechanical Devices",
  locator: "ch. 4, axially magnetised cylinder, field on the axis from the equivalent surface current (from memory)",
} as const;

/**
 * Flux density on the axis of an axially magnetised cylindrical magnet.
 *
 * B = (B_r / 2) [ (z + L/2) / sqrt((z + L/2)^2 + R^2) - (z - L/2) / sqrt((z - L/2)^2 + R^2) ],
 * with B in T along the magnetisation, B_r the remanence in T (uniform
 * magnetisation M = B_r / mu0), R the radius and L the length of the magnet in
 * m and z the signed axial distance from the magnet's centre in m (inside the
 * magnet too, where B is the flux density, not mu0 H).
 *
 * Method: outside the magnet (|z| > L/2) both terms have one sign and nearly
 * cancel far away (B ~ B_r R^2 L / (2 z^3), the dipole field); there the
 * difference is rewritten exactly as
 *   B = B_r R^2 L z / (s1 s2 (u1 s2 + u2 s1)),  u = z +- L/2, s = sqrt(u^2 + R^2),
 * a quotient of same-signed terms. Inside, the two terms add.
 *
 * Validity: ideal uniform magnetisation (rare-earth magnets come close; the
 * remanence falls with temperature, about -0.1 %/K for NdFeB, common practice).
 *
 * Cautions: strong fields (ICNIRP thresholds).
 *
 * Reference: Furlani, Permanent Magnet and Electromechanical Devices (2001), ch. 4 (from memory).
 *
 * @example
 * cylinderMagnetAxialField({ remanence: quantity(1.3, "T"), radius: quantity(5, "mm"), length: quantity(10, "mm"), axialDistance: quantity(10, "mm") }); // ≈ 0.157 T
 */
export const cylinderMagnetAxialField = /* @__PURE__ */ defineFormula({
  id: "cylinderMagnetAxialField",
  title: "Field on the axis of a cylinder magnet",
  category: "magnet",
  description: "Flux density on the axis of a uniformly, axially magnetised cylindrical permanent magnet, at a signed distance from its centre.",
  equation: "B = (Br/2) [ (z + L/2)/sqrt((z + L/2)^2 + R^2) - (z - L/2)/sqrt((z - L/2)^2 + R^2) ]",
  inputs: [
    { name: "remanence", dimension: "FluxDensity", description: "Remanence of the magnet material (signed along the axis)", example: 1.3 },
    { name: "radius", dimension: "Length", description: "Radius of the magnet", domain: POSITIVE, example: 0.005 },
    { name: "length", dimension: "Length", description: "Length of the magnet along its axis", domain: POSITIVE, example: 0.01 },
    { name: "axialDistance", dimension: "Length", description: "Signed distance along the axis from the magnet's centre", example: 0.01 },
  ],
  output: { dimension: "FluxDensity", description: "Axial flux density (along the magnetisation)" },
  // A permanent magnet's field is static: the ICNIRP 2009 lines.
  cautions: [strongFieldCaution(undefined, "static")],
  source: FURLANI,
  // The field depends on the lengths only through their ratios: bring the largest to [1, 2) by a
  // power of two (exact) so no square overflows or underflows.
  compute: (x) => {
    const s = -exponentOf(Math.max(x.radius, x.length, Math.abs(x.axialDistance)));
    const r = ldexp(x.radius, s);
    const l = ldexp(x.length, s);
    const z = ldexp(Math.abs(x.axialDistance), s); // the axial field is even in z: exactly so
    const u1 = z + 0.5 * l;
    const u2 = z - 0.5 * l;
    const s1 = Math.hypot(u1, r);
    const s2 = Math.hypot(u2, r);
    if (u1 > 0 && u2 < 0) return 0.5 * x.remanence * (u1 / s1 - u2 / s2); // inside: both terms positive
    // Outside: the exact rewrite of the difference as a quotient of same-signed terms.
    // u1 - u2 = l is formed exactly as l itself; (u1 + u2) = 2 z.
    // scaledProduct: r^2 may underflow for a thin magnet seen from far while B_r r^2 ... does not.
    return scaledProduct([x.remanence, r, r, l, z], [s1, s2, u1 * s2 + u2 * s1]);
  },
});

/**
 * Flux density of an axially magnetised cylindrical magnet at any point, off the axis too.
 *
 * The uniformly magnetised cylinder (M = B_r / mu0 along the axis) is a current sheet on its
 * side surface with K = M, so B = B_r [F_rho, F_z] with the sheet's field of N. Derby and
 * S. Olbert (2010): with R the radius and L the length (m), rho and z the point's radial and
 * signed axial distance from the magnet's centre (m), z+- = z +- L/2,
 * h+- = sqrt(z+-^2 + (R + rho)^2), k+- = sqrt(z+-^2 + (R - rho)^2) / h+-, gamma = (R - rho)/(R + rho):
 *   B_rho = (B_r / pi) [R/h+ cel(k+, 1, 1, -1) - R/h- cel(k-, 1, 1, -1)]
 *   B_z   = (B_r / pi) R/(R + rho) [z+/h+ cel(k+, gamma^2, 1, gamma) - z-/h- cel(k-, gamma^2, 1, gamma)]
 * in T. Inside the magnet this is the flux density B (not mu0 H). On the side surface
 * (rho = R, |z| < L/2) B_z jumps by B_r: the mean of the two sides is returned. The rim
 * of either face (rho = R, |z| = L/2) is refused (out_of_domain): B_rho is infinite there.
 * Far away it tends to the dipole field of moment m = B_r pi R^2 L / mu0.
 *
 * Method and accuracy: the current-sheet kernel shared with solenoidField
 * (src/flux/current-sheet.ts): cel near the magnet, Gauss-Legendre over loops at least a
 * radius from its side and beyond four half-diagonals; measured within 3 eps of |B| of a
 * 60-digit decimal.js oracle of the published form (tests/magnets/field.test.ts: remanences
 * 1e-300..1e300 T, sizes 1e-150..1e150 m, length / radius 0.1..10, out to 1e4 sizes).
 *
 * Validity: ideal uniform, rigid magnetisation (no demagnetisation of the material itself).
 *
 * Cautions: strong fields (ICNIRP thresholds; implanted devices from 0.5 mT).
 *
 * Reference: N. Derby and S. Olbert, Am. J. Phys. 78 (2010) 229, eqs. for B_rho and B_z with cel.
 *
 * @example
 * cylinderMagnetField({ remanence: quantity(1.3, "T"), radius: quantity(5, "mm"), length: quantity(10, "mm"), radialDistance: quantity(3, "mm"), axialDistance: quantity(10, "mm") }); // ≈ [0.0558, 0.129] T
 */
export const cylinderMagnetField = /* @__PURE__ */ defineFormula({
  id: "cylinderMagnetField",
  title: "Field of a cylinder magnet anywhere",
  category: "magnet",
  description: "Radial and axial flux density of a uniformly, axially magnetised cylindrical permanent magnet at any point, inside or outside, from its equivalent current sheet with Bulirsch's generalized complete elliptic integral.",
  equation: "B_rho = (Br/pi) [R/h+ cel(k+,1,1,-1) - R/h- cel(k-,1,1,-1)]; B_z = (Br/pi) R/(R+rho) [z+/h+ cel(k+,g^2,1,g) - z-/h- cel(k-,g^2,1,g)]",
  inputs: [
    { name: "remanence", dimension: "FluxDensity", description: "Remanence of the magnet material (signed along the axis)", example: 1.3 },
    { name: "radius", dimension: "Length", description: "Radius of the magnet", domain: POSITIVE, example: 0.005 },
    { name: "length", dimension: "Length", description: "Length of the magnet along its axis", domain: POSITIVE, example: 0.01 },
    { name: "radialDistance", dimension: "Length", description: "Distance of the point from the magnet's axis", domain: NON_NEGATIVE, example: 0.003 },
    { name: "axialDistance", dimension: "Length", description: "Signed distance of the point along the axis from the magnet's centre", example: 0.01 },
  ],
  output: { dimension: "FluxDensity", description: "Flux density components (radial outward, axial along the magnetisation); B inside the magnet", components: ["radial", "axial"] },
  relations: [notOnRim("magnet's faces")],
  // A permanent magnet's field is static: the implant line and the static limits apply.
  cautions: [strongFieldCaution(undefined, "static")],
  source: DERBY_OLBERT,
  // B = B_r F: the sheet's F is a ratio of lengths (scaled by a power of two inside sheetField).
  compute: (x) => {
    const f = sheetField(x.radius, x.length, x.radialDistance, x.axialDistance);
    return [x.remanence * f[0]!, x.remanence * f[1]!];
  },
});
