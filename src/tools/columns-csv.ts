import { FormulaError } from "../core/errors.js";
import { type AnyFormula, isFormula } from "../core/formula.js";
import type { LongRunOptions } from "../core/progress.js";
import { getFormula } from "../core/registry.js";
import { type ColumnsOptions, type ColumnsResult, evaluateColumns, MAX_COLUMN_ROWS, ROW_ERROR_CODES } from "./columns.js";
import type { UnitColumn } from "./columns-read.js";

/*
 * CSV text in and out of evaluateColumns. The header names the inputs; a
 * unit may follow a name in parentheses, "gap (mm)", the form sweepToCsv and
 * columnsToCsv write, so a table this library wrote reads back. Bare numbers
 * in such a column are in that unit; a cell may also carry its own unit
 * ("0.2 mm"), read as written; without a header unit bare numbers are SI.
 */

/** Largest CSV text read by default, in characters (about 50 MB). */
export const MAX_CSV_CHARS = 50_000_000;

export interface CsvLimits {
  /** Largest text in characters (default MAX_CSV_CHARS). */
  readonly maxChars?: number;
  /** Most data rows (default MAX_COLUMN_ROWS). */
  readonly maxRows?: number;
}

/** The columns of a CSV table: per header name, its cells and the unit from the header if any. */
export interface CsvTable {
  readonly names: readonly string[];
  readonly rows: number;
  readonly columns: Readonly<Record<string, readonly string[] | UnitColumn>>;
}

const HEADER = /^\s*([A-Za-z][A-Za-z0-9]*)\s*(?:\((.*)\))?\s*$/;

/**
 * Read CSV text (RFC 4180: commas, double-quoted cells with "" for a quote,
 * LF or CRLF line ends) with a header row of input names, each optionally
 * followed by its unit in parentheses. Blank lines are skipped. A row with
 * fewer cells than the header leaves the rest empty (not given); a row with
 * more is refused, since a decimal comma or a stray separator would shift
 * every later cell. Errors are FormulaErrors naming "csv".
 */
export function readCsvTable(text: string, limits: CsvLimits = {}): CsvTable {
  const maxChars = limit("maxChars", limits.maxChars, MAX_CSV_CHARS);
  const maxRows = limit("maxRows", limits.maxRows, MAX_COLUMN_ROWS);
  if (typeof text !== "string") throw new FormulaError("wrong_type", { input: "csv", value: text, expected: "CSV text" });
  if (text.length > maxChars) throw new FormulaError("invalid_argument", { input: "csv", detail: `the CSV text is over ${maxChars} characters` });
  const lines = splitRecords(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  const header = lines.next();
  if (header.done) throw new FormulaError("invalid_argument", { input: "csv", detail: "the CSV text is empty; the first line names the inputs" });
  const names: string[] = [];
  const units: (string | undefined)[] = [];
  for (const cell of header.value.cells) {
    const m = HEADER.exec(cell);
    if (m === null) {
      throw new FormulaError("unparsable", { input: "csv", value: cell, detail: 'a header cell is an input name, optionally with its unit in parentheses: "gap (mm)"' });
    }
    if (names.includes(m[1]!)) throw new FormulaError("invalid_argument", { input: m[1], detail: "the CSV header names this input twice" });
    names.push(m[1]!);
    const unit = m[2]?.trim();
    units.push(unit ? unit : undefined);
  }
  const cells: string[][] = names.map(() => []);
  let rows = 0;
  for (const record of lines) {
    if (record.cells.length > names.length) {
      throw new FormulaError("invalid_argument", { input: "csv", detail: `line ${record.line} has ${record.cells.length} cells; the header has ${names.length}` });
    }
    if (rows >= maxRows) throw new FormulaError("invalid_argument", { input: "csv", detail: `the CSV table has more than ${maxRows} rows` });
    for (let c = 0; c < names.length; c++) cells[c]!.push((record.cells[c] ?? "").trim());
    rows++;
  }
  if (rows === 0) throw new FormulaError("invalid_argument", { input: "csv", detail: "the CSV table has a header but no rows" });
  const columns: Record<string, readonly string[] | UnitColumn> = {};
  names.forEach((n, c) => (columns[n] = units[c] === undefined ? cells[c]! : { values: cells[c]!, unit: units[c]! }));
  return { names, rows, columns };
}

function limit(name: string, v: unknown, fallback: number): number {
  if (v === undefined) return fallback;
  if (typeof v !== "number" || !Number.isInteger(v) || v < 1) throw new FormulaError("invalid_argument", { input: name, value: v, detail: "a whole number from 1" });
  return v;
}

/** Records of CSV text: cells and the line each starts on. Blank lines are skipped. */
function* splitRecords(text: string): Generator<{ cells: string[]; line: number }> {
  let line = 1;
  if (!text.includes('"')) {
    // No quoting anywhere: plain splits, the common case.
    for (const l of text.split("\n")) {
      const t = l.endsWith("\r") ? l.slice(0, -1) : l;
      if (t.trim() !== "") yield { cells: t.split(","), line };
      line++;
    }
    return;
  }
  // One pass over the characters; every character is visited once, so it ends.
  let cells: string[] = [];
  let cell = "";
  let quoted = false;
  let start = line;
  let any = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = false;
      } else {
        if (ch === "\n") line++;
        cell += ch;
      }
      continue;
    }
    if (ch === '"') {
      quoted = true;
      any = true;
    } else if (ch === ",") {
      cells.push(cell);
      cell = "";
      any = true;
    } else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      cells.push(cell);
      if (any || cells.some((c) => c.trim() !== "")) yield { cells, line: start };
      cells = [];
      cell = "";
      any = false;
      line++;
      start = line;
    } else {
      cell += ch;
    }
  }
  if (quoted) throw new FormulaError("unparsable", { input: "csv", detail: `a quoted cell opened on line ${start} is not closed` });
  cells.push(cell);
  if (any || cells.some((c) => c.trim() !== "")) yield { cells, line: start };
}

/**
 * Evaluate a formula over the rows of CSV text (or a table readCsvTable read);
 * `fixed` gives inputs that are the same for every row (numbers in SI or
 * unit strings). Each row gets its value or an error code, as evaluateColumns.
 * `options.signal` and `options.onProgress` go to evaluateColumns (progress
 * in rows; reading the text, bounded by maxChars, is not counted).
 *
 * @example
 * const r = evaluateCsv("parallelPlateCapacitance", "area (cm^2),gap\n1,0.1 mm\n2,0.2 mm\n", {});
 * r.output.values; // Float64Array [8.854e-12, 8.854e-12]
 */
export function evaluateCsv(
  formula: AnyFormula | string,
  csv: string | CsvTable,
  fixed: Readonly<Record<string, unknown>> = {},
  options: CsvLimits & ColumnsOptions & LongRunOptions = {},
): ColumnsResult {
  const f = isFormula(formula) ? formula : getFormula(formula);
  if (typeof fixed !== "object" || fixed === null || Array.isArray(fixed)) {
    throw new FormulaError("wrong_type", { formula: f.id, input: "inputs", value: fixed, expected: "an object of the inputs fixed for every row" });
  }
  const table = typeof csv === "string" ? readCsvTable(csv, options) : csv;
  for (const name of Object.keys(fixed)) {
    if (table.names.includes(name)) throw new FormulaError("invalid_argument", { formula: f.id, input: name, detail: "given both as a CSV column and as a fixed value" });
  }
  const { maxChars: _c, maxRows: _r, ...columnOptions } = options;
  return evaluateColumns(f, { ...fixed, ...table.columns }, columnOptions);
}

/**
 * CSV text of a columns result: one line per row, the output (one column
 * per component for vectors) with its SI unit in the header, then the row's
 * error code ("error"; empty when the row computed, and the output cell empty
 * when it did not). Numbers are written with full precision (round-trip).
 */
export function columnsToCsv(result: ColumnsResult): string {
  const out = result.output;
  const unit = out.unit ? ` (${out.unit})` : "";
  const comps = out.components ? Object.entries(out.components) : [];
  const header = comps.length === 0 ? [`${out.name}${unit}`] : comps.map(([c]) => `${out.name}.${c}${unit}`);
  header.push("error");
  const arrays = comps.length === 0 ? [out.values] : comps.map(([, a]) => a);
  const lines = [header.map(csvCell).join(",")];
  for (let i = 0; i < result.rows; i++) {
    const e = result.errors[i]!;
    lines.push([...arrays.map((a) => (e === 0 ? String(a[i]) : "")), ROW_ERROR_CODES[e] ?? ""].join(","));
  }
  return `${lines.join("\n")}\n`;
}

function csvCell(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
