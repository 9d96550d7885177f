import { DIMENSIONS, type Exponents, nameExponents, sameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";
import { FormulaError } from "./errors.js";
import type { AnyFormula } from "./formula.js";
import { getFormula } from "./registry.js";
import type { InputSpec, Note } from "./spec.js";

/** What `evaluate` returns: the value in coherent SI with its unit symbol and notes. */
export interface EvaluateResult {
  readonly id: string;
  /** SI value; an array for formulas with components (vectors). */
  readonly value: number | readonly number[];
  /** SI unit symbol of the value ("F", "H", "T"; "" when dimensionless). */
  readonly unit: string;
  readonly warnings: readonly Note[];
  readonly cautions: readonly Note[];
}

/** One run-time input: a number in SI, a unit string, a choice word, or a 3-array of those. */
export type RawInput = number | string | readonly (number | string)[];

/**
 * Evaluate a formula by id from numbers in SI, unit strings ("0.2 mm") or
 * choice words; the core of notebooks and request handlers.
 * Never returns NaN or Infinity: every failure is a FormulaError with a code.
 *
 * @example
 * evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" }).value; // ≈ 8.854e-12
 */
export function evaluate(id: string, inputs: Readonly<Record<string, unknown>>): EvaluateResult {
  const formula = getFormula(id);
  const x = toSI(formula, inputs);
  const value = formula.run(x);
  const { warnings, cautions } = formula.notes(x, value);
  const dimension = formula.definition.output.dimension as keyof typeof DIMENSIONS;
  return { id: formula.id, value, unit: DIMENSIONS[dimension].unit, warnings, cautions };
}

/**
 * Convert run-time inputs to the checked SI object `compute` takes: unknown names,
 * types, units and dimensions here; finiteness, domains and relations in `prepare`.
 */
export function toSI(formula: AnyFormula, inputs: unknown): Record<string, unknown> {
  const id = formula.id;
  if (typeof inputs !== "object" || inputs === null || Array.isArray(inputs)) {
    throw new FormulaError("wrong_type", { formula: id, input: "inputs", value: inputs, expected: "an object of named inputs" });
  }
  const specs = formula.definition.inputs as Readonly<Record<string, InputSpec>>;
  for (const name of Object.keys(inputs)) {
    if (!Object.hasOwn(specs, name)) throw new FormulaError("unknown_input", { formula: id, input: name });
  }
  // A null-prototype object: keys like "__proto__" cannot reach Object.prototype.
  const out: Record<string, unknown> = Object.create(null);
  for (const [name, spec] of Object.entries(specs)) {
    const raw = Object.hasOwn(inputs, name) ? (inputs as Record<string, unknown>)[name] : undefined;
    if (raw === undefined) continue; // prepare() fills defaults or reports missing_input
    out[name] = convert(id, name, spec, raw);
  }
  return formula.prepare(out);
}

function convert(id: string, name: string, spec: InputSpec, raw: unknown): unknown {
  if ("choices" in spec) {
    if (typeof raw !== "string") throw new FormulaError("wrong_type", { formula: id, input: name, value: raw, expected: `one of ${spec.choices.join(", ")}` });
    return raw;
  }
  const exps = DIMENSIONS[spec.dimension].exps as Exponents;
  if (spec.vector) {
    if (!Array.isArray(raw) || raw.length !== 3) {
      throw new FormulaError("wrong_type", { formula: id, input: name, value: raw, expected: "a 3-array [x, y, z] of numbers or unit strings" });
    }
    return raw.map((c: unknown) => scalar(id, name, spec.dimension, exps, c));
  }
  return scalar(id, name, spec.dimension, exps, raw);
}

function scalar(id: string, name: string, dimension: string, exps: Exponents, raw: unknown): number {
  if (typeof raw === "number") return raw; // SI; finiteness is checked by prepare()
  if (typeof raw !== "string") {
    throw new FormulaError("wrong_type", { formula: id, input: name, value: raw, expected: "a number in SI units or a unit string" });
  }
  const q = parseQuantity(raw, name, id);
  if (q.plain) return q.si; // a bare number string is SI, like a number
  if (!sameExponents(q.exps, exps)) {
    throw new FormulaError("wrong_dimension", { formula: id, input: name, value: raw, expected: dimension, received: nameExponents(q.exps) });
  }
  return q.si;
}
