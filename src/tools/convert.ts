import { FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import type { ComputeInputs, Domain, InputSpec, InputSpecs, QuantityInput } from "../core/spec.js";
import { DIMENSIONS, type DimensionName } from "../units/dimensions.js";
import { convertInputs, inDomain, readQuantity } from "../core/convert.js";

export { convertInputs, inDomain, readQuantity };

/** The input specs of a formula, as a plain record. */
export function specsOf(formula: AnyFormula): Readonly<Record<string, InputSpec>> {
  return formula.definition.inputs as InputSpecs;
}

/** True for a scalar quantity input (not a choice, not a vector, not a series). */
export function isScalarQuantity(spec: InputSpec | undefined): spec is QuantityInput {
  return spec !== undefined && !("choices" in spec) && !spec.vector && !spec.series;
}

/** What kind of input a non-scalar is, for messages: "a choice", "a vector", "a series". */
export function inputKind(spec: InputSpec): string {
  return "choices" in spec ? "a choice" : spec.vector ? "a vector" : spec.series ? "a series" : "a scalar";
}

/** SI unit symbol of a dimension ("" for dimensionless). */
export function siUnit(dimension: DimensionName): string {
  return DIMENSIONS[dimension].unit;
}

/**
 * A mutable compute-input object for repeated evaluation with some inputs varied:
 * the fixed inputs are checked once through `prepare` (with probe values for
 * the varied ones); then `set` + `value` evaluate without allocating.
 */
export interface Binding {
  /** The object handed to compute; varied entries are overwritten in place. */
  readonly x: Record<string, unknown>;
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
  const trial: Record<string, unknown> = { ...fixedSI, ...probes };
  let x: Record<string, unknown>;
  try {
    x = formula.prepare(trial) as Record<string, unknown>;
  } catch (e) {
    // Per-input checks run before relations, so a relation failure means every input passed on its own.
    if (!(e instanceof FormulaError && e.code === "out_of_domain" && e.input === undefined)) throw e;
    x = formula.inputsObject(trial) as Record<string, unknown>;
  }
  const relations = formula.definition.relations ?? [];
  const compute = formula.definition.compute as (x: unknown) => unknown;
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
  return { x, scalar };
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
