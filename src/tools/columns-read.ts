import { ERROR_CODES, type ErrorCode, FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import type { ChoiceInput, QuantityInput } from "../core/spec.js";
import { DIMENSIONS, type Exponents, sameExponents } from "../units/dimensions.js";
import { decimalFactor, type DecimalFactor, scaleDecimal, scaleNumber } from "../units/decimal-scale.js";
import { parseQuantity } from "../units/parse.js";
import { inDomain, readQuantity, specsOf } from "./convert.js";

/*
 * The inputs of evaluateColumns read into plain columns: numeric columns in SI
 * (Float64Array or an all-number array, used as given), columns of choice
 * words, and per-row codes for cells that could not be read (a unit string
 * of the wrong dimension, text that is no number). Everything that can be
 * decided once per column (which input, its dimension, the unit's scale) is
 * decided here, once; the row loop (columns-loop.ts) only sees numbers.
 */

/** Most rows of one call (the same bound as a sweep's grid points). */
export const MAX_COLUMN_ROWS = 4_000_000;

/**
 * The per-row error codes: index 0 is "no error", index k is the library's
 * ERROR_CODES[k - 1], so the table is fixed and rows from separate calls
 * (shards of one table) mean the same codes.
 */
export const ROW_ERROR_CODES: readonly ("" | ErrorCode)[] = /* @__PURE__ */ Object.freeze(["", ...ERROR_CODES]);

/** The row code of a library error code. */
export function rowCode(code: ErrorCode): number {
  return ERROR_CODES.indexOf(code) + 1;
}

/**
 * A column with its unit: bare numbers (or number text) are in `unit`
 * ("mm", "pF"); a text cell carrying its own unit ("0.2 in") is read as written.
 */
export interface UnitColumn {
  readonly values: Float64Array | readonly (number | string)[];
  readonly unit: string;
}

/** A numeric column ready for the row loop. */
export interface NumberColumn {
  readonly name: string;
  readonly spec: QuantityInput;
  readonly data: Float64Array | readonly number[];
}

/** A column of choice words. */
export interface ChoiceColumn {
  readonly name: string;
  readonly spec: ChoiceInput;
  readonly data: readonly unknown[];
}

export interface ReadColumns {
  readonly rows: number;
  readonly numbers: NumberColumn[];
  readonly choices: ChoiceColumn[];
  /** The inputs given once for every row, as given (checked by the caller). */
  readonly fixed: Record<string, unknown>;
  /** Per-row codes of cells that could not be read (0 none); undefined when every cell was read. */
  readonly pre: Uint8Array | undefined;
  /** The row's inputs as `evaluate` takes them (for the message of a failed row). */
  rawRow(i: number): Record<string, unknown>;
}

function isColumn(v: unknown): v is Float64Array | readonly unknown[] {
  return v instanceof Float64Array || Array.isArray(v);
}

function isUnitColumn(v: unknown): v is UnitColumn {
  return typeof v === "object" && v !== null && !isColumn(v) && !ArrayBuffer.isView(v) && Object.hasOwn(v, "values") && Object.hasOwn(v, "unit");
}

/** A bare decimal number as text (no unit). */
const PLAIN = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s*$/;

/** Reads the inputs of one call; whole-call problems (names, lengths, fixed values' types) throw. */
export function readColumns(formula: AnyFormula, inputs: unknown): ReadColumns {
  const id = formula.id;
  if (typeof inputs !== "object" || inputs === null || Array.isArray(inputs)) {
    throw new FormulaError("wrong_type", { formula: id, input: "inputs", value: inputs, expected: "an object of named inputs (numbers, unit strings or columns)" });
  }
  const given = inputs as Record<string, unknown>;
  const specs = specsOf(formula);
  for (const name of Object.keys(given)) {
    if (!Object.hasOwn(specs, name)) throw new FormulaError("unknown_input", { formula: id, input: name });
  }
  // Rows: the length of the first column in declaration order; every other column must match it.
  let rows = -1;
  let first = "";
  for (const [name, spec] of Object.entries(specs)) {
    const raw = Object.hasOwn(given, name) ? given[name] : undefined;
    if (isUnitColumn(raw) && !isColumn(raw.values)) {
      throw new FormulaError("wrong_type", { formula: id, input: name, value: raw.values, expected: "a column (Float64Array or array) as values" });
    }
    const column = isUnitColumn(raw) ? raw.values : raw;
    if (!isColumn(column)) continue;
    if (!("choices" in spec) && spec.vector) {
      // One 3-vector for every row is the vector's own form; a column of them is not read.
      if (isUnitColumn(raw) || column.some((c) => typeof c === "object" && c !== null)) {
        throw new FormulaError("invalid_argument", { formula: id, input: name, detail: "a vector input takes one 3-vector for every row, not a column" });
      }
      continue;
    }
    // A series (a waveform) is one value for every row, like a vector: an array here is that series.
    if (!("choices" in spec) && spec.series) continue;
    const n = column.length;
    if (n > MAX_COLUMN_ROWS) throw new FormulaError("invalid_argument", { formula: id, input: name, value: n, detail: `a column has at most ${MAX_COLUMN_ROWS} rows` });
    if (rows < 0) {
      rows = n;
      first = name;
    } else if (n !== rows) {
      throw new FormulaError("invalid_argument", { formula: id, input: name, value: n, detail: `this column has ${n} rows; the column "${first}" has ${rows}` });
    }
  }
  if (rows === 0) throw new FormulaError("invalid_argument", { formula: id, input: first, detail: "a column needs at least one row" });
  if (rows < 0) rows = 1; // no column: one row, as evaluate
  let pre: Uint8Array | undefined;
  const fail = (i: number, code: ErrorCode): void => {
    pre ??= new Uint8Array(rows);
    if (pre[i] === 0) pre[i] = rowCode(code);
  };
  const numbers: NumberColumn[] = [];
  const choices: ChoiceColumn[] = [];
  const fixed: Record<string, unknown> = {};
  const texts = new Map<string, (i: number) => unknown>();
  for (const [name, spec] of Object.entries(specs)) {
    const raw = Object.hasOwn(given, name) ? given[name] : undefined;
    if ("choices" in spec) {
      if (!Array.isArray(raw)) {
        if (raw !== undefined) fixed[name] = raw;
        continue;
      }
      choices.push({ name, spec, data: choiceColumn(raw, spec, (i) => fail(i, raw[i] === undefined || raw[i] === "" ? "missing_input" : "wrong_type")) });
      texts.set(name, (i) => raw[i]);
      continue;
    }
    if (spec.vector || spec.series || (!isColumn(raw) && !isUnitColumn(raw))) {
      if (raw !== undefined) fixed[name] = raw;
      continue;
    }
    const unit = isUnitColumn(raw) ? raw.unit : undefined;
    const cells = isUnitColumn(raw) ? raw.values : (raw as Float64Array | readonly unknown[]);
    if (unit === undefined && (cells instanceof Float64Array || allNumbers(cells))) {
      numbers.push({ name, spec, data: cells as Float64Array | readonly number[] });
      texts.set(name, (i) => cells[i]);
      continue;
    }
    const reader = cellReader(id, name, spec, unit);
    const data = new Float64Array(rows);
    for (let i = 0; i < rows; i++) {
      const r = reader(cells[i]);
      if (typeof r === "number") data[i] = r;
      else {
        data[i] = NaN;
        fail(i, r);
      }
    }
    numbers.push({ name, spec, data });
    texts.set(name, (i) => {
      const c = cells[i];
      // A bare number in the column's unit, as the unit string it stands for ("0.2 mm"); NaN stays a number (not_finite).
      if (unit !== undefined && ((typeof c === "number" && c - c === 0) || (typeof c === "string" && PLAIN.test(c)))) return `${String(c).trim()} ${unit}`;
      return blankToUndefined(c);
    });
  }
  const rawRow = (i: number): Record<string, unknown> => {
    const row: Record<string, unknown> = { ...fixed };
    for (const [name, at] of texts) {
      const v = at(i);
      if (v !== undefined) row[name] = v;
    }
    return row;
  };
  return { rows, numbers, choices, fixed, pre, rawRow };
}

function blankToUndefined(v: unknown): unknown {
  return v === "" || (typeof v === "string" && v.trim() === "") ? undefined : v;
}

function allNumbers(cells: readonly unknown[]): boolean {
  // One pass of typeof per column: then the row loop reads the array as it is.
  for (let i = 0; i < cells.length; i++) if (typeof cells[i] !== "number") return false;
  return true;
}

/** Choice words as given; a cell that is no string (or empty, without a default) is marked for `fail`. */
function choiceColumn(raw: readonly unknown[], spec: ChoiceInput, fail: (i: number) => void): readonly unknown[] {
  let out: unknown[] | undefined;
  for (let i = 0; i < raw.length; i++) {
    const v = raw[i];
    if (typeof v === "string" && v !== "") continue;
    out ??= raw.slice();
    if ((v === undefined || v === "") && spec.default !== undefined) out[i] = spec.default;
    else fail(i);
  }
  return out ?? raw;
}

/**
 * The reader of one column's cells: the SI value, or the code of why the
 * cell cannot be read. With a unit, the unit is read once and its scale kept
 * as an exact decimal factor (bare numbers are then scaled as "0.2 mm" is,
 * correctly rounded from the decimal); units with an offset (degC) or a
 * factor that is no short decimal are read cell by cell as "value unit".
 */
function cellReader(id: string, name: string, spec: QuantityInput, unit: string | undefined): (cell: unknown) => number | ErrorCode {
  let factor: DecimalFactor | undefined;
  if (unit !== undefined) {
    if (typeof unit !== "string") throw new FormulaError("wrong_type", { formula: id, input: name, value: unit, expected: 'a unit such as "mm"' });
    // The unit's dimension is checked once, for the whole column.
    const one = readQuantity(id, name, spec.dimension, `1 ${unit}`);
    const zero = parseQuantity(`0 ${unit}`, name, id).si;
    factor = zero === 0 ? decimalFactor(one) : undefined;
  }
  const exps = DIMENSIONS[spec.dimension].exps as Exponents;
  return (cell) => {
    if (cell === undefined || (typeof cell === "string" && cell.trim() === "")) {
      return spec.default !== undefined ? spec.default : "missing_input";
    }
    if (typeof cell === "number") {
      if (unit === undefined) return cell;
      if (cell - cell !== 0) return "not_finite";
      return factor !== undefined ? scaleNumber(cell, factor) : textValue(`${cell} ${unit}`);
    }
    if (typeof cell !== "string") return "wrong_type";
    if (PLAIN.test(cell)) {
      if (unit === undefined) return Number(cell);
      if (factor !== undefined) {
        const v = factor[0] === 1 ? shiftDecimal(cell.trim(), factor[1]) : scaleDecimal(cell.trim(), factor[0], factor[1]);
        if (v !== undefined) return v - v === 0 ? v : "not_finite";
      }
      return textValue(`${cell.trim()} ${unit}`);
    }
    return textValue(cell);
  };
  function textValue(text: string): number | ErrorCode {
    try {
      const q = parseQuantity(text, name, id);
      if (!q.plain && !sameExponents(q.exps, exps)) return "wrong_dimension";
      return q.si - q.si === 0 ? q.si : "not_finite";
    } catch (e) {
      if (e instanceof FormulaError) return e.code;
      throw e;
    }
  }
}

/**
 * A plain decimal's text times 10^k, correctly rounded: the same decimal with
 * its exponent moved, read once by Number() (whose reading of a decimal is
 * correctly rounded), as scaleDecimal gives it without its BigInt product.
 */
function shiftDecimal(text: string, k: number): number {
  const e = text.search(/[eE]/);
  return e < 0 ? Number(`${text}e${k}`) : Number(`${text.slice(0, e)}e${Number(text.slice(e + 1)) + k}`);
}

/** A probe for binding the fixed inputs: the column's first value in the domain, or the input's example. */
export function probeValue(c: NumberColumn): number {
  const d = c.data;
  for (let i = 0; i < d.length && i < 1000; i++) if (inDomain(d[i]!, c.spec.domain)) return d[i]!;
  const ex = c.spec.example;
  return typeof ex === "number" ? ex : (c.spec.default ?? 1);
}
