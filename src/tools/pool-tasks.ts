import { FormulaError, type ErrorCode } from "../core/errors.js";
import { getFormula } from "../core/registry.js";
import type { QuantityInput } from "../core/spec.js";
import { fieldRange, type InsideCount } from "../flux/biot-savart.js";
import { mutualRows, segments, selfRows } from "../inductance/neumann.js";
import { type ColumnsPart, columnsRange, type ColumnsTaskData } from "./columns-task.js";
import { bind, specsOf } from "./convert.js";
import { computePoints } from "./sweep-points.js";
import { bindGrid, layoutSweep, planSweep, type SweepSpec } from "./sweep.js";
import { monteCarloRange, type MonteCarloPart, type Varied } from "./tolerance.js";

/*
 * The work one pool thread does: an index range of one call. Tasks and
 * results are plain data (structured clone); large arrays travel in
 * SharedArrayBuffers the calling thread allocated, so a range is written in
 * place. Every task recomputes from the request what it needs (a formula is
 * looked up by id), with the same code as the single-thread call.
 */

/** A toleranced input as a task carries it (its spec is looked up again by name). */
export type VariedData = Omit<Varied, "spec">;

export type PoolTask =
  | { readonly kind: "tolerance"; readonly formula: string; readonly fixed: Readonly<Record<string, unknown>>; readonly varied: readonly VariedData[]; readonly seed: number; readonly offset: number; readonly start: number; readonly end: number }
  | { readonly kind: "sweep"; readonly formula: string; readonly spec: SweepSpec; readonly buffer: SharedArrayBuffer; readonly start: number; readonly end: number }
  | { readonly kind: "field"; readonly path: Float64Array; readonly current: number; readonly points: Float64Array; readonly out: Float64Array; readonly wireRadius: number; readonly start: number; readonly end: number }
  | { readonly kind: "mutual"; readonly pathA: Float64Array; readonly pathB: Float64Array; readonly maxDepth: number; readonly start: number; readonly end: number }
  | { readonly kind: "self"; readonly path: Float64Array; readonly maxDepth: number; readonly start: number; readonly end: number }
  | { readonly kind: "columns"; readonly table: ColumnsTaskData; readonly start: number; readonly end: number };

/** A FormulaError as data: rebuilt in the calling thread with its code, fields and message. */
export interface ErrorData {
  readonly code: ErrorCode;
  readonly message: string;
  readonly fields: Record<string, unknown>;
}

export type TaskOutcome =
  | { readonly ok: true; readonly value: MonteCarloPart | number | InsideCount | Float64Array | ColumnsPart }
  | { readonly ok: false; readonly error: ErrorData };

/** Runs one task; a FormulaError comes back as data (see rebuildError), anything else is thrown. */
export function runTask(task: PoolTask): TaskOutcome {
  try {
    return { ok: true, value: compute(task) };
  } catch (e) {
    if (!(e instanceof FormulaError)) throw e;
    const { code, message, formula, input, value, expected, received, rule } = e;
    return { ok: false, error: { code, message, fields: { formula, input, value, expected, received, rule } } };
  }
}

/** The FormulaError a task reported, as the single-thread call would have thrown it. */
export function rebuildError(d: ErrorData): FormulaError {
  const e = new FormulaError(d.code, d.fields);
  e.message = d.message;
  return e;
}

function compute(task: PoolTask): MonteCarloPart | number | InsideCount | Float64Array | ColumnsPart {
  switch (task.kind) {
    case "tolerance": {
      const formula = getFormula(task.formula);
      const specs = specsOf(formula);
      const varied: Varied[] = task.varied.map((v) => ({ ...v, spec: specs[v.name] as QuantityInput }));
      const probes: Record<string, number> = {};
      for (const v of varied) probes[v.name] = v.nominal;
      const b = bind(formula, task.fixed, probes);
      return monteCarloRange(formula, b, varied, task.seed, task.offset, task.start, task.end);
    }
    case "sweep": {
      const plan = planSweep(getFormula(task.formula), task.spec);
      const grid = bindGrid(plan, layoutSweep(plan, task.buffer, false));
      return computePoints(plan.formula, grid.g, grid.axis0, grid.axis1, task.start, task.end);
    }
    case "field":
      return fieldRange(task.path, task.current, task.points, task.out, task.wireRadius, task.start, task.end);
    case "mutual":
      return mutualRows(segments(task.pathA, "pathA", "mutualInductance"), segments(task.pathB, "pathB", "mutualInductance"), task.maxDepth, task.start, task.end);
    case "self":
      return selfRows(segments(task.path, "path", "polylineSelfInductance"), task.maxDepth, task.start, task.end);
    case "columns":
      return columnsRange(task.table, task.start, task.end);
  }
}
