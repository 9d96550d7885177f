import { FormulaError } from "../core/errors.js";
import type { AnyFormula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import { outputDimension, type InputSpec, type QuantityInput } from "../core/spec.js";
import { readQuantity } from "../core/convert.js";
import { readTolerance, type Varied } from "../tools/tolerance.js";
import { DIMENSIONS, type DimensionName, type Exponents, nameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";
import {
  type Comparison, type Expr, dimensionOf, namesIn, parseCheck, parseExpression, sameDimension,
} from "./expression.js";
import type { DesignSpec } from "./spec.js";

// A design as checked, ordered data: every name resolved, every dimension
// checked, steps in an order where each reads only what comes before it.
// Evaluation, tolerance, solve and sweeps all run this one compiled form.

/** Bounds on a design's size: a stranger's file cannot make a job unbounded. */
export const DESIGN_LIMITS = { inputs: 200, steps: 500, checks: 200, nameLength: 64 } as const;

const NAME = /^[A-Za-z][A-Za-z0-9]*$/;
const RESERVED = new Set(["sqrt"]);

export interface CompiledInput {
  readonly name: string;
  /** The formula input this design input feeds directly (its dimension, domain and integer rule), if any. */
  readonly spec: QuantityInput;
  readonly dimension: DimensionName;
  readonly nominal: number;
  /** Set when the input carries a tolerance. */
  readonly varied?: Varied;
}

export type CompiledBinding =
  | { readonly input: string; readonly kind: "expr"; readonly expr: Expr }
  | { readonly input: string; readonly kind: "choice"; readonly word: string }
  | { readonly input: string; readonly kind: "vector"; readonly exprs: readonly Expr[] };

export type CompiledNode =
  | { readonly kind: "step"; readonly name: string; readonly formula: AnyFormula; readonly bindings: readonly CompiledBinding[]; readonly exps: Exponents }
  | { readonly kind: "derived"; readonly name: string; readonly text: string; readonly expr: Expr; readonly exps: Exponents };

export interface CompiledCheck {
  readonly text: string;
  readonly left: Expr;
  readonly op: Comparison;
  readonly right: Expr;
  readonly exps: Exponents;
}

export interface CompiledDesign {
  readonly title: string;
  readonly inputs: readonly CompiledInput[];
  /** Steps and derived quantities in evaluation order. */
  readonly nodes: readonly CompiledNode[];
  readonly checks: readonly CompiledCheck[];
  /** Remarks from reading tolerances (bands clipped at a domain edge). */
  readonly remarks: readonly string[];
}

function fail(code: "invalid_argument" | "unknown_input" | "wrong_type", input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError(code, { formula: "design", input, value, detail });
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v) && (Object.getPrototypeOf(v) === Object.prototype || Object.getPrototypeOf(v) === null);
}

function entries(v: unknown, field: string, limit: number): [string, unknown][] {
  if (v === undefined) return [];
  if (!isPlainObject(v)) throw fail("wrong_type", field, `"${field}" is an object of named entries`, v);
  const list = Object.keys(v).map((k) => [k, v[k]] as [string, unknown]);
  if (list.length > limit) throw fail("invalid_argument", field, `at most ${limit} ${field} (got ${list.length})`);
  return list;
}

/** Check a design and put it in evaluation order. Every problem is a FormulaError naming where it is. */
export function compileDesign(spec: DesignSpec): CompiledDesign {
  if (!isPlainObject(spec)) throw fail("wrong_type", "design", "a design is an object with inputs, steps, derived and checks", spec);
  for (const key of Object.keys(spec)) {
    if (!["title", "inputs", "steps", "derived", "checks"].includes(key)) throw fail("unknown_input", key, "a design has title, inputs, steps, derived and checks");
  }
  const title = spec.title === undefined ? "Design" : spec.title;
  if (typeof title !== "string" || title.length > 200) throw fail("wrong_type", "title", "a title is text of at most 200 characters", title);
  const rawInputs = entries(spec.inputs, "inputs", DESIGN_LIMITS.inputs);
  const rawSteps = entries(spec.steps, "steps", DESIGN_LIMITS.steps);
  const rawDerived = entries(spec.derived, "derived", DESIGN_LIMITS.steps);
  if (rawSteps.length + rawDerived.length > DESIGN_LIMITS.steps) {
    throw fail("invalid_argument", "steps", `at most ${DESIGN_LIMITS.steps} steps and derived quantities together`);
  }
  const rawChecks = spec.checks === undefined ? [] : spec.checks;
  if (!Array.isArray(rawChecks)) throw fail("wrong_type", "checks", "checks are a list of texts such as \"peakFluxDensity < 0.3 T\"", rawChecks);
  if (rawChecks.length > DESIGN_LIMITS.checks) throw fail("invalid_argument", "checks", `at most ${DESIGN_LIMITS.checks} checks`);

  // One namespace for inputs, steps and derived quantities.
  const kinds = new Map<string, "input" | "step" | "derived">();
  for (const [list, kind] of [[rawInputs, "input"], [rawSteps, "step"], [rawDerived, "derived"]] as const) {
    for (const [name] of list) {
      if (!NAME.test(name) || name.length > DESIGN_LIMITS.nameLength || RESERVED.has(name)) {
        throw fail("invalid_argument", name, `a name is a plain word of letters and digits, at most ${DESIGN_LIMITS.nameLength} characters, not "sqrt"`);
      }
      if (kinds.has(name)) throw fail("invalid_argument", name, `"${name}" is defined twice`);
      kinds.set(name, kind);
    }
  }
  const isName = (w: string): boolean => kinds.has(w);

  // Parse steps and derived quantities.
  interface StepDraft { name: string; formula: AnyFormula; bindings: CompiledBinding[]; reads: Set<string> }
  interface DerivedDraft { name: string; text: string; expr: Expr; reads: Set<string> }
  const steps = new Map<string, StepDraft>();
  for (const [name, raw] of rawSteps) {
    if (!isPlainObject(raw)) throw fail("wrong_type", name, "a step is { formula, inputs }", raw);
    for (const key of Object.keys(raw)) if (key !== "formula" && key !== "inputs") throw fail("unknown_input", name, `a step has "formula" and "inputs", not "${key}"`);
    const formula = getFormula(raw.formula);
    if (formula.definition.output.components) {
      throw fail("invalid_argument", name, `${formula.id} returns components; a design step takes formulas with one scalar result`);
    }
    const specs = formula.definition.inputs as Readonly<Record<string, InputSpec>>;
    const given = raw.inputs === undefined ? {} : raw.inputs;
    if (!isPlainObject(given)) throw fail("wrong_type", name, "a step's inputs are an object of bindings", given);
    const bindings: CompiledBinding[] = [];
    const reads = new Set<string>();
    const where = (input: string): string => `${name}.${input}`;
    for (const key of Object.keys(given)) {
      if (!Object.hasOwn(specs, key)) throw new FormulaError("unknown_input", { formula: formula.id, input: key, detail: `in design step "${name}"` });
    }
    for (const [input, ispec] of Object.entries(specs)) {
      if (!("choices" in ispec) && ispec.series) {
        // A design carries scalars (and 3-vectors) between steps, and its tolerance and sweeps vary
        // scalars: a waveform has no place in that chain, so the step is refused whatever it binds.
        throw new FormulaError("invalid_argument", {
          formula: formula.id, input, detail: `in design step "${name}": a series input (a waveform) cannot be bound in a design; evaluate this formula on its own`,
        });
      }
      const b = Object.hasOwn(given, input) ? given[input] : undefined;
      if (b === undefined) {
        if (ispec.default === undefined) throw new FormulaError("missing_input", { formula: formula.id, input, detail: `in design step "${name}"` });
        continue;
      }
      if ("choices" in ispec) {
        if (typeof b !== "string" || !ispec.choices.includes(b)) {
          throw new FormulaError("out_of_domain", { formula: formula.id, input, value: b, rule: `one of ${ispec.choices.join(", ")}`, detail: `in design step "${name}"` });
        }
        bindings.push({ input, kind: "choice", word: b });
      } else if (ispec.vector) {
        if (!Array.isArray(b) || b.length !== 3) throw new FormulaError("wrong_type", { formula: formula.id, input, value: b, expected: "a 3-array of bindings", detail: `in design step "${name}"` });
        const want = DIMENSIONS[ispec.dimension].exps as Exponents;
        const exprs = b.map((c: unknown) => bindingExpr(c, where(input), isName, want));
        exprs.forEach((e) => namesIn(e, reads));
        bindings.push({ input, kind: "vector", exprs });
      } else {
        const expr = bindingExpr(b, where(input), isName, DIMENSIONS[ispec.dimension].exps as Exponents);
        namesIn(expr, reads);
        bindings.push({ input, kind: "expr", expr });
      }
    }
    steps.set(name, { name, formula, bindings, reads });
  }
  const derived = new Map<string, DerivedDraft>();
  for (const [name, raw] of rawDerived) {
    if (typeof raw !== "string") throw fail("wrong_type", name, "a derived quantity is an expression text", raw);
    const expr = parseExpression(raw, name, isName);
    derived.set(name, { name, text: raw, expr, reads: namesIn(expr) });
  }

  // Each design input's home: a formula input it is bound to alone (its dimension, domain and
  // whole-number rule). With a unit, the first such input of the unit's dimension; a bare number, the first.
  const homes = new Map<string, QuantityInput[]>();
  for (const s of steps.values()) {
    for (const b of s.bindings) {
      if (b.kind !== "expr" || b.expr.k !== "name" || kinds.get(b.expr.name) !== "input") continue;
      const list = homes.get(b.expr.name) ?? [];
      list.push((s.formula.definition.inputs as Record<string, QuantityInput>)[b.input]!);
      homes.set(b.expr.name, list);
    }
  }
  const remarks: string[] = [];
  const inputs = rawInputs.map(([name, raw]) => readInput(name, raw, homes.get(name), remarks));

  // Order: depth-first from each node; a node met again while open is a cycle.
  const order: (StepDraft | DerivedDraft)[] = [];
  const state = new Map<string, "open" | "done">();
  const visit = (name: string, path: string[]): void => {
    if (kinds.get(name) === "input" || state.get(name) === "done") return;
    if (state.get(name) === "open") {
      throw fail("invalid_argument", name, `a cycle: ${[...path.slice(path.indexOf(name)), name].join(" -> ")}`);
    }
    state.set(name, "open");
    const node = steps.get(name) ?? derived.get(name)!;
    // Recursion depth is bounded by DESIGN_LIMITS.steps (500 frames).
    for (const r of node.reads) visit(r, [...path, name]);
    state.set(name, "done");
    order.push(node);
  };
  for (const name of [...steps.keys(), ...derived.keys()]) visit(name, []);

  // Dimensions, in order, so each name's dimension is known before it is read.
  const exps = new Map<string, Exponents>();
  for (const i of inputs) exps.set(i.name, DIMENSIONS[i.dimension].exps as Exponents);
  const dims = (n: string): Exponents => exps.get(n)!;
  const nodes: CompiledNode[] = order.map((node) => {
    if ("formula" in node) {
      for (const b of node.bindings) {
        if (b.kind === "choice") continue;
        const want = DIMENSIONS[((node.formula.definition.inputs as Record<string, QuantityInput>)[b.input]!).dimension].exps as Exponents;
        for (const e of b.kind === "vector" ? b.exprs : [b.expr]) {
          const got = dimensionOf(e, dims, `${node.name}.${b.input}`);
          if (!sameDimension(got, want)) {
            throw new FormulaError("wrong_dimension", {
              formula: node.formula.id, input: b.input, expected: nameExponents(want), received: nameExponents(got),
              detail: `in design step "${node.name}"`,
            });
          }
        }
      }
      // A choice word bound in the step may decide the output's dimension (OutputSpec.byChoice).
      const words = Object.fromEntries(node.bindings.flatMap((b) => (b.kind === "choice" ? [[b.input, b.word]] : [])));
      const out = DIMENSIONS[outputDimension(node.formula.definition.output, words)].exps as Exponents;
      exps.set(node.name, out);
      return { kind: "step", name: node.name, formula: node.formula, bindings: node.bindings, exps: out };
    }
    const e = dimensionOf(node.expr, dims, node.name);
    exps.set(node.name, e);
    return { kind: "derived", name: node.name, text: node.text, expr: node.expr, exps: e };
  });

  const checks = rawChecks.map((text: unknown, k: number) => {
    const where = `checks[${k}]`;
    if (typeof text !== "string") throw fail("wrong_type", where, 'a check is a text such as "peakFluxDensity < 0.3 T"', text);
    const c = parseCheck(text, where, isName);
    const a = dimensionOf(c.left, dims, where);
    const b = dimensionOf(c.right, dims, where);
    if (!sameDimension(a, b)) {
      throw new FormulaError("wrong_dimension", { formula: "design", input: where, expected: nameExponents(a), received: nameExponents(b), detail: `the two sides of "${text}" differ in dimension` });
    }
    return { text, ...c, exps: a };
  });
  return { title, inputs, nodes, checks, remarks };
}

function bindingExpr(b: unknown, where: string, isName: (w: string) => boolean, want: Exponents): Expr {
  if (typeof b === "number") {
    // A bare number is SI in the formula input's unit, as in evaluate.
    if (b - b !== 0) throw new FormulaError("not_finite", { formula: "design", input: where, value: b });
    return { k: "literal", si: b, exps: want, text: String(b) };
  }
  if (typeof b !== "string") throw new FormulaError("wrong_type", { formula: "design", input: where, value: b, expected: "a number in SI, a unit string or an expression of design names" });
  return parseExpression(b, where, isName);
}

function readInput(name: string, raw: unknown, homes: readonly QuantityInput[] | undefined, remarks: string[]): CompiledInput {
  const own = dimensionOfRaw(name, raw);
  const home = own === undefined ? homes?.[0] : homes?.find((h) => h.dimension === own);
  const spec = home ?? { dimension: own ?? "Dimensionless", description: name };
  const dimension = spec.dimension;
  if (isPlainObject(raw)) {
    const varied = readTolerance("design", name, spec, raw, remarks);
    return { name, spec, dimension, nominal: varied.nominal, varied };
  }
  const nominal = readQuantity("design", name, dimension, raw);
  return { name, spec, dimension, nominal };
}

// The dimension a value's unit names; undefined for a bare number (read in its home's unit, as SI).
function dimensionOfRaw(name: string, raw: unknown): DimensionName | undefined {
  const sample = isPlainObject(raw) ? (raw.nominal ?? raw.mean ?? raw.min) : raw;
  if (typeof sample !== "string") return undefined;
  const q = parseQuantity(sample, name, "design");
  if (q.plain) return undefined;
  for (const [n, d] of Object.entries(DIMENSIONS)) if (sameDimension(d.exps as Exponents, q.exps)) return n as DimensionName;
  throw new FormulaError("invalid_argument", {
    formula: "design", input: name, value: sample,
    detail: `${nameExponents(q.exps)} is not a named dimension; bind the input directly to a step input, or use derived quantities`,
  });
}
