import { DIMENSIONS } from "../units/dimensions.js";
import { convertInputs } from "./convert.js";
import { FormulaError } from "./errors.js";
import type { AnyFormula } from "./formula.js";
import { getFormula } from "./registry.js";
import { type Note, outputDimension } from "./spec.js";

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
  // A choice input may decide the output's dimension (exposureReferenceLevel's quantity).
  const dimension = outputDimension(formula.definition.output, x);
  return { id: formula.id, value, unit: DIMENSIONS[dimension].unit, warnings, cautions };
}

/**
 * Convert run-time inputs to the checked SI object `compute` takes: unknown names,
 * types, units and dimensions in `convertInputs`; finiteness, domains, defaults
 * and relations in `prepare`.
 */
export function toSI(formula: AnyFormula, inputs: unknown): Record<string, unknown> {
  return formula.prepare(convertInputs(formula, inputs));
}
