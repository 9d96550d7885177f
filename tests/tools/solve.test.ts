import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { FormulaError } from "../../src/core/errors.js";
import { type AnyFormula, defineFormula } from "../../src/core/formula.js";
import { listFormulas } from "../../src/core/registry.js";
import { COUNT, type InputSpec, POSITIVE } from "../../src/core/spec.js";
import { solve, solveDetails, solveRequest } from "../../src/tools/solve.js";
import { quantity } from "../../src/units/quantity.js";
import type { Length } from "../../src/units/types.js";
import { expectClose } from "../helpers/reference.js";
import { codeOf } from "../helpers/errors.js";

// eps0, CODATA 2022 recommended value (NIST), F/m.
const EPS0_CODATA_2022 = 8.8541878188e-12;


describe("solve on the parallel-plate capacitor", () => {
  it("finds the gap that gives 100 pF on 1 cm^2 (gap = eps0 A / C)", () => {
    const gap: Length = solve(parallelPlateCapacitance, "gap", { target: quantity(100, "pF"), area: quantity(1, "cm^2") });
    expectClose(gap, { input: "100 pF, 1 cm^2", expected: (EPS0_CODATA_2022 * 1e-4) / 100e-12, tolerance: 1e-12, source: "closed form with CODATA 2022 eps0" });
  });

  it("finds the permittivity from a unit-string request, and reports the output there", () => {
    const r = solveRequest({ formula: "parallelPlateCapacitance", solveFor: "relativePermittivity", target: "40 pF", inputs: { area: "1 cm^2", gap: "0.1 mm" } });
    expectClose(r.value, { input: r, expected: (40e-12 * 1e-4) / (EPS0_CODATA_2022 * 1e-4), tolerance: 1e-12, source: "closed form with CODATA 2022 eps0" });
    expect(r.unit).toBe("");
    expect(r.outputUnit).toBe("F");
    expectClose(r.outputAtValue, { expected: 40e-12, tolerance: 1e-12, source: "round trip" });
  });

  it("says no_solution, with the range searched and the outputs seen, when the target is out of reach", () => {
    // relativePermittivity >= 1, so C >= eps0 A / d = 8.85 pF here.
    try {
      solveRequest({ formula: "parallelPlateCapacitance", solveFor: "relativePermittivity", target: "1 pF", inputs: { area: "1 cm^2", gap: "0.1 mm" } });
      expect.fail("expected no_solution");
    } catch (e) {
      expect(e).toBeInstanceOf(FormulaError);
      expect((e as FormulaError).code).toBe("no_solution");
      expect((e as FormulaError).input).toBe("relativePermittivity");
      expect((e as Error).message).toMatch(/searched relativePermittivity from 1\.00000 to/);
      expect((e as Error).message).toMatch(/output took values from 8\.85419e-12 F/);
    }
  });

  it("rejects a target of the wrong dimension, a bad input and a solved input that is also given", () => {
    expect(codeOf(() => solveRequest({ formula: "parallelPlateCapacitance", solveFor: "gap", target: "3 kg", inputs: { area: "1 cm^2" } }))).toBe("wrong_dimension");
    expect(codeOf(() => solveRequest({ formula: "parallelPlateCapacitance", solveFor: "gap", target: "3 pF", inputs: { area: "-1 cm^2" } }))).toBe("out_of_domain");
    expect(codeOf(() => solveRequest({ formula: "parallelPlateCapacitance", solveFor: "gap", target: "3 pF", inputs: { area: "1 cm^2", gap: "1 mm" } }))).toBe("invalid_argument");
    expect(codeOf(() => solveRequest({ formula: "parallelPlateCapacitance", solveFor: "nothing", target: "3 pF", inputs: { area: "1 cm^2" } }))).toBe("unknown_input");
    expect(codeOf(() => solveRequest({ formula: "parallelPlateCapacitance", solveFor: "gap", target: "NaN", inputs: { area: "1 cm^2" } }))).toBe("unparsable");
  });
});

// Tool tests on small formulas defined here: mathematical identities, not physics.
const parabola = defineFormula({
  id: "testParabola", title: "test", category: "test", description: "test", equation: "y = (x - 3)^2",
  inputs: [{ name: "x", dimension: "Length", description: "x", example: 1 }],
  output: { dimension: "Area", description: "y" },
  source: { authors: "test", title: "test" },
  compute: (v) => (v.x - 3) ** 2,
});
const quadraticCoil = defineFormula({
  id: "testTurns", title: "test", category: "test", description: "test", equation: "y = 1e-6 N^2",
  inputs: [{ name: "turns", dimension: "Dimensionless", description: "turns", domain: COUNT, example: 10 }, { name: "scale", dimension: "Dimensionless", description: "k", default: 1e-6, domain: POSITIVE }],
  output: { dimension: "Inductance", description: "y" },
  cautions: [{ code: "always", message: "a caution that always applies" }],
  source: { authors: "test", title: "test" },
  compute: (v) => v.scale * v.turns * v.turns,
});
const plateau = defineFormula({
  id: "testPlateau", title: "test", category: "test", description: "test", equation: "y = min(x, 1)",
  inputs: [{ name: "x", dimension: "Dimensionless", description: "x", domain: POSITIVE, example: 0.5 }],
  output: { dimension: "Dimensionless", description: "y" },
  source: { authors: "test", title: "test" },
  compute: (v) => Math.min(v.x, 1),
});

describe("solve's search", () => {
  it("reports several_solutions with each root of a parabola, and a range picks one", () => {
    try {
      solveDetails(parabola, "x", { target: 4 as never });
      expect.fail("expected several_solutions");
    } catch (e) {
      expect((e as FormulaError).code).toBe("several_solutions");
      expect((e as Error).message).toContain("1.00000 m, 5.00000 m");
    }
    const r = solveRequest({ formula: "parallelPlateCapacitance", solveFor: "gap", target: "100 pF", inputs: { area: "1 cm^2" }, options: { range: ["1 um", "1 mm"] } });
    expect(r.searched[0]).toBeGreaterThanOrEqual(1e-6);
    expect(r.searched[1]).toBeLessThanOrEqual(1e-3);
    expect(solveDetails(parabola, "x", { target: 4 as never }, { range: [3, 100] }).value).toBeCloseTo(5, 12);
  });

  it("reports a flat stretch as several_solutions instead of listing every sample", () => {
    try {
      solveDetails(plateau, "x", { target: 1 });
      expect.fail("expected several_solutions");
    } catch (e) {
      expect((e as FormulaError).code).toBe("several_solutions");
      expect((e as Error).message).toMatch(/for every x from 1\.\d+ to 5\.00000: the output does not depend on x/);
    }
  });

  it("rounds a whole-number input, giving the unrounded solution and the output at the rounded value", () => {
    const r = solveDetails(quadraticCoil, "turns", { target: 150e-6 as never });
    expect(r.exact).toBeCloseTo(Math.sqrt(150), 10);
    expect(r.value).toBe(12);
    expectClose(r.outputAtValue, { expected: 144e-6, tolerance: 1e-14, source: "1e-6 * 12^2" });
    expect(r.cautions.map((c) => c.code)).toEqual(["always"]);
  });

  it("refuses choice inputs and component outputs with invalid_argument", () => {
    const withChoice = listFormulas().find((f) => Object.values(f.definition.inputs as Record<string, InputSpec>).some((s) => "choices" in s));
    if (withChoice) {
      const name = Object.entries(withChoice.definition.inputs as Record<string, InputSpec>).find(([, s]) => "choices" in s)![0];
      expect(codeOf(() => solveRequest({ formula: withChoice.id, solveFor: name, target: 1, inputs: {} }))).toBe("invalid_argument");
    }
    const vector = listFormulas().find((f) => f.definition.output.components);
    if (vector) {
      const name = Object.keys(vector.definition.inputs)[0]!;
      expect(codeOf(() => solveRequest({ formula: vector.id, solveFor: name, target: 1, inputs: {} }))).toBe("invalid_argument");
    }
    expect(withChoice ?? vector).toBeDefined();
  });
});

// ---- every registry formula ----

interface Case {
  formula: AnyFormula;
  input: string;
  examples: Record<string, unknown>;
  integer: boolean;
}

function cases(): Case[] {
  const out: Case[] = [];
  for (const f of listFormulas()) {
    if (f.definition.output.components) continue;
    const specs = f.definition.inputs as Record<string, InputSpec>;
    const examples: Record<string, unknown> = {};
    for (const [n, s] of Object.entries(specs)) if (s.example !== undefined) examples[n] = s.example;
    for (const [n, s] of Object.entries(specs)) {
      // Vectors and series are never solved for (solve refuses them: tested above and in tests/flux/waveform-loss).
      if ("choices" in s || s.vector || s.series || s.example === undefined) continue;
      out.push({ formula: f, input: n, examples, integer: s.domain?.integer === true });
    }
  }
  return out;
}

describe("solve on every registry formula", () => {
  const all = cases();

  it("has formulas to test", () => {
    expect(all.length).toBeGreaterThan(0);
  });

  it("round-trips: the output at the solution equals a target near the example output", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: all.length - 1 }), fc.double({ min: -0.3, max: 0.3, noNaN: true }), (k, delta) => {
        const c = all[k]!;
        const { [c.input]: _omit, ...others } = c.examples;
        const y0 = c.formula.run(c.formula.prepare(c.examples)) as number;
        const target = y0 * (1 + delta);
        let r;
        try {
          r = solveDetails(c.formula as never, c.input as never, { target, ...others } as never);
        } catch (e) {
          // Out of reach (saturating outputs) or not unique (even functions): legitimate answers,
          // but only these two codes.
          expect(e).toBeInstanceOf(FormulaError);
          expect(["no_solution", "several_solutions"]).toContain((e as FormulaError).code);
          return;
        }
        const again = c.formula.run(c.formula.prepare({ ...others, [c.input]: r.value })) as number;
        expect(again).toBe(r.outputAtValue);
        if (c.integer) {
          expect(Number.isInteger(r.value)).toBe(true);
          expect(Math.abs(r.value - r.exact!)).toBeLessThanOrEqual(1);
        } else {
          const err = Math.abs(again - target) / Math.max(Math.abs(target), 1e-300);
          if (err > 1e-8) expect.fail(`${c.formula.id}.${c.input}: target ${target}, got ${again} at ${r.value} (rel. err ${err})`);
        }
      }),
      { numRuns: 300, seed: 20261201 },
    );
  });

  it("recovers the example value itself whenever the answer is unique", () => {
    for (const c of all) {
      if (c.integer) continue;
      const { [c.input]: ex, ...others } = c.examples;
      const y0 = c.formula.run(c.formula.prepare(c.examples)) as number;
      let r;
      try {
        r = solveDetails(c.formula as never, c.input as never, { target: y0, ...others } as never);
      } catch (e) {
        expect((e as FormulaError).code, `${c.formula.id}.${c.input}: ${(e as Error).message}`).toBe("several_solutions");
        continue;
      }
      const err = Math.abs(r.outputAtValue - y0) / Math.max(Math.abs(y0), 1e-300);
      expect(err, `${c.formula.id}.${c.input}: ${r.value} vs example ${String(ex)}`).toBeLessThanOrEqual(1e-9);
    }
  });
});
