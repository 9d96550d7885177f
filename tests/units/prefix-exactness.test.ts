import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluate } from "../../src/core/evaluate.js";
import { parseQuantity } from "../../src/units/parse.js";
import { inUnit, quantity } from "../../src/units/quantity.js";

// Untyped view, so symbols can come from a list.
const q = quantity as unknown as (value: number, unit: string) => number;
const inU = inUnit as unknown as (value: number, unit: string) => number;

// The oracle: decimal.js multiplies the two decimals exactly (2000 digits is far
// more than the product of a 15-digit value and a 10-digit factor needs), and
// Number() of the exact decimal text is the correctly rounded double.
const D = Decimal.clone({ precision: 2000 });
const correctlyRounded = (valueText: string, factorText: string): number => Number(new D(valueText).times(new D(factorText)).toString());

// The exact value of a double (its full binary expansion): mantissa times a power of two.
// (new Decimal(v) would read the shortest decimal of v instead.)
function exactOf(v: number): Decimal {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, v);
  const bits = view.getBigUint64(0);
  const biased = Number((bits >> 52n) & 0x7ffn);
  const fraction = bits & 0xfffffffffffffn;
  const mantissa = biased === 0 ? fraction : fraction | (1n << 52n);
  const e = (biased === 0 ? 1 : biased) - 1075;
  const m = new D(mantissa.toString()).times(new D(2).pow(e));
  return v < 0 ? m.neg() : m;
}

// SI prefixes as the SI Brochure (BIPM, 9th ed., 2019, Table 7) defines them: exact powers of ten.
const PREFIX_EXPONENT: Record<string, number> = {
  y: -24, z: -21, a: -18, f: -15, p: -12, n: -9, u: -6, m: -3, c: -2, d: -1, "": 0,
  da: 1, h: 2, k: 3, M: 6, G: 9, T: 12, P: 15, E: 18, Z: 21, Y: 24,
};
const TYPED_PREFIXES = ["f", "p", "n", "u", "m", "c", "", "k", "M", "G", "T", "P"];

// Base units with exact decimal factors, by definition: the SI units themselves, the
// gram (1e-3 kg), the electronvolt (1.602176634e-19 J, exact since the 2019 SI,
// CODATA 2022), the inch (0.0254 m, 1959 international yard) and the mil (0.001 in).
const TYPED_BASES: [string, string][] = [
  ["m", "1"], ["s", "1"], ["A", "1"], ["Hz", "1"], ["C", "1"], ["V", "1"], ["F", "1"], ["H", "1"], ["ohm", "1"],
  ["S", "1"], ["Wb", "1"], ["T", "1"], ["N", "1"], ["Pa", "1"], ["J", "1"], ["W", "1"], ["V/m", "1"], ["A/m", "1"],
  ["g", "1e-3"], ["eV", "1.602176634e-19"],
];
const TYPED_FIXED: [string, string][] = [
  ["mil", "0.0000254"], ["in", "0.0254"], ["cm^2", "1e-4"], ["mm^2", "1e-6"], ["um^2", "1e-12"], ["cm^3", "1e-6"],
  ["mm^3", "1e-9"], ["G", "1e-4"], ["mG", "1e-7"], ["Mx", "1e-8"], ["V/us", "1e6"], ["A/mm^2", "1e6"], ["1/cm^3", "1e6"],
  ["min", "60"], ["h", "3600"], ["mrad", "1e-3"],
];
const TYPED: [string, string][] = [
  ...TYPED_BASES.flatMap(([b, f]) => TYPED_PREFIXES.map((p): [string, string] => [p + b, new D(f).times(new D(10).pow(PREFIX_EXPONENT[p]!)).toString()])),
  ...TYPED_FIXED,
];

// Decimal texts of at most 15 significant digits: each is the shortest decimal of its double.
const decimalText = fc
  .tuple(fc.boolean(), fc.bigInt({ min: 1n, max: 999_999_999_999_999n }), fc.integer({ min: -30, max: 30 }))
  .map(([neg, digits, exp]) => `${neg ? "-" : ""}${digits}e${exp}`);
const smallDecimal = fc.oneof(
  fc.integer({ min: -100000, max: 100000 }).map(String),
  fc.tuple(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 1, max: 999 })).map(([a, b]) => `${a}.${b}`),
);

describe("prefixed units give correctly rounded SI values", () => {
  it("quantity(10, \"uH\") is exactly 1e-5 and quantity(0.45, \"mm\") exactly 0.00045", () => {
    expect(quantity(10, "uH")).toBe(1e-5);
    expect(quantity(0.45, "mm")).toBe(0.00045);
    expect(quantity(4.7, "uF")).toBe(4.7e-6);
    expect(quantity(33, "pF")).toBe(33e-12);
    expect(inUnit(quantity(10, "uH"), "uH")).toBe(10);
  });

  it("quantity() matches decimal.js for every decimal typed unit and random decimal values", () => {
    fc.assert(
      fc.property(fc.constantFrom(...TYPED), fc.oneof(decimalText, smallDecimal), ([unit, factor], text) => {
        const v = Number(text);
        expect(q(v, unit), `quantity(${text}, "${unit}")`).toBe(correctlyRounded(String(v), factor));
      }),
      { numRuns: 5000 },
    );
  });

  it("inUnit() of a power-of-ten unit rounds once: it matches decimal.js on the double itself", () => {
    const powers = TYPED.filter(([, f]) => /^1(e[+-]?\d+)?$/.test(new D(f).toExponential()));
    fc.assert(
      fc.property(fc.constantFrom(...powers), fc.double({ min: 1e-200, max: 1e200, noNaN: true }), ([unit, factor], v) => {
        // The exact quotient of the double v (its full binary expansion) by the decimal factor.
        const expected = Number(exactOf(v).div(new D(factor)).toString());
        expect(inU(v, unit), `inUnit(${v}, "${unit}")`).toBe(expected);
      }),
      { numRuns: 3000 },
    );
  });

  it("unit strings (the evaluate path) match decimal.js for every SI prefix, powers and quotients", () => {
    const units: [string, (p: string) => string][] = [
      ["H", (p) => p], ["F", (p) => p], ["m", (p) => p], ["V/m", (p) => p], ["m^2", (p) => `(${p})^2`],
      ["m^3", (p) => `(${p})^3`], ["eV", (p) => `${p}*1.602176634e-19`], ["g", (p) => `${p}*1e-3`],
    ];
    fc.assert(
      fc.property(
        fc.constantFrom(...Object.keys(PREFIX_EXPONENT)),
        fc.constantFrom(...units),
        fc.oneof(decimalText, smallDecimal),
        (prefix, [unit, factorOf], text) => {
          if (unit.startsWith("m^") && ["da", "d", "h"].includes(prefix)) return; // "dam^2" reads fine, kept simple
          const p = new D(10).pow(PREFIX_EXPONENT[prefix]!).toString();
          const factor = factorOf(p).split("*").reduce((a, b) => a.times(b.startsWith("(") ? new D(b.slice(1, b.indexOf(")"))).pow(Number(b.slice(b.indexOf("^") + 1))) : new D(b)), new D(1));
          const parsed = parseQuantity(`${text} ${prefix}${unit}`);
          expect(parsed.si, `"${text} ${prefix}${unit}"`).toBe(correctlyRounded(text, factor.toString()));
        },
      ),
      { numRuns: 5000 },
    );
  });

  it("reciprocal and compound unit strings are exact too", () => {
    // 2 cm^-3 = 2e6 m^-3; mathjs's own arithmetic gives 1999999.9999999998.
    expect(parseQuantity("2 cm^-3").si).toBe(2e6);
    expect(parseQuantity("2 1/cm^3").si).toBe(2e6);
    expect(parseQuantity("3.3 kV/mm").si).toBe(3.3e6);
    expect(parseQuantity("10 \u00b5H").si).toBe(1e-5); // micro sign U+00B5
    expect(parseQuantity("10 \u03bcH").si).toBe(1e-5); // Greek mu U+03BC
  });

  it("evaluate returns the exact SI value where the formula multiplies by one", () => {
    // Q = C V with V = 1 V: the charge is the capacitance in SI, so the prefix alone decides it.
    for (const [text, si] of [["10 uF", 1e-5], ["4.7 nF", 4.7e-9], ["0.1 pF", 1e-13], ["220 mF", 0.22]] as const) {
      expect(evaluate("capacitorCharge", { capacitance: text, voltage: "1 V" }).value, text).toBe(si);
    }
  });

  it("units that are not decimals keep their factor (degrees, degrees Celsius)", () => {
    expect(quantity(180, "deg")).toBe(Math.PI);
    expect(parseQuantity("0 degC").si).toBe(273.15);
  });
});
