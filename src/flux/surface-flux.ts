import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import { countLoop } from "../math/loop-count.js";

/**
 * Most triangles a mesh may have: bounds the checks' and the quadrature's loops
 * (7 field calls per triangle). boxMesh's largest (1000 divisions) has 12 million,
 * sphereMesh's (8 subdivisions) 1.3 million.
 */
export const MAX_TRIANGLES = 20_000_000;
/** Most vertices of a mesh (2^26: edge keys i * nv + j stay exact doubles). */
export const MAX_VERTICES = 2 ** 26;

/** A triangulated surface: vertex coordinates (x, y, z triples, m) and triangles (three vertex indices each). */
export interface TriangleMesh {
  readonly vertices: Float64Array;
  readonly triangles: Uint32Array;
}

/**
 * A vector field sampled at a point. Either return the three components, or write
 * them into `out` (a reused 3-element buffer) and return nothing.
 */
export type VectorField = (x: number, y: number, z: number, out: Float64Array) => ArrayLike<number> | void;

/** Outward flux through a closed surface, with the sum of magnitudes to judge a near-zero result by. */
export interface SurfaceFlux {
  /** Outward flux of the field (field units times m^2: Wb for B in T, V m for E in V/m). */
  readonly flux: number;
  /** Sum over triangles of |flux through the triangle|: the scale of the cancellation in `flux`. */
  readonly absoluteFlux: number;
}

function bad(formula: string, input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError("invalid_argument", { formula, input, value, detail });
}

// Dunavant's 7-point rule, exact for polynomials of degree 5 on a triangle (the rule
// of Radon, 1948): D. A. Dunavant, "High degree efficient symmetrical Gaussian
// quadrature rules for the triangle", Int. J. Numer. Meth. Eng. 21 (1985) 1129-1148,
// table for p = 5. Barycentric points and weights (weights sum to 1), in closed form.
const S15 = Math.sqrt(15);
const B1 = (6 - S15) / 21;
const B2 = (6 + S15) / 21;
const W1 = (155 - S15) / 1200;
const W2 = (155 + S15) / 1200;
/** [l0, l1, l2, w] per point. */
export const DUNAVANT_5: readonly (readonly [number, number, number, number])[] = [
  [1 / 3, 1 / 3, 1 / 3, 9 / 40],
  [1 - 2 * B1, B1, B1, W1],
  [B1, 1 - 2 * B1, B1, W1],
  [B1, B1, 1 - 2 * B1, W1],
  [1 - 2 * B2, B2, B2, W2],
  [B2, 1 - 2 * B2, B2, W2],
  [B2, B2, 1 - 2 * B2, W2],
];

/**
 * Checks that a mesh is a closed, consistently oriented surface: every edge is shared
 * by exactly two triangles, which traverse it in opposite directions. Returns the
 * signed enclosed volume (positive when the triangles' normals point outward).
 * Throws FormulaError "invalid_argument" otherwise.
 */
export function checkClosedSurface(mesh: TriangleMesh, formula = "closedSurfaceFlux"): number {
  const { vertices, triangles } = mesh ?? ({} as TriangleMesh);
  if (!(vertices instanceof Float64Array) || vertices.length % 3 !== 0 || vertices.length < 12) {
    throw bad(formula, "surface.vertices", "expected a Float64Array of x, y, z triples, at least 4 vertices");
  }
  if (!(triangles instanceof Uint32Array) || triangles.length % 3 !== 0 || triangles.length < 12) {
    throw bad(formula, "surface.triangles", "expected a Uint32Array of vertex-index triples, at least 4 triangles");
  }
  if (triangles.length / 3 > MAX_TRIANGLES) {
    throw bad(formula, "surface.triangles", `at most ${MAX_TRIANGLES} triangles`, triangles.length / 3);
  }
  const nv = vertices.length / 3;
  if (nv > MAX_VERTICES) throw bad(formula, "surface.vertices", `at most ${MAX_VERTICES} vertices`, nv);
  for (let i = 0; i < vertices.length; i++) {
    if (vertices[i]! - vertices[i]! !== 0) throw bad(formula, "surface.vertices", `coordinate ${i} is not finite`, vertices[i]);
  }
  // Directed edges: each must occur once, and its reverse once. Keys i * nv + j
  // (exact: nv <= MAX_VERTICES = 2^26, so keys stay below 2^52) in a sorted typed
  // array, not a Set: a Set holds at most 2^24 entries, fewer than the edges of
  // a mesh at MAX_TRIANGLES, and a typed array costs 8 bytes an edge.
  const nt = triangles.length / 3;
  const keys = new Float64Array(3 * nt);
  for (let t = 0; t < nt; t++) {
    for (let e = 0; e < 3; e++) {
      const i = triangles[3 * t + e]!;
      const j = triangles[3 * t + ((e + 1) % 3)]!;
      if (i >= nv || j >= nv) throw bad(formula, "surface.triangles", `triangle ${t} refers to vertex ${Math.max(i, j)} of ${nv}`);
      if (i === j) throw bad(formula, "surface.triangles", `triangle ${t} repeats vertex ${i}`);
      keys[3 * t + e] = i * nv + j;
    }
  }
  keys.sort();
  for (let k = 1; k < keys.length; k++) {
    if (keys[k] === keys[k - 1]) {
      const i = Math.floor(keys[k]! / nv);
      throw bad(formula, "surface.triangles", `edge ${i}-${keys[k]! - i * nv} is traversed twice in the same direction: triangles are not consistently oriented, or more than two triangles share the edge`);
    }
  }
  for (let k = 0; k < keys.length; k++) {
    const i = Math.floor(keys[k]! / nv);
    const j = keys[k]! - i * nv;
    if (!sortedHas(keys, j * nv + i)) throw bad(formula, "surface.triangles", `edge ${i}-${j} belongs to one triangle only: the surface is not closed`);
  }
  // Signed volume (divergence theorem with F = r / 3), relative to the first vertex to limit rounding.
  const ox = vertices[0]!;
  const oy = vertices[1]!;
  const oz = vertices[2]!;
  let vol = 0;
  for (let t = 0; t < nt; t++) {
    const a = 3 * triangles[3 * t]!;
    const b = 3 * triangles[3 * t + 1]!;
    const c = 3 * triangles[3 * t + 2]!;
    const ax = vertices[a]! - ox, ay = vertices[a + 1]! - oy, az = vertices[a + 2]! - oz;
    const bx = vertices[b]! - ox, by = vertices[b + 1]! - oy, bz = vertices[b + 2]! - oz;
    const cx = vertices[c]! - ox, cy = vertices[c + 1]! - oy, cz = vertices[c + 2]! - oz;
    vol += ax * (by * cz - bz * cy) + ay * (bz * cx - bx * cz) + az * (bx * cy - by * cx);
  }
  vol /= 6;
  if (!(vol !== 0)) throw bad(formula, "surface", "the surface encloses no volume");
  return vol;
}

/** Whether the ascending array `a` holds `x` (binary search: at most 32 steps for 2^32 entries). */
function sortedHas(a: Float64Array, x: number): boolean {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid]! < x) lo = mid + 1;
    else hi = mid;
  }
  return lo < a.length && a[lo] === x;
}

/**
 * Outward flux of a vector field through a closed triangulated surface.
 *
 * Phi = sum over triangles of integral (F . n) dA, each integral by Dunavant's 7-point
 * degree-5 rule on the flat triangle. The mesh must be closed and consistently oriented
 * (checked; FormulaError "invalid_argument" otherwise); the result is the outward flux
 * whichever way the triangles turn. By Gauss's law the electric flux equals the enclosed
 * charge over eps0, and the magnetic flux is zero.
 *
 * Accuracy: the quadrature error per triangle falls as (h / d)^6, h the triangle size and
 * d the distance to the nearest source; refine the mesh near sources.
 *
 * Long calls: `options.signal` cancels the integration (FormulaError "cancelled", checked
 * every TRIANGLES_PER_TICK triangles; the mesh check before it runs to its end) and
 * `options.onProgress` reports triangles done (core/progress.ts).
 *
 * Reference: D. A. Dunavant, Int. J. Numer. Meth. Eng. 21 (1985) 1129-1148 (the rule);
 * D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017), sec. 2.2.1 (Gauss's law).
 *
 * @example
 * const q = 1e-9; // a point charge at the origin, inside a unit sphere
 * closedSurfaceFlux(sphereMesh([0, 0, 0], 1, 3), (x, y, z) => {
 *   const r3 = Math.hypot(x, y, z) ** 3, k = q / (4 * Math.PI * 8.8541878188e-12);
 *   return [k * x / r3, k * y / r3, k * z / r3];
 * }).flux; // ≈ 112.9 V m (= q / eps0)
 */
export function closedSurfaceFlux(surface: TriangleMesh, field: VectorField, options?: LongRunOptions): SurfaceFlux {
  const vol = checkClosedSurface(surface);
  if (typeof field !== "function") throw bad("closedSurfaceFlux", "field", "expected a function (x, y, z, out) => [Fx, Fy, Fz]");
  const { vertices, triangles } = surface;
  const orientation = vol > 0 ? 1 : -1;
  const out = new Float64Array(3);
  const nt = triangles.length / 3;
  const progress = ticker("closedSurfaceFlux", options, nt);
  let flux = 0;
  let absolute = 0;
  for (let t = 0; t < nt; t++) {
    if (t % TRIANGLES_PER_TICK === 0) progress.tick(t);
    const a = 3 * triangles[3 * t]!;
    const b = 3 * triangles[3 * t + 1]!;
    const c = 3 * triangles[3 * t + 2]!;
    const x0 = vertices[a]!, y0 = vertices[a + 1]!, z0 = vertices[a + 2]!;
    const x1 = vertices[b]!, y1 = vertices[b + 1]!, z1 = vertices[b + 2]!;
    const x2 = vertices[c]!, y2 = vertices[c + 1]!, z2 = vertices[c + 2]!;
    const ux = x1 - x0, uy = y1 - y0, uz = z1 - z0;
    const vx = x2 - x0, vy = y2 - y0, vz = z2 - z0;
    // n = u x v has length 2 * area; the weights sum to 1, so flux = (1/2) sum w F . n.
    const nx = uy * vz - uz * vy;
    const ny = uz * vx - ux * vz;
    const nz = ux * vy - uy * vx;
    let sum = 0;
    for (const [l0, l1, l2, w] of DUNAVANT_5) {
      const px = l0 * x0 + l1 * x1 + l2 * x2;
      const py = l0 * y0 + l1 * y1 + l2 * y2;
      const pz = l0 * z0 + l1 * z1 + l2 * z2;
      const r = field(px, py, pz, out);
      const f = r === undefined || r === null ? out : r;
      sum += w * (f[0]! * nx + f[1]! * ny + f[2]! * nz);
    }
    const triangleFlux = 0.5 * sum;
    flux += triangleFlux;
    absolute += Math.abs(triangleFlux);
  }
  countLoop(nt); // one pass of 7 points per triangle, nt <= MAX_TRIANGLES
  if (flux - flux !== 0 || absolute - absolute !== 0) {
    throw new FormulaError("out_of_range", { formula: "closedSurfaceFlux", detail: "the field returned non-finite values on the surface" });
  }
  progress.finish();
  return { flux: orientation * flux, absoluteFlux: absolute };
}

/**
 * Triangles between two progress ticks: 896 calls of the field, which is the caller's
 * function of unknown cost (20 us for one of 20 ns, more for a field summed over sources).
 */
const TRIANGLES_PER_TICK = 128;

// Regular icosahedron: vertices (0, +-1, +-phi) cyclically; faces oriented outward below.
const PHI = (1 + Math.sqrt(5)) / 2;
const ICO_VERTICES = [
  [-1, PHI, 0], [1, PHI, 0], [-1, -PHI, 0], [1, -PHI, 0],
  [0, -1, PHI], [0, 1, PHI], [0, -1, -PHI], [0, 1, -PHI],
  [PHI, 0, -1], [PHI, 0, 1], [-PHI, 0, -1], [-PHI, 0, 1],
] as const;
const ICO_FACES = [
  [0, 11, 5], [0, 5, 1], [0, 1, 7], [0, 7, 10], [0, 10, 11],
  [1, 5, 9], [5, 11, 4], [11, 10, 2], [10, 7, 6], [7, 1, 8],
  [3, 9, 4], [3, 4, 2], [3, 2, 6], [3, 6, 8], [3, 8, 9],
  [4, 9, 5], [2, 4, 11], [6, 2, 10], [8, 6, 7], [9, 8, 1],
] as const;

function checkVector(formula: string, name: string, v: unknown): asserts v is readonly [number, number, number] {
  if (!Array.isArray(v) && !(v instanceof Float64Array)) throw bad(formula, name, "expected [x, y, z] in m");
  const a = v as ArrayLike<unknown>;
  if (a.length !== 3 || ![0, 1, 2].every((i) => typeof a[i] === "number" && (a[i] as number) - (a[i] as number) === 0)) {
    throw bad(formula, name, "expected three finite numbers [x, y, z] in m");
  }
}

/**
 * An icosphere: a closed, outward-oriented triangulation of a sphere.
 *
 * Starts from a regular icosahedron and splits each triangle into four `subdivisions`
 * times, pushing new vertices onto the sphere: 20 * 4^subdivisions triangles
 * (subdivisions 0 to 8). Vertices lie on the sphere; the flat triangles enclose
 * slightly less volume than the sphere.
 *
 * @example
 * sphereMesh([0, 0, 0], 1, 2).triangles.length / 3; // 320
 */
export function sphereMesh(center: readonly [number, number, number], radius: number, subdivisions: number): TriangleMesh {
  checkVector("sphereMesh", "center", center);
  if (typeof radius !== "number" || !(radius > 0) || radius === Infinity) throw bad("sphereMesh", "radius", "must be finite and > 0", radius);
  if (!Number.isInteger(subdivisions) || subdivisions < 0 || subdivisions > 8) {
    throw bad("sphereMesh", "subdivisions", "must be a whole number from 0 to 8", subdivisions);
  }
  const pts: number[][] = ICO_VERTICES.map((v) => {
    const n = Math.hypot(v[0], v[1], v[2]);
    return [v[0] / n, v[1] / n, v[2] / n];
  });
  let faces: number[][] = ICO_FACES.map((f) => [...f]);
  for (let s = 0; s < subdivisions; s++) {
    const mid = new Map<number, number>();
    const midpoint = (i: number, j: number): number => {
      const key = i < j ? i * 1e7 + j : j * 1e7 + i;
      const hit = mid.get(key);
      if (hit !== undefined) return hit;
      const a = pts[i]!;
      const b = pts[j]!;
      const m = [a[0]! + b[0]!, a[1]! + b[1]!, a[2]! + b[2]!];
      const n = Math.hypot(m[0]!, m[1]!, m[2]!);
      pts.push([m[0]! / n, m[1]! / n, m[2]! / n]);
      mid.set(key, pts.length - 1);
      return pts.length - 1;
    };
    const next: number[][] = [];
    for (const [a, b, c] of faces as [number, number, number][]) {
      const ab = midpoint(a, b);
      const bc = midpoint(b, c);
      const ca = midpoint(c, a);
      next.push([a, ab, ca], [b, bc, ab], [c, ca, bc], [ab, bc, ca]);
    }
    faces = next;
  }
  const vertices = new Float64Array(pts.length * 3);
  pts.forEach((p, i) => {
    vertices[3 * i] = center[0] + radius * p[0]!;
    vertices[3 * i + 1] = center[1] + radius * p[1]!;
    vertices[3 * i + 2] = center[2] + radius * p[2]!;
  });
  const triangles = new Uint32Array(faces.length * 3);
  faces.forEach((f, t) => {
    // Orient outward: the normal must point away from the centre (unit-sphere coordinates).
    const [a, b, c] = f as [number, number, number];
    const pa = pts[a]!, pb = pts[b]!, pc = pts[c]!;
    const ux = pb[0]! - pa[0]!, uy = pb[1]! - pa[1]!, uz = pb[2]! - pa[2]!;
    const vx = pc[0]! - pa[0]!, vy = pc[1]! - pa[1]!, vz = pc[2]! - pa[2]!;
    const out = (uy * vz - uz * vy) * pa[0]! + (uz * vx - ux * vz) * pa[1]! + (ux * vy - uy * vx) * pa[2]!;
    triangles[3 * t] = a;
    triangles[3 * t + 1] = out >= 0 ? b : c;
    triangles[3 * t + 2] = out >= 0 ? c : b;
  });
  return { vertices, triangles };
}

/**
 * A closed, outward-oriented triangulation of an axis-aligned box.
 *
 * Each face is split into a grid of divisions (one number for every axis, or [nx, ny, nz])
 * squares, each cut into two triangles; vertices on edges and corners are shared, so the
 * mesh is closed.
 *
 * @example
 * boxMesh([0, 0, 0], [1, 1, 1], 2).triangles.length / 3; // 48
 */
export function boxMesh(
  min: readonly [number, number, number],
  max: readonly [number, number, number],
  divisions: number | readonly [number, number, number] = 1,
): TriangleMesh {
  checkVector("boxMesh", "min", min);
  checkVector("boxMesh", "max", max);
  for (let i = 0; i < 3; i++) if (!(max[i]! > min[i]!)) throw bad("boxMesh", "max", "each coordinate of max must exceed that of min");
  const div = typeof divisions === "number" ? [divisions, divisions, divisions] : divisions;
  if (!Array.isArray(div) || div.length !== 3 || !div.every((d) => Number.isInteger(d) && d >= 1 && d <= 1000)) {
    throw bad("boxMesh", "divisions", "a whole number from 1 to 1000, or three of them", typeof divisions === "number" ? divisions : undefined);
  }
  const [nx, ny, nz] = div as [number, number, number];
  const index = new Map<number, number>();
  const coords: number[] = [];
  const vertex = (i: number, j: number, k: number): number => {
    const key = (i * (ny + 1) + j) * (nz + 1) + k;
    const hit = index.get(key);
    if (hit !== undefined) return hit;
    coords.push(
      i === nx ? max[0] : min[0] + ((max[0] - min[0]) * i) / nx,
      j === ny ? max[1] : min[1] + ((max[1] - min[1]) * j) / ny,
      k === nz ? max[2] : min[2] + ((max[2] - min[2]) * k) / nz,
    );
    index.set(key, coords.length / 3 - 1);
    return coords.length / 3 - 1;
  };
  const tris: number[] = [];
  const n = [nx, ny, nz];
  // For each axis and each side, a grid over the two other axes.
  for (let axis = 0; axis < 3; axis++) {
    const u = (axis + 1) % 3;
    const v = (axis + 2) % 3;
    for (const side of [0, 1]) {
      const fixed = side === 0 ? 0 : n[axis]!;
      for (let a = 0; a < n[u]!; a++) {
        for (let b = 0; b < n[v]!; b++) {
          const at = (da: number, db: number): number => {
            const ijk = [0, 0, 0];
            ijk[axis] = fixed;
            ijk[u] = a + da;
            ijk[v] = b + db;
            return vertex(ijk[0]!, ijk[1]!, ijk[2]!);
          };
          const p00 = at(0, 0), p10 = at(1, 0), p11 = at(1, 1), p01 = at(0, 1);
          // (u, v, axis) is right-handed, so u x v points along +axis: keep for the max side.
          if (side === 1) tris.push(p00, p10, p11, p00, p11, p01);
          else tris.push(p00, p11, p10, p00, p01, p11);
        }
      }
    }
  }
  return { vertices: new Float64Array(coords), triangles: new Uint32Array(tris) };
}
