/**
 * Shared helpers for the registry-wide reliability tests: every formula in the
 * registry (present and future) is exercised from its definition alone, with
 * no per-formula code. Base inputs come from each input's `example`.
 */
import { expect } from "vitest";
import { FormulaError, type ErrorCode } from "../../src/core/errors.js";
import { evaluate, toSI, type EvaluateResult } from "../../src/core/evaluate.js";
import type { AnyFormula } from "../../src/core/formula.js";
import { listFormulas } from "../../src/core/registry.js";
import type { Domain, InputSpec, QuantityInput } from "../../src/core/spec.js";
import { DIMENSIONS, type DimensionName, type Exponents } from "../../src/units/dimensions.js";

export type Inputs = Record<string, unknown>;

export const formulas: readonly AnyFormula[] = listFormulas();

export function specsOf(f: AnyFormula): [string, InputSpec][] {
  return Object.entries(f.definition.inputs as Record<string, InputSpec>);
}

export function isChoice(s: InputSpec): s is Extract<InputSpec, { choices: readonly string[] }> {
  return "choices" in s;
}

export function isQuantity(s: InputSpec): s is QuantityInput {
  return !("choices" in s);
}

/** Example inputs of a formula in SI (every input, defaults included), or undefined if one lacks an example. */
export function exampleInputs(f: AnyFormula): Inputs | undefined {
  const out: Inputs = {};
  for (const [name, spec] of specsOf(f)) {
    const v = spec.example ?? spec.default;
    if (v === undefined) return undefined;
    out[name] = Array.isArray(v) ? [...v] : v;
  }
  return out;
}

/** Formulas whose every input has an example (a registry test elsewhere checks all do). */
export function withExamples(): { f: AnyFormula; ex: Inputs }[] {
  const out: { f: AnyFormula; ex: Inputs }[] = [];
  for (const f of formulas) {
    const ex = exampleInputs(f);
    if (ex) out.push({ f, ex });
  }
  return out;
}

export function inDomain(v: number, d: Domain | undefined): boolean {
  if (!Number.isFinite(v)) return false;
  if (d === undefined) return true;
  if (d.min !== undefined && (d.minExclusive ? !(v > d.min) : !(v >= d.min))) return false;
  if (d.max !== undefined && (d.maxExclusive ? !(v < d.max) : !(v <= d.max))) return false;
  if (d.integer && !Number.isInteger(v)) return false;
  return true;
}

/** Inputs with defaults filled, as `compute` and `relations` see them. */
export function filled(f: AnyFormula, x: Inputs): Inputs {
  const out: Inputs = {};
  for (const [name, spec] of specsOf(f)) out[name] = x[name] ?? spec.default;
  return out;
}

/** True when the inputs pass every per-input domain (not the relations). */
export function domainsHold(f: AnyFormula, x: Inputs): boolean {
  for (const [name, spec] of specsOf(f)) {
    const v = x[name] ?? spec.default;
    if (isChoice(spec)) {
      if (typeof v !== "string" || !spec.choices.includes(v)) return false;
    } else if (spec.vector) {
      if (!Array.isArray(v) || v.length !== 3 || !v.every((c) => typeof c === "number" && inDomain(c, spec.domain))) return false;
    } else if (spec.series) {
      const { minLength, maxLength } = spec.series;
      if (!Array.isArray(v) || v.length < minLength || v.length > maxLength || !v.every((c) => typeof c === "number" && inDomain(c, spec.domain))) return false;
    } else if (typeof v !== "number" || !inDomain(v, spec.domain)) return false;
  }
  return true;
}

/** The relations that fail for these inputs, in definition order. */
export function failingRelations(f: AnyFormula, x: Inputs): string[] {
  const rel = (f.definition.relations ?? []) as readonly { rule: string; holds: (x: never) => boolean }[];
  const xs = filled(f, x) as never;
  return rel.filter((r) => !r.holds(xs)).map((r) => r.rule);
}

/** Exponents of a quantity input's dimension. */
export function exps(dim: DimensionName): Exponents {
  return DIMENSIONS[dim].exps as Exponents;
}

/** Run a call and return the FormulaError it throws; fail on a result or on any other throw. */
export function catchFormulaError(call: () => unknown, what: string): FormulaError {
  let result: unknown;
  try {
    result = call();
  } catch (e) {
    if (e instanceof FormulaError) return e;
    throw new Error(`${what}: threw a ${(e as Error)?.constructor?.name ?? typeof e} instead of FormulaError: ${String(e)}`);
  }
  throw new Error(`${what}: expected a FormulaError, got a result ${JSON.stringify(result)}`);
}

/** Assert a call throws FormulaError with this code (and input name, when given). */
export function expectCode(call: () => unknown, code: ErrorCode, input: string | undefined, what: string): FormulaError {
  const e = catchFormulaError(call, what);
  expect(e.code, `${what}: ${e.message}`).toBe(code);
  if (input !== undefined) expect(e.input, `${what}: ${e.message}`).toBe(input);
  expect(e.message.length, `${what}: empty message`).toBeGreaterThan(0);
  return e;
}

export function isFiniteValue(v: unknown): boolean {
  if (typeof v === "number") return Number.isFinite(v);
  return Array.isArray(v) && v.length > 0 && v.every((c) => typeof c === "number" && Number.isFinite(c));
}

/** `evaluate` by id. */
export function ev(f: AnyFormula, inputs: unknown): EvaluateResult {
  return evaluate(f.id, inputs as Inputs);
}

/** The same checks as evaluate, for formulas not in the registry (fixtures). */
export function evLocal(f: AnyFormula, inputs: unknown): unknown {
  return f.run(toSI(f, inputs));
}

/** Outcome of a call that may legitimately fail with a FormulaError. */
export type Outcome = { ok: true; value: number | readonly number[] } | { ok: false; code: ErrorCode; message: string };

export function outcome(call: () => { value: number | readonly number[] } | number | readonly number[]): Outcome {
  try {
    const r = call();
    const value = typeof r === "number" || Array.isArray(r) ? (r as number | readonly number[]) : (r as { value: number | readonly number[] }).value;
    return { ok: true, value };
  } catch (e) {
    if (e instanceof FormulaError) return { ok: false, code: e.code, message: e.message };
    throw e;
  }
}

/** Components of a result as an array. */
export function components(v: number | readonly number[]): readonly number[] {
  return typeof v === "number" ? [v] : v;
}

/** Relative distance, with an absolute floor for values near zero relative to `scale`. */
export function relDiff(a: number, b: number, floor = 0): number {
  if (a === b) return 0;
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), floor);
}
