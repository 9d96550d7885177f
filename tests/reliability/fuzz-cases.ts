/**
 * Case generators of the fuzz suite (tests/reliability/fuzz-*.test.ts): hostile
 * run-time values built from each formula's definition alone, so every registry
 * formula, present and future, is covered without per-formula code. Cases are
 * plain data (they print as a reproducer and can be posted to a worker by the
 * diagnostic script fuzz-diagnose.ts).
 */
import fc from "fast-check";
import type { AnyFormula } from "../../src/core/formula.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec, QuantityInput } from "../../src/core/spec.js";
import { DIMENSIONS, type DimensionName } from "../../src/units/dimensions.js";

export const FORMULAS: readonly AnyFormula[] = listFormulas();
export const IDS: readonly string[] = FORMULAS.map((f) => f.id);

export function specsOf(f: AnyFormula): [string, InputSpec][] {
  return Object.entries(f.definition.inputs as Record<string, InputSpec>);
}

function isChoice(s: InputSpec): s is Extract<InputSpec, { choices: readonly string[] }> {
  return "choices" in s;
}

// ---- numbers over the whole double range ----

/** The doubles where arithmetic misbehaves: zeros, subnormals, the ends of the range, non-finite values. */
export const SPECIAL_NUMBERS: readonly number[] = [
  0, -0, Number.MIN_VALUE, -Number.MIN_VALUE, 1e-321, -1e-321, 2.2250738585072014e-308, 1e-310, 1e-300, -1e-300, 1e-200,
  1e-150, 1e150, 1e200, 1e300, -1e300, Number.MAX_VALUE, -Number.MAX_VALUE, 1.7e308, -1.7e308, NaN, Infinity, -Infinity,
  1, -1, 0.5, 2 ** 53, 2 ** 53 + 2, 1 - 2 ** -53, 1 + 2 ** -52,
];

/** Sign times mantissa times a power of ten spread evenly over the exponent range (1e-323 .. 1.8e308). */
const logUniform = fc
  .tuple(fc.integer({ min: -323, max: 308 }), fc.double({ min: 1, max: 9.999, noNaN: true }), fc.boolean())
  .map(([e, m, neg]) => (neg ? -1 : 1) * m * 10 ** e);

export const hostileNumber: fc.Arbitrary<number> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...SPECIAL_NUMBERS) },
  { weight: 2, arbitrary: fc.double() },
  { weight: 3, arbitrary: logUniform },
);

/** A value near the example: scaled by a power of ten, sign flipped, or nudged by an ulp. */
function nearExample(ex: number): fc.Arbitrary<number> {
  return fc.oneof(
    fc.integer({ min: -330, max: 330 }).map((k) => ex * 10 ** k),
    fc.integer({ min: -40, max: 40 }).map((k) => ex * 10 ** k),
    fc.constantFrom(-ex, ex * (1 + 2 ** -52), ex * (1 - 2 ** -53), ex / 3),
  );
}

// ---- unit strings ----

const WRONG_UNITS = ["kg", "s", "A", "K", "mol", "cd", "rad", "J", "m^2", "1/m", "T", "V", "F"];
const GARBAGE = [
  "", " ", "abc", "5 furlongs", "((((", "1 m )", "m 1", "1e400 m", "1e-400 m", "-1e400 m", "1e400", "1e-400", "NaN", "Infinity",
  "-Infinity", "NaN m", "Infinity m", "undefined", "null", "0x10", "1_000", "1..2", "1 m + 2 m", "import('fs')",
  "createUnit('x', '2 m')", "__proto__", "constructor", "toString", "5 __proto__", "5 constructor", "\u0000", "\u202e5", "\ud800",
  "5\u00a0m", "5\u2003m", "\t5\n", "5 m^1e400", "5 m^-1e400", "5 m^99999", "1 degC", "-300 degC", "5 bit", "5 B", "1".repeat(201),
  "1e308 km", "1e-308 mm", "5 m/0", "[1, 2] m", "1 m; 2", "-0", " -0 m", "+5", "5e", ".5", "5.",
];
const PREFIXES = ["", "k", "M", "G", "T", "m", "u", "\u00b5", "\u03bc", "n", "p", "f", "c", "d", "E", "a", "y", "Y"];

/** Text for a quantity of this dimension: valid (SI or prefixed), wrong dimension, garbage, extreme exponents. */
function unitText(dim: DimensionName): fc.Arbitrary<string> {
  const unit = DIMENSIONS[dim].unit;
  // Prefixes read only on a single simple symbol ("m", "F", "ohm"), not on compound units ("F/m").
  const simple = /^[A-Za-z]+$/.test(unit);
  const num = fc.oneof(hostileNumber.map(String), fc.constantFrom("1", "0.2", "-3", "4.7", "1e3", "2.5e-7"));
  const space = fc.constantFrom(" ", "", "  ", "\t", " \u00a0");
  return fc.oneof(
    { weight: 3, arbitrary: fc.tuple(num, space, fc.constant(unit)).map(([n, s, u]) => `${n}${s}${u}`.trim()) },
    { weight: 3, arbitrary: fc.tuple(num, fc.constantFrom(...PREFIXES)).map(([n, p]) => (simple ? `${n} ${p}${unit}` : `${n} ${unit}`)) },
    { weight: 2, arbitrary: fc.tuple(num, fc.constantFrom(...WRONG_UNITS)).map(([n, u]) => `${n} ${u}`) },
    { weight: 2, arbitrary: fc.constantFrom(...GARBAGE) },
    { weight: 1, arbitrary: fc.string({ maxLength: 12 }) },
    { weight: 1, arbitrary: fc.tuple(fc.integer({ min: -500, max: 500 }), fc.constantFrom(unit, `k${unit}`, "m")).map(([e, u]) => `1e${e} ${u}`) },
  );
}

// ---- values for one input ----

/** Values of no acceptable type at all. */
const WRONG_TYPES: fc.Arbitrary<unknown> = fc.constantFrom<unknown>(
  null, true, false, {}, [], [1, 2, 3], [[1]], { value: 1, unit: "m" }, Object.create(null), 10n, () => 1,
);

/** A value for a scalar quantity input, given its example and the other inputs' examples of the same dimension. */
function quantityValue(spec: QuantityInput, peers: readonly number[]): fc.Arbitrary<unknown> {
  const ex = typeof spec.example === "number" ? spec.example : (spec.default ?? 1);
  const arbs: fc.WeightedArbitrary<unknown>[] = [
    { weight: 4, arbitrary: hostileNumber },
    { weight: 4, arbitrary: nearExample(ex) },
    { weight: 3, arbitrary: unitText(spec.dimension) },
    { weight: 1, arbitrary: WRONG_TYPES },
  ];
  // Vanishing sizes and distances, down to values whose square underflows (a point on a filament, touching loops).
  arbs.push({ weight: 1, arbitrary: fc.constantFrom(0, -0, 5e-324, 1e-321, 1e-300, 1e-200, 1e-160, -1e-200) });
  // Another input's value (equal radii, a point on a filament): where geometry degenerates.
  if (peers.length > 0) {
    arbs.push({
      weight: 2,
      arbitrary: fc.tuple(fc.constantFrom(...peers), fc.constantFrom(1, 1 + 2 ** -52, 1 - 2 ** -53, 1 + 1e-9, 1 - 1e-12)).map(([p, k]) => p * k),
    });
  }
  return fc.oneof(...arbs);
}

function vectorValue(spec: QuantityInput): fc.Arbitrary<unknown> {
  const component = fc.oneof(hostileNumber, unitText(spec.dimension), WRONG_TYPES);
  const ex = Array.isArray(spec.example) ? (spec.example as number[]) : [1, 0, 0];
  return fc.oneof(
    { weight: 3, arbitrary: fc.tuple(component, component, component) },
    { weight: 2, arbitrary: fc.tuple(fc.nat({ max: 2 }), hostileNumber).map(([i, v]) => ex.map((c, k) => (k === i ? v : c))) },
    { weight: 1, arbitrary: fc.array(component, { maxLength: 5 }) },
    { weight: 1, arbitrary: fc.constantFrom<unknown>([[1, 2, 3]], [[1], [2], [3]], "1, 2, 3", "[1, 2, 3] m", [1, 2, [3]], ex.map(String)) },
    { weight: 1, arbitrary: WRONG_TYPES },
  );
}

function choiceValue(choices: readonly string[]): fc.Arbitrary<unknown> {
  return fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...choices) },
    { weight: 2, arbitrary: fc.constantFrom<unknown>("", " ", "__proto__", "constructor", "toString", choices[0]!.toUpperCase(), ` ${choices[0]!}`, "round", 0, 1, null, [choices[0]], NaN) },
    { weight: 1, arbitrary: fc.string({ maxLength: 8 }) },
  );
}

/** A value for this input (the example, or something hostile). */
export function inputValue(f: AnyFormula, name: string): fc.Arbitrary<unknown> {
  const key = `${f.id}.${name}`;
  let arb = valueCache.get(key);
  if (arb === undefined) valueCache.set(key, (arb = buildValue(f, name)));
  return arb;
}

const valueCache = new Map<string, fc.Arbitrary<unknown>>();

function buildValue(f: AnyFormula, name: string): fc.Arbitrary<unknown> {
  const spec = (f.definition.inputs as Record<string, InputSpec>)[name]!;
  if (isChoice(spec)) return choiceValue(spec.choices);
  if (spec.vector) return vectorValue(spec);
  const peers = specsOf(f)
    .filter(([n, s]) => n !== name && !isChoice(s) && !s.vector && s.dimension === spec.dimension && typeof s.example === "number")
    .map(([, s]) => (s as QuantityInput).example as number);
  return quantityValue(spec, peers);
}

/** Example inputs of a formula (SI; defaults included). */
export function exampleOf(f: AnyFormula): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [name, spec] of specsOf(f)) {
    const v = spec.example ?? spec.default;
    if (v !== undefined) out[name] = Array.isArray(v) ? [...v] : v;
  }
  return out;
}

const EXTRA_KEYS = ["__proto__", "constructor", "toString", "valueOf", "hasOwnProperty", "bogus", "Area", "value", ""];

/**
 * An inputs object for the formula: its examples with some inputs replaced by
 * hostile values, some removed, extra or prototype-named keys added; or not an
 * object at all.
 */
export function inputsFor(f: AnyFormula): fc.Arbitrary<unknown> {
  let arb = inputsCache.get(f);
  if (arb === undefined) inputsCache.set(f, (arb = buildInputs(f)));
  return arb;
}

// One arbitrary per formula, built once: building them per drawn case cost more than running it.
const inputsCache = new Map<AnyFormula, fc.Arbitrary<unknown>>();

/** Mostly null: a rare event in a case (a removed input, an extra key). */
function rarely<T>(arb: fc.Arbitrary<T>, oneIn: number): fc.Arbitrary<T | null> {
  return fc.oneof({ weight: oneIn - 1, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: arb });
}

function buildInputs(f: AnyFormula): fc.Arbitrary<unknown> {
  const names = specsOf(f).map(([n]) => n);
  const record = fc
    .tuple(
      fc.tuple(...names.map((n) => fc.option(inputValue(f, n), { freq: 2 }))),
      rarely(fc.constantFrom(...names), 8),
      rarely(fc.tuple(fc.constantFrom(...EXTRA_KEYS), fc.oneof(hostileNumber, fc.constant<unknown>("1 m"), fc.constant<unknown>({}))), 8),
    )
    .map(([values, removed, extra]) => {
      const x = exampleOf(f);
      names.forEach((n, i) => {
        if (values[i] !== null) x[n] = values[i];
      });
      if (removed !== null) delete x[removed];
      // defineProperty: an own key named "__proto__" (as JSON.parse makes), not a prototype change.
      if (extra) Object.defineProperty(x, extra[0], { value: extra[1], enumerable: true, configurable: true, writable: true });
      return x as unknown;
    });
  return fc.oneof(
    { weight: 12, arbitrary: record },
    { weight: 1, arbitrary: fc.constantFrom<unknown>(null, undefined, 5, "area=1", [], [1, 2], true, () => 1) },
  );
}

/**
 * Inputs of plain numbers (and valid choice words): the examples with some
 * replaced by hostile doubles, vanishing values or another input's value. The
 * typed calls' fast path sees only such objects; anything else goes to its
 * careful path.
 */
export function numericInputsFor(f: AnyFormula): fc.Arbitrary<Record<string, unknown>> {
  let arb = numericCache.get(f);
  if (arb === undefined) numericCache.set(f, (arb = buildNumeric(f)));
  return arb;
}

const numericCache = new Map<AnyFormula, fc.Arbitrary<Record<string, unknown>>>();

function buildNumeric(f: AnyFormula): fc.Arbitrary<Record<string, unknown>> {
  const specs = specsOf(f);
  const value = ([name, spec]: [string, InputSpec]): fc.Arbitrary<unknown> => {
    if (isChoice(spec)) return fc.constantFrom(...spec.choices);
    const ex = typeof spec.example === "number" ? spec.example : (spec.default ?? 1);
    const peers = specs
      .filter(([n, s]) => n !== name && !isChoice(s) && !s.vector && s.dimension === spec.dimension && typeof s.example === "number")
      .map(([, s]) => (s as QuantityInput).example as number);
    const scalar = fc.oneof(
      hostileNumber,
      nearExample(ex),
      fc.constantFrom(0, -0, 5e-324, 1e-321, 1e-300, 1e-200, 1e-160),
      ...(peers.length ? [fc.tuple(fc.constantFrom(...peers), fc.constantFrom(1, 1 + 2 ** -52, 1 - 2 ** -53)).map(([p, k]) => p * k)] : []),
    );
    return spec.vector ? fc.tuple(scalar, scalar, scalar) : scalar;
  };
  return fc.tuple(...specs.map((e) => fc.option(value(e), { freq: 2 }))).map((vs) => {
    const x = exampleOf(f);
    specs.forEach(([n], i) => {
      if (vs[i] !== null) x[n] = vs[i];
    });
    return x;
  });
}

/** A formula id: a registry id mostly, sometimes something that is not one. */
export const hostileId: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 20, arbitrary: fc.constantFrom(...IDS) },
  { weight: 1, arbitrary: fc.constantFrom<unknown>("", "__proto__", "constructor", "toString", "hasOwnProperty", "nosuchformula", IDS[0]!.toUpperCase(), ` ${IDS[0]!}`, 5, null, undefined, {}, ["x"]) },
);

/** One arbitrary per formula, built once, drawn with equal weight (cheaper than a chain, which builds per case). */
export function perFormula<T>(build: (f: AnyFormula) => fc.Arbitrary<T>): fc.Arbitrary<T> {
  return fc.oneof(...FORMULAS.map(build));
}

export function formulaById(id: string): AnyFormula | undefined {
  return FORMULAS.find((f) => f.id === id);
}

/** A registry id with hostile inputs for that formula. */
export const evaluateCase: fc.Arbitrary<{ id: unknown; inputs: unknown }> = fc.oneof(
  { weight: 30, arbitrary: perFormula((f) => inputsFor(f).map((inputs) => ({ id: f.id as unknown, inputs }))) },
  { weight: 1, arbitrary: fc.tuple(hostileId, fc.constantFrom<unknown>({}, null, { area: 1 })).map(([id, inputs]) => ({ id, inputs })) },
);

// ---- design-tool options ----

/** Hostile counts and option values: NaN, objects, negatives, huge, fractional. */
export const hostileCount: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom<unknown>(NaN, Infinity, -Infinity, -1, 0, 1, 2, 3, 0.5, 2.5, 1e6 + 1, 4_000_001, 1e9, 1e300, -1e300, Number.MAX_VALUE, {}, [], "10", null, true, 5e-324),
  fc.integer({ min: -5, max: 40 }),
);

/** A span end: the input's example, or a hostile value up to +-1.7e308, or text. */
export function spanEnd(f: AnyFormula, name: string): fc.Arbitrary<unknown> {
  const declared = Object.hasOwn(f.definition.inputs, name);
  return fc.oneof(
    { weight: 3, arbitrary: declared ? inputValue(f, name) : hostileNumber },
    { weight: 1, arbitrary: fc.constantFrom<unknown>(1.7e308, -1.7e308, Number.MAX_VALUE, -Number.MAX_VALUE, 5e-324, 0, -0) },
  );
}

/** Names of scalar quantity inputs (those solve and sweep can vary). */
export function scalarNames(f: AnyFormula): string[] {
  return specsOf(f).filter(([, s]) => !isChoice(s) && !s.vector).map(([n]) => n);
}

/** A name to solve for or sweep: a scalar input mostly, sometimes a choice, a vector, or no input at all. */
export function targetName(f: AnyFormula): fc.Arbitrary<unknown> {
  const scalars = scalarNames(f);
  const others = specsOf(f).map(([n]) => n);
  return fc.oneof(
    { weight: 8, arbitrary: fc.constantFrom(...(scalars.length ? scalars : others)) },
    { weight: 1, arbitrary: fc.constantFrom<unknown>(...others, "__proto__", "constructor", "bogus", 5, null) },
  );
}
