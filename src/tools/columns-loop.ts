import { FormulaError } from "../core/errors.js";
import { domainBounds } from "../core/fast-path.js";
import type { AnyFormula } from "../core/formula.js";
import { inDomain } from "../core/domain.js";
import type { Domain } from "../core/spec.js";
import type { ScanCondition } from "./sweep-points.js";
import { rowCode } from "./columns-read.js";

/*
 * The row loop of evaluateColumns: per row the column inputs are stored into
 * the formula's one compute-input object, checked (finite, domain, choices,
 * relations), compute runs, the result is checked and stored, and the notes'
 * conditions are counted, all in one pass. The result of rows [a, b) depends
 * only on those rows: the loop reads and writes nothing outside them.
 */

/** The loop's state. `o` is the formula's compute-input object with the fixed inputs set. */
export interface Rows {
  readonly o: Record<string, unknown>;
  readonly compute: (x: unknown) => unknown;
  readonly holds: readonly ((x: unknown) => boolean)[];
  readonly numbers: readonly (Float64Array | readonly number[])[];
  readonly choices: readonly (readonly unknown[])[];
  readonly choiceSets: readonly ReadonlySet<string>[];
  /** Per-row codes of unreadable cells; undefined when there are none. */
  readonly pre: Uint8Array | undefined;
  readonly values: Float64Array;
  /** One array per output component; empty for scalar outputs. */
  readonly components: readonly Float64Array[];
  readonly errors: Uint8Array;
  readonly conditions: readonly ScanCondition[];
  /** Per condition: rows that raised it, the worst row (-1 none) and its measure. */
  readonly counts: Float64Array;
  readonly index: Float64Array;
  readonly measure: Float64Array;
}

/** Column inputs in declaration order: name, domain, and whether it is a choice column. */
export type ColumnShape = readonly (readonly [name: string, domain: Domain | undefined, choice: boolean])[];

type Loop = (s: Rows, from: number, to: number, out: { at: number; thrown: unknown }) => void;
const loops = new WeakMap<AnyFormula, Map<string, Loop | null>>();

const NOT_FINITE = /* @__PURE__ */ rowCode("not_finite");
const OUT_OF_DOMAIN = /* @__PURE__ */ rowCode("out_of_domain");
const OUT_OF_RANGE = /* @__PURE__ */ rowCode("out_of_range");

/**
 * Runs rows [from, to). A FormulaError thrown by compute or a relation marks
 * that row with its code and the loop resumes after it (no try/catch per
 * row: one around the loop, which costs nothing per row).
 */
export function runRows(formula: AnyFormula, s: Rows, shape: ColumnShape, from: number, to: number): void {
  const loop = generatedLoop(formula, s, shape) ?? generalLoop(shape);
  const out = { at: -1, thrown: undefined as unknown };
  for (let start = from; start < to;) {
    out.at = -1;
    loop(s, start, to, out);
    if (out.at < 0) break;
    if (!(out.thrown instanceof FormulaError)) throw out.thrown;
    const k = out.at;
    s.errors[k] = rowCode(out.thrown.code);
    s.values[k] = NaN;
    for (const c of s.components) c[k] = NaN;
    start = k + 1;
  }
}

/**
 * The loop generated for one formula and set of column inputs, made once and
 * reused (as the sweep's point loops, sweep-points.ts): literal property
 * stores and domain bounds, relations and conditions called one by one, so
 * the engine runs it like a hand-written loop (bench/columns.ts).
 * Checks in declaration order give the code `evaluate` gives for the same
 * row: per input not_finite before out_of_domain, then the relations.
 */
function generatedLoop(formula: AnyFormula, s: Rows, shape: ColumnShape): Loop | undefined {
  const nc = s.components.length;
  // The array kinds are part of the key: one loop reading both Float64Arrays and
  // number arrays through the same access would be polymorphic there.
  const kinds = s.numbers.map((d) => (d instanceof Float64Array ? "f" : "a")).join("");
  const key = `${shape.map(([n, , c]) => (c ? `${n}?` : n)).join(",")}|${kinds}|${nc}|${s.pre ? 1 : 0}|${s.conditions.length}`;
  let byKey = loops.get(formula);
  if (byKey === undefined) loops.set(formula, (byKey = new Map()));
  const hit = byKey.get(key);
  if (hit !== undefined) return hit ?? undefined;
  const count = (n: number, f: (i: number) => string, sep = "\n"): string => Array.from({ length: n }, (_, i) => f(i)).join(sep);
  const reads: string[] = [];
  const fast: string[] = [];
  const ordered: string[] = [];
  const nums: string[] = [];
  let ni = 0;
  let ci = 0;
  for (const [name, domain, choice] of shape) {
    if (choice) {
      const v = `q${ci}`;
      reads.push(`const ${v} = Q${ci}[i]; o.${name} = ${v};`);
      fast.push(`!K${ci}.has(${v})`);
      ordered.push(`if (!K${ci}.has(${v})) code = ${OUT_OF_DOMAIN};`);
      ci++;
      continue;
    }
    const v = `a${ni}`;
    reads.push(`const ${v} = N${ni}[i]; o.${name} = ${v};`);
    nums.push(v);
    const bounds = domainBounds(v, domain);
    for (const b of bounds) fast.push(`!(${b})`);
    ordered.push(`if (${v} - ${v} !== 0) code = ${NOT_FINITE}; else if (${["false", ...bounds.map((b) => `!(${b})`)].join(" || ")}) code = ${OUT_OF_DOMAIN};`);
    ni++;
  }
  // One finiteness test for all numeric inputs: their sum is finite only if each is (an overflowing sum goes to the ordered checks, which find nothing).
  const sum = nums.length > 0 ? `const sum = ${nums.join(" + ")};` : "";
  if (nums.length > 0) fast.unshift("sum - sum !== 0");
  const miss = `values[i] = NaN; ${count(nc, (c) => `C${c}[i] = NaN;`, " ")}`;
  const check = (c: number): string => {
    const cond = s.conditions[c]!;
    const record = cond.measure !== undefined
      ? `const m = m${c}(o, r); if (i${c} < 0 || m > b${c}) { i${c} = i; if (m > b${c}) b${c} = m; }`
      : `if (i${c} < 0) i${c} = i;`;
    return cond.when !== undefined ? `if (w${c}(o, r)) { n${c}++; ${record} }` : `{ n${c}++; ${record} }`;
  };
  const store = nc === 0
    ? `if (typeof r !== "number" || r - r !== 0) { errors[i] = ${OUT_OF_RANGE}; ${miss} continue; }
        values[i] = r;`
    : `if (!Array.isArray(r) || r.length < ${nc}) { errors[i] = ${OUT_OF_RANGE}; ${miss} continue; }
        ${count(nc, (c) => `const r${c} = r[${c}];`, " ")}
        if (${count(nc, (c) => `r${c} - r${c} !== 0`, " || ")}) { errors[i] = ${OUT_OF_RANGE}; ${miss} continue; }
        ${count(nc, (c) => `C${c}[i] = r${c};`, " ")} values[i] = r0;`;
  const body = `
    const o = s.o, compute = s.compute, values = s.values, errors = s.errors, pre = s.pre;
    ${count(s.numbers.length, (k) => `const N${k} = s.numbers[${k}];`, " ")}
    ${count(s.choices.length, (k) => `const Q${k} = s.choices[${k}], K${k} = s.choiceSets[${k}];`, " ")}
    ${count(s.holds.length, (r) => `const h${r} = s.holds[${r}];`, " ")}
    ${count(nc, (c) => `const C${c} = s.components[${c}];`, " ")}
    ${count(s.conditions.length, (c) => `const w${c} = s.conditions[${c}].when, m${c} = s.conditions[${c}].measure; let n${c} = s.counts[${c}], i${c} = s.index[${c}], b${c} = s.measure[${c}];`)}
    let i = from;
    try {
      for (; i < to; i++) {
        ${s.pre ? `if (pre[i] !== 0) { errors[i] = pre[i]; ${miss} continue; }` : ""}
        ${reads.join("\n        ")}
        ${sum}
        if (${fast.length ? fast.join(" || ") : "false"}) {
          let code = 0;
          ${ordered.map((t, k) => (k === 0 ? t : `if (code === 0) ${t}`)).join("\n          ")}
          if (code !== 0) { errors[i] = code; ${miss} continue; }
        }
        if (${["false", ...s.holds.map((_, r) => `!h${r}(o)`)].join(" || ")}) { errors[i] = ${OUT_OF_DOMAIN}; ${miss} continue; }
        const r = compute(o);
        ${store}
        errors[i] = 0;
        ${count(s.conditions.length, check, "\n        ")}
      }
    } catch (e) {
      out.at = i;
      out.thrown = e;
    }
    ${count(s.conditions.length, (c) => `s.counts[${c}] = n${c}; s.index[${c}] = i${c}; s.measure[${c}] = b${c};`)}`;
  let made: Loop | null;
  try {
    // eslint-disable-next-line @typescript-eslint/no-implied-eval
    made = new Function("s", "from", "to", "out", body) as Loop;
  } catch {
    made = null;
  }
  byKey.set(key, made);
  return made ?? undefined;
}

/**
 * The loop where code cannot be generated (strict Content-Security-Policy):
 * the same checks, codes and notes through variable keys and arrays.
 */
function generalLoop(shape: ColumnShape): Loop {
  return (s, from, to, out) => {
    const { o, values, errors, components, conditions } = s;
    let i = from;
    try {
      for (; i < to; i++) {
        const miss = (code: number): void => {
          errors[i] = code;
          values[i] = NaN;
          for (const c of components) c[i] = NaN;
        };
        if (s.pre !== undefined && s.pre[i] !== 0) {
          miss(s.pre[i]!);
          continue;
        }
        let code = 0;
        let ni = 0;
        let ci = 0;
        for (const [name, domain, choice] of shape) {
          if (choice) {
            const q = s.choices[ci]![i];
            o[name] = q;
            if (code === 0 && !s.choiceSets[ci]!.has(q as string)) code = OUT_OF_DOMAIN;
            ci++;
          } else {
            const a = s.numbers[ni]![i]!;
            o[name] = a;
            if (code === 0 && a - a !== 0) code = NOT_FINITE;
            else if (code === 0 && !inDomain(a, domain)) code = OUT_OF_DOMAIN;
            ni++;
          }
        }
        for (let r = 0; code === 0 && r < s.holds.length; r++) if (!s.holds[r]!(o)) code = OUT_OF_DOMAIN;
        if (code !== 0) {
          miss(code);
          continue;
        }
        const r = s.compute(o);
        const nc = components.length;
        if (nc === 0 ? typeof r !== "number" || r - r !== 0 : !Array.isArray(r) || r.length < nc || r.slice(0, nc).some((v: number) => v - v !== 0)) {
          miss(OUT_OF_RANGE);
          continue;
        }
        if (nc === 0) values[i] = r as number;
        else {
          for (let c = 0; c < nc; c++) components[c]![i] = (r as number[])[c]!;
          values[i] = (r as number[])[0]!;
        }
        errors[i] = 0;
        for (let c = 0; c < conditions.length; c++) {
          const cond = conditions[c]!;
          if (cond.when !== undefined && !cond.when(o as never, r as never)) continue;
          s.counts[c]!++;
          const m = cond.measure === undefined ? -Infinity : cond.measure(o as never, r as never);
          if (s.index[c]! < 0 || m > s.measure[c]!) {
            s.index[c] = i;
            if (m > s.measure[c]!) s.measure[c] = m;
          }
        }
      }
    } catch (e) {
      out.at = i;
      out.thrown = e;
    }
  };
}
