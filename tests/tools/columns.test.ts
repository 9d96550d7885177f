// evaluateColumns: every row's value and error code are those `evaluate`
// gives for the row's inputs alone (an independent path: convert, prepare,
// run and notes per row), bad rows never stop the others, and whole-call
// problems are coded errors naming the input.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { coaxialCapacitance, parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { EPSILON0 } from "../../src/constants/si.js";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import type { AnyFormula } from "../../src/core/formula.js";
import { getFormula } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";
import { evaluateColumns, MAX_COLUMN_ROWS, ROW_ERROR_CODES, type ColumnsResult } from "../../src/tools/columns.js";
import { withoutCodeGeneration } from "../helpers/no-eval.js";
import { isQuantity, specsOf, withExamples } from "../reliability/harness.js";

type Row = Record<string, unknown>;

/** Row i's inputs from the columns given (arrays; a vector input's 3-array is its one value) and the fixed values; an empty cell is not given. */
function rowOf(id: string, inputs: Row, i: number): Row {
  const specs = getFormula(id).definition.inputs as Record<string, InputSpec>;
  const row: Row = {};
  for (const [k, v] of Object.entries(inputs)) {
    const vector = !("choices" in specs[k]!) && (specs[k]!.vector === true || specs[k]!.series !== undefined);
    const cell = v instanceof Float64Array || (Array.isArray(v) && !vector) ? (v as ArrayLike<unknown>)[i] : v;
    if (cell !== "") row[k] = cell;
  }
  return row;
}

/** Each row against evaluate alone: the same value bit for bit, or the same error code. Returns per-note-code counts from evaluate. */
function expectRowsAgree(id: string, inputs: Row, r: ColumnsResult): Map<string, number> {
  const counts = new Map<string, number>();
  for (let i = 0; i < r.rows; i++) {
    const row = rowOf(id, inputs, i);
    let expected: ReturnType<typeof evaluate> | undefined;
    let code = "";
    try {
      expected = evaluate(id, row);
    } catch (e) {
      if (!(e instanceof FormulaError)) throw e;
      code = e.code;
    }
    expect(ROW_ERROR_CODES[r.errors[i]!], `${id} row ${i} ${JSON.stringify(row)}`).toBe(code);
    if (expected === undefined) {
      expect(Number.isNaN(r.output.values[i]), `${id} row ${i} failed, value NaN`).toBe(true);
      continue;
    }
    if (typeof expected.value === "number") expect(r.output.values[i], `${id} row ${i}`).toBe(expected.value);
    else {
      const comps = Object.values(r.output.components!);
      (expected.value as number[]).forEach((v, c) => expect(comps[c]![i], `${id} row ${i} component ${c}`).toBe(v));
    }
    for (const n of [...expected.warnings, ...expected.cautions]) counts.set(n.code, (counts.get(n.code) ?? 0) + 1);
  }
  expect(Object.fromEntries(r.notes.map((n) => [n.code, n.count])), `${id} note counts`).toEqual(Object.fromEntries(counts));
  expect(r.failed).toBe([...r.errors].filter((e) => e !== 0).length);
  return counts;
}

describe("evaluateColumns over a table of parts", () => {
  it("computes 8.854 pF for 1 cm^2 over 0.1 mm of air (eps0 A / d with CODATA 2022 eps0 = 8.8541878188e-12 F/m)", () => {
    const r = evaluateColumns(parallelPlateCapacitance, { area: "1 cm^2", gap: ["0.1 mm", "0.2 mm"] });
    // CODATA 2022 eps0 = 8.8541878188(14)e-12 F/m; A / d = 1e-4 / 1e-4 = 1 m and 0.5 m.
    expect(r.output.values[0]).toBeCloseTo(8.8541878188e-12, 22);
    expect(r.output.values[1]).toBeCloseTo(8.8541878188e-12 / 2, 22);
    expect(r.output.unit).toBe("F");
    expect(EPSILON0).toBe(8.8541878188e-12);
  });

  it("one bad part in 10,000 gets its code and does not stop the others", () => {
    const n = 10_000;
    const area = new Float64Array(n).map((_, i) => 1e-4 * (1 + (i % 7)));
    const gap = new Float64Array(n).map((_, i) => 1e-4 * (1 + (i % 13)));
    gap[4321] = -1e-4;
    const r = evaluateColumns(parallelPlateCapacitance, { area, gap, relativePermittivity: 4.4 });
    expect(r.failed).toBe(1);
    expect(ROW_ERROR_CODES[r.errors[4321]!]).toBe("out_of_domain");
    expect(Number.isNaN(r.output.values[4321])).toBe(true);
    expect(r.rowErrors).toEqual([{ code: "out_of_domain", count: 1, first: { row: 4321, input: "gap", message: 'parallelPlateCapacitance: input "gap" must be > 0, got -0.0001' } }]);
    for (const i of [0, 4320, 4322, n - 1]) {
      expect(r.output.values[i]).toBe(parallelPlateCapacitance({ area: area[i]!, gap: gap[i]!, relativePermittivity: 4.4 } as never));
    }
    expectRowsAgree("parallelPlateCapacitance", { area: [...area], gap: [...gap], relativePermittivity: 4.4 }, r);
  });

  it("gives every row the value or error code evaluate gives it, for random rows with bad values mixed in (property)", () => {
    const value = fc.oneof(
      { weight: 8, arbitrary: fc.double({ min: 1e-6, max: 1e-1, noNaN: true }) },
      { weight: 1, arbitrary: fc.constantFrom(0, -1e-3, NaN, Infinity, 1e300, 5e-324) },
    );
    const permittivity = fc.oneof({ weight: 6, arbitrary: fc.double({ min: 1, max: 100, noNaN: true }) }, { weight: 1, arbitrary: fc.constantFrom(0.5, NaN, 1) });
    fc.assert(
      fc.property(fc.array(fc.tuple(value, value, value, permittivity), { minLength: 1, maxLength: 40 }), (rows) => {
        const inputs = {
          innerRadius: rows.map((r) => r[0]),
          outerRadius: rows.map((r) => r[1]),
          length: new Float64Array(rows.map((r) => r[2])),
          relativePermittivity: rows.map((r) => r[3]),
        };
        const r = evaluateColumns(coaxialCapacitance, inputs);
        expectRowsAgree("coaxialCapacitance", inputs, r);
      }),
      { numRuns: 60 },
    );
  });

  it("agrees with evaluate row by row for every registry formula, columns of scaled examples with bad rows mixed in", () => {
    let checked = 0;
    for (const { f, ex } of withExamples()) {
      const quantities = specsOf(f).filter(([, s]) => isQuantity(s) && !s.vector && !s.series && typeof s.example === "number");
      if (quantities.length === 0) continue;
      const factors = [1, 0.5, 2, 10, 0.1, -1, 0, NaN, 1e200, 1e-200, 3];
      const inputs: Row = { ...ex };
      quantities.forEach(([name], q) => {
        const base = ex[name] as number;
        // A different factor order per input, so rows mix good and bad values differently.
        inputs[name] = factors.map((_, i) => base * factors[(i + 3 * q) % factors.length]!);
      });
      const r = evaluateColumns(f.id, inputs);
      expectRowsAgree(f.id, inputs, r);
      checked++;
    }
    expect(checked).toBeGreaterThan(50);
  });

  it("reads columns of unit strings, mixed numbers and strings, and numbers in a unit, as evaluate reads each value", () => {
    const gap = ["0.1 mm", "100 um", 1e-4, "0.004 in", "2 kg", "fast", "", "1e400 mm"];
    const r = evaluateColumns(parallelPlateCapacitance, { area: "1 cm^2", gap });
    expectRowsAgree("parallelPlateCapacitance", { area: "1 cm^2", gap }, r);
    expect([...r.errors.slice(4)].map((e) => ROW_ERROR_CODES[e])).toEqual(["wrong_dimension", "unparsable", "missing_input", "not_finite"]);
    expect(r.output.values[0]).toBe(r.output.values[1]);

    const mm = evaluateColumns(parallelPlateCapacitance, { area: { values: [1, "2.5", 0.3], unit: "cm^2" }, gap: { values: new Float64Array([0.1, 0.2, 0.3]), unit: "mm" } });
    const asText = { area: ["1 cm^2", "2.5 cm^2", "0.3 cm^2"], gap: ["0.1 mm", "0.2 mm", "0.3 mm"] };
    expectRowsAgree("parallelPlateCapacitance", asText, mm);
    // Offset units are read value by value ("20 degC" is 293.15 K, not 20 times a scale).
    expect(() => evaluateColumns(parallelPlateCapacitance, { area: { values: [1], unit: "kg" }, gap: 1e-3 })).toThrow(expect.objectContaining({ code: "wrong_dimension", input: "area" }));
  });

  it("reads a column of choice words, with a default for empty cells and a code for words not among the choices", () => {
    const inputs = { outerDiameter: 2e-3, innerDiameter: 1e-3, turns: 5, shape: ["square", "circular", "triangle", "", "hexagonal"] };
    const r = evaluateColumns("planarSpiralInductance", inputs);
    expect([...r.errors].map((e) => ROW_ERROR_CODES[e])).toEqual(["", "", "out_of_domain", "", ""]);
    expectRowsAgree("planarSpiralInductance", inputs, r);
  });

  it("gives one column per component for vector outputs, the first also as values", () => {
    const inputs = { current: 1, radius: 0.1, radialDistance: [0, 0.05, 0.1, 0.2], axialDistance: [0.05, 0.05, 0, 0.1] };
    const r = evaluateColumns("loopField", inputs);
    expect(Object.keys(r.output.components!)).toEqual(["radial", "axial"]);
    expect(r.output.values).toBe(r.output.components!.radial);
    expect(ROW_ERROR_CODES[r.errors[2]!]).toBe("out_of_domain"); // on the wire
    expectRowsAgree("loopField", inputs, r);
  });

  it("fills arrays the caller passes, and computes a row range that equals the same rows of the whole table", () => {
    const n = 500;
    const area = new Float64Array(n).map((_, i) => 1e-4 * (1 + (i % 11)));
    const gap = new Float64Array(n).map((_, i) => (i % 97 === 5 ? -1 : 1e-5 * (1 + (i % 17))));
    const whole = evaluateColumns(parallelPlateCapacitance, { area, gap });
    const output = new Float64Array(n);
    const errors = new Uint8Array(n);
    const parts = [[0, 123], [123, 124], [124, 400], [400, n]].map(([from, to]) => evaluateColumns(parallelPlateCapacitance, { area, gap }, { output, errors, from, to }));
    expect(parts[0]!.output.values).toBe(output);
    expect(parts[0]!.errors).toBe(errors);
    expect(output).toEqual(whole.output.values);
    expect(errors).toEqual(whole.errors);
    // Merged as the options document: counts by sum, worst by largest measure, first failed row by lowest.
    expect(parts.reduce((s, p) => s + p.failed, 0)).toBe(whole.failed);
    const code = whole.notes[0]!.code;
    const mine = parts.flatMap((p) => p.notes.filter((s) => s.code === code));
    expect(mine.reduce((s, p) => s + p.count, 0)).toBe(whole.notes[0]!.count);
    const worst = mine.reduce((a, b) => (b.worst.measure! > a.worst.measure! ? b : a));
    expect(worst.worst).toEqual(whole.notes[0]!.worst);
    const firsts = parts.flatMap((p) => p.rowErrors).map((e) => e.first.row);
    expect(Math.min(...firsts)).toBe(whole.rowErrors[0]!.first.row);
  });

  it("runs without code generation (strict Content-Security-Policy) with the same results", () => {
    const inputs = { innerRadius: [1e-3, 2e-3, 3e-3, NaN], outerRadius: [4e-3, 1e-3, 5e-3, 1e-2], length: 2 };
    const r = withoutCodeGeneration(() => evaluateColumns(coaxialCapacitance, inputs));
    expectRowsAgree("coaxialCapacitance", inputs, r);
  });
});

describe("evaluateColumns refuses a call it cannot read, with a coded error naming the input", () => {
  const f: AnyFormula = parallelPlateCapacitance as unknown as AnyFormula;
  const refuse = (inputs: unknown, code: string, input: string, options?: object): void => {
    const label = `${code} ${input}`;
    let err: unknown;
    try {
      evaluateColumns(f, inputs as never, options as never);
    } catch (e) {
      err = e;
    }
    expect(err, label).toBeInstanceOf(FormulaError);
    expect((err as FormulaError).code).toBe(code);
    expect((err as FormulaError).input).toBe(input);
  };

  it("columns of different lengths", () => refuse({ area: [1, 2, 3], gap: [1, 2] }, "invalid_argument", "gap"));
  it("a column longer than the limit", () => refuse({ area: 1, gap: new Array(MAX_COLUMN_ROWS + 1) }, "invalid_argument", "gap"));
  it("an empty column", () => refuse({ area: [], gap: [] }, "invalid_argument", "area"));
  it("an unknown input", () => refuse({ area: [1], gap: [1], spacing: [1] }, "unknown_input", "spacing"));
  it("a required input not given", () => refuse({ area: [1, 2] }, "missing_input", "gap"));
  it("a bad fixed value, once for the whole call", () => refuse({ area: "1 kg", gap: [1, 2] }, "wrong_dimension", "area"));
  it("a fixed value out of its domain", () => refuse({ area: [1, 2], gap: -1 }, "out_of_domain", "gap"));
  it("an output array of the wrong length", () => refuse({ area: [1, 2], gap: 1 }, "invalid_argument", "output", { output: new Float64Array(3) }));
  it("an error array of the wrong type", () => refuse({ area: [1, 2], gap: 1 }, "invalid_argument", "errors", { errors: new Float64Array(2) }));
  it("a row range outside the table", () => refuse({ area: [1, 2], gap: 1 }, "invalid_argument", "to", { to: 3 }));
  it("a unit column whose values are no column", () => refuse({ area: { values: 5, unit: "mm^2" }, gap: 1 }, "wrong_type", "area"));
  it("inputs that are no object", () => refuse([1, 2], "wrong_type", "inputs"));
  it("a column for a vector input", () => {
    expect(() => evaluateColumns("lorentzForce", { charge: 1, velocity: [[1, 0, 0], [0, 1, 0]], electricField: [0, 0, 0], fluxDensity: [0, 0, 1] } as never))
      .toThrow(expect.objectContaining({ code: "invalid_argument", input: "velocity" }));
  });
});
