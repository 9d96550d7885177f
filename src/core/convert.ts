import { DIMENSIONS, type DimensionName, type Exponents, nameExponents, sameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";
import { FormulaError } from "./errors.js";
import type { AnyFormula } from "./formula.js";
import { atSample } from "./series.js";
import type { InputSpecs } from "./spec.js";

// Run-time inputs (numbers in SI, unit strings, choice words, 3-arrays, series) to SI:
// the one conversion shared by evaluate, the design tools, the CLI and the
// notebook binding.

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
  const specs = formula.definition.inputs as InputSpecs;
  for (const name of Object.keys(inputs)) {
    if (!Object.hasOwn(specs, name)) throw new FormulaError("unknown_input", { formula: id, input: name });
  }
  // A null-prototype object: keys like "__proto__" cannot reach Object.prototype.
  const out: Record<string, unknown> = Object.create(null);
  for (const [name, spec] of Object.entries(specs)) {
    if (skip.includes(name)) continue;
    // Own properties only: nothing inherited through a prototype counts as an input.
    const raw = Object.hasOwn(inputs, name) ? (inputs as Record<string, unknown>)[name] : undefined;
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
      out[name] = raw.map((c: unknown) => toNumber(id, name, spec.dimension, c));
    } else if (spec.series) {
      // A series of the wrong shape (not an array, or past its length bounds) passes
      // as it is, no sample read: prepare refuses it in declaration order, naming
      // the same input with the same code as the typed call does.
      if (!Array.isArray(raw) || raw.length < spec.series.minLength || raw.length > spec.series.maxLength) {
        out[name] = raw;
        continue;
      }
      const samples = new Array<unknown>(raw.length);
      for (let i = 0; i < raw.length; i++) samples[i] = toNumber(id, name, spec.dimension, raw[i], i);
      out[name] = samples;
    } else {
      out[name] = toNumber(id, name, spec.dimension, raw);
    }
  }
  return out;
}

/**
 * A number passes as it is: its finiteness is checked by `prepare` together
 * with the domains, in declaration order, so `evaluate` and the typed call name
 * the same input with the same code (checked here, a NaN in a later input was
 * reported before an earlier input outside its domain). Text is read here.
 */
function toNumber(formula: string, input: string, dimension: DimensionName, raw: unknown, sample?: number): unknown {
  if (typeof raw === "number") return raw;
  if (sample === undefined) return readQuantity(formula, input, dimension, raw);
  try {
    return readQuantity(formula, input, dimension, raw);
  } catch (e) {
    throw atSample(e, sample); // a series sample: the error says which one
  }
}

export { inDomain } from "./domain.js";
