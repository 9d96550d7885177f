/**
 * The one verdict of the fuzz suite on a call: it returned a result in which
 * every number is finite and no text says NaN, Infinity or undefined, or it
 * threw a FormulaError with a public code and such a message; and it ran no more
 * loop iterations than its bound. Violations are collected, not thrown, so one
 * run reports every class of failure with a reproducer for each (see Ledger).
 */
import { ERROR_CODES, FormulaError } from "../../src/core/errors.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

const CODES: ReadonlySet<string> = new Set(ERROR_CODES);

/** Words that betray a non-finite number or a missing field in text meant for people. */
export const FORBIDDEN = /NaN|Infinity|undefined/;

/**
 * Loop iterations one formula evaluation may run, all loops together. The
 * library's iterations (Carlson's elliptic integrals: under 20 duplications to
 * double precision; series; root finding; adaptive quadrature) are a few
 * hundred per evaluation; 1e5 leaves room and still stops a loop that only
 * ends by running out of a large cap. Tool calls get this times the number of
 * evaluations their request allows (evaluationsOf).
 */
export const LOOP_BOUND_PER_EVALUATION = 100_000;

/** Strings found in a case (its user text), to be told apart from what the library wrote. */
export function userStrings(value: unknown, out: Set<string> = new Set(), depth = 0): Set<string> {
  if (depth > 6) return out;
  if (typeof value === "string") out.add(value);
  else if (Array.isArray(value)) for (const v of value) userStrings(v, out, depth + 1);
  else if (typeof value === "object" && value !== null) {
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      userStrings(v, out, depth + 1);
    }
  }
  return out;
}

/**
 * Text with the user's own strings removed where the library quotes them
 * ("could not be read: \"NaN m\""): echoing what the user typed is not the
 * library writing NaN. Quoted forms only, as FormulaError quotes them (JSON,
 * long text cut to 57 characters and "...").
 */
export function withoutEchoes(text: string, strings: ReadonlySet<string>): string {
  let t = text;
  for (const s of strings) {
    if (!FORBIDDEN.test(s)) continue;
    const quoted = [JSON.stringify(s), JSON.stringify(s.length > 60 ? `${s.slice(0, 57)}...` : s)];
    // Also as they read inside a JSON document (a CLI --json answer, an HTTP body).
    for (const q of [...quoted, ...quoted.map((x) => JSON.stringify(x).slice(1, -1))]) t = t.split(q).join('"…"');
  }
  return t;
}

/**
 * Violations in a returned value: non-finite numbers and forbidden words in
 * strings, with their paths. `nanAllowed(path, index)` marks where a NaN is a
 * documented marker (a sweep's points not computed).
 */
export function resultViolations(
  value: unknown,
  strings: ReadonlySet<string>,
  nanAllowed: (path: string, index: number) => boolean = () => false,
  path = "result",
  depth = 0,
  out: string[] = [],
): string[] {
  if (out.length > 5) return out;
  if (depth > 12) {
    out.push(`${path}: nested deeper than 12`);
    return out;
  }
  if (typeof value === "number") {
    if (!Number.isFinite(value)) out.push(`${path} = ${String(value)}`);
  } else if (typeof value === "string") {
    const t = withoutEchoes(value, strings);
    if (FORBIDDEN.test(t)) out.push(`${path} says ${JSON.stringify(t.length > 160 ? `${t.slice(0, 157)}...` : t)}`);
  } else if (value instanceof Float64Array || value instanceof Float32Array) {
    for (let i = 0; i < value.length && out.length <= 5; i++) {
      if (!Number.isFinite(value[i]!) && !(Number.isNaN(value[i]!) && nanAllowed(path, i))) out.push(`${path}[${i}] = ${value[i]}`);
    }
  } else if (ArrayBuffer.isView(value)) {
    // Integer typed arrays (a sweep's computed mask) hold finite values by construction.
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => resultViolations(v, strings, nanAllowed, `${path}[${i}]`, depth + 1, out));
  } else if (typeof value === "object" && value !== null) {
    for (const [k, v] of Object.entries(value)) resultViolations(v, strings, nanAllowed, `${path}.${k}`, depth + 1, out);
  } else if (value === undefined && depth === 0) {
    out.push(`${path} is undefined`);
  }
  return out;
}

/** Violations in a thrown value: anything but a FormulaError with a public code and a clean message. */
export function errorViolations(e: unknown, strings: ReadonlySet<string>): string[] {
  if (!(e instanceof FormulaError)) {
    const name = (e as Error)?.constructor?.name ?? typeof e;
    return [`threw ${name}: ${String((e as Error)?.message ?? e).slice(0, 160)}`];
  }
  const out: string[] = [];
  if (!CODES.has(e.code)) out.push(`FormulaError with unknown code ${String(e.code)}`);
  const t = withoutEchoes(e.message, strings);
  if (FORBIDDEN.test(t)) out.push(`error message says ${JSON.stringify(t.slice(0, 200))}`);
  if (e.message.length === 0) out.push("empty error message");
  return out;
}

/** Loop-bound violations since the last resetLoopCount(). */
export function loopViolations(evaluations: number): string[] {
  const { total, largest } = loopCount();
  const bound = LOOP_BOUND_PER_EVALUATION * Math.max(1, evaluations);
  return total > bound ? [`ran ${total} loop iterations (longest loop ${largest}); bound ${bound}`] : [];
}

export interface Verdict {
  readonly violations: string[];
  /** The FormulaError code, when the call threw one. */
  readonly code?: string;
  readonly result?: unknown;
}

/** Run one synchronous call and judge it (result, error and loop count). */
export function judge(
  call: () => unknown,
  input: unknown,
  evaluations = 1,
  nanAllowed?: (result: unknown) => (path: string, index: number) => boolean,
): Verdict {
  const strings = userStrings(input);
  resetLoopCount();
  let result: unknown;
  try {
    result = call();
  } catch (e) {
    const v = errorViolations(e, strings);
    v.push(...loopViolations(evaluations));
    return { violations: v, code: e instanceof FormulaError ? e.code : "(not a FormulaError)" };
  }
  const v = resultViolations(result, strings, nanAllowed?.(result));
  v.push(...loopViolations(evaluations));
  return { violations: v, result };
}

// ---- the ledger: every violation, sorted into known classes or not ----

interface Entry {
  readonly kind: string;
  readonly input: unknown;
  readonly violation: string;
}

/** Printable form of a case: JSON with the values JSON cannot say spelled out. */
export function show(value: unknown): string {
  const text = JSON.stringify(value, (_k, v: unknown) => {
    if (typeof v === "number" && !Number.isFinite(v)) return `<${String(v)}>`;
    if (typeof v === "bigint") return `<${v}n>`;
    if (typeof v === "function") return "<function>";
    if (v === undefined) return "<undefined>";
    if (Object.is(v, -0)) return "<-0>";
    return v;
  });
  return text === undefined ? String(value) : text.length > 600 ? `${text.slice(0, 597)}...` : text;
}

/** Every violation of a path's cases, with the first 50 kept as reproducers. */
export class Ledger {
  cases = 0;
  violations = 0;
  readonly entries: Entry[] = [];

  record(kind: string, input: unknown, violations: readonly string[]): void {
    this.cases++;
    for (const violation of violations) {
      this.violations++;
      if (this.entries.length < 50) this.entries.push({ kind, input, violation });
    }
  }

  /** The first few entries as reproducers, for a failure message. */
  static describe(entries: readonly Entry[], max = 6): string {
    return entries
      .slice(0, max)
      .map((e) => `  ${e.kind} ${show(e.input)}\n    -> ${e.violation}`)
      .join("\n");
  }
}
