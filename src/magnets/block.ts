import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { gaussLegendre } from "../math/quadrature.js";
import { exponentOf, ldexp } from "../math/scaled.js";

/** Far zone: distance from the centre at least this many half-diagonals. */
const FAR_RATIO = 4;
/** Gauss-Legendre nodes per axis in the far zone (16^3 kernel evaluations). */
const FAR_NODES = 16;
const INV_FOUR_PI = 1 / (4 * Math.PI);

/** One of the three coordinates is on its face plane and the others within the extent. */
function edgeOrCorner(h: readonly [number, number, number], p: readonly number[]): boolean {
  const [x, y, z] = [Math.abs(p[0]!), Math.abs(p[1]!), Math.abs(p[2]!)];
  const [a, b, c] = h;
  return (x === a && y === b && z <= c) || (x === a && z === c && y <= b) || (y === b && z === c && x <= a);
}

/**
 * Flux density of a rectangular block magnet, magnetised along z, at any point.
 *
 * The block occupies |x| <= a, |y| <= b, |z| <= c (a, b, c half the sizes, m), centred at the
 * origin, with remanence B_r (T) along z. Its field is that of the magnetic charge sheets
 * +-B_r/mu0 on the faces z = +-c; with U = x - x', V = y - y', W = z - z' for the corners
 * x' = +-a, y' = +-b, z' = +-c, R = sqrt(U^2 + V^2 + W^2) and s the product of the signs of the
 * corner's coordinates that appear:
 *   B_x = (B_r / 4 pi) sum_(x', z') s [asinh((y + b)/sqrt(U^2 + W^2)) - asinh((y - b)/sqrt(U^2 + W^2))]
 *   B_y = (B_r / 4 pi) sum_(y', z') s [asinh((x + a)/sqrt(V^2 + W^2)) - asinh((x - a)/sqrt(V^2 + W^2))]
 *   B_z = B_r chi + (B_r / 4 pi) sum_(x', y', z') s atan(U V / (W R))
 * with chi = 1 inside the magnet (B, not mu0 H, is returned), 1/2 on a face and 0 outside
 * (E. P. Furlani, Permanent Magnet and Electromechanical Devices, 2001, sec. 4.3, the
 * rectangular magnet by the charge model; the same closed form as Yang et al. 1990).
 *
 * Stable evaluation: each asinh difference is one log1p of a sum of positive terms
 * (asinh p - asinh q = log1p(2b (1 + (V1 + V2)/(R1 + R2)) / (V2 + R2)) for 0 <= q < p, its
 * mirror for p <= 0, a sum of two positive asinh where the interval straddles 0). Far away
 * (beyond four half-diagonals) the corner sums cancel as the cube of size / distance; there
 * the field is the integral of the dipole density B_r / mu0 over the volume,
 *   B = (B_r / 4 pi) int [3 (R . z) R / |R|^5 - z / |R|^3] dV,
 * by 16-point Gauss-Legendre per axis (the integrand's singularities lie outside the
 * Bernstein ellipse of parameter 6.16 on every axis: error below 1e-20 relative).
 * On a face the tangential field jumps (the side faces carry the surface current): the
 * value returned is the mean of the two sides (atan of W = 0 taken as 0, chi = 1/2).
 * Points on an edge or corner are refused (out_of_domain): B_x or B_y is infinite on the
 * edges of the charged faces, and B_z has no single value on the side edges.
 *
 * Accuracy (tests/magnets/block.test.ts, against a decimal.js oracle of the published form,
 * relative to |B|): within 41 eps for side ratios 0.1..10, sizes 1e-100..1e100 m and points
 * out to 1e4 sizes; for plates and bars of side ratio 100..1000 the corner sums still cancel
 * next to the long faces (measured up to 8e-12).
 *
 * Validity: ideal uniform, rigid magnetisation (rare-earth magnets come close).
 *
 * Reference: Furlani (2001), sec. 4.3, field of a rectangular magnet (charge model).
 *
 * @example
 * blockMagnetField({ remanence: quantity(1.2, "T"), sizeX: quantity(10, "mm"), sizeY: quantity(10, "mm"), sizeZ: quantity(5, "mm"), position: [0.003, 0.002, 0.006] }); // ≈ [0.0657, 0.0406, 0.142] T
 */
export const blockMagnetField = /* @__PURE__ */ defineFormula({
  id: "blockMagnetField",
  title: "Field of a block magnet anywhere",
  category: "magnet",
  description: "Flux density vector of a uniformly magnetised rectangular block (cuboid) permanent magnet, magnetised along z and centred at the origin, at any point inside or outside, by the analytic charge-sheet form.",
  equation: "B_x = (Br/4pi) sum s [asinh((y+b)/rho_xz) - asinh((y-b)/rho_xz)]; B_y likewise; B_z = Br chi + (Br/4pi) sum s atan(U V / (W R))",
  inputs: [
    { name: "remanence", dimension: "FluxDensity", description: "Remanence of the magnet material (signed along z)", example: 1.2 },
    { name: "sizeX", dimension: "Length", description: "Size of the block along x", domain: POSITIVE, example: 0.01 },
    { name: "sizeY", dimension: "Length", description: "Size of the block along y", domain: POSITIVE, example: 0.01 },
    { name: "sizeZ", dimension: "Length", description: "Size of the block along z (the magnetisation)", domain: POSITIVE, example: 0.005 },
    { name: "position", dimension: "Length", description: "Point, from the block's centre (x, y, z)", vector: true, example: [0.003, 0.002, 0.006] },
  ],
  output: { dimension: "FluxDensity", description: "Flux density (B, also inside the magnet)", components: ["x", "y", "z"] },
  relations: [
    {
      rule: "the point is not on an edge or corner of the block, where the field is infinite or has no single value",
      holds: (x) => !edgeOrCorner([x.sizeX / 2, x.sizeY / 2, x.sizeZ / 2], x.position),
    },
  ],
  // A permanent magnet's field is static: the implant line and the static limits apply.
  cautions: [strongFieldCaution(undefined, "static")],
  source: { authors: "E. P. Furlani", year: 2001, title: "Permanent Magnet and Electromechanical Devices", locator: "sec. 4.3, rectangular magnet, charge model (from memory)" },
  compute: (x) => {
    const p = x.position;
    // The field depends on lengths only through their ratios: scale by a power of two (exact).
    const s = -exponentOf(Math.max(x.sizeX, x.sizeY, x.sizeZ, Math.abs(p[0]), Math.abs(p[1]), Math.abs(p[2])));
    const a = ldexp(x.sizeX, s - 1);
    const b = ldexp(x.sizeY, s - 1);
    const c = ldexp(x.sizeZ, s - 1);
    const px = ldexp(p[0], s);
    const py = ldexp(p[1], s);
    const pz = ldexp(p[2], s);
    const f = Math.hypot(px, py, pz) >= FAR_RATIO * Math.hypot(a, b, c) ? farField(a, b, c, px, py, pz) : nearField(a, b, c, px, py, pz);
    const br = x.remanence;
    return [br * f[0]!, br * f[1]!, br * f[2]!];
  },
});

const OUT = /* @__PURE__ */ new Float64Array(3);

/** The closed form, as fractions of B_r. */
function nearField(a: number, b: number, c: number, x: number, y: number, z: number): Float64Array {
  let fx = 0;
  let fy = 0;
  let fz = 0;
  for (let k = 0; k < 2; k++) {
    const sz = k === 0 ? 1 : -1;
    const w = z - sz * c;
    for (let i = 0; i < 2; i++) {
      const si = i === 0 ? 1 : -1;
      fx += si * sz * asinhDifference(y, b, Math.hypot(x - si * a, w)); // over y' for the corner line x' = si a
      fy += si * sz * asinhDifference(x, a, Math.hypot(y - si * b, w));
      const u = x - si * a;
      for (let j = 0; j < 2; j++) {
        const sj = j === 0 ? 1 : -1;
        const v = y - sj * b;
        // atan(U V / (W R)); W = 0: the mean of the two sides, 0.
        if (w !== 0) fz += si * sj * sz * Math.atan((u * v) / (w * Math.hypot(u, v, w)));
      }
    }
  }
  OUT[0] = INV_FOUR_PI * fx;
  OUT[1] = INV_FOUR_PI * fy;
  OUT[2] = chi(a, b, c, x, y, z) + INV_FOUR_PI * fz;
  return OUT;
}

/**
 * asinh((t + h)/r) - asinh((t - h)/r) for h > 0, r >= 0, without cancellation:
 * with V1 = t + h, V2 = t - h, R = sqrt(V^2 + r^2), for V2 >= 0 it is
 * ln((V1 + R1)/(V2 + R2)) = log1p(2h (1 + (V1 + V2)/(R1 + R2)) / (V2 + R2)) (the numerator
 * minus the denominator is 2h + (V1^2 - V2^2)/(R1 + R2), every term positive), the mirror
 * image for V1 <= 0, and the sum of two non-negative asinh where 0 lies between.
 */
function asinhDifference(t: number, h: number, r: number): number {
  const v1 = t + h;
  const v2 = t - h;
  const r1 = Math.hypot(v1, r);
  const r2 = Math.hypot(v2, r);
  if (v2 >= 0) return Math.log1p((2 * h * (1 + (v1 + v2) / (r1 + r2))) / (v2 + r2));
  if (v1 <= 0) return Math.log1p((2 * h * (1 - (v1 + v2) / (r1 + r2))) / (-v1 + r1));
  return Math.asinh(v1 / r) + Math.asinh(-v2 / r); // r > 0 here: r = 0 with v2 < 0 < v1 is an edge, refused
}

/** 1 inside, 1/2 on a face, 0 outside (edges are refused before this is reached). */
function chi(a: number, b: number, c: number, x: number, y: number, z: number): number {
  const ax = Math.abs(x);
  const ay = Math.abs(y);
  const az = Math.abs(z);
  if (ax > a || ay > b || az > c) return 0;
  return ax === a || ay === b || az === c ? 0.5 : 1;
}

/** The dipole-density integral by Gauss-Legendre on each axis, as fractions of B_r. */
function farField(a: number, b: number, c: number, x: number, y: number, z: number): Float64Array {
  const { nodes, weights } = gaussLegendre(FAR_NODES);
  let fx = 0;
  let fy = 0;
  let fz = 0;
  for (let i = 0; i < FAR_NODES; i++) {
    const rx = x - a * nodes[i]!;
    for (let j = 0; j < FAR_NODES; j++) {
      const ry = y - b * nodes[j]!;
      const wij = weights[i]! * weights[j]!;
      for (let k = 0; k < FAR_NODES; k++) {
        const rz = z - c * nodes[k]!;
        const r2 = rx * rx + ry * ry + rz * rz;
        const r = Math.sqrt(r2);
        const inv3 = 1 / (r2 * r);
        const t = (3 * rz * inv3) / r2; // 3 R_z / |R|^5
        const w = wij * weights[k]!;
        fx += w * t * rx;
        fy += w * t * ry;
        fz += w * (t * rz - inv3);
      }
    }
  }
  // dV = a b c dn dn dn; the kernel carries 1 / (4 pi).
  const scale = a * b * c * INV_FOUR_PI;
  OUT[0] = scale * fx;
  OUT[1] = scale * fy;
  OUT[2] = scale * fz;
  return OUT;
}
