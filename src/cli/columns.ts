import { FormulaError } from "../core/errors.js";
import type { LongRunOptions } from "../core/progress.js";
import { columnsToCsv, evaluateCsv } from "../tools/columns-csv.js";
import { type ColumnsResult, columnsToJson, ROW_ERROR_CODES } from "../tools/columns.js";
import { formatQuantity } from "../units/display.js";
import type { DesignFiles } from "./design.js";

// `emquant columns <formula> <file.csv> name=value ...`: every row of a CSV
// table through evaluateColumns. Kept apart from run.ts, as design.ts is, so
// the command's file handling stays in one place.

export interface ColumnsCommandOptions {
  readonly formula: string;
  readonly file: string;
  /** Inputs the same for every row (name=value pairs). */
  readonly fixed: Readonly<Record<string, unknown>>;
  readonly json: boolean;
  readonly csv: boolean;
  /** Cancellation and progress (the job thread's), passed to evaluateCsv. */
  readonly longRun?: LongRunOptions | undefined;
}

/**
 * Returns the exit status: 0 when every row computed, 4 when some rows
 * failed (their codes are in the output; the other rows are computed).
 * Whole-call FormulaErrors (the file, the header, limits) propagate.
 */
export function columnsCommand(
  o: ColumnsCommandOptions,
  files: DesignFiles,
  io: { out(text: string): void; err(text: string): void },
  noteLines: (r: ColumnsResult) => string[],
): number {
  let text: string;
  try {
    text = files.readText(o.file);
  } catch (e) {
    throw new FormulaError("invalid_argument", { input: "file", value: o.file, detail: `cannot read the CSV file: ${(e as Error).message}` });
  }
  const r = evaluateCsv(o.formula, text, o.fixed, { ...o.longRun });
  const status = r.failed > 0 ? 4 : 0;
  const notes = noteLines(r);
  const failures = r.rowErrors.map((e) => `error [${e.code}] in ${e.count} of ${r.rows} rows; first at row ${e.first.row + 1}: ${e.first.message}`);
  if (o.json) {
    io.out(JSON.stringify(columnsToJson(r), null, 2));
    return status;
  }
  if (o.csv) {
    // The data stays data only; the notes and the failed rows' messages go beside it, on stderr.
    io.out(columnsToCsv(r).trimEnd());
    if (notes.length + failures.length) io.err([...failures, ...notes].join("\n"));
    return status;
  }
  const out = r.output;
  const comps = out.components ? Object.entries(out.components) : [];
  const arrays = comps.length ? comps.map(([, a]) => a) : [out.values];
  const lines = [["row", ...(comps.length ? comps.map(([c]) => `${out.name}.${c}`) : [out.name]), "error"].join("\t")];
  for (let i = 0; i < r.rows; i++) {
    const e = r.errors[i]!;
    lines.push([String(i + 1), ...arrays.map((a) => (e === 0 ? formatQuantity(a[i]!, out.unit) : "not computed")), e === 0 ? "" : ROW_ERROR_CODES[e]!].join("\t"));
  }
  lines.push(`${r.rows - r.failed} of ${r.rows} rows computed`, ...failures);
  if (notes.length) lines.push("notes found in the rows:", ...notes);
  io.out(lines.join("\n"));
  return status;
}
