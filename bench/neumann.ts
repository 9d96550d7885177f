/**
 * Neumann solver: segment-pair throughput of mutualInductance (closed-form
 * inner integral, adaptive Gauss-Legendre outer integral) against a plain
 * scalar reference loop (fixed 8 x 8 Gauss-Legendre double sum of
 * (dl1 . dl2)/r per segment pair, nodes hard-wired in the loop), and the
 * accuracy of both against Maxwell's closed form for coaxial circles as the
 * polygons are refined.
 */
import { coaxialLoopsMutualInductance, mutualInductance, type Length } from "../src/index.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const MU0 = 1.25663706127e-6;

// 8-point Gauss-Legendre on [0, 1] (A&S Table 25.4), for the reference loop.
const X8 = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363].map((x) => 0.5 + 0.5 * x);
const W8 = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763].map((w) => 0.5 * w);

/** Textbook double sum: for every segment pair, 8 x 8 points of (dl1 . dl2) / r. */
function plainNeumann(a: Float64Array, b: Float64Array): number {
  const na = a.length / 3 - 1;
  const nb = b.length / 3 - 1;
  let total = 0;
  for (let i = 0; i < na; i++) {
    const ax = a[3 * i]!, ay = a[3 * i + 1]!, az = a[3 * i + 2]!;
    const dax = a[3 * i + 3]! - ax, day = a[3 * i + 4]! - ay, daz = a[3 * i + 5]! - az;
    for (let j = 0; j < nb; j++) {
      const bx = b[3 * j]!, by = b[3 * j + 1]!, bz = b[3 * j + 2]!;
      const dbx = b[3 * j + 3]! - bx, dby = b[3 * j + 4]! - by, dbz = b[3 * j + 5]! - bz;
      let s = 0;
      for (let p = 0; p < 8; p++) {
        const px = ax + X8[p]! * dax, py = ay + X8[p]! * day, pz = az + X8[p]! * daz;
        let inner = 0;
        for (let q = 0; q < 8; q++) {
          const rx = px - bx - X8[q]! * dbx, ry = py - by - X8[q]! * dby, rz = pz - bz - X8[q]! * dbz;
          inner += W8[q]! / Math.sqrt(rx * rx + ry * ry + rz * rz);
        }
        s += W8[p]! * inner;
      }
      total += s * (dax * dbx + day * dby + daz * dbz);
    }
  }
  return (MU0 / (4 * Math.PI)) * total;
}

function polygon(n: number, R: number, z: number, jitter?: Float64Array): Float64Array {
  const p = new Float64Array(3 * (n + 1));
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n;
    p[3 * i] = R * Math.cos(t) + (jitter ? jitter[3 * i]! : 0);
    p[3 * i + 1] = R * Math.sin(t) + (jitter ? jitter[3 * i + 1]! : 0);
    p[3 * i + 2] = z + (jitter ? jitter[3 * i + 2]! : 0);
  }
  p.copyWithin(3 * n, 0, 3);
  return p;
}

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  // Throughput: two coaxial loops (radii 1 and 0.7 m, 0.3 m apart), 96 segments each,
  // slightly randomised so no two calls see the same geometry.
  const n = 96;
  const pairs = n * n;
  const jitters = Array.from({ length: 8 }, (_, k) => randomArray(3 * n, -0.01, 0.01, 100 + k));
  const A = jitters.map((j) => polygon(n, 1, 0, j));
  const B = jitters.map((j) => polygon(n, 0.7, 0.3, j));
  let call = 0;
  const c = compare(
    {
      library: () => {
        const k = call++ & 7;
        return mutualInductance(A[k]!, B[k]!);
      },
      plain: () => {
        const k = call++ & 7;
        return plainNeumann(A[k]!, B[k]!);
      },
    },
    pairs,
    11,
    3,
  );
  rows.push({
    name: "neumann: mutualInductance segment pairs",
    value: `${(1e9 / c.ns.library! / 1e6).toFixed(2)} M pairs/s`,
    note: `${ns(c.ns.library!)} per pair; coaxial 96-gons 0.3 m apart`,
  });
  rows.push({
    name: "neumann: plain 8x8 Gauss loop / library (time per pair)",
    value: times(c.ratio.plain!),
    note: `above 1x the library is faster; plain loop ${ns(c.ns.plain!)} per pair, and inaccurate for near pairs (last row)`,
  });

  // Accuracy against Maxwell's closed form: the polygon error O(1/n^2) dominates;
  // Richardson extrapolation over n, 2n, 4n removes it for the library.
  const exact = coaxialLoopsMutualInductance({ radius1: 1 as Length, radius2: 0.7 as Length, distance: 0.3 as Length }) as number;
  const ns_ = [32, 64, 128, 256];
  const lib = ns_.map((m) => mutualInductance(polygon(m, 1, 0), polygon(m, 0.7, 0.3)));
  const plain = ns_.map((m) => plainNeumann(polygon(m, 1, 0), polygon(m, 0.7, 0.3)));
  ns_.forEach((m, i) => {
    rows.push({
      name: `neumann: coaxial ${m}-gons vs Maxwell`,
      value: `${(Math.abs(lib[i]! / exact - 1)).toExponential(2)} rel.`,
      note: `plain 8x8 loop: ${(Math.abs(plain[i]! / exact - 1)).toExponential(2)} (polygon error ~0.3/n^2 in both)`,
    });
  });
  const rich = (v: number[], i: number): number => {
    const r1 = (4 * v[i - 1]! - v[i - 2]!) / 3;
    const r2 = (4 * v[i]! - v[i - 1]!) / 3;
    return (16 * r2 - r1) / 15;
  };
  rows.push({
    name: "neumann: Richardson over 64, 128, 256-gons vs Maxwell",
    value: `${Math.abs(rich(lib, 3) / exact - 1).toExponential(2)} rel.`,
    note: `plain 8x8 loop extrapolated: ${Math.abs(rich(plain, 3) / exact - 1).toExponential(2)}`,
  });
  // A near pair: two parallel wires 1e-4 m apart, 1 m long, as single segments.
  const d = 1e-4;
  const nearExact = (MU0 / (2 * Math.PI)) * (Math.asinh(1 / d) - Math.hypot(1, d) + d);
  const wireA = new Float64Array([0, 0, 0, 1, 0, 0]);
  const wireB = new Float64Array([0, d, 0, 1, d, 0]);
  rows.push({
    name: "neumann: parallel wires 1e-4 m apart, one segment each",
    value: `${Math.abs(mutualInductance(wireA, wireB) / nearExact - 1).toExponential(2)} rel.`,
    note: `plain 8x8 loop: ${Math.abs(plainNeumann(wireA, wireB) / nearExact - 1).toExponential(2)} (Rosa's closed form)`,
  });
  return rows;
}
