/**
 * The private unit parser (mathjs's Unit class on number-only arithmetic,
 * src/units/mathjs-subset.ts) side by side with the complete mathjs 15.2.0
 * from npm, both with emquant's trade units: the same unit table, and for
 * every unit name mathjs knows, under every prefix it accepts, and for unit
 * strings in mathjs's grammar, the same parse (value, units, prefixes,
 * powers, dimensions), the same SI value (Object.is: the same double) and the
 * same error text.
 */
import fc from "fast-check";
import { all, create, type MathJsInstance, type Unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { createSubsetMath, type UnitMath } from "../../src/units/mathjs-subset.js";
import { addTradeUnits, createUnitMath, parseQuantity } from "../../src/units/parse.js";
import { listUnitSymbols } from "../../src/units/unit-table.js";

interface UnitEntry {
  name: string;
  value: unknown;
  offset: number;
  prefixes: Record<string, { name: string; value: number }>;
  dimensions: number[];
}
interface Parsed {
  value: unknown;
  dimensions: number[];
  units: { unit: UnitEntry; prefix: { name: string; value: number }; power: number }[];
  toSI(): Parsed;
}
interface UnitStatics {
  UNITS: Record<string, UnitEntry>;
  PREFIXES: Record<string, Record<string, { name: string; value: unknown }>>;
  BASE_UNITS: Record<string, { dimensions: number[] }>;
  BASE_DIMENSIONS: string[];
  parse(text: string, options?: { allowNoUnits: boolean }): Parsed;
}

// The reference: a complete mathjs instance of its own (the global one stays untouched), with the trade units.
const full: MathJsInstance = create(all!);
addTradeUnits(full);
const subset = createUnitMath();
const statics = (m: UnitMath | MathJsInstance): UnitStatics => m.Unit as unknown as UnitStatics;

/** A value as text that tells numbers (with their sign of zero), table fractions and non-real values apart. */
function describeValue(v: unknown): string {
  if (typeof v === "number") return Object.is(v, -0) ? "-0" : String(v);
  if (v === null || v === undefined) return String(v);
  const o = v as { isFraction?: boolean; isComplex?: boolean; valueOf(): unknown };
  if (o.isFraction === true) return `fraction ${String(o.valueOf())}`;
  if (o.isComplex === true) return "not real";
  return `other ${typeof v}`;
}

/** What a parse gives, as text: the error message, or value, units and dimensions, and the SI value where the value is real. */
function reading(m: UnitMath | MathJsInstance, text: string): string {
  let u: Parsed;
  try {
    u = statics(m).parse(text, { allowNoUnits: true });
  } catch (e) {
    return `error: ${(e as Error).message}`;
  }
  const terms = u.units.map((t) => `${t.prefix.name}|${t.unit.name}^${t.power}`).join(" ");
  const head = `${describeValue(u.value)} [${terms}] (${u.dimensions.join(",")})`;
  if (typeof u.value !== "number") return head;
  try {
    return `${head} = ${describeValue(u.toSI().value)}`;
  } catch (e) {
    return `${head} toSI error: ${(e as Error).message}`;
  }
}

/** Each text where the two readings differ, with both readings. */
function differences(texts: Iterable<string>): string[] {
  const wrong: string[] = [];
  for (const text of texts) {
    const a = reading(subset, text);
    const b = reading(full, text);
    if (a !== b) wrong.push(`${JSON.stringify(text)}: subset ${a} | mathjs ${b}`);
  }
  return wrong;
}

const FULL = statics(full);
const UNIT_NAMES = Object.keys(FULL.UNITS);

describe("the unit table of the private parser is mathjs's", () => {
  it("has the same unit names, prefixes, base dimensions and unit values (fractions and non-real values included)", () => {
    const mine = statics(subset);
    expect(Object.keys(mine.UNITS).sort()).toEqual([...UNIT_NAMES].sort());
    expect(mine.BASE_DIMENSIONS).toEqual(FULL.BASE_DIMENSIONS);
    expect(Object.keys(mine.BASE_UNITS).sort()).toEqual(Object.keys(FULL.BASE_UNITS).sort());
    const wrong: string[] = [];
    for (const [kind, table] of Object.entries(FULL.PREFIXES)) {
      for (const [p, { value }] of Object.entries(table)) {
        const ours = mine.PREFIXES[kind]?.[p]?.value;
        if (describeValue(ours) !== describeValue(value)) wrong.push(`prefix ${kind} ${p}: ${describeValue(ours)} vs ${describeValue(value)}`);
      }
    }
    for (const name of UNIT_NAMES) {
      const a = mine.UNITS[name]!;
      const b = FULL.UNITS[name]!;
      const fields = (u: UnitEntry): string => `${describeValue(u.value)} offset ${u.offset} (${u.dimensions.join(",")}) ${Object.keys(u.prefixes).length} prefixes`;
      if (fields(a) !== fields(b)) wrong.push(`${name}: ${fields(a)} vs ${fields(b)}`);
    }
    expect(wrong).toEqual([]);
    // The table's special values are there: fractions for the Fahrenheit and Rankine scales, a non-real VAR.
    expect(describeValue(mine.UNITS.degF!.value)).toBe("fraction 0.5555555555555556");
    expect(describeValue(mine.UNITS.VAR!.value)).toBe("not real");
  });
});

describe("every unit under every prefix reads as mathjs reads it", () => {
  it("each unit name, bare, with each prefix it takes, and under powers and values of both signs", () => {
    const texts: string[] = [];
    for (const name of UNIT_NAMES) {
      const prefixes = Object.keys(FULL.UNITS[name]!.prefixes);
      for (const p of prefixes) texts.push(`1 ${p}${name}`, `-2.5e-3 ${p}${name}^2`);
      texts.push(`${name}`, `3 ${name}^-1`, `0.1 ${name}/s`, `7 kg*${name}^3/m`, `-0 ${name}`, `1e300 ${name}^2`);
    }
    expect(texts.length).toBeGreaterThan(5000);
    expect(differences(texts)).toEqual([]);
  });

  it("temperatures with offsets (degC, degF, degR, fahrenheit, rankine, kelvin) at values across the scales", () => {
    const units = ["degC", "degF", "degR", "celsius", "fahrenheit", "rankine", "K", "kelvin", "mdegC", "kdegF", "udegR"];
    const values = ["0", "1", "-40", "-459.67", "-273.15", "32", "98.6", "212", "1e5", "0.001", "-1e-9", "451"];
    const texts = units.flatMap((u) => values.map((v) => `${v} ${u}`));
    expect(differences([...texts, "1 degF/s", "2 degC^2", "1 degF*m"])).toEqual([]);
    // The one product mathjs forms as an exact fraction (5/9 x 459.67) gives the double the complete mathjs gives.
    expect(parseQuantity("0 degF").si).toBe(full.unit("0 degF").toSI().value);
    // The Rankine scale's factor is a fraction, no decimal: its SI value is mathjs's (it once escaped as a TypeError).
    for (const text of ["1 degR", "1 rankine", "1e-3 mdegR", "491.67 degR"]) expect(parseQuantity(text).si, text).toBe(full.unit(text).toSI().value);
  });

  it("angles (rad, deg, grad, cycle, arcmin, arcsec and their long names) and reactive power", () => {
    const units = ["rad", "deg", "grad", "cycle", "arcmin", "arcsec", "radian", "degree", "gradian", "mrad", "urad", "cycles", "degrees"];
    const texts = units.flatMap((u) => [`1 ${u}`, `90 ${u}`, `-0.5 ${u}^2`, `360 ${u}/s`]);
    expect(differences([...texts, "1 VAR", "2 kVAR", "3 VA", "1 VAR^2"])).toEqual([]);
    // Reactive power has no real value in mathjs: refused alike, as a unit without a numeric value.
    expect(() => parseQuantity("1 VAR")).toThrow(/numeric value/);
  });

  it("the typed table's symbols and the trade units (gauss, oersted, eV, dalton...) read alike", () => {
    const symbols = listUnitSymbols().filter((s) => s !== "");
    const trade = ["G", "mG", "gauss", "milligauss", "Oe", "kOe", "oersted", "Mx", "maxwell", "eV", "keV", "MeV", "electronvolt", "Da", "kDa", "dalton", "u", "At", "kAt", "ampereturn"];
    const texts = [...symbols, ...trade].flatMap((s) => [`1 ${s}`, `4.7 ${s}^2`, `2 ${s}/m`, `5 1/${s}`]);
    expect(symbols.length).toBeGreaterThan(300);
    expect(differences(texts)).toEqual([]);
  });

  it("mistakes give the same errors: unknown units, bad powers, unbalanced parentheses, stray characters", () => {
    const texts = [
      "1 foo", "1 uh", "5 mmm", "5 M", "1 m^", "1 m^-", "1 m^m", "((((", "1 (m", "1 m)", "1..2 m", "1.2.3 m", "0x10 m", "e5 m",
      "1 m + 2 m", "1 m to cm", "[1,2] m", "__proto__", "5 constructor", "5 toString", "5 hasOwnProperty", "1 m^1e400", "1 km^99999",
      "1e999999 m", "Infinity m", "NaN m", "", " ", "5", "-", "1 m/0", "5 m/s/s/s/s", `1 ${"(".repeat(30)}m${")".repeat(30)}`,
    ];
    expect(differences(texts)).toEqual([]);
  });
});

// Strings in mathjs's unit grammar from numbers, units (any of mathjs's), prefixes, powers and joiners.
const numberText = fc.oneof(
  fc.integer({ min: -100000, max: 100000 }).map(String),
  fc.tuple(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 0, max: 9999 })).map(([a, b]) => `${a}.${b}`),
  fc.tuple(fc.integer({ min: 1, max: 999999 }), fc.integer({ min: -320, max: 320 })).map(([d, e]) => `${d}e${e}`),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map(String),
  fc.constant(""),
);
const unitName = fc.constantFrom(...UNIT_NAMES);
const prefix = fc.oneof({ weight: 6, arbitrary: fc.constant("") }, fc.constantFrom("m", "u", "k", "M", "n", "p", "G", "c", "d", "da", "h", "milli", "micro", "kilo", "mega", "Ki", "x"));
const power = fc.constantFrom("", "", "", "^2", "^3", "^-1", "^-2", "^0.5", "^ 2", "^+2", "^0", "^1e400");
const joiner = fc.oneof({ weight: 8, arbitrary: fc.constantFrom(" ", "*", "/", " / ", " * ") }, fc.constantFrom("(", ")", "", "^", "  "));
const unitString = fc
  .tuple(numberText, fc.constantFrom(" ", "", "/", "*"), fc.array(fc.tuple(prefix, unitName, power, joiner), { minLength: 1, maxLength: 4 }))
  .map(([n, sep, terms]) => `${n}${sep}${terms.map(([p, u, w, j]) => p + u + w + j).join("")}`);

describe("generated unit strings", () => {
  it("read the same through the private parser and the complete mathjs, result or error", () => {
    const wrong: string[] = [];
    let read = 0;
    fc.assert(
      fc.property(unitString, (text) => {
        const [mismatch] = differences([text]);
        if (mismatch !== undefined) wrong.push(mismatch);
        if (!reading(full, text).startsWith("error")) read++;
      }),
      { numRuns: 3000 },
    );
    expect(wrong).toEqual([]);
    // Not a comparison of errors only: a good share of the strings parse.
    expect(read).toBeGreaterThan(300);
  });
});

describe("instances of the private parser", () => {
  it("are independent: a unit created on one is unknown to another and to a complete mathjs", () => {
    const a = createSubsetMath();
    const b = createSubsetMath();
    a.createUnit({ furlongish: { definition: "201.168 m", aliases: ["furlongishes"] } }, {});
    expect(a.unit("2 furlongishes").toSI().value).toBe(402.336);
    expect(() => b.unit("1 furlongish")).toThrow(/not found/);
    expect(() => full.unit("1 furlongish")).toThrow(/not found/);
    expect(statics(a).UNITS.m).not.toBe(statics(b).UNITS.m);
  });

  it("unit() reads a bare unit name as a unit without value and anything else with the parser, as mathjs's unit() does", () => {
    for (const text of ["mm", "kOe", "5 mm", "degF", "1 deg"]) {
      const ours: Unit = subset.unit(text);
      const theirs: Unit = full.unit(text);
      expect(describeValue(ours.value), text).toBe(describeValue(theirs.value));
      expect(ours.equalBase(subset.unit(theirs.formatUnits())), text).toBe(true);
    }
    expect(subset.unit("mm").value).toBeNull();
  });

  it("refuses the number types it does not carry with a clear error, never a wrong number", () => {
    const U = subset.Unit as unknown as new (value: unknown, name: string) => Unit;
    expect(() => new U("5", "m")).toThrow(/First parameter in Unit constructor must be/);
    expect(new U(5, "mm").toSI().value).toBe(full.unit(5, "mm").toSI().value);
  });
});
