/**
 * The field of a finite cylindrical current sheet (an ideal solenoid, or an
 * axially magnetised cylinder through its surface current K = M = B_r / mu0),
 * shared by solenoidField and cylinderMagnetField.
 *
 * B = mu0 K [F_rho, F_z] with K the surface current density (A/m) and, for a sheet of
 * radius a and half-length b, a point at radial distance rho and axial distance z
 * from the centre, z+- = z +- b, h+- = sqrt(z+-^2 + (a + rho)^2), k+- = sqrt(z+-^2 + (a - rho)^2) / h+-,
 * alpha+- = a / h+-, beta+- = z+- / h+-, gamma = (a - rho) / (a + rho):
 *   F_rho = (1/pi) [alpha+ cel(k+, 1, 1, -1) - alpha- cel(k-, 1, 1, -1)]
 *   F_z   = (1/pi) a / (a + rho) [beta+ cel(k+, gamma^2, 1, gamma) - beta- cel(k-, gamma^2, 1, gamma)]
 * (N. Derby and S. Olbert, "Cylindrical magnets and ideal solenoids", Am. J. Phys. 78
 * (2010) 229-235, eqs. for B_rho and B_z in terms of cel, with B_0 = mu0 n I / pi).
 *
 * Stable evaluation:
 * - cel(k, 1, 1, -1) = -((2 - m) K - 2 E) / m (m = 1 - k^2 = 4 a rho / h^2 from the geometry):
 *   for m <= 0.9 through Maxwell's combination by Landen's transformation
 *   (ellipticMaxwell), which keeps full relative precision as m -> 0 (the axis and far
 *   away, where cel's own last step cancels); cel itself above (|cel| >= K / 4 there).
 *   m = 0 (the axis) gives 0: B_rho vanishes on the axis.
 * - On the sheet (rho = a, |z| < b) gamma = 0 and the axial field jumps by mu0 K across it;
 *   the value returned there is the mean of the two sides, from cel(k, 0, 1, 0) = K(k)
 *   (the principal part sign(gamma) pi / (2 k) of the two sides cancels in the mean).
 *   Where gamma^2 underflows but gamma does not (a point within 1e-154 radii of the
 *   sheet) the limit K(k) + sign(gamma) pi / (2 k) is used; the terms left out are
 *   O(|gamma|) relative.
 * - Far away (distance from the centre at least FAR_RATIO times the half-diagonal
 *   sqrt(a^2 + b^2)) the two terms of each bracket nearly cancel (the field falls as the
 *   cube of the distance while each term falls as its first power). There the same
 *   field is summed as the integral over the sheet's length of circular loops of
 *   current K dz', by FAR_NODES-point Gauss-Legendre quadrature of loopField's stable
 *   kernel. The integrand's nearest singularities (z' = z +- i |a -+ rho|) lie at least
 *   3 half-diagonals from the segment, outside the Bernstein ellipse of parameter
 *   3 + sqrt(10) = 6.16, so the quadrature error is below about 6.16^(-2 n) times a
 *   modest constant: 1e-37 for n = 24.
 * Lengths arrive scaled by a power of two (largest about 1) so no square overflows.
 *
 * The point on the sheet's rim (rho = a, |z| = b), where k = 0 and B_rho is
 * logarithmically infinite, must be refused by the caller.
 */
import { MU0 } from "../constants/si.js";
import { cel } from "../math/cel.js";
import { ellipticK, ellipticMaxwell } from "../math/elliptic.js";
import { gaussLegendre } from "../math/quadrature.js";
import { loopField } from "./field-sources.js";

/** Far zone: distance from the centre at least this many half-diagonals. */
export const FAR_RATIO = 4;
/** Gauss-Legendre nodes along the sheet in the far zone. */
export const FAR_NODES = 24;
const INV_PI = 1 / Math.PI;
const HALF_PI = Math.PI / 2;

/**
 * [F_rho, F_z] (dimensionless; B = mu0 K [F_rho, F_z]) into out, for a sheet of
 * radius a > 0 and half-length b > 0 and a point at rho >= 0, z (all scaled alike).
 */
export function currentSheetField(a: number, b: number, rho: number, z: number, out: Float64Array): void {
  if (Math.hypot(rho, z) >= FAR_RATIO * Math.hypot(a, b)) {
    farField(a, b, rho, z, out);
    return;
  }
  const gamma = (a - rho) / (a + rho); // a - rho exact next to the sheet (Sterbenz)
  let fr = 0;
  let fz = 0;
  for (let side = 0; side < 2; side++) {
    const sign = side === 0 ? 1 : -1;
    const zs = side === 0 ? z + b : z - b;
    const h = Math.hypot(zs, a + rho);
    const kc = Math.hypot(zs, a - rho) / h; // from the geometry: 1 - m would lose it near the rim
    const m = 4 * (a / h) * (rho / h);
    let c1: number;
    if (m === 0) c1 = 0;
    else if (m <= 0.9) c1 = -ellipticMaxwell(m, kc * kc) / m;
    else c1 = cel(kc, 1, 1, -1);
    let c2: number;
    const p = gamma * gamma;
    if (p > 0) c2 = cel(kc, p, 1, gamma);
    else c2 = ellipticK(m, kc * kc) + (gamma === 0 ? 0 : Math.sign(gamma) * (HALF_PI / kc));
    fr += sign * (a / h) * c1;
    fz += sign * (zs / h) * c2;
  }
  out[0] = INV_PI * fr;
  out[1] = INV_PI * (a / (a + rho)) * fz;
}

/** The far zone: Gauss-Legendre over the sheet's length of loops of current K dz'. */
function farField(a: number, b: number, rho: number, z: number, out: Float64Array): void {
  const { nodes, weights } = gaussLegendre(FAR_NODES);
  let fr = 0;
  let fz = 0;
  for (let i = 0; i < FAR_NODES; i++) {
    const zp = b * nodes[i]!;
    const loop = loopField.definition.compute({ current: 1, radius: a, radialDistance: rho, axialDistance: z - zp }) as readonly number[];
    fr += weights[i]! * loop[0]!;
    fz += weights[i]! * loop[1]!;
  }
  // int_-b^b (...) dz' = b sum w_i (...); the loops carry mu0 (current 1): divide it out.
  out[0] = (b * fr) / MU0;
  out[1] = (b * fz) / MU0;
}
