// cylinderMagnetField: a decimal.js oracle of Derby and Olbert's published
// expressions (the magnet as a current sheet K = B_r / mu0), the existing on-axis
// cylinderMagnetAxialField, the equivalent solenoid, the Biot-Savart solver on the
// equivalent surface current, and the dipole limit far away (moment B_r V / mu0).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cylinderMagnetAxialField, cylinderMagnetField, solenoidField, type Current, type FluxDensity, type Length } from "../../src/index.js";
import { MU0 } from "../../src/constants/si.js";
import { codeOf } from "../helpers/errors.js";
import { relativeError } from "../helpers/reference.js";
import { stackedLoopsField, vectorError } from "../helpers/stacked-loops.js";
import { sheetOracle } from "../flux/sheet-oracle.js";

const EPS = Number.EPSILON;
const m = (v: number) => v as Length;
const field = (br: number, a: number, l: number, rho: number, z: number) =>
  cylinderMagnetField({ remanence: br as FluxDensity, radius: m(a), length: m(l), radialDistance: m(rho), axialDistance: m(z) }) as unknown as readonly [number, number];
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);

describe("cylinderMagnetField", () => {
  it("is within 1e-12 of |B| of a decimal.js oracle of Derby and Olbert (2010) over remanences 1e-300..1e300, sizes 1e-150..1e150 m, aspect 0.1..10, out to 1e4 sizes", () => {
    let worst = 0;
    fc.assert(fc.property(decades(-300, 300), decades(-150, 150), decades(-1, 1), decades(-3, 4), fc.double({ min: 0, max: Math.PI, noNaN: true }), (br, a, aspect, r, theta) => {
      const l = a * aspect;
      const size = Math.max(a, l);
      const rho = r * size * Math.sin(theta), z = r * size * Math.cos(theta);
      const [fr, fz] = sheetOracle(a, l, rho, z);
      const want = [fr.times(br).toNumber(), fz.times(br).toNumber()];
      const err = vectorError(field(br, a, l, rho, z), want);
      worst = Math.max(worst, err);
      expect(err).toBeLessThan(1e-12);
    }), { numRuns: 150 });
    console.log(`cylinderMagnetField worst error (relative to |B|): ${(worst / EPS).toFixed(1)} eps`);
  });

  it("equals cylinderMagnetAxialField on the axis, inside and outside (B inside, not mu0 H)", () => {
    fc.assert(fc.property(decades(-3, 0), decades(-3, 0), fc.double({ min: -3, max: 3, noNaN: true }), (a, l, z) => {
      const [br, bz] = field(1.2, a, l, 0, z);
      const axial = cylinderMagnetAxialField({ remanence: 1.2 as FluxDensity, radius: m(a), length: m(l), axialDistance: m(z) }) as number;
      expect(br).toBe(0);
      expect(relativeError(bz, axial)).toBeLessThan(1e-12);
    }), { numRuns: 300 });
  });

  it("equals the field of the equivalent solenoid, N I = B_r L / mu0", () => {
    const a = 0.004, l = 0.012, br = 1.1;
    for (const [rho, z] of [[0.002, 0.001], [0.006, 0.007], [0.03, -0.02]] as const) {
      const s = solenoidField({ current: ((br * l) / (MU0 * 100)) as Current, turns: 100, radius: m(a), length: m(l), radialDistance: m(rho), axialDistance: m(z) }) as unknown as number[];
      expect(vectorError(field(br, a, l, rho, z), s)).toBeLessThan(1e-14);
    }
  });

  it("agrees with the Biot-Savart solver on the equivalent surface current (K = B_r / mu0), 400 loops of 1000-gons, off the axis", () => {
    const a = 0.01, l = 0.02, br = 1.3, loops = 400, sides = 1000;
    const pts: [number, number][] = [[0.005, 0.015], [0.015, 0.0], [0.004, 0.002], [0.02, -0.03]];
    const current = (br / MU0) * (l / loops); // the strip's share of the surface current
    const total = stackedLoopsField(a, l, loops, sides, current, new Float64Array(pts.flatMap(([r, z]) => [0, r, z])));
    pts.forEach(([rho, z], p) => {
      const [sr, sz] = field(br, a, l, rho, z);
      // Points on the y axis: the radial component is B_y. Polygon and midpoint-rule errors about 1e-5.
      expect(vectorError([total[3 * p + 1]!, total[3 * p + 2]!], [sr, sz])).toBeLessThan(1e-4);
    });
  });

  it("tends to the dipole field of moment B_r pi R^2 L / mu0 far away (property)", () => {
    fc.assert(fc.property(decades(-3, 0), decades(-1, 1), decades(2, 6), fc.double({ min: 0, max: Math.PI, noNaN: true }), (a, aspect, r, theta) => {
      const l = a * aspect, br = 1.3;
      const size = Math.hypot(a, l / 2);
      const d = r * size;
      const moment = (br * Math.PI * a * a * l) / MU0;
      const c = (MU0 * moment) / (4 * Math.PI * d ** 3);
      const dipole = [3 * c * Math.sin(theta) * Math.cos(theta), c * (3 * Math.cos(theta) ** 2 - 1)];
      // The next (octupole) term is of order (size / distance)^2 of the dipole.
      expect(vectorError(field(br, a, l, d * Math.sin(theta), d * Math.cos(theta)), dipole)).toBeLessThan(3 / r ** 2 + 1e-13);
    }), { numRuns: 200 });
  });

  it("on the side surface: B_z jumps by B_r and the mean of the two sides is returned; the rim is out_of_domain", () => {
    const a = 0.005, l = 0.01, br = 1.3;
    const inside = field(br, a, l, a * (1 - 1e-12), 0.002), on = field(br, a, l, a, 0.002), outside = field(br, a, l, a * (1 + 1e-12), 0.002);
    expect(relativeError(inside[1] - outside[1], br)).toBeLessThan(1e-9);
    expect(relativeError(on[1], (inside[1] + outside[1]) / 2)).toBeLessThan(1e-9);
    expect(codeOf(() => field(br, a, l, a, -l / 2))).toBe("out_of_domain");
  });

  it("cautions from 200 uT near a magnet and not far away", () => {
    const near = cylinderMagnetField.details({ remanence: 1.3 as FluxDensity, radius: m(0.005), length: m(0.01), radialDistance: m(0.003), axialDistance: m(0.01) });
    expect(near.cautions.map((c) => c.code)).toEqual(["strong_field"]);
    expect(near.cautions[0]!.message).toMatch(/0\.5 mT/);
    const far = cylinderMagnetField.details({ remanence: 1.3 as FluxDensity, radius: m(0.005), length: m(0.01), radialDistance: m(1), axialDistance: m(0) });
    expect(far.cautions).toEqual([]);
  });
});
