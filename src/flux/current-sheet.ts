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
 * - Outside the cylinder (rho > a) each end's term is the field of that end's disk of
 *   magnetic charge; at least 2.5 radii from the disk's centre it is summed from the disk's
 *   exterior series (diskField), where cel's last step would cancel like the modulus.
 * - Beside the sheet (rho > a, |z| <= b, rho - a <= 2 b) the closed form with those disk
 *   terms is used: there the loops' fields cancel among themselves (a long sheet's outer field
 *   is small against each loop's) while the two disks' add.
 * - Elsewhere at least a radius from the sheet (and not far), where flat sheets make the
 *   closed form cancel as well, the same loop integral by Gauss-Legendre on panels graded
 *   away from the point (gradedQuadrature below).
 * Lengths arrive scaled by a power of two (largest about 1) so no square overflows.
 *
 * The point on the sheet's rim (rho = a, |z| = b), where k = 0 and B_rho is
 * logarithmically infinite, must be refused by the caller.
 */
import { MU0 } from "../constants/si.js";
import { cel } from "../math/cel.js";
import { ellipticK, ellipticMaxwell } from "../math/elliptic.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";
import { loopField } from "./field-sources.js";

/** Far zone: distance from the centre at least this many half-diagonals. */
export const FAR_RATIO = 4;
/** Gauss-Legendre nodes along the sheet in the far zone. */
export const FAR_NODES = 24;
/** The graded quadrature serves points at least this many radii from the sheet. */
const NEAR_LIMIT = 1;
const INV_PI = 1 / Math.PI;
const HALF_PI = Math.PI / 2;

/**
 * [F_rho, F_z] (dimensionless; B = mu0 K [F_rho, F_z]) into out, for a sheet of
 * radius a > 0 and half-length b > 0 and a point at rho >= 0, z (all scaled alike).
 */
export function currentSheetField(a: number, b: number, rho: number, z: number, out: Float64Array): void {
  // delta: distance from the point to the sheet in the (rho, z) half-plane, which is also how far
  // the loop integrand's nearest singularity (z' = z +- i |a - rho|) lies from the segment.
  const delta = Math.hypot(rho - a, Math.max(0, Math.abs(z) - b));
  // Beside the sheet, within its length and not farther out than that length, the loops' fields
  // cancel (the outer field of a long sheet is small against each loop's): the ends' disks do not.
  const beside = rho > a && Math.abs(z) <= b && rho - a <= 2 * b;
  if (!beside && delta >= NEAR_LIMIT * a && gradedQuadrature(a, b, rho, z, delta, out)) return;
  if (!beside && Math.hypot(rho, z) >= FAR_RATIO * Math.hypot(a, b)) {
    farField(a, b, rho, z, out);
    return;
  }
  const gamma = (a - rho) / (a + rho); // a - rho exact next to the sheet (Sterbenz)
  let fr = 0;
  let fz = 0;
  DISK[0] = 0;
  DISK[1] = 0;
  for (let side = 0; side < 2; side++) {
    const sign = side === 0 ? 1 : -1;
    const zs = side === 0 ? z + b : z - b;
    // Outside the cylinder (rho > a) an end's term is the field of its disk of magnetic charge
    // (-1 at the bottom, +1 at the top): far from that end (beside a long sheet) by the disk's series.
    if (rho > a && Math.hypot(rho, zs) >= DISK_RADII * a) {
      diskField(a, rho, zs, -sign);
      continue;
    }
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
  out[0] = INV_PI * fr + DISK[0]!;
  out[1] = INV_PI * (a / (a + rho)) * fz + DISK[1]!;
}

/** Accumulated [F_rho, F_z] of the ends taken as disks (diskField). */
const DISK = /* @__PURE__ */ new Float64Array(2);
/** The disk's series serves points at least this many radii from the disk's centre (a/r <= 0.4). */
const DISK_RADII = 2.5;
/** Most terms of the disk's series: at a/r <= 0.4 term k is below 2k 0.16^(k-1) of the first, 1e-18 at k = 25. */
const DISK_TERMS = 28;

/**
 * Adds charge times the field H / sigma of a uniformly charged disk (radius a, unit surface
 * charge, centred on the axis at axial offset 0) at (rho, zs), r = hypot(rho, zs) >= DISK_RADII a,
 * to DISK. Outside the cylinder each end's term of the closed form is this field (the sheet is
 * a magnet whose H comes from its end faces' charges +-K); written with cel it cancels like m,
 * the modulus (cel(k', gamma^2, 1, gamma) with gamma < 0 tends to 0 as m -> 0), and beside a
 * sheet 1000 radii long lost about 1e-11 of |B|. Here by the exterior series of the disk's
 * potential, the on-axis (sqrt(zs^2 + a^2) - |zs|) / 2 expanded in (a / zs)^2 and continued off
 * the axis with Legendre polynomials (an axisymmetric potential's expansion in r^-(l+1) P_l):
 *   phi = (r / 2) sum_k c_k q^k P_(2k-2)(mu),  q = (a/r)^2, mu = zs/r, c_k = binom(1/2, k),
 *   H_r = (1/2) sum_k c_k (2k - 1) q^k P_(2k-2)(mu),  H_t = (1/2) sum_k c_k q^k sin(t) P'_(2k-2)(mu),
 * with P_l and sin(t) P'_l (the associated P_l^1 up to sign) by their three-term recurrences, stable
 * for |mu| <= 1. Terms fall at least as 2k (a/r)^(2k-2); none cancels more than the field itself.
 */
function diskField(a: number, rho: number, zs: number, charge: number): void {
  const r = Math.hypot(rho, zs);
  const mu = zs / r;
  const st = rho / r;
  const q = (a / r) * (a / r);
  // P_l, P_(l-1) and Q_l = sin(t) P_l'(mu), Q_(l-1), starting at l = 0.
  let p = 1;
  let pPrev = 0;
  let qq = 0;
  let qPrev = 0;
  let l = 0;
  let c = 0.5; // binom(1/2, 1)
  let qk = q;
  let hr = 0;
  let ht = 0;
  let k = 1;
  for (; k <= DISK_TERMS; k++) {
    const tr = c * (2 * k - 1) * qk * p;
    const tt = c * qk * qq;
    hr += tr;
    ht += tt;
    if (Math.abs(tr) + Math.abs(tt) <= 1e-17 * (Math.abs(hr) + Math.abs(ht))) break;
    // Two steps of the recurrences: l -> l + 2.
    for (let step = 0; step < 2; step++) {
      const n = l + 1;
      const pNext = ((2 * n - 1) * mu * p - (n - 1) * pPrev) / n;
      const qNext = n === 1 ? st : ((2 * n - 1) * mu * qq - n * qPrev) / (n - 1);
      pPrev = p;
      p = pNext;
      qPrev = qq;
      qq = qNext;
      l = n;
    }
    c *= (0.5 - k) / (k + 1);
    qk *= q;
  }
  countLoop(Math.min(k, DISK_TERMS));
  hr *= 0.5 * charge;
  ht *= 0.5 * charge;
  DISK[0] = DISK[0]! + hr * st + ht * mu;
  DISK[1] = DISK[1]! + hr * mu - ht * st;
}

/** The far zone: Gauss-Legendre over the sheet's length of loops of current K dz'. */
function farField(a: number, b: number, rho: number, z: number, out: Float64Array): void {
  ACC[0] = 0;
  ACC[1] = 0;
  panel(a, rho, z, -b, b);
  // The loops carry mu0 (current 1): divide it out.
  out[0] = ACC[0]! / MU0;
  out[1] = ACC[1]! / MU0;
}

const ACC = /* @__PURE__ */ new Float64Array(2);

/** Adds int_lo^hi of the loop field over z' (FAR_NODES-point Gauss-Legendre) to ACC. */
function panel(a: number, rho: number, z: number, lo: number, hi: number): void {
  const { nodes, weights } = gaussLegendre(FAR_NODES);
  const mid = 0.5 * lo + 0.5 * hi;
  const half = 0.5 * hi - 0.5 * lo;
  let fr = 0;
  let fz = 0;
  for (let i = 0; i < FAR_NODES; i++) {
    const loop = loopField.definition.compute({ current: 1, radius: a, radialDistance: rho, axialDistance: z - (mid + half * nodes[i]!) }) as readonly number[];
    fr += weights[i]! * loop[0]!;
    fz += weights[i]! * loop[1]!;
  }
  ACC[0] = ACC[0]! + half * fr;
  ACC[1] = ACC[1]! + half * fz;
}

/** Most panels on each side of the point in the graded quadrature: (5/3)^30 = 4.6e6 covers b / delta up to 2e6. */
const PANEL_CAP = 30;

/**
 * Points at least a radius away from the sheet (delta >= a): there the closed form loses
 * about (delta / a)^2 of its digits beyond the ends of a long sheet (both end terms tend to
 * +-pi/2) and about delta / a beside it. Instead the loop integral over z' is split into
 * panels graded away from the point's nearest position z_c on the sheet: a panel that starts
 * s from z_c (along the axis) has length 2 (s + delta) / 3, so the integrand's nearest
 * singularity, at least s + delta away, is at least three half-lengths from the panel
 * (Bernstein parameter >= 6.16, as in the far zone), and panel starts grow by 5/3 each
 * step. Returns false (the caller uses the closed form) when more than PANEL_CAP panels a
 * side would be needed (a sheet more than 2e6 times longer than delta).
 * Measured (tests/flux/solenoid-field.test.ts): within 1e-12 of |B| for aspect ratios
 * 1e-3..100. Beside a sheet 1000 radii long it lost 1.2e-10, the loops' fields cancelling
 * there: such points now take the closed form with the ends' disk series (within 1e-13).
 */
function gradedQuadrature(a: number, b: number, rho: number, z: number, delta: number, out: Float64Array): boolean {
  const zc = Math.min(b, Math.max(-b, z));
  // Each side of zc: [zc, b] upwards and [-b, zc] downwards, with lengths 'up' and 'down'.
  const up = b - zc;
  const down = zc + b;
  const need = (len: number) => (len <= delta / 1.5 ? 1 : 1 + Math.ceil(Math.log((1.5 * len) / delta) / Math.log(5 / 3)));
  if (need(up) > PANEL_CAP || need(down) > PANEL_CAP) return false;
  ACC[0] = 0;
  ACC[1] = 0;
  for (const [len, dir] of [[up, 1], [down, -1]] as const) {
    if (len === 0) continue;
    // Panels [s, s + L] along dir from zc, s from 0: the first of length min(len, 2 delta / 3),
    // then each 2/3 of its distance from zc plus delta (the singularity is at least that far).
    let s = 0;
    let n = 0;
    for (; n < PANEL_CAP + 1 && s < len; n++) {
      const length = Math.min(len - s, (2 / 3) * (s + delta));
      const lo = zc + dir * s;
      const hi = zc + dir * (s + length);
      panel(a, rho, z, Math.min(lo, hi), Math.max(lo, hi));
      s += length;
    }
    countLoop(n);
  }
  out[0] = ACC[0]! / MU0;
  out[1] = ACC[1]! / MU0;
  return true;
}
