/**
 * The unit-string path (parseQuantity and evaluate) under random and hostile
 * text: only FormulaError comes out, long text is refused by length before
 * mathjs sees it, and no request can change another's answer (the unit cache
 * holds frozen records; the global mathjs instance is never touched).
 */
import fc from "fast-check";
import * as mathjs from "mathjs";
import { afterAll, describe, expect, it, vi } from "vitest";
import { ERROR_CODES, FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { parseQuantity, unitMath } from "../../src/units/parse.js";
import { exampleInputs, formulas, isChoice, specsOf } from "./harness.js";


let tried = 0;

const ADVERSARIAL = [
  "1e999999 m", "1 m^99999", "1 km^99999", "1 m^1e400", "2 m^-1e400", "1 m^NaN", "((((", "))))", "(", "\u0000", "1\u0000 m", "\u202e5 m",
  "5 \u00b5m", "5 \u03a9", "\ud83d\ude00", "\ud800 m", "import('fs')", "import({}, {override: true})", "createUnit('foo')",
  "createUnit('m', '2 m', {override: true})", "evaluate('1')", "parse('1')", "compile('1')", "simplify('x')", "1 m + 2 m",
  "1 m * 2", "1 m to cm", "[1,2] m", "[1 m, 2 m]", "{a: 1}", "x = 5", "f(x) = x", "1; 2", "5 m; createUnit('x')", "config({number: 'BigNumber'})",
  "__proto__", "constructor", "prototype", "5 __proto__", "5 constructor", "5 toString", "5 hasOwnProperty", "1 m^m", "1 m^-", "1 m^",
  "1e", "e5 m", ".", "-", "+", "1..2 m", "1.2.3 m", "0x10 m", "0b10 m", "1_0 m", "Infinity m", "-Infinity m", "NaN m", "i m", "2i m",
  "1 m/0", "0 m/m", "5 m/s/s/s/s/s/s/s/s/s/s", "5 " + "m ".repeat(90), "1 " + "(".repeat(90) + "m" + ")".repeat(90), "5 bit", "5 B",
  "1 degC", "-300 degC", "1 rad", "5 kg", "5 \t m", "5\nm", "5 M", "5 mM", "5 mmm", "1e-400 m", "-0 m", "1e308 km",
];

const LONG = ["1".repeat(10_000), `${"9".repeat(5_000)} m`, `1 ${"m".repeat(10_000)}`, "(".repeat(10_000), `${"1".repeat(201)}`, "x".repeat(100_000)];

const CODES = new Set<string>(ERROR_CODES);

function catchParse(text: string): FormulaError | undefined {
  try {
    parseQuantity(text, "gap");
  } catch (e) {
    if (e instanceof FormulaError) return e;
    throw e;
  }
  return undefined;
}

/** parseQuantity either returns a frozen record or throws an "unparsable" FormulaError. */
function checkParse(text: string): void {
  tried++;
  try {
    const q = parseQuantity(text, "someInput", "someFormula");
    expect(Object.isFrozen(q)).toBe(true);
    expect(Object.isFrozen(q.exps)).toBe(true);
    expect(typeof q.si).toBe("number");
    expect(q.exps.length).toBe(8);
  } catch (e) {
    if (!(e instanceof FormulaError)) throw new Error(`parseQuantity(${JSON.stringify(text.slice(0, 40))}) threw ${String(e)}`);
    expect(e.code).toBe("unparsable");
    expect(e.input).toBe("someInput");
  }
}

/** evaluate with the text in every input: a FormulaError with a known code, or a finite result. */
function checkEvaluate(text: string, rounds: number): void {
  for (const f of formulas.slice(0, rounds)) {
    const ex = exampleInputs(f);
    if (!ex) continue;
    for (const [name, spec] of specsOf(f)) {
      if (isChoice(spec)) continue;
      tried++;
      try {
        const r = evaluate(f.id, { ...ex, [name]: spec.vector ? [text, text, text] : text });
        for (const c of typeof r.value === "number" ? [r.value] : r.value) expect(Number.isFinite(c)).toBe(true);
      } catch (e) {
        if (!(e instanceof FormulaError)) throw new Error(`${f.id}.${name} = ${JSON.stringify(text.slice(0, 40))} threw ${String(e)}`);
        expect(CODES.has(e.code)).toBe(true);
        // Input-level failures name the input; range and relation failures concern them all.
        if (e.code === "out_of_range" || (e.code === "out_of_domain" && e.input === undefined)) continue;
        expect(e.input, e.message).toBe(name);
      }
    }
  }
}

describe("unit strings under fuzzing", () => {
  it("adversarial unit strings give a frozen parse or an unparsable FormulaError, in parseQuantity and evaluate", () => {
    for (const s of [...ADVERSARIAL, ...LONG]) {
      checkParse(s);
      checkEvaluate(s, 6);
    }
  });

  it("an infinite unit exponent is refused as unparsable with a message about exponents", () => {
    for (const s of ["1 m^1e400", "2 m^-1e400"]) {
      tried++;
      const e = catchParse(s);
      expect(e?.code).toBe("unparsable");
      expect(e?.message).toContain("exponents must be finite");
    }
  });

  it("random strings and random unicode give only FormulaError", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 60 }), fc.string({ unit: "binary", maxLength: 40 }), fc.string({ unit: "grapheme", maxLength: 20 })), (s) => {
        checkParse(s);
        checkEvaluate(s, 2);
      }),
      { numRuns: 400 },
    );
  });

  it("strings built from the unit grammar's pieces give only FormulaError or a finite dimensioned value", () => {
    const piece = fc.constantFrom("1", "2.5", "-3", "1e3", "1e-300", "1e300", "1e400", " ", "m", "mm", "kg", "s", "A", "K", "F", "H", "T", "V", "ohm", "^", "2", "-1", "/", "*", "(", ")", "deg", "rad", "p", "u", "G", "Oe", "eV", ",", "e", ".");
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 12 }), (parts) => {
        const s = parts.join("");
        checkParse(s);
        checkEvaluate(s, 2);
      }),
      { numRuns: 600 },
    );
  });

  it("text longer than the limit is refused by length before mathjs parses it", () => {
    const math = unitMath();
    const spy = vi.spyOn(math.Unit, "parse");
    try {
      for (const s of LONG) {
        tried++;
        const e = catchParse(s);
        expect(e?.code).toBe("unparsable");
        expect(e?.message).toMatch(/longer than \d+ characters/);
        // The message quotes a short prefix, never the whole text.
        expect(e?.message.length).toBeLessThan(300);
      }
      expect(spy).not.toHaveBeenCalled();
      // A short new string the fast reader leaves to mathjs (a long unit name) does reach mathjs, so the spy is live.
      parseQuantity(`${Math.random()} inch`);
      expect(spy).toHaveBeenCalled();
    } finally {
      spy.mockRestore();
    }
  });

  it("the unit cache cannot be poisoned: a string parses to the same frozen record before and after hostile requests", () => {
    const probes = ["0.2 mm", "4.7 uF", "1 cm^2", "3 T", "1 G", "1 eV", "2 Oe", "1e-3"];
    const before = probes.map((s) => parseQuantity(s));
    const snapshot = before.map((q) => JSON.stringify(q));
    for (const q of before) {
      tried++;
      expect(() => {
        (q as { si: number }).si = 42;
      }).toThrow(TypeError);
      expect(() => {
        (q.exps as unknown as number[])[0] = 7;
      }).toThrow(TypeError);
    }
    for (const s of [...ADVERSARIAL, ...LONG]) checkParse(s);
    // Fill the cache past its limit so it is cleared and rebuilt.
    for (let i = 0; i < 5000; i++) checkParse(`${i}.5 mm`);
    const after = probes.map((s) => parseQuantity(s));
    expect(after.map((q) => JSON.stringify(q))).toEqual(snapshot);
    expect(parseQuantity("1 G").si).toBe(1e-4);
    expect(parseQuantity("1 eV").si).toBe(1.602176634e-19);
  });

  it("one request's result never changes another's answer", () => {
    for (const f of formulas) {
      const ex = exampleInputs(f);
      if (!ex) continue;
      tried++;
      const first = evaluate(f.id, ex);
      const reference = JSON.parse(JSON.stringify(first)) as unknown;
      // Tamper with everything the first caller received.
      try {
        if (Array.isArray(first.value)) (first.value as number[]).fill(NaN);
        (first.warnings as unknown[]).push({ code: "tampered", message: "x" });
        (first.cautions as unknown[]).length = 0;
        (first as { value: unknown }).value = NaN;
      } catch {
        // frozen results are fine too
      }
      // Tamper with the inputs object the caller passed.
      for (const k of Object.keys(ex)) ex[k] = "tampered";
      expect(JSON.parse(JSON.stringify(evaluate(f.id, exampleInputs(f)!)))).toEqual(reference);
    }
  });

  it("the global mathjs instance is untouched by emquant's units and by hostile requests", () => {
    const probe = (s: string): string => {
      try {
        const u = mathjs.unit(s);
        return `${u.toSI().toString()}`;
      } catch (e) {
        return `error ${(e as Error).message}`;
      }
    };
    const texts = ["1 eV", "1 gauss", "1 G", "1 Oe", "1 Da", "1 maxwell", "1 foo", "1 m"];
    // Make sure emquant's private instance exists and has been used.
    parseQuantity("1 Oe");
    const before = texts.map(probe);
    for (const s of ADVERSARIAL) checkParse(s);
    for (const s of ["createUnit('foo', '2 m')", "import({foo: 1})"]) checkEvaluate(s, 3);
    expect(texts.map(probe)).toEqual(before);
    // emquant's instance is a different object from the global one.
    expect(unitMath()).not.toBe(mathjs);
    expect(() => mathjs.unit("1 foo")).toThrow();
  });

  afterAll(() => console.log(`unit-fuzz: ${tried} parse/evaluate cases tried`));
});
