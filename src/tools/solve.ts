import { FormulaError } from "../core/errors.js";
import type { AnyFormula, Formula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import { outputDimension, type FormulaInputs, type FormulaOutput, type InputSpecs, type Note, type OutputSpec, type QuantityInput } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";
import { brent, signChanges } from "../math/roots.js";
import type { DimensionName } from "../units/dimensions.js";
import type { DimensionTypes } from "../units/types.js";
import { bind, convertInputs, inDomain, inputKind, isScalarQuantity, readQuantity, siUnit, specsOf, startValue } from "./convert.js";

/** Names of a formula's scalar quantity inputs (the ones solve can find). */
export type SolvableInput<I extends InputSpecs> = {
  [K in keyof I]: I[K] extends { readonly dimension: DimensionName }
    ? I[K] extends { readonly vector: true } | { readonly series: object } ? never : K
    : never;
}[keyof I] & string;

type InputQuantity<S> = S extends { readonly dimension: infer D extends DimensionName } ? DimensionTypes[D] : never;

/**
 * Options of the search. Each is checked like an input: a value of the wrong
 * type, outside its limits, or an option name not listed here is
 * `invalid_argument` naming the option. With the limits below a search
 * evaluates the formula at most 2 * ((300 + 6) * 100 + 1) + 5 = 61,207 times, and
 * refines each sign change found with at most 200 Brent iterations.
 */
export interface SolveOptions {
  /**
   * How far to search, in decades either side of the input's example value:
   * a whole number from 1 to 300 (default 12). The search widens one decade at
   * a time and stops at the first width where the output crosses the target.
   */
  readonly decades?: number;
  /** Samples per decade: a whole number from 2 to 100 (default 8). */
  readonly samplesPerDecade?: number;
  /** Search only within [lo, hi] (SI, finite, lo < hi), still inside the input's domain. */
  readonly range?: readonly [number, number];
}

/** Limits of the search options (see SolveOptions). */
export const SOLVE_LIMITS = {
  decades: { min: 1, max: 300, default: 12 },
  samplesPerDecade: { min: 2, max: 100, default: 8 },
  /** Brent iterations per sign change (R. P. Brent's procedure converges well before). */
  refineIterations: 200,
} as const;

const OPTION_NAMES = new Set(["decades", "samplesPerDecade", "range"]);

/** The options checked, with defaults filled; `range` already in SI numbers. */
function checkOptions(id: string, options: unknown): { decades: number; perDecade: number; range: readonly [number, number] | undefined } {
  if (options === undefined) options = {};
  if (typeof options !== "object" || options === null || Array.isArray(options)) {
    throw new FormulaError("invalid_argument", { formula: id, input: "options", value: options, detail: "options is an object { decades, samplesPerDecade, range }" });
  }
  const o = options as Record<string, unknown>;
  for (const k of Object.keys(o)) {
    if (!OPTION_NAMES.has(k) && o[k] !== undefined) {
      throw new FormulaError("invalid_argument", { formula: id, input: k, detail: "not a solve option; the options are decades, samplesPerDecade and range" });
    }
  }
  const count = (name: "decades" | "samplesPerDecade"): number => {
    const v = o[name];
    const lim = SOLVE_LIMITS[name];
    if (v === undefined) return lim.default;
    if (typeof v !== "number" || !Number.isInteger(v) || v < lim.min || v > lim.max) {
      throw new FormulaError("invalid_argument", { formula: id, input: name, value: typeof v === "number" ? v : undefined, detail: `${name} must be a whole number from ${lim.min} to ${lim.max}` });
    }
    return v;
  };
  let range: readonly [number, number] | undefined;
  if (o.range !== undefined) {
    const r = o.range;
    if (!Array.isArray(r) || r.length !== 2 || typeof r[0] !== "number" || typeof r[1] !== "number" || r[0] - r[0] !== 0 || r[1] - r[1] !== 0) {
      throw new FormulaError("invalid_argument", { formula: id, input: "range", detail: "range is [low, high]: two finite numbers in the solved input's SI unit" });
    }
    if (!(r[0] < r[1])) throw new FormulaError("invalid_argument", { formula: id, input: "range", detail: "range is [low, high] with low < high" });
    range = [r[0], r[1]];
  }
  return { decades: count("decades"), perDecade: count("samplesPerDecade"), range };
}

/** Everything solve found. Values in SI. */
export interface SolveResult {
  readonly formula: string;
  readonly input: string;
  /** The input value (rounded to a whole number for counts). */
  readonly value: number;
  /** SI unit symbol of the input. */
  readonly unit: string;
  /** For whole-number inputs: the unrounded solution. */
  readonly exact?: number;
  /** The output at `value` (differs from the target when the value was rounded). */
  readonly outputAtValue: number;
  readonly target: number;
  readonly outputUnit: string;
  /** The interval searched last, in SI. */
  readonly searched: readonly [number, number];
  readonly warnings: readonly Note[];
  readonly cautions: readonly Note[];
}

/**
 * The value of one input that makes the formula's (scalar) output equal `target`,
 * with the other inputs given. Typed: the result has the input's dimension.
 * Throws FormulaError "no_solution" or "several_solutions" (with the values found).
 *
 * @example
 * solve(parallelPlateCapacitance, "gap", { target: quantity(100, "pF"), area: quantity(1, "cm^2") }); // ≈ 8.854e-6 m
 */
export function solve<I extends InputSpecs, O extends OutputSpec, N extends SolvableInput<I>>(
  formula: Formula<I, O>,
  input: N,
  given: Omit<FormulaInputs<I>, N> & { readonly target: FormulaOutput<O> },
  options?: SolveOptions,
): InputQuantity<I[N]> {
  return solveDetails(formula, input, given, options).value as InputQuantity<I[N]>;
}

/** As `solve`, returning the full result (rounding, output at the value, notes). */
export function solveDetails<I extends InputSpecs, O extends OutputSpec, N extends SolvableInput<I>>(
  formula: Formula<I, O>,
  input: N,
  given: Omit<FormulaInputs<I>, N> & { readonly target: FormulaOutput<O> },
  options: SolveOptions = {},
): SolveResult {
  if (typeof given !== "object" || given === null || Array.isArray(given)) {
    throw new FormulaError("wrong_type", { formula: (formula as unknown as AnyFormula).id, input: "given", value: given, expected: "an object of the other inputs and the target" });
  }
  const { target, ...others } = given as unknown as Record<string, unknown>;
  return solveSI(formula as unknown as AnyFormula, input, target, others, options);
}

/** JSON form of a solve request: unit strings accepted everywhere. */
export interface SolveRequest {
  readonly formula: string;
  readonly solveFor: string;
  /** A number in the output's SI unit or a unit string ("100 pF"). */
  readonly target: number | string;
  readonly inputs?: Readonly<Record<string, unknown>>;
  /** Search options; `range` ends may be unit strings. */
  readonly options?: Omit<SolveOptions, "range"> & { readonly range?: readonly [number | string, number | string] };
}

/**
 * Solve from JSON: `{ formula, solveFor, target, inputs }` with unit strings,
 * returning plain JSON. The core of request handlers and the CLI.
 */
export function solveRequest(request: SolveRequest): SolveResult {
  if (typeof request !== "object" || request === null) {
    throw new FormulaError("wrong_type", { input: "request", value: request, expected: "an object { formula, solveFor, target, inputs }" });
  }
  const formula = getFormula(request.formula);
  if (typeof request.solveFor !== "string") {
    throw new FormulaError("invalid_argument", { formula: formula.id, input: "solveFor", detail: "name the input to solve for" });
  }
  const inputs = request.inputs ?? {};
  if (typeof inputs === "object" && inputs !== null && Object.hasOwn(inputs, request.solveFor)) {
    throw new FormulaError("invalid_argument", { formula: formula.id, input: request.solveFor, detail: "the input solved for must not also be given" });
  }
  const si = convertInputs(formula, inputs, [request.solveFor]);
  const target = readQuantity(formula.id, "target", outputDimension(formula.definition.output, si), request.target);
  const opts = request.options ?? {};
  if (typeof opts !== "object" || opts === null || Array.isArray(opts)) {
    throw new FormulaError("invalid_argument", { formula: formula.id, input: "options", detail: "options is an object { decades, samplesPerDecade, range }" });
  }
  let range: [number, number] | undefined;
  if (opts.range !== undefined) {
    const spec = Object.hasOwn(specsOf(formula), request.solveFor) ? specsOf(formula)[request.solveFor] : undefined;
    if (!Array.isArray(opts.range) || opts.range.length !== 2 || !isScalarQuantity(spec)) {
      throw new FormulaError("invalid_argument", { formula: formula.id, input: "range", detail: "range is [low, high] in the solved input's unit" });
    }
    range = [readQuantity(formula.id, "range", spec.dimension, opts.range[0]), readQuantity(formula.id, "range", spec.dimension, opts.range[1])];
  }
  return solveSI(formula, request.solveFor, target, si, { ...opts, ...(range ? { range } : {}) } as SolveOptions);
}

function solveSI(formula: AnyFormula, name: string, target: unknown, others: Record<string, unknown>, rawOptions: unknown): SolveResult {
  const id = formula.id;
  const options = checkOptions(id, rawOptions);
  const def = formula.definition;
  const specs = specsOf(formula);
  const spec = Object.hasOwn(specs, name) ? specs[name] : undefined;
  if (spec === undefined) throw new FormulaError("unknown_input", { formula: id, input: name });
  if (def.output.components) {
    throw new FormulaError("invalid_argument", { formula: id, detail: "solve needs a scalar output; this formula returns components" });
  }
  if (!isScalarQuantity(spec)) {
    throw new FormulaError("invalid_argument", {
      formula: id, input: name,
      detail: `${inputKind(spec)} input cannot be solved for`,
    });
  }
  if (typeof target !== "number") throw new FormulaError("wrong_type", { formula: id, input: "target", value: target, expected: "a number in SI units" });
  if (target - target !== 0) throw new FormulaError("not_finite", { formula: id, input: "target", value: target });

  const start = startValue(spec);
  const binding = bind(formula, others, { [name]: start });
  const x = binding.x;
  let lastOutput = NaN;
  const g = (v: number): number => {
    x[name] = v;
    lastOutput = binding.scalar();
    // Output and target of opposite signs near the largest double: the
    // difference overflows. Its sign is what the search needs; keep it finite.
    const r = lastOutput - target;
    return r === Infinity ? Number.MAX_VALUE : r === -Infinity ? -Number.MAX_VALUE : r;
  };

  const grid = searchGrid(spec, start, options);
  const samplesX = grid.points;
  const samplesF = new Float64Array(samplesX.length).fill(NaN);
  const done = new Uint8Array(samplesX.length);
  let roots: number[] = [];
  // Intervals over which every sample gives exactly the target.
  let flat: [number, number][] = [];
  let searched: [number, number] = [start, start];
  let lo = grid.center;
  let hi = grid.center;
  let minSeen = Infinity;
  let maxSeen = -Infinity;
  // Bound: each grid point is evaluated once (done[]), at most 61,207 points
  // (SOLVE_LIMITS); the grid has one point per sample offset, the start,
  // the domain's ends and the range's ends.
  let evaluations = 0;
  for (const ring of grid.rings) {
    lo = ring[0];
    hi = ring[1];
    for (let i = lo; i <= hi; i++) {
      if (done[i]) continue;
      done[i] = 1;
      evaluations++;
      const r = g(samplesX[i]!);
      samplesF[i] = r;
      if (r === r) {
        minSeen = Math.min(minSeen, lastOutput);
        maxSeen = Math.max(maxSeen, lastOutput);
      }
    }
    searched = [samplesX[lo]!, samplesX[hi]!];
    const brackets = signChanges(samplesX.subarray(lo, hi + 1), samplesF.subarray(lo, hi + 1));
    roots = [];
    flat = [];
    let prevZero = -2;
    for (const b of brackets) {
      if (b.lo === b.hi) {
        // Neighbouring samples exactly on the target: the output is flat there.
        const last = flat[flat.length - 1];
        if (b.index === prevZero + 1 && last) last[1] = b.hi;
        else if (b.index === prevZero + 1 && roots.length > 0) {
          flat.push([roots.pop()!, b.hi]);
        } else roots.push(b.lo);
        prevZero = b.index;
        continue;
      }
      const r = refine(g, b, grid.log, target);
      if (r !== undefined) roots.push(r);
    }
    if (roots.length > 0 || flat.length > 0) break;
  }
  countLoop(evaluations);

  const unit = siUnit(spec.dimension);
  const outputUnit = siUnit(outputDimension(def.output, x));
  const show = (v: number): string => `${v.toPrecision(6)}${unit ? ` ${unit}` : ""}`;
  const showOut = (v: number): string => `${v.toPrecision(6)}${outputUnit ? ` ${outputUnit}` : ""}`;
  if (flat.length > 0) {
    throw new FormulaError("several_solutions", {
      formula: id, input: name, value: target,
      detail: `target ${showOut(target)} is reached for every ${name} ${flat.map(([a, c]) => `from ${show(a)} to ${show(c)}`).join(" and ")}${roots.length ? ` and at ${roots.map(show).join(", ")}` : ""}: the output does not depend on ${name} there`,
    });
  }
  if (roots.length === 0) {
    const seen = minSeen <= maxSeen ? `the output took values from ${showOut(minSeen)} to ${showOut(maxSeen)}` : "the output could not be computed anywhere in that range";
    throw new FormulaError("no_solution", {
      formula: id, input: name, value: target,
      detail: `target ${showOut(target)}; searched ${name} from ${show(searched[0])} to ${show(searched[1])}; ${seen}`,
    });
  }
  if (roots.length > 1) {
    throw new FormulaError("several_solutions", {
      formula: id, input: name, value: target,
      detail: `target ${showOut(target)} is reached at ${name} = ${roots.slice(0, 8).map(show).join(", ")}${roots.length > 8 ? ` and ${roots.length - 8} more` : ""}; search a narrower range`,
    });
  }

  let value = roots[0]!;
  let exact: number | undefined;
  if (spec.domain?.integer) {
    exact = value;
    value = Math.round(value);
    if (!inDomain(value, spec.domain)) value = value < exact ? value + 1 : value - 1;
  }
  // The final value goes through the full checks, so the notes are those of a normal evaluation.
  let prepared;
  try {
    prepared = formula.prepare({ ...others, [name]: value });
  } catch (e) {
    if (e instanceof FormulaError) {
      throw new FormulaError("no_solution", {
        formula: id, input: name, value: target,
        detail: `the solution ${show(exact ?? value)} fails the formula's checks: ${e.message}`,
      });
    }
    throw e;
  }
  const outputAtValue = formula.run(prepared) as number;
  const notes = formula.notes(prepared, outputAtValue);
  return {
    formula: id, input: name, value, unit,
    ...(exact !== undefined ? { exact } : {}),
    outputAtValue, target, outputUnit, searched,
    warnings: notes.warnings, cautions: notes.cautions,
  };
}

/** Refine a bracket with Brent's method (in log space for positive inputs); undefined at a jump. */
function refine(g: (v: number) => number, b: { lo: number; hi: number; flo: number; fhi: number }, log: boolean, target: number): number | undefined {
  if (b.lo === b.hi) return b.lo;
  const h = log ? (u: number) => g(Math.exp(u)) : g;
  const a = log ? Math.log(b.lo) : b.lo;
  const c = log ? Math.log(b.hi) : b.hi;
  // NaN inside the bracket (a relation failing between samples) stops Brent: treat as no root there.
  const safe = (u: number): number => {
    const r = h(u);
    if (r !== r) throw new RangeError("not computed");
    return r;
  };
  let res;
  let calls = 0;
  const counted = (u: number): number => {
    calls++;
    return safe(u);
  };
  try {
    // Bound: at most SOLVE_LIMITS.refineIterations iterations, one evaluation each.
    res = brent(counted, a, c, { xRelTol: 2 * Number.EPSILON, xAbsTol: log ? 1e-15 : 0, maxIterations: SOLVE_LIMITS.refineIterations }, b.flo, b.fhi);
  } catch {
    return undefined;
  } finally {
    countLoop(calls);
  }
  const v = log ? Math.exp(res.x) : res.x;
  // A sign change across a jump converges to the jump, not a root: the residual stays large.
  const scale = Math.max(Math.abs(target), Math.abs(b.flo), Math.abs(b.fhi));
  if (!(Math.abs(res.fx) <= 1e-6 * scale)) return undefined;
  return v;
}

interface Grid {
  /** Sample points, ascending. */
  readonly points: Float64Array;
  readonly center: number;
  /** Index ranges [lo, hi] of successively wider searches. */
  readonly rings: readonly (readonly [number, number])[];
  readonly log: boolean;
}

/**
 * Sample points around the start value: geometric (log-spaced) for inputs whose
 * domain is positive, otherwise offsets start +- scale * 10^k on both sides.
 * Rings widen by one decade at a time; everything is clipped to the domain.
 */
function searchGrid(spec: QuantityInput, start: number, options: ReturnType<typeof checkOptions>): Grid {
  const { decades, perDecade } = options;
  const d = spec.domain;
  const lower = Math.max(d?.min ?? -Infinity, options.range?.[0] ?? -Infinity);
  const upper = Math.min(d?.max ?? Infinity, options.range?.[1] ?? Infinity);
  if (!(lower <= upper)) {
    throw new FormulaError("invalid_argument", { input: "range", detail: "the search range does not overlap the input's domain" });
  }
  if (start < lower || start > upper) {
    // Start inside a given range: its geometric middle when positive, else its middle.
    start = lower > 0 && Number.isFinite(upper) ? Math.sqrt(lower * upper) : Number.isFinite(lower) && Number.isFinite(upper) ? (lower + upper) / 2 : Number.isFinite(lower) ? lower : upper;
  }
  const ok = (v: number): boolean =>
    Number.isFinite(v) && inDomain(v, d, false) && v >= lower && v <= upper;
  const log = d?.min !== undefined && d.min >= 0 && start > 0;
  const levels: { v: number; level: number }[] = [];
  const add = (v: number, level: number): void => {
    if (ok(v)) levels.push({ v, level });
  };
  // Make sure the range ends are sampled when a range is given.
  if (log) {
    add(start, 0);
    for (let k = 1; k <= decades * perDecade; k++) {
      const f = Math.pow(10, k / perDecade);
      const level = Math.ceil(k / perDecade);
      add(start * f, level);
      add(start / f, level);
    }
    // The domain's lower bound itself (e.g. relative permittivity 1) and the range ends.
    if (d?.min !== undefined && d.min > 0) add(d.min, Math.max(1, Math.ceil(Math.log10(start / d.min))));
  } else {
    const scale = start !== 0 ? Math.abs(start) : 1;
    add(start, 0);
    for (let k = -6 * perDecade; k <= decades * perDecade; k++) {
      const off = scale * Math.pow(10, k / perDecade);
      const level = Math.max(1, Math.ceil(k / perDecade));
      add(start + off, level);
      add(start - off, level);
    }
    if (d?.min !== undefined) add(d.min, Math.max(1, Math.ceil(Math.log10(Math.abs(start - d.min) / scale + 1e-300))));
    if (d?.max !== undefined) add(d.max, Math.max(1, Math.ceil(Math.log10(Math.abs(d.max - start) / scale + 1e-300))));
  }
  if (options.range) {
    add(options.range[0], 1);
    add(options.range[1], 1);
  }
  if (levels.length === 0) {
    throw new FormulaError("invalid_argument", { input: "range", detail: "the search range does not overlap the input's domain" });
  }
  levels.sort((a, b) => a.v - b.v);
  // Drop duplicates, keeping the smaller level.
  const uniq: { v: number; level: number }[] = [];
  for (const p of levels) {
    const last = uniq[uniq.length - 1];
    if (last && last.v === p.v) last.level = Math.min(last.level, p.level);
    else uniq.push({ ...p });
  }
  const points = Float64Array.from(uniq, (p) => p.v);
  let center = 0;
  for (let i = 0; i < uniq.length; i++) if (uniq[i]!.level === 0) center = i;
  const maxLevel = uniq.reduce((m, p) => Math.max(m, p.level), 0);
  const rings: [number, number][] = [];
  // Ring k: the contiguous run of points around the centre whose level is <= k.
  // Rings only grow, so each starts from the last: lo and hi each move at most
  // points.length times in all, whatever the number of levels.
  let lo = center;
  let hi = center;
  let steps = 0;
  for (let k = 1; k <= Math.max(1, maxLevel); k++) {
    while (lo > 0 && uniq[lo - 1]!.level <= k) lo--, steps++;
    while (hi < uniq.length - 1 && uniq[hi + 1]!.level <= k) hi++, steps++;
    const prev = rings[rings.length - 1];
    if (!prev || prev[0] !== lo || prev[1] !== hi) rings.push([lo, hi]);
  }
  countLoop(steps);
  return { points, center, rings, log };
}
