import type { MathJsInstance, Unit } from "mathjs";
import { FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import { getFormula, listFormulas } from "../core/registry.js";
import { outputDimension, type InputSpec, type Note } from "../core/spec.js";
import { DIMENSIONS, type Exponents, nameExponents, sameExponents } from "../units/dimensions.js";
import { loadFullMath } from "../units/load-full.js";
import { addTradeUnits } from "../units/parse.js";
import { catalogEntry } from "../tools/catalog.js";
import { readQuantity } from "../tools/convert.js";
import { columnsToJson, evaluateColumns } from "../tools/columns.js";
import { atSample, checkSeriesShape } from "../core/series.js";
import { formatQuantity } from "../units/display.js";
import { notebookDesign } from "./design.js";
import { BuiltinHelp, FormulaHelp, type MathjsDoc } from "./help.js";

/** Options of a notebook instance. */
export interface NotebookOptions {
  /** Called after every formula call with its warnings and cautions (e.g. to print them in the notebook). */
  readonly onNotes?: (formula: string, notes: { readonly warnings: readonly Note[]; readonly cautions: readonly Note[] }) => void;
}

/**
 * The functions disabled inside expressions, following mathjs's security
 * guidance ("Security" in the mathjs docs): those that change the instance
 * (import, createUnit, reviver, config: a notebook cell must not change how
 * the next one computes) and those that parse text into expression trees
 * (evaluate, parse, compile, simplify, derivative, resolve).
 */
export const DISABLED_IN_EXPRESSIONS = [
  "import", "createUnit", "reviver", "config", "evaluate", "parse", "compile", "simplify", "derivative", "resolve",
] as const;

/**
 * The instance's own functions that change it, disabled on the returned
 * object as well: calling them from code would change units or settings
 * that the formulas and every later cell rely on.
 */
export const DISABLED_ON_INSTANCE = ["import", "createUnit", "config"] as const;

/**
 * A new mathjs instance (never the global one) for notebooks: every registry
 * formula is a function taking and returning mathjs Units, positional in the
 * definition's input order or as one object of named inputs, plus the trade's
 * units, plus `notes(name, ...same arguments)` returning the warnings and
 * cautions of a call, plus `columns(name, {input: column, ...})` evaluating
 * a formula row by row (evaluateColumns). A formula's result carries its notes: a Unit (or a
 * matrix of components) whose `notes` property holds the warnings and
 * cautions and whose text (`toString`, `format`, `math.format`) ends with one
 * line per note, so a notebook that prints results shows them with no second
 * call. Arithmetic on the result gives a plain Unit again (the notes belonged
 * to the formula's value, not to what is computed from it). Dimensionless
 * results stay plain numbers, which cannot carry notes: for those use
 * `onNotes` or `notes(...)`. Inside expressions the functions of
 * DISABLED_IN_EXPRESSIONS throw, and DISABLED_ON_INSTANCE throw when called
 * on the returned object; its own `evaluate` (saved before they were
 * disabled) is the one to call.
 *
 * Assigning to a unit name is refused (`C = ...` would turn every later "5 C"
 * from 5 coulombs into 5 times the variable): pick another name (`C1`, `Cp`).
 * `help(formula)` shows a formula's title, equation, inputs and source.
 * Quantities print with the library's formatter: 4 significant digits, an SI
 * prefix chosen for engineering notation ("8.854 pF"); a unit chosen with
 * `to(x, nC)` is kept, with 4 significant digits.
 *
 * @example
 * const math = createNotebookMath();
 * math.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)").toString(); // "8.854 pF"
 */
export function createNotebookMath(options: NotebookOptions = {}): MathJsInstance {
  const math = loadFullMath();
  addTradeUnits(math);
  const functions: Record<string, (...args: unknown[]) => unknown> = {};
  for (const f of listFormulas()) {
    functions[f.id] = (...args: unknown[]) => call(math, f, args, options);
  }
  const originalHelp = math.help as (x: unknown) => unknown;
  const formulaNames = new Map<unknown, string>(Object.entries(functions).map(([id, fn]) => [fn, id]));
  functions.help = (x: unknown) => {
    // A formula (the function itself, or its id as text) gets its registry documentation.
    const id = formulaNames.get(x) ?? (typeof x === "string" && isFormulaId(x) ? x : undefined);
    return id !== undefined ? new FormulaHelp(catalogEntry(id)) : new BuiltinHelp((originalHelp(x) as { doc: MathjsDoc }).doc);
  };
  functions.notes = (name: unknown, ...args: unknown[]) => {
    const f = getFormula(name);
    const x = f.prepare(inputsFrom(math, f, args));
    const value = f.run(x);
    const n = f.notes(x, value);
    return { warnings: n.warnings.map((w) => ({ ...w })), cautions: n.cautions.map((c) => ({ ...c })) };
  };
  functions.design = (spec: unknown) => notebookDesign(math, spec);
  functions.columns = (name: unknown, inputs: unknown) => notebookColumns(math, name, inputs);
  const { help, ...rest } = functions;
  math.import(rest, { override: false });
  math.import({ help }, { override: true });
  useLibraryFormatter(math);
  // Resolve evaluate before disabling: it keeps the parser it was built with.
  const evaluate = math.evaluate;
  const locked: Record<string, () => never> = {};
  for (const name of DISABLED_IN_EXPRESSIONS) {
    locked[name] = () => {
      throw new Error(`Function ${name} is disabled`);
    };
  }
  math.import(locked, { override: true });
  const guarded = (expr: unknown, scope?: unknown): unknown => evaluate(expr as string, unitSafeScope(math, scope) as never);
  const properties: PropertyDescriptorMap = { evaluate: { value: guarded, enumerable: true } };
  for (const name of DISABLED_ON_INSTANCE) properties[name] = { value: locked[name], enumerable: true };
  return Object.create(math, properties) as MathJsInstance;
}

/**
 * `columns(name, { input: value or column, ... })`: evaluateColumns from a
 * notebook. A column is an array or matrix of numbers (SI), Units or unit
 * strings; one value (a number, Unit or string) is the same for every row.
 * Returns the JSON form of the result (columnsToJson): values in SI, null and
 * an error code for each row that failed, the failed rows' messages and the
 * notes with their row counts.
 */
function notebookColumns(math: MathJsInstance, name: unknown, inputs: unknown): unknown {
  const f = getFormula(name);
  const given = inputs instanceof Map ? Object.fromEntries(inputs) : inputs;
  if (!isPlainObject(given)) {
    throw new FormulaError("wrong_type", { formula: f.id, input: "inputs", value: inputs, expected: "an object of named inputs, e.g. {gap: [0.1 mm, 0.2 mm]}" });
  }
  const specs = f.definition.inputs as Readonly<Record<string, InputSpec>>;
  const out: Record<string, unknown> = {};
  for (const [k, raw] of Object.entries(given)) {
    const spec = Object.hasOwn(specs, k) ? specs[k] : undefined;
    const list = typeof (raw as { toArray?: unknown })?.toArray === "function" ? (raw as { toArray(): unknown[] }).toArray() : raw;
    const vector = spec !== undefined && !("choices" in spec) && spec.vector === true;
    // A Unit cell becomes its SI value when the dimension fits, else text mathjs reads back, so the row gets wrong_dimension.
    const cell = (v: unknown): unknown => {
      if (!isUnit(v) || spec === undefined || "choices" in spec) return v;
      try {
        return scalar(math, f.id, k, spec.dimension, v);
      } catch {
        return (v as Unit).format({ precision: 17 } as never);
      }
    };
    out[k] = Array.isArray(list) && !vector ? list.map(cell) : vector ? raw : cell(raw);
  }
  return columnsToJson(evaluateColumns(f, out));
}

function isFormulaId(x: string): boolean {
  return listFormulas().some((f) => f.id === x);
}

/**
 * A scope in which assigning to a unit name fails with a clear error. mathjs
 * reads a scope through get/set/has/keys (any object with them is taken as a
 * Map); this one forwards to the caller's Map or plain object, so values
 * assigned in one call are there in the next, as with mathjs's own scopes.
 */
function unitSafeScope(math: MathJsInstance, scope: unknown): unknown {
  const store: Map<string, unknown> | Record<string, unknown> =
    scope instanceof Map ? scope : typeof scope === "object" && scope !== null ? (scope as Record<string, unknown>) : new Map();
  const isMap = store instanceof Map;
  const has = (k: string): boolean => (isMap ? store.has(k) : Object.hasOwn(store, k));
  const guard = {
    get: (k: string): unknown => (isMap ? store.get(k) : has(k) ? (store as Record<string, unknown>)[k] : undefined),
    has,
    keys: () => (isMap ? store.keys() : Object.keys(store)[Symbol.iterator]()),
    set(k: string, v: unknown) {
      if (math.Unit.isValuelessUnit(k)) {
        throw new Error(`"${k}" is a unit name: assigning it would change what "5 ${k}" means in every later expression; choose another name, e.g. "${k}1"`);
      }
      if (isMap) store.set(k, v);
      else (store as Record<string, unknown>)[k] = v;
      return guard;
    },
    delete: (k: string): boolean => (isMap ? store.delete(k) : has(k) && delete (store as Record<string, unknown>)[k]),
    clear: (): void => {
      if (isMap) store.clear();
      else for (const k of Object.keys(store)) delete (store as Record<string, unknown>)[k];
    },
    forEach(cb: (v: unknown, k: string, m: unknown) => void) {
      for (const k of [...guard.keys()]) cb(guard.get(k), k, guard);
    },
    [Symbol.iterator]: function* () {
      for (const k of [...guard.keys()]) yield [k, guard.get(k)] as [string, unknown];
    },
    get size() {
      return isMap ? store.size : Object.keys(store).length;
    },
  };
  return guard;
}

/**
 * Quantities in this instance print with the library's formatter
 * (src/units/display.ts): 4 significant digits and an SI prefix chosen for
 * engineering notation, for any value of a dimension the library names. A
 * unit the user fixed with `to(x, nC)` is kept, with 4 significant digits.
 * Only the default text changes; `format(x, options)` with options is mathjs's.
 */
function useLibraryFormatter(math: MathJsInstance): void {
  const proto = (math as unknown as { Unit: { prototype: UnitLike } }).Unit.prototype;
  const original = proto.format;
  proto.format = function (this: UnitLike, options?: unknown): string {
    if (options !== undefined || typeof this.value !== "number") return original.call(this, options);
    if (!this.fixPrefix) {
      const unit = siUnitOf(this);
      if (unit !== undefined) return formatQuantity(this.toSI().value as number, unit);
    }
    return original.call(this, { precision: 4 });
  };
}

interface UnitLike {
  value: unknown;
  fixPrefix: boolean;
  dimensions: number[];
  units: { unit: { offset: number } }[];
  toSI(): { value: unknown };
  format(options?: unknown): string;
}

/** The SI unit symbol of a Unit's dimension when the library names that dimension (and no offset is involved). */
function siUnitOf(u: UnitLike): string | undefined {
  if (u.units.some((x) => x.unit.offset !== 0)) return undefined;
  const d = u.dimensions;
  const exps = [d[1], d[0], d[2], d[3], d[4], d[6], d[5], d[7]] as unknown as Exponents;
  for (const dim of Object.values(DIMENSIONS)) {
    if (dim.unit && sameExponents(exps, dim.exps as Exponents)) return dim.unit;
  }
  return undefined;
}

function call(math: MathJsInstance, f: AnyFormula, args: unknown[], options: NotebookOptions): unknown {
  const x = f.prepare(inputsFrom(math, f, args));
  const value = f.run(x);
  const notes = f.notes(x, value);
  if (options.onNotes) options.onNotes(f.id, notes);
  return withNotes(toUnits(math, f, value, x as Record<string, unknown>), notes);
}

/** One line per note, cautions first, as a notebook prints them under the value. */
export function notesLines(notes: { readonly warnings: readonly Note[]; readonly cautions: readonly Note[] }): string[] {
  return [
    ...notes.cautions.map((c) => `CAUTION [${c.code}]: ${c.message}`),
    ...notes.warnings.map((w) => `warning [${w.code}]: ${w.message}`),
  ];
}

/**
 * The result with its notes: a `notes` property (always, possibly empty) and,
 * when there are notes, text that ends with them. Own, non-enumerable
 * properties on this one object: mathjs's own code reads Units through their
 * fields, so arithmetic and conversions are unaffected. A plain number is
 * returned as it is.
 */
function withNotes(result: unknown, notes: { readonly warnings: readonly Note[]; readonly cautions: readonly Note[] }): unknown {
  if (typeof result !== "object" || result === null) return result;
  const copy = { warnings: notes.warnings.map((w) => ({ ...w })), cautions: notes.cautions.map((c) => ({ ...c })) };
  Object.defineProperty(result, "notes", { value: copy, enumerable: false });
  const lines = notesLines(copy);
  if (lines.length === 0) return result;
  const proto = Object.getPrototypeOf(result) as { format(o?: unknown): string; toString(): string };
  const append = (text: string): string => [text, ...lines].join("\n");
  // A Unit's toString goes through its format; a matrix's does not, so both are wrapped for matrices.
  Object.defineProperty(result, "format", { value(this: unknown, o?: unknown) { return append(proto.format.call(this, o)); }, enumerable: false });
  if (!isUnit(result)) {
    Object.defineProperty(result, "toString", { value(this: unknown) { return append(proto.toString.call(this)); }, enumerable: false });
  }
  return result;
}

function isUnit(v: unknown): v is Unit {
  return typeof v === "object" && v !== null && (v as { type?: unknown }).type === "Unit" && (v as { isUnit?: unknown }).isUnit === true;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v) && Object.getPrototypeOf(v) === Object.prototype;
}

function inputsFrom(math: MathJsInstance, f: AnyFormula, args: unknown[]): Record<string, unknown> {
  const specs = f.definition.inputs as Readonly<Record<string, InputSpec>>;
  const names = Object.keys(specs);
  let given: Record<string, unknown>;
  if (args.length === 1 && (isPlainObject(args[0]) || args[0] instanceof Map)) {
    const o = args[0] instanceof Map ? Object.fromEntries(args[0] as Map<string, unknown>) : (args[0] as Record<string, unknown>);
    for (const k of Object.keys(o)) if (!Object.hasOwn(specs, k)) throw new FormulaError("unknown_input", { formula: f.id, input: k });
    given = o;
  } else {
    if (args.length > names.length) {
      throw new FormulaError("invalid_argument", { formula: f.id, detail: `${args.length} arguments given; the inputs are ${names.join(", ")}` });
    }
    given = {};
    args.forEach((a, i) => (given[names[i]!] = a));
  }
  const out: Record<string, unknown> = {};
  for (const [name, raw] of Object.entries(given)) {
    const spec = specs[name]!;
    if (raw === undefined) continue;
    if ("choices" in spec) {
      out[name] = raw;
    } else if (spec.vector) {
      const arr = typeof (raw as { toArray?: unknown }).toArray === "function" ? (raw as { toArray(): unknown[] }).toArray() : raw;
      if (!Array.isArray(arr) || arr.length !== 3) {
        throw new FormulaError("wrong_type", { formula: f.id, input: name, value: raw, expected: "a 3-vector [x, y, z]" });
      }
      out[name] = arr.map((c) => scalar(math, f.id, name, spec.dimension, c));
    } else if (spec.series) {
      // A mathjs matrix or a plain array; its length is checked before any sample is read.
      const arr = typeof (raw as { toArray?: unknown }).toArray === "function" ? (raw as { toArray(): unknown[] }).toArray() : raw;
      checkSeriesShape(f.id, name, spec.series, arr);
      out[name] = arr.map((c, i) => sample(math, f.id, name, spec.dimension, c, i));
    } else {
      out[name] = scalar(math, f.id, name, spec.dimension, raw);
    }
  }
  return out;
}

function scalar(math: MathJsInstance, id: string, name: string, dimension: keyof typeof DIMENSIONS, raw: unknown): number {
  if (isUnit(raw)) {
    const d = raw.dimensions;
    const exps = [d[1], d[0], d[2], d[3], d[4], d[6], d[5], d[7]] as unknown as Exponents;
    if (!sameExponents(exps, DIMENSIONS[dimension].exps as Exponents)) {
      throw new FormulaError("wrong_dimension", { formula: id, input: name, expected: dimension, received: nameExponents(exps) });
    }
    const v = raw.toSI().value as unknown;
    if (typeof v !== "number") throw new FormulaError("wrong_type", { formula: id, input: name, expected: "a real quantity" });
    return v;
  }
  // Numbers are SI; strings are unit strings; anything else fails with the input's name.
  void math;
  return readQuantity(id, name, dimension, raw);
}

/** One sample of a series: a scalar whose error, if any, says which sample it was. */
function sample(math: MathJsInstance, id: string, name: string, dimension: keyof typeof DIMENSIONS, raw: unknown, index: number): number {
  try {
    return scalar(math, id, name, dimension, raw);
  } catch (e) {
    throw atSample(e, index);
  }
}

function toUnits(math: MathJsInstance, f: AnyFormula, value: number | readonly number[], x: Readonly<Record<string, unknown>>): unknown {
  const unit = DIMENSIONS[outputDimension(f.definition.output, x)].unit;
  const one = (v: number): unknown => (unit ? math.unit(v, unit) : v);
  return typeof value === "number" ? one(value) : math.matrix(value.map(one) as never);
}
