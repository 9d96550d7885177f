import { defineFormula } from "../core/formula.js";
import { strongFieldCaution } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";
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
 * Near, but at least two of the smallest half-sizes from the block (plates and bars, where the
 * corner sums cancel like (distance / thin size)^2), the same dipole-density integral on
 * Gauss-Legendre panels: one across each thin size, graded along the long ones (panelField).
 *
 * Accuracy (tests/magnets/block.test.ts, against a decimal.js oracle of the published form,
 * relative to |B|): within 41 eps for side ratios 0.1..10, sizes 1e-100..1e100 m and points
 * out to 1e4 sizes; within 1e-13 beside plates and bars of side ratio 100 (was 2.7e-11 for
 * bars) and 1e-12 for plates of 1000 (measured 1.3e-13; nearer than the panels' budget
 * allows, the closed form).
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
    const f = Math.hypot(px, py, pz) >= FAR_RATIO * Math.hypot(a, b, c) ? farField(a, b, c, px, py, pz) : (panelField(a, b, c, px, py, pz) ?? nearField(a, b, c, px, py, pz));
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

/** Panels (centre, half-width) per axis for panelField; reused. */
const PANELS = /* @__PURE__ */ [new Float64Array(2 * 64), new Float64Array(2 * 64), new Float64Array(2 * 64)];
const PANEL_COUNT = /* @__PURE__ */ new Int32Array(3);
/** The closed form serves points nearer to the block than this many of its smallest half-sizes. */
const THIN_RATIO = 2;
/** Most kernel evaluations panelField may spend (about 1 ms); beyond it the closed form is used. */
const PANEL_BUDGET = 150_000;

/**
 * Panels along one axis of half-size h for a point at p on it, at distance dist from the block:
 * the integrand's singularities in that coordinate lie at least dist from the segment [-h, h].
 * One panel when dist >= 3h (Bernstein parameter >= 6.16, as in the far zone); otherwise panels
 * graded away from the nearest point clamp(p): a panel starting s from it has length
 * 2 (s + dist) / 3, so every panel keeps its nearest singularity three half-lengths away.
 * Bound: panel starts grow by 5/3 each step; a side of length len <= 2h takes
 * 1 + ceil(ln(1.5 len / dist) / ln(5/3)) panels; capped at 32 a side (-1 if that did not cover it).
 */
function axisPanels(h: number, p: number, dist: number, out: Float64Array): number {
  if (dist >= 3 * h) {
    out[0] = 0;
    out[1] = h;
    return 1;
  }
  const pc = Math.min(h, Math.max(-h, p));
  let n = 0;
  for (const [len, dir] of [[h - pc, 1], [pc + h, -1]] as const) {
    let s = 0;
    let j = 0;
    for (; j < 32 && s < len; j++) {
      const length = Math.min(len - s, (2 / 3) * (s + dist));
      out[2 * n] = pc + dir * (s + length / 2);
      out[2 * n + 1] = length / 2;
      n++;
      s += length;
    }
    countLoop(j);
    if (s < len) return -1; // not covered within 32 panels (the budget check makes this unreachable)
  }
  return n;
}

/**
 * Points away from the block by at least THIN_RATIO of its smallest half-size, not far: there
 * the corner sums of the closed form cancel like (distance / thin size)^2 (bars and plates, side
 * ratios 100 and more: 2.7e-11 of |B| beside a 100:1:1 bar, measured against
 * tests/magnets/block-oracle.ts). Instead the dipole-density integral of farField, by
 * Gauss-Legendre on panels per axis (axisPanels): one panel across each thin size, panels graded
 * along the long ones. Returns undefined (the caller uses the closed form) nearer than that, or
 * when the panels would cost more than PANEL_BUDGET kernel evaluations (plates seen from close by,
 * graded along two axes, where the closed form keeps about 5e-13).
 */
function panelField(a: number, b: number, c: number, x: number, y: number, z: number): Float64Array | undefined {
  const dx = Math.max(0, Math.abs(x) - a);
  const dy = Math.max(0, Math.abs(y) - b);
  const dz = Math.max(0, Math.abs(z) - c);
  const dist = Math.hypot(dx, dy, dz);
  if (!(dist >= THIN_RATIO * Math.min(a, b, c))) return undefined;
  // The panel counts, bounded first: a side of length len needs 1 + ceil(log_(5/3)(1.5 len / dist))
  // panels and len <= 2h (so at most 17 a side within the budget: 36 panels in all at 16^3 nodes each).
  const est = (h: number) => (dist >= 3 * h ? 1 : 2 * (1 + Math.ceil(Math.log((3 * h) / dist) / Math.log(5 / 3))));
  const cube = FAR_NODES * FAR_NODES * FAR_NODES;
  if (est(a) * est(b) * est(c) * cube > PANEL_BUDGET) return undefined;
  PANEL_COUNT[0] = axisPanels(a, x, dist, PANELS[0]!);
  PANEL_COUNT[1] = axisPanels(b, y, dist, PANELS[1]!);
  PANEL_COUNT[2] = axisPanels(c, z, dist, PANELS[2]!);
  if (PANEL_COUNT[0]! < 0 || PANEL_COUNT[1]! < 0 || PANEL_COUNT[2]! < 0) return undefined;
  const [px, py, pz] = PANELS as [Float64Array, Float64Array, Float64Array];
  SUM[0] = 0;
  SUM[1] = 0;
  SUM[2] = 0;
  for (let ip = 0; ip < PANEL_COUNT[0]!; ip++) {
    for (let jp = 0; jp < PANEL_COUNT[1]!; jp++) {
      for (let kp = 0; kp < PANEL_COUNT[2]!; kp++) {
        dipoleBox(px[2 * ip]!, px[2 * ip + 1]!, py[2 * jp]!, py[2 * jp + 1]!, pz[2 * kp]!, pz[2 * kp + 1]!, x, y, z);
      }
    }
  }
  OUT[0] = INV_FOUR_PI * SUM[0]!;
  OUT[1] = INV_FOUR_PI * SUM[1]!;
  OUT[2] = INV_FOUR_PI * SUM[2]!;
  return OUT;
}

/** Running sums of dipoleBox. */
const SUM = /* @__PURE__ */ new Float64Array(3);

/**
 * Adds to SUM the integral of the dipole-density kernel 3 (R . z) R / |R|^5 - z / |R|^3 over the
 * box centred at (cx, cy, cz) with half-widths (hx, hy, hz), by FAR_NODES-point Gauss-Legendre
 * on each axis (dV = hx hy hz dn dn dn).
 */
function dipoleBox(cx: number, hx: number, cy: number, hy: number, cz: number, hz: number, x: number, y: number, z: number): void {
  const { nodes, weights } = gaussLegendre(FAR_NODES);
  let sx = 0;
  let sy = 0;
  let sz = 0;
  for (let i = 0; i < FAR_NODES; i++) {
    const rx = x - (cx + hx * nodes[i]!);
    for (let j = 0; j < FAR_NODES; j++) {
      const ry = y - (cy + hy * nodes[j]!);
      const wij = weights[i]! * weights[j]!;
      for (let k = 0; k < FAR_NODES; k++) {
        const rz = z - (cz + hz * nodes[k]!);
        const r2 = rx * rx + ry * ry + rz * rz;
        const r = Math.sqrt(r2);
        const inv3 = 1 / (r2 * r);
        const t = (3 * rz * inv3) / r2; // 3 R_z / |R|^5
        const w = wij * weights[k]!;
        sx += w * t * rx;
        sy += w * t * ry;
        sz += w * (t * rz - inv3);
      }
    }
  }
  const vol = hx * hy * hz;
  SUM[0] = SUM[0]! + vol * sx;
  SUM[1] = SUM[1]! + vol * sy;
  SUM[2] = SUM[2]! + vol * sz;
}

/** The dipole-density integral by Gauss-Legendre on each axis, as fractions of B_r (one box, the kernel carries 1 / (4 pi)). */
function farField(a: number, b: number, c: number, x: number, y: number, z: number): Float64Array {
  SUM[0] = 0;
  SUM[1] = 0;
  SUM[2] = 0;
  dipoleBox(0, a, 0, b, 0, c, x, y, z);
  OUT[0] = INV_FOUR_PI * SUM[0]!;
  OUT[1] = INV_FOUR_PI * SUM[1]!;
  OUT[2] = INV_FOUR_PI * SUM[2]!;
  return OUT;
}
