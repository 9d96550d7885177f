import { FormulaError } from "../core/errors.js";
import { getFormula } from "../core/registry.js";
import type { ChoiceInput, QuantityInput } from "../core/spec.js";
import { type ColumnsPlan, planColumns } from "./columns.js";
import { runRows } from "./columns-loop.js";
import type { ReadColumns } from "./columns-read.js";
import { inPieces } from "./chunks.js";
import { specsOf } from "./convert.js";

/*
 * A range of rows of one evaluateColumns call, computed apart from the rest:
 * on a pool thread (columnsParallel) or in a shard (columns-shards.ts). The
 * columns have been read once by the caller (unit strings and mixed arrays
 * are SI numbers by then, unreadable cells have their codes in `pre`); a part
 * binds the fixed inputs with the whole table's probes, runs the same
 * generated row loop over its rows, and returns the notes' counts and worst
 * rows, which mergeColumnParts joins in row order exactly as one loop over
 * all rows would have counted them.
 */

/** A table's columns as a pool task carries them: numbers and codes in shared arrays, indexed by the whole table's rows. */
export interface ColumnsTaskData {
  readonly formula: string;
  readonly rows: number;
  /** Numeric columns in SI, full length. */
  readonly numbers: readonly { readonly name: string; readonly data: Float64Array }[];
  /** Choice columns as indices into the input's choices; NOT_A_CHOICE for a word that is none of them. */
  readonly choices: readonly { readonly name: string; readonly data: Uint8Array }[];
  /** The inputs given once for every row, as given. */
  readonly fixed: Readonly<Record<string, unknown>>;
  readonly probes: Readonly<Record<string, unknown>>;
  /** Per-row codes of unreadable cells (0 none), full length; absent when every cell was read. */
  readonly pre?: Uint8Array;
  readonly values: Float64Array;
  readonly components: readonly Float64Array[];
  readonly errors: Uint8Array;
}

/** What a range of rows found: per note condition the rows that raised it, the worst row (-1 none) and its measure. */
export interface ColumnsPart {
  readonly counts: readonly number[];
  readonly index: readonly number[];
  readonly measure: readonly number[];
}

/** The code of a choice cell that is none of the input's choices (choice lists are far shorter). */
export const NOT_A_CHOICE = 255;

/** A word that is no input's choice (the loop checks membership; the word itself is never used). */
const NONE = "\u0000not a choice";

/** A choice column as indices into its input's choices (for a task). */
export function choiceCodes(tool: string, name: string, data: readonly unknown[], spec: ChoiceInput, into: Uint8Array): void {
  if (spec.choices.length >= NOT_A_CHOICE) throw new FormulaError("invalid_argument", { formula: tool, input: name, detail: `a choice column split over threads or shards takes at most ${NOT_A_CHOICE - 1} choices` });
  const index = new Map<unknown, number>(spec.choices.map((c, i) => [c, i]));
  for (let i = 0; i < data.length; i++) into[i] = index.get(data[i]) ?? NOT_A_CHOICE;
}

/**
 * Rows [start, end) of the table: the row loop over views of the task's
 * arrays (so row k of the table is row k - start here), worst rows reported
 * in the table's numbering. With `between`, the rows run in pieces of a few
 * milliseconds and `between(done)` is called after each but the last (a pool
 * task stores its progress and reads the cancel flag there); the loop's
 * counts carry over from piece to piece, so the part is that of one loop.
 */
export function columnsRange(task: ColumnsTaskData, start: number, end: number, between?: (done: number) => void): ColumnsPart {
  const formula = getFormula(task.formula);
  const specs = specsOf(formula);
  const view = <T extends Float64Array | Uint8Array>(a: T): T => a.subarray(start, end) as T;
  const read: ReadColumns = {
    rows: end - start,
    numbers: task.numbers.map((c) => ({ name: c.name, spec: specs[c.name] as QuantityInput, data: view(c.data) })),
    choices: task.choices.map((c) => {
      const spec = specs[c.name] as ChoiceInput;
      const data = Array.from(view(c.data), (k) => (k === NOT_A_CHOICE ? NONE : spec.choices[k]!));
      return { name: c.name, spec, data };
    }),
    fixed: { ...task.fixed },
    pre: task.pre === undefined ? undefined : view(task.pre),
    rawRow: () => {
      throw new Error("columnsRange: row messages are made by the calling thread");
    },
  };
  const plan = planColumns(formula, read, { output: task.components.length > 0 ? undefined : view(task.values), components: task.components.length > 0 ? task.components.map(view) : undefined, errors: view(task.errors) }, task.probes);
  if (between === undefined) runRows(formula, plan.state, plan.shape, 0, end - start);
  else inPieces(0, end - start, (a, b) => runRows(formula, plan.state, plan.shape, a, b), between);
  const s = plan.state;
  return { counts: Array.from(s.counts), index: Array.from(s.index, (k) => (k < 0 ? k : k + start)), measure: Array.from(s.measure) };
}

/**
 * Puts the parts' note counts into the plan's state, parts in row order:
 * counts add up; the worst row is the first part's unless a later part found
 * a strictly larger measure (the loop keeps the earlier row on a tie), or the
 * earlier parts found none. The same rule as the loop's, so the result is the
 * one loop's, bit for bit.
 */
export function mergeColumnParts(plan: ColumnsPlan, parts: readonly ColumnsPart[]): void {
  const s = plan.state;
  for (const p of parts) {
    for (let c = 0; c < s.counts.length; c++) {
      s.counts[c]! += p.counts[c]!;
      if (p.index[c]! < 0) continue;
      if (s.index[c]! < 0 || p.measure[c]! > s.measure[c]!) {
        s.index[c] = p.index[c]!;
        s.measure[c] = p.measure[c]!;
      }
    }
  }
}
