import { describe, expect, it } from "vitest";
import * as mathjs from "mathjs";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec, Note } from "../../src/core/spec.js";
import { DISABLED_IN_EXPRESSIONS, createNotebookMath } from "../../src/notebook/index.js";

describe("the notebook mathjs instance", () => {
  const seen: { id: string; warnings: readonly Note[]; cautions: readonly Note[] }[] = [];
  const math = createNotebookMath({ onNotes: (id, n) => seen.push({ id, ...n }) });

  it("evaluates formulas on units, positionally and with an object of named inputs", () => {
    // eps0 A / d with eps0 = 8.8541878188e-12 F/m (CODATA 2022), A = 1 cm^2, d = 0.1 mm.
    const c = math.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)");
    expect(c.toNumber("F")).toBeCloseTo(8.8541878188e-12, 22);
    expect(c.toString()).toBe("8.854 pF");
    const named = math.evaluate("parallelPlateCapacitance({gap: 100 um, area: 100 mm^2, relativePermittivity: 4.4})");
    expect(named.toNumber("pF")).toBeCloseTo(8.8541878188 * 4.4, 10);
    expect(math.evaluate("to(parallelPlateCapacitance(1 cm^2, 0.1 mm) * 5 V, nC)").toNumber("nC")).toBeCloseTo(0.044270939094, 10);
  });

  it("gives every registry formula's example the same value as evaluate", () => {
    for (const f of listFormulas()) {
      const specs = f.definition.inputs as Record<string, InputSpec>;
      const ex: Record<string, unknown> = {};
      for (const [n, s] of Object.entries(specs)) if (s.example !== undefined) ex[n] = s.example;
      const expected = evaluate(f.id, ex).value;
      const got = math.evaluate(`${f.id}(x)`, { x: ex });
      const unit = evaluate(f.id, ex).unit;
      const toSI = (v: any): number => (typeof v === "number" ? v : v.toSI().value);
      if (typeof expected === "number") expect(toSI(got), f.id).toBeCloseTo(expected, 12 - Math.floor(Math.log10(Math.abs(expected) || 1)));
      else expect((got.toArray() as unknown[]).map(toSI), `${f.id} [${unit}]`).toEqual(expected);
    }
  });

  it("makes warnings reachable: a notes() function in expressions and an onNotes callback", () => {
    const n = math.evaluate('notes("parallelPlateCapacitance", 1 cm^2, 2 mm)');
    expect(n.warnings[0].code).toBe("fringing");
    seen.length = 0;
    math.evaluate("parallelPlateCapacitance(1 cm^2, 2 mm)");
    expect(seen[0]!.id).toBe("parallelPlateCapacitance");
    expect(seen[0]!.warnings[0]!.code).toBe("fringing");
  });

  it("throws FormulaError for a unit of the wrong dimension or an input out of its domain", () => {
    expect(() => math.evaluate("parallelPlateCapacitance(1 kg, 0.1 mm)")).toThrow(FormulaError);
    try {
      math.evaluate("parallelPlateCapacitance(1 cm^2, -0.1 mm)");
      expect.fail("expected out_of_domain");
    } catch (e) {
      expect((e as FormulaError).code).toBe("out_of_domain");
      expect((e as FormulaError).input).toBe("gap");
    }
    expect(() => math.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm, 4, 5)")).toThrow(/invalid argument/);
  });

  it("disables import, createUnit, reviver, evaluate, parse, compile, simplify, derivative and resolve inside expressions", () => {
    const calls: Record<string, string> = {
      import: "import({x: 1}, {})", createUnit: 'createUnit("furlong", "201.168 m")', reviver: 'reviver("a", 1)',
      config: 'config({number: "BigNumber"})',
      evaluate: 'evaluate("1 + 1")', parse: 'parse("1 + 1")', compile: 'compile("1 + 1")', simplify: 'simplify("x + x")',
      derivative: 'derivative("x^2", "x")', resolve: 'resolve("x", {})',
    };
    expect(Object.keys(calls).sort()).toEqual([...DISABLED_IN_EXPRESSIONS].sort());
    for (const [name, expr] of Object.entries(calls)) {
      expect(() => math.evaluate(expr), name).toThrow(`Function ${name} is disabled`);
    }
    // Ordinary unit arithmetic still works, including the trade units added to this instance.
    expect(math.evaluate("to(10 G, mT)").toNumber("mT")).toBeCloseTo(1, 12);
  });

  it("shows a result's warnings and cautions with its value, no second call needed", () => {
    // gap / sqrt(area) = 20 %: fringing applies (common practice threshold 1 %).
    const c = math.evaluate("parallelPlateCapacitance(1 cm^2, 2 mm)");
    expect(c.notes.warnings.map((n: Note) => n.code)).toEqual(["fringing"]);
    expect(c.toString()).toMatch(/^442\.7 fF\nwarning \[fringing\]: gap is 20 % of the plate size/);
    expect(math.format(c)).toBe(c.toString());
    // A value without notes prints as before; arithmetic on a result gives a plain value.
    expect(math.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)").toString()).toBe("8.854 pF");
    expect(math.evaluate("parallelPlateCapacitance(1 cm^2, 2 mm) * 2").toString()).not.toMatch(/fringing/);
    // A component output (a matrix) prints its cautions too: 1 kA in a 1 mm loop, mu0 I / 2R = 0.63 T at the centre.
    const b = math.evaluate("loopField(1 kA, 1 mm, 0 m, 0 m)");
    expect(String(b)).toMatch(/CAUTION \[strong_field\]/);
    expect(b.notes.cautions[0].code).toBe("strong_field");
  });

  it("refuses to change the instance from code: config, import and createUnit throw", () => {
    const m = createNotebookMath();
    const anyMath = m as unknown as Record<string, (...a: unknown[]) => unknown>;
    expect(() => anyMath.config!({ number: "BigNumber" })).toThrow("Function config is disabled");
    expect(() => anyMath.import!({ x: 1 })).toThrow("Function import is disabled");
    expect(() => anyMath.createUnit!("furlong", "201.168 m")).toThrow("Function createUnit is disabled");
    // Numbers are still numbers: config did not change.
    expect(m.evaluate("1 / 3")).toBe(1 / 3);
  });

  it("refuses to assign a unit name, which would change what later expressions mean", () => {
    const scope: Record<string, unknown> = {};
    expect(() => math.evaluate("C = parallelPlateCapacitance(1 cm^2, 0.1 mm)", scope)).toThrow(/"C" is a unit name/);
    expect(() => math.evaluate("L = 1 mH", scope)).toThrow(/"L" is a unit name/);
    expect(() => math.evaluate("f(m) = m + 1", scope)).not.toThrow(); // a parameter name is local to the function
    expect(() => math.evaluate("m(x) = x + 1", scope)).toThrow(/"m" is a unit name/);
    expect(Object.keys(scope)).toEqual(["f"]);
    // Other names work, and values stay in the caller's scope (object or Map) between calls.
    math.evaluate("Cp = parallelPlateCapacitance(1 cm^2, 0.1 mm)", scope);
    expect(math.evaluate("to(Cp * 5 V, pC)", scope).toNumber("pC")).toBeCloseTo(44.270939094, 9); // 8.8541878188 pF x 5 V
    const map = new Map<string, unknown>();
    math.evaluate("x = 3 mm", map);
    expect(math.evaluate("x * 2", map).toNumber("mm")).toBeCloseTo(6, 12);
    expect(map.has("x")).toBe(true);
    // 5 C is still 5 coulombs.
    expect(math.evaluate("5 C", scope).toNumber("C")).toBe(5);
  });

  it("shows a formula's documentation with help(formula): title, equation, inputs and source", () => {
    for (const expr of ["help(coaxialCapacitance)", 'help("coaxialCapacitance")']) {
      const text = String(math.evaluate(expr));
      expect(text).toMatch(/^Coaxial capacitance \(coaxialCapacitance\)\n {2}C = 2 pi eps0 epsr l \/ ln\(b \/ a\)/);
      expect(text).toContain("innerRadius: ");
      expect(text).toContain("relativePermittivity: ");
      expect(text).toContain("Source:\n  D. M. Pozar (2012)");
    }
    // mathjs's own functions keep their documentation (examples listed, not run: evaluate is disabled).
    expect(String(math.evaluate("help(sqrt)"))).toMatch(/^Name: sqrt\n[\s\S]*Examples:\n {4}sqrt\(25\)/);
  });

  it("prints quantities with the library's formatter: 4 significant digits, an SI prefix, a chosen unit kept", () => {
    expect(String(math.evaluate("5 cm"))).toBe("50 mm");
    expect(String(math.evaluate("1 / (2 pi sqrt(1 mH * 1 nF))"))).toBe("159.2 kHz"); // 1 / (2 pi sqrt(LC)) = 159.15494 kHz
    expect(String(math.evaluate("to(1 / (2 pi sqrt(1 mH * 1 nF)), MHz)"))).toBe("0.1592 MHz");
    expect(math.format(math.evaluate("5 cm"), { precision: 2 })).toBe("5 cm"); // options given: mathjs's own format
  });

  it("is a new instance: the global mathjs keeps its functions and gains no formulas", () => {
    expect(mathjs.evaluate("1 + 1")).toBe(2);
    expect(() => mathjs.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)")).toThrow();
    const other = createNotebookMath();
    expect(other).not.toBe(math);
    expect(other.evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)").toNumber("pF")).toBeCloseTo(8.8541878188, 10);
  });
});

describe("designs in the notebook", () => {
  it("design(...) evaluates a design written in an expression, units and all, as the library does", async () => {
    const { evaluateDesign } = await import("../../src/designs/index.js");
    const math = createNotebookMath();
    const view = math.evaluate('design({ inputs: { area: 1 cm^2, gap: 0.1 mm }, steps: { capacitance: { formula: "parallelPlateCapacitance", inputs: { area: "area", gap: "gap" } } }, checks: ["capacitance > 5 pF"] })') as { result: { steps: { value: number }[]; passed: boolean }; toString(): string; toHTML(): string };
    const direct = evaluateDesign({ inputs: { area: "1 cm^2", gap: "0.1 mm" }, steps: { capacitance: { formula: "parallelPlateCapacitance", inputs: { area: "area", gap: "gap" } } }, checks: ["capacitance > 5 pF"] });
    expect(view.result.steps[0]!.value).toBe(direct.steps[0]!.value);
    expect(view.result.passed).toBe(true);
    expect(view.toString()).toContain("capacitance = 8.854 pF");
    expect(view.toString()).toContain("pass  capacitance > 5 pF");
    expect(view.toHTML()).toContain("<h2>Checks</h2>");
  });

  it("design(...) takes a design file's JSON text and reports a bad design with its code", () => {
    const math = createNotebookMath();
    const text = JSON.stringify({ inputs: { a: "1 m" }, derived: { x: "a * 2" } });
    expect(String(math.evaluate(`design(${JSON.stringify(text)})`))).toContain("x = 2 m");
    expect(() => math.evaluate('design({ inputs: { a: 1 m }, derived: { x: "a + 1 s" } })')).toThrow(/wrong_dimension|needs/);
  });
});
