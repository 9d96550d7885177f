// Exposure reference levels against the ICNIRP tables as published and restated:
// ICNIRP 2010 (Health Physics 99(6) 818-836) Table 3 (occupational) and Table 4
// (general public), checked against a bioelectromagnetism handbook's Table 7.3
// ("reproduced from ICNIRP, Health Physics 99: 818-836, 2010") and the 60 Hz
// figures quoted by emftesting.net (1 mT and 8.3 kV/m occupational, 200 uT and
// 4167 V/m public); ICNIRP 2009 static limits (400 mT public, 2 T occupational)
// as summarised in the ICES EMF database (study 1840).
import { describe, expect, it } from "vitest";
import { evaluate, evaluateDesign, exposureReferenceLevel, formulaCatalog, solveRequest, sweep, type Frequency } from "../../src/index.js";
import { createNotebookMath } from "../../src/notebook/index.js";
import { checkCases } from "../helpers/reference.js";
import { codeOf } from "../helpers/errors.js";

const level = (frequency: number, group: "public" | "occupational", quantity: "fluxDensity" | "electricField"): number =>
  evaluate("exposureReferenceLevel", { frequency, group, quantity }).value as number;

describe("exposure reference levels (ICNIRP 2010 Tables 3 and 4, ICNIRP 2009 static)", () => {
  it("gives the general-public flux density of Table 4 in every row", () => {
    checkCases([
      { input: [2], expected: 4e-2 / 4, tolerance: 1e-15, source: "ICNIRP 2010 Table 4, 1-8 Hz: 4e-2/f^2 T" },
      { input: [10], expected: 5e-4, tolerance: 1e-15, source: "ICNIRP 2010 Table 4, 8-25 Hz: 5e-3/f T" },
      { input: [50], expected: 2e-4, tolerance: 0, source: "ICNIRP 2010 Table 4, 25-400 Hz: 2e-4 T (emftesting.net: 2 G at 60 Hz)" },
      { input: [60], expected: 2e-4, tolerance: 0, source: "ICNIRP 2010 Table 4, 25-400 Hz: 2e-4 T" },
      { input: [1000], expected: 8e-5, tolerance: 1e-15, source: "ICNIRP 2010 Table 4, 400 Hz-3 kHz: 8e-2/f T" },
      { input: [50e3], expected: 2.7e-5, tolerance: 0, source: "ICNIRP 2010 Table 4, 3 kHz-10 MHz: 2.7e-5 T" },
    ], ([f]) => level(f!, "public", "fluxDensity"));
  });

  it("gives the occupational flux density of Table 3 in every row", () => {
    checkCases([
      { input: [4], expected: 0.2 / 16, tolerance: 1e-15, source: "ICNIRP 2010 Table 3, 1-8 Hz: 0.2/f^2 T" },
      { input: [20], expected: 2.5e-2 / 20, tolerance: 1e-15, source: "ICNIRP 2010 Table 3, 8-25 Hz: 2.5e-2/f T" },
      { input: [60], expected: 1e-3, tolerance: 0, source: "ICNIRP 2010 Table 3, 25-300 Hz: 1e-3 T (emftesting.net: 10 G at 60 Hz)" },
      { input: [1000], expected: 3e-4, tolerance: 1e-15, source: "ICNIRP 2010 Table 3, 300 Hz-3 kHz: 0.3/f T" },
      { input: [20e3], expected: 1e-4, tolerance: 0, source: "ICNIRP 2010 Table 3, 3 kHz-10 MHz: 1e-4 T" },
    ], ([f]) => level(f!, "occupational", "fluxDensity"));
  });

  it("gives the electric fields of Tables 3 and 4", () => {
    checkCases([
      { input: [60, 0], expected: 250e3 / 60, tolerance: 1e-15, source: "ICNIRP 2010 Table 4, 50-400 Hz: 2.5e2/f kV/m (emftesting.net: 4167 V/m at 60 Hz)" },
      { input: [10, 0], expected: 5e3, tolerance: 0, source: "ICNIRP 2010 Table 4, 1-50 Hz: 5 kV/m" },
      { input: [10e3, 0], expected: 83, tolerance: 0, source: "ICNIRP 2010 Table 4, 3 kHz-10 MHz: 8.3e-2 kV/m" },
      { input: [60, 1], expected: 500e3 / 60, tolerance: 1e-15, source: "ICNIRP 2010 Table 3, 25 Hz-3 kHz: 5e2/f kV/m (emftesting.net: 8300 V/m at 60 Hz)" },
      { input: [10, 1], expected: 2e4, tolerance: 0, source: "ICNIRP 2010 Table 3, 1-25 Hz: 20 kV/m" },
      { input: [10e3, 1], expected: 170, tolerance: 0, source: "ICNIRP 2010 Table 3, 3 kHz-10 MHz: 1.7e-1 kV/m" },
    ], ([f, g]) => level(f!, g ? "occupational" : "public", "electricField"));
  });

  it("takes the static-field limits of ICNIRP 2009 below 1 Hz, warning between 0 and 1 Hz", () => {
    expect(level(0, "public", "fluxDensity")).toBe(0.4);
    expect(level(0, "occupational", "fluxDensity")).toBe(2);
    const r = evaluate("exposureReferenceLevel", { frequency: "0.5 Hz", group: "public", quantity: "fluxDensity" });
    expect(r.value).toBe(0.4);
    expect(r.warnings.map((w) => w.code)).toEqual(["below_one_hertz"]);
    expect(evaluate("exposureReferenceLevel", { frequency: 0, group: "public", quantity: "fluxDensity" }).warnings).toEqual([]);
  });

  it("takes the lower value on a row edge and is continuous where the table's rows meet exactly", () => {
    // 3 kHz: 8e-2/3000 = 26.7 uT against the next row's 27 uT; 250/3000 kV/m = 83.3 V/m against 83 V/m.
    expect(level(3000, "public", "fluxDensity")).toBe(8e-2 / 3000);
    expect(level(3000, "public", "electricField")).toBe(83);
    expect(level(8, "public", "fluxDensity")).toBeCloseTo(6.25e-4, 18);
    expect(level(25, "occupational", "fluxDensity")).toBeCloseTo(1e-3, 18);
  });

  it("returns the quantity asked for: T for a flux density, V/m for an electric field, on every path", () => {
    expect(evaluate("exposureReferenceLevel", { frequency: "50 Hz", group: "public", quantity: "electricField" }).unit).toBe("V/m");
    expect(evaluate("exposureReferenceLevel", { frequency: "50 Hz", group: "public", quantity: "fluxDensity" }).unit).toBe("T");
    expect(exposureReferenceLevel({ frequency: 50 as Frequency, group: "public", quantity: "electricField" })).toBe(5000);
    // solve reads its target in the chosen quantity's unit, and refuses the other one.
    const s = solveRequest({ formula: "exposureReferenceLevel", solveFor: "frequency", target: "100 uT", inputs: { group: "public", quantity: "fluxDensity" }, options: { range: ["500 Hz", "3 kHz"] } });
    expect(s.value).toBeCloseTo(800, 6);
    const e = solveRequest({ formula: "exposureReferenceLevel", solveFor: "frequency", target: "1 kV/m", inputs: { group: "public", quantity: "electricField" }, options: { range: ["60 Hz", "3 kHz"] } });
    expect(e.value).toBeCloseTo(250, 6);
    expect(codeOf(() => solveRequest({ formula: "exposureReferenceLevel", solveFor: "frequency", target: "1 kV/m", inputs: { group: "public", quantity: "fluxDensity" } }))).toBe("wrong_dimension");
    expect(sweep(exposureReferenceLevel, { vary: { frequency: { from: 1e3, to: 2e3, points: 3 } }, fixed: { group: "occupational", quantity: "electricField" } }).output.unit).toBe("V/m");
    // A design step's dimension follows the choice word it binds: an electric field is checked against V/m, not T.
    const d = evaluateDesign({
      title: "exposure check", inputs: { f: "60 Hz" },
      steps: { eLimit: { formula: "exposureReferenceLevel", inputs: { frequency: "f", group: "public", quantity: "electricField" } } },
      checks: ["eLimit > 4 kV/m"],
    });
    expect(d.checks[0]!.pass).toBe(true);
    expect(d.checks[0]!.unit).toBe("V/m");
    expect(codeOf(() => evaluateDesign({
      title: "exposure check", inputs: { f: "60 Hz" },
      steps: { eLimit: { formula: "exposureReferenceLevel", inputs: { frequency: "f", group: "public", quantity: "electricField" } } },
      checks: ["eLimit > 100 uT"],
    }))).toBe("wrong_dimension");
    const nb = createNotebookMath();
    expect(String(nb.evaluate('exposureReferenceLevel(50 Hz, "public", "electricField")'))).toBe("5 kV/m");
    expect(String(nb.evaluate('exposureReferenceLevel(50 Hz, "public", "fluxDensity")'))).toBe("200 uT");
    const cat = formulaCatalog("exposure")[0]!;
    expect(cat.output.byChoice?.dimensions.electricField).toEqual({ dimension: "ElectricField", unit: "V/m" });
  });

  it("cautions, naming its table row, where a flux-density level is at or above the 0.5 mT implant line, and warns above 100 kHz", () => {
    const r = evaluate("exposureReferenceLevel", { frequency: "50 Hz", group: "occupational", quantity: "fluxDensity" });
    expect(r.cautions.map((c) => c.code)).toEqual(["implant_line"]);
    expect(r.cautions[0]!.message).toMatch(/ICNIRP 2010, Table 3 \(occupational\), 25 Hz - 300 Hz: 1e-3 T/);
    expect(r.cautions[0]!.message).toMatch(/not a safety assessment/);
    expect(r.cautions[0]!.message).toMatch(/licensed practice govern/);
    // Public 50 Hz, 200 uT: below the line; the occupational level at 300 Hz - 3 kHz falls through it at 600 Hz.
    expect(evaluate("exposureReferenceLevel", { frequency: "50 Hz", group: "public", quantity: "fluxDensity" }).cautions).toEqual([]);
    expect(evaluate("exposureReferenceLevel", { frequency: "600 Hz", group: "occupational", quantity: "fluxDensity" }).cautions.map((c) => c.code)).toEqual(["implant_line"]);
    expect(evaluate("exposureReferenceLevel", { frequency: "601 Hz", group: "occupational", quantity: "fluxDensity" }).cautions).toEqual([]);
    expect(evaluate("exposureReferenceLevel", { frequency: "50 Hz", group: "occupational", quantity: "electricField" }).cautions).toEqual([]);
    expect(evaluate("exposureReferenceLevel", { frequency: "0 Hz", group: "occupational", quantity: "fluxDensity" }).cautions[0]!.message).toMatch(/ICNIRP 2009 static magnetic field, occupational exposure limit/);
    expect(evaluate("exposureReferenceLevel", { frequency: "200 kHz", group: "public", quantity: "fluxDensity" }).warnings.map((w) => w.code)).toEqual(["radio_frequency_range"]);
    expect(evaluate("exposureReferenceLevel", { frequency: "100 kHz", group: "public", quantity: "fluxDensity" }).warnings).toEqual([]);
  });

  it("refuses a static electric field, frequencies above 10 MHz and below zero, and unknown groups, naming the input", () => {
    expect(codeOf(() => level(0.5, "public", "electricField"))).toBe("out_of_domain");
    expect(codeOf(() => level(10.1e6, "public", "fluxDensity"))).toBe("out_of_domain");
    expect(codeOf(() => level(-1, "public", "fluxDensity"))).toBe("out_of_domain");
    expect(codeOf(() => evaluate("exposureReferenceLevel", { frequency: 50, group: "workers", quantity: "fluxDensity" }))).toBe("out_of_domain");
    expect(level(10e6, "public", "fluxDensity")).toBe(2.7e-5);
  });
});
