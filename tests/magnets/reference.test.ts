// The cylinder magnet's axial field: a decimal.js oracle of the published
// difference form, the equivalent solenoid (surface current M = B_r / mu0)
// through the existing solenoidAxialField and the Biot-Savart solver, and the
// dipole limit far away.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cylinderMagnetAxialField, solenoidAxialField, type Current, type FluxDensity, type Length } from "../../src/index.js";
import { MU0 } from "../../src/constants/si.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { cylinderOracle } from "./oracle.js";
import { stackedLoopsField } from "../helpers/stacked-loops.js";

const m = (v: number) => v as Length;
const field = (br: number, r: number, l: number, z: number) =>
  cylinderMagnetAxialField({ remanence: br as FluxDensity, radius: m(r), length: m(l), axialDistance: m(z) }) as number;

describe("cylinderMagnetAxialField", () => {
  it("matches a decimal.js oracle of the published form inside, at the faces, nearby and far away", () => {
    for (const [r, l, z] of [[5e-3, 1e-2, 1e-2], [5e-3, 1e-2, 0], [5e-3, 1e-2, 5e-3], [5e-3, 1e-2, -5e-3], [1, 0.1, 3], [1, 0.1, -1e6], [0.01, 0.5, 2e4], [1e-3, 1e-3, 0.9e-3]] as const) {
      expectClose(field(1.3, r, l, z), { input: { r, l, z }, expected: cylinderOracle(1.3, r, l, z).toNumber(), tolerance: 8 * Number.EPSILON, source: "decimal.js oracle of Furlani (2001), ch. 4 axial field (from memory)" });
    }
  });

  it("equals the field of the equivalent solenoid (N I = B_r L / mu0) from solenoidAxialField", () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), (r, l, z) => {
      const br = 1.2;
      const sol = solenoidAxialField({ current: ((br * l) / (MU0 * 1000)) as Current, turns: 1000, radius: m(r), length: m(l), axialPosition: m(z) }) as number;
      expect(relativeError(field(br, r, l, z), sol)).toBeLessThan(1e-9);
    }));
  });

  it("agrees with the Biot-Savart solver on the equivalent surface current, 400 loops of 2000-gons", () => {
    const r = 0.01, l = 0.02, br = 1.3, loops = 400, sides = 2000;
    const points = new Float64Array([0, 0, 0.015, 0, 0, 0.002, 0, 0, -0.04]);
    // Surface current M times the strip width, loops by the midpoint rule along the side surface.
    const total = stackedLoopsField(r, l, loops, sides, (br / MU0) * (l / loops), points);
    for (let p = 0; p < 3; p++) {
      // Polygon and midpoint-rule errors are both O(1e-5) here.
      expect(relativeError(total[3 * p + 2]!, field(br, r, l, points[3 * p + 2]!))).toBeLessThan(1e-4);
    }
  });

  it("tends to the dipole field B_r R^2 L / (2 z^3) far away, and is even in z", () => {
    const r = 0.005, l = 0.01;
    for (const z of [1, 10, 1e3, 1e8]) {
      const dipole = (1.3 * r * r * l) / (2 * z ** 3);
      expect(relativeError(field(1.3, r, l, z), dipole)).toBeLessThan(1e-4 / z ** 2 + 4 * Number.EPSILON);
      expect(field(1.3, r, l, -z)).toBe(field(1.3, r, l, z));
    }
  });
});
