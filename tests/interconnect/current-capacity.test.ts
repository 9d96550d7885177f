// The IPC-2221 trace-current fit: the standard's equation at a few points
// (decimal.js, in the standard's own units), trade tables read from its chart,
// properties, notes, solve and bad input. The numerics over the double range are
// in extremes-accuracy.test.ts.
import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluate, quantity, solve, traceCurrentForTemperatureRise, type Current, type Length, type Temperature } from "../../src/index.js";
import { expectFormulaError } from "../helpers/errors.js";
import { checkCases, type ReferenceCase } from "../helpers/reference.js";

const m = (v: number) => v as Length;
const K = (v: number) => v as Temperature;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const MIL = 25.4e-6;
/** 1 oz/ft^2 copper: 1.378 mil, 35 um (common practice, from memory). */
const OZ1 = 35e-6;

interface Trace { widthMil: number; thicknessMil: number; rise: number; layer?: "external" | "internal" }
const current = (x: Trace) =>
  traceCurrentForTemperatureRise({ width: m(x.widthMil * MIL), thickness: m(x.thicknessMil * MIL), temperatureRise: K(x.rise), layer: x.layer ?? "external" });

/** IPC-2221B sec. 6.2 as the standard writes it, in its units (A, degC rise, square mils), 30 digits. */
const standard = (k: string, rise: number, areaMil2: string) =>
  new Decimal(k).times(new Decimal(rise).pow("0.44")).times(new Decimal(areaMil2).pow("0.725")).toNumber();

describe("trace current for a temperature rise (IPC-2221 curve fit)", () => {
  it("matches the standard's equation I = k dT^0.44 A^0.725 evaluated in square mils at a few points", () => {
    const src = "IPC-2221B (2012) sec. 6.2, I = k dT^0.44 A^0.725, k = 0.048 external / 0.024 internal, A in square mils (equation from memory), evaluated with decimal.js";
    const cases: ReferenceCase<Trace>[] = [
      { name: "100 mil x 1.378 mil, 10 K, external", input: { widthMil: 100, thicknessMil: 1.378, rise: 10 }, expected: standard("0.048", 10, "137.8"), tolerance: 1e-14, source: src },
      { name: "100 mil x 1.378 mil, 10 K, internal", input: { widthMil: 100, thicknessMil: 1.378, rise: 10, layer: "internal" }, expected: standard("0.024", 10, "137.8"), tolerance: 1e-14, source: src },
      { name: "250 mil x 2.756 mil, 30 K, external", input: { widthMil: 250, thicknessMil: 2.756, rise: 30 }, expected: standard("0.048", 30, "689"), tolerance: 1e-14, source: src },
      { name: "10 mil x 0.689 mil, 100 K, internal", input: { widthMil: 10, thicknessMil: 0.689, rise: 100, layer: "internal" }, expected: standard("0.024", 100, "6.89"), tolerance: 1e-14, source: src },
    ];
    checkCases(cases, current);
  });

  it("agrees with the trade's table for 1 oz external copper at a 10 K rise (about 12, 30 and 50 mil for 1, 2 and 3 A)", () => {
    // The trade's width-for-current table read from the IPC-2221 external chart (common practice, from memory):
    // 1 A ~ 12 mil, 2 A ~ 30 mil, 3 A ~ 50 mil on 1 oz copper for a 10 degC rise. A chart reading: 10 %.
    const src = "common practice (from memory): width-for-current table read from the IPC-2221 external-conductor chart, 1 oz copper, 10 degC rise";
    const cases: ReferenceCase<{ widthMil: number }>[] = [
      { name: "12 mil", input: { widthMil: 12 }, expected: 1, tolerance: 0.1, source: src },
      { name: "30 mil", input: { widthMil: 30 }, expected: 2, tolerance: 0.1, source: src },
      { name: "50 mil", input: { widthMil: 50 }, expected: 3, tolerance: 0.1, source: src },
    ];
    checkCases(cases, (x) => traceCurrentForTemperatureRise({ width: m(x.widthMil * MIL), thickness: m(OZ1), temperatureRise: K(10) }));
  });

  it("an internal conductor carries exactly half the external current; the current grows as dT^0.44 and (w t)^0.725", () => {
    const w = fc.double({ min: 1e-4, max: 1e-2, noNaN: true });
    const t = fc.double({ min: 1e-5, max: 1e-4, noNaN: true });
    const r = fc.double({ min: 1, max: 100, noNaN: true });
    const s = fc.double({ min: 0.1, max: 10, noNaN: true });
    fc.assert(fc.property(w, t, r, s, (width, thickness, rise, k) => {
      const x = { width: m(width), thickness: m(thickness), temperatureRise: K(rise) };
      const ext = traceCurrentForTemperatureRise(x);
      expect(traceCurrentForTemperatureRise({ ...x, layer: "internal" })).toBe(ext / 2);
      expect(rel(traceCurrentForTemperatureRise({ ...x, temperatureRise: K(rise * k) }), ext * Math.pow(k, 0.44))).toBeLessThan(1e-13);
      // Width and thickness enter only through their product.
      expect(rel(traceCurrentForTemperatureRise({ ...x, width: m(width * k), thickness: m(thickness / k) }), ext)).toBeLessThan(1e-13);
      expect(rel(traceCurrentForTemperatureRise({ ...x, width: m(width * k) }), ext * Math.pow(k, 0.725))).toBeLessThan(1e-13);
    }));
  });

  it("warns outside the charts' range and cautions above a 45 K rise", () => {
    const d = (x: Record<string, string>) => evaluate("traceCurrentForTemperatureRise", x);
    const ok = d({ width: "1 mm", thickness: "35 um", temperatureRise: "20 K" });
    expect(ok.warnings).toEqual([]);
    expect(ok.cautions).toEqual([]);
    expect(d({ width: "1 mm", thickness: "35 um", temperatureRise: "5 K" }).warnings.map((w) => w.code)).toEqual(["rise_range"]);
    expect(d({ width: "15 mm", thickness: "35 um", temperatureRise: "20 K" }).warnings.map((w) => w.code)).toContain("size_range");
    expect(d({ width: "6 mm", thickness: "105 um", temperatureRise: "20 K" }).warnings.map((w) => w.code)).toContain("size_range");
    expect(d({ width: "6 mm", thickness: "70 um", temperatureRise: "30 K", layer: "internal" }).warnings.map((w) => w.code)).toEqual([]);
    // A rise written in degC is read as an absolute temperature: the range warning says so.
    const degC = d({ width: "1 mm", thickness: "35 um", temperatureRise: "10 degC" });
    expect(degC.warnings[0]!.message).toContain("degC");
    // The caution's edge: 45 K itself is quiet, just above it fires.
    expect(d({ width: "1 mm", thickness: "35 um", temperatureRise: "45 K" }).cautions).toEqual([]);
    expect(d({ width: "1 mm", thickness: "35 um", temperatureRise: "45.001 K" }).cautions.map((c) => c.code)).toEqual(["hot_trace"]);
    const hot = d({ width: "1 mm", thickness: "35 um", temperatureRise: "60 K" });
    expect(hot.cautions.map((c) => c.code)).toEqual(["hot_trace"]);
    expect(hot.cautions[0]!.message).toContain("IPC-2152");
    expect(hot.cautions[0]!.message).toContain("Local codes");
    // 35 A is the top of the external chart, 17.5 A of the internal one.
    expect(d({ width: "9 mm", thickness: "70 um", temperatureRise: "100 K", layer: "internal" }).warnings.map((w) => w.code)).toContain("current_range");
  });

  it("solves the width for a current and evaluates back", () => {
    const w = solve(traceCurrentForTemperatureRise, "width", { thickness: m(OZ1), temperatureRise: K(10), target: 2 as Current });
    expect(rel(traceCurrentForTemperatureRise({ width: w, thickness: m(OZ1), temperatureRise: K(10) }), 2)).toBeLessThan(1e-9);
    const t = solve(traceCurrentForTemperatureRise, "temperatureRise", { width: quantity(0.5, "mm"), thickness: m(OZ1), layer: "internal", target: 1 as Current });
    expect(rel(traceCurrentForTemperatureRise({ width: quantity(0.5, "mm"), thickness: m(OZ1), temperatureRise: t, layer: "internal" }), 1)).toBeLessThan(1e-9);
  });

  it("bad input is a coded error naming the input", () => {
    const good = { width: "1 mm", thickness: "35 um", temperatureRise: "10 K" };
    expect(expectFormulaError(() => evaluate("traceCurrentForTemperatureRise", { ...good, width: "-1 mm" })).input).toBe("width");
    expect(expectFormulaError(() => evaluate("traceCurrentForTemperatureRise", { ...good, thickness: 0 })).input).toBe("thickness");
    expect(expectFormulaError(() => evaluate("traceCurrentForTemperatureRise", { ...good, temperatureRise: "0 K" })).input).toBe("temperatureRise");
    expect(expectFormulaError(() => evaluate("traceCurrentForTemperatureRise", { ...good, temperatureRise: "10 mm" })).input).toBe("temperatureRise");
    expect(expectFormulaError(() => evaluate("traceCurrentForTemperatureRise", { ...good, layer: "middle" })).input).toBe("layer");
  });
});
