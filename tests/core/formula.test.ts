import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { defineFormula, evaluate, FormulaError, POSITIVE, solve, sweep, tolerance, type Length } from "../../src/index.js";
import { codeOf } from "../helpers/errors.js";
import { withoutCodeGeneration } from "../helpers/no-eval.js";

// A formula defined only for these tests: the core's behaviour, not physics.
const ratio = defineFormula({
  id: "testRatio",
  title: "Test ratio",
  category: "test",
  description: "Ratio of two lengths, for core tests.",
  equation: "r = a / b",
  inputs: [
    { name: "shorter", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
    { name: "longer", dimension: "Length", description: "b", domain: POSITIVE, example: 2 },
    { name: "factor", dimension: "Dimensionless", description: "k", default: 1, domain: { min: 1, max: 10 }, example: 2 },
    { name: "mode", choices: ["plain", "doubled"], description: "m", default: "plain", example: "plain" },
  ],
  output: { dimension: "Dimensionless", description: "ratio" },
  relations: [{ rule: "shorter < longer", holds: (x) => x.shorter < x.longer }],
  validity: [{ code: "close", when: (x) => x.shorter > 0.9 * x.longer, message: "nearly equal" }],
  cautions: [{ code: "always", message: "test caution" }],
  source: { authors: "common practice", title: "test" },
  compute: (x) => (x.factor * x.shorter) / x.longer * (x.mode === "doubled" ? 2 : 1),
});


describe("a defined formula", () => {
  const m = (v: number) => v as Length;

  it("computes with defaults filled in", () => {
    expect(ratio({ shorter: m(1), longer: m(4) })).toBe(0.25);
    expect(ratio({ shorter: m(1), longer: m(4), factor: 2, mode: "doubled" })).toBe(1);
  });

  it("gives the same answer and the same error codes on the fast and the generic path", () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), fc.oneof(fc.constant(undefined), fc.double()), (a, b, k) => {
        const inputs = { shorter: a, longer: b, factor: k } as never;
        let fast: unknown, slow: unknown;
        try { fast = ratio(inputs); } catch (e) { fast = (e as FormulaError).code; }
        try { slow = ratio.run(ratio.prepare(inputs)); } catch (e) { slow = (e as FormulaError).code; }
        expect(fast).toEqual(slow);
      }),
    );
  });

  it("sends legal inputs whose sum overflows down the careful path and still computes them", () => {
    // The fast path tests finiteness of all inputs at once through their sum.
    const big = Number.MAX_VALUE;
    expect(ratio({ shorter: m(big / 2), longer: m(big), factor: 1 })).toBe(0.5);
    expect(ratio({ shorter: m(big * 0.9), longer: m(big) })).toBeCloseTo(0.9, 15);
  });

  it("holds its inputs by name in declaration order, and refuses a name declared twice", () => {
    expect(Object.keys(ratio.definition.inputs)).toEqual(["shorter", "longer", "factor", "mode"]);
    expect(ratio.definition.inputs.longer.description).toBe("b");
    // Null prototype: no Object.prototype member can pass for an input.
    expect("toString" in ratio.definition.inputs).toBe(false);
    expect(() =>
      defineFormula({
        id: "testTwice", title: "t", category: "test", description: "t", equation: "y = a",
        inputs: [
          { name: "a", dimension: "Length", description: "a", example: 1 },
          { name: "a", dimension: "Length", description: "again", example: 1 },
        ],
        output: { dimension: "Length", description: "a" },
        source: { authors: "common practice", title: "test" },
        compute: (x) => x.a,
      }),
    ).toThrow(/input name "a" must be a plain word, declared once/);
  });

  it("reports each kind of bad input with its code and the input's name", () => {
    expect(codeOf(() => ratio({ shorter: m(-1), longer: m(4) }))).toBe("out_of_domain");
    expect(codeOf(() => ratio({ shorter: m(NaN), longer: m(4) }))).toBe("not_finite");
    expect(codeOf(() => ratio({ shorter: "1" as never, longer: m(4) }))).toBe("wrong_type");
    expect(codeOf(() => ratio({ shorter: m(1) } as never))).toBe("missing_input");
    expect(codeOf(() => ratio({ shorter: m(5), longer: m(4) }))).toBe("out_of_domain");
    expect(codeOf(() => ratio({ shorter: m(1), longer: m(4), factor: 11 }))).toBe("out_of_domain");
    expect(codeOf(() => ratio({ shorter: m(1), longer: m(4), mode: "tripled" as never }))).toBe("out_of_domain");
    try {
      ratio({ shorter: m(5), longer: m(4) });
    } catch (e) {
      expect((e as FormulaError).rule).toBe("shorter < longer");
      expect((e as Error).message).toContain("shorter < longer");
    }
  });

  it("returns warnings only when their condition holds, and cautions always", () => {
    const near = ratio.details({ shorter: m(0.95), longer: m(1) });
    expect(near.warnings.map((w) => w.code)).toEqual(["close"]);
    expect(near.cautions.map((w) => w.code)).toEqual(["always"]);
    expect(ratio.details({ shorter: m(0.5), longer: m(1) }).warnings).toEqual([]);
  });

  it("turns a non-finite result into out_of_range instead of returning it", () => {
    expect(codeOf(() => ratio({ shorter: m(1e300), longer: m(1e301), factor: 10 }))).toBeUndefined();
    const overflow = defineFormula({
      id: "testSquare", title: "t", category: "test", description: "square", equation: "a^2",
      inputs: [{ name: "a", dimension: "Length", description: "a", example: 1 }],
      output: { dimension: "Area", description: "a^2" },
      source: { authors: "common practice", title: "test" },
      compute: (x) => x.a * x.a,
    });
    expect(codeOf(() => overflow({ a: m(1e200) }))).toBe("out_of_range");
  });
});

describe("the object a formula's compute receives", () => {
  // A formula that records what its compute is handed.
  const seen: object[] = [];
  const recorder = (id: string) =>
    defineFormula({
      id, title: "t", category: "test", description: "records its inputs", equation: "y = a b",
      inputs: [
        { name: "alpha", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
        { name: "beta", dimension: "Length", description: "b", default: 2, domain: POSITIVE, example: 2 },
      ],
      output: { dimension: "Area", description: "a b" },
      relations: [{ rule: "alpha < 100 beta", holds: (x) => x.alpha < 100 * x.beta }],
      source: { authors: "common practice", title: "test" },
      compute: (x) => {
        seen.push(x);
        return x.alpha * x.beta;
      },
    });

  it("is one kind of object, inputs in declared order, on every path (typed, evaluate, solve, tolerance, sweep)", () => {
    const f = recorder("testRecorder");
    seen.length = 0;
    f({ alpha: 1 as Length });
    evaluate("parallelPlateCapacitance", { area: 1e-4, gap: 1e-4 }); // another formula: not recorded
    f.details({ alpha: 1 as Length, beta: 3 as Length });
    solve(f, "alpha", { beta: 3 as Length, target: 6 as never });
    tolerance(f, { alpha: { nominal: 1, percent: 10 }, beta: 2 }, { samples: 50 });
    sweep(f, { vary: { alpha: { from: 1, to: 2, points: 3 } } });
    expect(seen.length).toBeGreaterThan(6);
    // One constructor for all: the engine sees one shape and keeps compute's reads monomorphic.
    const protos = new Set(seen.map((x) => Object.getPrototypeOf(x)));
    expect(protos.size).toBe(1);
    expect([...protos][0]).not.toBe(Object.prototype);
    for (const x of seen) expect(Object.keys(x)).toEqual(["alpha", "beta"]);
  });

  it("is made the same way, and gives the same answers, where code generation is forbidden", () => {
    const f = withoutCodeGeneration(() => recorder("testRecorderNoEval"));
    seen.length = 0;
    expect(f({ alpha: 2 as Length, beta: 3 as Length })).toBe(6);
    expect(f({ alpha: 2 as Length })).toBe(4);
    expect(codeOf(() => f({ alpha: -1 as Length }))).toBe("out_of_domain");
    expect(codeOf(() => f({ alpha: 1000 as Length, beta: 1 as Length }))).toBe("out_of_domain");
    expect(Object.keys(seen[0]!)).toEqual(["alpha", "beta"]);
  });

  it("works with inputs named like Object.prototype members, on the fast and the careful path", () => {
    const odd = defineFormula({
      id: "testOddNames", title: "t", category: "test", description: "t", equation: "y = constructor + valueOf",
      inputs: [
        { name: "constructor", dimension: "Length", description: "a", domain: POSITIVE, example: 1 },
        { name: "valueOf", dimension: "Length", description: "b", default: 2, example: 2 },
      ],
      output: { dimension: "Length", description: "sum" },
      source: { authors: "common practice", title: "test" },
      compute: (x) => x.constructor + x.valueOf,
    });
    expect(odd({ constructor: 1 as Length, valueOf: 3 as Length } as never)).toBe(4);
    expect(odd({ constructor: 1 as Length } as never)).toBe(3);
    // A plain object inherits a "constructor" function: that is not an input value.
    expect(codeOf(() => odd({} as never))).toBe("missing_input");
    expect(odd.details({ constructor: 1 as Length } as never).value).toBe(3);
    expect(sweep(odd, { vary: { valueOf: { from: 1, to: 2, points: 2 } }, fixed: { constructor: 1 } } as never).output.values).toEqual(new Float64Array([2, 3]));
  });

  it("refuses input names that are not plain words", () => {
    for (const name of ["two words", "__proto__", "a-b", "1st", ""]) {
      expect(() =>
        defineFormula({
          id: "testBadName", title: "t", category: "test", description: "t", equation: "y = a",
          inputs: [{ name, dimension: "Length", description: "a", example: 1 }],
          output: { dimension: "Length", description: "a" },
          source: { authors: "common practice", title: "test" },
          compute: () => 1,
        }),
      ).toThrow(/must be a plain word, declared once/);
    }
  });
});

describe("evaluate", () => {
  it("reads unit strings and returns the SI value with its unit", () => {
    const r = evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" });
    // eps0 (CODATA 2022) * 1e-4 m^2 / 1e-4 m
    expect(r.value).toBeCloseTo(8.8541878188e-12, 22);
    expect(r.unit).toBe("F");
  });

  it("rejects an unknown formula id with its code", () => {
    expect(codeOf(() => evaluate("noSuchFormula", {}))).toBe("unknown_formula");
    expect(codeOf(() => evaluate("toString", {}))).toBe("unknown_formula");
  });

  it("names the input, the expected and the given dimension on a unit mismatch", () => {
    try {
      evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "5 kg" });
      expect.unreachable();
    } catch (e) {
      const err = e as FormulaError;
      expect([err.code, err.input, err.expected, err.received]).toEqual(["wrong_dimension", "gap", "Length", "Mass"]);
    }
  });

  it("does not let prototype keys reach the formula", () => {
    const inputs = JSON.parse('{"__proto__": {"gap": 1}, "area": 1}');
    expect(codeOf(() => evaluate("parallelPlateCapacitance", inputs))).toBe("unknown_input");
  });
});
