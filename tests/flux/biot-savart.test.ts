import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError, biotSavart, loopAxialField, loopField, wireField, type Current, type Length } from "../../src/index.js";
import { MAX_PATH_VERTICES, MAX_SEGMENT_POINT_PAIRS } from "../../src/flux/biot-savart.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
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
    // Oracle: n sides, each a finite straight segment at distance d = R cos(pi/n) from the centre,
    // seen under half-angle pi/n: B = n mu0 I / (4 pi d) * 2 sin(pi/n) (the Biot-Savart law for a
    // finite straight segment, B = mu0 I (sin t1 + sin t2) / (4 pi d)), evaluated in decimal.js.
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

  it("is linear in current near the conductor and on the extension of a segment", () => {
    const path = polygon(8, 1);
    // Next to a vertex, next to a side's midpoint, inside, far away, and on the line of the
    // first side beyond its end (no field from that side there: c = 0).
    const c = Math.cos(Math.PI / 4), sn = Math.sin(Math.PI / 4);
    const pts = new Float64Array([1 + 1e-9, 0, 0, (1 + c) / 2, sn / 2, 1e-12, 0.3, 0.1, 0.2, 5, 5, 5, 1 + 0.5 * (1 - c), -0.5 * sn, 0]);
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
    expect(() => biotSavart(ok, 1, new Float64Array([0.5, 1, 0]))).not.toThrow(FormulaError);
    expect(code(() => biotSavart(ok, 1, new Float64Array([0, 0, 1]), undefined, { wireRadius: -1 }))).toBe("invalid_argument:wireRadius");
  });

  it("refuses a field point on the filament (at a vertex or inside a segment) as out_of_range, saying why", () => {
    const path = polygon(8, 1);
    const c = Math.cos(Math.PI / 4), sn = Math.sin(Math.PI / 4);
    for (const p of [[1, 0, 0], [c, sn, 0], [(1 + c) / 2, sn / 2, 0]]) {
      let err: FormulaError | undefined;
      try {
        biotSavart(path, 1, new Float64Array([0, 0, 0.5, ...p]));
      } catch (e) {
        err = e as FormulaError;
      }
      expect(err).toBeInstanceOf(FormulaError);
      expect(err!.code).toBe("out_of_range");
      expect(err!.input).toBe("points");
      expect(err!.message).toContain("point 1 lies on the current filament");
      expect(err!.message).toContain("unbounded");
    }
  });

  it("warns inside_conductor for points closer to a segment than the given wire radius, and not otherwise", () => {
    // A straight wire along x from -1 to 1 m of radius 1 mm: points at 0.5 mm (inside), 2 mm (outside),
    // and 0.5 mm beyond its end (inside the wire's end cap region).
    const wire = new Float64Array([-1, 0, 0, 1, 0, 0]);
    const pts = new Float64Array([0, 5e-4, 0, 0, 2e-3, 0, 1 + 5e-4, 0, 0]);
    const b = biotSavart(wire, 10, pts, undefined, { wireRadius: 1e-3 });
    expect(b.warnings.map((w) => w.code)).toEqual(["inside_conductor"]);
    expect(b.warnings[0]!.message).toContain("2 of 3 field points");
    expect(biotSavart(wire, 10, pts).warnings).toEqual([]); // no radius, no check
    expect(biotSavart(wire, 10, new Float64Array([0, 2e-3, 0]), undefined, { wireRadius: 1e-3 }).warnings).toEqual([]);
  });

  it("refuses inputs above its stated size limits with invalid_argument naming the input", () => {
    const code = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return (e as FormulaError).code + ":" + (e as FormulaError).input;
      }
      return "no error";
    };
    // 10,001 vertices and 100,001 points: 1.0e9 segment-point pairs, just over MAX_SEGMENT_POINT_PAIRS.
    const path = new Float64Array(3 * 10_001).map((_, i) => (i % 3 === 0 ? i : 0));
    const pts = new Float64Array(3 * 100_001).fill(0.5);
    expect(code(() => biotSavart(path, 1, pts))).toBe("invalid_argument:points");
    expect(code(() => biotSavart(new Float64Array(3 * (MAX_PATH_VERTICES + 1)), 1, new Float64Array(3)))).toBe("invalid_argument:path");
    expect(MAX_SEGMENT_POINT_PAIRS).toBe(1e9);
  });

  it("reports its work to the loop counter: points times segments, once per call", () => {
    resetLoopCount();
    biotSavart(polygon(8, 1), 1, new Float64Array([0, 0, 0, 0, 0, 1, 0, 0, 2]));
    expect(loopCount()).toEqual({ total: 24, largest: 24 });
  });
});
