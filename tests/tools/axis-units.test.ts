// Axis units for charts. The prefixes and their powers are those of the SI
// Brochure (BIPM, 9th ed., 2019, Table 7); a prefix on a squared unit scales by
// its square (same Brochure, Sec. 3: "mm^2 means (mm)^2"). Choosing the prefix
// that keeps the largest value at 1 or more is common practice for plot axes.
import { describe, expect, it } from "vitest";
import { axisTitle, axisUnit, largestMagnitude, unitLabel } from "../../src/tools/axis-units.js";

describe("engineering units for chart axes", () => {
  it("picks the prefix that keeps the largest value at 1 or more", () => {
    expect(axisUnit("m", 1e-3)).toEqual({ factor: 1e-3, label: "mm" });
    expect(axisUnit("m", 0.99e-3)).toEqual({ factor: 1e-6, label: "µm" });
    expect(axisUnit("F", 8.854e-12)).toEqual({ factor: 1e-12, label: "pF" });
    expect(axisUnit("Hz", 2.4e9)).toEqual({ factor: 1e9, label: "GHz" });
    expect(axisUnit("ohm", 4700)).toEqual({ factor: 1e3, label: "kΩ" });
    expect(axisUnit("V", 230)).toEqual({ factor: 1, label: "V" });
  });

  it("scales a prefix on a squared or cubed unit by its power", () => {
    // 1 cm^2 = 100 mm^2: mm^2 is 1e-6 m^2.
    expect(axisUnit("m^2", 1e-4)).toEqual({ factor: 1e-6, label: "mm²" });
    expect(axisUnit("m^3", 1e-6)).toEqual({ factor: 1e-9, label: "mm³" });
  });

  it("puts the prefix on the first symbol of a compound unit", () => {
    expect(axisUnit("F/m", 1e-10)).toEqual({ factor: 1e-12, label: "pF/m" });
    expect(axisUnit("A/m^2", 2e-2)).toEqual({ factor: 1e-3, label: "mA/m²" });
    expect(axisUnit("V m/s", 5e3)).toEqual({ factor: 1e3, label: "kV·m/s" });
  });

  it("writes a power of ten for units without everyday prefixes and for large plain numbers", () => {
    expect(axisUnit("kg", 3e-6)).toEqual({ factor: 1e-6, label: "×10⁻⁶ kg" });
    expect(axisUnit("1/m^3", 1e25)).toEqual({ factor: 1e24, label: "×10²⁴ 1/m³" });
    expect(axisUnit("", 1e6)).toEqual({ factor: 1e6, label: "×10⁶" });
    expect(axisUnit("", 1000)).toEqual({ factor: 1, label: "" });
    expect(axisUnit("kg", 0.5)).toEqual({ factor: 1, label: "kg" });
  });

  it("stays within the prefixes from femto to tera", () => {
    expect(axisUnit("Hz", 1e20)).toEqual({ factor: 1e12, label: "THz" });
    expect(axisUnit("F", 1e-20)).toEqual({ factor: 1e-15, label: "fF" });
  });

  it("leaves an axis with no finite value unscaled", () => {
    expect(axisUnit("m", 0)).toEqual({ factor: 1, label: "m" });
    expect(axisUnit("m", Number.POSITIVE_INFINITY)).toEqual({ factor: 1, label: "m" });
  });

  it("finds the largest magnitude among the computed finite values", () => {
    expect(largestMagnitude([1, -5, Number.NaN, 3])).toBe(5);
    expect(largestMagnitude(new Float64Array([1, -5, 3]), new Uint8Array([1, 0, 1]))).toBe(3);
    expect(largestMagnitude([])).toBe(0);
  });

  it("writes unit labels as printed and titles with the unit in brackets", () => {
    expect(unitLabel("ohm m")).toBe("Ω·m");
    expect(axisTitle("gap", { factor: 1e-3, label: "mm" })).toBe("gap (mm)");
    expect(axisTitle("turns", { factor: 1, label: "" })).toBe("turns");
  });
});
