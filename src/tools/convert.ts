import { FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import type { ComputeInputs, Domain, InputSpec, InputSpecs, QuantityInput } from "../core/spec.js";
import { DIMENSIONS, type DimensionName, type Exponents, nameExponents, sameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";

/** The input specs of a formula, as a plain record. */
export function specsOf(formula: AnyFormula): Readonly<Record<string, InputSpec>> {
  return formula.definition.inputs as InputSpecs;
}

/** True for a scalar quantity input (not a choice, not a vector). */
export function isScalarQuantity(spec: InputSpec | undefined): spec is QuantityInput {
  return spec !== undefined && !("choices" in spec) && !spec.vector;
}

/** SI unit symbol of a dimension ("" for dimensionless). */
export function siUnit(dimension: DimensionName): string {
  return DIMENSIONS[dimension].unit;
}

/**
 * Read one run-time value of the given dimension: a number (SI), a bare number
 * string (SI) or a unit string. FormulaError naming `input` otherwise.
 */
export function readQuantity(formula: string, input: string, dimension: DimensionName, raw: unknown): number {
  if (typeof raw === "number") {
    if (raw - raw !== 0) throw new FormulaError("not_finite", { formula, input, value: raw });
    return raw;
  }
  if (typeof raw !== "string") {
    throw new FormulaError("wrong_type", { formula, input, value: raw, expected: "a number in SI units or a unit string" });
  }
  const q = parseQuantity(raw, input, formula);
  if (!q.plain && !sameExponents(q.exps, DIMENSIONS[dimension].exps as Exponents)) {
    throw new FormulaError("wrong_dimension", { formula, input, value: raw, expected: dimension, received: nameExponents(q.exps) });
  }
  if (q.si - q.si !== 0) throw new FormulaError("not_finite", { formula, input, value: raw });
  return q.si;
}

/**
 * Convert the given run-time inputs (numbers in SI, unit strings, choice words,
 * 3-arrays) to SI without filling defaults or checking domains: unknown names,
 * types, units and dimensions only. `skip` names are left out (a solved input).
 */
export function convertInputs(formula: AnyFormula, inputs: unknown, skip: readonly string[] = []): Record<string, unknown> {
  const id = formula.id;
  if (typeof inputs !== "object" || inputs === null || Array.isArray(inputs)) {
    throw new FormulaError("wrong_type", { formula: id, input: "inputs", value: inputs, expected: "an object of named inputs" });
  }
  const specs = specsOf(formula);
  for (const name of Object.keys(inputs)) {
    if (!Object.hasOwn(specs, name)) throw new FormulaError("unknown_input", { formula: id, input: name });
  }
  const out: Record<string, unknown> = {};
  for (const [name, spec] of Object.entries(specs)) {
    if (skip.includes(name)) continue;
    const raw = (inputs as Record<string, unknown>)[name];
    if (raw === undefined) continue;
    if ("choices" in spec) {
      if (typeof raw !== "string") {
        throw new FormulaError("wrong_type", { formula: id, input: name, value: raw, expected: `one of ${spec.choices.join(", ")}` });
      }
      out[name] = raw;
    } else if (spec.vector) {
      if (!Array.isArray(raw) || raw.length !== 3) {
        throw new FormulaError("wrong_type", { formula: id, input: name, value: raw, expected: "a 3-array [x, y, z] of numbers or unit strings" });
      }
      out[name] = raw.map((c: unknown) => readQuantity(id, name, spec.dimension, c));
    } else {
      out[name] = readQuantity(id, name, spec.dimension, raw);
    }
  }
  return out;
}

/** True when v lies in the domain (the integer rule is checked only when `integer`). */
export function inDomain(v: number, d: Domain | undefined, checkInteger = true): boolean {
  if (!(v - v === 0)) return false;
  if (d === undefined) return true;
  if (d.min !== undefined && (d.minExclusive ? !(v > d.min) : !(v >= d.min))) return false;
  if (d.max !== undefined && (d.maxExclusive ? !(v < d.max) : !(v <= d.max))) return false;
  if (checkInteger && d.integer && !Number.isInteger(v)) return false;
  return true;
}

/**
 * A mutable compute-input object for repeated evaluation with some inputs varied:
 * the fixed inputs are checked once through `prepare` (with probe values for
 * the varied ones); then `set` + `value` evaluate without allocating.
 */
export interface Binding {
  /** The object handed to compute; varied entries are overwritten in place. */
  readonly x: Record<string, unknown>;
  /** Relations hold for the current x. */
  relationsHold(): boolean;
  /**
   * The scalar output at the current x, or NaN when a relation fails, compute
   * throws a FormulaError or the result is not finite. (Internal; callers mask NaN.)
   */
  scalar(): number;
}

/**
 * Check the fixed inputs (SI) once and build a Binding. `probes` gives an
 * in-domain value for each varied input. Errors about fixed inputs are thrown;
 * a relation that fails at the probe is not an error here (other values of the
 * varied inputs may satisfy it).
 */
export function bind(formula: AnyFormula, fixedSI: Readonly<Record<string, unknown>>, probes: Readonly<Record<string, number>>): Binding {
  const specs = specsOf(formula);
  const trial: Record<string, unknown> = { ...fixedSI, ...probes };
  try {
    formula.prepare(trial);
  } catch (e) {
    // Per-input checks run before relations, so a relation failure means every input passed on its own.
    if (!(e instanceof FormulaError && e.code === "out_of_domain" && e.input === undefined)) throw e;
  }
  const x: Record<string, unknown> = {};
  for (const [name, spec] of Object.entries(specs)) {
    const v = Object.hasOwn(trial, name) ? trial[name] : undefined;
    x[name] = v === undefined ? spec.default : v;
  }
  const relations = formula.definition.relations ?? [];
  const compute = formula.definition.compute as (x: unknown) => unknown;
  const relationsHold = (): boolean => {
    for (let i = 0; i < relations.length; i++) if (!relations[i]!.holds(x as ComputeInputs<InputSpecs>)) return false;
    return true;
  };
  const scalar = (): number => {
    for (let i = 0; i < relations.length; i++) if (!relations[i]!.holds(x as ComputeInputs<InputSpecs>)) return NaN;
    let r: unknown;
    try {
      r = compute(x);
    } catch (e) {
      if (e instanceof FormulaError) return NaN;
      throw e;
    }
    return typeof r === "number" && r - r === 0 ? r : NaN;
  };
  return { x, relationsHold, scalar };
}

/** An in-domain value near the input's example (or default), for probing and search starts. */
export function startValue(spec: QuantityInput): number {
  const ex = typeof spec.example === "number" ? spec.example : spec.default;
  const d = spec.domain;
  let v = ex ?? (d?.min !== undefined ? (d.min > 0 ? d.min * 2 : d.min + 1) : d?.max !== undefined ? d.max - 1 : 1);
  if (d?.integer) v = Math.max(Math.round(v), d.min !== undefined ? Math.ceil(d.min) : -Infinity);
  if (!inDomain(v, d) && d?.min !== undefined && d?.max !== undefined) v = (d.min + d.max) / 2;
  return v;
}
