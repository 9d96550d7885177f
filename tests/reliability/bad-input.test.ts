/**
 * Every formula in the registry (and the core fixtures) rejects bad input with
 * a FormulaError carrying a stable code and the input's name, through
 * `evaluate` and through the typed call alike; none returns NaN or Infinity or
 * throws anything else. Cases are derived from each definition, nothing per formula.
 */
import { afterAll, describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { type AnyFormula, domainRule } from "../../src/core/formula.js";
import type { QuantityInput } from "../../src/core/spec.js";
import { DIMENSIONS } from "../../src/units/dimensions.js";
import { fixtures } from "./fixtures.js";
import {
  catchFormulaError, domainsHold, ev, evLocal, exampleInputs, expectCode, failingRelations, filled, formulas,
  type Inputs, inDomain, isChoice, isFiniteValue, specsOf,
} from "./harness.js";

/**
 * Formulas with a known defect found by this suite, id -> the bug. Their test
 * is marked `it.fails` with the bug in its title; remove the entry once fixed.
 */
const KNOWN_BUGS: Readonly<Record<string, string>> = {};

let tried = 0;
const perFormula: string[] = [];

interface Target {
  f: AnyFormula;
  ex: Inputs;
  /** evaluate(), or its internals for fixtures outside the registry. */
  call: (inputs: unknown) => unknown;
  registered: boolean;
}

const targets: Target[] = [];
for (const f of formulas) {
  const ex = exampleInputs(f);
  if (ex) targets.push({ f, ex, call: (i) => ev(f, i), registered: true });
}
for (const f of fixtures) targets.push({ f, ex: exampleInputs(f)!, call: (i) => evLocal(f, i), registered: false });

const UNPARSABLE = ["abc", "5 furlongs", "((((", "", "   ", "1 m )", "m 1", "import('fs')", "createUnit('x')", "\u0000", "5 \u00b5\u00b5", "1 m + 2 m", "[1, 2] m", "NaN", "Infinity", "1".repeat(10_000) + " m"];
const WRONG_TYPES: readonly unknown[] = [{}, [1], [], true, false, null, () => 1, 10n, Symbol("x")];
const ABSURD = [1e308, -1e308, 1e-308, -1e-308, 5e-324];

/** Values just outside an input's domain, derived from the domain. */
function outsideDomain(spec: QuantityInput): number[] {
  const d = spec.domain;
  if (!d) return [];
  const out: number[] = [];
  if (d.min !== undefined) {
    out.push(d.min - Math.max(1, Math.abs(d.min)), -1e300);
    if (d.minExclusive) out.push(d.min);
    if (d.min > 0) out.push(0);
  }
  if (d.max !== undefined) {
    out.push(d.max + Math.max(1, Math.abs(d.max)), 1e300);
    if (d.maxExclusive) out.push(d.max);
  }
  if (d.integer) {
    const ex = typeof spec.example === "number" ? spec.example : (d.min ?? 0) + 1;
    out.push(ex + 0.5);
  }
  return out.filter((v) => !inDomain(v, d));
}

/** A unit whose dimension differs from the input's. */
function wrongUnit(spec: QuantityInput): string {
  return spec.dimension === "Mass" ? "5 m" : "5 kg";
}

function siUnit(spec: QuantityInput): string {
  return DIMENSIONS[spec.dimension].unit;
}

function checkTarget(t: Target): void {
  const { f, ex, call } = t;
  const id = f.id;
  let n = 0;
  const expectEval = (inputs: unknown, code: FormulaError["code"], input: string | undefined, what: string): FormulaError => {
    n++;
    return expectCode(() => call(inputs), code, input, `${id} evaluate: ${what}`);
  };
  const expectTyped = (inputs: unknown, code: FormulaError["code"], input: string | undefined, what: string): FormulaError => {
    n++;
    return expectCode(() => (f as (x: unknown) => unknown)(inputs), code, input, `${id} typed call: ${what}`);
  };
  const with1 = (name: string, v: unknown): Inputs => ({ ...ex, [name]: v });

  // The base case works, so every failure below is due to the one change.
  const base = call(ex);
  expect(isFiniteValue(typeof base === "object" && base !== null && "value" in base ? (base as { value: unknown }).value : base)).toBe(true);

  // The inputs object itself.
  for (const bad of [null, undefined, 5, "area", [], [ex]]) {
    expectEval(bad, "wrong_type", "inputs", `inputs ${String(bad)}`);
    expectTyped(bad, "wrong_type", "inputs", `inputs ${String(bad)}`);
  }
  if (t.registered) {
    for (const bad of ["__proto__", "constructor", "toString", "hasOwnProperty", "", `${id} `, id.toUpperCase()]) {
      n++;
      expectCode(() => evaluate(bad, ex), "unknown_formula", undefined, `${id}: formula id ${JSON.stringify(bad)}`);
    }
  }

  // Unknown names, including Object.prototype's, as own properties (JSON.parse).
  for (const key of ["notAnInput", "__proto__", "constructor", "toString", "valueOf", "hasOwnProperty"]) {
    const inputs = JSON.parse(JSON.stringify(ex).replace(/^\{/, `{${JSON.stringify(key)}: 1,`)) as Inputs;
    expect(Object.hasOwn(inputs, key)).toBe(true);
    expectEval(inputs, "unknown_input", key, `unknown input ${key}`);
  }
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();

  for (const [name, spec] of specsOf(f)) {
    // Missing.
    const without = { ...ex };
    delete without[name];
    if (spec.default === undefined) {
      expectEval(without, "missing_input", name, `missing ${name}`);
      expectTyped(without, "missing_input", name, `missing ${name}`);
      expectEval(with1(name, undefined), "missing_input", name, `undefined ${name}`);
    } else {
      n++;
      const a = call(without);
      const b = call(with1(name, spec.default));
      expect(a, `${id}: omitted ${name} takes its default`).toEqual(b);
    }

    if (isChoice(spec)) {
      for (const bad of ["not-a-choice", "", spec.choices[0]!.toUpperCase() + "x", ` ${spec.choices[0]}`, "__proto__", "toString"]) {
        const e = expectEval(with1(name, bad), "out_of_domain", name, `choice ${JSON.stringify(bad)}`);
        expect(e.rule).toContain(spec.choices[0]);
        expectTyped(with1(name, bad), "out_of_domain", name, `choice ${JSON.stringify(bad)}`);
      }
      for (const bad of [1, NaN, true, null, {}, [spec.choices[0]]]) {
        expectEval(with1(name, bad), "wrong_type", name, `choice given ${String(bad)}`);
        expectTyped(with1(name, bad), "wrong_type", name, `choice given ${String(bad)}`);
      }
      continue;
    }

    const unit = siUnit(spec);
    // Scalar-level cases; for vectors and series they are applied to one component (one sample).
    const place = (v: unknown): unknown => {
      if (!spec.vector && !spec.series) return v;
      const c = [...(ex[name] as number[])];
      c[1] = v as number;
      return c;
    };
    const where = spec.vector || spec.series ? `${name}[1]` : name;

    for (const v of [NaN, Infinity, -Infinity]) {
      expectEval(with1(name, place(v)), "not_finite", name, `${where} = ${v}`);
      expectTyped(with1(name, place(v)), "not_finite", name, `${where} = ${v}`);
    }
    for (const s of ["1e400", "-1e999"]) expectEval(with1(name, place(s)), "not_finite", name, `${where} = "${s}"`);
    if (unit !== "") {
      for (const s of [`1e400 ${unit}`, `-1e999999 ${unit}`]) expectEval(with1(name, place(s)), "not_finite", name, `${where} = "${s}"`);
    }

    for (const v of outsideDomain(spec)) {
      const e = expectEval(with1(name, place(v)), "out_of_domain", name, `${where} = ${v} outside ${domainRule(spec.domain!)}`);
      expect(e.rule).toBe(domainRule(spec.domain!));
      expect(e.message).toContain(domainRule(spec.domain!));
      expectTyped(with1(name, place(v)), "out_of_domain", name, `${where} = ${v}`);
      if (unit !== "") expectEval(with1(name, place(`${v} ${unit}`)), "out_of_domain", name, `${where} = "${v} ${unit}"`);
      expectEval(with1(name, place(String(v))), "out_of_domain", name, `${where} = "${v}"`);
    }

    const e = expectEval(with1(name, place(wrongUnit(spec))), "wrong_dimension", name, `${where} = ${wrongUnit(spec)}`);
    expect(e.expected).toBe(spec.dimension);
    expect(e.received).not.toBe(spec.dimension);
    expectEval(with1(name, place("5 bit")), "unparsable", name, `${where} = "5 bit"`);

    for (const s of UNPARSABLE) expectEval(with1(name, place(s)), "unparsable", name, `${where} = ${JSON.stringify(s.slice(0, 20))}`);

    for (const v of WRONG_TYPES) {
      expectEval(with1(name, place(v)), "wrong_type", name, `${where} = ${typeof v} ${Array.isArray(v) ? "array" : ""}`);
      expectTyped(with1(name, place(v)), "wrong_type", name, `${where} = ${typeof v}`);
    }
    expectTyped(with1(name, place("1")), "wrong_type", name, `${where} = "1" in the typed call`);

    if (spec.vector) {
      for (const bad of [[], [1, 2], [1, 2, 3, 4], 5, "1 m", { 0: 1, 1: 2, 2: 3, length: 3 }, new Float64Array(3), [[1], 2, 3]]) {
        const code = Array.isArray(bad) && bad.length === 3 ? "wrong_type" : "wrong_type";
        expectEval(with1(name, bad), code, name, `${name} = ${JSON.stringify(bad)}`);
        expectTyped(with1(name, bad), code, name, `${name} = ${JSON.stringify(bad)}`);
      }
    }
    if (spec.series) {
      // Not an array: wrong_type; an array outside the length bounds: out_of_domain; both name the input.
      for (const bad of [5, "1 m", { 0: 1, 1: 2, length: 2 }, new Float64Array(3)]) {
        expectEval(with1(name, bad), "wrong_type", name, `${name} = ${JSON.stringify(bad)}`);
        expectTyped(with1(name, bad), "wrong_type", name, `${name} = ${JSON.stringify(bad)}`);
      }
      for (const length of [spec.series.minLength - 1, spec.series.maxLength + 1]) {
        const bad = new Array<number>(Math.max(0, length)).fill(0);
        expectEval(with1(name, bad), "out_of_domain", name, `${name} of ${length} samples`);
        expectTyped(with1(name, bad), "out_of_domain", name, `${name} of ${length} samples`);
      }
    }

    // Absurd magnitudes: a FormulaError (domain or range) or a finite value, nothing else.
    for (const v of ABSURD) {
      for (const [how, run] of [["evaluate", call], ["typed call", f as (x: unknown) => unknown]] as const) {
        n++;
        let r: unknown;
        try {
          r = run(with1(name, place(v)));
        } catch (err) {
          const fe = catchFormulaError(() => { throw err; }, `${id} ${how}: ${where} = ${v}`);
          expect(["out_of_domain", "out_of_range"], `${id} ${how}: ${where} = ${v}: ${fe.message}`).toContain(fe.code);
          continue;
        }
        const value = typeof r === "object" && r !== null && "value" in r ? (r as { value: unknown }).value : r;
        expect(isFiniteValue(value), `${id} ${how}: ${where} = ${v} gave ${String(value)}`).toBe(true);
      }
    }
  }

  // Geometry contradictions: break each relation from the example and expect its rule.
  n += checkRelations(t);
  tried += n;
  perFormula.push(`${id}: ${n}`);
}

/** Example-based inputs that break a relation: scale or swap the inputs its rule names. */
function breakers(t: Target, rule: string): Inputs[] {
  const { f, ex } = t;
  const named = specsOf(f).filter(([n, s]) => !isChoice(s) && new RegExp(`\\b${n}\\b`).test(rule)).map(([n]) => n);
  const out: Inputs[] = [];
  for (let i = 0; i < named.length; i++) {
    for (let j = i + 1; j < named.length; j++) out.push({ ...ex, [named[i]!]: ex[named[j]!], [named[j]!]: ex[named[i]!] });
  }
  const times = (v: unknown, k: number): unknown => (Array.isArray(v) ? v.map((c: number) => c * k) : (v as number) * k);
  for (const n of named) {
    for (const k of [0.5, 2, 0.1, 10, 1e-3, 1e3, 1e-6, 1e6, 1e9, 0.99, 1.01, -1, 0]) out.push({ ...ex, [n]: times(ex[n], k) });
  }
  // Rules about coincidence (a point on a wire): one input copied to another, with a third set to zero.
  for (const a of named) {
    for (const b of named) {
      if (a === b) continue;
      const copied = { ...ex, [b]: ex[a] };
      out.push(copied);
      for (const z of named) if (z !== a && z !== b) out.push({ ...copied, [z]: times(ex[z], 0) });
    }
  }
  return out;
}

function checkRelations(t: Target): number {
  const rel = t.f.definition.relations ?? [];
  let n = 0;
  for (const r of rel) {
    const candidate = breakers(t, r.rule).find((x) => domainsHold(t.f, x) && failingRelations(t.f, x).includes(r.rule));
    if (!candidate) {
      unbroken.push(`${t.f.id}: "${r.rule}"`);
      continue;
    }
    const expectedRule = failingRelations(t.f, candidate)[0]!;
    for (const [how, run] of [["evaluate", t.call], ["typed call", t.f as (x: unknown) => unknown]] as const) {
      n++;
      const e = expectCode(() => run(candidate), "out_of_domain", undefined, `${t.f.id} ${how}: breaking "${r.rule}" with ${JSON.stringify(filled(t.f, candidate))}`);
      expect(e.rule).toBe(expectedRule);
      expect(e.message).toContain(expectedRule);
    }
  }
  return n;
}
const unbroken: string[] = [];

describe("bad input is rejected with a stable code by every registry formula", () => {
  it("the registry has formulas to walk, each with example inputs", () => {
    expect(formulas.length).toBeGreaterThan(0);
    const lacking = formulas.filter((f) => exampleInputs(f) === undefined).map((f) => f.id);
    expect(lacking, "formulas with an input lacking an example").toEqual([]);
  });

  for (const t of targets) {
    const bug = KNOWN_BUGS[t.f.id];
    if (bug) it.fails(`${t.f.id} rejects bad input (known bug: ${bug})`, () => checkTarget(t));
    else it(`${t.f.id} rejects every kind of bad input with its code and input name`, () => checkTarget(t));
  }

  afterAll(() => {
    console.log(`bad-input: ${tried} cases tried over ${targets.length} formulas (${perFormula.join(", ")})`);
    if (unbroken.length) console.log(`bad-input: relations no example-based change could break: ${unbroken.join("; ")}`);
  });
});
