// The cylinder magnet's axial field against a decimal.js oracle of the
// published difference form (tests/magnets/oracle.ts),
// from the exact decimal values of the double inputs, over sizes from 1e-200 m
// to 1e200 m, remanences 1e-300..1e300 T, aspect ratios 1e-6..1e6 and distances
// from the centre out to 1e6 magnet sizes (far magnets, where the form cancels).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cylinderMagnetAxialField } from "../../src/index.js";
import { agreesWithOracle, D } from "../capacitance/oracle.js";
import { cylinderOracle } from "./oracle.js";

const EPS = Number.EPSILON;
const worst = new Map<string, number>();
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const signed = (lo: number, hi: number) => fc.tuple(decades(lo, hi), fc.boolean()).map(([v, n]) => (n ? -v : v));

describe("cylinder magnet field against a decimal.js oracle across the double range", () => {
  it("is within 8 ulp of the published axial form, inside, near and far", () => {
    fc.assert(fc.property(signed(-300, 300), decades(-200, 200), decades(-6, 6), fc.oneof(fc.constant(0), signed(-3, 6)), (remanence, radius, aspect, zr) => {
      const length = radius * aspect;
      const axialDistance = zr * Math.max(radius, length);
      fc.pre(Number.isFinite(length) && length > 0 && Number.isFinite(axialDistance));
      agreesWithOracle(cylinderMagnetAxialField, { remanence, radius, length, axialDistance },
        new D(cylinderOracle(remanence, radius, length, axialDistance)), 8 * EPS, worst);
    }), { numRuns: 300 });
  });

  it("reports the worst error measured (in eps)", () => {
    console.log(`magnets worst relative error / eps: ${[...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`).join(", ")}`);
    expect(worst.size).toBe(1);
  });
});
