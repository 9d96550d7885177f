import { FormulaError, type ErrorCode } from "../core/errors.js";
import { type AbortSignalLike, cancelledError } from "../core/progress.js";
import { getFormula } from "../core/registry.js";
import type { QuantityInput } from "../core/spec.js";
import { fieldRange, type InsideCount } from "../flux/biot-savart.js";
import { mutualRows, segments, selfRows } from "../inductance/neumann.js";
import { inPieces } from "./chunks.js";
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
 *
 * Progress and cancellation: runOnPool adds to every task the call's shared
 * control array and the task's slot in it (TaskControl). The task reads the
 * cancel flag and stores the items it has done into its slot between blocks
 * of its work (blockHook), so the calling thread can report progress inside
 * long tasks and a cancel stops a running task within one block.
 */

/** How a caller of runOnPool follows and stops its tasks (see pool.node.ts). */
export interface PoolWatch {
  /** Aborting it cancels the call: no more tasks start, running ones stop within one block, the promise rejects "cancelled". */
  readonly signal?: AbortSignalLike;
  /** Items done so far over all tasks (each task's own unit, summed); throwing cancels the call with that error. */
  readonly progress?: (done: number) => void;
}

/**
 * A parallel call's shared control: Int32 cells in a SharedArrayBuffer.
 * Cell CANCEL_CELL is the cancel flag (1: stop). Task i has two cells:
 * progressCell(i), the items it has done while running (-1 until it starts,
 * always below its size), and finalCell(i), its size once it has finished.
 * The calling thread counts a task whole only when it has received its
 * result, so a report before the last result is below the total.
 */
export interface TaskControl {
  readonly control?: Int32Array;
  readonly slot?: number;
}
export const CANCEL_CELL = 0;
/** Cells of a control array for `tasks` tasks. */
export const controlCells = (tasks: number): number => 1 + 2 * tasks;
export const progressCell = (slot: number): number => 1 + 2 * slot;
export const finalCell = (slot: number): number => 2 + 2 * slot;

/**
 * The block hook of a task: stores `done` (items of this task) into its slot
 * and throws "cancelled" when the call was cancelled. Undefined for a task
 * without control (run in the calling thread or by an older caller). Work of
 * another kind added to the pool calls it between its blocks the same way.
 */
export function blockHook(task: TaskControl, tool: string): ((done: number) => void) | undefined {
  const { control, slot } = task;
  if (control === undefined || slot === undefined) return undefined;
  const cell = progressCell(slot);
  return (done: number): void => {
    Atomics.store(control, cell, done);
    if (Atomics.load(control, CANCEL_CELL) !== 0) throw cancelledError(tool, undefined);
  };
}

/** A toleranced input as a task carries it (its spec is looked up again by name). */
export type VariedData = Omit<Varied, "spec">;

/**
 * One range of a parallel call. Its progress unit: samples (tolerance), grid
 * points (sweep), field points (field), segment pairs (mutual, self).
 */
export type PoolTask = TaskControl & (
  | { readonly kind: "tolerance"; readonly formula: string; readonly fixed: Readonly<Record<string, unknown>>; readonly varied: readonly VariedData[]; readonly seed: number; readonly offset: number; readonly start: number; readonly end: number }
  | { readonly kind: "sweep"; readonly formula: string; readonly spec: SweepSpec; readonly buffer: SharedArrayBuffer; readonly start: number; readonly end: number }
  | { readonly kind: "field"; readonly path: Float64Array; readonly current: number; readonly points: Float64Array; readonly out: Float64Array; readonly wireRadius: number; readonly start: number; readonly end: number }
  | { readonly kind: "mutual"; readonly pathA: Float64Array; readonly pathB: Float64Array; readonly maxDepth: number; readonly start: number; readonly end: number }
  | { readonly kind: "self"; readonly path: Float64Array; readonly maxDepth: number; readonly start: number; readonly end: number }
  | { readonly kind: "columns"; readonly table: ColumnsTaskData; readonly start: number; readonly end: number }
);

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
    const hook = blockHook(task, task.kind);
    // Started (0 done): from here the calling thread no longer withdraws this task from the pool's queue on a cancel.
    hook?.(0);
    return { ok: true, value: compute(task, hook) };
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

/** Pairs in rows i0..i1-1 of a self-inductance sum over n segments (row i pairs segment i with i+1..n-1). */
export function selfPairs(n: number, i0: number, i1: number): number {
  // The sum of n - 1 - i over the rows, an arithmetic series.
  return ((i1 - i0) * (2 * n - 1 - i0 - i1)) / 2;
}

/**
 * Rows i0..i1-1 of a pair sum in pieces (rows are independent, so the rows
 * are those of one call), reporting the pairs done through `hook`.
 */
export function rowsInPieces(i0: number, i1: number, rows: (a: number, b: number) => Float64Array, pairs: (a: number, b: number) => number, hook: ((done: number) => void) | undefined): Float64Array {
  if (hook === undefined) return rows(i0, i1);
  const out = new Float64Array(i1 - i0);
  inPieces(i0, i1, (a, b) => out.set(rows(a, b), a - i0), (at) => hook(pairs(i0, at)), 1);
  return out;
}

/**
 * A field map computed piece by piece (points are independent): `work`
 * computes points [a, b); `found` gives the count inside the conductor and
 * the first such point, as one call over all the pieces would.
 */
export function fieldPieces(path: Float64Array, current: number, points: Float64Array, out: Float64Array, wireRadius: number): { work(a: number, b: number): void; found(): InsideCount } {
  let inside = 0;
  let first = -1;
  return {
    work(a: number, b: number): void {
      const r = fieldRange(path, current, points, out, wireRadius, a, b);
      inside += r.inside;
      if (first < 0) first = r.first;
    },
    found: () => ({ inside, first }),
  };
}

/** Field points p0..p1-1 in pieces, reporting the points done through `hook`. */
function fieldInPieces(path: Float64Array, current: number, points: Float64Array, out: Float64Array, wireRadius: number, p0: number, p1: number, hook: ((done: number) => void) | undefined): InsideCount {
  if (hook === undefined) return fieldRange(path, current, points, out, wireRadius, p0, p1);
  const field = fieldPieces(path, current, points, out, wireRadius);
  inPieces(p0, p1, field.work, (at) => hook(at - p0), 16);
  return field.found();
}

function compute(task: PoolTask, hook: ((done: number) => void) | undefined): MonteCarloPart | number | InsideCount | Float64Array | ColumnsPart {
  // The last count (all of the task) is stored without the cancel check: the work is done.
  const finished = (items: number): void => {
    if (task.control !== undefined && task.slot !== undefined) Atomics.store(task.control, finalCell(task.slot), items);
  };
  switch (task.kind) {
    case "tolerance": {
      const formula = getFormula(task.formula);
      const specs = specsOf(formula);
      const varied: Varied[] = task.varied.map((v) => ({ ...v, spec: specs[v.name] as QuantityInput }));
      const probes: Record<string, number> = {};
      for (const v of varied) probes[v.name] = v.nominal;
      const b = bind(formula, task.fixed, probes);
      const part = monteCarloRange(formula, b, varied, task.seed, task.offset, task.start, task.end, hook);
      finished(task.end - task.start);
      return part;
    }
    case "sweep": {
      const plan = planSweep(getFormula(task.formula), task.spec);
      const arrays = layoutSweep(plan, task.buffer, false);
      // The buffer is reused (shared-scratch.ts): the loop's rule that its entries start zeroed holds once this range is cleared.
      arrays.values.fill(0, task.start, task.end);
      for (const c of arrays.components ?? []) c.fill(0, task.start, task.end);
      arrays.computed.fill(0, task.start, task.end);
      const grid = bindGrid(plan, arrays);
      let failed = 0;
      const work = (a: number, b: number): void => {
        failed += computePoints(plan.formula, grid.g, grid.axis0, grid.axis1, a, b);
      };
      if (hook === undefined) work(task.start, task.end);
      else inPieces(task.start, task.end, work, (at) => hook(at - task.start));
      finished(task.end - task.start);
      return failed;
    }
    case "field": {
      const r = fieldInPieces(task.path, task.current, task.points, task.out, task.wireRadius, task.start, task.end, hook);
      finished(task.end - task.start);
      return r;
    }
    case "mutual": {
      const A = segments(task.pathA, "pathA", "mutualInductance");
      const B = segments(task.pathB, "pathB", "mutualInductance");
      const rows = rowsInPieces(task.start, task.end, (a, b) => mutualRows(A, B, task.maxDepth, a, b), (a, b) => (b - a) * B.n, hook);
      finished((task.end - task.start) * B.n);
      return rows;
    }
    case "self": {
      const S = segments(task.path, "path", "polylineSelfInductance");
      const rows = rowsInPieces(task.start, task.end, (a, b) => selfRows(S, task.maxDepth, a, b), (a, b) => selfPairs(S.n, a, b), hook);
      finished(selfPairs(S.n, task.start, task.end));
      return rows;
    }
    case "columns": {
      const part = columnsRange(task.table, task.start, task.end, hook);
      finished(task.end - task.start);
      return part;
    }
  }
}
