import type { Formula } from "../core/formula.js";
import type { FormulaInputs, FormulaOutput, InputSpecs, OutputSpec } from "../core/spec.js";
import type { ToleranceSpec } from "../tools/tolerance.js";
import { FormulaError } from "../core/errors.js";
import { DIMENSIONS, type DimensionName } from "../units/dimensions.js";
import type { DimensionTypes } from "../units/types.js";
import type { DesignResult } from "./run.js";
import { evaluateDesign } from "./tools.js";

// A design as data (JSON for files and backends) and the typed builder that
// writes the same data from TypeScript, where a binding of the wrong
// dimension does not compile.

/** A design input: a number in SI, a unit string ("0.5 mm"), or a tolerance ({ nominal: "0.5 mm", percent: 5 }). */
export type DesignInputValue = number | string | ToleranceSpec;

/**
 * A step input's binding: a number in SI, or a text that is a unit string
 * ("0.5 mm"), a design name ("gapLength"), an expression of names and
 * quantities ("2 * gapLength + 0.1 mm"), or a choice word for a choice input.
 * Vector inputs take a 3-array of such.
 */
export type DesignBinding = number | string | readonly (number | string)[];

export interface DesignStepSpec {
  /** Registry id of the formula. */
  readonly formula: string;
  /** Bindings by formula input name; inputs with defaults may be left out. */
  readonly inputs?: Readonly<Record<string, DesignBinding>>;
}

/** A design: named inputs, steps, derived quantities and checks. Names are plain words shared by all four. */
export interface DesignSpec {
  readonly title?: string;
  readonly inputs?: Readonly<Record<string, DesignInputValue>>;
  /** Steps by name; each name holds its formula's result. Order does not matter. */
  readonly steps?: Readonly<Record<string, DesignStepSpec>>;
  /** Derived quantities: expressions of names and quantities (+ - * / ^ sqrt, parentheses). */
  readonly derived?: Readonly<Record<string, string>>;
  /** Checks such as "peakFluxDensity < 0.3 T" or "temperatureRise <= 40 K". */
  readonly checks?: readonly string[];
}

// ---- typed builder ----

declare const QUANTITY: unique symbol;
/** A reference to a named design value of quantity type Q. */
export interface Ref<Q> {
  readonly name: string;
  readonly [QUANTITY]?: Q;
}

const REF = Symbol.for("emquant.designRef");

function isRef(v: unknown): v is Ref<unknown> {
  return typeof v === "object" && v !== null && (v as Record<symbol, unknown>)[REF] === true;
}

/** References to a design's named values, each typed by its quantity. */
export type Refs<Env> = { readonly [K in keyof Env]: Ref<Env[K]> };
/** A typed step binding: a quantity of the input's type or a reference to one. */
export type Bindings<I extends InputSpecs> = { readonly [K in keyof FormulaInputs<I>]: FormulaInputs<I>[K] | Ref<NonNullable<FormulaInputs<I>[K]>> };
/** A tolerance of typed quantities (the typed form of ToleranceSpec). */
export type TypedTolerance<Q> =
  | { readonly nominal: Q; readonly plusMinus: Q }
  | { readonly nominal: Q; readonly percent: number }
  | { readonly distribution: "normal"; readonly mean: Q; readonly sd: Q }
  | { readonly distribution: "uniform"; readonly min: Q; readonly max: Q };

/**
 * Builds a design in TypeScript. Each `input`, `step` and `derived` adds a
 * name with its quantity type; a step's bindings take quantities or
 * references (`r.gapLength`) of exactly the formula input's type.
 * `spec` is the same JSON a design file holds.
 */
export class DesignBuilder<Env = object> {
  private constructor(
    readonly spec: DesignSpec,
    // The dimensions derived quantities were declared with; checked against the expressions on evaluate.
    private readonly declared: Readonly<Record<string, DimensionName>> = {},
  ) {}

  static start(title: string): DesignBuilder<object> {
    return new DesignBuilder({ title, inputs: {}, steps: {}, derived: {}, checks: [] });
  }

  /**
   * A design input of the stated dimension: a quantity, or a tolerance of
   * quantities. Written to the JSON as SI unit strings, so the dimension
   * travels with the value.
   */
  input<N extends string, D extends DimensionName>(
    name: N,
    dimension: D,
    value: DimensionTypes[D] | TypedTolerance<DimensionTypes[D]>,
  ): DesignBuilder<Env & { readonly [K in N]: DimensionTypes[D] }> {
    const unit = DIMENSIONS[dimension].unit;
    const text = (v: unknown): unknown => (typeof v === "number" && unit ? `${v} ${unit}` : v);
    const json = typeof value === "object" && value !== null
      ? Object.fromEntries(Object.entries(value).map(([k, v]) => [k, k === "percent" || k === "distribution" ? v : text(v)]))
      : text(value);
    return new DesignBuilder({ ...this.spec, inputs: { ...this.spec.inputs, [name]: json as DesignInputValue } }, this.declared) as never;
  }

  step<N extends string, I extends InputSpecs, O extends OutputSpec>(
    name: N,
    formula: Formula<I, O>,
    bind: (refs: Refs<Env>) => Bindings<I>,
  ): DesignBuilder<Env & { readonly [K in N]: FormulaOutput<O> }> {
    const refs = new Proxy({}, { get: (_t, key) => (typeof key === "string" ? { name: key, [REF]: true } : undefined) }) as Refs<Env>;
    const given = bind(refs) as Record<string, unknown>;
    const inputs: Record<string, DesignBinding> = {};
    for (const [k, v] of Object.entries(given)) {
      if (v === undefined) continue;
      inputs[k] = isRef(v) ? v.name : Array.isArray(v) ? v.map((c) => (isRef(c) ? c.name : c)) : (v as number | string);
    }
    return new DesignBuilder({ ...this.spec, steps: { ...this.spec.steps, [name]: { formula: formula.id, inputs } } }, this.declared);
  }

  /** A derived quantity of the stated dimension (checked when the design is compiled). */
  derived<N extends string, D extends DimensionName>(name: N, dimension: D, expression: string): DesignBuilder<Env & { readonly [K in N]: DimensionTypes[D] }> {
    return new DesignBuilder({ ...this.spec, derived: { ...this.spec.derived, [name]: expression } }, { ...this.declared, [name]: dimension }) as never;
  }

  check(rule: string): DesignBuilder<Env> {
    return new DesignBuilder({ ...this.spec, checks: [...(this.spec.checks ?? []), rule] }, this.declared);
  }

  /** Evaluate the design: the full result, plus every named value with its quantity type. */
  evaluate(): { readonly result: DesignResult; readonly values: { readonly [K in keyof Env]: Env[K] } } {
    const result = evaluateDesign(this.spec);
    for (const d of result.derived) {
      const want = this.declared[d.name];
      if (want !== undefined && DIMENSIONS[want].unit !== d.unit) {
        throw new FormulaError("wrong_dimension", { formula: "design", input: d.name, expected: want, received: d.unit || "dimensionless", detail: `"${d.expression}"` });
      }
    }
    const values: Record<string, number> = {};
    for (const i of result.inputs) values[i.name] = i.value;
    for (const s of [...result.steps, ...result.derived]) values[s.name] = s.value;
    return { result, values: values as never };
  }
}

/** Start a typed design. */
export function design(title: string): DesignBuilder<object> {
  return DesignBuilder.start(title);
}
