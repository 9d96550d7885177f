import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluateDesign } from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";

// Designs in the fuzz suite: hostile fragments (prototype keys, reserved words,
// broken expressions, overflowing literals, unknown formulas) assembled at random.
describe("fuzzed designs", () => {
  // The fuzz suite's rule for designs: random fragments assembled into designs
  // either evaluate to finite numbers or fail with a FormulaError.
  it("random designs built from fragments evaluate or fail with a FormulaError, never anything else", () => {
    const names = ["a", "b", "gap", "area", "x", "y", "__proto__", "sqrt", "T"];
    const exprs = ["a", "b * 2", "sqrt(area)", "gap / 0 m", "1e308 m * 10", "x + y", "a ^ (1/3)", "-gap", "((a)", "2 mm", "20 degC", "1 T", "a < b", "", "a b"];
    const values = ["1 cm^2", "0.1 mm", "3", "-1 m", "1e400 m", "abc", 5, 0, -0, { nominal: "1 mm", percent: 5 }, { nominal: "1 mm" }, null, [1, 2]];
    const formulas = ["parallelPlateCapacitance", "wireField", "loopField", "noSuch", "toString"];
    const design = fc.record({
      inputs: fc.dictionary(fc.constantFrom(...names), fc.constantFrom(...values), { maxKeys: 4 }),
      derived: fc.dictionary(fc.constantFrom(...names), fc.constantFrom(...exprs), { maxKeys: 3 }),
      steps: fc.dictionary(
        fc.constantFrom(...names),
        fc.record({ formula: fc.constantFrom(...formulas), inputs: fc.dictionary(fc.constantFrom("area", "gap", "current", "distance", "radius"), fc.constantFrom(...exprs, 1e-3, -1), { maxKeys: 3 }) }),
        { maxKeys: 3 },
      ),
      checks: fc.array(fc.constantFrom(...exprs.map((e) => `${e} < 1 m`), "a > b", "x <= 2 T"), { maxLength: 2 }),
    });
    fc.assert(
      fc.property(design, (spec) => {
        try {
          const r = evaluateDesign(spec as DesignSpec);
          for (const s of [...r.steps, ...r.derived]) expect(Number.isFinite(s.value)).toBe(true);
          for (const k of r.checks) expect(Number.isNaN(k.margin)).toBe(false);
        } catch (e) {
          if (!(e instanceof FormulaError)) throw e;
          expect(e.message).not.toMatch(/NaN|Infinity|undefined/);
        }
      }),
      { numRuns: 5000 },
    );
  });

});
