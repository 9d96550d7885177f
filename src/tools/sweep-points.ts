import { inDomain } from "../core/domain.js";
import { FormulaError } from "../core/errors.js";
import { domainBounds } from "../core/fast-path.js";
import type { AnyFormula } from "../core/formula.js";
import type { Domain } from "../core/spec.js";

/*
 * The point loops of a sweep: every grid point's inputs set in place, domain
 * and relations checked, compute run, the result stored. sweep.ts reads the
 * request and lays out the result arrays.
 */

/** A swept input's name and domain. */
export type SweptInput = readonly [name: string, domain: Domain | undefined];

/** A sweep's state as the point loops see it. `o` is the formula's compute-input object, varied in place. */
export interface Grid {
  readonly o: Record<string, unknown>;
  readonly compute: (x: unknown) => unknown;
  readonly holds: readonly ((x: unknown) => boolean)[];
  readonly v0: Float64Array;
  readonly v1: Float64Array;
  readonly values: Float64Array;
  /** One array per output component; empty for scalar outputs. */
  readonly components: readonly Float64Array[];
  readonly computed: Uint8Array;
}

/**
 * Computes the grid's points from index `start` to `end - 1` (row-major) into
 * `values` (and `components`), marking `computed`; returns the count of those
 * points not computed. Their entries in `g.values`, `g.components` and
 * `g.computed` must start zeroed (fresh arrays). Points are independent, so
 * any split of the grid into ranges gives the values of one run.
 */
export function computePoints(formula: AnyFormula, g: Grid, axis0: SweptInput, axis1: SweptInput | undefined, start = 0, end = g.computed.length): number {
  const generated = generatedLoop(formula, g.holds.length, g.components.length, axis0, axis1);
  if (generated !== undefined) return runLoop(generated, g, start, end);
  return generalLoop(g, axis0, axis1, start, end);
}

/** Computes the grid's points in order from index `start` to `end - 1`; a FormulaError propagates. */
type Loop = (g: Grid, start: number, end: number) => void;
const loops = new WeakMap<AnyFormula, Map<string, Loop | null>>();

/**
 * Runs a generated loop over the grid from its first point; a FormulaError
 * thrown by compute or a relation marks that point not computed and the loop
 * resumes after it. Points are written in order and the buffer starts zeroed,
 * so the point that threw is the first one from `start` still 0 and not
 * computed: found by this scan instead of recording each point's index in the
 * loop, which cost a third of its time. Returns the count of points not computed.
 */
function runLoop(loop: Loop, g: Grid, from: number, end: number): number {
  const { values, computed, components } = g;
  let start = from;
  for (;;) {
    try {
      loop(g, start, end);
      break;
    } catch (e) {
      if (!(e instanceof FormulaError)) throw e;
      let at = start;
      while (computed[at] === 1 || values[at] !== 0) at++;
      values[at] = NaN;
      for (const c of components) c[at] = NaN;
      start = at + 1;
    }
  }
  let done = 0;
  for (let k = from; k < end; k++) done += computed[k]!;
  return end - from - done;
}

/**
 * The point loop generated for one formula and its swept inputs: the swept
 * inputs are stored and domain-checked by literal names and bounds, the
 * relations are called one by one, output components are checked and stored
 * one by one, a one-axis sweep is a single loop, and the loop has no
 * try/catch (see runLoop). It is made once per formula and swept inputs and
 * reused, so the engine optimises it across calls. Engines run that like
 * hand-written code; stores through a variable key (`x[name] = v`), a lookup
 * per point in a domain mask and a try/catch per point each cost about as
 * much as the formula (bench/sweep.ts). Undefined where `new Function` is not
 * allowed (strict Content-Security-Policy); `generalLoop` is the fallback.
 */
function generatedLoop(formula: AnyFormula, nRelations: number, nComponents: number, axis0: SweptInput, axis1: SweptInput | undefined): Loop | undefined {
  // One loop per formula and swept inputs: a loop shared by several formulas
  // would see several computes and input shapes, and the engine optimises it less.
  let byAxes = loops.get(formula);
  if (byAxes === undefined) loops.set(formula, (byAxes = new Map()));
  const key = `${axis0[0]}|${axis1?.[0] ?? ""}`;
  const hit = byAxes.get(key);
  if (hit !== undefined) return hit ?? undefined;
  const count = (n: number, f: (i: number) => string, sep = " "): string => Array.from({ length: n }, (_, i) => f(i)).join(sep);
  // Axis values are finite (fillAxis keeps them between the finite ends), so only the bounds are tested.
  const inDomain = (v: string, d: Domain | undefined): string => ["true", ...domainBounds(v, d)].join(" && ");
  const relations = count(nRelations, (r) => ` && h${r}(o)`, "");
  // Same acceptance as Formula.run: a finite number, or an array of finite components.
  const point = (k: string): string => nComponents === 0
    ? `
        const out = compute(o);
        if (typeof out === "number" && out - out === 0) { values[${k}] = out; computed[${k}] = 1; continue; }`
    : `
        const out = compute(o);
        if (Array.isArray(out) && out.length >= ${nComponents}) {
          ${count(nComponents, (c) => `const r${c} = out[${c}];`)}
          if (${count(nComponents, (c) => `r${c} - r${c} === 0`, " && ")}) {
            ${count(nComponents, (c) => `c${c}[${k}] = r${c};`)} values[${k}] = r0; computed[${k}] = 1; continue;
          }
        }`;
  const miss = (k: string): string => `values[${k}] = NaN; ${count(nComponents, (c) => `c${c}[${k}] = NaN;`)}`;
  const [name0, dom0] = axis0;
  const loop = axis1 === undefined
    ? `
    for (let i = start; i < end; i++) {
      const a = v0[i];
      o.${name0} = a;
      if (${inDomain("a", dom0)}${relations}) {${point("i")}
      }
      ${miss("i")}
    }`
    : `
    const i0 = (start / n1) | 0;
    const i1 = Math.ceil(end / n1);
    for (let i = i0; i < i1; i++) {
      const a = v0[i];
      o.${name0} = a;
      const ok0 = ${inDomain("a", dom0)};
      const j1 = Math.min(n1, end - i * n1);
      for (let j = i === i0 ? start % n1 : 0; j < j1; j++) {
        const k = i * n1 + j;
        const b = v1[j];
        o.${axis1[0]} = b;
        if (ok0 && ${inDomain("b", axis1[1])}${relations}) {${point("k")}
        }
        ${miss("k")}
      }
    }`;
  const body = `
    const o = g.o, compute = g.compute, v0 = g.v0, v1 = g.v1, values = g.values, computed = g.computed;
    const n0 = v0.length, n1 = v1.length;
    ${count(nRelations, (r) => `const h${r} = g.holds[${r}];`)}
    ${count(nComponents, (c) => `const c${c} = g.components[${c}];`)}${loop}`;
  let made: Loop | null;
  try {
    // eslint-disable-next-line @typescript-eslint/no-implied-eval
    made = new Function("g", "start", "end", body) as Loop;
  } catch {
    made = null;
  }
  byAxes.set(key, made);
  return made ?? undefined;
}

/**
 * The point loop where code cannot be generated: the same results, with a
 * store through a variable key, a domain check through `inDomain` and a
 * try/catch per point.
 */
function generalLoop(g: Grid, axis0: SweptInput, axis1: SweptInput | undefined, start: number, end: number): number {
  const { o, compute, holds, v0, v1, values, components, computed } = g;
  const [name0, dom0] = axis0;
  const n1 = axis1 === undefined ? 1 : v1.length;
  const nc = components.length;
  let failed = 0;
  for (let k = start; k < end; k++) {
    const i = (k / n1) | 0;
    const j = k - i * n1;
    o[name0] = v0[i]!;
    const ok0 = inDomain(v0[i]!, dom0);
    if (axis1 !== undefined) o[axis1[0]] = v1[j]!;
    let ok = ok0 && (axis1 === undefined || inDomain(v1[j]!, axis1[1]));
    for (let r = 0; ok && r < holds.length; r++) ok = holds[r]!(o);
    let out: unknown;
    if (ok) {
      try {
        out = compute(o);
      } catch (e) {
        if (!(e instanceof FormulaError)) throw e;
      }
    }
    if (nc === 0 && typeof out === "number" && out - out === 0) {
      values[k] = out;
      computed[k] = 1;
      continue;
    }
    if (nc > 0 && Array.isArray(out) && out.length >= nc && out.slice(0, nc).every((c: number) => c - c === 0)) {
      for (let c = 0; c < nc; c++) components[c]![k] = out[c];
      values[k] = out[0];
      computed[k] = 1;
      continue;
    }
    values[k] = NaN;
    for (let c = 0; c < nc; c++) components[c]![k] = NaN;
    failed++;
  }
  return failed;
}


/** Per condition: how many computed points raised it, the worst point's index (-1: none) and its measure. */
export interface NoteScan {
  readonly counts: Float64Array;
  readonly index: Float64Array;
  readonly measure: Float64Array;
}

/** A condition as the note scan calls it. */
export interface ScanCondition {
  readonly when?: ((x: never, value: never) => boolean) | undefined;
  readonly measure?: ((x: never, value: never) => number) | undefined;
}

type Scan = (g: Grid, conditions: readonly ScanCondition[], out: NoteScan) => void;
const scans = new WeakMap<AnyFormula, Map<string, Scan | null>>();

/**
 * Checks the conditions at every computed point of the grid: one pass of
 * n0 * n1 points after the point loop, so that loop stays as it was. The
 * rule is that of `formula.notes` (a condition without `when` always
 * applies); the worst point is the one with the largest measure (NaN never
 * wins), or the first point for a condition without one. Only the worst
 * point's index is kept: its inputs and value are read back from the grid.
 * Generated per formula and swept inputs like the point loop (calls through
 * an array of conditions shared by all formulas ran about 5x slower: 67 ms
 * against 13 ms for a 1M-point grid of parallelPlateCapacitance);
 * `generalScan` where code cannot be generated.
 */
export function scanNotes(formula: AnyFormula, g: Grid, name0: string, name1: string | undefined, conditions: readonly ScanCondition[]): NoteScan {
  const n = conditions.length;
  const out: NoteScan = { counts: new Float64Array(n), index: new Float64Array(n).fill(-1), measure: new Float64Array(n).fill(-Infinity) };
  const scan = generatedScan(formula, g.components.length, name0, name1, conditions);
  if (scan !== undefined) scan(g, conditions, out);
  else generalScan(g, name0, name1, conditions, out);
  return out;
}

function generatedScan(formula: AnyFormula, nc: number, name0: string, name1: string | undefined, conditions: readonly ScanCondition[]): Scan | undefined {
  let byAxes = scans.get(formula);
  if (byAxes === undefined) scans.set(formula, (byAxes = new Map()));
  const key = `${name0}|${name1 ?? ""}`;
  const hit = byAxes.get(key);
  if (hit !== undefined) return hit ?? undefined;
  const count = (k: number, f: (i: number) => string, sep = "\n"): string => Array.from({ length: k }, (_, i) => f(i)).join(sep);
  const check = (c: number): string => {
    const cond = conditions[c]!;
    // Worst by measure (NaN never wins; the first point stands in until one does), or the first point.
    const record = cond.measure !== undefined
      ? `const m = m${c}(o, v); if (i${c} < 0 || m > b${c}) { i${c} = k; if (m > b${c}) b${c} = m; }`
      : `if (i${c} < 0) i${c} = k;`;
    return cond.when !== undefined ? `if (w${c}(o, v)) { n${c}++; ${record} }` : `{ n${c}++; ${record} }`;
  };
  const body = `
    const o = g.o, v0 = g.v0, v1 = g.v1, values = g.values, computed = g.computed, comps = g.components;
    const n1 = ${name1 === undefined ? "1" : "v1.length"};
    ${count(conditions.length, (c) => `const w${c} = conditions[${c}].when, m${c} = conditions[${c}].measure; let n${c} = 0, i${c} = -1, b${c} = -Infinity;`)}
    const point = ${nc === 0 ? "null" : `new Array(${nc}).fill(0)`};
    // Row by row, as the point loops run: no division per point.
    for (let i = 0, k = 0; i < v0.length; i++) {
      o.${name0} = v0[i];
      for (let j = 0; j < n1; j++, k++) {
        if (computed[k] !== 1) continue;
        ${name1 === undefined ? "" : `o.${name1} = v1[j];`}
        ${nc === 0 ? "const v = values[k];" : `${count(nc, (c) => `point[${c}] = comps[${c}][k];`, " ")} const v = point;`}
        ${count(conditions.length, check)}
      }
    }
    ${count(conditions.length, (c) => `out.counts[${c}] = n${c}; out.index[${c}] = i${c}; out.measure[${c}] = b${c};`)}`;
  let made: Scan | null;
  try {
    // eslint-disable-next-line @typescript-eslint/no-implied-eval
    made = new Function("g", "conditions", "out", body) as Scan;
  } catch {
    made = null;
  }
  byAxes.set(key, made);
  return made ?? undefined;
}

/** The note scan where code cannot be generated: the same results through the array of conditions. */
function generalScan(g: Grid, name0: string, name1: string | undefined, conditions: readonly ScanCondition[], out: NoteScan): void {
  const { o, v0, v1, values, components, computed } = g;
  const n1 = name1 === undefined ? 1 : v1.length;
  const nc = components.length;
  const point = new Array<number>(nc).fill(0);
  for (let k = 0; k < computed.length; k++) {
    if (computed[k] !== 1) continue;
    o[name0] = v0[(k / n1) | 0]!;
    if (name1 !== undefined) o[name1] = v1[k % n1]!;
    for (let c = 0; c < nc; c++) point[c] = components[c]![k]!;
    const v = (nc === 0 ? values[k]! : point) as never;
    for (let c = 0; c < conditions.length; c++) {
      const cond = conditions[c]!;
      if (cond.when !== undefined && !cond.when(o as never, v)) continue;
      out.counts[c]!++;
      const m = cond.measure === undefined ? -Infinity : cond.measure(o as never, v);
      if (out.index[c]! < 0 || m > out.measure[c]!) {
        out.index[c] = k;
        if (m > out.measure[c]!) out.measure[c] = m;
      }
    }
  }
}
