// blockMagnetField: a decimal.js oracle of the published charge-model form, the
// dipole limit far away (a cube's next multipole is (size/distance)^4 down), the
// Biot-Savart solver on stacked rectangular loops (K = B_r / mu0), the jumps and
// continuity at the faces, symmetry, and bad input.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { biotSavart, blockMagnetField, type FluxDensity, type Length, type Vec3 } from "../../src/index.js";
import { MU0 } from "../../src/constants/si.js";
import { codeOf } from "../helpers/errors.js";
import { relativeError } from "../helpers/reference.js";
import { vectorError } from "../helpers/stacked-loops.js";
import { blockOracle } from "./block-oracle.js";

const EPS = Number.EPSILON;
type P = [number, number, number];
const field = (br: number, s: P, p: P) =>
  blockMagnetField({ remanence: br as FluxDensity, sizeX: s[0] as Length, sizeY: s[1] as Length, sizeZ: s[2] as Length, position: p as unknown as Vec3<Length> }) as unknown as P;
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((e) => 10 ** e);
const dipole = (br: number, s: P, p: P): P => {
  // m = B_r V / mu0 along z: B = (mu0 / 4 pi) (3 (m . r) r / r^5 - m / r^3) = (B_r V / 4 pi) (...)
  const r = Math.hypot(...p), k = (br * s[0] * s[1] * s[2]) / (4 * Math.PI * r ** 3);
  return [(3 * k * p[2] * p[0]) / r ** 2, (3 * k * p[2] * p[1]) / r ** 2, k * ((3 * p[2] ** 2) / r ** 2 - 1)];
};

describe("blockMagnetField", () => {
  it("matches a decimal.js oracle of Furlani's charge-model form inside, on the faces, next to the edges, on the face planes and far away", () => {
    const s: P = [0.01, 0.006, 0.004];
    const pts: P[] = [
      [0, 0, 0], [0.003, 0.002, 0.001], [0.003, 0.002, 0.002], [0.005, 0.001, 0.0], [0.004, -0.002, 0.005], [0.0050000001, 0.003 - 1e-12, 0.001],
      [0.007, 0.003, 0.002], [0.02, 0.0, 0.002], [0.0, 0.0, 0.01], [0.012, -0.01, 0.008], [0.01, 0.01, -0.01], [0.0049999999, 0.0029999999, 0.0019999999],
      [10, 3, -7], [0, 0, 12], [12, 0, 0], [0.1, 0.1, 0.1],
    ];
    let worst = 0;
    for (const p of pts) {
      const want = blockOracle(1.2, s, p).map((d) => d.toNumber());
      const err = vectorError(field(1.2, s, p), want);
      worst = Math.max(worst, err);
      expect(err, `at ${p}`).toBeLessThan(1e-12);
    }
    console.log(`blockMagnetField worst error at the listed points (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
  });

  it("is within 1e-12 of |B| of the oracle for random blocks (aspect 0.1..10, sizes 1e-100..1e100 m) and points out to 1e4 sizes (property)", () => {
    let worst = 0;
    fc.assert(fc.property(decades(-100, 100), decades(-1, 1), decades(-1, 1), decades(-2, 4), fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (sx, ry, rz, r, theta, phi) => {
      const s: P = [sx, sx * ry, sx * rz];
      const d = r * Math.max(...s);
      const p: P = [d * Math.sin(theta) * Math.cos(phi), d * Math.sin(theta) * Math.sin(phi), d * Math.cos(theta)];
      const want = blockOracle(-0.9, s, p).map((v) => v.toNumber());
      const err = vectorError(field(-0.9, s, p), want);
      worst = Math.max(worst, err);
      expect(err).toBeLessThan(1e-12);
    }), { numRuns: 60 });
    console.log(`blockMagnetField worst error over random blocks (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
  });

  it("keeps 1e-13 of |B| beside flat plates and thin bars of side ratio 100, and 1e-12 for plates of 1000, inside and out", () => {
    // Formerly up to 2.7e-11 (100:1:1 bars) and 6e-12 (1000:1 plates): the corner sums cancel like
    // (distance / thin size)^2 there; such points now take the dipole-density integral on panels.
    const cases: [P, number][] = [
      [[1, 1, 0.01], 1e-13], [[1, 0.01, 1], 1e-13], [[0.01, 1, 1], 1e-13],
      [[1, 0.01, 0.01], 1e-13], [[0.01, 0.01, 1], 1e-13], [[0.01, 1, 0.01], 1e-13],
      [[1, 1, 0.001], 1e-12], [[1, 0.001, 1], 1e-12],
    ];
    const wrong: string[] = [];
    let worst = 0;
    for (const [s, bound] of cases) {
      const h = s.map((v) => v / 2) as P;
      const thin = s.indexOf(Math.min(...s));
      const pts: P[] = [];
      for (const f of [[0, 0.3, 0.7], [0.49, 0.7, 0.3], [0.51, 0, 0.51], [1.2, 2, 0], [3, 0, 0], [0.2, 0.2, 0.2]] as P[]) pts.push(f.map((v) => v * Math.max(...s)) as P);
      for (const d of [1e-3, 1e-2, 0.1, 0.3]) for (const t of [0, 0.2, 0.45]) {
        const p: P = [t * s[0], t * s[1], t * s[2]];
        p[thin] = h[thin]! + d * Math.max(...s); // just beside the thin size, over the broad face or along the bar
        pts.push(p);
      }
      for (const p of pts) {
        const want = blockOracle(1.1, s, p).map((v) => v.toNumber());
        const err = vectorError(field(1.1, s, p), want);
        worst = Math.max(worst, err);
        if (!(err < bound)) wrong.push(`${s} at ${p}: ${err.toExponential(2)}`);
      }
    }
    console.log(`blockMagnetField worst error beside plates and bars (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
    expect(wrong).toEqual([]);
  });

  it("a cube's field 1000 sizes away is its dipole's, B_r V / mu0, to 1e-10 (the cube's octupole vanishes; the next term is (size/distance)^4)", () => {
    const s: P = [0.01, 0.01, 0.01];
    for (const dir of [[0, 0, 1], [1, 0, 0], [0.6, 0.48, 0.64], [-0.36, 0.48, -0.8], [0.8, 0, 0.6]] as P[]) {
      const p = dir.map((c) => c * 10) as P; // 1000 sizes
      expect(vectorError(field(1.3, s, p), dipole(1.3, s, p)), `direction ${dir}`).toBeLessThan(1e-10);
    }
  });

  it("any block tends to its dipole field far away (property: within 3 (size/distance)^2)", () => {
    fc.assert(fc.property(decades(-1, 1), decades(-1, 1), decades(1, 6), fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (ry, rz, r, theta, phi) => {
      const s: P = [0.01, 0.01 * ry, 0.01 * rz];
      const size = Math.max(...s), d = r * size;
      const p: P = [d * Math.sin(theta) * Math.cos(phi), d * Math.sin(theta) * Math.sin(phi), d * Math.cos(theta)];
      expect(vectorError(field(1.3, s, p), dipole(1.3, s, p))).toBeLessThan(3 / r ** 2 + 1e-12);
    }), { numRuns: 200 });
  });

  it("agrees with the Biot-Savart solver on its side-face current as 200 stacked rectangular loops (K = B_r / mu0) outside the magnet", () => {
    const s: P = [0.01, 0.006, 0.004], br = 1.2, loops = 200;
    const pts: P[] = [[0.002, 0.001, 0.005], [0.008, 0.0, 0.0], [0.006, 0.005, -0.003], [0.0, 0.0, -0.004], [0.02, 0.02, 0.02]];
    const points = new Float64Array(pts.flat());
    const total = new Float64Array(points.length);
    const [a, b, c] = s.map((v) => v / 2) as P;
    for (let k = 0; k < loops; k++) {
      const zk = -c + ((k + 0.5) * 2 * c) / loops; // midpoint rule along z
      const path = new Float64Array([a, -b, zk, a, b, zk, -a, b, zk, -a, -b, zk, a, -b, zk]); // counter-clockwise about +z
      const bl = biotSavart(path, (br / MU0) * ((2 * c) / loops), points);
      for (let j = 0; j < total.length; j++) total[j] = total[j]! + bl[j]!;
    }
    pts.forEach((p, i) => {
      // The midpoint rule's error is about (strip / distance)^2 / 24: under 1e-4 at these points.
      expect(vectorError(field(br, s, p), [total[3 * i]!, total[3 * i + 1]!, total[3 * i + 2]!]), `at ${p}`).toBeLessThan(1e-4);
    });
  });

  it("B_z jumps by B_r across a side face and the mean is returned there; B is continuous across the top face; the components have the block's symmetry", () => {
    const s: P = [0.01, 0.006, 0.004], br = 1.2;
    const inside = field(br, s, [0.005 * (1 - 1e-13), 0.001, 0.001]);
    const on = field(br, s, [0.005, 0.001, 0.001]);
    const outside = field(br, s, [0.005 * (1 + 1e-13), 0.001, 0.001]);
    expect(relativeError(inside[2] - outside[2], br)).toBeLessThan(1e-9);
    expect(relativeError(on[2], (inside[2] + outside[2]) / 2)).toBeLessThan(1e-9);
    const below = field(br, s, [0.001, 0.001, 0.002 * (1 - 1e-13)]);
    const top = field(br, s, [0.001, 0.001, 0.002]);
    const above = field(br, s, [0.001, 0.001, 0.002 * (1 + 1e-13)]);
    for (let i = 0; i < 3; i++) {
      expect(Math.abs(below[i]! - above[i]!)).toBeLessThan(1e-9);
      expect(Math.abs(top[i]! - above[i]!)).toBeLessThan(1e-9);
    }
    const q = field(br, s, [0.003, 0.002, 0.005]);
    const mirrored = field(br, s, [-0.003, 0.002, -0.005]);
    expect(mirrored[0]).toBeCloseTo(q[0], 15); // B_x odd in x and in z: even under both
    expect(mirrored[1]).toBeCloseTo(-q[1], 15); // B_y even in x, odd in z
    expect(mirrored[2]).toBeCloseTo(q[2], 15);
  });

  it("refuses points on an edge or corner as out_of_domain", () => {
    const s: P = [0.01, 0.006, 0.004];
    expect(codeOf(() => field(1.2, s, [0.005, 0.001, 0.002]))).toBe("out_of_domain"); // top edge along y
    expect(codeOf(() => field(1.2, s, [0.005, 0.003, 0.0]))).toBe("out_of_domain"); // side edge along z
    expect(codeOf(() => field(1.2, s, [-0.005, -0.003, 0.002]))).toBe("out_of_domain"); // corner
    expect(codeOf(() => field(1.2, s, [0.006, 0.003, 0.002]))).toBeUndefined(); // on the extension of an edge: finite
  });

  it("cautions from 200 uT, not far away", () => {
    const p = (v: P) => v as unknown as Vec3<Length>;
    const near = blockMagnetField.details({ remanence: 1.2 as FluxDensity, sizeX: 0.01 as Length, sizeY: 0.01 as Length, sizeZ: 0.005 as Length, position: p([0, 0, 0.01]) });
    expect(near.cautions.map((c) => c.code)).toEqual(["strong_field"]);
    const far = blockMagnetField.details({ remanence: 1.2 as FluxDensity, sizeX: 0.01 as Length, sizeY: 0.01 as Length, sizeZ: 0.005 as Length, position: p([0, 0, 1]) });
    expect(far.cautions).toEqual([]);
  });
});
