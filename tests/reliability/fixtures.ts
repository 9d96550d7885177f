/**
 * Test fixtures, not physics: small definitions that exercise the parts of the
 * core (vector inputs, choice inputs, counts, relations, component outputs)
 * whether or not the registry has a formula using them yet. They are never
 * registered; the reliability tests call them through the same checks as
 * `evaluate` (toSI + run).
 */
import { defineFormula } from "../../src/core/formula.js";
import { COUNT, POSITIVE } from "../../src/core/spec.js";

export const fixtureShellVector = /* @__PURE__ */ defineFormula({
  id: "fixtureShellVector",
  title: "Fixture: vector, choice, count, relation, components",
  category: "fixture",
  description: "Test fixture exercising every kind of input and a component output; no physical meaning.",
  equation: "r = position * turns * (outer - inner) / outer",
  inputs: [
    { name: "innerRadius", dimension: "Length", description: "Inner radius", domain: POSITIVE, example: 0.001 },
    { name: "outerRadius", dimension: "Length", description: "Outer radius", domain: POSITIVE, example: 0.004 },
    { name: "turns", dimension: "Dimensionless", description: "A count", domain: COUNT, example: 10 },
    { name: "mode", choices: ["plain", "doubled"], description: "A choice", default: "plain", example: "doubled" },
    { name: "position", dimension: "Length", description: "A point", vector: true, example: [0.01, -0.02, 0.03] },
  ],
  output: { dimension: "Length", description: "A scaled point", components: ["x", "y", "z"] },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: { authors: "test fixture", title: "not a published formula" },
  compute: (x) => {
    const k = (x.turns * (x.outerRadius - x.innerRadius)) / x.outerRadius * (x.mode === "doubled" ? 2 : 1);
    return [x.position[0] * k, x.position[1] * k, x.position[2] * k];
  },
});

export const fixtureScalarChoice = /* @__PURE__ */ defineFormula({
  id: "fixtureScalarChoice",
  title: "Fixture: scalar output with a required choice and a bounded input",
  category: "fixture",
  description: "Test fixture exercising the fast path with a choice and a bounded domain; no physical meaning.",
  equation: "y = length * fraction * (shape factor)",
  inputs: [
    { name: "length", dimension: "Length", description: "A length", domain: POSITIVE, example: 0.5 },
    { name: "fraction", dimension: "Dimensionless", description: "A bounded fraction", domain: { min: 0, max: 1, maxExclusive: true }, example: 0.25 },
    { name: "shape", choices: ["round", "square"], description: "A required choice", example: "square" },
  ],
  output: { dimension: "Length", description: "A length" },
  source: { authors: "test fixture", title: "not a published formula" },
  compute: (x) => x.length * x.fraction * (x.shape === "round" ? Math.PI / 4 : 1),
});

export const fixtures = [fixtureShellVector, fixtureScalarChoice] as const;
