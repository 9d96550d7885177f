import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { compileDesign } from "../../src/designs/compile.js";
import { designTolerance, evaluateDesign, solveDesign, sweepDesign } from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";
import { expectFormulaError } from "../helpers/errors.js";

// Bad and hostile designs: every problem is a coded FormulaError that names
// where it is, never a hang, a crash or a wrong number.

const probe: DesignSpec = JSON.parse(readFileSync(new URL("../../examples/designs/level-sensor.json", import.meta.url), "utf8"));
const small: DesignSpec = {
  inputs: { area: "1 cm^2", gap: "0.1 mm" },
  steps: { capacitance: { formula: "parallelPlateCapacitance", inputs: { area: "area", gap: "gap" } } },
  checks: ["capacitance > 1 pF"],
};
const err = (spec: unknown): FormulaError => expectFormulaError(() => evaluateDesign(spec as DesignSpec));

describe("design errors name the step and input", () => {
  it("a binding of the wrong dimension is wrong_dimension naming the formula input and the step", () => {
    const e = err({ ...small, steps: { capacitance: { formula: "parallelPlateCapacitance", inputs: { area: "gap", gap: "gap" } } } });
    expect(e.code).toBe("wrong_dimension");
    expect(e.input).toBe("area");
    expect(e.message).toContain('step "capacitance"');
    expect(e.message).toContain("Area");
  });

  it("a sum of unlike quantities in a derived quantity is wrong_dimension naming it", () => {
    const e = err({ ...small, derived: { bad: "area + gap" } });
    expect([e.code, e.input]).toEqual(["wrong_dimension", "bad"]);
  });

  it("a check comparing unlike quantities is wrong_dimension", () => {
    expect(err({ ...small, checks: ["capacitance < 1 m"] }).code).toBe("wrong_dimension");
  });

  it("unknown names, formulas and formula inputs are coded", () => {
    expect(err({ ...small, derived: { x: "area * nothing" } }).code).toBe("unknown_input");
    expect(err({ ...small, steps: { c: { formula: "noSuchFormula", inputs: {} } } }).code).toBe("unknown_formula");
    const e = err({ ...small, steps: { c: { formula: "parallelPlateCapacitance", inputs: { area: "area", gap: "gap", size: "gap" } } } });
    expect([e.code, e.input]).toEqual(["unknown_input", "size"]);
    const m = err({ ...small, steps: { c: { formula: "parallelPlateCapacitance", inputs: { area: "area" } } } });
    expect([m.code, m.input]).toEqual(["missing_input", "gap"]);
  });

  it("a cycle is invalid_argument naming the loop", () => {
    const e = err({ inputs: { a: "1 m" }, derived: { x: "y + a", y: "x * 1" } });
    expect(e.code).toBe("invalid_argument");
    expect(e.message).toMatch(/cycle: (x -> y -> x|y -> x -> y)/);
  });

  it("a step that refuses its inputs at run time names the step", () => {
    const e = err({ ...small, inputs: { area: "1 cm^2", gap: "-0.1 mm" } });
    expect([e.code, e.input]).toEqual(["out_of_domain", "gap"]);
    expect(e.message).toContain('step "capacitance"');
  });

  it("an overflowing derived quantity is out_of_range, not Infinity", () => {
    expect(err({ inputs: { a: "1e300 m" }, derived: { big: "a * a" } }).code).toBe("out_of_range");
    expect(err({ inputs: { a: "0 m", b: "1 m" }, derived: { r: "b / a" } }).code).toBe("out_of_range");
  });
});

describe("hostile designs", () => {
  it("prototype keys are not names and reach nothing", () => {
    const spec = JSON.parse('{"inputs": {"__proto__": "1 m"}, "derived": {"x": "1 m"}}');
    expect(err(spec).code).toBe("invalid_argument");
    const spec2 = JSON.parse('{"inputs": {"constructor": "1 m"}, "steps": {"toString": {"formula": "constructor", "inputs": {}}}}');
    expect(err(spec2).code).toBe("unknown_formula");
    expect(err({ inputs: { a: "1 m" }, derived: { x: "a.constructor" } }).code).toBe("invalid_argument");
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it("expressions cannot call, assign or reach anything", () => {
    for (const text of ["process.exit(1)", "a = 2", "a; a", "eval(a)", "a[0]", "`a`", "a => a", "sqrt a", "1 m ^ a", "import(a)"]) {
      const e = err({ inputs: { a: "1 m" }, derived: { x: text } });
      expect(["invalid_argument", "unknown_input", "unparsable"]).toContain(e.code);
      expect(e.input).toBe("x");
    }
  });

  it("size limits: 10,000 steps, deep nesting, long text and huge sample counts are refused", () => {
    const derived: Record<string, string> = { d0: "a" };
    for (let i = 1; i < 10_000; i++) derived[`d${i}`] = `d${i - 1} * 1`;
    expect(err({ inputs: { a: "1 m" }, derived }).code).toBe("invalid_argument");
    expect(err({ inputs: { a: "1 m" }, derived: { x: `${"(".repeat(100)}a${")".repeat(100)}` } }).code).toBe("invalid_argument");
    expect(err({ inputs: { a: "1 m" }, derived: { x: "a + ".repeat(200) + "a" } }).code).toBe("invalid_argument");
    expect(expectFormulaError(() => designTolerance(probe, { samples: 1e9 })).code).toBe("invalid_argument");
    expect(expectFormulaError(() => sweepDesign(probe, { input: "level", from: "0.1 m", to: "0.9 m", points: 1e7 })).code).toBe("invalid_argument");
    expect(expectFormulaError(() => solveDesign(probe, { input: "level", output: "span", target: "50 pF", decades: 1e6 })).code).toBe("invalid_argument");
  });

  it("a 500-step chain, the largest allowed, runs", () => {
    const derived: Record<string, string> = { d0: "a" };
    for (let i = 1; i < 500; i++) derived[`d${i}`] = `d${i - 1} * 1`;
    expect(evaluateDesign({ inputs: { a: "2 m" }, derived }).derived.at(-1)!.value).toBe(2);
  });

  it("compileDesign accepts the design files of the examples", () => {
    expect(compileDesign(probe).nodes.map((n) => n.name)).toContain("span");
  });
});
