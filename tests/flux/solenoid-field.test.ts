// solenoidField: a decimal.js oracle of Derby and Olbert's published expressions,
// the existing on-axis solenoidAxialField, the Biot-Savart solver on a helix and on
// stacked loops, the current sheet's jump, the dipole limit, and bad input.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { biotSavart, evaluate, solenoidAxialField, solenoidField, type Current, type Length } from "../../src/index.js";
import { MU0 } from "../../src/constants/si.js";
import { codeOf, expectFormulaError } from "../helpers/errors.js";
import { relativeError } from "../helpers/reference.js";
import { stackedLoopsField, vectorError } from "../helpers/stacked-loops.js";
import { sheetOracle } from "./sheet-oracle.js";

const EPS = Number.EPSILON;
const m = (v: number) => v as Length;
const field = (I: number, N: number, a: number, l: number, rho: number, z: number) =>
  solenoidField({ current: I as Current, turns: N, radius: m(a), length: m(l), radialDistance: m(rho), axialDistance: m(z) }) as unknown as readonly [number, number];
function oracleB(I: number, N: number, a: number, l: number, rho: number, z: number): [number, number] {
  const k = (MU0 * N * I) / l; // mu0 K: the oracle's geometry factor carries the digits that cancel
  const [fr, fz] = sheetOracle(a, l, rho, z);
  return [k * fr.toNumber(), k * fz.toNumber()];
}
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);

describe("solenoidField", () => {
  it("matches a decimal.js oracle of Derby and Olbert (2010) inside, next to and on the winding, at the ends and far away", () => {
    const a = 0.01, l = 0.1;
    const points: [number, number][] = [
      [0.005, 0.02], [0, 0], [0.009, -0.03], [0.0099999999, 0.01], [0.0100000001, 0.01], [0.01, 0.01], [0.01, -0.049],
      [0.005, 0.05], [0.012, 0.05], [0.02, 0.06], [0.03, 0], [0.1, 0.1], [0.2, 0.05], [1, 2], [10, -3], [0, 100], [100, 0],
    ];
    let worst = 0;
    for (const [rho, z] of points) {
      const err = vectorError(field(1, 1000, a, l, rho, z), oracleB(1, 1000, a, l, rho, z));
      worst = Math.max(worst, err);
      expect(err, `rho ${rho}, z ${z}`).toBeLessThan(1e-12);
    }
    console.log(`solenoidField worst error at the listed points (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
  });

  it("is within 1e-12 of |B| of the oracle for random sizes, aspect ratios 0.1..10 and points out to 1e4 sizes (property)", () => {
    let worst = 0;
    fc.assert(fc.property(decades(-100, 100), decades(-1, 1), decades(-3, 4), fc.double({ min: 0, max: Math.PI, noNaN: true }), (a, aspect, r, theta) => {
      const l = a * aspect;
      const size = Math.max(a, l);
      const rho = r * size * Math.sin(theta), z = r * size * Math.cos(theta);
      const err = vectorError(field(1, 100, a, l, rho, z), oracleB(1, 100, a, l, rho, z));
      worst = Math.max(worst, err);
      expect(err).toBeLessThan(1e-12);
    }), { numRuns: 150 });
    console.log(`solenoidField worst error over random geometry (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
  });

  it("stays within 1e-12 of |B| of the oracle for long and flat windings (length / radius 1e-3..100) on a grid of points out to 80 half-diagonals", () => {
    for (const l of [100, 10, 0.01, 0.001]) {
      let worst = 0;
      for (const r of [0.01, 0.3, 0.5, 0.9, 1.1, 2, 5, 20]) for (const t of [0, 0.1, 0.3, 0.7, 1.0, 1.2, 1.5]) {
        const d = r * 3.9 * Math.hypot(1, l / 2);
        const rho = d * Math.sin(t), z = d * Math.cos(t);
        worst = Math.max(worst, vectorError(field(1, 1, 1, l, rho, z), oracleB(1, 1, 1, l, rho, z)));
      }
      expect(worst, `length / radius ${l}`).toBeLessThan(1e-12);
    }
  });

  it("keeps 1e-13 of |B| just outside and beside windings 100 and 1000 radii long, where the outer field is small against each loop's", () => {
    // Formerly about 1e-11 (closed form, rho < 2a) and up to 1.2e-10 (loop quadrature, rho >= 2a): each
    // end's term cancelled like its modulus, and the loops' fields cancel beside a long sheet (Ampere).
    const wrong: string[] = [];
    let worst = 0;
    for (const l of [100, 1000]) for (const rho of [1.0001, 1.001, 1.01, 1.1, 1.5, 2, 2.5, 3, 5, 20, 150]) for (const zf of [0, 0.1, 0.3, 0.45, 0.499, 0.5, 0.501, 0.6]) {
      const z = zf * l;
      const err = vectorError(field(1, 1, 1, l, rho, z), oracleB(1, 1, 1, l, rho, z));
      worst = Math.max(worst, err);
      if (!(err < 1e-13)) wrong.push(`l ${l}, rho ${rho}, z/l ${zf}: ${err.toExponential(2)}`);
    }
    console.log(`solenoidField worst error beside long windings (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
    expect(wrong).toEqual([]);
  });

  it("agrees with solenoidAxialField on the axis (radialDistance 0)", () => {
    fc.assert(fc.property(decades(-3, 0), decades(-3, 0), fc.double({ min: -5, max: 5, noNaN: true }), (a, l, z) => {
      const [br, bz] = field(2, 500, a, l, 0, z);
      const axial = solenoidAxialField({ current: 2 as Current, turns: 500, radius: m(a), length: m(l), axialPosition: m(z) }) as number;
      expect(br).toBe(0);
      expect(relativeError(bz, axial)).toBeLessThan(1e-12);
    }), { numRuns: 300 });
  });

  it("agrees with the Biot-Savart solver on a helix of 200 turns (polyline, 256 sides per turn) away from the winding", () => {
    const a = 0.02, l = 0.1, N = 200, sides = 256, I = 3;
    const path = new Float64Array(3 * (N * sides + 1));
    for (let i = 0; i <= N * sides; i++) {
      const t = (2 * Math.PI * i) / sides;
      path[3 * i] = a * Math.cos(t);
      path[3 * i + 1] = a * Math.sin(t);
      path[3 * i + 2] = -l / 2 + (l * i) / (N * sides);
    }
    // Points at angle 0.3 rad (x-z plane rotated): a helix is not axisymmetric, but away from the
    // winding by many pitches its field is the sheet's plus the field of one axial return wire's worth of
    // current (I along the axis direction over l), which the sheet misses: compare only where that is small.
    for (const [rho, z] of [[0, 0], [0.01, 0.02], [0.005, -0.06], [0.01, 0.09], [0.3, 0.4]] as const) {
      const pts = new Float64Array([rho * Math.cos(0.3), rho * Math.sin(0.3), z]);
      const b = biotSavart(path, I, pts);
      const br = b[0]! * Math.cos(0.3) + b[1]! * Math.sin(0.3);
      const [sr, sz] = field(I, N, a, l, rho, z);
      const scale = Math.hypot(sr, sz);
      // The helix's start and end half-turns differ from the sheet's ends by about pitch / distance
      // (5e-4 / 0.01 near an end); elsewhere the polygon (1e-4) and the helix's pitch dominate.
      expect(Math.abs(b[2]! - sz) / scale, `axial at ${rho}, ${z}`).toBeLessThan(5e-3);
      expect(Math.abs(br - sr) / scale, `radial at ${rho}, ${z}`).toBeLessThan(5e-3);
    }
  });

  it("agrees with the Biot-Savart solver on 400 stacked loops (midpoint rule, 1000-gons) to the discretisation accuracy", () => {
    const a = 0.01, l = 0.02, loops = 400, sides = 1000, I = 1, N = 400;
    const pts: [number, number][] = [[0.004, 0.005], [0.015, 0], [0.02, 0.02], [0.0, -0.03], [0.008, 0.012]];
    const total = stackedLoopsField(a, l, loops, sides, I, new Float64Array(pts.flatMap(([r, z]) => [r, 0, z])));
    pts.forEach(([rho, z], p) => {
      const [sr, sz] = field(I, N, a, l, rho, z);
      const scale = Math.hypot(sr, sz);
      // Polygon (1e-5) and midpoint-rule errors (1e-5 here, pitch 5e-5 m at >= 2 mm from the winding).
      expect(Math.abs(total[3 * p]! - sr) / scale).toBeLessThan(1e-4);
      expect(Math.abs(total[3 * p + 2]! - sz) / scale).toBeLessThan(1e-4);
    });
  });

  it("on the winding: B_rho is continuous and B_z is the mean of the two sides, which differ by mu0 N I / l", () => {
    const a = 0.01, l = 0.1, N = 1000, I = 1;
    for (const z of [0, 0.02, -0.045]) {
      const inside = field(I, N, a, l, a * (1 - 1e-12), z);
      const on = field(I, N, a, l, a, z);
      const outside = field(I, N, a, l, a * (1 + 1e-12), z);
      expect(relativeError(inside[1] - outside[1], (MU0 * N * I) / l)).toBeLessThan(1e-9);
      expect(relativeError(on[1], (inside[1] + outside[1]) / 2)).toBeLessThan(1e-9);
      expect(Math.abs(on[0] - inside[0])).toBeLessThan(1e-9 * Math.abs(on[1]));
    }
  });

  it("tends to the dipole field of moment N I pi R^2 far away", () => {
    const a = 0.01, l = 0.03, N = 50, I = 2;
    const moment = N * I * Math.PI * a * a;
    for (const d of [30, 300, 3000]) for (const theta of [0.2, 1.0, Math.PI / 2, 2.5]) {
      const rho = d * Math.sin(theta), z = d * Math.cos(theta);
      const c = (MU0 * moment) / (4 * Math.PI * d ** 3);
      const dipole = [3 * c * Math.sin(theta) * Math.cos(theta), c * (3 * Math.cos(theta) ** 2 - 1)];
      // The next multipole is (size / distance)^2 of the dipole.
      expect(vectorError(field(I, N, a, l, rho, z), dipole)).toBeLessThan(10 * (0.03 / d) ** 2 + 1e-14);
    }
  });

  it("refuses the rim of an end, where B_rho is infinite, as out_of_domain naming the geometry", () => {
    const e = expectFormulaError(() => field(1, 10, 0.01, 0.1, 0.01, 0.05));
    expect(e.code).toBe("out_of_domain");
    expect(e.message).toMatch(/rim/);
    expect(codeOf(() => field(1, 10, 0.01, 0.1, 0.01, -0.05))).toBe("out_of_domain");
    expect(codeOf(() => evaluate("solenoidField", { current: "1 A", turns: 10, radius: "1 cm", length: "10 cm", radialDistance: "-1 mm", axialDistance: "0 m" }))).toBe("out_of_domain");
  });

  it("warns next to the winding, closer than the pitch, and for a coarse pitch; cautions from 200 uT", () => {
    const near = solenoidField.details({ current: 1 as Current, turns: 100, radius: m(0.01), length: m(0.1), radialDistance: m(0.0095), axialDistance: m(0) });
    expect(near.warnings.map((w) => w.code)).toContain("near_winding");
    expect(near.cautions.map((c) => c.code)).toEqual(["strong_field"]); // mu0 * 1000 A/m, about 1.2 mT inside
    const far = solenoidField.details({ current: 1 as Current, turns: 100, radius: m(0.01), length: m(0.1), radialDistance: m(1), axialDistance: m(1) });
    expect(far.warnings).toEqual([]);
    expect(far.cautions).toEqual([]);
  });
});
