import { domainRule } from "../core/formula.js";
import type { AnyFormula } from "../core/formula.js";
import { getFormula, listFormulas } from "../core/registry.js";
import type { Condition, InputSpecs, OutputSpec, Source } from "../core/spec.js";
import { siUnit, specsOf } from "./convert.js";

/** One input as plain JSON. */
export interface CatalogInput {
  readonly name: string;
  readonly description: string;
  /** "quantity" or "choice". */
  readonly kind: "quantity" | "choice";
  readonly dimension?: string;
  /** SI unit symbol ("" when dimensionless). */
  readonly unit?: string;
  readonly vector?: boolean;
  /** For a series input (a waveform): how many samples it takes. */
  readonly series?: { readonly minLength: number; readonly maxLength: number };
  readonly default?: number | string;
  readonly domain?: { readonly min?: number; readonly minExclusive?: boolean; readonly max?: number; readonly maxExclusive?: boolean; readonly integer?: boolean; readonly rule: string };
  readonly example?: number | string | readonly number[];
  readonly choices?: readonly string[];
  readonly required: boolean;
}

/** How a quantity input is shaped, as the CLI and notebook help print it: "", ", 3-vector", ", series of 2 to 10000 samples". */
export function inputShapeText(i: CatalogInput): string {
  return i.vector ? ", 3-vector" : i.series ? `, series of ${i.series.minLength} to ${i.series.maxLength} samples` : "";
}

/** A warning or caution as plain JSON: its code, and its text when the text does not depend on the inputs. */
export interface CatalogNote {
  readonly code: string;
  /** The message when static; absent when it is built from the inputs. */
  readonly message?: string;
  /** True when the note always applies (a caution without a condition). */
  readonly always: boolean;
}

export interface CatalogEntry {
  readonly id: string;
  readonly title: string;
  readonly category: string;
  readonly description: string;
  readonly equation: string;
  readonly inputs: readonly CatalogInput[];
  readonly output: {
    readonly dimension: string; readonly unit: string; readonly description: string; readonly components?: readonly string[];
    /** When a choice input decides the output: that input, and the dimension and unit per choice (`dimension`/`unit` are the first choice's). */
    readonly byChoice?: { readonly input: string; readonly dimensions: Readonly<Record<string, { readonly dimension: string; readonly unit: string }>> };
  };
  readonly relations: readonly string[];
  readonly validity: readonly CatalogNote[];
  readonly cautions: readonly CatalogNote[];
  readonly sources: readonly Source[];
}

function byChoiceJson(by: NonNullable<OutputSpec["byChoice"]>): NonNullable<CatalogEntry["output"]["byChoice"]> {
  return {
    input: by.input,
    dimensions: Object.fromEntries(Object.entries(by.dimensions).map(([c, d]) => [c, { dimension: d, unit: siUnit(d) }])),
  };
}

/** "FluxDensity [T]", or per choice: "FluxDensity [T] (quantity fluxDensity) or ElectricField [V/m] (quantity electricField)". */
export function outputText(output: CatalogEntry["output"]): string {
  const one = (dimension: string, unit: string): string => `${dimension}${unit ? ` [${unit}]` : ""}`;
  if (!output.byChoice) return one(output.dimension, output.unit);
  const by = output.byChoice;
  return Object.entries(by.dimensions).map(([c, d]) => `${one(d.dimension, d.unit)} (${by.input} ${c})`).join(" or ");
}

function notesJson(list: readonly Condition<InputSpecs>[] | undefined): CatalogNote[] {
  return (list ?? []).map((c) => ({
    code: c.code,
    ...(typeof c.message === "string" ? { message: c.message } : {}),
    always: c.when === undefined,
  }));
}

/** Plain-JSON metadata of one formula (no functions; safe to serialise). */
export function catalogEntry(formula: AnyFormula | string): CatalogEntry {
  const f = typeof formula === "string" ? getFormula(formula) : formula;
  const def = f.definition;
  const inputs: CatalogInput[] = Object.entries(specsOf(f)).map(([name, s]) => {
    if ("choices" in s) {
      return {
        name, description: s.description, kind: "choice", choices: [...s.choices],
        ...(s.default !== undefined ? { default: s.default } : {}),
        ...(s.example !== undefined ? { example: s.example } : {}),
        required: s.default === undefined,
      };
    }
    return {
      name, description: s.description, kind: "quantity", dimension: s.dimension, unit: siUnit(s.dimension),
      ...(s.vector ? { vector: true } : {}),
      ...(s.series ? { series: { minLength: s.series.minLength, maxLength: s.series.maxLength } } : {}),
      ...(s.default !== undefined ? { default: s.default } : {}),
      ...(s.domain ? { domain: { ...s.domain, rule: domainRule(s.domain) } } : {}),
      ...(s.example !== undefined ? { example: Array.isArray(s.example) ? [...s.example] : s.example } : {}),
      required: s.default === undefined,
    };
  });
  const sources = Array.isArray(def.source) ? [...def.source] : [def.source as Source];
  return {
    id: f.id, title: def.title, category: def.category, description: def.description, equation: def.equation,
    inputs,
    output: {
      dimension: def.output.dimension, unit: siUnit(def.output.dimension), description: def.output.description,
      ...(def.output.components ? { components: [...def.output.components] } : {}),
      ...(def.output.byChoice ? { byChoice: byChoiceJson(def.output.byChoice) } : {}),
    },
    relations: (def.relations ?? []).map((r) => r.rule),
    validity: notesJson(def.validity),
    cautions: notesJson(def.cautions),
    sources: sources.map((s) => ({ ...s })),
  };
}

/** Every formula's metadata as plain JSON, sorted by category then id; optionally one category. */
export function formulaCatalog(category?: string): CatalogEntry[] {
  return listFormulas()
    .filter((f) => category === undefined || f.definition.category === category)
    .map((f) => catalogEntry(f));
}

/**
 * JSON Schema (draft 2020-12) of a formula's inputs object, for generated forms
 * and request validation: each quantity is a number in SI (with the domain as
 * bounds) or a unit string; choices are enums; inputs without a default are
 * required; no other properties.
 */
export function inputSchema(formula: AnyFormula | string): Record<string, unknown> {
  const f = typeof formula === "string" ? getFormula(formula) : formula;
  const properties: Record<string, unknown> = {};
  const required: string[] = [];
  for (const [name, s] of Object.entries(specsOf(f))) {
    if (s.default === undefined) required.push(name);
    if ("choices" in s) {
      properties[name] = {
        description: s.description, type: "string", enum: [...s.choices],
        ...(s.default !== undefined ? { default: s.default } : {}),
        ...(s.example !== undefined ? { examples: [s.example] } : {}),
      };
      continue;
    }
    const unit = siUnit(s.dimension);
    const number: Record<string, unknown> = { type: s.domain?.integer ? "integer" : "number", description: `SI value${unit ? ` in ${unit}` : ""}` };
    const d = s.domain;
    if (d?.min !== undefined) number[d.minExclusive ? "exclusiveMinimum" : "minimum"] = d.min;
    if (d?.max !== undefined) number[d.maxExclusive ? "exclusiveMaximum" : "maximum"] = d.max;
    const scalar = {
      anyOf: [number, { type: "string", minLength: 1, maxLength: 200, description: unit ? `a number with a unit of ${s.dimension}, e.g. "1.5 ${unit}"` : "a number (a bare number string is read as is)" }],
    };
    const body = s.vector
      ? { type: "array", items: scalar, minItems: 3, maxItems: 3 }
      : s.series
        ? { type: "array", items: scalar, minItems: s.series.minLength, maxItems: s.series.maxLength }
        : scalar;
    properties[name] = {
      description: s.description,
      "x-dimension": s.dimension,
      "x-unit": unit,
      ...body,
      ...(s.default !== undefined ? { default: s.default } : {}),
      ...(s.example !== undefined ? { examples: [s.example] } : {}),
    };
  }
  return {
    $schema: "https://json-schema.org/draft/2020-12/schema",
    $id: `emquant:formula/${f.id}/inputs`,
    title: `${f.definition.title}: inputs`,
    type: "object",
    properties,
    required,
    additionalProperties: false,
  };
}
