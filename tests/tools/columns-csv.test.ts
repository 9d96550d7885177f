// CSV in and out of evaluateColumns: header units and value units read as
// evaluate reads the same unit strings; limits and malformed text are coded
// errors naming "csv" (or the input), never a wrong number.
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { columnsToCsv, evaluateCsv, readCsvTable } from "../../src/tools/columns-csv.js";
import { ROW_ERROR_CODES } from "../../src/tools/columns.js";
import { sweep, sweepToCsv } from "../../src/tools/sweep.js";

const codes = (r: { errors: Uint8Array }): string[] => [...r.errors].map((e) => ROW_ERROR_CODES[e]!);

describe("evaluateCsv", () => {
  it("reads units from the header and from the values alike, each row as evaluate reads its unit strings", () => {
    const inHeader = evaluateCsv("parallelPlateCapacitance", "area (cm^2),gap (mm),relativePermittivity\n1,0.1,4.4\n2.5,0.25,1\n0.3,1e-2,\n");
    const inValues = evaluateCsv("parallelPlateCapacitance", "area,gap,relativePermittivity\n1 cm^2,0.1 mm,4.4\n2.5 cm^2,0.25 mm,1\n0.3 cm^2,1e-2 mm,\n");
    const rows = [
      { area: "1 cm^2", gap: "0.1 mm", relativePermittivity: 4.4 },
      { area: "2.5 cm^2", gap: "0.25 mm", relativePermittivity: 1 },
      { area: "0.3 cm^2", gap: "1e-2 mm" },
    ];
    rows.forEach((row, i) => {
      const v = evaluate("parallelPlateCapacitance", row).value;
      expect(inHeader.output.values[i]).toBe(v);
      expect(inValues.output.values[i]).toBe(v);
    });
    expect(inHeader.failed).toBe(0);
  });

  it("reads a cell with its own unit as written under a header unit, and a header unit of the wrong dimension as a coded error", () => {
    const r = evaluateCsv("parallelPlateCapacitance", "area (mm^2),gap (mm)\n100,0.1\n100,100 um\n", {});
    expect(r.output.values[1]).toBe(r.output.values[0]);
    expect(() => evaluateCsv("parallelPlateCapacitance", "area (mm^2),gap (kg)\n100,0.1\n")).toThrow(expect.objectContaining({ code: "wrong_dimension", input: "gap" }));
  });

  it("marks bad rows with their codes and computes the rest; short rows leave cells empty", () => {
    const text = 'area,gap\n1e-4,1e-4\n1e-4,-1\n1e-4,"1e-4"\n1e-4,abc\n1e-4\n\n1e-4,2 kg\r\n1e-4,2e-4\n';
    const r = evaluateCsv("parallelPlateCapacitance", text);
    expect(r.rows).toBe(7);
    expect(codes(r)).toEqual(["", "out_of_domain", "", "unparsable", "missing_input", "wrong_dimension", ""]);
    expect(r.output.values[6]).toBe(evaluate("parallelPlateCapacitance", { area: 1e-4, gap: 2e-4 }).value);
  });

  it("takes inputs fixed for every row beside the columns", () => {
    const r = evaluateCsv("parallelPlateCapacitance", "gap (um)\n100\n200\n", { area: "1 cm^2", relativePermittivity: 2 });
    expect(r.output.values[1]).toBe(evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "200 um", relativePermittivity: 2 }).value);
    expect(() => evaluateCsv("parallelPlateCapacitance", "gap\n1\n", { gap: 1 })).toThrow(expect.objectContaining({ code: "invalid_argument", input: "gap" }));
  });

  it("reads quoted cells with commas, quotes and line breaks", () => {
    const t = readCsvTable('shape,"outerDiameter (mm)"\n"square",2\n"oct""agonal",3\n"a,\nb",4\n');
    expect(t.columns.shape).toEqual(["square", 'oct"agonal', "a,\nb"]);
    expect(t.columns.outerDiameter).toEqual({ values: ["2", "3", "4"], unit: "mm" });
  });

  it("reads back the CSV that sweepToCsv writes", () => {
    const s = sweep("parallelPlateCapacitance", { vary: { gap: { from: 1e-4, to: 1e-3, points: 4 } }, fixed: { area: 1e-4 } });
    const text = sweepToCsv(s).split("\n").map((l) => l.split(",")[0]).join("\n");
    const r = evaluateCsv("parallelPlateCapacitance", text, { area: 1e-4 });
    expect(r.output.values).toEqual(s.output.values);
  });

  it("writes the result column and an error column, full precision, empty where a row failed", () => {
    const r = evaluateCsv("parallelPlateCapacitance", "area,gap\n1e-4,1e-4\n1e-4,0\n");
    expect(columnsToCsv(r)).toBe(`parallelPlateCapacitance (F),error\n${String(r.output.values[0])},\n,out_of_domain\n`);
    const v = evaluateCsv("loopField", "radialDistance,axialDistance\n0,0.05\n", { current: 1, radius: 0.1 });
    expect(columnsToCsv(v).split("\n")[0]).toBe("loopField.radial (T),loopField.axial (T),error");
  });

  describe("refuses text it cannot read, with a coded error", () => {
    const refuse = (text: string, code: string, input: string, limits = {}): void => {
      let err: unknown;
      try {
        evaluateCsv("parallelPlateCapacitance", text, {}, limits);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(FormulaError);
      expect({ code: (err as FormulaError).code, input: (err as FormulaError).input }).toEqual({ code, input });
    };
    it("text over the size limit", () => refuse("area,gap\n1,1\n", "invalid_argument", "csv", { maxChars: 10 }));
    it("more rows than the row limit", () => refuse("area,gap\n1,1\n1,1\n1,1\n", "invalid_argument", "csv", { maxRows: 2 }));
    it("an empty text", () => refuse("", "invalid_argument", "csv"));
    it("a header without rows", () => refuse("area,gap\n", "invalid_argument", "csv"));
    it("a row with more cells than the header (a decimal comma)", () => refuse("area,gap\n1,5,1\n", "invalid_argument", "csv"));
    it("an unclosed quote", () => refuse('area,gap\n"1,1\n', "unparsable", "csv"));
    it("a header cell that is no input name", () => refuse("area [m2],gap\n1,1\n", "unparsable", "csv"));
    it("an input named twice", () => refuse("gap,gap\n1,1\n", "invalid_argument", "gap"));
    it("a header naming no input of the formula", () => refuse("area,gap,width\n1,1,1\n", "unknown_input", "width"));
    it("a bad limit", () => refuse("area,gap\n1,1\n", "invalid_argument", "maxRows", { maxRows: 0 }));
  });
});
