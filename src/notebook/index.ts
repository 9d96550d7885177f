import type { MathJsInstance, Unit } from "mathjs";
import { FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import { getFormula, listFormulas } from "../core/registry.js";
import type { InputSpec, Note } from "../core/spec.js";
import { DIMENSIONS, type Exponents, nameExponents, sameExponents } from "../units/dimensions.js";
import { loadFullMath } from "../units/load-full.js";
import { addTradeUnits } from "../units/parse.js";
import { readQuantity } from "../tools/convert.js";

/** Options of a notebook instance. */
export interface NotebookOptions {
  /** Called after every formula call with its warnings and cautions (e.g. to print them in the notebook). */
  readonly onNotes?: (formula: string, notes: { readonly warnings: readonly Note[]; readonly cautions: readonly Note[] }) => void;
}

/**
 * The functions disabled inside expressions, following mathjs's security
 * guidance ("Security" in the mathjs docs): those that change the instance
 * (import, createUnit, reviver) and those that parse text into expression trees
 * (evaluate, parse, compile, simplify, derivative, resolve).
 */
export const DISABLED_IN_EXPRESSIONS = [
  "import", "createUnit", "reviver", "evaluate", "parse", "compile", "simplify", "derivative", "resolve",
] as const;

/**
 * A new mathjs instance (never the global one) for notebooks: every registry
 * formula is a function taking and returning mathjs Units, positional in the
 * definition's input order or as one object of named inputs, plus the trade's
 * units, plus `notes(name, ...same arguments)` returning the warnings and
 * cautions of a call. A formula's result carries its notes: a Unit (or a
 * matrix of components) whose `notes` property holds the warnings and
 * cautions and whose text (`toString`, `format`, `math.format`) ends with one
 * line per note, so a notebook that prints results shows them with no second
 * call. Arithmetic on the result gives a plain Unit again (the notes belonged
 * to the formula's value, not to what is computed from it). Dimensionless
 * results stay plain numbers, which cannot carry notes: for those use
 * `onNotes` or `notes(...)`. Inside expressions the functions of
 * DISABLED_IN_EXPRESSIONS throw; the returned object's own `evaluate` (saved
 * before they were disabled) is the one to call.
 *
 * @example
 * const math = createNotebookMath();
 * math.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)").toString(); // "8.8541878188 pF"
 */
export function createNotebookMath(options: NotebookOptions = {}): MathJsInstance {
  const math = loadFullMath();
  addTradeUnits(math);
  const functions: Record<string, (...args: unknown[]) => unknown> = {};
  for (const f of listFormulas()) {
    functions[f.id] = (...args: unknown[]) => call(math, f, args, options);
  }
  functions.notes = (name: unknown, ...args: unknown[]) => {
    const f = getFormula(name);
    const x = f.prepare(inputsFrom(math, f, args));
    const value = f.run(x);
    const n = f.notes(x, value);
    return { warnings: n.warnings.map((w) => ({ ...w })), cautions: n.cautions.map((c) => ({ ...c })) };
  };
  math.import(functions, { override: false });
  // Resolve evaluate before disabling: it keeps the parser it was built with.
  const evaluate = math.evaluate;
  const locked: Record<string, () => never> = {};
  for (const name of DISABLED_IN_EXPRESSIONS) {
    locked[name] = () => {
      throw new Error(`Function ${name} is disabled`);
    };
  }
  math.import(locked, { override: true });
  return Object.create(math, { evaluate: { value: evaluate, enumerable: true } }) as MathJsInstance;
}

function call(math: MathJsInstance, f: AnyFormula, args: unknown[], options: NotebookOptions): unknown {
  const x = f.prepare(inputsFrom(math, f, args));
  const value = f.run(x);
  const notes = f.notes(x, value);
  if (options.onNotes) options.onNotes(f.id, notes);
  return withNotes(toUnits(math, f, value), notes);
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

function toUnits(math: MathJsInstance, f: AnyFormula, value: number | readonly number[]): unknown {
  const unit = DIMENSIONS[f.definition.output.dimension as keyof typeof DIMENSIONS].unit;
  const one = (v: number): unknown => (unit ? math.unit(v, unit) : v);
  return typeof value === "number" ? one(value) : math.matrix(value.map(one) as never);
}
