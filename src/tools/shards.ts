import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import { getFormula } from "../core/registry.js";
import { inPieces, tickBelow } from "./chunks.js";
import type { ColumnsResult } from "./columns.js";
import { type ColumnsShardRequest, type ColumnsShardResult, columnsRows, mergeColumnsShards, runColumnsShard } from "./columns-shards.js";
import type { CollectedNotes } from "./notes.js";
import { MONTE_CARLO_BLOCK } from "./random.js";
import { fromShardValue, type ShardValue, toShardValues } from "./shard-values.js";
import { computePoints } from "./sweep-points.js";
import { bindGrid, finishSweep, layoutSweep, planSweep, type SweepResult, type SweepSpec } from "./sweep.js";
import { finishTolerance, monteCarloRange, planTolerance, type ToleranceOptions, type ToleranceResult } from "./tolerance.js";

/*
 * Shards: a large request split by index range into independent requests
 * that any job runner or queue can run anywhere (each is plain JSON, and so
 * is its result), merged into exactly the result of one run. A sweep splits
 * its grid points; a tolerance analysis its Monte Carlo samples (each sample
 * draws from its own random stream, so a shard draws what one run draws);
 * an evaluateColumns call its rows (columns-shards.ts).
 * Every shard and the merge repeat the request's cheap parts (checks, axes,
 * the nominal, slopes and corners) and compute only their range.
 */

/** A tolerance analysis as plain JSON (toleranceRequest's form). */
export interface ToleranceShardRequest {
  readonly kind: "tolerance";
  readonly formula: string;
  readonly inputs: Readonly<Record<string, unknown>>;
  readonly options?: ToleranceOptions;
}

/** A sweep as plain JSON (sweepRequest's form). */
export interface SweepShardRequest extends SweepSpec {
  readonly kind: "sweep";
  readonly formula: string;
}

export type ShardRequest = ToleranceShardRequest | SweepShardRequest | ColumnsShardRequest;

/** One shard: the whole request and the index range this shard computes (start..end-1). */
export interface Shard<R extends ShardRequest = ShardRequest> {
  readonly request: R;
  readonly index: number;
  readonly count: number;
  readonly start: number;
  readonly end: number;
}

/** What a tolerance shard found: its samples' computed values in order ("-0" for a negative zero, see ShardValue) and their notes. */
export interface ToleranceShardResult {
  readonly shard: Shard<ToleranceShardRequest>;
  readonly values: readonly ShardValue[];
  readonly notes: CollectedNotes;
}

/** What a sweep shard computed: its points' values (null where not computed, "-0" for a negative zero), in order. */
export interface SweepShardResult {
  readonly shard: Shard<SweepShardRequest>;
  readonly values: readonly ShardValue[];
  readonly components?: readonly (readonly ShardValue[])[];
  readonly computed: readonly number[];
  readonly notComputed: number;
}

export type ShardResult = ToleranceShardResult | SweepShardResult | ColumnsShardResult;
export type { ColumnsShardRequest, ColumnsShardResult };

/** Most shards one request is split into. */
export const MAX_SHARDS = 10_000;

function bad(input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError("invalid_argument", { input, value, detail });
}

function kindOf(request: unknown): "tolerance" | "sweep" | "columns" {
  const kind = typeof request === "object" && request !== null ? (request as { kind?: unknown }).kind : undefined;
  if (kind !== "tolerance" && kind !== "sweep" && kind !== "columns") {
    throw bad("kind", 'a shardable request is { kind: "tolerance", formula, inputs, options }, { kind: "sweep", formula, vary, fixed } or { kind: "columns", formula, inputs }', kind);
  }
  return kind;
}

/** Checks the request as one run would and returns its index count (samples or grid points). */
function size(request: ShardRequest): number {
  if (kindOf(request) === "columns") return columnsRows(request as ColumnsShardRequest);
  const f = getFormula(request.formula);
  if (kindOf(request) === "tolerance") {
    const r = request as ToleranceShardRequest;
    return planTolerance(f, r.inputs, r.options ?? {}).samples;
  }
  return planSweep(f, request as SweepShardRequest).total;
}

/**
 * Splits a request into at most `count` shards of nearly equal index ranges
 * (Monte Carlo ranges on whole random-stream blocks). The request is checked
 * here as one run checks it, so a bad request fails before any shard runs.
 */
export function planShards<R extends ShardRequest>(request: R, count: number): Shard<R>[] {
  kindOf(request);
  if (typeof count !== "number" || !Number.isInteger(count) || count < 1 || count > MAX_SHARDS) {
    throw bad("count", `the shard count must be a whole number from 1 to ${MAX_SHARDS}`, count);
  }
  const total = size(request);
  const align = request.kind === "tolerance" ? MONTE_CARLO_BLOCK : 1;
  const n = Math.max(1, Math.min(count, Math.ceil(total / align)));
  const bounds: number[] = [0];
  for (let c = 1; c < n; c++) bounds.push(Math.max(bounds[c - 1]!, Math.min(total, Math.round((total * c) / n / align) * align)));
  bounds.push(total);
  const ranges = bounds.slice(1).map((end, i) => [bounds[i]!, end] as const).filter(([s, e]) => e > s || total === 0);
  return ranges.map(([start, end], index) => ({ request, index, count: ranges.length, start, end }));
}

/**
 * Runs one shard (on any machine): the same computation as one run, over the
 * shard's range. `signal` and `onProgress` (LongRunOptions) work as in the
 * other long calls, over the shard's indices; a queue worker can pass its
 * job's progress on from here.
 */
export function runShard(shard: Shard<ToleranceShardRequest>, options?: LongRunOptions): ToleranceShardResult;
export function runShard(shard: Shard<SweepShardRequest>, options?: LongRunOptions): SweepShardResult;
export function runShard(shard: Shard<ColumnsShardRequest>, options?: LongRunOptions): ColumnsShardResult;
export function runShard(shard: Shard, options?: LongRunOptions): ShardResult;
export function runShard(shard: Shard, options?: LongRunOptions): ShardResult {
  if (typeof shard !== "object" || shard === null) throw bad("shard", "a shard is { request, index, count, start, end } as planShards makes it");
  const { request, start, end } = shard;
  const progress = () => ticker("runShard", options, end - start);
  if (kindOf(request) === "columns") return runColumnsShard(shard as Shard<ColumnsShardRequest>, (rows) => checkRange(shard, rows), progress);
  const f = getFormula(request?.formula);
  if (kindOf(request) === "tolerance") {
    const r = request as ToleranceShardRequest;
    const plan = planTolerance(f, r.inputs, r.options ?? {});
    checkRange(shard, plan.samples);
    const t = progress();
    // monteCarloRange calls `between` below the range's end only: fraction 1 is finish()'s.
    const part = monteCarloRange(f, plan.b, plan.varied, plan.seed, plan.sampleOffset, start, end, (done) => t.tick(done));
    t.finish();
    return { shard: shard as Shard<ToleranceShardRequest>, values: toShardValues(part.values), notes: part.notes };
  }
  const plan = planSweep(f, request as SweepShardRequest);
  checkRange(shard, plan.total);
  const t = progress();
  const arrays = layoutSweep(plan, new ArrayBuffer(plan.bytes), true);
  const grid = bindGrid(plan, arrays);
  let notComputed = 0;
  // In pieces with a tick between: points are independent, so the values are those of one loop.
  inPieces(start, end, (a, b) => (notComputed += computePoints(f, grid.g, grid.axis0, grid.axis1, a, b)), (done) => tickBelow(t, done - start, end - start));
  t.finish();
  return {
    shard: shard as Shard<SweepShardRequest>,
    values: toShardValues(arrays.values, start, end),
    ...(arrays.components ? { components: arrays.components.map((c) => toShardValues(c, start, end)) } : {}),
    computed: Array.from(arrays.computed.subarray(start, end)),
    notComputed,
  };
}

function checkRange(shard: Shard, total: number): void {
  const { start, end } = shard;
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end < start || end > total) {
    throw bad("shard", `the shard's range must lie within 0..${total}`, `${String(start)}..${String(end)}`);
  }
}

/**
 * Merges the results of every shard of one request (in any order) into the
 * result of one run, bit for bit. Refuses results of different requests, a
 * missing or repeated range.
 */
export function mergeShards(results: readonly ToleranceShardResult[]): ToleranceResult;
export function mergeShards(results: readonly SweepShardResult[]): SweepResult;
export function mergeShards(results: readonly ColumnsShardResult[]): ColumnsResult;
export function mergeShards(results: readonly ShardResult[]): ToleranceResult | SweepResult | ColumnsResult;
export function mergeShards(results: readonly ShardResult[]): ToleranceResult | SweepResult | ColumnsResult {
  if (!Array.isArray(results) || results.length === 0) throw bad("shards", "give the results of every shard of one request");
  const sorted = [...results].sort((a, b) => a.shard.start - b.shard.start);
  const request = sorted[0]!.shard.request;
  const key = JSON.stringify(request);
  let at = 0;
  for (const r of sorted) {
    if (JSON.stringify(r.shard.request) !== key) throw bad("shards", "the results come from different requests");
    if (r.shard.start !== at) throw bad("shards", `no shard covers indices from ${at} (a shard is missing or repeated)`);
    at = r.shard.end;
  }
  if (kindOf(request) === "columns") return mergeColumnsShards(sorted as ColumnsShardResult[], at);
  const f = getFormula(request.formula);
  if (kindOf(request) === "tolerance") {
    const r = request as ToleranceShardRequest;
    const plan = planTolerance(f, r.inputs, r.options ?? {});
    if (at !== plan.samples) throw bad("shards", `the shards cover ${at} of ${plan.samples} samples`);
    const parts = (sorted as ToleranceShardResult[]).map((s) => ({ samples: s.shard.end - s.shard.start, values: Float64Array.from(s.values, fromShardValue), notes: s.notes }));
    return finishTolerance(plan, plan.samples > 0 ? parts : []);
  }
  const plan = planSweep(f, request as SweepShardRequest);
  if (at !== plan.total) throw bad("shards", `the shards cover ${at} of ${plan.total} points`);
  const arrays = layoutSweep(plan, new ArrayBuffer(plan.bytes), true);
  let failed = 0;
  // A point not computed (null) is NaN again here, and "-0" is -0.
  const put = (to: Float64Array, from: readonly ShardValue[], start: number): void => {
    for (let i = 0; i < from.length; i++) to[start + i] = fromShardValue(from[i]);
  };
  for (const s of sorted as SweepShardResult[]) {
    const { start, end } = s.shard;
    if (s.values.length !== end - start || s.computed.length !== end - start) throw bad("shards", `shard ${s.shard.index} holds ${s.values.length} values for ${end - start} points`);
    put(arrays.values, s.values, start);
    arrays.components?.forEach((c, i) => put(c, s.components?.[i] ?? [], start));
    arrays.computed.set(s.computed, start);
    failed += s.notComputed;
  }
  return finishSweep(plan, arrays, bindGrid(plan, arrays), failed);
}
