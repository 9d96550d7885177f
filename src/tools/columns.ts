import { convertInputs } from "../core/convert.js";
import { FormulaError } from "../core/errors.js";
import { type AnyFormula, type Formula, isFormula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import type { InputSpecs, OutputSpec } from "../core/spec.js";
import { type ColumnShape, type Rows, runRows } from "./columns-loop.js";
import { MAX_COLUMN_ROWS, probeValue, type ReadColumns, readColumns, ROW_ERROR_CODES, type UnitColumn } from "./columns-read.js";
import { bind, siUnit } from "./convert.js";
import { noteConditions, noteSummary, type NoteSummary } from "./notes.js";
import { type LongRunOptions, ticker, watched } from "../core/progress.js";
import { inPieces, tickBelow } from "./chunks.js";

export { MAX_COLUMN_ROWS, ROW_ERROR_CODES };
export type { UnitColumn };

/**
 * One input of evaluateColumns: the same value for every row (a number in
 * SI, a unit string, a choice word, a 3-vector), or a column with one value
 * per row: a Float64Array or array of numbers (SI), an array of unit strings
 * ("0.2 mm") or choice words, or `{ values, unit }` for numbers in a unit.
 */
export type ColumnInput =
  | number
  | string
  | Float64Array
  | readonly (number | string)[]
  | UnitColumn;

export interface ColumnsOptions {
  /**
   * Output column to fill instead of a new one (length = rows). For formulas
   * with components it receives the first component.
   */
  readonly output?: Float64Array;
  /** For formulas with components: one array per component to fill (length = rows). */
  readonly components?: readonly Float64Array[];
  /** Per-row error codes to fill (length = rows). */
  readonly errors?: Uint8Array;
  /**
   * Compute rows [from, to) only (default all rows). The arrays keep full
   * length and row numbers stay those of the whole table; rows outside the
   * range are left as they were. The result for a range depends only on the
   * rows in it, so parts of one table can be computed apart (by workers or on
   * other machines) and put together: values and errors by position, note and
   * error counts by sum, the worst note row by the largest measure (the
   * lower row on a tie) and the first failed row by the lowest.
   */
  readonly from?: number;
  readonly to?: number;
}

/** Rows that failed with one error code: how many, and the first with its message. */
export interface RowErrorSummary {
  readonly code: string;
  readonly count: number;
  readonly first: {
    readonly row: number;
    /** The input the message names (absent for relations between inputs and results out of range). */
    readonly input?: string;
    readonly message: string;
  };
}

/**
 * The result of evaluateColumns. `values[i]` is the output of row i in SI
 * (for formulas with components: the first component; each component is in
 * `components`). A row that could not be computed has `errors[i]` > 0, the
 * index of its code in ROW_ERROR_CODES, and NaN in the value arrays: NaN
 * marks a row not computed here and nowhere else (as in sweeps).
 */
export interface ColumnsResult {
  readonly formula: string;
  readonly rows: number;
  readonly output: {
    readonly name: string;
    readonly description: string;
    readonly unit: string;
    readonly values: Float64Array;
    /** One column per named component (vectors), for formulas with components. */
    readonly components?: Readonly<Record<string, Float64Array>>;
  };
  /** Per row: 0, or the index of the row's error code in ROW_ERROR_CODES. */
  readonly errors: Uint8Array;
  /** Rows (in the range computed) that failed. */
  readonly failed: number;
  /** One entry per error code met, in ROW_ERROR_CODES order. */
  readonly rowErrors: readonly RowErrorSummary[];
  /**
   * Warnings and cautions raised on computed rows, one entry per condition:
   * how many rows raised it and the worst row (largest measure, or the first
   * row for always-on cautions) with its column inputs and message there.
   */
  readonly notes: readonly NoteSummary[];
}

/**
 * Evaluate a formula over columns of inputs, row by row, into Float64Arrays.
 * Per column once: the input's name, dimension and unit scale, and the fixed
 * inputs' checks; per row only what depends on the row (finite, domain,
 * relations, the result). A bad row never throws: it gets an error code and
 * the other rows are computed; each row's value and code are those `evaluate`
 * gives for the row's inputs. Whole-call problems (unknown input, columns of
 * different lengths, a bad fixed input, more than MAX_COLUMN_ROWS rows) throw a
 * FormulaError naming the input.
 *
 * `options.signal` and `options.onProgress` (progress in rows of the range)
 * are checked between pieces of a few milliseconds of rows; a synchronous
 * call sees an abort made before it started or from its own onProgress.
 *
 * @example
 * const r = evaluateColumns("parallelPlateCapacitance", { area: "1 cm^2", gap: ["0.1 mm", "0.2 mm", "-1 mm"] });
 * r.output.values; // Float64Array [8.854e-12, 4.427e-12, NaN]
 * ROW_ERROR_CODES[r.errors[2]]; // "out_of_domain"
 */
export function evaluateColumns<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O> | string,
  inputs: { readonly [K in keyof I]?: ColumnInput | readonly (number | string)[] } | Readonly<Record<string, unknown>>,
  options: ColumnsOptions & LongRunOptions = {},
): ColumnsResult {
  // Anything but a formula is looked up by id, so a stray value is unknown_formula, not a TypeError.
  const f = isFormula(formula) ? formula : getFormula(formula);
  return run(f, inputs, options);
}

function run(formula: AnyFormula, inputs: unknown, options: ColumnsOptions & LongRunOptions): ColumnsResult {
  if (typeof options !== "object" || options === null) throw new FormulaError("invalid_argument", { formula: formula.id, input: "options", detail: "options is an object" });
  const plan = planColumns(formula, readColumns(formula, inputs), options);
  const { from, to, state, shape } = plan;
  const t = ticker("evaluateColumns", options, to - from);
  if (!watched(options)) runRows(formula, state, shape, from, to);
  // In pieces with a tick between: a range's rows depend only on themselves, and the note
  // counts and worst rows accumulate in `state` in row order, as in one pass.
  else inPieces(from, to, (a, b) => runRows(formula, state, shape, a, b), (done) => tickBelow(t, done - from, to - from));
  const result = finishColumns(plan);
  t.finish();
  return result;
}

/**
 * One call of evaluateColumns made ready for its row loop: the range, the
 * result arrays, the fixed inputs checked and bound, and the loop's state.
 * evaluateColumns runs the loop over the range; the parallel entry and the
 * shards run parts of it elsewhere and put the parts' note counts into
 * `state` (mergeColumnParts) before finishColumns.
 */
export interface ColumnsPlan {
  readonly formula: AnyFormula;
  readonly read: ReadColumns;
  readonly from: number;
  readonly to: number;
  readonly shape: ColumnShape;
  readonly state: Rows;
  /** The probe values the fixed inputs were bound with (one per column input). */
  readonly probes: Readonly<Record<string, unknown>>;
}

/** The probe values for binding the fixed inputs: per column, its first in-domain value (or the example); per choice column its first choice. */
export function columnProbes(read: ReadColumns): Record<string, unknown> {
  const probes: Record<string, unknown> = {};
  for (const c of read.numbers) probes[c.name] = probeValue(c);
  for (const c of read.choices) probes[c.name] = c.data.find((v) => typeof v === "string" && c.spec.choices.includes(v)) ?? c.spec.choices[0];
  return probes;
}

/**
 * Plans a call over columns already read. `probes` default to columnProbes(read);
 * a worker computing part of a table passes the whole table's, so the fixed
 * inputs are bound exactly as in one run.
 */
export function planColumns(formula: AnyFormula, read: ReadColumns, options: ColumnsOptions, probes: Readonly<Record<string, unknown>> = columnProbes(read)): ColumnsPlan {
  const id = formula.id;
  const def = formula.definition;
  const rows = read.rows;
  const from = rangeEnd(id, "from", options.from, 0, rows);
  const to = rangeEnd(id, "to", options.to, rows, rows);
  if (from > to) throw new FormulaError("invalid_argument", { formula: id, input: "from", value: from, detail: `from must not be after to (${to})` });
  const comps = def.output.components as readonly string[] | undefined;
  const nc = comps?.length ?? 0;
  const components = nc === 0 ? [] : given(id, "components", options.components, nc, rows) ?? comps!.map(() => new Float64Array(rows));
  const values = nc > 0 ? components[0]! : (outputArray(id, "output", options.output, rows, Float64Array) ?? new Float64Array(rows));
  if (nc > 0 && options.output !== undefined) throw new FormulaError("invalid_argument", { formula: id, input: "output", detail: "a formula with components fills `components`, one array per component" });
  const errors = outputArray(id, "errors", options.errors, rows, Uint8Array) ?? new Uint8Array(rows);

  // The fixed inputs: read and checked once (with in-domain probes for the columns), as a sweep does.
  const fixed = convertInputs(formula, read.fixed);
  const o = bind(formula, fixed, probes as Record<string, number>).x;

  const shape: ColumnShape = Object.keys(def.inputs)
    .map((name) => {
      const n = read.numbers.find((c) => c.name === name);
      if (n) return [name, n.spec.domain, false] as const;
      return read.choices.some((c) => c.name === name) ? ([name, undefined, true] as const) : undefined;
    })
    .filter((s) => s !== undefined);
  const { conditions } = noteConditions(formula);
  const state: Rows = {
    o,
    compute: def.compute as (x: unknown) => unknown,
    holds: (def.relations ?? []).map((r) => r.holds) as ((x: unknown) => boolean)[],
    numbers: shape.filter((s) => !s[2]).map((s) => read.numbers.find((c) => c.name === s[0])!.data),
    choices: shape.filter((s) => s[2]).map((s) => read.choices.find((c) => c.name === s[0])!.data),
    choiceSets: shape.filter((s) => s[2]).map((s) => new Set(read.choices.find((c) => c.name === s[0])!.spec.choices)),
    pre: read.pre,
    values,
    components,
    errors,
    conditions,
    counts: new Float64Array(conditions.length),
    index: new Float64Array(conditions.length).fill(-1),
    measure: new Float64Array(conditions.length).fill(-Infinity),
  };
  return { formula, read, from, to, shape, state, probes };
}

/** The result of a planned call once its rows [from, to) are computed and their note counts are in the plan's state. */
export function finishColumns(plan: ColumnsPlan): ColumnsResult {
  const { formula, read, from, to, shape, state } = plan;
  const id = formula.id;
  const def = formula.definition;
  const { values, components, errors, o } = state;
  const comps = def.output.components as readonly string[] | undefined;
  const nc = components.length;
  const { conditions, kinds } = noteConditions(formula);
  const seen = new Float64Array(ROW_ERROR_CODES.length);
  const firstRow = new Float64Array(ROW_ERROR_CODES.length).fill(-1);
  for (let i = from; i < to; i++) {
    const e = errors[i]!;
    if (e === 0) continue;
    if (seen[e] === 0) firstRow[e] = i;
    seen[e]!++;
  }
  let failed = 0;
  const rowErrors: RowErrorSummary[] = [];
  for (let e = 1; e < ROW_ERROR_CODES.length; e++) {
    if (seen[e] === 0) continue;
    failed += seen[e]!;
    rowErrors.push({ code: ROW_ERROR_CODES[e]!, count: seen[e]!, first: rowMessage(formula, read, firstRow[e]!) });
  }
  const columnNames = shape.map((s) => s[0]);
  const notes: NoteSummary[] = [];
  for (let c = 0; c < conditions.length; c++) {
    if (state.counts[c] === 0) continue;
    const k = state.index[c]!;
    const worstInputs: Record<string, number> = {};
    for (const name of columnNames) {
      const col = read.numbers.find((n) => n.name === name);
      const v = col ? col.data[k]! : read.choices.find((n) => n.name === name)!.data[k];
      o[name] = v;
      if (col) worstInputs[name] = v as number;
    }
    const value = nc === 0 ? values[k]! : components.map((a) => a[k]!);
    notes.push(noteSummary(conditions[c]!, kinds[c]!, state.counts[c]!, k, state.measure[c]!, worstInputs, o, value));
  }
  return {
    formula: id,
    rows: read.rows,
    output: {
      name: id,
      description: def.output.description,
      unit: siUnit(def.output.dimension),
      values,
      ...(comps ? { components: Object.fromEntries(comps.map((c, i) => [c, components[i]!])) } : {}),
    },
    errors,
    failed,
    rowErrors,
    notes,
  };
}

/**
 * The first failed row of a code, with the message `evaluate` gives for it:
 * the row is run again through the checked path, which names the input.
 * Once per code, so failed rows cost nothing extra in the loop.
 */
function rowMessage(formula: AnyFormula, read: ReadColumns, row: number): RowErrorSummary["first"] {
  try {
    formula.run(formula.prepare(convertInputs(formula, read.rawRow(row))));
  } catch (e) {
    if (e instanceof FormulaError) return { row, ...(e.input !== undefined ? { input: e.input } : {}), message: e.message };
    throw e;
  }
  // Not reached for a row the loop marked; kept so a disagreement is visible, not hidden.
  return { row, message: `${formula.id}: row ${row} failed in the column loop but not when evaluated alone` };
}

function rangeEnd(id: string, name: string, v: unknown, fallback: number, rows: number): number {
  if (v === undefined) return fallback;
  if (typeof v !== "number" || !Number.isInteger(v) || v < 0 || v > rows) {
    throw new FormulaError("invalid_argument", { formula: id, input: name, value: v, detail: `a row number from 0 to ${rows}` });
  }
  return v;
}

function outputArray<T extends Float64Array | Uint8Array>(
  id: string, name: string, v: unknown, rows: number, kind: { new (n: number): T; readonly name: string },
): T | undefined {
  if (v === undefined) return undefined;
  if (!(v instanceof kind) || v.length !== rows) {
    throw new FormulaError("invalid_argument", { formula: id, input: name, detail: `give a ${kind.name} of length ${rows} (one per row)` });
  }
  return v;
}

function given(id: string, name: string, v: unknown, n: number, rows: number): Float64Array[] | undefined {
  if (v === undefined) return undefined;
  if (!Array.isArray(v) || v.length !== n) throw new FormulaError("invalid_argument", { formula: id, input: name, detail: `give ${n} Float64Arrays, one per component` });
  return v.map((a) => outputArray(id, name, a, rows, Float64Array)!);
}

/**
 * A columns result as plain JSON: arrays for the typed arrays, null (JSON
 * has no NaN) for the value of a failed row, and each row's error code as
 * text (null when it computed). Used by the command line and emquant/http.
 */
export function columnsToJson(result: ColumnsResult): Record<string, unknown> {
  const ok = result.errors;
  const column = (values: Float64Array): (number | null)[] => Array.from(values, (v, i) => (ok[i] === 0 ? v : null));
  const out = result.output;
  return {
    formula: result.formula,
    rows: result.rows,
    output: {
      name: out.name, description: out.description, unit: out.unit, values: column(out.values),
      ...(out.components ? { components: Object.fromEntries(Object.entries(out.components).map(([k, v]) => [k, column(v)])) } : {}),
    },
    errors: Array.from(result.errors, (e) => (e === 0 ? null : ROW_ERROR_CODES[e]!)),
    failed: result.failed,
    rowErrors: result.rowErrors,
    notes: result.notes,
  };
}
