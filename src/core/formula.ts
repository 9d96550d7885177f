import { inDomain } from "./domain.js";
import { FormulaError } from "./errors.js";
import { inWords } from "./format.js";
import { generateCode, inputsClass } from "./fast-path.js";
import type {
  ChoiceCall, ComputeInputs, ComputeOutput, Detailed, Domain, FormulaDeclaration, FormulaDefinition, FormulaInputs, FormulaOutput,
  InputList, InputsByName, InputSpec, InputSpecs, NamedInput, Note, OutputSpec,
} from "./spec.js";

/**
 * A formula: call it with typed inputs to get a typed quantity. The call checks
 * domains and relations (cheap comparisons) and throws FormulaError; use
 * `details` for the result with its validity warnings and cautions.
 */
export interface Formula<I extends InputSpecs = InputSpecs, O extends OutputSpec = OutputSpec> {
  (inputs: FormulaInputs<I>): FormulaOutput<O>;
  readonly id: string;
  readonly definition: FormulaDefinition<I, O>;
  /** Result with validity warnings and cautions. */
  details(inputs: FormulaInputs<I>): Detailed<FormulaOutput<O>>;
  /**
   * Checks plain SI inputs (types, finiteness, domains, relations), fills defaults,
   * and returns the object `compute` takes. Shared by evaluate, solve, sweeps.
   */
  prepare(inputs: Readonly<Record<string, unknown>>): ComputeInputs<I>;
  /**
   * The object `compute` takes, from SI values by name (defaults filled, nothing
   * checked). Tools that vary inputs in place start from it; every compute-input
   * object has the one shape this makes.
   */
  inputsObject(values: Readonly<Record<string, unknown>>): ComputeInputs<I>;
  /** Computes from prepared inputs and checks the result is finite. */
  run(x: ComputeInputs<I>): ComputeOutput<O>;
  /** Warnings and cautions for prepared inputs and their result. */
  notes(x: ComputeInputs<I>, value: ComputeOutput<O>): { warnings: Note[]; cautions: Note[] };
}

/** A formula of any inputs and output, as held by the registry. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyFormula = Formula<any, any>;

const FORMULA = Symbol.for("emquant.formula");

/** True for values made by `defineFormula`. */
export function isFormula(v: unknown): v is AnyFormula {
  return typeof v === "function" && (v as unknown as Record<symbol, unknown>)[FORMULA] === true;
}

/** Rule text of a domain, for messages and docs: "> 0", ">= 1 and integer". */
export function domainRule(d: Domain): string {
  const parts: string[] = [];
  if (d.min !== undefined) parts.push(`${d.minExclusive ? ">" : ">="} ${d.min}`);
  if (d.max !== undefined) parts.push(`${d.maxExclusive ? "<" : "<="} ${d.max}`);
  if (d.integer) parts.push("a whole number");
  return parts.join(" and ") || "finite";
}


/**
 * Define a formula once; the typed function, registry metadata, `evaluate`,
 * errors, notes and the design tools all derive from this definition.
 * Mark calls `/* @__PURE__ *\/` so bundlers drop unused formulas.
 */
export function defineFormula<const L extends InputList, const O extends OutputSpec>(
  declaration: FormulaDeclaration<L, O>,
): ChoiceCall<InputsByName<L>, O> & Formula<InputsByName<L>, O> {
  type I = InputsByName<L>;
  const def = { ...declaration, inputs: byName(declaration) } as FormulaDefinition<I, O>;
  const id = def.id;
  const specs: readonly NamedInput[] = declaration.inputs;
  const names = specs.map((s) => s.name);
  const nComponents = def.output.components?.length ?? 0;

  function prepare(raw: Readonly<Record<string, unknown>>): ComputeInputs<I> {
    if (typeof raw !== "object" || raw === null || Array.isArray(raw)) {
      throw new FormulaError("wrong_type", { formula: id, input: "inputs", value: raw, expected: "an object of named inputs" });
    }
    const values = declaredValues(raw);
    for (let i = 0; i < names.length; i++) checkInput(names[i]!, specs[i]!, values[i]);
    const xs = new Inputs(...values) as ComputeInputs<I>;
    if (def.relations) {
      for (const r of def.relations) {
        if (!r.holds(xs)) throw new FormulaError("out_of_domain", { formula: id, rule: r.rule, detail: quoteInputs(xs) });
      }
    }
    return xs;
  }

  function checkInput(name: string, spec: InputSpecs[string], v: unknown): void {
    if (v === undefined) throw new FormulaError("missing_input", { formula: id, input: name });
    if ("choices" in spec) {
      if (typeof v !== "string") {
        throw new FormulaError("wrong_type", { formula: id, input: name, value: v, expected: `one of ${spec.choices.join(", ")}` });
      }
      if (!spec.choices.includes(v)) {
        throw new FormulaError("out_of_domain", { formula: id, input: name, value: v, rule: `one of ${spec.choices.join(", ")}` });
      }
      return;
    }
    if (spec.vector) {
      if (!Array.isArray(v) || v.length !== 3) {
        throw new FormulaError("wrong_type", { formula: id, input: name, value: v, expected: "a 3-vector [x, y, z]" });
      }
      for (const c of v) checkNumber(name, spec.domain, c);
      return;
    }
    if (spec.series) return spec.series.check(id, name, spec.series, spec.domain, v, checkNumber);
    checkNumber(name, spec.domain, v);
  }

  function checkNumber(name: string, domain: Domain | undefined, v: unknown): void {
    if (typeof v !== "number") throw new FormulaError("wrong_type", { formula: id, input: name, value: v, expected: "a number in SI units" });
    if (v - v !== 0) throw new FormulaError("not_finite", { formula: id, input: name, value: v });
    if (domain !== undefined && !inDomain(v, domain)) {
      throw new FormulaError("out_of_domain", { formula: id, input: name, value: v, rule: domainRule(domain) });
    }
  }

  // The declared inputs' values in order, own properties only, defaults filled.
  function declaredValues(raw: Readonly<Record<string, unknown>>): unknown[] {
    return names.map((n, i) => {
      const v = Object.hasOwn(raw, n) ? raw[n] : undefined;
      return v === undefined ? specs[i]!.default : v;
    });
  }

  function inputsObject(raw: Readonly<Record<string, unknown>>): ComputeInputs<I> {
    return new Inputs(...declaredValues(raw)) as ComputeInputs<I>;
  }

  function run(x: ComputeInputs<I>): ComputeOutput<O> {
    const value = def.compute(x);
    if (nComponents === 0) {
      if ((value as number) - (value as number) !== 0) throw rangeError(x);
    } else {
      const arr = value as readonly number[];
      for (let i = 0; i < arr.length; i++) if (arr[i]! - arr[i]! !== 0) throw rangeError(x);
    }
    return value;
  }

  function rangeError(x: ComputeInputs<I>): FormulaError {
    return new FormulaError("out_of_range", { formula: id, detail: quoteInputs(x) });
  }

  function notes(x: ComputeInputs<I>, value: ComputeOutput<O>): { warnings: Note[]; cautions: Note[] } {
    const pick = (list: FormulaDefinition<I, O>["validity"], always: boolean): Note[] => {
      const out: Note[] = [];
      for (const c of list ?? []) {
        if (c.when ? c.when(x, value) : always) {
          // inWords: a message that quotes an overflowed number says so in words, never "Infinity".
          out.push({ code: c.code, message: inWords(typeof c.message === "function" ? c.message(x, value) : c.message) });
        }
      }
      return out;
    };
    return { warnings: pick(def.validity, false), cautions: pick(def.cautions, true) };
  }

  const checked = (inputs: unknown): unknown => run(prepare(inputs as Record<string, unknown>));
  // Inputs: prepare and inputsObject above use it; they run only once a formula is called.
  const [Inputs, fast] = generateCode(def.inputs, def.compute, def.relations ?? [], checked, nComponents > 0) ?? [inputsClass(names)];
  const formula = (fast ?? checked) as unknown as ChoiceCall<I, O> & Formula<I, O>;
  const details = (inputs: FormulaInputs<I>): Detailed<FormulaOutput<O>> => {
    const x = prepare(inputs as Record<string, unknown>);
    const value = run(x);
    return { value: value as FormulaOutput<O>, ...notes(x, value) };
  };
  Object.defineProperty(formula, "name", { value: id });
  Object.assign(formula, { id, definition: def, details, prepare, inputsObject, run, notes, [FORMULA]: true });
  return formula;
}

/**
 * The by-name view of the declared inputs. Built as an instance of its own
 * class, not written as a literal or grown from `{}`, so that it never shares
 * a hidden class with callers' argument objects (see InputList); its class's
 * prototype chain ends at null, so an input named like an Object.prototype
 * member cannot be mistaken for one. Not a null-prototype object: V8 keeps
 * those as hash tables, and `evaluate` reads this view on every call
 * (measured 1.3 -> 1.9 us per call).
 */
class InputsView {
  constructor(id: string, list: InputList) {
    for (const spec of list) {
      const name = spec.name;
      // Whole words, each once: they become property names in generated code
      // (see inputsClass).
      if (!/^[A-Za-z][A-Za-z0-9]*$/.test(name) || Object.hasOwn(this, name)) throw new Error(`${id}: input name "${name}" must be a plain word, declared once`);
      (this as unknown as Record<string, InputSpec>)[name] = spec;
    }
  }
}
Object.setPrototypeOf(InputsView.prototype, null);

function byName(declaration: { readonly id: string; readonly inputs: InputList }): InputSpecs {
  return Object.freeze(new InputsView(declaration.id, declaration.inputs)) as unknown as InputSpecs;
}

function quoteInputs(x: Readonly<Record<string, unknown>>): string {
  return Object.entries(x)
    // A vector is quoted; a series (thousands of samples, perhaps) only counted.
    .map(([k, v]) => `${k} = ${Array.isArray(v) ? `[${v.length > 3 ? `${v.length} samples` : v.join(", ")}]` : String(v)}`)
    .join(", ");
}
