// Series and parallel combination of two capacitors: registered formulas,
// checked against 50-digit decimal.js evaluations of C1 C2 / (C1 + C2) and
// C1 + C2, with circuit identities as properties.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluate, getFormula, parallelCapacitance, quantity, seriesCapacitance, type Capacitance } from "../../src/index.js";
import { exact, relErr } from "./oracle.js";
import { expectFormulaError } from "../helpers/errors.js";

const EPS = Number.EPSILON;
const F = (v: number) => v as Capacitance;
const cap = fc.double({ min: -300, max: 300, noNaN: true }).map((p) => 10 ** p);
const series = (a: number, b: number) => seriesCapacitance({ capacitance1: F(a), capacitance2: F(b) });
const parallel = (a: number, b: number) => parallelCapacitance({ capacitance1: F(a), capacitance2: F(b) });

describe("series and parallel capacitance", () => {
  it("are registered formulas that evaluate unit strings", () => {
    expect(getFormula("seriesCapacitance").definition.inputs).toHaveProperty("capacitance2");
    const s = evaluate("seriesCapacitance", { capacitance1: "10 nF", capacitance2: "10 nF" });
    const p = evaluate("parallelCapacitance", { capacitance1: "10 nF", capacitance2: "22 nF" });
    expect(s.unit).toBe("F");
    // Two equal capacitors in series halve (common practice); 10 nF + 22 nF in parallel.
    expect(relErr(s.value as number, exact(5e-9))).toBeLessThan(2 * EPS);
    expect(relErr(p.value as number, exact(10e-9).plus(exact(22e-9)))).toBeLessThan(EPS);
    expect(relErr(seriesCapacitance({ capacitance1: quantity(10, "nF"), capacitance2: quantity(10, "nF") }), exact(5e-9))).toBeLessThan(2 * EPS);
  });

  it("series capacitance is within 1.5 ulp of C1 C2 / (C1 + C2) in 50-digit decimals, from 1e-300 F to 1e300 F", () => {
    fc.assert(
      fc.property(cap, cap, (a, b) => {
        const want = exact(a).times(exact(b)).div(exact(a).plus(exact(b)));
        expect(relErr(series(a, b), want)).toBeLessThanOrEqual(1.5 * EPS);
      }),
      { numRuns: 500 },
    );
  });

  it("parallel capacitance is the correctly rounded sum, and out_of_range only when the sum overflows", () => {
    fc.assert(
      fc.property(cap, cap, (a, b) => {
        const want = exact(a).plus(exact(b));
        expect(relErr(parallel(a, b), want)).toBeLessThanOrEqual(0.5 * EPS);
      }),
      { numRuns: 500 },
    );
    expect(expectFormulaError(() => parallel(1e308, 1e308)).code).toBe("out_of_range");
    expect(parallel(8e307, 8e307)).toBe(1.6e308);
  });

  it("series capacitance never exceeds the smaller capacitor and is symmetric", () => {
    fc.assert(
      fc.property(cap, cap, (a, b) => {
        expect(series(a, b)).toBeLessThanOrEqual(Math.min(a, b));
        expect(series(b, a)).toBe(series(a, b));
        expect(parallel(b, a)).toBe(parallel(a, b));
      }),
    );
  });

  it("keeps the issue's extremes: 1e308 F with 1e308 F in series is 5e307 F, 1e-200 F with 1e200 F is 1e-200 F", () => {
    expect(series(1e308, 1e308)).toBe(5e307);
    expect(series(1e-200, 1e200)).toBe(1e-200);
    expect(series(5e-324 * 2 ** 60, 5e-324 * 2 ** 60)).toBe(5e-324 * 2 ** 59);
  });

  it("bad inputs fail with a FormulaError code naming the input", () => {
    const neg = expectFormulaError(() => evaluate("seriesCapacitance", { capacitance1: "1 nF", capacitance2: "-1 nF" }));
    expect([neg.code, neg.input]).toEqual(["out_of_domain", "capacitance2"]);
    const zero = expectFormulaError(() => parallel(0, 1e-9));
    expect([zero.code, zero.input]).toEqual(["out_of_domain", "capacitance1"]);
    const nan = expectFormulaError(() => series(1e-9, Number.NaN));
    expect([nan.code, nan.input]).toEqual(["not_finite", "capacitance2"]);
    const missing = expectFormulaError(() => evaluate("parallelCapacitance", { capacitance1: "1 nF" }));
    expect([missing.code, missing.input]).toEqual(["missing_input", "capacitance2"]);
  });
});
