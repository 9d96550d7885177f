import type { AnyFormula, Formula } from "../core/formula.js";
import { ticker, watched } from "../core/progress.js";
import { inPiecesAsync, tickBelow } from "./chunks.js";
import type { InputSpecs, OutputSpec } from "../core/spec.js";
import { type ColumnInput, type ColumnsOptions, type ColumnsResult, finishColumns, planColumns } from "./columns.js";
import { runRows } from "./columns-loop.js";
import { readColumns } from "./columns-read.js";
import { choiceCodes, type ColumnsPart, type ColumnsTaskData, mergeColumnParts } from "./columns-task.js";
import { onPool, type ParallelOptions, readWorkers, registryFormula, splitRange, startHere } from "./parallel.js";
import type { PoolTask } from "./pool-tasks.js";
import { borrowShared, giveBackShared } from "./shared-scratch.js";

/*
 * evaluateColumns with its rows split by index range over the worker pool.
 * The columns are read once in the calling thread (unit strings become SI
 * numbers there, unreadable cells get their codes); the threads run the same
 * generated row loop over their ranges, writing values and codes in place
 * into shared arrays, and return their note counts, which are joined in row
 * order (columns-task.ts). Row messages and note texts are made in the
 * calling thread from the caller's own inputs. So the result is
 * evaluateColumns', bit for bit, for any number of workers.
 */

/** Rows from which columnsParallel uses the pool (bench/columns.ts; below it, the calling thread). */
export const MIN_PARALLEL_ROWS = 200_000;

/**
 * `evaluateColumns` with the rows split over worker threads; the same result,
 * bit for bit, for any `workers` (rows, codes, notes and messages). At
 * MIN_PARALLEL_ROWS rows and more the pool is used; below, the calling thread
 * (in chunks, yielding to the event loop between them, when `signal` or
 * `onProgress` is given). Output arrays the call makes are plain, as
 * evaluateColumns'; given ones are filled in place (over a
 * SharedArrayBuffer, by the threads themselves).
 *
 * @example
 * const r = await columnsParallel("parallelPlateCapacitance", { area: areas, gap: gaps }, { workers: 2 });
 * r.output.values; // Float64Array, one capacitance per row
 */
export async function columnsParallel<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O> | string,
  inputs: { readonly [K in keyof I]?: ColumnInput | readonly (number | string)[] } | Readonly<Record<string, unknown>>,
  options: ColumnsOptions & ParallelOptions = {},
): Promise<ColumnsResult> {
  const tool = "columnsParallel";
  const f = registryFormula(tool, formula as unknown as AnyFormula | string);
  const workers = readWorkers(tool, options);
  // Checks signal and onProgress, and ends the call before any work if the signal is already aborted.
  ticker(tool, options, 0);
  const read = readColumns(f, inputs);
  const rows = read.rows;
  const nc = (f.definition.output.components as readonly string[] | undefined)?.length ?? 0;
  // Arrays made here are plain, as evaluateColumns makes them; on the pool the threads
  // write reused shared copies (a fresh shared buffer was faulted in on every call).
  const plan = planColumns(f, read, options);
  const { from, to, state } = plan;
  const n = to - from;
  const progress = ticker(tool, options, n);
  // Rows from..to-1 counted from 0: the loop's note counts carry over from one range to the next.
  const work = (a: number, b: number): void => runRows(f, state, plan.shape, from + a, from + b);
  const { at, pooled } = startHere(n, MIN_PARALLEL_ROWS, work, (done) => tickBelow(progress, done, n));
  if (!pooled) {
    if (!watched(options)) work(at, n);
    // In pieces, yielding between them: an abort from a timer or another event reaches the loop.
    else await inPiecesAsync(at, n, work, (done) => tickBelow(progress, done, n));
    progress.finish();
    return finishColumns(plan);
  }

  // Shared copies of what the threads read or write that is not shared already.
  const lent: Float64Array[] = [];
  const shared = (a: Float64Array | readonly number[]): Float64Array => {
    if (a instanceof Float64Array && a.buffer instanceof SharedArrayBuffer) return a;
    const s = borrowShared(rows);
    lent.push(s);
    s.set(a);
    return s;
  };
  const sharedBytes = (a: Uint8Array | undefined, copy: boolean): Uint8Array => {
    if (a !== undefined && a.buffer instanceof SharedArrayBuffer) return a;
    const s = borrowShared(Math.ceil(rows / 8));
    lent.push(s);
    const u = new Uint8Array(s.buffer, 0, rows);
    if (copy && a !== undefined) u.set(a);
    return u;
  };
  const choices = read.choices.map((c) => {
    const data = sharedBytes(undefined, false);
    choiceCodes(tool, c.name, c.data, c.spec, data);
    return { name: c.name, data };
  });
  const components = state.components.map((c) => outputCopy(c, lent));
  const table: ColumnsTaskData = {
    formula: f.id,
    rows,
    numbers: read.numbers.map((c) => ({ name: c.name, data: shared(c.data) })),
    choices,
    fixed: read.fixed,
    probes: plan.probes,
    ...(read.pre !== undefined ? { pre: sharedBytes(read.pre, true) } : {}),
    // With components, values is the first of them (as in evaluateColumns).
    values: nc === 0 ? outputCopy(state.values, lent) : components[0]!,
    components,
    errors: sharedBytes(state.errors, true),
  };
  // The rows past the timed head, which this thread has done.
  const start0 = from + at;
  const ranges = splitRange(to - start0, workers).map(([a, b]): [number, number] => [start0 + a, start0 + b]);
  const tasks: PoolTask[] = ranges.map(([start, end]) => ({ kind: "columns", table, start, end }));
  const parts = await onPool<ColumnsPart>(tool, tasks, workers, options, progress, at, n);
  // Results written into copies go back to the caller's arrays (the threads' rows only).
  const back = <T extends Float64Array | Uint8Array>(copy: T, to_: T): void => {
    if (copy !== to_) to_.set(copy.subarray(start0, to), start0);
  };
  if (nc === 0) back(table.values, state.values);
  table.components.forEach((c, k) => back(c, state.components[k]!));
  back(table.errors, state.errors);
  for (const s of lent) giveBackShared(s);
  mergeColumnParts(plan, parts);
  progress.finish();
  return finishColumns(plan);
}

/** An output array the threads can write: itself when shared, else a shared copy of it (its rows outside the range kept). */
function outputCopy(a: Float64Array, lent: Float64Array[]): Float64Array {
  if (a.buffer instanceof SharedArrayBuffer) return a;
  const s = borrowShared(a.length);
  lent.push(s);
  return s;
}
