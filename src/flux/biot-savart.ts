import { MU0 } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";

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
 * A point on a segment (or its end) gets no contribution from that segment: the field of
 * a filament is singular there. Each segment's end is reused as the next start, so one
 * square root per segment and point; no allocation per point.
 *
 * Errors: FormulaError "invalid_argument" for arrays of the wrong type or length,
 * non-finite coordinates or a non-finite current.
 *
 * @example
 * // square loop of side 2 m, 1 A; field at its centre ≈ 5.66e-7 T along +z
 * biotSavart(new Float64Array([1,1,0, -1,1,0, -1,-1,0, 1,-1,0, 1,1,0]), 1, new Float64Array([0,0,0]));
 */
export function biotSavart(path: Float64Array, current: number, points: Float64Array, out?: Float64Array): Float64Array {
  checkCoordinates("path", path, 2);
  checkCoordinates("points", points, 0);
  if (typeof current !== "number" || current - current !== 0) throw bad("current", "must be a finite number (A)", current);
  const np = points.length / 3;
  const result = out ?? new Float64Array(points.length);
  if (result.length < points.length) throw bad("out", "output array is shorter than points", result.length);
  const nv = path.length / 3;
  const k = (MU0 * current) / (4 * Math.PI);
  for (let p = 0; p < np; p++) {
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
      let f = 0;
      if (ab < 0) {
        if (c2 > 0) f = (s * (rr - ab)) / (rr * c2); // 2 s (rr - ab) / (rr * 2 c2)
      } else if (rr > 0) {
        f = s / (rr * (rr + ab));
      }
      bx += f * cx;
      by += f * cy;
      bz += f * cz;
      ax = qx;
      ay = qy;
      az = qz;
      ra = rb;
    }
    if ((bx - bx) + (by - by) + (bz - bz) !== 0) {
      throw new FormulaError("out_of_range", { formula: "biotSavart", detail: `field at point ${p} is not representable` });
    }
    result[3 * p] = k * bx;
    result[3 * p + 1] = k * by;
    result[3 * p + 2] = k * bz;
  }
  return result;
}
