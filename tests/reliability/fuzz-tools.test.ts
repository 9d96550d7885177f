/**
 * Fuzz: the design tools, typed (solveDetails, tolerance, sweep) and JSON
 * (solveRequest, toleranceRequest, sweepRequest), with hostile inputs and
 * options (NaN, {}, negative and huge counts, spans to +-1.7e308). Sweeps may
 * hold NaN only where `computed` marks a point not computed (documented).
 */
import { describe, it } from "vitest";
import { driveSync, expectClean, newDrive } from "./fuzz-drive.js";
import { CASES } from "./fuzz-runners.js";

const solved = newDrive();
const toleranced = newDrive();
const swept = newDrive();
const columned = newDrive();

describe("fuzz: solve, tolerance and sweep", () => {
  it(`${CASES.solve} solve cases: a finite result or a coded FormulaError, clean text, bounded loops`, () => {
    driveSync(solved, "solve", CASES.solve);
    expectClean(solved, CASES.solve);
  });

  it(`${CASES.tolerance} tolerance cases: every field finite or a coded FormulaError, clean text, bounded loops`, () => {
    driveSync(toleranced, "tolerance", CASES.tolerance);
    expectClean(toleranced, CASES.tolerance);
  });

  it(`${CASES.sweep} sweep cases: finite axes, NaN only at points not computed, or a coded FormulaError`, () => {
    driveSync(swept, "sweep", CASES.sweep);
    expectClean(swept, CASES.sweep);
  });

  it(`${CASES.columns} columns cases (arrays, typed arrays, unit columns, CSV text): NaN only in failed rows, or a coded FormulaError`, () => {
    driveSync(columned, "columns", CASES.columns);
    expectClean(columned, CASES.columns);
  });
});

