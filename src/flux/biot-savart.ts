import { MU0 } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker, watched } from "../core/progress.js";
import type { Note } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";

/** Most path vertices biotSavart accepts. */
export const MAX_PATH_VERTICES = 1_000_000;
/** Most field points biotSavart accepts in one call. */
export const MAX_FIELD_POINTS = 10_000_000;
/**
 * Most segment-point pairs in one call (points times segments): about 5-10 s of
 * work at a few ns per pair. Split larger jobs into several calls.
 */
export const MAX_SEGMENT_POINT_PAIRS = 1e9;

/** The field at the points (x, y, z triples, T), with notes on where the thin-filament model ends. */
export type BiotSavartField = Float64Array & { readonly warnings: readonly Note[] };

export interface BiotSavartOptions {
  /**
   * Radius of the conductor, m. A field point closer than this to a segment lies
   * inside the wire, where the filament's field (which grows as 1/distance) is
   * wrong: the real field falls to zero at the wire's axis. Such points are
   * reported in the `inside_conductor` warning. Default 0 (no check).
   */
  readonly wireRadius?: number;
}

function bad(input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError("invalid_argument", { formula: "biotSavart", input, value, detail });
}

function checkCoordinates(name: string, a: unknown, minPoints: number): asserts a is Float64Array {
  if (!(a instanceof Float64Array)) throw bad(name, "expected a Float64Array of x, y, z triples (m)");
  if (a.length % 3 !== 0 || a.length < 3 * minPoints) {
    throw bad(name, `length must be a multiple of 3 with at least ${minPoints} point(s)`, a.length);
  }
  for (let i = 0; i < a.length; i++) if (a[i]! - a[i]! !== 0) throw bad(name, `coordinate ${i} is not finite`, a[i]);
}

/**
 * Flux density of a polyline conductor at many points (Biot-Savart law, exact per straight segment).
 *
 * `path` holds the conductor's vertices as x, y, z triples in m; consecutive vertices are
 * joined by straight segments (repeat the first vertex at the end to close a loop).
 * `current` (A) flows from the first vertex to the last. `points` holds the field
 * points as x, y, z triples in m. Returns B (T) as x, y, z triples, one per point.
 *
 * For a segment from A to B and a field point P, with a = P - A, b = P - B,
 * L = B - A, c = L x a, R_a = |a|, R_b = |b|, s = R_a + R_b, the segment's field is
 *   dB = mu0 I / (4 pi) * c * 2 s / (R_a R_b ((s)^2 - |L|^2))
 * (the closed form of the Biot-Savart integral over a straight filament, e.g.
 * J. D. Hanson and S. P. Hirshman, Phys. Plasmas 9 (2002) 4410; from memory). Close to the
 * segment s^2 - L^2 = 2 (R_a R_b + a.b) cancels; there it is computed as
 * 2 |c|^2 / (R_a R_b - a.b) (Lagrange's identity), which does not.
 *
 * Each segment's end is reused as the next start, so one square root per segment and
 * point; no allocation per point.
 *
 * Validity: a thin filament. A point on a segment (or at a vertex), or closer to it than
 * 2^-44 of its length (the rounding of the coordinates), is refused: the field of a filament
 * is unbounded there. With `options.wireRadius`, points closer than that to a
 * segment are inside the real conductor and get the warning `inside_conductor` (the
 * result there overstates the field; inside a round wire it falls linearly to zero at the
 * axis). The result carries `warnings` (a property of the returned array; `[]` when none).
 *
 * Limits (each loop is bounded by them): at most MAX_PATH_VERTICES vertices,
 * MAX_FIELD_POINTS points and MAX_SEGMENT_POINT_PAIRS segment-point pairs per call.
 *
 * Errors: FormulaError "invalid_argument" for arrays of the wrong type or length, sizes
 * above the limits, non-finite coordinates, a non-finite current or a bad wireRadius;
 * "out_of_range" for a point on the filament or a field that is not representable.
 *
 * Long calls: `options.signal` cancels the call (FormulaError "cancelled"; `out` then holds
 * a part of the field) and `options.onProgress` reports field points done (core/progress.ts).
 *
 * @example
 * // square loop of side 2 m, 1 A; field at its centre ≈ 5.66e-7 T along +z
 * biotSavart(new Float64Array([1,1,0, -1,1,0, -1,-1,0, 1,-1,0, 1,1,0]), 1, new Float64Array([0,0,0]));
 */
export function biotSavart(
  path: Float64Array,
  current: number,
  points: Float64Array,
  out?: Float64Array,
  options?: BiotSavartOptions & LongRunOptions,
): BiotSavartField {
  const wireRadius = checkFieldInputs(path, current, points, options);
  const np = points.length / 3;
  if (out !== undefined && out.length < points.length) throw bad("out", "output array is shorter than points", out.length);
  // Without signal and onProgress there is no ticker: biotSavart is also called for one point
  // at a time (inside field functions), where making one cost 1.7x on a 4-segment call.
  const t = watched(options) ? ticker("biotSavart", options, np) : undefined;
  const result = (out ?? new Float64Array(points.length)) as Float64Array & { warnings: readonly Note[] };
  // Blocks of points of about PAIRS_PER_TICK segment-point pairs; each point's field
  // depends on that point alone, so the blocks give the values of one pass.
  const step = Math.max(1, Math.floor(PAIRS_PER_TICK / (path.length / 3 - 1)));
  // The accumulation of pool-tasks.ts' fieldPieces, written out: this call also serves one
  // point at a time inside field functions, where a closure object per call would cost.
  let inside = 0;
  let first = -1;
  for (let p0 = 0; p0 < np; p0 += step) {
    t?.tick(p0);
    const found = fieldRange(path, current, points, result, wireRadius, p0, Math.min(np, p0 + step));
    if (first < 0) first = found.first;
    inside += found.inside;
  }
  // The block loop runs at most np times; fieldRange reports the points and segments it visits.
  result.warnings = fieldWarnings({ inside, first }, np, wireRadius);
  t?.finish();
  return result;
}

/**
 * Segment-point pairs between two progress ticks (whole points, at least one):
 * about 1-3 ms at the measured 5-11 ns a pair (bench/biot-savart.ts). Progress
 * counts field points.
 */
const PAIRS_PER_TICK = 1 << 18;

/** Checks biotSavart's inputs and limits (all but `out`); returns the wire radius. */
export function checkFieldInputs(path: unknown, current: unknown, points: unknown, options: BiotSavartOptions | undefined): number {
  checkCoordinates("path", path, 2);
  checkCoordinates("points", points, 0);
  if (typeof current !== "number" || current - current !== 0) throw bad("current", "must be a finite number (A)", current);
  const np = points.length / 3;
  const nv = path.length / 3;
  if (nv > MAX_PATH_VERTICES) throw bad("path", `at most ${MAX_PATH_VERTICES} vertices per call`, nv);
  if (np > MAX_FIELD_POINTS) throw bad("points", `at most ${MAX_FIELD_POINTS} points per call; split the points into several calls`, np);
  if (np * (nv - 1) > MAX_SEGMENT_POINT_PAIRS) {
    throw bad("points", `${np} points times ${nv - 1} segments exceeds ${MAX_SEGMENT_POINT_PAIRS} pairs per call; split the points into several calls`, np);
  }
  const wireRadius = options?.wireRadius ?? 0;
  if (typeof wireRadius !== "number" || !(wireRadius >= 0) || wireRadius === Infinity) {
    throw bad("wireRadius", "must be a finite radius >= 0 (m)", wireRadius);
  }
  return wireRadius;
}

/** Points inside the conductor found over a range of field points: how many, and the first (-1: none). */
export interface InsideCount {
  readonly inside: number;
  readonly first: number;
}

/** The `inside_conductor` warning from the count over all np points. */
export function fieldWarnings(found: InsideCount, np: number, wireRadius: number): Note[] {
  return found.inside === 0
    ? []
    : [
        {
          code: "inside_conductor",
          message: `${found.inside} of ${np} field points (the first is point ${found.first}) lie closer to a segment than the wire radius ${wireRadius} m: inside the conductor the thin-filament field is wrong (the real field falls linearly to zero at the wire's axis)`,
        },
      ];
}

/**
 * The field at points p0..p1-1 (checked inputs) into `result` at the same
 * indices. Each point's field depends on that point alone, so any split of the
 * points into ranges gives the values of one run; errors name the point by its
 * index in the whole array.
 */
export function fieldRange(path: Float64Array, current: number, points: Float64Array, result: Float64Array, wireRadius: number, p0: number, p1: number): InsideCount {
  const nv = path.length / 3;
  let inside = 0; // points inside the conductor
  let firstInside = -1;
  const k = (MU0 * current) / (4 * Math.PI);
  for (let p = p0; p < p1; p++) {
    const px = points[3 * p]!;
    const py = points[3 * p + 1]!;
    const pz = points[3 * p + 2]!;
    let ax = px - path[0]!;
    let ay = py - path[1]!;
    let az = pz - path[2]!;
    let ra = Math.sqrt(ax * ax + ay * ay + az * az);
    let bx = 0;
    let by = 0;
    let bz = 0;
    let near = false;
    for (let v = 1; v < nv; v++) {
      const qx = px - path[3 * v]!;
      const qy = py - path[3 * v + 1]!;
      const qz = pz - path[3 * v + 2]!;
      const rb = Math.sqrt(qx * qx + qy * qy + qz * qz);
      // L = B - A = (P - A) - (P - B) = a - b; c = L x a (= a x b) points along dl x r.
      const lx = ax - qx;
      const ly = ay - qy;
      const lz = az - qz;
      const cx = ly * az - lz * ay;
      const cy = lz * ax - lx * az;
      const cz = lx * ay - ly * ax;
      const c2 = cx * cx + cy * cy + cz * cz;
      const rr = ra * rb;
      const ab = ax * qx + ay * qy + az * qz;
      const s = ra + rb;
      // factor = 2 s / (rr (s^2 - L^2)), with s^2 - L^2 = 2 (rr + a.b).
      // A point within ON_FILAMENT |L| of the segment is on the filament as far as its
      // coordinates can tell (rounding puts a point "on" a slanted segment about an ulp off it).
      const l2 = lx * lx + ly * ly + lz * lz;
      let f = 0;
      if (ab < 0) {
        // a and b point apart: P projects inside the segment, at distance |c| / |L| from it.
        if (c2 <= ON_FILAMENT * ON_FILAMENT * l2 * l2) throw onFilament(p, v);
        f = (s * (rr - ab)) / (rr * c2); // 2 s (rr - ab) / (rr * 2 c2)
      } else {
        // Beyond an end (on the line's extension c = 0: no field), nearest to a vertex.
        const r = Math.min(ra, rb);
        if (r * r <= ON_FILAMENT * ON_FILAMENT * l2) throw onFilament(p, v);
        f = s / (rr * (rr + ab));
      }
      if (wireRadius > 0 && !near) {
        // Distance from P to the segment: |c| / |L| inside it (ab < 0), else the nearer end.
        const dist = ab < 0 ? Math.sqrt(c2) / Math.sqrt(lx * lx + ly * ly + lz * lz) : Math.min(ra, rb);
        near = dist < wireRadius;
      }
      bx += f * cx;
      by += f * cy;
      bz += f * cz;
      ax = qx;
      ay = qy;
      az = qz;
      ra = rb;
    }
    if (near) {
      if (inside === 0) firstInside = p;
      inside++;
    }
    if ((bx - bx) + (by - by) + (bz - bz) !== 0) {
      throw new FormulaError("out_of_range", { formula: "biotSavart", detail: `field at point ${p} is not representable` });
    }
    result[3 * p] = k * bx;
    result[3 * p + 1] = k * by;
    result[3 * p + 2] = k * bz;
  }
  countLoop((p1 - p0) * (nv - 1));
  return { inside, first: firstInside };
}

/**
 * Distance from a segment, as a fraction of its length, below which a field point counts
 * as on the filament: 2^-44, about 256 ulp. There the field (over 1e6 T for 1 A and a 1 m
 * segment) is set by the rounding of the coordinates, not by the geometry.
 */
const ON_FILAMENT = 2 ** -44;

function onFilament(p: number, v: number): FormulaError {
  return new FormulaError("out_of_range", {
    formula: "biotSavart",
    input: "points",
    detail: `field point ${p} lies on the current filament (segment ${v - 1}, to within 2^-44 of its length), where the field of a thin filament is unbounded; keep field points outside the conductor (see the wireRadius option)`,
  });
}
