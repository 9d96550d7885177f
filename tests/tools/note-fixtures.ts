// Test-only formulas for the note summaries of sweeps and tolerance analyses;
// never registered, no physical meaning.
import { defineFormula } from "../../src/core/formula.js";
import { POSITIVE } from "../../src/core/spec.js";

// A scalar output with a measured warning, an always-on caution and a relation.
// Factories: the sweep caches its generated loops per formula, so a test of the
// fallback loops needs a formula no earlier sweep has seen.
export const makeMeasured = () => defineFormula({
  id: "testMeasuredNotes", title: "t", category: "test", description: "notes on purpose", equation: "y = a b",
  inputs: [
    { name: "a", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
    { name: "b", dimension: "Length", description: "b", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Area", description: "a b" },
  relations: [{ rule: "a < 9", holds: (x) => x.a < 9 }],
  validity: [{ code: "large", when: (_x, v) => (v as number) > 10, measure: (_x, v) => v as number, message: (_x, v) => `y is ${v as number}` }],
  cautions: [{ code: "always_here", message: "always" }],
  source: { authors: "common practice", title: "test" },
  compute: (x) => x.a * x.b,
});

// A component output with a warning measured on its second component.
export const makeMeasuredVector = () => defineFormula({
  id: "testMeasuredVector", title: "t", category: "test", description: "notes on purpose", equation: "y = (a b, -a b)",
  inputs: [
    { name: "a", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
    { name: "b", dimension: "Length", description: "b", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Area", description: "a b", components: ["plus", "minus"] },
  // Measured on the second component: the note pass must hand every component over.
  validity: [{ code: "deep", when: (_x, v) => (v as number[])[1]! < -10, measure: (_x, v) => -(v as number[])[1]!, message: (_x, v) => `minus is ${(v as number[])[1]}` }],
  source: { authors: "common practice", title: "test" },
  compute: (x) => [x.a * x.b, -x.a * x.b],
});


export const measured = makeMeasured();
export const measuredVector = makeMeasuredVector();
