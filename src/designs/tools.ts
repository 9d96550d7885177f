import { readQuantity } from "../core/convert.js";
import { type Exponents, nameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";
import { sameDimension } from "./expression.js";
import { inDomain } from "../core/domain.js";
import { FormulaError } from "../core/errors.js";
import { brent } from "../math/roots.js";
import { countLoop } from "../math/loop-count.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import { createRandom } from "../tools/random.js";
import { derivative, drawSample, scaledMoments, scaledNorm, type Varied } from "../tools/tolerance.js";
import { type CompiledDesign, type CompiledInput, compileDesign } from "./compile.js";
import { type DesignResult, type Values, checkValues, runDetailed, runValues } from "./run.js";
import type { DesignBuilder, DesignSpec } from "./spec.js";
import { unitOf } from "./units.js";

// Evaluate, tolerance, solve and sweep over a whole design. Each runs the one
// compiled chain; a shared input is one value per run, so every step that
// reads it sees the same draw (the chain's correlations hold by construction).

/** A design as JSON or as a typed builder. */
export type DesignLike = DesignSpec | DesignBuilder<unknown>;

function compiled(d: DesignLike): CompiledDesign {
  // A builder carries its JSON in `spec`; a design file has no such key (compile refuses unknown keys).
  const spec = typeof d === "object" && d !== null && !Array.isArray(d) && Object.hasOwn(d, "spec") ? (d as DesignBuilder<unknown>).spec : (d as DesignSpec);
  return compileDesign(spec);
}

/**
 * Evaluate a design at its nominal inputs: every step's value, unit, inputs,
 * notes (with the step that raised them), source and equation, and every
 * check with pass/fail and margin. Errors are FormulaErrors naming the step.
 */
export function evaluateDesign(d: DesignLike): DesignResult {
  return runDetailed(compiled(d));
}

const nominalValues = (c: CompiledDesign): Map<string, number> => new Map(c.inputs.map((i) => [i.name, i.nominal]));

function option(name: string, v: unknown, dflt: number, min: number, max: number): number {
  if (v === undefined) return dflt;
  if (typeof v !== "number" || !Number.isInteger(v) || v < min || v > max) {
    throw new FormulaError("invalid_argument", { formula: "design", input: name, value: v, detail: `a whole number from ${min} to ${max}` });
  }
  return v;
}

/**
 * Chain runs between two progress ticks in the design tools: a run of the
 * chain costs microseconds to a millisecond (a map per run, every step's
 * checks), so a few dozen make a chunk.
 */
const RUNS_PER_TICK = 32;

/** Limits of the design tools: bounded work for any request. */
export const DESIGN_TOOL_LIMITS = { samples: 200_000, cornerInputs: 12, sweepPoints: 10_000, decades: 12 } as const;

export interface DesignToleranceOptions {
  /** Monte Carlo samples, 0..200000 (default 10000). */
  readonly samples?: number;
  /** Seed, a whole number (default 1). */
  readonly seed?: number;
  /** Evaluate every corner up to this many toleranced inputs, 0..12 (default 10); above, the two slope corners. */
  readonly maxCornerInputs?: number;
}

export interface DesignQuantitySpread {
  readonly name: string;
  readonly unit: string;
  readonly nominal: number;
  readonly worstCase: { readonly min: number; readonly max: number; readonly method: "corners" | "derivative signs" };
  /** First-order spread: sd and each toleranced input's slope and share of the variance. */
  readonly rss: { readonly sd: number; readonly sensitivities: readonly { readonly input: string; readonly derivative: number; readonly unit: string; readonly share: number }[] };
  readonly monteCarlo?: { readonly mean: number; readonly sd: number; readonly p1: number; readonly p99: number };
}

export interface DesignToleranceResult {
  readonly title: string;
  readonly generator: string;
  readonly seed: number;
  readonly samples: number;
  /** Samples where every step computed. */
  readonly accepted: number;
  /** Samples outside an input's domain or where a step refused its inputs. */
  readonly rejected: number;
  readonly quantities: readonly DesignQuantitySpread[];
  readonly checks: readonly {
    readonly rule: string;
    readonly passAtNominal: boolean;
    /** Whether the check holds at every evaluated worst-case corner. */
    readonly passAtCorners: boolean;
    /** Fraction of accepted Monte Carlo samples where the check fails, with its binomial standard error. */
    readonly failureProbability?: number;
    readonly standardError?: number;
  }[];
  readonly remarks: readonly string[];
}

/**
 * Tolerance through the whole chain: worst case (every corner of the
 * toleranced inputs' box up to maxCornerInputs, else the corners the slopes
 * point to), first-order RSS with the sensitivity of every step and derived
 * quantity to every toleranced input, and a Monte Carlo that draws each input
 * once per sample, with the probability that each check fails.
 *
 * `options.signal` and `options.onProgress` are checked every few dozen runs
 * of the chain; progress counts the slopes (one per quantity and toleranced
 * input), the corners, then the Monte Carlo samples. A synchronous call sees
 * an abort made before it started or from its own onProgress.
 */
export function designTolerance(d: DesignLike, options: DesignToleranceOptions & LongRunOptions = {}): DesignToleranceResult {
  if (typeof options !== "object" || options === null) throw new FormulaError("invalid_argument", { formula: "design", input: "options", detail: "options are an object" });
  const samples = option("samples", options.samples, 10_000, 0, DESIGN_TOOL_LIMITS.samples);
  const seed = option("seed", options.seed, 1, 0, 2 ** 32 - 1);
  const maxCorners = option("maxCornerInputs", options.maxCornerInputs, 10, 0, DESIGN_TOOL_LIMITS.cornerInputs);
  const c = compiled(d);
  const varied = c.inputs.filter((i): i is CompiledInput & { varied: Varied } => i.varied !== undefined);
  const names = c.nodes.map((n) => n.name);
  const method = varied.length <= maxCorners ? "corners" : "derivative signs";
  const slopeCount = names.length * varied.length;
  const cornerCount = method === "corners" ? 2 ** varied.length : 2 * names.length;
  const total = slopeCount + cornerCount + samples;
  const t = ticker("designTolerance", options, total);
  // Below the total only: fraction 1 is finish()'s.
  const tick = (done: number): void => {
    if (done < total) t.tick(done);
  };
  const base = nominalValues(c);
  const nominal = runValues(c, base);
  const nominalChecks = checkValues(c, nominal);
  const remarks = [...c.remarks];

  const runAt = (set: ReadonlyMap<string, number>): Values | undefined => {
    try {
      return runValues(c, set);
    } catch (e) {
      if (e instanceof FormulaError) return undefined;
      throw e;
    }
  };

  // Slopes of every quantity with respect to every toleranced input.
  // Each slope takes up to 32 runs of the chain: a tick after each.
  let slopesDone = 0;
  const slopes = names.map((name) =>
    varied.map((v) => {
      const f = (x: number): number => runAt(new Map(base).set(v.name, x))?.get(name) ?? NaN;
      const s = derivative(f, v.varied, "design");
      tick(++slopesDone);
      return s;
    }),
  );

  // Worst case over the corners.
  const min = names.map((n) => nominal.get(n)!);
  const max = [...min];
  let cornersPass = nominalChecks.map((k) => k.pass);
  const visit = (set: Map<string, number>): void => {
    const r = runAt(set);
    if (!r) return;
    names.forEach((n, j) => {
      const x = r.get(n)!;
      if (x < min[j]!) min[j] = x;
      if (x > max[j]!) max[j] = x;
    });
    const ks = checkValues(c, r);
    cornersPass = cornersPass.map((p, i) => p && ks[i]!.pass);
  };
  const end = (v: CompiledInput & { varied: Varied }, up: boolean): number => {
    const t = up ? v.varied.hi : v.varied.lo;
    return v.spec.domain?.integer ? Math.round(t) : t;
  };
  if (method === "corners") {
    // 2^12 corners at most (DESIGN_TOOL_LIMITS.cornerInputs).
    const corners = 2 ** varied.length;
    for (let mask = 0; mask < corners; mask++) {
      if (mask % RUNS_PER_TICK === 0) tick(slopeCount + mask);
      const set = new Map(base);
      varied.forEach((v, i) => set.set(v.name, end(v, ((mask >> i) & 1) === 1)));
      visit(set);
    }
    countLoop(corners);
  } else {
    // For each quantity, the two corners its slopes point to.
    names.forEach((_, j) => {
      for (const up of [true, false]) {
        const set = new Map(base);
        varied.forEach((v, i) => set.set(v.name, end(v, ((slopes[j]![i] ?? 0) >= 0) === up)));
        visit(set);
      }
    });
  }

  // Monte Carlo: one draw per input per sample.
  const values = names.map(() => new Float64Array(samples));
  const failures = c.checks.map(() => 0);
  let accepted = 0;
  const rng = createRandom(seed);
  for (let s = 0; s < samples; s++) {
    if (s % RUNS_PER_TICK === 0) tick(slopeCount + cornerCount + s);
    const set = new Map(base);
    let ok = true;
    for (const v of varied) {
      const t = drawSample(v.varied, rng);
      if (t - t !== 0 || !inDomain(t, v.spec.domain)) ok = false;
      set.set(v.name, t);
    }
    if (!ok) continue;
    const r = runAt(set);
    if (!r) continue;
    names.forEach((n, j) => (values[j]![accepted] = r.get(n)!));
    checkValues(c, r).forEach((k, i) => {
      if (!k.pass) failures[i]!++;
    });
    accepted++;
  }
  if (samples > 0 && accepted === 0) {
    throw new FormulaError("invalid_argument", { formula: "design", detail: "every Monte Carlo sample broke an input's domain or a step's rules; narrow the tolerances" });
  }
  if (accepted < samples) remarks.push(`${samples - accepted} of ${samples} Monte Carlo samples were outside a domain or refused by a step and are not counted`);

  const quantities = names.map((name, j): DesignQuantitySpread => {
    const node = c.nodes[j]!;
    const unit = unitOf(node.exps);
    // Inputs whose slope could not be taken (the chain refused one side) count for nothing.
    const known = varied.flatMap((v, i) => (slopes[j]![i] === undefined ? [] : [i]));
    const rss = scaledNorm("design", `the RSS standard deviation of ${name}`, known.map((i) => slopes[j]![i]!), known.map((i) => varied[i]!.varied.sd));
    const sd = rss.norm;
    const sensitivities = varied.map((v, i) => ({
      input: v.name, derivative: slopes[j]![i] ?? NaN, unit: slopeUnit(unit, unitOf(v.dimension)), share: rss.shares[known.indexOf(i)] ?? 0,
    }));
    let monteCarlo: DesignQuantitySpread["monteCarlo"];
    if (accepted > 0) {
      const acc = values[j]!.subarray(0, accepted).sort();
      const { mean, sd: mcSd } = scaledMoments("design", acc);
      const pct = (p: number): number => acc[Math.min(accepted - 1, Math.max(0, Math.round((p / 100) * (accepted - 1))))]!;
      monteCarlo = { mean, sd: mcSd, p1: pct(1), p99: pct(99) };
      if (acc[0]! < min[j]!) min[j] = acc[0]!;
      if (acc[accepted - 1]! > max[j]!) max[j] = acc[accepted - 1]!;
    }
    return {
      name, unit, nominal: nominal.get(name)!, worstCase: { min: min[j]!, max: max[j]!, method },
      rss: { sd, sensitivities }, ...(monteCarlo ? { monteCarlo } : {}),
    };
  });
  if (varied.length > 0) remarks.push("worst case: the corners evaluated, widened by any Monte Carlo sample outside them");
  const checks = c.checks.map((k, i) => {
    const p = accepted > 0 ? failures[i]! / accepted : undefined;
    return {
      rule: k.text, passAtNominal: nominalChecks[i]!.pass, passAtCorners: cornersPass[i]!,
      ...(p === undefined ? {} : { failureProbability: p, standardError: Math.sqrt((p * (1 - p)) / accepted) }),
    };
  });
  t.finish();
  return { title: c.title, generator: "xoshiro128** 1.1", seed, samples, accepted, rejected: samples - accepted, quantities, checks, remarks };
}

function slopeUnit(out: string, input: string): string {
  if (!input) return out;
  if (!out) return `1/${input}`;
  return `${out}/${input.includes(" ") || input.includes("/") ? `(${input})` : input}`;
}

export interface DesignSolveRequest {
  /** The design input to adjust. */
  readonly input: string;
  /** The step or derived quantity to bring to the target. */
  readonly output: string;
  /** Target value: a number in SI or a unit string. */
  readonly target: number | string;
  /** Decades searched on each side of the input's nominal (default 6, at most 12). */
  readonly decades?: number;
}

export interface DesignSolveResult {
  readonly input: string;
  /** The solution in SI; rounded for whole-number inputs. */
  readonly value: number;
  readonly unit: string;
  /** The exact root before rounding (equal to value for continuous inputs). */
  readonly root: number;
  readonly rounded: boolean;
  readonly output: string;
  readonly target: number;
  /** The output at `value`. */
  readonly achieved: number;
  readonly outputUnit: string;
  /** The whole design evaluated at the solution. */
  readonly design: DesignResult;
}

/**
 * Solve a design input so that a chosen step output (or derived quantity)
 * meets a target. Searches geometric samples around the nominal for sign
 * changes, takes the root nearest the nominal and refines it by Brent's
 * method; a whole-number input (turns) is rounded to the nearest whole number
 * and the achieved output reported.
 */
export function solveDesign(d: DesignLike, request: DesignSolveRequest): DesignSolveResult {
  if (typeof request !== "object" || request === null) throw new FormulaError("wrong_type", { formula: "design", input: "request", value: request, expected: "{ input, output, target }" });
  const c = compiled(d);
  const inp = c.inputs.find((i) => i.name === request.input);
  if (!inp) throw new FormulaError("unknown_input", { formula: "design", input: String(request.input), detail: "not a design input" });
  const node = c.nodes.find((n) => n.name === request.output);
  if (!node) throw new FormulaError("unknown_input", { formula: "design", input: String(request.output), detail: "not a step or derived quantity" });
  const outputUnit = unitOf(node.exps);
  const target = typeof request.target === "number" ? request.target : readTargetUnit(request.target, node.exps);
  if (target - target !== 0) throw new FormulaError("not_finite", { formula: "design", input: "target", value: request.target });
  const decades = option("decades", request.decades, 6, 1, DESIGN_TOOL_LIMITS.decades);
  const base = nominalValues(c);
  const g = (t: number): number => {
    try {
      return runValues(c, new Map(base).set(inp.name, t)).get(node.name)! - target;
    } catch (e) {
      if (e instanceof FormulaError) return NaN;
      throw e;
    }
  };
  const start = inp.nominal;
  if (!(start > 0)) throw new FormulaError("invalid_argument", { formula: "design", input: inp.name, detail: "solve searches geometric steps around a positive nominal" });
  const perDecade = 20;
  const integer = inp.spec.domain?.integer === true;
  const xs: number[] = [];
  for (let k = -decades * perDecade; k <= decades * perDecade; k++) {
    // Whole-number inputs (turns) are searched on whole numbers: the formulas refuse anything else.
    const t = integer ? Math.round(start * 10 ** (k / perDecade)) : start * 10 ** (k / perDecade);
    if (inDomain(t, inp.spec.domain) && t !== xs[xs.length - 1]) xs.push(t);
  }
  const fs = xs.map(g);
  let best: { lo: number; hi: number; flo: number; fhi: number; dist: number } | undefined;
  for (let i = 0; i + 1 < xs.length; i++) {
    const a = fs[i]!;
    const b = fs[i + 1]!;
    if (a !== a || b !== b || ((a > 0) === (b > 0) && a !== 0)) continue;
    const dist = Math.abs(Math.log(xs[i]! / start));
    if (!best || dist < best.dist) best = { lo: xs[i]!, hi: xs[i + 1]!, flo: a, fhi: b, dist };
  }
  if (!best) throw new FormulaError("no_solution", { formula: "design", input: inp.name, detail: `no value within ${decades} decades of the nominal brings ${node.name} to the target` });
  let root: number;
  let value: number;
  if (!integer) {
    root = best.flo === 0 ? best.lo : brent(g, best.lo, best.hi, {}, best.flo, best.fhi).x;
    value = root;
  } else {
    // Bisection on whole numbers: at most log2(10^(2 decades)) < 80 halvings.
    let { lo, hi, flo, fhi } = best;
    let halvings = 0;
    while (hi - lo > 1 && flo !== 0) {
      halvings++;
      const mid = Math.floor(lo / 2 + hi / 2);
      const fm = g(mid);
      if (fm !== fm) break;
      if ((fm > 0) === (flo > 0) && fm !== 0) [lo, flo] = [mid, fm];
      else [hi, fhi] = [mid, fm];
    }
    countLoop(halvings);
    // The whole number whose output lies nearer the target; the root by linear interpolation, for the record.
    value = flo === 0 || Math.abs(flo) <= Math.abs(fhi) ? lo : hi;
    root = flo === fhi ? lo : lo + (hi - lo) * (flo / (flo - fhi));
  }
  const set = new Map(base).set(inp.name, value);
  const design = runDetailed({ ...c, inputs: c.inputs.map((i) => (i.name === inp.name ? { ...i, nominal: value } : i)) });
  return {
    input: inp.name, value, unit: unitOf(inp.dimension), root, rounded: value !== root, output: node.name, target,
    achieved: runValues(c, set).get(node.name)!, outputUnit, design,
  };
}

function readTargetUnit(text: string, exps: Exponents): number {
  if (typeof text !== "string") throw new FormulaError("wrong_type", { formula: "design", input: "target", value: text, expected: "a number in SI or a unit string" });
  const q = parseQuantity(text, "target", "design");
  if (!q.plain && !sameDimension(q.exps, exps)) {
    throw new FormulaError("wrong_dimension", { formula: "design", input: "target", value: text, expected: nameExponents(exps), received: nameExponents(q.exps) });
  }
  return q.si;
}

export interface DesignSweepRequest {
  /** The design input to vary. */
  readonly input: string;
  /** Ends of the range: numbers in SI or unit strings. */
  readonly from: number | string;
  readonly to: number | string;
  /** Number of points, 2..10000. */
  readonly points: number;
  /** "linear" (default) or "log" (geometric; needs positive ends). */
  readonly scale?: "linear" | "log";
}

export interface DesignSweepResult {
  readonly input: string;
  readonly unit: string;
  readonly values: readonly number[];
  /** Every step and derived quantity along the sweep; null where the chain did not compute. */
  readonly outputs: readonly { readonly name: string; readonly unit: string; readonly values: readonly (number | null)[] }[];
  /** Each check as a pass/fail mask along the sweep (false where the chain did not compute). */
  readonly checks: readonly { readonly rule: string; readonly pass: readonly boolean[] }[];
  /** Per point: the error code that stopped the chain, or null. */
  readonly errors: readonly (string | null)[];
}

/**
 * Sweep one design input and record every step output and every check along
 * the way. `options.signal` and `options.onProgress` (progress in points) are
 * checked every few dozen points; a synchronous call sees an abort made
 * before it started or from its own onProgress.
 */
export function sweepDesign(d: DesignLike, request: DesignSweepRequest, options?: LongRunOptions): DesignSweepResult {
  if (typeof request !== "object" || request === null) throw new FormulaError("wrong_type", { formula: "design", input: "request", value: request, expected: "{ input, from, to, points }" });
  const c = compiled(d);
  const inp = c.inputs.find((i) => i.name === request.input);
  if (!inp) throw new FormulaError("unknown_input", { formula: "design", input: String(request.input), detail: "not a design input" });
  const points = option("points", request.points, 0, 2, DESIGN_TOOL_LIMITS.sweepPoints);
  const scale = request.scale ?? "linear";
  if (scale !== "linear" && scale !== "log") throw new FormulaError("invalid_argument", { formula: "design", input: "scale", value: scale, detail: 'scale is "linear" or "log"' });
  const from = readQuantity("design", "from", inp.dimension, request.from);
  const to = readQuantity("design", "to", inp.dimension, request.to);
  if (scale === "log" && !(from > 0 && to > 0)) throw new FormulaError("invalid_argument", { formula: "design", input: "from", detail: "a log sweep needs positive ends" });
  const values: number[] = [];
  for (let k = 0; k < points; k++) {
    const u = k / (points - 1);
    // Weighted means of the ends (to - from overflows for ends near the largest double).
    let t = scale === "log" ? Math.exp(Math.log(from) * (1 - u) + Math.log(to) * u) : from * (1 - u) + to * u;
    if (inp.spec.domain?.integer) t = Math.round(t);
    values.push(t);
  }
  const base = nominalValues(c);
  const outputs = c.nodes.map((n) => ({ name: n.name, unit: unitOf(n.exps), values: [] as (number | null)[] }));
  const checks = c.checks.map((k) => ({ rule: k.text, pass: [] as boolean[] }));
  const errors: (string | null)[] = [];
  const ticks = ticker("sweepDesign", options, points);
  for (let k = 0; k < points; k++) {
    if (k > 0 && k % RUNS_PER_TICK === 0) ticks.tick(k);
    const t = values[k]!;
    let r: Values | undefined;
    let code: string | null = null;
    try {
      r = runValues(c, new Map(base).set(inp.name, t));
    } catch (e) {
      if (!(e instanceof FormulaError)) throw e;
      code = e.code;
    }
    errors.push(code);
    outputs.forEach((o) => o.values.push(r ? r.get(o.name)! : null));
    const ks = r ? checkValues(c, r) : undefined;
    checks.forEach((k, i) => k.pass.push(ks ? ks[i]!.pass : false));
  }
  ticks.finish();
  return { input: inp.name, unit: unitOf(inp.dimension), values, outputs, checks, errors };
}
