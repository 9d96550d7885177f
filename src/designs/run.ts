import { FormulaError } from "../core/errors.js";
import type { Note, Source } from "../core/spec.js";
import { type CompiledDesign, type CompiledNode } from "./compile.js";
import { evaluateExpression } from "./expression.js";
import { unitOf } from "./units.js";

// Running a compiled design: one pass over its nodes in order. `runValues`
// is the lean form the tolerance, solve and sweep loops call many times;
// `runDetailed` adds every step's inputs, notes and source for results and reports.

/** Values by name after one run (inputs, steps, derived quantities). */
export type Values = Map<string, number>;

/** A step's error, restated to name the design step. */
function inStep(e: unknown, step: string): unknown {
  if (!(e instanceof FormulaError)) return e;
  if (e.formula === "design") return e;
  return new FormulaError(e.code, {
    formula: e.formula, input: e.input, value: e.value, expected: e.expected, received: e.received, rule: e.rule,
    detail: `in design step "${step}"`,
  });
}

function runNode(node: CompiledNode, values: Values, withNotes: boolean): { value: number; x?: Record<string, unknown>; notes?: { warnings: Note[]; cautions: Note[] } } {
  const get = (n: string): number => values.get(n)!;
  if (node.kind === "derived") {
    const value = evaluateExpression(node.expr, get);
    if (value - value !== 0) throw new FormulaError("out_of_range", { formula: "design", input: node.name, detail: `"${node.text}" is not a finite number` });
    return { value };
  }
  const raw: Record<string, unknown> = Object.create(null);
  for (const b of node.bindings) {
    if (b.kind === "choice") raw[b.input] = b.word;
    else if (b.kind === "vector") raw[b.input] = b.exprs.map((e) => evaluateExpression(e, get));
    else raw[b.input] = evaluateExpression(b.expr, get);
  }
  try {
    const x = node.formula.prepare(raw);
    const value = node.formula.run(x) as number;
    return withNotes ? { value, x, notes: node.formula.notes(x, value) } : { value };
  } catch (e) {
    throw inStep(e, node.name);
  }
}

/** Run the chain for the given input values (SI, by name); throws the first step's error. */
export function runValues(c: CompiledDesign, inputs: ReadonlyMap<string, number>): Values {
  const values: Values = new Map(inputs);
  for (const node of c.nodes) values.set(node.name, runNode(node, values, false).value);
  return values;
}

/** The two sides of every check and whether it passes, from one run's values. */
export function checkValues(c: CompiledDesign, values: Values): { left: number; right: number; pass: boolean }[] {
  const get = (n: string): number => values.get(n)!;
  return c.checks.map((k) => {
    const left = evaluateExpression(k.left, get);
    const right = evaluateExpression(k.right, get);
    const pass = k.op === "<" ? left < right : k.op === "<=" ? left <= right : k.op === ">" ? left > right : left >= right;
    return { left, right, pass };
  });
}

export interface DesignInputResult {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  /** For a toleranced input: its band (SI) and distribution. */
  readonly tolerance?: { readonly lo: number; readonly hi: number; readonly sd: number; readonly kind: "uniform" | "normal" };
}

export interface DesignStepResult {
  readonly name: string;
  readonly formula: string;
  readonly title: string;
  readonly equation: string;
  readonly source: Source | readonly Source[];
  /** The inputs the formula received, in SI (defaults filled). */
  readonly inputs: readonly { readonly name: string; readonly value: number | string | readonly number[]; readonly unit: string }[];
  readonly value: number;
  readonly unit: string;
  readonly warnings: readonly Note[];
  readonly cautions: readonly Note[];
}

export interface DesignDerivedResult {
  readonly name: string;
  readonly expression: string;
  readonly value: number;
  readonly unit: string;
}

export interface DesignCheckResult {
  readonly rule: string;
  readonly pass: boolean;
  readonly left: number;
  readonly right: number;
  readonly unit: string;
  /** Room left before the check fails, in SI (negative when it fails): right - left for < and <=, left - right for > and >=. */
  readonly margin: number;
  /** margin / |right|; undefined when the limit is 0. */
  readonly relativeMargin: number | undefined;
}

/** A note raised by a step, with the step's name. */
export interface DesignNote extends Note {
  readonly step: string;
}

export interface DesignResult {
  readonly title: string;
  readonly inputs: readonly DesignInputResult[];
  readonly steps: readonly DesignStepResult[];
  readonly derived: readonly DesignDerivedResult[];
  readonly checks: readonly DesignCheckResult[];
  /** True when every check passes. */
  readonly passed: boolean;
  readonly warnings: readonly DesignNote[];
  readonly cautions: readonly DesignNote[];
  readonly remarks: readonly string[];
}

/** Run once at the nominal inputs with everything a reader needs. */
export function runDetailed(c: CompiledDesign): DesignResult {
  const values: Values = new Map(c.inputs.map((i) => [i.name, i.nominal]));
  const steps: DesignStepResult[] = [];
  const derived: DesignDerivedResult[] = [];
  const warnings: DesignNote[] = [];
  const cautions: DesignNote[] = [];
  for (const node of c.nodes) {
    const r = runNode(node, values, true);
    values.set(node.name, r.value);
    const unit = unitOf(node.exps);
    if (node.kind === "derived") {
      derived.push({ name: node.name, expression: node.text, value: r.value, unit });
      continue;
    }
    const def = node.formula.definition;
    const specs = def.inputs as Record<string, { dimension?: string; choices?: readonly string[] }>;
    const inputs = Object.keys(specs).map((name) => {
      const v = r.x![name] as number | string | readonly number[];
      const d = specs[name]!.dimension;
      return { name, value: v, unit: d ? unitOf(d) : "" };
    });
    for (const w of r.notes!.warnings) warnings.push({ ...w, step: node.name });
    for (const w of r.notes!.cautions) cautions.push({ ...w, step: node.name });
    steps.push({
      name: node.name, formula: node.formula.id, title: def.title, equation: def.equation, source: def.source,
      inputs, value: r.value, unit, warnings: r.notes!.warnings, cautions: r.notes!.cautions,
    });
  }
  const sides = checkValues(c, values);
  const checks = c.checks.map((k, i): DesignCheckResult => {
    const { left, right, pass } = sides[i]!;
    const margin = k.op === "<" || k.op === "<=" ? right - left : left - right;
    return { rule: k.text, pass, left, right, unit: unitOf(k.exps), margin, relativeMargin: right === 0 ? undefined : margin / Math.abs(right) };
  });
  const inputs = c.inputs.map((i): DesignInputResult => {
    const unit = unitOf(i.dimension);
    return i.varied
      ? { name: i.name, value: i.nominal, unit, tolerance: { lo: i.varied.lo, hi: i.varied.hi, sd: i.varied.sd, kind: i.varied.kind } }
      : { name: i.name, value: i.nominal, unit };
  });
  return {
    title: c.title, inputs, steps, derived, checks, passed: checks.every((k) => k.pass),
    warnings, cautions, remarks: c.remarks,
  };
}
