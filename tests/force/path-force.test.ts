// The numerical force between two current paths, against closed forms: the
// exact force between two parallel straight segments (the finite-length form
// quoted in parallelWiresForce's documentation), coaxialLoopsForce on fine
// polygons, and Newton's third law.
import { describe, expect, it } from "vitest";
import { coaxialLoopsForce, pathForce, type Current, type Length } from "../../src/index.js";
import { MU0 } from "../../src/constants/si.js";
import { relativeError } from "../helpers/reference.js";
import { codeOf } from "../helpers/errors.js";

function circle(r: number, z: number, sides: number): Float64Array {
  const p = new Float64Array(3 * (sides + 1));
  for (let i = 0; i <= sides; i++) {
    const t = (2 * Math.PI * (i % sides)) / sides;
    p[3 * i] = r * Math.cos(t);
    p[3 * i + 1] = r * Math.sin(t);
    p[3 * i + 2] = z;
  }
  return p;
}

describe("pathForce", () => {
  it("gives the exact force between two parallel segments, mu0 I1 I2 (sqrt(l^2 + d^2) - d) / (2 pi d)", () => {
    // Grover (1946) / Rosa (1908): the force between equal parallel filaments side by side (from memory);
    // it is minus the derivative of their mutual inductance (mu0 l/(2 pi))(asinh(l/d) - sqrt(1 + d^2/l^2) + d/l).
    for (const [l, d] of [[1, 0.01], [1, 0.5], [0.2, 3]] as const) {
      const f = pathForce([0, 0, 0, l, 0, 0], 3, [0, d, 0, l, d, 0], 2);
      const exact = (MU0 * 6 * (Math.hypot(l, d) - d)) / (2 * Math.PI * d);
      expect(f[0]).toBeCloseTo(0, 20);
      expect(f[2]).toBe(0);
      expect(relativeError(-f[1], exact)).toBeLessThan(1e-12); // attraction: path 2 pulled towards -y
    }
  });

  it("agrees with coaxialLoopsForce on 600-gons (polygon error O(1/n^2)), and obeys Newton's third law", () => {
    const a = 0.05, b = 0.03;
    for (const d of [0.02, 0.005]) {
      const f = pathForce(circle(a, 0, 600), 4, circle(b, d, 600), 5);
      const exact = coaxialLoopsForce({ current1: 4 as Current, current2: 5 as Current, radius1: a as Length, radius2: b as Length, distance: d as Length }) as number;
      expect(relativeError(-f[2], exact)).toBeLessThan(1e-4); // attraction pulls loop 2 towards -z
      const back = pathForce(circle(b, d, 600), 5, circle(a, 0, 600), 4);
      expect(relativeError(back[2], -f[2])).toBeLessThan(1e-9);
    }
  });

  it("refuses touching paths and bad input with coded errors", () => {
    expect(codeOf(() => pathForce([0, 0, 0, 1, 0, 0], 1, [0.5, -1, 0, 0.5, 1, 0], 1))).toBe("out_of_range");
    expect(codeOf(() => pathForce([0, 0, 0, 1, 0], 1, [0, 1, 0, 1, 1, 0], 1))).toBe("invalid_argument");
    expect(codeOf(() => pathForce([0, 0, 0, 1, 0, 0], Number.NaN, [0, 1, 0, 1, 1, 0], 1))).toBe("invalid_argument");
    expect(codeOf(() => pathForce([0, 0, 0, 1, 0, Infinity], 1, [0, 1, 0, 1, 1, 0], 1))).toBe("invalid_argument");
  });

  it("refuses, before any work, a job certainly above the field-evaluation cap (naming path2), and counts only segments with a length", () => {
    // Path 1: a straight line of 100,000 segments; path 2: far away, so one 16-point panel per segment.
    const n1 = 100_000;
    const p1 = new Float64Array(3 * (n1 + 1));
    for (let i = 0; i <= n1; i++) p1[3 * i] = i / n1;
    const far = (segments: number, repeats = 0): Float64Array => {
      const p = new Float64Array(3 * (segments + repeats + 1));
      for (let i = 0; i <= segments + repeats; i++) {
        p[3 * i] = Math.min(i, segments) / segments;
        p[3 * i + 1] = 10;
      }
      return p;
    };
    // 626 segments x 16 points x 100,000 segments = 1.0016e9 > 1e9 field evaluations.
    let caught: unknown;
    try {
      pathForce(p1, 1, far(626), 1);
    } catch (e) {
      caught = e;
    }
    expect(caught).toMatchObject({ code: "invalid_argument", input: "path2" });
    expect(String((caught as Error).message)).toMatch(/exceed 1000000000 field evaluations/);
    // 625 segments with a length (1e9, at the cap) and 50 repeated points pass the check:
    // with an aborted signal the call then stops as cancelled (the work itself would take seconds).
    const aborted = AbortSignal.abort();
    expect(codeOf(() => pathForce(p1, 1, far(625, 50), 1, { signal: aborted }))).toBe("cancelled");
    expect(codeOf(() => pathForce(p1, 1, far(626), 1, { signal: aborted }))).toBe("invalid_argument");
  });
});
