/**
 * The unit-string boundary reads the typography engineers paste from data
 * sheets: the micro sign and Greek mu, the ohm sign, superscript powers, the
 * minus sign U+2212 and Unicode spaces, each as its ASCII spelling; ASCII text
 * is read as before.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { parseQuantity } from "../../src/units/parse.js";
import { checkCases, type ReferenceCase } from "../helpers/reference.js";

// Prefix and unit definitions of the SI (BIPM, The International System of Units,
// 9th edition, 2019: micro = 1e-6, centi = 1e-2, kilo = 1e3, mega = 1e6; Ω = V/A). From memory.
const SI = "SI Brochure, 9th ed. (2019), prefixes and derived units (from memory)";
const CASES: ReferenceCase<string>[] = [
  { input: "5 \u00b5m", expected: 5e-6, tolerance: 1e-15, source: SI },
  { input: "5 \u03bcm", expected: 5e-6, tolerance: 1e-15, source: SI },
  { input: "4.7 \u00b5F", expected: 4.7e-6, tolerance: 1e-15, source: SI },
  { input: "1 \u00b5\u03a9", expected: 1e-6, tolerance: 1e-15, source: SI },
  { input: "2.2 k\u03a9", expected: 2200, tolerance: 1e-15, source: SI },
  { input: "1 M\u2126", expected: 1e6, tolerance: 1e-15, source: SI },
  { input: "3 cm\u00b2", expected: 3e-4, tolerance: 1e-15, source: SI },
  { input: "1 cm\u00b3", expected: 1e-6, tolerance: 1e-15, source: SI },
  { input: "2 m\u207b\u00b9", expected: 2, tolerance: 0, source: SI },
  { input: "\u22123 mm", expected: -3e-3, tolerance: 1e-15, source: SI },
  { input: "5\u00a0mm", expected: 5e-3, tolerance: 1e-15, source: SI },
  { input: "5\u2009mm", expected: 5e-3, tolerance: 1e-15, source: SI },
  { input: "\u00a00.25\u00a0", expected: 0.25, tolerance: 0, source: "a plain number is SI (common practice in this library)" },
];

describe("unit strings with the typography of data sheets", () => {
  it("read as their ASCII spelling: micro sign, Greek mu, ohm sign, superscript powers, minus sign, Unicode spaces", () => {
    checkCases(CASES, (s) => parseQuantity(s).si);
    expect(parseQuantity("3 cm\u00b2").exps).toEqual(parseQuantity("3 cm^2").exps);
    expect(parseQuantity("2 m\u207b\u00b9").exps).toEqual(parseQuantity("2 m^-1").exps);
    expect(parseQuantity("2.2 k\u03a9").exps).toEqual(parseQuantity("2.2 kohm").exps);
  });

  it("reach evaluate: a gap in micrometres written with the micro sign gives the same capacitance as with u", () => {
    const a = evaluate("parallelPlateCapacitance", { area: "1 cm\u00b2", gap: "100 \u00b5m" }).value;
    const b = evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "100 um" }).value;
    expect(a).toBe(b);
  });

  it("a lone micro sign is not a unit: refused as unparsable, not read as the atomic mass unit u", () => {
    for (const s of ["5 \u00b5", "5 \u03bc"]) {
      let err: unknown;
      try {
        parseQuantity(s);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(FormulaError);
      expect((err as FormulaError).code).toBe("unparsable");
    }
  });

  it("any number with a micro-prefixed unit reads the same with the micro sign, Greek mu or u", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e300, max: 1e300, noNaN: true }), fc.constantFrom("m", "F", "H", "A", "V", "s", "T", "Wb", "ohm"), (x, u) => {
        const ascii = parseQuantity(`${x} u${u}`);
        expect(parseQuantity(`${x} \u00b5${u}`).si).toBe(ascii.si);
        expect(parseQuantity(`${x}\u00a0\u03bc${u}`).si).toBe(ascii.si);
      }),
      { numRuns: 300 },
    );
  });
});
