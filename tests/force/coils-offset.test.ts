// coaxialCoilsForce for nearly concentric coils: centre distances from 1e-2 of a length
// down to subnormal ones, where the force falls with the offset (as d for most coils, as
// d ln(1/d) for identical ones). Checked against tests/force/coils-offset-oracle.ts, the
// derivative of Maxwell's mutual inductance integrated over both windings (Treatise (1873),
// art. 701) written as two integrals of m0 over windows of width 2d (no cancellation as
// d -> 0), itself checked against the double integral of Babic and Akyel's (2008) filament
// force (tests/force/coils-oracle.ts) where both converge, and against its own leading term
// (no quadrature) at the least offsets. The bound is 1e-14 relative (the target is
// 1e-12); subnormal results within one subnormal step (the range policy of src/math/scaled.ts).
import { describe, expect, it } from "vitest";
import { coaxialCoilsForce, coaxialCoilsMutualInductance, coaxialLoopsForce, FormulaError, type Current, type Length } from "../../src/index.js";
import { coaxialSheetsOracle } from "../inductance/oracle.js";
import { dec, type Dec } from "../math/decimal-elliptic.js";
import { coilsAttractionOracle } from "./coils-oracle.js";
import { concentricAttraction, offsetAttractionOracle } from "./coils-offset-oracle.js";
import { FLAT_CASES, LEADING_CASES, OFFSET_CASES, OFFSET_GEOMETRIES, OFFSETS, WINDOW_VS_DOUBLE, type Coils, type CoilsAt } from "./coils-cases.js";
import { storedAttraction } from "./coils-fixture.js";
import { loopsForceOracleDecimal } from "./loops-oracle.js";
import { MU0 } from "./oracle.js";

const m = (v: number) => v as Length;
const I1 = 2.5, N1 = 40, I2 = -1.5, N2 = 25;
const force = ([a, l1, b, l2]: Coils, d: number, i1 = I1, i2 = I2) =>
  coaxialCoilsForce({
    current1: i1 as Current, turns1: N1, radius1: m(a), length1: m(l1),
    current2: i2 as Current, turns2: N2, radius2: m(b), length2: m(l2), distance: m(d),
  }) as number;
/** The force in N from an attraction G in m (mu0 from the CODATA 2022 string). */
const newtons = (g: Dec, i1 = I1, i2 = I2): Dec => g.times(MU0).times(i1).times(i2).times(N1).times(N2);
const relative = (x: Dec, y: Dec): number => x.minus(y).div(y).abs().toNumber();

// The cases (tests/force/coils-cases.ts) and the window oracle's values for them are in the fixture
// tests/force/fixtures/coils-oracle.json (written by npx tsx tests/force/make-coils-fixture.ts, 40 digits):
// the library is compared with the stored values for every case, and a few are recomputed live below.
const window = (c: CoilsAt): Dec => storedAttraction("window", c);
// Identical coils at the least offset (log-singular m0), nested coils, flat coils of unequal radii 1e-160 of a radius long.
const LIVE_WINDOW_CASES: readonly CoilsAt[] = [[1, 1, 1, 1, 1e-200], [1, 4, 0.5, 1, 4e-5], FLAT_CASES[2]!];

describe("coaxialCoilsForce for nearly concentric coils (window oracle of Maxwell's M)", () => {
  it("the window oracle agrees with the double integral of the filament force where both converge", () => {
    // Identical coils 1e-20 of a length off centre: the double integral's signed integrand cancels to
    // 1e-20 of itself (it needs 45 points a panel there); before, with 24 points, it came out 2e-19 off.
    // Both oracles' stored values, every case (the fixture script asserts the same when it writes them):
    for (const c of WINDOW_VS_DOUBLE) {
      expect(relative(window(c), storedAttraction("filament", c)), `${c}`).toBeLessThan(1e-22);
    }
    // and both recomputed live for one case.
    const live: CoilsAt = [1, 1, 0.8, 1, 1e-3];
    expect(relative(offsetAttractionOracle(...live), coilsAttractionOracle(...live)), `${live}`).toBeLessThan(1e-22);
  }, 120_000);

  it("the fixture holds the window oracle's values: a few recomputed live agree to its 40 digits", () => {
    for (const c of LIVE_WINDOW_CASES) {
      expect(relative(offsetAttractionOracle(...c), window(c)), `${c}`).toBeLessThan(1e-38);
    }
  }, 120_000);

  it("the window oracle tends to its leading term: 2d [m0(c) - m0(s)], and 2d [a (ln(8a/d) - 1) - m0(s)] for identical coils", () => {
    for (const c of LEADING_CASES) {
      // The next term is O((d / min(a, c))^2 ln): 1e-40 relative at d = 1e-20.
      expect(relative(concentricAttraction(...c), window(c)), `${c}`).toBeLessThan(1e-35);
    }
  });

  it("identical coils: the force falls as d ln(1/d), not as d (the slope at d = 0 is infinite); others as d", () => {
    const slope = (c: Coils, d: number) => force(c, d) / d;
    // Identical coils: G / d = 2 [a (ln(8a/d) - 1) - m0(l)] / l^2 grows by 2 a ln(10^180) / l^2 = 829 from 1e-20 to 1e-200.
    const identical: Coils = [1, 1, 1, 1];
    const step = newtons(dec(40)(2 * Math.log(1e180))).toNumber();
    expect(Math.abs((slope(identical, 1e-200) - slope(identical, 1e-20)) / step - 1)).toBeLessThan(1e-12);
    const nested: Coils = [1, 4, 0.5, 1];
    expect(Math.abs(slope(nested, 1e-200) / slope(nested, 1e-20) - 1)).toBeLessThan(1e-14);
  });

  it("agrees with the window oracle to 1e-14 from 1e-2 to 1e-200 of a length off centre", () => {
    const wrong: string[] = [];
    let worst = 0;
    expect(OFFSET_CASES).toHaveLength(OFFSET_GEOMETRIES.length * OFFSETS.length);
    for (const c of OFFSET_CASES) {
      const [a, l1, b, l2, d] = c;
      const err = relative(new (dec(40))(force([a, l1, b, l2], d)), newtons(window(c)));
      worst = Math.max(worst, err);
      if (!(err < 1e-14)) wrong.push(`${c}: ${err.toExponential(2)}`);
    }
    console.log(`coaxialCoilsForce nearly concentric, worst relative error ${worst.toExponential(1)}`);
    expect(wrong).toEqual([]);
  });

  it("flat coils of unequal radii, lengths 1e-200 and 1e-300 of a radius: the window oracle (any offset)", () => {
    // The sum's terms are of the size of the lengths squared there: it came out 0 (1e-200) or 2e-5 off (1e-160).
    // Lengths 1e-160, 1e-200 and 1e-300 of a radius, offsets 3, 0.5 and 1e-3 of the length.
    for (const c of FLAT_CASES) {
      const [a, l1, b, l2, d] = c;
      expect(relative(new (dec(40))(force([a, l1, b, l2], d)), newtons(window(c))), `${c}`).toBeLessThan(1e-14);
    }
  });

  it("subnormal offsets: the force is the leading term times d, to one subnormal step; below 2^-1074 out_of_range", () => {
    // Before, the overlap weights (of order d) made subnormal products: 1.6e-7 off at d = 4e-315 m and 0
    // instead of 5.4e-317 N at d = 2e-323 m (nested coils 1, 4 / 0.5, 1 m, 1 kA, 1e4 turns each); and a
    // subnormal distance scaled to unit size lost its bits (0 at d = 5e-324 m).
    const tiny = 2 ** -1074;
    const least = dec(40)(2).pow(-1074); // the range policy: results below the least subnormal are out_of_range
    const wrong: string[] = [];
    for (const c of [[1, 1, 1, 1], [1, 1, 1, 0.7], [1, 4, 0.5, 1], [1, 1, 0.8, 1]] as readonly Coils[]) {
      for (const d of [tiny, 2 * tiny, 1e-322, 1e-320, 1e-315, 1e-310, 2 ** -1022, 1e-305]) {
        for (const i of [1, 1e5]) {
          const want = newtons(concentricAttraction(...c, d), i, -i);
          const exact = want.toNumber();
          if (want.abs().lt(least)) {
            expect(() => force(c, d, i, -i), `${c} at ${d}, ${i} A`).toThrow(FormulaError);
            continue;
          }
          const got = force(c, d, i, -i);
          const err = Math.abs(got - exact);
          if (!(err <= tiny || err <= 1e-14 * Math.abs(exact))) wrong.push(`${c} at ${d}, ${i} A: ${got} vs ${exact}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });
});

describe("coaxialLoopsForce and coaxialCoilsMutualInductance at tiny offsets", () => {
  it("coaxialLoopsForce from 1e-20 m down to subnormal distances: Babic and Akyel's K, E form in decimal", () => {
    // Unequal radii: the force falls as d (to a subnormal step); radii one ulp apart: as mu0 I1 I2 a d / (a - b)^2
    // (the axial part of the parallel-wire force) while d < |a - b|; equal radii: mu0 I1 I2 a / d, until it
    // passes the largest double (out_of_range).
    const wrong: string[] = [];
    for (const [a, b] of [[1, 0.8], [1, 1], [1, 1 - 2 ** -52]] as const) {
      for (const d of [2 ** -1074, 1e-320, 1e-310, 1e-300, 1e-200, 1e-20]) {
        for (const i of [1, 1e10]) {
          const want = loopsForceOracleDecimal(i, i, a, b, d);
          const call = () => coaxialLoopsForce({ current1: i as Current, current2: i as Current, radius1: m(a), radius2: m(b), distance: m(d) }) as number;
          const exact = want.toNumber();
          if (want.abs().lt(dec(40)(2).pow(-1074)) || !Number.isFinite(exact)) {
            expect(call, `${a}, ${b} at ${d}, ${i} A`).toThrow(FormulaError);
            continue;
          }
          const err = Math.abs(call() - exact);
          if (!(err <= 2 ** -1074 || err <= 1e-15 * Math.abs(exact))) wrong.push(`${a}, ${b} at ${d}, ${i} A: ${err / Math.abs(exact)}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });

  it("coaxialCoilsMutualInductance from 1e-20 of a length to a subnormal offset: the difference of Nagaoka sheets in decimal", () => {
    // M is even in d and flat at d = 0 (M(d) - M(0) ~ d^2 ln d): the offset must neither disturb nor be lost.
    for (const [l1, l2] of [[1, 1], [1, 0.7]] as const) {
      for (const d of [2 ** -1074, 1e-310, 1e-200, 1e-20]) {
        const got = coaxialCoilsMutualInductance({ turns1: 1, radius1: m(1), length1: m(l1), turns2: 1, radius2: m(1), length2: m(l2), distance: m(d) }) as number;
        expect(relative(new (dec(40))(got), coaxialSheetsOracle(1, l1, l2, d)), `${l1}, ${l2} at ${d}`).toBeLessThan(4e-15);
      }
    }
  }, 60_000);
});
