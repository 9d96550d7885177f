import type { Domain, InputSpecs } from "./spec.js";

/**
 * Builds a straight-line checker + compute for a formula's scalar inputs, so a
 * typed call costs about as much as the bare arithmetic: generic loops over
 * input names defeat the engine's inlining and cost tens of times more
 * (measured in bench/). On any failed check it hands the call to `slow`, which
 * re-checks and throws the precise FormulaError.
 *
 * Returns undefined where code generation is unavailable (a strict
 * Content-Security-Policy forbids `new Function`) or the formula has vector
 * inputs; callers then use the generic path, which is correct but slower.
 */
export function buildFastPath(
  inputs: InputSpecs,
  compute: (x: never) => unknown,
  relations: readonly { holds: (x: never) => boolean }[],
  slow: (x: unknown) => unknown,
): ((x: unknown) => unknown) | undefined {
  const names = Object.keys(inputs);
  const lines: string[] = ['if (typeof x !== "object" || x === null) return slow(x);'];
  const choices: (readonly string[])[] = [];
  for (let i = 0; i < names.length; i++) {
    const name = names[i]!;
    const spec = inputs[name]!;
    if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name)) return undefined;
    const key = JSON.stringify(name);
    lines.push(`let v${i} = x[${key}];`);
    if ("choices" in spec) {
      if (spec.default !== undefined) lines.push(`if (v${i} === undefined) v${i} = ${JSON.stringify(spec.default)};`);
      lines.push(`if (!choices[${choices.length}].includes(v${i})) return slow(x);`);
      choices.push(spec.choices);
      continue;
    }
    if (spec.vector) return undefined;
    if (spec.default !== undefined) lines.push(`if (v${i} === undefined) v${i} = ${numberLiteral(spec.default)};`);
    lines.push(`if (typeof v${i} !== "number" || !(${domainTest(`v${i}`, spec.domain)})) return slow(x);`);
  }
  // "$fast" gives `o` a hidden class of its own: the definition's `inputs` literal
  // has exactly these keys, and sharing its class would box every number stored
  // here (see src/tools/sweep.ts; measured 8.2 -> 7.5 ns per typed call).
  lines.push(`const o = { $fast: 0, ${names.map((n, i) => `${JSON.stringify(n)}: v${i}`).join(", ")} };`);
  relations.forEach((_, i) => lines.push(`if (!relations[${i}].holds(o)) return slow(x);`));
  lines.push("const r = compute(o);");
  lines.push('if (typeof r !== "number" || r - r !== 0) return slow(x);');
  lines.push("return r;");
  try {
    // eslint-disable-next-line @typescript-eslint/no-implied-eval
    const factory = new Function("compute", "relations", "slow", "choices", `return function fast(x) {\n${lines.join("\n")}\n};`);
    return factory(compute, relations, slow, choices) as (x: unknown) => unknown;
  } catch {
    return undefined;
  }
}

function numberLiteral(v: number): string {
  if (!Number.isFinite(v)) throw new Error(`non-finite default ${v}`);
  return Object.is(v, -0) ? "-0" : String(v);
}

// The test is written so NaN fails every comparison and Infinity fails the bound.
function domainTest(v: string, d: Domain | undefined): string {
  const parts: string[] = [];
  if (d?.min !== undefined) parts.push(`${v} ${d.minExclusive ? ">" : ">="} ${numberLiteral(d.min)}`);
  else parts.push(`${v} > -Infinity`);
  if (d?.max !== undefined) parts.push(`${v} ${d.maxExclusive ? "<" : "<="} ${numberLiteral(d.max)}`);
  else parts.push(`${v} < Infinity`);
  if (d?.integer) parts.push(`Number.isInteger(${v})`);
  return parts.join(" && ");
}
