import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { parseQuantity, unitCacheSize } from "../../src/units/parse.js";
import { expectFormulaError } from "../helpers/errors.js";

const ID = "parallelPlateCapacitance";

/** Run `fn`, expecting a FormulaError; return it. */

describe("parseQuantity cache", () => {
  it("returns the identical record for the same text", () => {
    const a = parseQuantity("3.3 mm");
    expect(parseQuantity("3.3 mm")).toBe(a);
    expect(a.si).toBeCloseTo(3.3e-3, 18);
  });

  it("hands out frozen records, so no caller can change another's answer", () => {
    const a = parseQuantity("4.7 uF");
    expect(Object.isFrozen(a)).toBe(true);
    expect(Object.isFrozen(a.exps)).toBe(true);
    expect(() => {
      (a as { si: number }).si = 1;
    }).toThrow(TypeError);
    expect(() => {
      (a.exps as unknown as number[])[0] = 5;
    }).toThrow(TypeError);
    expect(parseQuantity("4.7 uF").si).toBe(a.si);
  });

  it("stays bounded under many distinct strings", () => {
    for (let i = 0; i < 5000; i++) parseQuantity(`${i}.25`);
    expect(unitCacheSize()).toBeLessThanOrEqual(4096);
    expect(unitCacheSize()).toBeGreaterThan(0);
    // Still correct after the cache was cleared.
    expect(parseQuantity("2 mm").si).toBe(0.002);
  });

  it("does not cache failures", () => {
    const before = unitCacheSize();
    for (let i = 0; i < 20; i++) expect(() => parseQuantity(`${i} furlongs per fortnight`)).toThrow(FormulaError);
    expect(unitCacheSize()).toBe(before);
  });
});

describe("bare number strings", () => {
  it.each([
    ["1e-3", 1e-3],
    [" 12 ", 12],
    ["+.5", 0.5],
    ["-3", -3],
    ["1.", 1],
    ["6.02214076e23", 6.02214076e23],
  ])("%j is read as the SI number %d", (text, si) => {
    const p = parseQuantity(text);
    expect(p.plain).toBe(true);
    expect(p.si).toBe(si);
    expect(p.exps).toEqual([0, 0, 0, 0, 0, 0, 0, 0]);
  });

  it("a bare number string through evaluate() is SI, like a number", () => {
    const fromString = evaluate(ID, { area: "1e-4", gap: "1e-4" }).value;
    const fromNumber = evaluate(ID, { area: 1e-4, gap: 1e-4 }).value;
    expect(fromString).toBe(fromNumber);
  });
});

describe("wrong dimension through evaluate()", () => {
  it.each([
    ["area", "5 kg", "Area", "Mass"],
    ["gap", "1 m^2", "Length", "Area"],
    ["gap", "3 pF", "Length", "Capacitance"],
    ["area", "2 Oe", "Area", "MagneticFieldStrength"],
    ["gap", "1 m^5", "Length", "m^5"],
  ])("%s given %j names the input, expected %s and given %s", (input, text, expected, received) => {
    const inputs: Record<string, unknown> = { area: "1 cm^2", gap: "0.1 mm", [input]: text };
    const err = expectFormulaError(() => evaluate(ID, inputs));
    expect(err.code).toBe("wrong_dimension");
    expect(err.input).toBe(input);
    expect(err.formula).toBe(ID);
    expect(err.expected).toBe(expected);
    expect(err.received).toBe(received);
    expect(err.message).toContain(input);
    expect(err.message).toContain(expected);
    expect(err.message).toContain(received);
  });
});

describe("strings that are not quantities", () => {
  const UNPARSABLE = [
    "abc", "mm", "", "   ", "1 + 2", "5 furlong", "8 bit", "2 kB", "2i m", "1 m/0", "NaN m", "Infinity m",
    "__proto__", "constructor", "1 m 1 m", "1e18 1/", "m 5", "5 m)", "((", "1 mm; 2 mm", "\u0000", "5 \u00b5",
  ];
  it.each(UNPARSABLE)("%j is FormulaError unparsable naming the input", (text) => {
    const err = expectFormulaError(() => evaluate(ID, { area: "1 cm^2", gap: text }));
    expect(err.code).toBe("unparsable");
    expect(err.input).toBe("gap");
    expect(err.formula).toBe(ID);
  });

  it("an overflowing value is not_finite, never Infinity", () => {
    const err = expectFormulaError(() => evaluate(ID, { area: "1 cm^2", gap: "1e400 mm" }));
    expect(err.code).toBe("not_finite");
    expect(err.input).toBe("gap");
  });

  it("strings longer than 200 characters are refused before mathjs sees them, with a short message", () => {
    const long = `${"1".repeat(199)} m`; // 201 characters
    expect(long.length).toBe(201);
    const err = expectFormulaError(() => evaluate(ID, { area: "1 cm^2", gap: long }));
    expect(err.code).toBe("unparsable");
    expect(err.input).toBe("gap");
    expect(err.message).toContain("longer than 200");
    expect(err.message.length).toBeLessThan(200);
    const huge = expectFormulaError(() => parseQuantity("9".repeat(100_000), "gap"));
    expect(huge.code).toBe("unparsable");
  });

  it("a 200-character quantity is still read", () => {
    const text = `0.${"0".repeat(195)}1 m`; // 200 characters
    expect(text.length).toBe(200);
    expect(parseQuantity(text).si).toBeCloseTo(1e-196, 206);
  });

  it("no string makes parseQuantity throw anything but FormulaError", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 40 }), fc.string({ unit: "grapheme", maxLength: 20 }).map((s) => `1 ${s}`)), (text) => {
        try {
          const p = parseQuantity(text, "gap");
          return typeof p.si === "number" && p.exps.length === 8;
        } catch (e) {
          return e instanceof FormulaError && e.code === "unparsable" && e.input === "gap";
        }
      }),
      { numRuns: 300 },
    );
  });

  it.each([
    [true], [null], [{}], [[1, 2]], [() => 1], [Symbol("x")], [10n],
  ])("a %s input is FormulaError wrong_type naming the input", (value) => {
    const err = expectFormulaError(() => evaluate(ID, { area: "1 cm^2", gap: value }));
    expect(err.code).toBe("wrong_type");
    expect(err.input).toBe("gap");
  });
});
