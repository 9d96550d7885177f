import * as beams from "../beams/index.js";
import * as capacitance from "../capacitance/index.js";
import * as displacement from "../displacement/index.js";
import * as flux from "../flux/index.js";
import * as force from "../force/index.js";
import * as inductance from "../inductance/index.js";
import * as interconnect from "../interconnect/index.js";
import * as magnets from "../magnets/index.js";
import * as windings from "../windings/index.js";
import { FormulaError } from "./errors.js";
import { type AnyFormula, isFormula } from "./formula.js";
import type { FormulaDefinition, InputSpecs, OutputSpec } from "./spec.js";
import { didYouMean } from "./suggest.js";

// Every formula module's exports are scanned, so adding a formula to a module's
// index is all it takes to appear in the registry, evaluate, the CLI and docs.
const modules: readonly Record<string, unknown>[] = [capacitance, inductance, flux, force, displacement, interconnect, beams, magnets, windings];

let byId: Map<string, AnyFormula> | undefined;

function table(): Map<string, AnyFormula> {
  if (byId) return byId;
  byId = new Map();
  for (const m of modules) {
    for (const v of Object.values(m)) {
      if (!isFormula(v)) continue;
      if (byId.has(v.id) && byId.get(v.id) !== v) throw new Error(`duplicate formula id ${v.id}`);
      checkByChoice(v.definition as FormulaDefinition<InputSpecs, OutputSpec>);
      byId.set(v.id, v);
    }
  }
  return byId;
}

/** Every formula, sorted by category then id. */
export function listFormulas(): AnyFormula[] {
  return [...table().values()].sort(
    (a, b) => a.definition.category.localeCompare(b.definition.category) || a.id.localeCompare(b.id),
  );
}

/** The formula with this id; FormulaError "unknown_formula" otherwise. */
export function getFormula(id: unknown): AnyFormula {
  const f = typeof id === "string" ? table().get(id) : undefined;
  if (!f) {
    // A mistyped id gets the closest ids as a suggestion.
    const hint = typeof id === "string" ? didYouMean(id, [...table().keys()]) : "";
    throw new FormulaError("unknown_formula", { value: id, ...(hint ? { detail: hint } : {}) });
  }
  return f;
}

/**
 * An output decided by a choice names a declared choice input and gives a
 * dimension for every choice, the first being `dimension`. Checked when the
 * registry is built (and by tests for any definition), not in defineFormula:
 * the typed path of a formula without such an output should not carry it.
 */
export function checkByChoice(def: FormulaDefinition<InputSpecs, OutputSpec>): void {
  const by = def.output.byChoice;
  if (by === undefined) return;
  const spec = Object.hasOwn(def.inputs, by.input) ? def.inputs[by.input] : undefined;
  if (spec === undefined || !("choices" in spec)) throw new Error(`${def.id}: output.byChoice names "${by.input}", which is not a choice input`);
  const keys = Object.keys(by.dimensions);
  if (keys.length !== spec.choices.length || spec.choices.some((c) => !Object.hasOwn(by.dimensions, c)) || by.dimensions[spec.choices[0]!] !== def.output.dimension) {
    throw new Error(`${def.id}: output.byChoice needs one dimension per choice of "${by.input}", the first equal to output.dimension`);
  }
}
