import { FormulaError } from "../core/errors.js";
import type { Ticker } from "../core/progress.js";
import { getFormula } from "../core/registry.js";
import { inPieces, tickBelow } from "./chunks.js";
import { type ColumnsResult, finishColumns, planColumns } from "./columns.js";
import { runRows } from "./columns-loop.js";
import { readColumns } from "./columns-read.js";
import { type ColumnsPart, mergeColumnParts } from "./columns-task.js";
import { fromShardValue, type ShardValue, toShardValue } from "./shard-values.js";
import type { Shard } from "./shards.js";

/*
 * Shards of an evaluateColumns call (planShards, runShard and mergeShards in
 * shards.ts hand columns requests to these). Every shard reads the whole
 * request (its columns as JSON: numbers, unit strings, { values, unit }) so
 * the fixed inputs are bound as in one run, computes its rows only, and
 * returns them with its notes' counts and worst rows; the merge reads the
 * request again, puts the rows in place and joins the counts in row order
 * (columns-task.ts), so the merged result is one run's, bit for bit.
 */

/** An evaluateColumns call as plain JSON. */
export interface ColumnsShardRequest {
  readonly kind: "columns";
  readonly formula: string;
  readonly inputs: Readonly<Record<string, unknown>>;
}

/** What a columns shard computed: its rows' values, codes and note counts, as plain JSON. */
export interface ColumnsShardResult {
  readonly shard: Shard<ColumnsShardRequest>;
  readonly values: readonly ShardValue[];
  readonly components?: readonly (readonly ShardValue[])[];
  /** Per row: 0, or the index of its error code in ROW_ERROR_CODES. */
  readonly errors: readonly number[];
  /** Per note condition: rows that raised it, the worst row (-1 none) and its measure (text where not finite: JSON has no infinities). */
  readonly notes: { readonly counts: readonly number[]; readonly index: readonly number[]; readonly measure: readonly (number | string)[] };
}

/** The rows of a columns request, checked as one run checks it (columns and fixed inputs). */
export function columnsRows(request: ColumnsShardRequest): number {
  const f = getFormula(request.formula);
  return planColumns(f, readColumns(f, request.inputs), {}).read.rows;
}

/** Runs the rows of one shard; `progress()` makes the shard's ticker once the shard is checked. */
export function runColumnsShard(shard: Shard<ColumnsShardRequest>, check: (total: number) => void, progress: () => Ticker): ColumnsShardResult {
  const f = getFormula(shard.request.formula);
  const read = readColumns(f, shard.request.inputs);
  check(read.rows);
  const { start, end } = shard;
  const plan = planColumns(f, read, { from: start, to: end });
  const t = progress();
  // In pieces with a tick between, as evaluateColumns runs them: a range's rows depend only on themselves.
  inPieces(start, end, (a, b) => runRows(f, plan.state, plan.shape, a, b), (done) => tickBelow(t, done - start, end - start));
  t.finish();
  const s = plan.state;
  const rows = (a: Float64Array): ShardValue[] => Array.from(a.subarray(start, end), (v, i) => toShardValue(v, s.errors[start + i] !== 0));
  return {
    shard,
    values: rows(s.values),
    ...(s.components.length > 0 ? { components: s.components.map(rows) } : {}),
    errors: Array.from(s.errors.subarray(start, end)),
    notes: { counts: Array.from(s.counts), index: Array.from(s.index), measure: Array.from(s.measure, (m) => (m - m === 0 ? m : String(m))) },
  };
}

/** Merges the results of every shard of one columns request (sorted by start, checked to cover it once) into one run's result. */
export function mergeColumnsShards(sorted: readonly ColumnsShardResult[], covered: number): ColumnsResult {
  const request = sorted[0]!.shard.request;
  const f = getFormula(request.formula);
  const plan = planColumns(f, readColumns(f, request.inputs), {});
  const { state } = plan;
  if (covered !== plan.read.rows) throw bad(`the shards cover ${covered} of ${plan.read.rows} rows`);
  const parts: ColumnsPart[] = [];
  for (const r of sorted) {
    const { start, end, index } = r.shard;
    const n = end - start;
    const comps = r.components ?? [];
    if (r.values.length !== n || r.errors.length !== n || comps.length !== state.components.length || comps.some((c) => c.length !== n)) {
      throw bad(`shard ${index} holds ${r.values.length} values for ${n} rows`);
    }
    for (let i = 0; i < n; i++) {
      state.errors[start + i] = r.errors[i]!;
      if (comps.length === 0) state.values[start + i] = fromShardValue(r.values[i]);
      comps.forEach((c, k) => (state.components[k]![start + i] = fromShardValue(c[i])));
    }
    parts.push({ counts: r.notes.counts, index: r.notes.index, measure: r.notes.measure.map(Number) });
  }
  mergeColumnParts(plan, parts);
  return finishColumns(plan);
}

function bad(detail: string): FormulaError {
  return new FormulaError("invalid_argument", { input: "shards", detail });
}
