// Error messages are built from the error's fields and never echo a
// program's internals ("Infinity", "NaN", "undefined") for the values quoted.
import { describe, expect, it } from "vitest";
import { evaluate } from "../../src/core/evaluate.js";
import { FormulaError } from "../../src/core/errors.js";
import { expectFormulaError } from "../helpers/errors.js";

describe("error messages", () => {
  it("say non-finite and missing values in words", () => {
    const cases: [unknown, string][] = [
      [Infinity, "a value beyond the double range"], [-Infinity, "minus a value beyond the double range"], [NaN, "not a number"], [undefined, "nothing"],
    ];
    for (const [value, words] of cases) {
      const e = new FormulaError("not_finite", { formula: "f", input: "gap", value });
      expect(e.message).toBe(`f: input "gap" must be a finite number, got ${words}`);
      expect(new FormulaError("wrong_type", { input: "x", value, expected: "a number" }).message).toContain(words);
    }
  });

  it("put free text that quotes a non-finite number into words too", () => {
    const e = new FormulaError("out_of_range", { formula: "f", detail: "gap = Infinity, area = NaN, turns = -Infinity, shape = undefined" });
    expect(e.message).toBe("f: the result is out of the representable range (gap = a value beyond the double range, area = not a number, turns = minus a value beyond the double range, shape = nothing)");
  });

  it("reach users without Infinity or NaN through evaluate", () => {
    for (const gap of [Infinity, -Infinity, NaN]) {
      const e = expectFormulaError(() => evaluate("parallelPlateCapacitance", { area: 1e-4, gap }));
      expect(e.message).not.toMatch(/Infinity|NaN|undefined/);
      expect(e.input).toBe("gap");
    }
  });
});
