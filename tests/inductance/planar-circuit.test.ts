import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MU0 } from "../../src/constants/si.js";
import {
  FormulaError, evaluate, inductorEnergy, parallelInductance, planarSpiralInductance, modifiedWheelerSpiralInductance, seriesInductance,
  type Current, type Inductance, type Length,
} from "../../src/index.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { exact } from "../math/decimal-elliptic.js";

const m = (v: number) => v as Length;
const H = (v: number) => v as Inductance;

describe("planarSpiralInductance (Mohan et al. 1999)", () => {
  it("reproduces the coefficient formula for each shape", () => {
    // Coefficients c1..c4 from Mohan et al. (1999), current-sheet table, from memory.
    const table = { square: [1.27, 2.07, 0.18, 0.13], hexagonal: [1.09, 2.23, 0, 0.17], octagonal: [1.07, 2.29, 0, 0.19], circular: [1, 2.46, 0, 0.2] } as const;
    for (const [shape, [c1, c2, c3, c4]] of Object.entries(table)) {
      const dout = 400e-6;
      const din = 100e-6;
      const rho = (dout - din) / (dout + din);
      const expected = ((MU0 * 36 * ((dout + din) / 2) * c1) / 2) * (Math.log(c2 / rho) + c3 * rho + c4 * rho * rho);
      expectClose(planarSpiralInductance({ turns: 6, outerDiameter: m(dout), innerDiameter: m(din), shape: shape as "square" }), {
        input: shape, expected, tolerance: 1e-14, source: "Mohan et al. (1999) current-sheet expression re-evaluated with the coefficients from memory: a check of the implementation, not a published value",
      });
    }
  });

  it("a circular spiral of small fill ratio approaches a thin flat ring's inductance", () => {
    // A flat strip ring of mean radius R and width w: L = mu0 R n^2 (ln(8R/w) - 1/2), from
    // Maxwell's geometric mean distance of a strip from itself, w e^(-3/2) (Maxwell,
    // Treatise (1873) art. 692; Grover (1946)), from memory. With R = d_avg/2 and
    // w = rho d_avg this is (mu0 n^2 d_avg / 2)(ln(4/rho) - 1/2): Mohan's
    // c2 = 2.46 sits next to 4 e^(-1/2) = 2.43.
    for (const rho of [0.001, 0.01, 0.05, 0.1]) {
      const dout = 1e-3;
      const din = (dout * (1 - rho)) / (1 + rho);
      const davg = (dout + din) / 2;
      const ring = ((MU0 * 9 * davg) / 2) * (Math.log(4 / rho) - 0.5);
      const got = planarSpiralInductance({ turns: 3, outerDiameter: m(dout), innerDiameter: m(din), shape: "circular" });
      expect(relativeError(got, ring)).toBeLessThan(0.01);
    }
  });

  it("agrees with the modified Wheeler expression within the paper's error bands", () => {
    // Each expression: typical error 2-3 %, a few cases up to about 8 % (Mohan et al. 1999,
    // from memory); so the two agree within 10 % over fill ratios 0.15 .. 0.95.
    fc.assert(
      fc.property(fc.constantFrom("square", "hexagonal", "octagonal" as const), fc.double({ min: 0.15, max: 0.95, noNaN: true }), fc.integer({ min: 2, max: 20 }), (shape, rho, n) => {
        const dout = 300e-6;
        const din = (dout * (1 - rho)) / (1 + rho);
        const x = { turns: n, outerDiameter: m(dout), innerDiameter: m(din), shape };
        expect(relativeError(planarSpiralInductance(x), modifiedWheelerSpiralInductance(x))).toBeLessThan(0.1);
      }),
    );
  });

  it("scales with n^2 and linearly with the diameters", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 0, max: 0.9, noNaN: true }), (s, t) => {
        const x = { turns: 4, outerDiameter: m(1e-3), innerDiameter: m(t * 1e-3), shape: "octagonal" as const };
        const L = planarSpiralInductance(x);
        const Lw = modifiedWheelerSpiralInductance(x);
        const y = { ...x, outerDiameter: m(s * 1e-3), innerDiameter: m(s * t * 1e-3) };
        expect(relativeError(planarSpiralInductance(y), s * L)).toBeLessThan(1e-13);
        expect(relativeError(modifiedWheelerSpiralInductance(y), s * Lw)).toBeLessThan(1e-13);
        expect(relativeError(planarSpiralInductance({ ...x, turns: 8 }), 4 * L)).toBeLessThan(1e-15);
      }),
    );
  });

  it("rejects an unknown shape, a circular shape for the Wheeler variant, and din >= dout", () => {
    const err = (f: () => unknown) => { try { f(); } catch (e) { return e as FormulaError; } throw new Error("no error"); };
    const e1 = err(() => evaluate("planarSpiralInductance", { turns: 3, outerDiameter: "1 mm", innerDiameter: "0.5 mm", shape: "triangle" }));
    expect(e1.code).toBe("out_of_domain");
    expect(e1.input).toBe("shape");
    const e2 = err(() => evaluate("modifiedWheelerSpiralInductance", { turns: 3, outerDiameter: "1 mm", innerDiameter: "0.5 mm", shape: "circular" }));
    expect(e2.input).toBe("shape");
    const e3 = err(() => evaluate("planarSpiralInductance", { turns: 3, outerDiameter: "1 mm", innerDiameter: "1 mm" }));
    expect(e3.rule).toBe("innerDiameter < outerDiameter");
    expect(evaluate("planarSpiralInductance", { turns: 1, outerDiameter: "1 mm", innerDiameter: "0.8 mm" }).warnings.map((w) => w.code)).toContain("single_turn");
  });
});

describe("inductorEnergy", () => {
  it("is L I^2 / 2 for either sign of the current", () => {
    expect(inductorEnergy({ inductance: H(0.01), current: 5 as Current })).toBe(0.125);
    const r = evaluate("inductorEnergy", { inductance: "10 mH", current: "-5 A" });
    expect(r.value).toBeCloseTo(0.125, 15);
    expect(r.unit).toBe("J");
  });

  it("cautions about stored energy from the 20 J hazardous energy level on, and not below", () => {
    // 20 J: the hazardous energy level of IEC 60950-1:2005, 1.2.8.10 (from memory), as in src/core/hazards.ts.
    const notes = (L: string, I: string) => evaluate("inductorEnergy", { inductance: L, current: I }).cautions;
    expect(notes("10 mH", "5 A")).toEqual([]); // 0.125 J
    expect(notes("1 nH", "1 mA")).toEqual([]); // 0.5 fJ: no caution on a signal inductor
    expect(notes("0.4 H", "9.9 A").map((c) => c.code)).toEqual([]); // 19.6 J, just below
    const big = notes("1 H", "10 A"); // 50 J
    expect(big.map((c) => c.code)).toEqual(["stored_energy"]);
    expect(big[0]!.message).toMatch(/50 J stored.*20 J.*IEC 60950-1.*Local codes, standards and licensed practice govern/);
  });

  it("reports the worst point of a bulk run by the stored energy (measure)", () => {
    const caution = inductorEnergy.definition.cautions!.find((c) => c.code === "stored_energy")!;
    expect(caution.measure!({ inductance: 1, current: 10 } as never, 50)).toBe(50);
  });
});

describe("seriesInductance and parallelInductance", () => {
  it("series is L1 + L2 +/- 2M", () => {
    expect(seriesInductance({ inductance1: H(1e-5), inductance2: H(2e-5), mutualInductance: H(5e-6) })).toBeCloseTo(4e-5, 18);
    expect(seriesInductance({ inductance1: H(1e-5), inductance2: H(2e-5), mutualInductance: H(5e-6), connection: "opposing" })).toBeCloseTo(2e-5, 18);
  });

  it("series opposing keeps its digits for a tightly coupled pair (decimal.js oracle)", () => {
    for (const g of [1e-3, 1e-8, 1e-12]) {
      const L1 = 1e-3;
      const L2 = 1.0000001e-3;
      const M = Math.sqrt(L1 * L2) * (1 - g);
      const ex = exact(L1).plus(exact(L2)).minus(exact(M).times(2)).toNumber();
      expectClose(seriesInductance({ inductance1: H(L1), inductance2: H(L2), mutualInductance: H(M), connection: "opposing" }), {
        input: { L1, L2, M }, expected: ex, tolerance: 4e-16, source: "decimal.js oracle of L1 + L2 - 2M",
      });
    }
  });

  it("parallel keeps its digits for a tightly coupled pair (decimal.js oracle)", () => {
    for (const g of [1e-3, 1e-8, 1e-12]) {
      const L1 = 1e-3;
      const L2 = 1.0000001e-3;
      const M = Math.sqrt(L1 * L2) * (1 - g);
      const ex = exact(L1).times(exact(L2)).minus(exact(M).pow(2)).div(exact(L1).plus(exact(L2)).minus(exact(M).times(2))).toNumber();
      expectClose(parallelInductance({ inductance1: H(L1), inductance2: H(L2), mutualInductance: H(M) }), {
        input: { L1, L2, M }, expected: ex, tolerance: 1e-15, source: "decimal.js oracle of (L1 L2 - M^2)/(L1 + L2 - 2M)",
      });
    }
  });

  it("parallel equals the inverse of the summed inverse inductance matrix", () => {
    // Two coupled coils in parallel: V = L1 i1' + M i2' = M i1' + L2 i2'; the total
    // inductance is 1 / (sum of the entries of the inverse matrix [[L1, +/-M], [+/-M, L2]]^-1).
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e-3, noNaN: true }), fc.double({ min: 1e-6, max: 1e-3, noNaN: true }), fc.double({ min: 0, max: 0.99, noNaN: true }), fc.boolean(), (L1, L2, k, aiding) => {
        const M = k * Math.sqrt(L1 * L2);
        const s = aiding ? M : -M;
        const det = L1 * L2 - s * s;
        const sumInv = (L2 + L1 - 2 * s) / det;
        const got = parallelInductance({ inductance1: H(L1), inductance2: H(L2), mutualInductance: H(M), connection: aiding ? "aiding" : "opposing" });
        expect(relativeError(got, 1 / sumInv)).toBeLessThan(1e-9);
      }),
    );
    expect(parallelInductance({ inductance1: H(1e-5), inductance2: H(1e-5) })).toBeCloseTo(5e-6, 18);
    expect(parallelInductance({ inductance1: H(1e-5), inductance2: H(1e-5), mutualInductance: H(1e-5) })).toBe(1e-5);
  });

  it("warns when a coupling a hair above 1 (within the relation's rounding tolerance) is clamped to 0", () => {
    // L1 = L2 = 1 uH, M = 1 uH (1 + 1e-13): k - 1 = 1e-13 passes the relation's 1e-12 tolerance,
    // and both L1 + L2 - 2M and L1 L2 - M^2 come out negative.
    // The perfectly coupled limits: series opposing 0; parallel aiding of equal coils L1, opposing 0.
    const M = "1.0000000000001 uH";
    const cases = [["seriesInductance", "opposing", 0], ["parallelInductance", "aiding", 1e-6], ["parallelInductance", "opposing", 0]] as const;
    for (const [id, connection, limit] of cases) {
      const r = evaluate(id, { inductance1: "1 uH", inductance2: "1 uH", mutualInductance: M, connection });
      expect(r.value).toBeCloseTo(limit, 20);
      expect(r.warnings.map((w) => w.code)).toEqual(["coupling_clamped"]);
      expect(r.warnings[0]!.message).toMatch(/perfectly coupled/);
    }
    // No warning at perfect coupling or below it.
    expect(evaluate("seriesInductance", { inductance1: "1 uH", inductance2: "1 uH", mutualInductance: "1 uH", connection: "opposing" }).warnings).toEqual([]);
    expect(evaluate("parallelInductance", { inductance1: "1 uH", inductance2: "4 uH", mutualInductance: "1.9 uH" }).warnings).toEqual([]);
  });

  it("rejects a mutual inductance above sqrt(L1 L2)", () => {
    expect(() => evaluate("seriesInductance", { inductance1: "1 uH", inductance2: "1 uH", mutualInductance: "2 uH" })).toThrow(/coupling coefficient at most 1/);
  });
});
