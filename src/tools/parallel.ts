import { FormulaError } from "../core/errors.js";
import type { AnyFormula, Formula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import type { InputSpecs, Note, OutputSpec } from "../core/spec.js";
import { type BiotSavartField, type BiotSavartOptions, checkFieldInputs, fieldRange, fieldWarnings, type InsideCount } from "../flux/biot-savart.js";
import {
  checkPairs, depthOption, finishMutualInductance, finishSelfInductance, mutualRows, type NeumannOptions, planSelfInductance,
  type Polyline, segments, selfRows, sumRows,
} from "../inductance/neumann.js";
import { type LongRunOptions, type Ticker, ticker, watched } from "../core/progress.js";
import { inPiecesAsync, tickBelow, timedHead } from "./chunks.js";
import { defaultWorkers, poolAvailable, runOnPool } from "./pool.js";
import { fieldPieces, type PoolTask, rebuildError, selfPairs, type TaskOutcome } from "./pool-tasks.js";
import { MONTE_CARLO_BLOCK } from "./random.js";
import { borrowShared, giveBackShared } from "./shared-scratch.js";
import { computePoints } from "./sweep-points.js";
import { bindGrid, finishSweep, layoutSweep, planSweep, type SweepResult, type SweepSpec } from "./sweep.js";
import { finishTolerance, type MonteCarloPart, monteCarloRange, planTolerance, type ToleranceOptions, type ToleranceResult, type ToleranceValue } from "./tolerance.js";

/*
 * The parallel entries: the same work as sweep, tolerance, biotSavart,
 * mutualInductance and polylineSelfInductance, split by index range over a
 * pool of worker threads (piscina, Node build only). Each returns a Promise;
 * the synchronous calls stay as they are. Results are bit-identical to the
 * synchronous call for any number of workers: the work is split by index
 * (grid points, field points, Monte Carlo samples with their own random
 * streams, pair rows) and joined in index order.
 *
 * Below a size where threads do not pay (measured in bench/parallel.ts: the
 * MIN_PARALLEL_* constants, set from a run on a loaded machine: measure again
 * on an idle one) the work runs in the calling thread.
 *
 * Browser build: there are no worker threads; `workers` given is refused
 * (invalid_argument), left out the call computes in the calling thread.
 *
 * Progress and cancellation (`signal`, `onProgress`): on the pool, tasks
 * store their items done in a shared array between blocks of work and read a
 * shared cancel flag there (pool-tasks.ts); the calling thread reports the
 * sum after each task and every PROGRESS_INTERVAL_MS. An abort at any time
 * rejects the promise with "cancelled" once every task of the call has
 * stopped (within one block): poolBusy() is 0 again when it settles. Below the
 * pool thresholds the calling thread works in pieces of a few milliseconds
 * and yields to the event loop between them (only when a signal or
 * onProgress is given), so an abort from a timer or another event reaches it.
 */

/** Options shared by the parallel entries (with `signal` and `onProgress`). */
export interface ParallelOptions extends LongRunOptions {
  /**
   * Worker threads to use: a whole number from 1 to MAX_WORKERS. Default: the
   * cores Node reports (os.availableParallelism()); in the browser build, the
   * calling thread (and `workers` given is an error there).
   */
  readonly workers?: number;
}

/** Most worker threads one call may ask for. */
export const MAX_WORKERS = 64;

/** Monte Carlo samples from which toleranceParallel uses the pool (bench/parallel.ts). */
export const MIN_PARALLEL_SAMPLES = 20_000;
/** Sweep points from which sweepParallel uses the pool (bench/parallel.ts). */
export const MIN_PARALLEL_POINTS = 1_000_000;
/** Segment-point pairs from which biotSavartParallel uses the pool (bench/parallel.ts). */
export const MIN_PARALLEL_FIELD_PAIRS = 8_000_000;
/** Segment pairs from which the Neumann entries use the pool (bench/parallel.ts). */
export const MIN_PARALLEL_SEGMENT_PAIRS = 5_000;

/**
 * Estimated calling-thread time of a sweep, Monte Carlo or table from which
 * the pool is used, ms. At and above the MIN_PARALLEL_* counts these calls
 * first run their first items here for about a millisecond (chunks.ts,
 * timedHead; those items are part of the result) and hand the rest to the
 * pool only when it would take at least this long here: below it, starting
 * the tasks and copying the arrays through shared buffers cost more than the
 * second thread saves (bench/parallel.ts: a table of 1e6 rows of
 * parallelPlateCapacitance, about 9 ms, ran at 0.90x on the pool).
 */
export const MIN_POOL_MS = 20;

/**
 * Ranges per worker: several, so a thread that finishes early takes more;
 * and the estimated time from which the pool is used (MIN_POOL_MS).
 * A test seam, not exported from the package: tests raise chunksPerWorker to
 * get many small tasks (a task boundary near any fraction of the work), set
 * minPoolMs to 0 so a call above the counts goes to the pool whatever the
 * machine's speed, and restore both.
 */
export const poolSplit = { chunksPerWorker: 4, minPoolMs: MIN_POOL_MS };

/**
 * Whether the rest of a call, estimated at `restMs` of work here, goes to the
 * pool: in a build with worker threads (the browser build has none), from
 * poolSplit.minPoolMs of work. One worker is allowed: it does the work no
 * faster, but off the calling thread's event loop.
 */
export function usePool(restMs: number): boolean {
  return poolAvailable && restMs >= poolSplit.minPoolMs;
}

/**
 * Where a call of `total` items starts: from `min` items on, its first items
 * are done and timed here (timedHead, calling `work` and `between`) and the
 * rest goes to the pool when usePool says so; below `min`, nothing is done
 * yet and the call stays here.
 */
export function startHere(total: number, min: number, work: (a: number, b: number) => void, between: (done: number) => void, align = 1, first = 256): { at: number; pooled: boolean } {
  if (total < min) return { at: 0, pooled: false };
  const head = timedHead(total, work, between, align, first);
  return { at: head.done, pooled: usePool(head.restMs) };
}

/** The worker count asked for, checked; undefined means the default. */
export function readWorkers(tool: string, options: ParallelOptions | undefined): number {
  if (options !== undefined && (typeof options !== "object" || options === null)) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "options", detail: "options is an object" });
  }
  const w = options?.workers;
  if (w === undefined) return Math.min(MAX_WORKERS, defaultWorkers());
  if (typeof w !== "number" || !Number.isInteger(w) || w < 1 || w > MAX_WORKERS) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "workers", value: typeof w === "number" ? w : undefined, detail: `workers must be a whole number from 1 to ${MAX_WORKERS}` });
  }
  if (!poolAvailable) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "workers", detail: "worker threads are available in Node only; in this build leave workers out and the call computes in this thread" });
  }
  return w;
}

/**
 * 0..total split into at most `workers * poolSplit.chunksPerWorker` ranges of nearly
 * equal size, inner boundaries on multiples of `align`.
 */
export function splitRange(total: number, workers: number, align = 1): [number, number][] {
  const count = Math.max(1, Math.min(workers * poolSplit.chunksPerWorker, Math.ceil(total / align)));
  const out: [number, number][] = [];
  let start = 0;
  for (let c = 1; c <= count && start < total; c++) {
    const end = c === count ? total : Math.min(total, Math.round((total * c) / count / align) * align);
    if (end > start) out.push([start, end]);
    start = Math.max(start, end);
  }
  return out;
}

/**
 * The tasks' values in task order; the first error (lowest range) is thrown
 * as the single-thread call throws it. Progress is `base` plus the items the
 * tasks have done, through `t`, below `total` (fraction 1 is finish()'s).
 */
export async function onPool<T>(tool: string, tasks: readonly PoolTask[], workers: number, options: LongRunOptions, t: Ticker, base: number, total: number): Promise<T[]> {
  const outcomes: TaskOutcome[] = await runOnPool(tool, tasks, workers, {
    ...(options.signal !== undefined ? { signal: options.signal } : {}),
    ...(options.onProgress !== undefined ? { progress: (done: number) => tickBelow(t, base + done, total) } : {}),
  });
  return outcomes.map((o) => {
    if (!o.ok) throw rebuildError(o.error);
    return o.value as T;
  });
}

/** Workers load formulas by id, so a parallel call needs the registry's own formula. */
export function registryFormula(tool: string, formula: AnyFormula | string): AnyFormula {
  if (typeof formula === "string") return getFormula(formula);
  const f = formula;
  let found: AnyFormula | undefined;
  try {
    found = getFormula(f.id);
  } catch {
    found = undefined;
  }
  if (found !== f) {
    throw new FormulaError("invalid_argument", { formula: f.id, input: "formula", detail: `${tool} runs registry formulas only (worker threads look formulas up by id); call the synchronous function for this one` });
  }
  return f;
}

/**
 * `tolerance` with its Monte Carlo split over worker threads; the same result,
 * bit for bit, for any `workers`. At MIN_PARALLEL_SAMPLES samples and more the
 * pool is used; below, the calling thread.
 *
 * @example
 * await toleranceParallel(coaxialCoilsMutualInductance, inputs, { samples: 1e6, workers: 2 });
 */
export async function toleranceParallel<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O> | string,
  inputs: { readonly [K in keyof I & string]?: ToleranceValue },
  options: ToleranceOptions & ParallelOptions = {},
): Promise<ToleranceResult> {
  const tool = "toleranceParallel";
  const f = registryFormula(tool, formula as unknown as AnyFormula | string);
  const workers = readWorkers(tool, options);
  const plan = planTolerance(f, inputs, options, options, tool);
  const { samples, seed, sampleOffset, varied, corners, ticker: t } = plan;
  const total = corners + samples;
  const parts: MonteCarloPart[] = [];
  // Pieces of whole blocks: the parts joined in order are the samples of one run.
  const work = (a: number, b: number): void => {
    parts.push(monteCarloRange(f, plan.b, varied, seed, sampleOffset, a, b));
  };
  const { at, pooled } = startHere(samples, MIN_PARALLEL_SAMPLES, work, (done) => tickBelow(t, corners + done, total), MONTE_CARLO_BLOCK, MONTE_CARLO_BLOCK);
  if (samples > at && !pooled) {
    if (!watched(options)) work(at, samples);
    else await inPiecesAsync(at, samples, work, (done) => tickBelow(t, corners + done, total), MONTE_CARLO_BLOCK, MONTE_CARLO_BLOCK);
  } else if (samples > at) {
    const variedData = varied.map(({ spec: _spec, ...rest }) => rest);
    const tasks: PoolTask[] = splitRange(samples - at, workers, MONTE_CARLO_BLOCK).map(([start, end]) => ({
      kind: "tolerance", formula: f.id, fixed: plan.fixed, varied: variedData, seed, offset: sampleOffset, start: at + start, end: at + end,
    }));
    parts.push(...(await onPool<MonteCarloPart>(tool, tasks, workers, options, t, corners + at, total)));
  }
  const result = finishTolerance(plan, parts);
  t.finish();
  return result;
}

/**
 * `sweep` with its grid split over worker threads; the same result, bit for
 * bit, for any `workers`, in plain arrays as `sweep` returns them. At
 * MIN_PARALLEL_POINTS points and more the pool is used when the points would
 * take MIN_POOL_MS or more here (timed on the first of them); otherwise, the
 * calling thread.
 */
export async function sweepParallel<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O> | string,
  spec: SweepSpec<keyof I & string>,
  options: ParallelOptions = {},
): Promise<SweepResult> {
  const tool = "sweepParallel";
  const f = registryFormula(tool, formula as unknown as AnyFormula | string);
  const workers = readWorkers(tool, options);
  const plan = planSweep(f, spec as SweepSpec);
  const total = plan.total;
  const t = ticker(tool, options, total);
  const arrays = layoutSweep(plan, new ArrayBuffer(plan.bytes), true);
  const grid = bindGrid(plan, arrays);
  let failed = 0;
  const work = (a: number, b: number): void => {
    failed += computePoints(f, grid.g, grid.axis0, grid.axis1, a, b);
  };
  const { at, pooled } = startHere(total, MIN_PARALLEL_POINTS, work, (done) => tickBelow(t, done, total));
  if (!pooled) {
    if (!watched(options)) work(at, total);
    else await inPiecesAsync(at, total, work, (done) => tickBelow(t, done, total));
  } else {
    // The threads fill a reused shared buffer (a fresh one is faulted in page
    // by page on every call: shared-scratch.ts), which is then copied into the
    // result's plain buffer: axes in, values and flags out.
    const request: SweepSpec = { vary: spec.vary, ...(spec.fixed !== undefined ? { fixed: spec.fixed } : {}) };
    const scratch = borrowShared(Math.ceil(plan.bytes / 8));
    const buffer = scratch.buffer as SharedArrayBuffer;
    const axesBytes = arrays.values.byteOffset;
    new Uint8Array(buffer, 0, axesBytes).set(new Uint8Array(arrays.values.buffer, 0, axesBytes));
    const tasks: PoolTask[] = splitRange(total - at, workers).map(([start, end]) => ({ kind: "sweep", formula: f.id, spec: request, buffer, start: at + start, end: at + end }));
    failed += (await onPool<number>(tool, tasks, workers, options, t, at, total)).reduce((a, b) => a + b, 0);
    // The points past the timed head come back from the threads' buffer.
    const back = layoutSweep(plan, buffer, false);
    arrays.values.set(back.values.subarray(at), at);
    back.components?.forEach((c, k) => arrays.components![k]!.set(c.subarray(at), at));
    arrays.computed.set(back.computed.subarray(at), at);
    giveBackShared(scratch);
  }
  const result = finishSweep(plan, arrays, grid, failed);
  t.finish();
  return result;
}

/** biotSavart's options plus `out` (the output array) and `workers`. */
export interface BiotSavartParallelOptions extends BiotSavartOptions, ParallelOptions {
  /**
   * Output array to fill. Over a SharedArrayBuffer, the worker threads write
   * it in place; a plain one is filled from a shared copy.
   */
  readonly out?: Float64Array;
}

/**
 * `biotSavart` with the field points split over worker threads; the same
 * field and warnings, bit for bit, for any `workers` (an error names the first
 * bad point, as the synchronous call does). At MIN_PARALLEL_FIELD_PAIRS
 * segment-point pairs and more the pool is used; below, the calling thread.
 * Points (and `out`) over a SharedArrayBuffer reach the threads without a
 * copy; without `out`, the result is a plain Float64Array, as biotSavart's.
 */
export async function biotSavartParallel(path: Float64Array, current: number, points: Float64Array, options: BiotSavartParallelOptions = {}): Promise<BiotSavartField> {
  const tool = "biotSavartParallel";
  const workers = readWorkers(tool, options);
  const wireRadius = checkFieldInputs(path, current, points, options);
  const np = points.length / 3;
  const nv = path.length / 3;
  const out = options.out;
  if (out !== undefined && (!(out instanceof Float64Array) || out.length < points.length)) {
    throw new FormulaError("invalid_argument", { formula: "biotSavart", input: "out", detail: "output array is shorter than points" });
  }
  const t = ticker(tool, options, np);
  const pooled = np * (nv - 1) >= MIN_PARALLEL_FIELD_PAIRS && usePool(Number.POSITIVE_INFINITY);
  // A result made here is plain, as biotSavart's; on the pool the threads fill a reused
  // shared buffer that is copied into it (a fresh shared one was faulted in on every call).
  const result = (out ?? new Float64Array(points.length)) as Float64Array & { warnings: readonly Note[] };
  let found: InsideCount;
  if (!pooled) {
    if (!watched(options)) found = fieldRange(path, current, points, result, wireRadius, 0, np);
    else {
      // Points are independent: the pieces give the field, count and first point of one call.
      const field = fieldPieces(path, current, points, result, wireRadius);
      await inPiecesAsync(0, np, field.work, (done) => tickBelow(t, done, np), 16);
      found = field.found();
    }
  } else {
    // Arrays over a SharedArrayBuffer are handed to the threads as they are;
    // plain ones are copied into reused shared buffers (shared-scratch.ts:
    // a fresh buffer's first touch cost more than the field map itself).
    // A copy of the path (a few hundred bytes) goes with each task: a view's whole buffer would.
    const sp = path.slice();
    const isShared = (a: Float64Array): boolean => a.buffer instanceof SharedArrayBuffer;
    const spoints = isShared(points) ? points : borrowShared(points.length);
    if (spoints !== points) spoints.set(points);
    const sout = isShared(result) ? result : borrowShared(points.length);
    const tasks: PoolTask[] = splitRange(np, workers).map(([start, end]) => ({ kind: "field", path: sp, current, points: spoints, out: sout, wireRadius, start, end }));
    const parts = await onPool<InsideCount>(tool, tasks, workers, options, t, 0, np);
    let inside = 0;
    let first = -1;
    for (const p of parts) {
      if (first < 0 && p.first >= 0) first = p.first;
      inside += p.inside;
    }
    found = { inside, first };
    if (sout !== result) {
      result.set(sout.subarray(0, points.length));
      giveBackShared(sout);
    }
    if (spoints !== points) giveBackShared(spoints);
  }
  result.warnings = fieldWarnings(found, np, wireRadius);
  t.finish();
  return result;
}

/** Row ranges of a pair sum with about equal numbers of pairs each (rows of `cost(i)` pairs). */
function rowRanges(rows: number, workers: number, cost: (i: number) => number, total: number): [number, number][] {
  const count = Math.max(1, Math.min(workers * poolSplit.chunksPerWorker, rows));
  const out: [number, number][] = [];
  let start = 0;
  let acc = 0;
  for (let i = 0; i < rows; i++) {
    acc += cost(i);
    if (acc >= (total * (out.length + 1)) / count && out.length < count - 1) {
      out.push([start, i + 1]);
      start = i + 1;
    }
  }
  if (start < rows) out.push([start, rows]);
  return out;
}

/**
 * `mutualInductance` with the segment pairs split by rows over worker threads;
 * the same M, bit for bit, for any `workers`. At MIN_PARALLEL_SEGMENT_PAIRS
 * pairs and more the pool is used; below, the calling thread.
 */
export async function mutualInductanceParallel(pathA: Polyline, pathB: Polyline, options: NeumannOptions & ParallelOptions = {}): Promise<number> {
  const tool = "mutualInductance";
  const workers = readWorkers("mutualInductanceParallel", options);
  const maxDepth = depthOption(options, tool);
  const A = segments(pathA, "pathA", tool);
  const B = segments(pathB, "pathB", tool);
  checkPairs(A.n * B.n, "pathB", tool);
  const total = A.n * B.n;
  const t = ticker("mutualInductanceParallel", options, total);
  let rows: Float64Array;
  if (total < MIN_PARALLEL_SEGMENT_PAIRS || !usePool(Number.POSITIVE_INFINITY)) {
    rows = await rowsHere(A.n, (i0, i1) => mutualRows(A, B, maxDepth, i0, i1), (i) => i * B.n, options, t, total);
  } else {
    const a = Float64Array.from(pathA);
    const b = Float64Array.from(pathB);
    const tasks: PoolTask[] = rowRanges(A.n, workers, () => B.n, total).map(([start, end]) => ({ kind: "mutual", pathA: a, pathB: b, maxDepth, start, end }));
    rows = joinRows(await onPool<Float64Array>("mutualInductanceParallel", tasks, workers, options, t, 0, total));
  }
  const M = finishMutualInductance(sumRows(rows));
  t.finish();
  return M;
}

/**
 * The rows 0..n-1 of a pair sum in the calling thread: in one piece, or with
 * a signal or onProgress in pieces with a yield between them (rows are
 * independent: the same rows). `pairsBefore(i)` counts the pairs of rows 0..i-1.
 */
async function rowsHere(n: number, rows: (i0: number, i1: number) => Float64Array, pairsBefore: (i: number) => number, options: LongRunOptions, t: Ticker, total: number): Promise<Float64Array> {
  if (!watched(options)) return rows(0, n);
  const out = new Float64Array(n);
  await inPiecesAsync(0, n, (a, b) => out.set(rows(a, b), a), (i) => tickBelow(t, pairsBefore(i), total), 1);
  return out;
}

/**
 * `polylineSelfInductance` with the segment pairs split by rows over worker
 * threads; the same L, bit for bit, for any `workers`. At
 * MIN_PARALLEL_SEGMENT_PAIRS pairs and more the pool is used; below, the
 * calling thread.
 */
export async function polylineSelfInductanceParallel(path: Polyline, wireRadius: number, options: NeumannOptions & ParallelOptions = {}): Promise<number> {
  const workers = readWorkers("polylineSelfInductanceParallel", options);
  const plan = planSelfInductance(path, wireRadius, options);
  const n = plan.S.n;
  const pairs = (n * (n - 1)) / 2;
  const t = ticker("polylineSelfInductanceParallel", options, pairs);
  let rows: Float64Array;
  if (pairs < MIN_PARALLEL_SEGMENT_PAIRS || !usePool(Number.POSITIVE_INFINITY)) {
    rows = await rowsHere(n, (i0, i1) => selfRows(plan.S, plan.maxDepth, i0, i1), (i) => selfPairs(n, 0, i), options, t, pairs);
  } else {
    const p = Float64Array.from(path);
    const tasks: PoolTask[] = rowRanges(n, workers, (i) => n - 1 - i, pairs).map(([start, end]) => ({ kind: "self", path: p, maxDepth: plan.maxDepth, start, end }));
    rows = joinRows(await onPool<Float64Array>("polylineSelfInductanceParallel", tasks, workers, options, t, 0, pairs));
  }
  const L = finishSelfInductance(plan, sumRows(rows));
  t.finish();
  return L;
}

function joinRows(parts: readonly Float64Array[]): Float64Array {
  let n = 0;
  for (const p of parts) n += p.length;
  const rows = new Float64Array(n);
  let at = 0;
  for (const p of parts) {
    rows.set(p, at);
    at += p.length;
  }
  return rows;
}
