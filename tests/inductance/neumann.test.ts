import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MU0 } from "../../src/constants/si.js";
import { FormulaError, mutualInductance, polylineSelfInductance, type Length } from "../../src/index.js";
import { maxwellMutual } from "../../src/inductance/shared.js";
import { wirePartialSelf } from "../../src/inductance/lines.js";
import { loopInductance } from "../../src/index.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { MAX_SEGMENT_PAIRS, PIECE_BOUND } from "../../src/inductance/neumann.js";
import { dec, exact } from "../math/decimal-elliptic.js";

/** Regular n-gon inscribed in a circle of radius R at height z, closed (last point = first). */
function polygon(n: number, R: number, z: number, phase = 0): Float64Array {
  const p = new Float64Array(3 * (n + 1));
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n + phase;
    p[3 * i] = R * Math.cos(t);
    p[3 * i + 1] = R * Math.sin(t);
    p[3 * i + 2] = z;
  }
  p.copyWithin(3 * n, 0, 3);
  return p;
}

/**
 * Two parallel straight filaments along x, lengths l1 (from 0) and l2 (from s), a distance d apart:
 * M = mu0/(4 pi) [G(s + l2) - G(s + l2 - l1) - G(s) + G(s - l1)], G(u) = u asinh(u/d) - sqrt(u^2 + d^2)
 * (Grover (1946), parallel filaments of unequal length; Rosa (1908)), in 60-digit decimals.
 */
function parallelOracle(l1: number, l2: number, s: number, d: number): number {
  const D = dec(60);
  const dd = exact(d);
  const G = (u: InstanceType<typeof D>) => u.times(u.div(dd).asinh()).minus(u.pow(2).plus(dd.pow(2)).sqrt());
  const S = exact(s);
  const L1 = exact(l1);
  const L2 = exact(l2);
  const sum = G(S.plus(L2)).minus(G(S.plus(L2).minus(L1))).minus(G(S)).plus(G(S.minus(L1)));
  return exact(MU0).div(D.acos(-1).times(4)).times(sum).toNumber();
}

describe("mutualInductance (Neumann's formula for polylines)", () => {
  it("matches the closed form for parallel straight filaments (decimal.js oracle)", () => {
    for (const [l1, l2, s, d] of [[1, 1, 0, 0.01], [1, 1, 0, 1e-4], [1, 1, 0, 100], [1, 0.3, 0.2, 0.05], [1, 2, -0.5, 1e-3], [1, 1, 1, 0.1], [1, 1, 5, 0.1]] as const) {
      const M = mutualInductance([0, 0, 0, l1, 0, 0], [s, d, 0, s + l2, d, 0]);
      expectClose(M, { input: { l1, l2, s, d }, expected: parallelOracle(l1, l2, s, d), tolerance: 1e-12, source: "Grover (1946) parallel filaments, decimal.js oracle" });
    }
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 3, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -3, max: 1, noNaN: true }), (l2, s, lgd) => {
        const d = Math.pow(10, lgd);
        const M = mutualInductance([0, 0, 0, 1, 0, 0], [s, 0, d, s + l2, 0, d]);
        const ex = parallelOracle(1, l2, s, d);
        expect(Math.abs(M - ex)).toBeLessThan(1e-12 * Math.abs(ex) + 1e-22);
      }),
      { numRuns: 60 },
    );
  });

  it("gives zero for perpendicular segments and changes sign with the direction of a path", () => {
    expect(mutualInductance([0, 0, 0, 1, 0, 0], [0.5, 0.2, 0, 0.5, 1, 0])).toBe(0);
    const A = [0, 0, 0, 1, 0, 0, 1, 1, 0.3];
    const B = [0, 0.5, 0.5, 1, 0.7, 0.4, 2, 0.1, 0.9];
    const Br = [2, 0.1, 0.9, 1, 0.7, 0.4, 0, 0.5, 0.5];
    expect(relativeError(mutualInductance(A, Br), -mutualInductance(A, B))).toBeLessThan(1e-13);
  });

  it("converges to Maxwell's formula for coaxial circles as O(1/n^2); extrapolated to 1e-9", () => {
    // Inscribed polygons differ from the circles by O(1/n^2), so M(n) = M + c/n^2 + d/n^4 + ...;
    // two Richardson steps over n = 64, 128, 256 leave O(1/n^6).
    const exact = maxwellMutual(1, 0.7, 0.3);
    const Mn = [64, 128, 256].map((n) => mutualInductance(polygon(n, 1, 0), polygon(n, 0.7, 0.3)));
    const rawErr = relativeError(Mn[2]!, exact);
    expect(rawErr).toBeLessThan(1e-4);
    expect(rawErr).toBeGreaterThan(1e-6); // a polygon is not a circle
    const r1 = (4 * Mn[1]! - Mn[0]!) / 3;
    const r2 = (4 * Mn[2]! - Mn[1]!) / 3;
    expectClose((16 * r2 - r1) / 15, { expected: exact, tolerance: 1e-9, source: "Maxwell (1873) art. 701 (closed form, checked against its decimal oracle)" });
  });

  it("is symmetric, M(A, B) = M(B, A), and scales linearly with all lengths (property)", () => {
    const point = fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }));
    fc.assert(
      fc.property(fc.array(point, { minLength: 2, maxLength: 5 }), fc.array(point, { minLength: 2, maxLength: 5 }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (pa, pb, s) => {
        const A = pa.flat();
        const B = pb.flat().map((v, i) => (i % 3 === 2 ? v + 3 : v)); // keep the paths apart
        const M = mutualInductance(A, B);
        expect(Math.abs(mutualInductance(B, A) - M)).toBeLessThan(1e-12 * Math.abs(M) + 1e-22);
        const Ms = mutualInductance(A.map((v) => v * s), B.map((v) => v * s));
        expect(Math.abs(Ms - s * M)).toBeLessThan(1e-12 * s * Math.abs(M) + 1e-22 * s);
      }),
      { numRuns: 60 },
    );
  });

  it("rejects malformed paths and touching collinear segments with FormulaError", () => {
    const err = (f: () => unknown) => { try { f(); } catch (e) { return e as FormulaError; } throw new Error("no error"); };
    const e1 = err(() => mutualInductance([0, 0, 0, 1, 0], [0, 0, 1, 1, 0, 1]));
    expect(e1).toBeInstanceOf(FormulaError);
    expect(e1.code).toBe("invalid_argument");
    expect(e1.input).toBe("pathA");
    expect(err(() => mutualInductance([0, 0, 0, 1, 0, 0], [0, 0, 1, Number.NaN, 0, 1])).input).toBe("pathB");
    expect(err(() => mutualInductance([0, 0, 0], [0, 0, 1, 1, 0, 1])).code).toBe("invalid_argument");
    expect(err(() => mutualInductance("abc" as unknown as Float64Array, [0, 0, 1, 1, 0, 1])).code).toBe("invalid_argument");
    expect(err(() => mutualInductance([0, 0, 0, 1, 0, 0], [0.5, 0, 0, 2, 0, 0])).code).toBe("out_of_range");
    expect(err(() => mutualInductance([0, 0, 0, 1, 0, 0], [0, 0, 1, 1, 0, 1], { maxDepth: -1 })).input).toBe("maxDepth");
  });
});

describe("polylineSelfInductance", () => {
  it("a straight wire cut into collinear pieces gives Rosa's value plus only the tiny end-term change", () => {
    // Exact identity of the method: with the long-wire self terms and the filament mutual
    // inductance of touching collinear pieces, L(k pieces) = longForm(L) + (c(l1) + c(lk))/2,
    // c(l) = Rosa(l) - longForm(l). This checks the near-singular pair integrals.
    const a = 1e-3;
    const longForm = (l: number) => ((MU0 * l) / (2 * Math.PI)) * (Math.log((2 * l) / a) - 0.75);
    for (const k of [1, 2, 5, 17]) {
      const p = new Float64Array(3 * (k + 1));
      for (let i = 0; i <= k; i++) p[3 * i] = i / k;
      const l = 1 / k;
      const expected = longForm(1) + (wirePartialSelf(l, a) - longForm(l));
      expectClose(polylineSelfInductance(p, a), { input: k, expected, tolerance: 1e-12, source: "identity of the partial-inductance method (Rosa 1908 straight wire)" });
    }
    expect(polylineSelfInductance([0, 0, 0, 0.1, 0, 0], 5e-4)).toBe(wirePartialSelf(0.1, 5e-4));
  });

  it("a square loop matches Grover's square of round wire within the corner uncertainty", () => {
    // Partial inductances: 4 sides, opposite sides as parallel filaments with opposite
    // currents, adjacent sides perpendicular (zero). With Rosa's straight-wire terms this is
    // (2 mu0 s/pi)(ln(s/a) - 0.524 + a/s) (Grover (1946), square of round wire, from memory);
    // the long-wire self terms used here drop the a/s end terms (the corner uncertainty).
    const s = 0.1;
    const a = 5e-4;
    const sq = [0, 0, 0, s, 0, 0, s, s, 0, 0, s, 0, 0, 0, 0];
    const L = polylineSelfInductance(sq, a);
    const filamentOpposite = (MU0 / (2 * Math.PI)) * (s * Math.asinh(1) - Math.SQRT2 * s + s);
    const longForm = ((MU0 * s) / (2 * Math.PI)) * (Math.log((2 * s) / a) - 0.75);
    expectClose(L, { expected: 4 * longForm - 4 * filamentOpposite, tolerance: 1e-13, source: "partial inductances in closed form (Rosa 1908)" });
    const grover = ((2 * MU0 * s) / Math.PI) * (Math.log(s / a) - 0.524 + a / s);
    expect(relativeError(L, grover)).toBeLessThan((2 * a) / s);
  });

  it("a fine polygon converges to the thin circular loop, mu0 R (ln(8R/a) - 7/4)", () => {
    // Error about 0.8/n^2 (times a slowly growing log), measured: 5.5e-5 at n = 256, a/R = 1e-3.
    const R = 0.05;
    const a = 5e-5;
    const L = polylineSelfInductance(polygon(256, R, 0), a);
    const ring = loopInductance({ loopRadius: R as Length, wireRadius: a as Length });
    expect(relativeError(L, ring)).toBeLessThan(1e-4);
  });

  it("rejects a bad wire radius and a path that folds back", () => {
    const err = (f: () => unknown) => { try { f(); } catch (e) { return e as FormulaError; } throw new Error("no error"); };
    expect(err(() => polylineSelfInductance([0, 0, 0, 1, 0, 0], 0)).input).toBe("wireRadius");
    expect(err(() => polylineSelfInductance([0, 0, 0, 1, 0, 0, 0.5, 0, 0], 1e-3)).code).toBe("out_of_range");
  });
});

describe("Neumann's loops are bounded", () => {
  it("refines one pair of segments in at most 1 + 18 maxDepth pieces, even where they touch", () => {
    // Adjacent segments sharing a vertex (the log singularity), a segment ending on another's
    // middle, and two crossing at a small angle within 1e-12 m: the hardest cases for the
    // refinement. The bound is proven in src/inductance/neumann.ts (PIECE_BOUND).
    const cases: [number[], number[]][] = [
      [[0, 0, 0, 1, 0, 0], [1, 0, 0, 1, 1, 0]],
      [[0, 0, 0, 1, 0, 0], [0.5, 1e-300, 0, 0.5, 1, 0]],
      [[0, 0, 0, 1, 0, 0], [0.5, -1, 1e-12, 0.5 + 1e-3, 1, 1e-12]],
      [[0, 0, 0, 1, 0, 0], [1, 0, 0, 2, 1e-3, 0]],
    ];
    let most = 0;
    for (const [a, b] of cases) {
      for (const maxDepth of [0, 10, 40, 60]) {
        resetLoopCount();
        mutualInductance(a, b, { maxDepth });
        const { largest } = loopCount();
        expect(largest).toBeLessThanOrEqual(1 + 18 * maxDepth);
        most = Math.max(most, largest);
      }
    }
    expect(PIECE_BOUND).toBe(1 + 18 * 60);
    expect(most).toBeGreaterThan(40); // the touching cases do refine deeply
  });

  it("refuses more segment pairs than its stated limit with invalid_argument", () => {
    // 1001 segments each: 1,002,001 pairs, just over MAX_SEGMENT_PAIRS (1e6).
    const line = (y: number) => Array.from({ length: 3 * 1002 }, (_, i) => (i % 3 === 0 ? i / 3 : i % 3 === 1 ? y : 0));
    let err: FormulaError | undefined;
    try {
      mutualInductance(line(0), line(1));
    } catch (e) {
      err = e as FormulaError;
    }
    expect(err?.code).toBe("invalid_argument");
    expect(err?.input).toBe("pathB");
    expect(MAX_SEGMENT_PAIRS).toBe(1e6);
  });
});
