import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";
import { catalogEntry, formulaCatalog, inputSchema } from "../../src/tools/catalog.js";
import { DIMENSIONS } from "../../src/units/dimensions.js";

type Schema = Record<string, any>;

/**
 * A validator for the subset of JSON Schema 2020-12 that inputSchema emits:
 * type, enum, anyOf, minimum, exclusiveMinimum, maximum, exclusiveMaximum,
 * minLength, maxLength, items, minItems, maxItems, properties, required,
 * additionalProperties: false. Returns the list of problems (empty when valid).
 */
function validate(schema: Schema, v: unknown, path = "$"): string[] {
  const errs: string[] = [];
  const known = new Set(["$schema", "$id", "title", "description", "default", "examples", "x-dimension", "x-unit",
    "type", "enum", "anyOf", "minimum", "exclusiveMinimum", "maximum", "exclusiveMaximum", "minLength", "maxLength",
    "items", "minItems", "maxItems", "properties", "required", "additionalProperties"]);
  for (const k of Object.keys(schema)) if (!known.has(k)) errs.push(`${path}: keyword ${k} not supported by this validator`);
  if (schema.anyOf) {
    const ok = (schema.anyOf as Schema[]).some((s) => validate(s, v, path).length === 0);
    if (!ok) errs.push(`${path}: matches no alternative`);
  }
  if (schema.type !== undefined) {
    const t = schema.type;
    const is = t === "number" ? typeof v === "number" && Number.isFinite(v)
      : t === "integer" ? Number.isInteger(v)
      : t === "string" ? typeof v === "string"
      : t === "array" ? Array.isArray(v)
      : t === "object" ? typeof v === "object" && v !== null && !Array.isArray(v)
      : false;
    if (!is) return [...errs, `${path}: not of type ${t}`];
  }
  if (schema.enum && !(schema.enum as unknown[]).includes(v)) errs.push(`${path}: not in enum`);
  if (typeof v === "number") {
    if (schema.minimum !== undefined && !(v >= schema.minimum)) errs.push(`${path}: below minimum`);
    if (schema.exclusiveMinimum !== undefined && !(v > schema.exclusiveMinimum)) errs.push(`${path}: not above exclusiveMinimum`);
    if (schema.maximum !== undefined && !(v <= schema.maximum)) errs.push(`${path}: above maximum`);
    if (schema.exclusiveMaximum !== undefined && !(v < schema.exclusiveMaximum)) errs.push(`${path}: not below exclusiveMaximum`);
  }
  if (typeof v === "string") {
    if (schema.minLength !== undefined && v.length < schema.minLength) errs.push(`${path}: too short`);
    if (schema.maxLength !== undefined && v.length > schema.maxLength) errs.push(`${path}: too long`);
  }
  if (Array.isArray(v)) {
    if (schema.minItems !== undefined && v.length < schema.minItems) errs.push(`${path}: too few items`);
    if (schema.maxItems !== undefined && v.length > schema.maxItems) errs.push(`${path}: too many items`);
    if (schema.items) v.forEach((x, i) => errs.push(...validate(schema.items, x, `${path}[${i}]`)));
  }
  if (typeof v === "object" && v !== null && !Array.isArray(v)) {
    const o = v as Record<string, unknown>;
    for (const r of (schema.required ?? []) as string[]) if (!Object.hasOwn(o, r)) errs.push(`${path}: missing ${r}`);
    for (const [k, x] of Object.entries(o)) {
      const p = schema.properties?.[k];
      if (p) errs.push(...validate(p, x, `${path}.${k}`));
      else if (schema.additionalProperties === false) errs.push(`${path}: unexpected ${k}`);
    }
  }
  return errs;
}

function examples(id: string): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const specs = listFormulas().find((f) => f.id === id)!.definition.inputs as Record<string, InputSpec>;
  for (const [n, s] of Object.entries(specs)) if (s.example !== undefined) out[n] = s.example;
  return out;
}

describe("the formula catalog", () => {
  const catalog = formulaCatalog();

  it("lists every registry formula as plain JSON that survives a round trip", () => {
    expect(catalog.map((e) => e.id)).toEqual(listFormulas().map((f) => f.id));
    expect(JSON.parse(JSON.stringify(catalog))).toEqual(catalog);
  });

  it("gives each quantity input its dimension's SI unit, and each output too", () => {
    for (const e of catalog) {
      for (const i of e.inputs) {
        if (i.kind === "choice") expect(i.choices!.length, `${e.id}.${i.name}`).toBeGreaterThan(0);
        else expect(i.unit, `${e.id}.${i.name}`).toBe(DIMENSIONS[i.dimension as keyof typeof DIMENSIONS].unit);
        expect(i.required).toBe(i.default === undefined);
      }
      expect(e.output.unit).toBe(DIMENSIONS[e.output.dimension as keyof typeof DIMENSIONS].unit);
      for (const d of Object.values(e.output.byChoice?.dimensions ?? {})) expect(d.unit).toBe(DIMENSIONS[d.dimension as keyof typeof DIMENSIONS].unit);
      expect(e.sources.length).toBeGreaterThan(0);
      for (const n of [...e.validity, ...e.cautions]) expect(n.code).toMatch(/^[a-z0-9_]+$/i);
    }
  });

  it("describes the parallel-plate capacitor: equation, inputs, the fringing warning by code, its source", () => {
    const e = catalogEntry("parallelPlateCapacitance");
    expect(e.equation).toBe("C = eps0 * epsr * A / d");
    expect(e.inputs.map((i) => i.name)).toEqual(["area", "gap", "relativePermittivity"]);
    expect(e.inputs[2]).toMatchObject({ default: 1, domain: { min: 1, rule: ">= 1" }, unit: "" });
    expect(e.validity).toEqual([{ code: "fringing", always: false }]);
    expect(e.sources[0]!.authors).toBe("D. J. Griffiths");
    expect(formulaCatalog("capacitance").every((x) => x.category === "capacitance")).toBe(true);
  });

  it("names unknown formulas with unknown_formula", () => {
    expect(() => catalogEntry("noSuchFormula")).toThrow(FormulaError);
  });
});

describe("input schemas", () => {
  it("accept every registry formula's example inputs, as SI numbers and as the values evaluate accepts", () => {
    for (const f of listFormulas()) {
      const schema = inputSchema(f.id);
      expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
      const ex = examples(f.id);
      expect(validate(schema, ex), f.id).toEqual([]);
      expect(() => evaluate(f.id, ex)).not.toThrow();
    }
  });

  it("accept unit strings and refuse a missing input, an extra one, a value below the domain, a bad choice", () => {
    const s = inputSchema("parallelPlateCapacitance");
    expect(validate(s, { area: "1 cm^2", gap: "0.1 mm" })).toEqual([]);
    expect(validate(s, { area: "1 cm^2" })).toEqual(["$: missing gap"]);
    expect(validate(s, { area: 1e-4, gap: 1e-4, colour: "red" })).toEqual(["$: unexpected colour"]);
    expect(validate(s, { area: -1, gap: 1e-4 })).toEqual(["$.area: matches no alternative"]);
    expect(validate(s, { area: 1e-4, gap: 1e-4, relativePermittivity: 0.5 })).toEqual(["$.relativePermittivity: matches no alternative"]);
    for (const f of listFormulas()) {
      for (const [n, spec] of Object.entries(f.definition.inputs as Record<string, InputSpec>)) {
        if (!("choices" in spec)) continue;
        const bad = { ...examples(f.id), [n]: "no-such-choice" };
        expect(validate(inputSchema(f.id), bad).length, `${f.id}.${n}`).toBeGreaterThan(0);
      }
    }
  });
});
