/**
 * Biot-Savart throughput: the library's polyline kernel (one square root per segment
 * and point, end distances reused, no allocation) against a plain scalar loop on the
 * same flat arrays using the textbook angle form B = mu0 I / (4 pi d) (cos a1 - cos a2).
 * Reported as segment-point interactions per second and the ratio of the two.
 */
import { biotSavart } from "../src/index.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const MU0 = 1.25663706127e-6;

/** Textbook finite-segment field, per segment: unit vector, perpendicular foot, two angle cosines. */
function plainLoop(path: Float64Array, current: number, points: Float64Array, out: Float64Array): void {
  const nv = path.length / 3;
  const k = (MU0 * current) / (4 * Math.PI);
  for (let p = 0; p < points.length; p += 3) {
    const px = points[p]!, py = points[p + 1]!, pz = points[p + 2]!;
    let bx = 0, by = 0, bz = 0;
    for (let i = 0; i + 1 < nv; i++) {
      const ax = path[3 * i]!, ay = path[3 * i + 1]!, az = path[3 * i + 2]!;
      const lx = path[3 * i + 3]! - ax, ly = path[3 * i + 4]! - ay, lz = path[3 * i + 5]! - az;
      const len = Math.sqrt(lx * lx + ly * ly + lz * lz);
      const ux = lx / len, uy = ly / len, uz = lz / len;
      const r1x = px - ax, r1y = py - ay, r1z = pz - az;
      const t = r1x * ux + r1y * uy + r1z * uz;
      const dx = r1x - t * ux, dy = r1y - t * uy, dz = r1z - t * uz;
      const d2 = dx * dx + dy * dy + dz * dz;
      if (d2 === 0) continue;
      const r2x = r1x - lx, r2y = r1y - ly, r2z = r1z - lz;
      const cos1 = t / Math.sqrt(r1x * r1x + r1y * r1y + r1z * r1z);
      const cos2 = (r2x * ux + r2y * uy + r2z * uz) / Math.sqrt(r2x * r2x + r2y * r2y + r2z * r2z);
      const f = (cos1 - cos2) / d2; // |B| = k (cos1 - cos2) / d along (u x d) / d
      bx += f * (uy * dz - uz * dy);
      by += f * (uz * dx - ux * dz);
      bz += f * (ux * dy - uy * dx);
    }
    out[p] = k * bx;
    out[p + 1] = k * by;
    out[p + 2] = k * bz;
  }
}

export async function run(): Promise<BenchRow[]> {
  const segments = 200;
  const nPoints = 500;
  const jitter = randomArray(3 * (segments + 1), -0.05, 0.05, 11);
  const path = new Float64Array(3 * (segments + 1));
  for (let i = 0; i <= segments; i++) {
    const t = (2 * Math.PI * i) / segments;
    path[3 * i] = Math.cos(t) + jitter[3 * i]!;
    path[3 * i + 1] = Math.sin(t) + jitter[3 * i + 1]!;
    path[3 * i + 2] = jitter[3 * i + 2]!;
  }
  const points = randomArray(3 * nPoints, -2, 2, 12);
  const a = new Float64Array(points.length);
  const b = new Float64Array(points.length);
  const currents = randomArray(64, 0.5, 2, 13);
  let call = 0;

  const t = compare(
    {
      plain: () => {
        plainLoop(path, currents[call++ & 63]!, points, b);
        return b[0]! + b[b.length - 1]!;
      },
      library: () => {
        biotSavart(path, currents[call++ & 63]!, points, a);
        return a[0]! + a[a.length - 1]!;
      },
    },
    segments * nPoints,
    15,
    3,
  );
  // Same inputs through both: the results must agree (and are consumed).
  biotSavart(path, 1, points, a);
  plainLoop(path, 1, points, b);
  let worst = 0;
  for (let i = 0; i < a.length; i += 3) {
    const s = Math.hypot(a[i]!, a[i + 1]!, a[i + 2]!) || 1;
    worst = Math.max(worst, Math.hypot(a[i]! - b[i]!, a[i + 1]! - b[i + 1]!, a[i + 2]! - b[i + 2]!) / s);
  }
  return [
    {
      name: "biotSavart segment-point interactions per second",
      value: (1e9 / t.ns.library!).toExponential(2),
      note: `${segments} segments x ${nPoints} points per call; ${ns(t.ns.library!)} per interaction`,
    },
    {
      name: "biotSavart vs plain scalar loop (time ratio)",
      value: times(t.ratio.library!),
      note: `plain textbook angle form on the same flat arrays ${ns(t.ns.plain!)} per interaction; results agree to ${worst.toExponential(1)} (lower is faster)`,
    },
  ];
}
