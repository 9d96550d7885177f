import type { Domain, InputSpecs } from "./spec.js";

/** A formula's generated code: its compute-input class and, for scalar inputs, its fast path. */
export type GeneratedCode = readonly [Inputs: InputsClass, fast: ((x: unknown) => unknown) | undefined];

/**
 * Builds a straight-line checker + compute for a formula's scalar inputs, so a
 * typed call costs about as much as the bare arithmetic: generic loops over
 * input names defeat the engine's inlining and cost tens of times more
 * (measured in bench/). On any failed check it hands the call to `slow`, which
 * re-checks and throws the precise FormulaError.
 *
 * The fast path and the formula's Inputs class come from one `new Function`:
 * every formula pays it when its module loads, and each call has a fixed cost
 * besides parsing, so one call instead of two cuts what `import "emquant"`
 * spends generating code (scripts/startup-time.mjs). Not deferred to the first
 * call: the formula must exist as a function from the start, and a forwarding
 * function in front of a later-made fast path cost typed calls 8-15 % (one
 * shared forwarder: 3-15x, its call site turns megamorphic), measured with
 * bench/typed.ts.
 *
 * The fast path is undefined where the output has components or an input is a
 * vector or series (callers use the generic path, correct but slower); the
 * whole result is undefined where code generation is unavailable (a strict
 * Content-Security-Policy forbids `new Function`): callers then use inputsClass.
 *
 * The class: every object handed to compute and to the relations (typed calls,
 * evaluate, solve, tolerance, sweeps) is made by it, so they all share one
 * hidden class and the engine's property reads in compute stay monomorphic
 * (with one shape per caller they went polymorphic and a typed call slowed by a
 * third). A class rather than an object literal, so that no caller's
 * `{ area, gap, ... }` literal shares its hidden class (see InputList in
 * spec.ts). Names are plain identifiers (checked by defineFormula).
 */
export function generateCode(
  inputs: InputSpecs,
  compute: (x: never) => unknown,
  relations: readonly { holds: (x: never) => boolean }[],
  slow: (x: unknown) => unknown,
  componentOutput: boolean,
): GeneratedCode | undefined {
  const names = Object.keys(inputs);
  const choices: (readonly string[])[] = [];
  // The generated source is written without spaces: it ships in every bundle.
  const params = names.map((_, i) => `v${i}`).join();
  const fields = names.map((n, i) => `this.${n}=v${i}`).join(";");
  // An absent fast path is written as `undefined` in the returned pair.
  const fast = componentOutput ? undefined : fastPathSource(inputs, names, params, relations.length, choices);
  try {
    // eslint-disable-next-line @typescript-eslint/no-implied-eval
    return new Function("compute", "relations", "slow", "choices", `class Inputs{constructor(${params}){${fields}}}return[Inputs,${fast}]`)(
      compute, relations, slow, choices,
    ) as GeneratedCode;
  } catch {
    return undefined;
  }
}

// Source of the fast path as a function expression (using Inputs, compute,
// relations, slow, and the choice lists it appends to `choices`; `params` are
// the input variables v0,v1,... in order), or
// undefined for vector and series inputs.
function fastPathSource(inputs: InputSpecs, names: readonly string[], params: string, relations: number, choices: (readonly string[])[]): string | undefined {
  // Arrays go to the careful path too: an array has a numeric `length`, so a
  // formula whose only required input is named `length` (propagationDelay)
  // would otherwise accept [inputs] as its inputs.
  const lines: string[] = ['if(typeof x!="object"||x===null||Array.isArray(x))return slow(x)'];
  const numbers: string[] = [];
  const domainTests: string[] = [];
  for (let i = 0; i < names.length; i++) {
    const name = names[i]!;
    const spec = inputs[name]!;
    const key = JSON.stringify(name);
    lines.push(`let v${i}=x[${key}]`);
    if ("choices" in spec) {
      if (spec.default !== undefined) lines.push(`if(v${i}===undefined)v${i}=${JSON.stringify(spec.default)}`);
      lines.push(`if(!choices[${choices.length}].includes(v${i}))return slow(x)`);
      choices.push(spec.choices);
      continue;
    }
    if (spec.vector || spec.series) return undefined;
    if (spec.default !== undefined) lines.push(`if(v${i}===undefined)v${i}=${numberLiteral(spec.default)}`);
    numbers.push(`v${i}`);
    domainTests.push(...domainBounds(`v${i}`, spec.domain));
  }
  if (numbers.length > 0) {
    lines.push(`if(${numbers.map((v) => `typeof ${v}!="number"`).join("||")})return slow(x)`);
    // One finiteness test for all inputs: the sum is NaN or infinite when any input
    // is (a finite sum that overflows only sends the call down the careful path).
    // Per-input tests cost about a third more per call on a short formula (bench/typed.ts).
    lines.push(`const finite=${numbers.join("+")}`);
    lines.push(`if(finite-finite!==0${domainTests.map((t) => `||!(${t})`).join("")})return slow(x)`);
  }
  lines.push(`const o=new Inputs(${params})`);
  for (let i = 0; i < relations; i++) lines.push(`if(!relations[${i}].holds(o))return slow(x)`);
  lines.push("const r=compute(o)");
  lines.push('if(typeof r!="number"||r-r!==0)return slow(x)');
  lines.push("return r");
  return `function fast(x){${lines.join(";")}}`;
}

/** Constructor of a formula's compute-input objects: the values in declaration order. */
export type InputsClass = new (...values: unknown[]) => Record<string, unknown>;

/**
 * A formula's compute-input class where code generation is unavailable (strict
 * Content-Security-Policy): the same names stored in the same order still give
 * every instance one hidden class. Otherwise generateCode makes it.
 */
export function inputsClass(names: readonly string[]): InputsClass {
  return class Inputs {
    constructor(...values: unknown[]) {
      for (let i = 0; i < names.length; i++) (this as Record<string, unknown>)[names[i]!] = values[i];
    }
  } as unknown as InputsClass;
}

// String(v) reads back as v for every double ("NaN" and "Infinity" included: a
// non-finite default or bound makes the generated tests fail, and the careful
// path then reports the input); only -0 needs spelling out.
function numberLiteral(v: number): string {
  return Object.is(v, -0) ? "-0" : String(v);
}

/** Source text of the bound tests of a domain on variable `v` (finiteness is tested apart). */
export function domainBounds(v: string, d: Domain | undefined): string[] {
  const parts: string[] = [];
  if (d?.min !== undefined) parts.push(`${v}${d.minExclusive ? ">" : ">="}${numberLiteral(d.min)}`);
  if (d?.max !== undefined) parts.push(`${v}${d.maxExclusive ? "<" : "<="}${numberLiteral(d.max)}`);
  if (d?.integer) parts.push(`Number.isInteger(${v})`);
  return parts;
}
