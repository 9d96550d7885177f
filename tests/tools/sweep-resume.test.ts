import { describe, expect, it } from "vitest";
import { defineFormula, FormulaError, POSITIVE, sweep } from "../../src/index.js";
import { withoutCodeGeneration } from "../helpers/no-eval.js";

// Test-only formula: compute throws a FormulaError on one band of inputs and
// returns Infinity on another, the two ways a point can fail inside compute.
const picky = defineFormula({
  id: "testPicky", title: "t", category: "test", description: "fails on purpose", equation: "y = a b",
  inputs: [
    { name: "a", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
    { name: "b", dimension: "Length", description: "b", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Area", description: "a b" },
  source: { authors: "common practice", title: "test" },
  compute: (x) => {
    if (x.a > 3 && x.a < 5) throw new FormulaError("out_of_range", { formula: "testPicky" });
    if (x.b > 8) return Infinity;
    return x.a * x.b;
  },
});

describe("a sweep over points where compute fails", () => {
  it("marks exactly the failing points as not computed and computes every other point", () => {
    const r = sweep(picky, { vary: { a: { from: 1, to: 10, points: 10 }, b: { from: 1, to: 10, points: 10 } } });
    let expectedFailures = 0;
    for (let i = 0; i < 10; i++) {
      for (let j = 0; j < 10; j++) {
        const a = i + 1;
        const b = j + 1;
        const k = i * 10 + j;
        const fails = (a > 3 && a < 5) || b > 8;
        if (fails) {
          expectedFailures++;
          expect(r.computed[k]).toBe(0);
          expect(Number.isNaN(r.output.values[k])).toBe(true);
        } else {
          expect(r.computed[k]).toBe(1);
          expect(r.output.values[k]).toBe(a * b);
        }
      }
    }
    expect(r.notComputed).toBe(expectedFailures);
  });

  it("resumes after a failure at the last point of a row and of the grid", () => {
    const r = sweep(picky, { vary: { a: { from: 4, to: 4, points: 1 }, b: { from: 1, to: 2, points: 2 } } });
    expect([...r.computed]).toEqual([0, 0]);
    const one = sweep(picky, { vary: { a: { from: 1, to: 4, points: 4 } }, fixed: { b: 2 } });
    expect([...one.computed]).toEqual([1, 1, 1, 0]);
    expect(one.notComputed).toBe(1);
  });
});

describe("a sweep where code generation is forbidden (strict Content-Security-Policy)", () => {
  it("falls back to the general loop and gives the same grid", () => {
    // Same physics as `picky`, other input names, so no generated loop is cached for it.
    const pickyToo = defineFormula({
      id: "testPickyToo", title: "t", category: "test", description: "fails on purpose", equation: "y = p q",
      inputs: [{ ...picky.definition.inputs.a, name: "p" }, { ...picky.definition.inputs.b, name: "q" }],
      output: picky.definition.output,
      source: picky.definition.source,
      compute: (x) => picky.definition.compute({ a: x.p, b: x.q }),
    });
    const spec = { vary: { p: { from: 1, to: 10, points: 10 }, q: { from: 1, to: 10, points: 10 } } };
    const fallback = withoutCodeGeneration(() => sweep(pickyToo, spec));
    const generated = sweep(picky, { vary: { a: spec.vary.p, b: spec.vary.q } });
    expect([...fallback.computed]).toEqual([...generated.computed]);
    expect([...fallback.output.values]).toEqual([...generated.output.values]);
    expect(fallback.notComputed).toBe(generated.notComputed);
  });

  it("falls back to the general loop for component outputs too, and gives the same components", () => {
    const makePair = (id: string) =>
      defineFormula({
        id, title: "t", category: "test", description: "fails on purpose, two components", equation: "(a b, a / b)",
        inputs: [{ ...picky.definition.inputs.a, name: "a" }, { ...picky.definition.inputs.b, name: "b" }],
        output: { dimension: "Area", description: "two numbers", components: ["product", "ratio"] },
        source: picky.definition.source,
        compute: (x) => [picky.definition.compute({ a: x.a, b: x.b }), x.a / x.b],
      });
    // Defined under the ban too, so no generated code exists for it.
    const pair = withoutCodeGeneration(() => makePair("testPickyPair"));
    const spec = { vary: { a: { from: -1, to: 10, points: 12 }, b: { from: 1, to: 10, points: 10 } } };
    const fallback = withoutCodeGeneration(() => sweep(pair, spec));
    const scalar = sweep(picky, spec);
    expect([...fallback.computed]).toEqual([...scalar.computed]);
    // The generated loop resumes after throws the same way. (A fresh formula: the one
    // above has its failed code generation remembered, as in a real strict-CSP page.)
    const generated = sweep(makePair("testPickyPairGenerated"), spec);
    expect(generated.notComputed).toBe(fallback.notComputed);
    expect([...generated.computed]).toEqual([...fallback.computed]);
    for (const c of ["product", "ratio"]) expect([...generated.output.components![c]!]).toEqual([...fallback.output.components![c]!]);
    expect([...fallback.output.components!.product!]).toEqual([...scalar.output.values]);
    expect(fallback.notComputed).toBe(scalar.notComputed);
    for (let k = 0; k < 120; k++) {
      const ratio = fallback.output.components!.ratio![k]!;
      if (scalar.computed[k] === 1) expect(ratio).toBe(fallback.axes[0]!.values[Math.floor(k / 10)]! / fallback.axes[1]!.values[k % 10]!);
      else expect(Number.isNaN(ratio)).toBe(true);
    }
  });
});
