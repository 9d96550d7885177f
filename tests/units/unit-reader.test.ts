/**
 * The fast unit-string reader against mathjs, the reference it stands in for:
 * every symbol it knows resolves to mathjs's unit and prefix values, and every
 * string it reads gives the SI value and dimension of the mathjs path, bit for
 * bit (the mathjs path is mathjs's Unit.parse and toSI, rounded by exactSI).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { type ParsedQuantity, parseQuantity, parseWithMathjs, unitCacheSize, unitMath } from "../../src/units/parse.js";
import { readerSymbols, readUnitString } from "../../src/units/unit-reader.js";

interface MathjsTerm {
  unit: { value: unknown; offset: number; dimensions: number[] };
  prefix: { value: unknown };
  power: number;
}
const mathjsParse = (text: string) =>
  (unitMath().Unit.parse as unknown as (t: string) => { units: MathjsTerm[]; dimensions: number[] })(text);

/** The mathjs path's reading, or undefined where mathjs refuses the string. */
function viaMathjs(text: string): ParsedQuantity | undefined {
  try {
    return parseWithMathjs(text, text);
  } catch (e) {
    if (e instanceof FormulaError) return undefined;
    throw e;
  }
}

/** How the reader and the mathjs path disagree (Object.is: the same double, the same zero), or undefined when they agree exactly. */
function difference(text: string, fast: ParsedQuantity | undefined, slow: ParsedQuantity | undefined): string | undefined {
  if (fast === undefined) return `the reader does not read "${text}"`;
  if (slow === undefined) return `mathjs refuses "${text}", the reader reads it`;
  if (!Object.is(fast.si, slow.si)) return `"${text}": reader ${fast.si}, mathjs ${slow.si}`;
  for (let k = 0; k < 8; k++) if (!Object.is(fast.exps[k], slow.exps[k])) return `"${text}" exponent ${k}: reader ${fast.exps[k]}, mathjs ${slow.exps[k]}`;
  if (fast.plain) return `"${text}": the reader calls it a plain number`;
  return undefined;
}

/** Fails unless the reader and the mathjs path agree exactly. */
function expectSame(text: string, fast: ParsedQuantity, slow: ParsedQuantity | undefined): void {
  expect(difference(text, fast, slow), text).toBeUndefined();
}

const SYMBOLS = [...readerSymbols().keys()];

describe("the reader's symbols are mathjs's", () => {
  it("every symbol, prefixed or not, is the unit and prefix mathjs finds for it", () => {
    expect(SYMBOLS.length).toBeGreaterThan(500);
    for (const [sym, { unit, prefix }] of readerSymbols()) {
      const parsed = mathjsParse(`1 ${sym}`);
      expect(parsed.units.length, sym).toBe(1);
      const [m] = parsed.units;
      expect(Object.is(m!.unit.value, unit.value), `${sym}: unit value`).toBe(true);
      expect(Object.is(m!.prefix.value, prefix.value), `${sym}: prefix value`).toBe(true);
      expect(m!.unit.offset, `${sym}: offset`).toBe(unit.offset);
      const d = parsed.dimensions; // mathjs order: M, L, T, I, Θ, J, N, angle, bit
      expect([d[1], d[0], d[2], d[3], d[4], d[6], d[5], d[7]], `${sym}: dimension`).toEqual([...unit.exps]);
      expect(d[8], sym).toBe(0);
    }
  });

  it("each symbol to the powers -2..3 with a few values reads as the mathjs path reads it", () => {
    const wrong: string[] = [];
    for (const sym of SYMBOLS) {
      for (const power of ["", "^2", "^3", "^-1", "^-2"]) {
        for (const value of ["1", "10", "0.45", "4.7e-3", "-2.5e7"]) {
          const text = `${value} ${sym}${power}`;
          const why = difference(text, readUnitString(text), viaMathjs(text));
          if (why !== undefined) wrong.push(why);
        }
      }
    }
    // One expect for the 12,500 strings, not a dozen per string: the test took a quarter of the time.
    expect(wrong).toEqual([]);
  });
});

describe("strings the engineer writes", () => {
  // Expected values: the typed decimal times the SI prefix as an exact power of ten (SI Brochure,
  // BIPM, 9th ed., 2019, Table 7), correctly rounded; the eV at 1.602176634e-19 J (exact, CODATA 2022).
  it.each([
    ["10 uH", 1e-5],
    ["0.45 mm", 0.00045],
    ["4.7 uF", 4.7e-6],
    ["9.81 kg*m/s^2", 9.81],
    ["2 mm^2", 2e-6],
    ["50 1/s", 50],
    ["50 /s", 50],
    ["50/s", 50],
    ["3.3 kV/mm", 3.3e6],
    ["80 A/m", 80],
    ["5mm", 0.005],
    ["4eV", 4 * 1.602176634e-19],
    ["1e3 m", 1000],
    ["-.5 m", -0.5],
    ["+2. m", 2],
  ])("%j is read without mathjs as %d, exactly", (text, si) => {
    const fast = readUnitString(text);
    expect(fast?.si).toBe(si);
    expectSame(text, fast!, viaMathjs(text));
  });

  // T/K = t/degC + 273.15 (SI Brochure, 9th ed., 2.3.1); the sums are mathjs's own double arithmetic.
  it("20 degC is 293.15 K and -40 degC 233.15 K, as mathjs reads them", () => {
    for (const text of ["20 degC", "-40 degC", "0 degC", "36.6 degC"]) {
      const fast = readUnitString(text)!;
      expect(fast.exps).toEqual([0, 0, 0, 0, 1, 0, 0, 0]);
      expectSame(text, fast, viaMathjs(text));
    }
    expect(readUnitString("20 degC")!.si).toBe(293.15);
  });

  it.each([
    "5 meter", "5 inch", "(5 m)", "5 kg/(m s^2)", "5 m^0.5", "5 m^1e1", "5 m^2kg", "5 m^999", "5 mdegC",
    "mm", "5", "5 m/", "5 m*", "5 */m", "5 uh", "5 m 1/s", "5\nm", "0x10 m", "5 ft", "5 bit", "e5 m", ".", "5 m)",
  ])("%j is left to mathjs", (text) => {
    expect(readUnitString(text)).toBeUndefined();
  });

  it("bad unit strings keep mathjs's coded errors with the closest names", () => {
    let err: unknown;
    try {
      parseQuantity("5 uh", "inductance", "someFormula");
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(FormulaError);
    expect((err as FormulaError).code).toBe("unparsable");
    expect((err as FormulaError).input).toBe("inductance");
    expect((err as FormulaError).message).toContain('unknown unit "uh"');
    expect((err as FormulaError).message).toContain('"uH"');
  });
});

// Strings in mathjs's unit grammar, from the pieces the reader knows and some it does not.
const numberText = fc.oneof(
  fc.integer({ min: -100000, max: 100000 }).map(String),
  fc.tuple(fc.integer({ min: 0, max: 99999 }), fc.integer({ min: 0, max: 99999 })).map(([a, b]) => `${a}.${b}`),
  fc.tuple(fc.bigInt({ min: 1n, max: 999_999_999_999_999n }), fc.integer({ min: -330, max: 330 })).map(([d, e]) => `${d}e${e}`),
  fc.tuple(fc.constantFrom("+", "-", ""), fc.integer({ min: 0, max: 999 }), fc.constantFrom(".", "", "E+2", "e-05")).map(([s, a, t]) => `${s}${a}${t}`),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map(String),
);
const symbol = fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...SYMBOLS) }, fc.constantFrom("meter", "inch", "ft", "kohm", "degF", "b", "mdegC", "uh", "L"));
const power = fc.oneof({ weight: 3, arbitrary: fc.constant("") }, fc.constantFrom("^2", "^3", "^-1", "^-3", "^+2", "^02", "^ 2", " ^-2", "^0", "^-0", "^10", "^0.5"));
const joiner = fc.constantFrom(" ", "*", "/", " / ", " * ", "  ", "\t");
const term = fc.tuple(symbol, power).map(([s, p]) => s + p);
const unitString = fc
  .tuple(numberText, fc.constantFrom(" ", "", "  ", " 1/", "/", " /", "*", "\t"), term, fc.array(fc.tuple(joiner, term), { maxLength: 4 }), fc.constantFrom("", " ", "/"))
  .map(([n, sep, first, rest, tail]) => `${n}${sep}${first}${rest.map(([j, t]) => j + t).join("")}${tail}`);

describe("generated unit strings", () => {
  it("wherever the reader reads a string, the mathjs path gives the same SI value and dimension", () => {
    let read = 0;
    let runs = 0;
    fc.assert(
      fc.property(unitString, (text) => {
        runs++;
        const fast = readUnitString(text);
        if (fast === undefined) return;
        read++;
        expectSame(text, fast, viaMathjs(text));
      }),
      { numRuns: 3000 },
    );
    // The comparison is not empty: about half the generated strings are the reader's (the rest, mathjs's).
    expect(read).toBeGreaterThan(runs / 3);
  });
});

describe("the cache of unit strings", () => {
  it("keeps a string in use through a stream of fresh ones, and stays bounded", () => {
    const inUse = parseQuantity("3.3 mm");
    for (let i = 0; i < 20_000; i++) {
      parseQuantity(`${i}.125 um`);
      if (i % 1000 === 0) expect(parseQuantity("3.3 mm"), `after ${i} fresh strings`).toBe(inUse);
      expect(unitCacheSize()).toBeLessThanOrEqual(4096);
    }
    expect(parseQuantity("3.3 mm")).toBe(inUse);
  });
});
