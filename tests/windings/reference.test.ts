import { describe, expect, it } from "vitest";
import {
  evaluate, quantity, roundWireAcResistanceFactor, wireGaugeDiameter, wireResistance,
  type Conductivity, type Frequency, type Length, type Temperature,
} from "../../src/index.js";
import { WIRE_GAUGES } from "../../src/windings/wire.js";
import { checkCases, expectClose } from "../helpers/reference.js";

const m = (v: number) => v as Length;
const Hz = (v: number) => v as Frequency;
const K = (v: number) => v as Temperature;
const INCH = 0.0254;

describe("wireGaugeDiameter", () => {
  it("matches the ASTM B258 Table 1 diameters, rounded there to 0.0001 in", () => {
    // ASTM B258, Table 1, nominal diameters in inches (values from memory); half a unit of the
    // last place is the table's rounding.
    const table: [string, number][] = [
      ["4/0", 0.46], ["2/0", 0.3648], ["1/0", 0.3249], ["2", 0.2576], ["4", 0.2043], ["6", 0.162], ["8", 0.1285],
      ["10", 0.1019], ["12", 0.0808], ["14", 0.0641], ["16", 0.0508], ["18", 0.0403], ["20", 0.032], ["22", 0.0253],
      ["24", 0.0201], ["26", 0.0159], ["28", 0.0126], ["30", 0.01], ["32", 0.008], ["36", 0.005], ["40", 0.0031],
    ];
    for (const [gauge, inches] of table) {
      const d = wireGaugeDiameter({ gauge: gauge as (typeof WIRE_GAUGES)[number] });
      expect(Math.abs(d / INCH - inches), `AWG ${gauge}: ${d / INCH} in, table ${inches} in (ASTM B258 Table 1, from memory)`).toBeLessThanOrEqual(0.00005 + 1e-12);
    }
  });

  it("is exactly 0.46 in for 4/0 and 0.005 in for 36, the two sizes that define the series (ASTM B258)", () => {
    expectClose(wireGaugeDiameter({ gauge: "4/0" }), { expected: 0.46 * INCH, tolerance: 4e-16, source: "ASTM B258: 4/0 = 0.4600 in by definition" });
    expectClose(wireGaugeDiameter({ gauge: "36" }), { expected: 0.005 * INCH, tolerance: 4e-16, source: "ASTM B258: 36 = 0.0050 in by definition" });
  });

  it("gets about 12 % smaller per gauge and halves every six gauges (92^(6/39) = 2.005; common practice)", () => {
    for (let i = 1; i < WIRE_GAUGES.length; i++) {
      const r = wireGaugeDiameter({ gauge: WIRE_GAUGES[i - 1]! }) / wireGaugeDiameter({ gauge: WIRE_GAUGES[i]! });
      expect(Math.abs(r - Math.pow(92, 1 / 39))).toBeLessThan(1e-14);
    }
    const six = wireGaugeDiameter({ gauge: "10" }) / wireGaugeDiameter({ gauge: "16" });
    expect(Math.abs(six - 2)).toBeLessThan(0.01);
  });

  it("refuses a gauge outside the standard's table with a coded error naming the input", () => {
    expect(() => evaluate("wireGaugeDiameter", { gauge: "41" })).toThrow(expect.objectContaining({ code: "out_of_domain", input: "gauge" }));
    expect(() => evaluate("wireGaugeDiameter", { gauge: 24 })).toThrow(expect.objectContaining({ code: "wrong_type", input: "gauge" }));
    expect(() => evaluate("wireGaugeDiameter", { gauge: "0000" })).toThrow(expect.objectContaining({ code: "out_of_domain", input: "gauge" }));
  });
});

describe("wireResistance", () => {
  it("matches the resistance per length of copper AWG tables at 20 degC (annealed copper, 100 % IACS)", () => {
    // Copper wire tables at 20 degC, ohm per km (e.g. NBS Handbook 100, Copper Wire Tables (1966),
    // or the wire tables of Reference Data for Engineers; values from memory, 4 figures).
    checkCases(
      [
        { name: "AWG 10", input: { gauge: "10" as const }, expected: 3.277e-3, tolerance: 3e-4, source: "copper wire table, AWG 10 3.277 ohm/km at 20 degC (from memory)" },
        { name: "AWG 18", input: { gauge: "18" as const }, expected: 20.95e-3, tolerance: 3e-4, source: "copper wire table, AWG 18 20.95 ohm/km at 20 degC (from memory)" },
        { name: "AWG 24", input: { gauge: "24" as const }, expected: 84.22e-3, tolerance: 3e-4, source: "copper wire table, AWG 24 84.22 ohm/km at 20 degC (from memory)" },
      ],
      (x) => wireResistance({ length: m(1), diameter: wireGaugeDiameter({ gauge: x.gauge }) }),
    );
  });

  it("is rho l / A with IEC 60028's 1/58 ohm mm^2/m: 1 m of 1 mm^2 copper is 17.24 mOhm at 20 degC", () => {
    const d = Math.sqrt(4e-6 / Math.PI);
    expectClose(wireResistance({ length: m(1), diameter: m(d) }), { expected: 1 / 58, tolerance: 1e-15, source: "IEC 60028: 1/58 ohm mm^2/m" });
    const al = wireResistance({ length: m(1), diameter: m(d), material: "aluminium" });
    expectClose(al, { expected: 0.028264, tolerance: 1e-15, source: "IEC 60889 / 60111: 0.028264 ohm mm^2/m (from memory)" });
  });

  it("follows the standard temperature corrections: (234.5 + T) / (234.5 + 20) for copper, 228 for aluminium", () => {
    // IEEE Std C57.12.90 / IEC 60076-1 winding resistance correction to a reference temperature:
    // R2 / R1 = (T_k + t2) / (T_k + t1), T_k = 234.5 for copper and 225 (IEEE) or 228 (IEC) for aluminium (from memory).
    const base = { length: m(1), diameter: m(1e-3) };
    const r = (t: number, mat: "copper" | "aluminium") => wireResistance({ ...base, temperature: K(273.15 + t), material: mat }) / wireResistance({ ...base, material: mat });
    expectClose(r(75, "copper"), { expected: (234.5 + 75) / (234.5 + 20), tolerance: 1e-4, source: "T_k = 234.5 copper (IEC 60076-1, from memory)" });
    expectClose(r(-20, "copper"), { expected: (234.5 - 20) / (234.5 + 20), tolerance: 1e-4, source: "T_k = 234.5 copper (IEC 60076-1, from memory)" });
    expectClose(r(75, "aluminium"), { expected: (228 + 75) / (228 + 20), tolerance: 2e-4, source: "T_k = 228 aluminium (IEC 60076-1, from memory)" });
  });

  it("reads offset temperatures in unit strings: 75 degC is 348.15 K", () => {
    const a = evaluate("wireResistance", { length: "10 m", diameter: "0.5 mm", temperature: "75 degC" }).value as number;
    const b = wireResistance({ length: m(10), diameter: m(0.5e-3), temperature: K(348.15) });
    expectClose(a, { expected: b, tolerance: 1e-14, source: "mathjs degC offset to kelvin" });
    expectClose(evaluate("wireResistance", { length: "10 m", diameter: "0.5 mm" }).value as number, { expected: wireResistance({ length: m(10), diameter: m(0.5e-3), temperature: K(293.15) }), tolerance: 0, source: "default 20 degC" });
  });

  it("warns outside -50 to +200 degC and refuses temperatures where the linear law reaches zero", () => {
    const codes = (t: number) => wireResistance.details({ length: m(1), diameter: m(1e-3), temperature: K(t) }).warnings.map((w) => w.code);
    expect(codes(293.15)).toEqual([]);
    expect(codes(77)).toEqual(["outside_temperature_law"]);
    expect(codes(600)).toEqual(["outside_temperature_law"]);
    expect(() => wireResistance({ length: m(1), diameter: m(1e-3), temperature: K(30) })).toThrow(expect.objectContaining({ code: "out_of_domain" }));
    expect(() => evaluate("wireResistance", { length: "1 m", diameter: "1 mm", temperature: "-240 degC" })).toThrow(expect.objectContaining({ code: "out_of_domain" }));
  });
});

describe("roundWireAcResistanceFactor", () => {
  it("matches the classic table of R/R0 against the Kelvin argument q = sqrt(2) a / delta", () => {
    // Table of R/R0 for an isolated round wire against x = sqrt(2) a / delta, as printed in
    // NBS Circular 74 (1918) and F. E. Terman, Radio Engineers' Handbook (1943), skin effect
    // (values to 4 decimals, from memory): rounding allows 5e-5 absolute.
    const table: [number, number][] = [[1, 1.005], [2, 1.078], [3, 1.318], [4, 1.678], [5, 2.043], [6, 2.394], [7, 2.743], [8, 3.094], [9, 3.446], [10, 3.799]];
    const f = 1e5;
    const sigma = 58e6;
    const delta = 1 / Math.sqrt(Math.PI * f * 1.25663706127e-6 * sigma);
    for (const [q, want] of table) {
      const got = roundWireAcResistanceFactor({ diameter: m(Math.SQRT2 * q * delta), frequency: Hz(f), conductivity: sigma as Conductivity });
      expect(Math.abs(got - want), `q = ${q}: ${got} vs table ${want} (NBS Circular 74 / Terman, from memory)`).toBeLessThanOrEqual(5e-4 + 1e-12);
    }
  });

  it("for 1 mm copper at 100 kHz (a / delta = 2.39) lies between the table's q = 3 and q = 4 entries", () => {
    // q = sqrt(2) 2.39 = 3.38: between 1.318 and 1.678 in the table above (NBS Circular 74 / Terman, from memory).
    const f = roundWireAcResistanceFactor({ diameter: quantity(1, "mm"), frequency: quantity(100, "kHz") });
    expect(f).toBeGreaterThan(1.318);
    expect(f).toBeLessThan(1.678);
    expect(evaluate("roundWireAcResistanceFactor", { diameter: "1 mm", frequency: "100 kHz" }).value).toBe(f);
  });

  it("warns when the material is not a good conductor at that frequency", () => {
    const d = roundWireAcResistanceFactor.details({ diameter: m(1e-3), frequency: Hz(1e12), conductivity: 1 as Conductivity });
    expect(d.warnings.map((w) => w.code)).toEqual(["not_a_good_conductor"]);
  });
});
