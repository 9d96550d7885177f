// The limits stated in the tools' doc comments, each measured: the value at
// the limit is taken, the next one refused with invalid_argument naming it.
import { describe, expect, it } from "vitest";
import { sweep } from "../../src/tools/sweep.js";
import { tolerance } from "../../src/tools/tolerance.js";
import { expectFormulaError } from "../helpers/errors.js";
import { measured } from "./note-fixtures.js";

const box = { a: { nominal: 4, plusMinus: 1 }, b: { nominal: 2, plusMinus: 0.5 } };

describe("tolerance option limits", () => {
  it("takes 0 to 1e6 Monte Carlo samples as whole numbers and refuses anything else, naming the option", () => {
    expect(tolerance(measured, box, { samples: 0 }).monteCarlo).toBeUndefined();
    for (const samples of [-1, 1e6 + 1, 2.5, NaN, Infinity, "10" as never]) {
      const e = expectFormulaError(() => tolerance(measured, box, { samples }));
      expect([e.code, e.input], String(samples)).toEqual(["invalid_argument", "samples"]);
      expect(e.message).not.toMatch(/Infinity|NaN/);
    }
    for (const seed of [1.5, NaN]) expect(expectFormulaError(() => tolerance(measured, box, { seed })).input).toBe("seed");
  });

  it("evaluates every corner up to maxCornerInputs toleranced inputs (0 to 16), and only the slope corners above", () => {
    expect(tolerance(measured, box, { samples: 0 }).worstCase).toMatchObject({ method: "corners", evaluated: 4 });
    expect(tolerance(measured, box, { samples: 0, maxCornerInputs: 2 }).worstCase).toMatchObject({ method: "corners", evaluated: 4 });
    expect(tolerance(measured, box, { samples: 0, maxCornerInputs: 1 }).worstCase).toMatchObject({ method: "derivative signs", evaluated: 2 });
    expect(tolerance(measured, box, { samples: 0, maxCornerInputs: 0 }).worstCase.method).toBe("derivative signs");
    for (const maxCornerInputs of [-1, 17, 1.5]) expect(expectFormulaError(() => tolerance(measured, box, { maxCornerInputs })).input).toBe("maxCornerInputs");
  });
});

describe("sweep limits", () => {
  it("refuses more than 4,000,000 points in all before allocating anything", () => {
    const e = expectFormulaError(() => sweep(measured, { vary: { a: { from: 1, to: 2, points: 2001 }, b: { from: 1, to: 2, points: 2000 } } }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "points"]);
  });

  it("takes whole-number point counts from 1 and refuses others, naming the input", () => {
    expect(sweep(measured, { vary: { a: { from: 1, to: 2, points: 1 } }, fixed: { b: 1 } }).axes[0]!.values).toEqual(new Float64Array([1]));
    for (const points of [0, 1.5, NaN, 4_000_001]) {
      const e = expectFormulaError(() => sweep(measured, { vary: { a: { from: 1, to: 2, points } }, fixed: { b: 1 } }));
      expect([e.code, e.input], String(points)).toEqual(["invalid_argument", "a"]);
    }
  });
});
