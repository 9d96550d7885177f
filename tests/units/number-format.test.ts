import fc from "fast-check";
import { all, create } from "mathjs";
import { describe, expect, it } from "vitest";
import { formatAuto, formatEngineering, formatPrefixed } from "../../src/units/number-format.js";

// Reference: mathjs 15.2.0 (an outside library from npm), whose Unit.format and
// format(number) the display code reproduces without loading mathjs.
const math = create(all!, {});
const UNITS = ["m", "m^2", "m^3", "s", "Hz", "A", "V", "ohm", "S", "F", "H", "Wb", "T", "N", "J", "W", "C", "Pa", "rad"];

// Values over the range formatQuantity prefixes (1e-24..1e27), both signs, plus
// short decimals (ties like 1.2345 exercise rounding on the decimal text).
const value = fc.oneof(
  fc.double({ min: 1e-24, max: 1e27, noNaN: true }).map((v) => (v === 0 ? 1 : v)),
  fc.tuple(fc.integer({ min: 1, max: 99999 }), fc.integer({ min: -24, max: 24 })).map(([m, e]) => Number(`${m}e${e}`)),
).chain((v) => fc.constantFrom(v, -v));

describe("display formatting without mathjs", () => {
  it("writes a prefixed value exactly as mathjs's Unit.format does", () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...UNITS), fc.integer({ min: 1, max: 8 }), (v, u, p) => {
        expect(formatPrefixed(v, u, p)).toBe(math.unit(v, u).format({ precision: p }));
      }),
      { numRuns: 3000 },
    );
  });

  it("writes plain and engineering notation exactly as mathjs's format does", () => {
    fc.assert(
      fc.property(fc.oneof(value, fc.double({ noNaN: true, noDefaultInfinity: true })), fc.integer({ min: 1, max: 10 }), (v, p) => {
        expect(formatAuto(v, p)).toBe(math.format(v, { precision: p }));
        // Zero is written "0" by the callers before engineering notation is asked for.
        if (v !== 0) expect(formatEngineering(v, p)).toBe(math.format(v, { notation: "engineering", precision: p }));
      }),
      { numRuns: 3000 },
    );
  });

  it("rounds half away from zero on the decimal text and carries into a new digit", () => {
    // Values chosen to exercise the carry; expected text from mathjs 15.2.0.
    for (const [v, p] of [[9.9995, 4], [0.00099995, 4], [999999, 3], [-1.2345, 4], [99950, 3]] as const) {
      expect(formatAuto(v, p)).toBe(math.format(v, { precision: p }));
      expect(formatEngineering(v, p)).toBe(math.format(v, { notation: "engineering", precision: p }));
    }
  });
});
