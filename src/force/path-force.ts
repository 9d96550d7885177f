/**
 * Force on one current path from another (thin wires, any shapes): the
 * Biot-Savart force density integrated along path 2,
 *   F = I2 int_2 dl2 x B1,   B1 from path 1 by the Biot-Savart law,
 * paths as xyz polylines in m (the same format as mutualInductance: current
 * from the first point to the last; repeat the first point to close a loop).
 *
 * Method. B1 is exact per straight segment of path 1 (src/flux/biot-savart.ts).
 * Each segment of path 2 is cut into panels, and each panel integrated with a
 * 16-point Gauss-Legendre rule once it is no longer than half its distance to
 * path 1 (B1 is then analytic over a Bernstein ellipse wide enough for the rule
 * to reach about 1e-13 relative); closer panels are halved. A panel that still
 * touches path 1 after 50 halvings (2^-50 of its segment) means the paths touch:
 * FormulaError out_of_range.
 *
 * Loops: the panels of one segment of path 2 are visited breadth-first; the
 * total number of panels is capped by MAX_PANELS (an invalid_argument error
 * beyond it), and the depth by 50 halvings, so every loop is bounded. The
 * field evaluations (16 per panel on every segment of path 1) are capped at
 * MAX_SEGMENT_POINT_PAIRS, checked before any work against the least the job
 * can need (one panel per segment of path 2) and again as panels are made.
 *
 * Validity: filaments (wire radius small against the distance between the
 * paths); magnetostatics. Newton's third law holds for closed paths.
 *
 * Reference: the Biot-Savart force law, e.g. J. D. Jackson, Classical
 * Electrodynamics, 3rd ed. (1999), section 5.2, F = I2 oint dl2 x B1 (section from memory).
 */
import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import { fieldRange, MAX_SEGMENT_POINT_PAIRS } from "../flux/biot-savart.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";

const TOOL = "pathForce";
const ORDER = 16;
/** A panel is integrated once its length is at most this fraction of its distance to path 1. */
const RATIO = 0.5;
const MAX_DEPTH = 50;
/** Most panels one call integrates (each costs ORDER field points on every segment of path 1). */
export const MAX_PANELS = 200_000;

function bad(input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError("invalid_argument", { formula: TOOL, input, value, detail });
}

function tooManyPairs(): FormulaError {
  return bad("path2", `the panels of path 2 times the segments of path 1 exceed ${MAX_SEGMENT_POINT_PAIRS} field evaluations; use fewer segments on path 1 or split the job`);
}

function toPath(p: unknown, name: string): Float64Array {
  const a = p instanceof Float64Array ? p : Array.isArray(p) ? Float64Array.from(p as number[]) : undefined;
  if (!a) throw bad(name, "expected xyz triples (m) as a Float64Array or an array of numbers");
  if (a.length % 3 !== 0 || a.length < 6) throw bad(name, "length must be a multiple of 3 with at least 2 points", a.length);
  for (let i = 0; i < a.length; i++) if (a[i]! - a[i]! !== 0) throw bad(name, `coordinate ${i} is not finite`, a[i]);
  return a;
}

/** Distance from point q to the segment a-b (a, b, q as offsets into arrays). */
function pointSegmentDistance(qx: number, qy: number, qz: number, p: Float64Array, i: number): number {
  const ax = p[i]!, ay = p[i + 1]!, az = p[i + 2]!;
  const dx = p[i + 3]! - ax, dy = p[i + 4]! - ay, dz = p[i + 5]! - az;
  const wx = qx - ax, wy = qy - ay, wz = qz - az;
  const dd = dx * dx + dy * dy + dz * dz;
  const t = dd === 0 ? 0 : Math.min(1, Math.max(0, (wx * dx + wy * dy + wz * dz) / dd));
  return Math.hypot(wx - t * dx, wy - t * dy, wz - t * dz);
}

/** Least distance from point q to path 1. */
function distanceToPath(qx: number, qy: number, qz: number, p: Float64Array): number {
  let best = Infinity;
  for (let i = 0; i + 5 < p.length; i += 3) best = Math.min(best, pointSegmentDistance(qx, qy, qz, p, i));
  return best;
}

/**
 * Force on path 2 (current2, A) from path 1 (current1, A), as [Fx, Fy, Fz] in N.
 *
 * Long calls: `options.signal` cancels the call (FormulaError "cancelled", checked
 * between blocks of panels and of field points) and `options.onProgress` reports the
 * segments of path 2 done (core/progress.ts); the result is the same with or without them.
 *
 * @example
 * // two parallel 1 m wires 1 cm apart, 1 A each, same direction: attraction along -y on path 2
 * pathForce([0,0,0, 1,0,0], 1, [0,0.01,0, 1,0.01,0], 1); // ≈ [0, -1.98e-5, 0] N
 */
export function pathForce(
  path1: Float64Array | readonly number[],
  current1: number,
  path2: Float64Array | readonly number[],
  current2: number,
  options?: LongRunOptions,
): [number, number, number] {
  const p1 = toPath(path1, "path1");
  const p2 = toPath(path2, "path2");
  for (const [name, v] of [["current1", current1], ["current2", current2]] as const) {
    if (typeof v !== "number" || v - v !== 0) throw bad(name, "must be a finite number (A)", v);
  }
  const segments2 = p2.length / 3 - 1;
  const segments1 = p1.length / 3 - 1;
  // Every segment of path 2 with a length gives at least one panel: a job certainly
  // above the field-evaluation cap fails here, before any work, not part-way.
  let carrying = 0;
  for (let o = 0; o + 5 < p2.length; o += 3) if (p2[o] !== p2[o + 3] || p2[o + 1] !== p2[o + 4] || p2[o + 2] !== p2[o + 5]) carrying++;
  if (carrying * ORDER * segments1 > MAX_SEGMENT_POINT_PAIRS) throw tooManyPairs();
  const progress = ticker(TOOL, options, segments2);
  const { nodes, weights } = gaussLegendre(ORDER);
  // Panels visited between two cancellation checks: each visit measures its distance to every segment of path 1.
  const visitsPerCheck = Math.max(1, Math.floor(CHECK_WORK / segments1));
  // Field points per fieldRange call (a cancellation check between calls).
  const pointsPerCheck = Math.max(1, Math.floor(CHECK_WORK / segments1));
  // One segment of path 2 at a time: its accepted panels (start point, unit direction,
  // half-length), then their Gauss nodes' field in blocks. The panels are summed in the
  // order they are accepted, whatever the blocks, so the result does not depend on them.
  let starts: number[] = [];
  let halves: number[] = [];
  let visited = 0;
  let untilCheck = visitsPerCheck;
  let pairs = 0;
  let points = new Float64Array(0);
  let field = new Float64Array(0);
  let fx = 0, fy = 0, fz = 0;
  for (let s = 0; s < segments2; s++) {
    progress.tick(s);
    const o2 = 3 * s;
    const ax = p2[o2]!, ay = p2[o2 + 1]!, az = p2[o2 + 2]!;
    const dx = p2[o2 + 3]! - ax, dy = p2[o2 + 4]! - ay, dz = p2[o2 + 5]! - az;
    const len = Math.hypot(dx, dy, dz);
    if (len === 0) continue; // a repeated point carries no current element
    const ux = dx / len, uy = dy / len, uz = dz / len;
    starts = [];
    halves = [];
    // Breadth-first halving: pieces as [t0, h] along the segment.
    let pieces: number[] = [0, len];
    let depth = 0;
    for (; depth <= MAX_DEPTH && pieces.length > 0; depth++) {
      const next: number[] = [];
      for (let k = 0; k < pieces.length; k += 2) {
        visited++;
        if (visited > MAX_PANELS) throw bad("path2", `more than ${MAX_PANELS} panels: the paths run too close for too long; split the job`);
        if (--untilCheck === 0) {
          untilCheck = visitsPerCheck;
          progress.check();
        }
        const t0 = pieces[k]!, h = pieces[k + 1]!;
        const mid = t0 + h / 2;
        const dist = distanceToPath(ax + ux * mid, ay + uy * mid, az + uz * mid, p1) - h / 2;
        if (h <= RATIO * dist) {
          starts.push(ax + ux * t0, ay + uy * t0, az + uz * t0);
          halves.push(h / 2);
        } else {
          if (depth === MAX_DEPTH) throw new FormulaError("out_of_range", { formula: TOOL, detail: "path 2 touches or crosses path 1, where the filament force is infinite" });
          next.push(t0, h / 2, t0 + h / 2, h / 2);
        }
      }
      pieces = next;
    }
    countLoop(depth);
    const n = halves.length;
    const np = n * ORDER;
    pairs += np * segments1;
    if (pairs > MAX_SEGMENT_POINT_PAIRS) {
      throw tooManyPairs();
    }
    if (points.length < 3 * np) {
      points = new Float64Array(3 * np);
      field = new Float64Array(3 * np);
    }
    for (let i = 0; i < n; i++) {
      const h = halves[i]!;
      for (let k = 0; k < ORDER; k++) {
        const t = h * (1 + nodes[k]!);
        const o = 3 * (i * ORDER + k);
        points[o] = starts[3 * i]! + ux * t;
        points[o + 1] = starts[3 * i + 1]! + uy * t;
        points[o + 2] = starts[3 * i + 2]! + uz * t;
      }
    }
    for (let q0 = 0; q0 < np; q0 += pointsPerCheck) {
      if (q0 > 0) progress.check();
      fieldRange(p1, current1, points, field, 0, q0, Math.min(np, q0 + pointsPerCheck));
    }
    for (let i = 0; i < n; i++) {
      let sx = 0, sy = 0, sz = 0;
      for (let k = 0; k < ORDER; k++) {
        const o = 3 * (i * ORDER + k);
        const w = weights[k]!;
        sx += w * (uy * field[o + 2]! - uz * field[o + 1]!);
        sy += w * (uz * field[o]! - ux * field[o + 2]!);
        sz += w * (ux * field[o + 1]! - uy * field[o]!);
      }
      const h = halves[i]!;
      fx += sx * h;
      fy += sy * h;
      fz += sz * h;
    }
  }
  const out: [number, number, number] = [current2 * fx, current2 * fy, current2 * fz];
  if (out.some((v) => v - v !== 0)) throw new FormulaError("out_of_range", { formula: TOOL, detail: "the force is beyond the double range" });
  progress.finish();
  return out;
}

/** Distance-to-path or field evaluations (panel or point times segments of path 1) between two cancellation checks: about 1 ms. */
const CHECK_WORK = 1 << 17;
