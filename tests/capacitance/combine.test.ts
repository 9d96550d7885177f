// Series and parallel combination: textbook identities as properties, a
// decimal.js oracle for the series sum, and errors for unusable lists.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parallelCapacitance, quantity, seriesCapacitance, type Capacitance } from "../../src/index.js";
import { exact, relErr } from "./oracle.js";
import { expectFormulaError } from "../helpers/errors.js";

const cap = fc.double({ min: -300, max: 300, noNaN: true }).map((p) => (10 ** p) as Capacitance);
const caps = fc.array(cap, { minLength: 1, maxLength: 12 });
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);


describe("series and parallel capacitance", () => {
  it("two 10 nF capacitors give 5 nF in series and 20 nF in parallel", () => {
    const c = quantity(10, "nF");
    expect(rel(seriesCapacitance(c, c), 5e-9)).toBeLessThan(1e-15);
    expect(rel(parallelCapacitance(c, c), 20e-9)).toBeLessThan(1e-15);
  });

  it("series capacitance is within 1e-14 of 1 / sum(1 / C_i) computed in 50-digit decimals, for values from 1e-300 F to 1e300 F", () => {
    fc.assert(
      fc.property(caps, (cs) => {
        const inv = cs.reduce((s, c) => s.plus(exact(1).div(exact(c))), exact(0));
        const want = exact(1).div(inv);
        expect(relErr(seriesCapacitance(...cs), want)).toBeLessThan(1e-14);
      }),
      { numRuns: 300 },
    );
  });

  it("series capacitance never exceeds the smallest capacitor, and n equal capacitors give C / n", () => {
    fc.assert(
      fc.property(caps, fc.integer({ min: 1, max: 50 }), (cs, n) => {
        expect(seriesCapacitance(...cs)).toBeLessThanOrEqual(Math.min(...cs));
        const c = cs[0]!;
        expect(rel(seriesCapacitance(...Array<Capacitance>(n).fill(c)), c / n)).toBeLessThan(1e-14);
      }),
    );
  });

  it("parallel capacitance is the sum and at least the largest capacitor", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 1e-15, max: 1, noNaN: true }).map((v) => v as Capacitance), { minLength: 1, maxLength: 12 }), (cs) => {
        const want = cs.reduce((s, c) => s.plus(exact(c)), exact(0));
        expect(relErr(parallelCapacitance(...cs), want)).toBeLessThan(1e-14);
        expect(parallelCapacitance(...cs)).toBeGreaterThanOrEqual(Math.max(...cs));
      }),
    );
  });

  it("series and parallel are symmetric in the order of the capacitors", () => {
    fc.assert(
      fc.property(caps, (cs) => {
        const rev = [...cs].reverse();
        expect(rel(seriesCapacitance(...rev), seriesCapacitance(...cs))).toBeLessThan(1e-14);
        expect(rel(parallelCapacitance(...rev), parallelCapacitance(...cs))).toBeLessThan(1e-14);
      }),
    );
  });

  it("unusable lists fail with a FormulaError code naming the offending entry", () => {
    for (const f of [seriesCapacitance, parallelCapacitance]) {
      expect(expectFormulaError(() => f()).code).toBe("invalid_argument");
      const neg = expectFormulaError(() => f(1e-9 as Capacitance, -1e-9 as Capacitance));
      expect([neg.code, neg.input]).toEqual(["out_of_domain", "capacitances[1]"]);
      expect(expectFormulaError(() => f(0 as Capacitance)).code).toBe("out_of_domain");
      const nan = expectFormulaError(() => f(1e-9 as Capacitance, Number.NaN as Capacitance));
      expect([nan.code, nan.input]).toEqual(["not_finite", "capacitances[1]"]);
      expect(expectFormulaError(() => f(Infinity as Capacitance)).code).toBe("not_finite");
      expect(expectFormulaError(() => f("10 nF" as unknown as Capacitance)).code).toBe("wrong_type");
    }
    expect(expectFormulaError(() => parallelCapacitance(1e308 as Capacitance, 1e308 as Capacitance)).code).toBe("out_of_range");
    expect(seriesCapacitance(1e308 as Capacitance, 1e308 as Capacitance)).toBe(5e307);
    expect(rel(seriesCapacitance(1e-200 as Capacitance, 1e200 as Capacitance), 1e-200)).toBeLessThan(1e-15);
  });
});
