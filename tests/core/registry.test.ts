import { describe, expect, it } from "vitest";
import * as root from "../../src/index.js";
import { DIMENSIONS } from "../../src/units/dimensions.js";
import type { OutputSpec } from "../../src/core/spec.js";
import { evaluate, isFormula, listFormulas } from "../../src/index.js";

const formulas = listFormulas();
const CATEGORIES = new Set([
  "capacitance", "inductance", "flux", "magnetic circuit", "magnetic field", "electric field",
  "force", "particle", "displacement", "beam", "magnet", "exposure",
  "transmission line",
  "winding",
]);

describe("the formula registry", () => {
  it("holds every formula exported from the package root, under its exported name", () => {
    const exported = Object.entries(root).filter(([, v]) => isFormula(v));
    expect(exported.length).toBe(formulas.length);
    for (const [name, f] of exported) expect(isFormula(f) && f.id).toBe(name);
  });

  for (const f of formulas) {
    const d = f.definition;
    describe(f.id, () => {
      it("fires every warning and caution on a condition, with a measure of how far past it a point is", () => {
        // An always-on note is an assumption and belongs in the description; bulk
        // tools rank points by the measure to report the worst one.
        for (const c of [...(d.validity ?? []), ...(d.cautions ?? [])]) {
          expect(typeof c.when, `${c.code}: when`).toBe("function");
          expect(typeof c.measure, `${c.code}: measure`).toBe("function");
        }
      });

      it("names its category, title, equation, description and a source", () => {
        expect(CATEGORIES.has(d.category)).toBe(true);
        expect(d.title.length).toBeGreaterThan(3);
        expect(d.equation.length).toBeGreaterThan(3);
        expect(d.description.length).toBeGreaterThan(10);
        const sources = Array.isArray(d.source) ? d.source : [d.source];
        expect(sources.length).toBeGreaterThan(0);
        for (const s of sources) expect(s.title.length * s.authors.length).toBeGreaterThan(0);
      });

      it("declares known dimensions and an example for every input", () => {
        expect(Object.hasOwn(DIMENSIONS, d.output.dimension)).toBe(true);
        for (const [name, spec] of Object.entries(d.inputs) as [string, Record<string, unknown>][]) {
          expect(name).toMatch(/^[a-z][A-Za-z0-9]*$/);
          expect(spec.example, `${f.id}.${name} has no example`).toBeDefined();
          if (!("choices" in spec)) expect(Object.hasOwn(DIMENSIONS, String(spec.dimension))).toBe(true);
        }
      });

      it("evaluates its examples to a finite value of the declared shape", () => {
        const inputs: Record<string, unknown> = {};
        for (const [name, spec] of Object.entries(d.inputs as Record<string, { example?: unknown }>)) inputs[name] = spec.example;
        const r = evaluate(f.id, inputs);
        const values = Array.isArray(r.value) ? r.value : [r.value];
        for (const v of values) expect(Number.isFinite(v)).toBe(true);
        expect(values.length).toBe(d.output.components?.length ?? 1);
        expect(r.unit).toBe(DIMENSIONS[d.output.dimension as keyof typeof DIMENSIONS].unit);
      });

      it("reports, when a choice decides its output, the unit of that choice's dimension for every choice", () => {
        const by = (d.output as OutputSpec).byChoice;
        if (by === undefined) return;
        const choices = (d.inputs as Record<string, { choices?: readonly string[]; example?: unknown }>)[by.input]!.choices!;
        expect(Object.keys(by.dimensions).sort()).toEqual([...choices].sort());
        for (const c of choices) {
          expect(Object.hasOwn(DIMENSIONS, by.dimensions[c]!)).toBe(true);
          const inputs: Record<string, unknown> = {};
          for (const [name, spec] of Object.entries(d.inputs as Record<string, { example?: unknown }>)) inputs[name] = spec.example;
          inputs[by.input] = c;
          expect(evaluate(f.id, inputs).unit).toBe(DIMENSIONS[by.dimensions[c]!].unit);
        }
      });
    });
  }
});
