// Tolerance results carry the notes raised over the sampled range: nominal,
// worst-case corners, band scans and Monte Carlo samples, each code with its
// count and worst sample.
import { describe, expect, it } from "vitest";
import { tolerance, toleranceRequest } from "../../src/tools/tolerance.js";
import { measured } from "./note-fixtures.js";

describe("notes of a tolerance analysis", () => {
  it("counts every checked sample and finds the worst corner by measure", () => {
    const r = tolerance(measured, { a: { nominal: 4, plusMinus: 2 }, b: { nominal: 3, percent: 10 } }, { samples: 1000 });
    // Nominal, 4 corners, 17 scan points per input, 1000 Monte Carlo samples (all inside a < 9).
    expect(r.notesOver).toBe(1 + 4 + 2 * 17 + 1000);
    const always = r.notes.find((s) => s.code === "always_here")!;
    expect(always).toMatchObject({ kind: "caution", count: r.notesOver, worst: { index: 0, inputs: { a: 4, b: 3 } } });
    const large = r.notes.find((s) => s.code === "large")!;
    // y = a b is largest at the corner a = 6, b = 3.3: 19.8 (by hand).
    expect(large.worst.measure).toBeCloseTo(19.8, 12);
    expect(large.worst.inputs.a).toBe(6);
    expect(large.worst.inputs.b).toBeCloseTo(3.3, 14);
    expect(large.worst.message).toBe(`y is ${large.worst.measure}`);
    expect(large.count).toBeGreaterThan(0);
    expect(large.count).toBeLessThan(r.notesOver);
    // At nominal y = 12 > 10: the warning carries the nominal's text.
    expect(r.warnings).toEqual([{ code: "large", message: "y is 12" }]);
  });

  it("counts a note raised at every sample as often as samples were checked", () => {
    // y >= 4 x 2.7 = 10.8 > 10 everywhere in the box.
    const r = tolerance(measured, { a: { nominal: 5, plusMinus: 1 }, b: { nominal: 3, percent: 10 } }, { samples: 300 });
    expect(r.notes.find((s) => s.code === "large")!.count).toBe(r.notesOver);
  });

  it("reports a note raised only away from nominal, with the text at its worst sample", () => {
    const r = tolerance(measured, { a: { nominal: 2, plusMinus: 1.9 }, b: 3 }, { samples: 200 });
    const large = r.notes.find((s) => s.code === "large")!;
    expect(large.worst.inputs.a).toBeCloseTo(3.9, 14);
    expect(r.warnings).toEqual([{ code: "large", message: large.worst.message }]);
  });

  it("flags fringing at every sample of a 2 mm +- 50 % gap on 1 cm^2 plates", () => {
    // gap / sqrt(area) >= 1 mm / 10 mm = 10 %, above the 1 % where fringing stops being small (common practice).
    const r = toleranceRequest({ formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "2 mm", percent: 50 } }, options: { samples: 200 } });
    expect(r.notes.find((s) => s.code === "fringing")!.count).toBe(r.notesOver);
    expect(r.notesOver).toBe(1 + 2 + 17 + 200);
  });
});
