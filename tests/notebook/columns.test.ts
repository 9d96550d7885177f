// columns(...) in the notebook binding: evaluateColumns from mathjs expressions,
// each row as evaluate gives it, bad rows coded and the others computed.
import { describe, expect, it } from "vitest";
import { evaluate } from "../../src/core/evaluate.js";
import { createNotebookMath } from "../../src/notebook/index.js";

describe("columns in a notebook", () => {
  const math = createNotebookMath();
  it("evaluates a formula over a column of Units with one value fixed, coding the bad rows", () => {
    const r = math.evaluate('columns("parallelPlateCapacitance", {area: 1 cm^2, gap: [0.1 mm, 0.2 mm, 5 kg, -1 mm]})') as {
      output: { values: (number | null)[] }; errors: (string | null)[]; rowErrors: { code: string; first: { row: number; input: string } }[];
    };
    expect(r.output.values.slice(0, 2)).toEqual(["0.1 mm", "0.2 mm"].map((gap) => evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap }).value));
    expect(r.errors).toEqual([null, null, "wrong_dimension", "out_of_domain"]);
    expect(r.rowErrors.map((e) => [e.code, e.first.row, e.first.input])).toEqual([["wrong_dimension", 2, "gap"], ["out_of_domain", 3, "gap"]]);
  });

  it("takes unit strings and SI numbers in a column, and names an unknown input", () => {
    const r = math.evaluate('columns("parallelPlateCapacitance", {area: ["1 cm^2", 2e-4], gap: 0.1 mm})') as { output: { values: number[] } };
    expect(r.output.values[1]).toBe(evaluate("parallelPlateCapacitance", { area: 2e-4, gap: "0.1 mm" }).value);
    expect(() => math.evaluate('columns("parallelPlateCapacitance", {width: [1], gap: 1})')).toThrow(/unknown input "width"/);
  });
});
