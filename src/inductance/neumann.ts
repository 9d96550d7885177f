/**
 * Neumann's formula for polylines: mutual inductance of two thin-wire paths and
 * the self-inductance of a path of round wire.
 *
 *   M = mu0/(4 pi) sum_i sum_j (u_i . u_j) int_{seg i} int_{seg j} ds dt / |r_i(s) - r_j(t)|
 *
 * Method. For each pair of straight segments the inner integral over segment j
 * is done in closed form: for a point P at axial position s (from the segment's
 * start, along its unit vector) and distance rho from its line, with R0, R1 the
 * distances to its ends,
 *   int_0^L dt / |P - Q(t)| = ln((L - s + R1)(s + R0) / rho^2)   (0 < s < L),
 *                           = ln((L - s + R1)/(R0 - s))          (s <= 0),
 *                           = ln((s + R0)/(s - L + R1))          (s >= L),
 * each branch a ratio of sums of positive terms (rho from a cross product), so no
 * digits cancel near the segment. The outer integral is Gauss-Legendre over
 * segment i: 4 points when the piece is shorter than 1/10 of the distance to
 * the nearest singularity of the inner integral (segment j's end points, or
 * where the piece's line passes j's line within j), 8 points up to 4/10, 12
 * points up to that distance, otherwise the piece is halved (recursively, down to `maxDepth`
 * levels). Halving towards a touching point (adjacent segments share a vertex)
 * grades the panels geometrically, so the integrable logarithmic singularity
 * there costs about 12 points per level. With these rules the pair integral is
 * accurate to about 1e-13 relative; collinear segments that overlap give an
 * infinite result (reported as an error). Every loop is bounded: the pair loops by
 * MAX_SEGMENT_PAIRS, the refinement of one pair by PIECE_BOUND pieces (proof there).
 *
 * References: F. E. Neumann (1845), the double line integral; E. B. Rosa,
 * Bull. Bureau of Standards 4 (1908) 301 (straight filaments, partial self-inductance);
 * F. W. Grover, Inductance Calculations (1946), polygons of straight wire.
 */
import { MU0 } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";
import { wirePartialSelf } from "./lines.js";

/** A polyline as xyz triplets in metres: [x0, y0, z0, x1, y1, z1, ...]; repeat the first point to close it. */
export type Polyline = Float64Array | readonly number[];

/**
 * Most segment pairs one call integrates (segments of A times segments of B, or
 * n (n - 1) / 2 for a self-inductance): the outer loops' bound. A pair costs a
 * few closed-form evaluations when far apart and at most PIECE_BOUND pieces near contact.
 */
export const MAX_SEGMENT_PAIRS = 1_000_000;

/**
 * Pieces the refinement of one pair can visit at maxDepth = 60. A piece of length
 * h is halved only when a singularity of the inner integral lies within h of it.
 * There are at most three such points per pair (segment j's two ends, and one
 * complex pair where the lines pass), and at each depth at most three pieces of
 * length h lie within h of one point (their projections cover an interval of
 * length 2h). So at most 9 pieces are halved per depth, and the recursion visits
 * at most 1 + 2 * 9 * maxDepth pieces: 1081 at the largest maxDepth (60), 721 at
 * the default 40. Measured: tests/inductance/neumann.test.ts.
 */
export const PIECE_BOUND = 1 + 18 * 60;

/** Shortest piece, relative to the size of its coordinates, that is still halved. */
const RESOLVE = 2 ** -40;

/** Pieces visited by the current pair's refinement (reported to countLoop per pair). */
let pieces = 0;

export interface NeumannOptions {
  /** Maximum number of halvings of a segment near another one (default 40). */
  readonly maxDepth?: number;
}

export interface Segments {
  readonly n: number;
  readonly x: Float64Array; // start points
  readonly y: Float64Array;
  readonly z: Float64Array;
  readonly ux: Float64Array; // unit directions
  readonly uy: Float64Array;
  readonly uz: Float64Array;
  readonly len: Float64Array;
}

export function segments(path: Polyline, name: string, tool: string): Segments {
  if (!(path instanceof Float64Array) && !Array.isArray(path)) {
    throw new FormulaError("invalid_argument", { formula: tool, input: name, detail: "expected a Float64Array (or array) of xyz triplets" });
  }
  const len = path.length;
  if (len % 3 !== 0 || len < 6) {
    throw new FormulaError("invalid_argument", { formula: tool, input: name, detail: `expected at least two points as xyz triplets, got ${len} numbers` });
  }
  for (let i = 0; i < len; i++) {
    const v = path[i];
    if (typeof v !== "number" || v - v !== 0) {
      throw new FormulaError("invalid_argument", { formula: tool, input: name, value: v, detail: `coordinate ${i} is not a finite number` });
    }
  }
  const np = len / 3;
  const x = new Float64Array(np - 1);
  const y = new Float64Array(np - 1);
  const z = new Float64Array(np - 1);
  const ux = new Float64Array(np - 1);
  const uy = new Float64Array(np - 1);
  const uz = new Float64Array(np - 1);
  const L = new Float64Array(np - 1);
  let n = 0;
  for (let i = 0; i + 1 < np; i++) {
    const dx = path[3 * i + 3]! - path[3 * i]!;
    const dy = path[3 * i + 4]! - path[3 * i + 1]!;
    const dz = path[3 * i + 5]! - path[3 * i + 2]!;
    const l = Math.hypot(dx, dy, dz);
    if (l === 0) continue; // a repeated point carries no segment
    x[n] = path[3 * i]!;
    y[n] = path[3 * i + 1]!;
    z[n] = path[3 * i + 2]!;
    ux[n] = dx / l;
    uy[n] = dy / l;
    uz[n] = dz / l;
    L[n] = l;
    n++;
  }
  return { n, x, y, z, ux, uy, uz, len: L };
}

/** int_0^L dt / |P - (B + t u)| for a point P and a segment (B, u, L), without cancellation. */
function lineIntegral(px: number, py: number, pz: number, bx: number, by: number, bz: number, ux: number, uy: number, uz: number, L: number): number {
  const wx = px - bx;
  const wy = py - by;
  const wz = pz - bz;
  const s = wx * ux + wy * uy + wz * uz;
  const r0 = Math.sqrt(wx * wx + wy * wy + wz * wz);
  const ex = wx - L * ux;
  const ey = wy - L * uy;
  const ez = wz - L * uz;
  const r1 = Math.sqrt(ex * ex + ey * ey + ez * ez);
  if (s <= 0) return Math.log((L - s + r1) / (r0 - s));
  if (s >= L) return Math.log((s + r0) / (s - L + r1));
  const cx = wy * uz - wz * uy;
  const cy = wz * ux - wx * uz;
  const cz = wx * uy - wy * ux;
  return Math.log(((L - s + r1) * (s + r0)) / (cx * cx + cy * cy + cz * cz));
}

/** Distance from point Q to the segment P + s u, s in [0, h]. */
function pointSegmentDistance(qx: number, qy: number, qz: number, px: number, py: number, pz: number, ux: number, uy: number, uz: number, h: number): number {
  const wx = qx - px;
  const wy = qy - py;
  const wz = qz - pz;
  const s = Math.min(h, Math.max(0, wx * ux + wy * uy + wz * uz));
  const dx = wx - s * ux;
  const dy = wy - s * uy;
  const dz = wz - s * uz;
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/**
 * Distance, in the complex s-plane, from the piece [0, h] of segment i (start P,
 * unit u) to the nearest singularity of the closed-form inner integral over
 * segment j (start B, unit v, length L). That integral is analytic except on
 * segment j, so the singularities of s -> F(P + s u) are
 *  - near j's end points: at complex distance equal to the end point's
 *    distance from the piece;
 *  - where the line of i passes j's line inside the segment: rho(s)^2 =
 *    (s - s*)^2 sin^2(theta) + delta^2 vanishes at s* +- i delta / sin(theta).
 * Gauss-Legendre on the piece converges like the Bernstein ellipse through the
 * nearest one; parallel segments have only the end-point singularities, so a
 * wire running close beside another is not cut up along its whole length.
 */
function singularityDistance(
  px: number, py: number, pz: number, ux: number, uy: number, uz: number, h: number,
  bx: number, by: number, bz: number, vx: number, vy: number, vz: number, L: number,
): number {
  let d = Math.min(
    pointSegmentDistance(bx, by, bz, px, py, pz, ux, uy, uz, h),
    pointSegmentDistance(bx + L * vx, by + L * vy, bz + L * vz, px, py, pz, ux, uy, uz, h),
  );
  const b = ux * vx + uy * vy + uz * vz;
  const sin2 = 1 - b * b;
  if (sin2 > 1e-20) {
    const wx = px - bx;
    const wy = py - by;
    const wz = pz - bz;
    const dA = ux * wx + uy * wy + uz * wz;
    const eB = vx * wx + vy * wy + vz * wz;
    const sStar = (b * eB - dA) / sin2;
    const tStar = (eB - b * dA) / sin2;
    if (tStar >= 0 && tStar <= L) {
      const cx = wx + sStar * ux - tStar * vx;
      const cy = wy + sStar * uy - tStar * vy;
      const cz = wz + sStar * uz - tStar * vz;
      const delta = Math.sqrt(cx * cx + cy * cy + cz * cz);
      const off = Math.max(0, -sStar, sStar - h);
      d = Math.min(d, Math.hypot(off, delta / Math.sqrt(sin2)));
    }
  }
  return d;
}

const G4 = /* @__PURE__ */ gaussLegendre(4);
const G8 = /* @__PURE__ */ gaussLegendre(8);
const G12 = /* @__PURE__ */ gaussLegendre(12);

/**
 * int over the piece (start P, unit u of segment i, length h) of the closed-form
 * integral over segment j of B, adaptively as described above.
 */
function pieceIntegral(
  px: number, py: number, pz: number, ux: number, uy: number, uz: number, h: number,
  B: Segments, j: number, depth: number, maxDepth: number,
): number {
  pieces++;
  const bx = B.x[j]!;
  const by = B.y[j]!;
  const bz = B.z[j]!;
  const vx = B.ux[j]!;
  const vy = B.uy[j]!;
  const vz = B.uz[j]!;
  const L = B.len[j]!;
  // Cheap lower bound from the midpoints first; the singularity distance only when needed.
  const mx = px + 0.5 * h * ux - (bx + 0.5 * L * vx);
  const my = py + 0.5 * h * uy - (by + 0.5 * L * vy);
  const mz = pz + 0.5 * h * uz - (bz + 0.5 * L * vz);
  let d = Math.sqrt(mx * mx + my * my + mz * mz) - 0.5 * (h + L);
  if (h > 0.1 * d) d = singularityDistance(px, py, pz, ux, uy, uz, h, bx, by, bz, vx, vy, vz, L);
  // Points by the ratio of piece length to singularity distance (Bernstein-ellipse
  // bound rho^(-2n) below about 1e-14 in each tier).
  let rule = G4;
  if (h > 0.1 * d) {
    rule = G8;
    if (h > 0.4 * d) {
      // Halve while the piece is longer than what its coordinates resolve (2^-40 of their
      // size): shorter pieces put Gauss nodes onto the touching vertex itself, where the
      // closed form divides by a distance that has rounded to 0.
      if (h > d && depth < maxDepth && h > RESOLVE * (Math.abs(px) + Math.abs(py) + Math.abs(pz) + h)) {
        const half = 0.5 * h;
        return (
          pieceIntegral(px, py, pz, ux, uy, uz, half, B, j, depth + 1, maxDepth) +
          pieceIntegral(px + half * ux, py + half * uy, pz + half * uz, ux, uy, uz, half, B, j, depth + 1, maxDepth)
        );
      }
      rule = G12;
    }
  }
  const { nodes, weights } = rule;
  const c = 0.5 * h;
  let sum = 0;
  for (let k = 0; k < nodes.length; k++) {
    const t = c + c * nodes[k]!;
    sum += weights[k]! * lineIntegral(px + t * ux, py + t * uy, pz + t * uz, bx, by, bz, vx, vy, vz, L);
  }
  return sum * c;
}

/** True when segments i and j lie on one line and overlap over a positive length (infinite M). */
function collinearOverlap(A: Segments, i: number, B: Segments, j: number): boolean {
  const ux = A.ux[i]!;
  const uy = A.uy[i]!;
  const uz = A.uz[i]!;
  const cx = uy * B.uz[j]! - uz * B.uy[j]!;
  const cy = uz * B.ux[j]! - ux * B.uz[j]!;
  const cz = ux * B.uy[j]! - uy * B.ux[j]!;
  if (cx * cx + cy * cy + cz * cz > 1e-24) return false;
  const wx = B.x[j]! - A.x[i]!;
  const wy = B.y[j]! - A.y[i]!;
  const wz = B.z[j]! - A.z[i]!;
  const s0 = wx * ux + wy * uy + wz * uz;
  const ox = wx - s0 * ux;
  const oy = wy - s0 * uy;
  const oz = wz - s0 * uz;
  const scale = Math.max(A.len[i]!, B.len[j]!);
  if (ox * ox + oy * oy + oz * oz > 1e-24 * scale * scale) return false;
  const s1 = s0 + B.len[j]! * (B.ux[j]! * ux + B.uy[j]! * uy + B.uz[j]! * uz);
  const lo = Math.max(0, Math.min(s0, s1));
  const hi = Math.min(A.len[i]!, Math.max(s0, s1));
  return hi - lo > 1e-12 * scale;
}

/** mu0/(4 pi) (u_i . u_j) int int over the segment pair; 0 for perpendicular segments. */
function pairMutual(A: Segments, i: number, B: Segments, j: number, maxDepth: number): number {
  const dot = A.ux[i]! * B.ux[j]! + A.uy[i]! * B.uy[j]! + A.uz[i]! * B.uz[j]!;
  if (dot === 0) return 0;
  if (collinearOverlap(A, i, B, j)) return Infinity;
  pieces = 0;
  const v = dot * pieceIntegral(A.x[i]!, A.y[i]!, A.z[i]!, A.ux[i]!, A.uy[i]!, A.uz[i]!, A.len[i]!, B, j, 0, maxDepth);
  countLoop(pieces);
  return v;
}

/** Refuses more segment pairs than MAX_SEGMENT_PAIRS, naming the path input. */
export function checkPairs(pairs: number, input: string, tool: string): void {
  if (pairs > MAX_SEGMENT_PAIRS) {
    throw new FormulaError("invalid_argument", {
      formula: tool,
      input,
      value: pairs,
      detail: `${pairs} segment pairs exceed the limit of ${MAX_SEGMENT_PAIRS} per call; use fewer, longer segments where the path is straight`,
    });
  }
}

export function depthOption(options: NeumannOptions | undefined, tool: string): number {
  const d = options?.maxDepth ?? 40;
  if (!Number.isInteger(d) || d < 0 || d > 60) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "maxDepth", value: d, detail: "a whole number 0..60" });
  }
  return d;
}

/**
 * Mutual inductance of two thin-wire paths (polylines) by Neumann's formula.
 *
 * M = mu0/(4 pi) sum over segment pairs of (u_i . u_j) int int ds dt / |r_i - r_j|,
 * paths as xyz triplets in m (current flows from the first point to the last;
 * repeat the first point to close a loop); M in H.
 *
 * Filaments: the wires' thickness is neglected, which holds when the paths are
 * far apart compared with the wire radius. Paths that share a stretch of line
 * give an infinite result and a FormulaError "out_of_range".
 *
 * Long calls: `options.signal` cancels the call (FormulaError "cancelled")
 * and `options.onProgress` reports segment pairs done of A's segments times
 * B's (core/progress.ts); the result is the same with or without them.
 *
 * @example
 * // two coaxial squares, side 0.1 m, 0.05 m apart
 * const sq = (z: number) => new Float64Array([0,0,z, 0.1,0,z, 0.1,0.1,z, 0,0.1,z, 0,0,z]);
 * mutualInductance(sq(0), sq(0.05)); // ≈ 3.2e-8 H
 */
export function mutualInductance(pathA: Polyline, pathB: Polyline, options?: NeumannOptions & LongRunOptions): number {
  const tool = "mutualInductance";
  const maxDepth = depthOption(options, tool);
  const A = segments(pathA, "pathA", tool);
  const B = segments(pathB, "pathB", tool);
  const total = A.n * B.n;
  checkPairs(total, "pathB", tool);
  const t = ticker(tool, options, total);
  // Blocks of whole rows of about PAIRS_PER_TICK pairs; each row is added to the
  // running sum in order, so the sum is sumRows over all rows, bit for bit.
  const step = Math.max(1, Math.floor(PAIRS_PER_TICK / Math.max(1, B.n)));
  let sum = 0;
  for (let i0 = 0; i0 < A.n && total > 0; i0 += step) {
    t.tick(i0 * B.n);
    const rows = mutualRows(A, B, maxDepth, i0, Math.min(A.n, i0 + step));
    for (let k = 0; k < rows.length; k++) sum += rows[k]!;
  }
  countLoop(Math.ceil(A.n / step));
  const M = finishMutualInductance(sum);
  t.finish();
  return M;
}

/**
 * Low-frequency self-inductance of a path (polyline) of round wire.
 *
 * L = sum_i (mu0 l_i/(2 pi)) (ln(2 l_i/a) - 3/4) + sum_{i != j} M_ij + end terms,
 * with l_i the segment lengths, a the wire radius, M_ij Neumann's integral
 * between the centrelines of segments i and j (filaments); the path as xyz
 * triplets in m (it is closed when the last point equals the first); L in H.
 *
 * Each segment's own part is the long-wire form of Rosa's partial
 * self-inductance, (mu0 l/(2 pi))(ln(2l/a) - 3/4): with it, splitting a straight
 * wire into collinear pieces changes nothing (the filament mutual inductance of
 * touching collinear pieces supplies exactly the difference), so the result
 * does not depend on how finely a smooth path is cut. An open path adds the
 * end terms of Rosa's expression (straightWireInductance minus the long-wire
 * form, half for each of the first and last segments), so a single straight
 * segment gives Rosa's value exactly.
 *
 * Validity: thin wire (a much smaller than the path's radius of curvature and
 * segment lengths at corners); uniform current. Sharp corners carry an error of
 * order a/l; smooth paths converge to the thin-wire inductance as the segments
 * shrink. A path that runs back over itself gives FormulaError "out_of_range".
 *
 * Long calls: `options.signal` and `options.onProgress` as for mutualInductance;
 * progress counts segment pairs, n (n - 1) / 2 for n segments.
 *
 * References: Rosa (1908); Grover (1946), polygons of round wire.
 *
 * @example
 * // square loop, side 0.1 m, wire radius 0.5 mm
 * polylineSelfInductance(new Float64Array([0,0,0, 0.1,0,0, 0.1,0.1,0, 0,0.1,0, 0,0,0]), 0.0005); // ≈ 3.82e-7 H
 */
export function polylineSelfInductance(path: Polyline, wireRadius: number, options?: NeumannOptions & LongRunOptions): number {
  const plan = planSelfInductance(path, wireRadius, options);
  const n = plan.S.n;
  const total = (n * (n - 1)) / 2;
  const t = ticker("polylineSelfInductance", options, total);
  // Row i holds n - 1 - i pairs: blocks of rows until about PAIRS_PER_TICK pairs,
  // each row added to the running sum in order (sumRows over all rows, bit for bit).
  let sum = 0;
  let done = 0;
  let blocks = 0;
  for (let i0 = 0; i0 < n && total > 0; blocks++) {
    t.tick(done);
    let i1 = i0;
    let pairs = 0;
    for (; i1 < n && pairs < PAIRS_PER_TICK; i1++) pairs += n - 1 - i1;
    const rows = selfRows(plan.S, plan.maxDepth, i0, i1);
    for (let k = 0; k < rows.length; k++) sum += rows[k]!;
    done += pairs;
    i0 = i1;
  }
  countLoop(blocks);
  const L = finishSelfInductance(plan, sum);
  t.finish();
  return L;
}

/**
 * Segment pairs between two progress ticks (whole rows, at least one): about
 * 0.6 ms of well-separated pairs at the measured 150 ns a pair (bench/neumann.ts);
 * near pairs cost up to PIECE_BOUND pieces each, so a block can take longer.
 * Progress counts segment pairs.
 */
const PAIRS_PER_TICK = 4096;

/** A checked self-inductance request: its segments and the segments' own parts (H). */
export interface SelfInductancePlan {
  readonly S: Segments;
  readonly maxDepth: number;
  readonly self: number;
}

/** The checks of polylineSelfInductance and the sum of the segments' own parts. */
export function planSelfInductance(path: Polyline, wireRadius: number, options?: NeumannOptions): SelfInductancePlan {
  const tool = "polylineSelfInductance";
  const maxDepth = depthOption(options, tool);
  if (typeof wireRadius !== "number" || !(wireRadius > 0) || wireRadius === Infinity) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "wireRadius", value: wireRadius, detail: "a positive finite radius in m" });
  }
  const S = segments(path, "path", tool);
  if (S.n === 0) throw new FormulaError("invalid_argument", { formula: tool, input: "path", detail: "all points coincide" });
  checkPairs((S.n * (S.n - 1)) / 2, "path", tool);
  const a = wireRadius;
  const longForm = (l: number): number => ((MU0 * l) / (2 * Math.PI)) * (Math.log((2 * l) / a) - 0.75);
  let self = 0;
  for (let i = 0; i < S.n; i++) self += longForm(S.len[i]!);
  const last = path.length - 3;
  const closed = path[0] === path[last] && path[1] === path[last + 1] && path[2] === path[last + 2];
  if (!closed) {
    const first = S.len[0]!;
    const end = S.len[S.n - 1]!;
    self += 0.5 * (wirePartialSelf(first, a) - longForm(first) + wirePartialSelf(end, a) - longForm(end));
  }
  return { S, maxDepth, self };
}

/** L from the plan and the summed pair rows (selfRows), in H; out_of_range when infinite. */
export function finishSelfInductance(plan: SelfInductancePlan, mutual: number): number {
  const L = plan.self + (2 * MU0 * mutual) / (4 * Math.PI);
  if (L - L !== 0) throw new FormulaError("out_of_range", { formula: "polylineSelfInductance", detail: "the path runs back over itself" });
  return L;
}

/** M from the summed pair rows (mutualRows), in H; out_of_range when infinite. */
export function finishMutualInductance(rowSum: number): number {
  const M = (MU0 / (4 * Math.PI)) * rowSum;
  if (M - M !== 0) throw new FormulaError("out_of_range", { formula: "mutualInductance", detail: "the paths touch along a common stretch of line" });
  return M;
}

/*
 * The double sums are summed row by row: row i is the sum over j of segment
 * i's pairs, and the result the sum of the rows in order. Rows are
 * independent, so any split of the rows (worker chunks) gives, bit for bit,
 * the sum of one run.
 */

/** Row sums i0..i1-1 of the pair sum of two paths (row i: segment i of A with every segment of B). */
export function mutualRows(A: Segments, B: Segments, maxDepth: number, i0: number, i1: number): Float64Array {
  const rows = new Float64Array(i1 - i0);
  for (let i = i0; i < i1; i++) {
    let sum = 0;
    for (let j = 0; j < B.n; j++) sum += pairMutual(A, i, B, j, maxDepth);
    rows[i - i0] = sum;
  }
  return rows;
}

/** Row sums i0..i1-1 of a path's own pair sum (row i: segment i with the segments after it). */
export function selfRows(S: Segments, maxDepth: number, i0: number, i1: number): Float64Array {
  const rows = new Float64Array(i1 - i0);
  for (let i = i0; i < i1; i++) {
    let sum = 0;
    for (let j = i + 1; j < S.n; j++) sum += pairMutual(S, i, S, j, maxDepth);
    rows[i - i0] = sum;
  }
  return rows;
}

/** The sum of row sums, in order. */
export function sumRows(rows: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < rows.length; i++) sum += rows[i]!;
  return sum;
}
