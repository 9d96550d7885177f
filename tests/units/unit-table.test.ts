import { readFileSync } from "node:fs";
import Decimal from "decimal.js";
import { renderUnitFactors } from "../../scripts/gen-unit-factors.js";
import fc from "fast-check";
import { unit as globalUnit } from "mathjs";
import { describe, expect, it } from "vitest";
import { codata2022 } from "../../src/constants/codata.js";
import { DIMENSIONS, type DimensionName, sameExponents } from "../../src/units/dimensions.js";
import { createUnitMath, parseQuantity, unitMath } from "../../src/units/parse.js";
import { inUnit, quantity } from "../../src/units/quantity.js";
import { listUnitSymbols, lookupUnit } from "../../src/units/unit-table.js";
import { unitDimension } from "../../src/units/unit-symbols.js";
import { expectClose } from "../helpers/reference.js";

// Untyped views of the typed API, so every table symbol can be fed from a list.
const q = quantity as unknown as (value: number, unit: string) => number;
const inU = inUnit as unknown as (value: number, unit: string) => number;

// Trade units the private mathjs instance adds; the global mathjs must not know them.
const TRADE_UNITS = ["Oe", "oersted", "gauss", "G", "maxwell", "Mx", "dalton", "Da", "u", "ampereturn", "At"];

// Read before anything below creates the private instance (it is created lazily).
const globalBefore = {
  eV: globalUnit("1 eV").toSI().value,
  unknown: TRADE_UNITS.filter((u) => {
    try {
      globalUnit(`1 ${u}`);
      return false;
    } catch {
      return true;
    }
  }),
};

const SYMBOLS = listUnitSymbols();

describe("typed unit table against the private mathjs instance", () => {
  it("the factors the typed path reads are the ones the table declares (unit-factors.ts is current)", () => {
    expect(readFileSync(new URL("../../src/units/unit-factors.ts", import.meta.url), "utf8"), "run: npx tsx scripts/gen-unit-factors.ts").toBe(renderUnitFactors());
  });

  it("has a few hundred symbols, each with a declared dimension", () => {
    expect(SYMBOLS.length).toBeGreaterThan(300);
    for (const s of SYMBOLS) expect(Object.hasOwn(DIMENSIONS, unitDimension(s)!), s).toBe(true);
  });

  it("every symbol has the same SI factor (to 1e-15) and dimension as mathjs reads it", () => {
    // Outside reference: mathjs 15.2.0 unit definitions (plus the trade units checked below).
    for (const s of SYMBOLS) {
      const [factor] = lookupUnit(s)!;
      const dim = unitDimension(s)!;
      const parsed = parseQuantity(`1 ${s}`);
      expectClose(parsed.si, { name: `1 ${s}`, expected: factor, tolerance: 1e-15, source: "mathjs 15.2.0 unit definition" });
      expect(sameExponents(parsed.exps, DIMENSIONS[dim as DimensionName].exps), `dimension of ${s}`).toBe(true);
      expect(q(1, s), s).toBe(factor);
    }
  });

  it("quantity() then inUnit() returns the value for every symbol", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...SYMBOLS),
        // Normal doubles: neither the value nor its SI form may be subnormal (those lose digits).
        fc.double({ min: -1e6, max: 1e6, noNaN: true }).filter((v) => v === 0 || Math.abs(v) > 1e-200),
        (s, v) => {
          // Two roundings (scale, unscale): at most about two units in the last place.
          const back = inU(q(v, s), s);
          return v === 0 ? back === 0 : Math.abs(back - v) <= 2 * Number.EPSILON * Math.abs(v);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("a value in one unit equals the same SI value through mathjs text", () => {
    fc.assert(
      fc.property(fc.constantFrom(...SYMBOLS.filter((s) => s !== "")), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (s, v) => {
        const text = `${v} ${s}`;
        const si = parseQuantity(text).si;
        return Math.abs(si - q(v, s)) <= 1e-15 * Math.abs(si);
      }),
      { numRuns: 500 },
    );
  });

  it("reciprocal symbols of the table (1/m^3, 1/cm^3, 1/H) work in run-time strings", () => {
    expect(parseQuantity("1e18 1/m^3").si).toBe(1e18);
    expectClose(parseQuantity("1e12 1/cm^3").si, { expected: 1e18, tolerance: 1e-15, source: "1 cm^-3 = 1e6 m^-3 (SI prefixes)" });
    expect(parseQuantity("2 1/H").exps).toEqual(DIMENSIONS.Reluctance.exps);
  });
});

describe("trade units mathjs lacks or defines with an outdated value", () => {
  const D = Decimal.clone({ precision: 40 });
  // 1 Oe = (1000/4 pi) A/m, the CGS-Gaussian definition as NIST SP 811 (2008) App. B lists it (from memory).
  const OERSTED = D.div(1000, D.acos(-1).times(4)).toNumber();
  const m_u = codata2022.atomicMassConstant.value;

  const CASES: readonly (readonly [text: string, dimension: DimensionName, si: number, source: string])[] = [
    ["1 eV", "Energy", 1.602176634e-19, "SI Brochure 9th ed. (2019), table of non-SI units accepted (table number from memory): 1 eV = 1.602 176 634e-19 J exactly"],
    ["1 keV", "Energy", 1.602176634e-16, "SI prefix on the exact electron volt"],
    ["1 electronvolt", "Energy", 1.602176634e-19, "SI Brochure 9th ed. (2019), non-SI units accepted (from memory)"],
    ["1 gauss", "FluxDensity", 1e-4, "NIST SP 811 (2008) App. B, locator from memory: 1 G = 1e-4 T"],
    ["1 G", "FluxDensity", 1e-4, "NIST SP 811 (2008) App. B, locator from memory: 1 G = 1e-4 T"],
    ["1 mG", "FluxDensity", 1e-7, "NIST SP 811 (2008) App. B (from memory) with the SI milli prefix"],
    ["1 kilogauss", "FluxDensity", 0.1, "NIST SP 811 (2008) App. B (from memory) with the SI kilo prefix"],
    ["1 maxwell", "MagneticFlux", 1e-8, "NIST SP 811 (2008) App. B, locator from memory: 1 Mx = 1e-8 Wb"],
    ["1 Mx", "MagneticFlux", 1e-8, "NIST SP 811 (2008) App. B, locator from memory: 1 Mx = 1e-8 Wb"],
    ["1 oersted", "MagneticFieldStrength", OERSTED, "NIST SP 811 (2008) App. B (from memory): 1 Oe = (1000/4 pi) A/m, decimal.js at 40 digits"],
    ["1 Oe", "MagneticFieldStrength", OERSTED, "NIST SP 811 (2008) App. B (from memory): 1 Oe = (1000/4 pi) A/m, decimal.js at 40 digits"],
    ["1 kOe", "MagneticFieldStrength", OERSTED * 1000, "NIST SP 811 (2008) App. B (from memory) with the SI kilo prefix"],
    ["1 dalton", "Mass", m_u, "CODATA 2022 atomic mass constant (1 Da = m_u)"],
    ["1 Da", "Mass", m_u, "CODATA 2022 atomic mass constant (1 Da = m_u)"],
    ["1 u", "Mass", m_u, "CODATA 2022 unified atomic mass unit"],
    ["1 kDa", "Mass", m_u * 1000, "CODATA 2022 m_u with the SI kilo prefix"],
    ["1 ampereturn", "Current", 1, "common practice: magnetomotive force in ampere-turns, 1 At = 1 A"],
    ["1 At", "Current", 1, "common practice: 1 At = 1 A"],
  ];

  it.each(CASES)("%s is its SI or CODATA definition", (text, dimension, si, source) => {
    const parsed = parseQuantity(text);
    expectClose(parsed.si, { name: text, expected: si, tolerance: 1e-15, source });
    expect(parsed.exps).toEqual(DIMENSIONS[dimension].exps);
  });

  it("typed symbols eV, G, mG, Mx, Oe, Da, u and At carry the same definitions", () => {
    expect(quantity(1, "eV")).toBe(codata2022.electronVolt.value);
    expect(quantity(1, "G")).toBe(1e-4);
    expectClose(quantity(1, "mG"), { expected: 1e-7, tolerance: 1e-15, source: "NIST SP 811 (2008) App. B (from memory)" });
    expect(quantity(1, "Mx")).toBe(1e-8);
    expectClose(quantity(1, "Oe"), { expected: OERSTED, tolerance: 1e-15, source: "NIST SP 811 (2008) App. B (from memory), decimal.js" });
    expect(quantity(1, "Da")).toBe(m_u);
    expect(quantity(1, "u")).toBe(m_u);
    expect(quantity(1, "At")).toBe(1);
    expect(quantity(1, "uF")).toBe(1e-6); // "u" alone is the dalton; as a prefix it is still micro
    expect(parseQuantity("1 um").si).toBe(1e-6);
  });

  it("leaves the global mathjs untouched", () => {
    // Exercise the private instance first, then look at the global one.
    parseQuantity("3 Oe");
    parseQuantity("2 eV");
    const fresh = createUnitMath();
    expect(fresh.unit("1 Oe").toSI().value).toBe(unitMath().unit("1 Oe").toSI().value);
    expect(unitMath()).toBe(unitMath());
    expect(unitMath()).not.toBe(fresh);
    // mathjs 15.2.0 ships 1.602176565e-19 J (CODATA 2010) for its eV; ours is exact.
    expect(globalUnit("1 eV").toSI().value).toBe(globalBefore.eV);
    expect(globalBefore.eV).not.toBe(parseQuantity("1 eV").si);
    expect(globalBefore.unknown).toEqual(TRADE_UNITS);
    for (const u of TRADE_UNITS) expect(() => globalUnit(`1 ${u}`), u).toThrow();
  });
});
