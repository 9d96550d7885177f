import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError, biotSavart, loopAxialField, loopField, wireField, type Current, type Length } from "../../src/index.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { D, MU0, PI, exact } from "./oracle.js";

const MU0_NUM = MU0.toNumber();

/** Closed regular polygon with n sides inscribed in a circle of radius R in the plane z = 0, centred on the z axis. */
function polygon(n: number, R: number): Float64Array {
  const p = new Float64Array(3 * (n + 1));
  for (let i = 0; i <= n; i++) {
    const t = (2 * Math.PI * (i % n)) / n;
    p[3 * i] = R * Math.cos(t);
    p[3 * i + 1] = R * Math.sin(t);
  }
  return p;
}

describe("biotSavart", () => {
  it("gives the exact field at the centre of a regular polygon, (n / pi) tan(pi / n) mu0 I / (2R)", () => {
    // Griffiths, Introduction to Electrodynamics 4th ed., Problem 5.8 (square and n-gon loops; from memory);
    // the n-gon value follows from n finite segments; decimal.js oracle.
    for (const n of [3, 4, 7, 64]) {
      const expected = new D(n).div(PI).times(D.tan(PI.div(n))).times(MU0).times(2).div(new D(2).times("0.25")).toNumber();
      const b = biotSavart(polygon(n, 0.25), 2, new Float64Array([0, 0, 0]));
      expectClose(b[2]!, { input: { n }, expected, tolerance: 1e-13, source: "n-gon centre field, decimal.js oracle" });
      expect(Math.abs(b[0]!) + Math.abs(b[1]!)).toBeLessThan(1e-12 * Math.abs(b[2]!));
    }
  });

  it("converges to loopAxialField and loopField as the polygon's sides multiply, with error ~ 1/n^2", () => {
    const pts = new Float64Array([0, 0, 0.05, 0.05, 0, 0.05, 0.15, 0, 0.02, 0.3, 0, -0.1]);
    const exactField = [
      [0, loopAxialField({ current: 1 as Current, radius: 0.1 as Length, axialDistance: 0.05 as Length })],
      loopField({ current: 1 as Current, radius: 0.1 as Length, radialDistance: 0.05 as Length, axialDistance: 0.05 as Length }),
      loopField({ current: 1 as Current, radius: 0.1 as Length, radialDistance: 0.15 as Length, axialDistance: 0.02 as Length }),
      loopField({ current: 1 as Current, radius: 0.1 as Length, radialDistance: 0.3 as Length, axialDistance: -0.1 as Length }),
    ];
    const errors: number[] = [];
    for (const n of [64, 128, 256, 4096]) {
      const b = biotSavart(polygon(n, 0.1), 1, pts);
      let worst = 0;
      exactField.forEach(([br, bz], i) => {
        // Points lie in the x-z plane (y = 0): radial = x component.
        const scale = Math.hypot(br!, bz!);
        worst = Math.max(worst, Math.hypot(b[3 * i]! - br!, b[3 * i + 1]!, b[3 * i + 2]! - bz!) / scale);
      });
      errors.push(worst);
    }
    // Measured worst error: 2.9e-3 at n = 64, 7.2e-4 at 128, 1.8e-4 at 256, 7.0e-7 at 4096 (about 12 / n^2).
    expect(errors[0]! / errors[1]!).toBeGreaterThan(3.5);
    expect(errors[1]! / errors[2]!).toBeGreaterThan(3.5);
    expect(errors[3]!).toBeLessThan(2e-6);
  });

  it("approaches wireField for a long straight polyline, and matches the finite-wire closed form", () => {
    const L = 1e4, d = 0.2, n = 1000;
    const path = new Float64Array(3 * (n + 1));
    for (let i = 0; i <= n; i++) path[3 * i + 2] = -L + (2 * L * i) / n;
    const b = biotSavart(path, 3, new Float64Array([d, 0, 0.37]));
    const infinite = wireField({ current: 3 as Current, distance: d as Length });
    expect(relativeError(b[1]!, infinite)).toBeLessThan(1e-8); // end correction ~ d^2 / L^2 = 4e-10
    // Finite segment: B = mu0 I / (4 pi d) (sin theta2 - sin theta1), decimal.js oracle.
    const z = exact(0.37), Ld = exact(L), dd = exact(d);
    const s2 = Ld.minus(z).div(Ld.minus(z).pow(2).plus(dd.pow(2)).sqrt());
    const s1 = Ld.neg().minus(z).div(Ld.neg().minus(z).pow(2).plus(dd.pow(2)).sqrt());
    const finite = MU0.times(3).div(PI.times(4).times(dd)).times(s2.minus(s1)).toNumber();
    expectClose(b[1]!, { input: { L, d }, expected: finite, tolerance: 1e-12, source: "finite straight wire, decimal.js oracle" });
    expect(Math.abs(b[0]!) + Math.abs(b[2]!)).toBeLessThan(1e-15 * Math.abs(b[1]!));
  });

  it("satisfies Ampere's law: the line integral of B around a closed path is mu0 I when it links the conductor (fast-check)", () => {
    // Conductor: a closed 2 m x 2 m square in z = 0. Path: a circle around the side x = 1, in the plane y = y0.
    const square = new Float64Array([1, -1, 0, 1, 1, 0, -1, 1, 0, -1, -1, 0, 1, -1, 0]);
    const n = 256;
    const pts = new Float64Array(3 * n);
    fc.assert(
      fc.property(
        fc.double({ min: -0.6, max: 0.6, noNaN: true }),
        fc.double({ min: 0.02, max: 0.3, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }).filter((i) => Math.abs(i) > 1e-3),
        fc.boolean(),
        (y0, r, I, linked) => {
          const cx = linked ? 1 : 0.5; // centred on the wire, or a circle that does not reach it
          for (let k = 0; k < n; k++) {
            const t = (2 * Math.PI * k) / n;
            pts[3 * k] = cx + r * Math.cos(t);
            pts[3 * k + 1] = y0;
            pts[3 * k + 2] = r * Math.sin(t);
          }
          const b = biotSavart(square, I, pts);
          // Trapezoid rule on a periodic integrand (spectrally accurate): dl = r dt (-sin t, 0, cos t).
          let sum = 0;
          for (let k = 0; k < n; k++) {
            const t = (2 * Math.PI * k) / n;
            sum += (-b[3 * k]! * Math.sin(t) + b[3 * k + 2]! * Math.cos(t)) * r;
          }
          const circulation = (sum * 2 * Math.PI) / n;
          // Current along +y on the side x = 1; the circle (x - 1, z) turns from +x towards +z, so the normal is -y.
          const expected = linked ? -MU0_NUM * I : 0;
          expect(Math.abs(circulation - expected)).toBeLessThan(1e-9 * MU0_NUM * Math.abs(I));
        },
      ),
      { numRuns: 60 },
    );
  });

  it("is linear in current and stays finite on the conductor and at its vertices", () => {
    const path = polygon(8, 1);
    const pts = new Float64Array([1, 0, 0, (1 + Math.cos(Math.PI / 4)) / 2, Math.sin(Math.PI / 4) / 2, 0, 0.3, 0.1, 0.2, 5, 5, 5]);
    const b1 = biotSavart(path, 1, pts);
    const b7 = biotSavart(path, -7, pts);
    for (let i = 0; i < b1.length; i++) {
      expect(Number.isFinite(b1[i]!)).toBe(true);
      expect(Math.abs(b7[i]! + 7 * b1[i]!)).toBeLessThanOrEqual(1e-15 * 7 * Math.abs(b1[i]!) + 1e-300);
    }
  });

  it("rejects malformed arrays and non-finite values with invalid_argument", () => {
    const code = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return (e as FormulaError).code + ":" + (e as FormulaError).input;
      }
      return "no error";
    };
    const ok = new Float64Array([0, 0, 0, 1, 0, 0]);
    expect(code(() => biotSavart(new Float64Array([0, 0, 0]), 1, ok))).toBe("invalid_argument:path");
    expect(code(() => biotSavart([0, 0, 0, 1, 0, 0] as never, 1, ok))).toBe("invalid_argument:path");
    expect(code(() => biotSavart(ok, 1, new Float64Array([0, 0])))).toBe("invalid_argument:points");
    expect(code(() => biotSavart(ok, 1, new Float64Array([0, Number.NaN, 0])))).toBe("invalid_argument:points");
    expect(code(() => biotSavart(ok, Number.POSITIVE_INFINITY, ok))).toBe("invalid_argument:current");
    expect(() => biotSavart(ok, 1, ok)).not.toThrow(FormulaError);
  });
});
