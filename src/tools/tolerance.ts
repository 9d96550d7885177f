import { FormulaError } from "../core/errors.js";
import type { AnyFormula, Formula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import { outputDimension, type InputSpecs, type Note, type OutputSpec, type QuantityInput } from "../core/spec.js";
import { type Binding, bind, convertInputs, inDomain, inputKind, isScalarQuantity, readQuantity, siUnit, specsOf } from "./convert.js";
import { type CollectedNotes, NoteCollector, type NoteSummary } from "./notes.js";
import { BlockStreams, MONTE_CARLO_BLOCK, type Random } from "./random.js";
import { type LongRunOptions, type Ticker, ticker } from "../core/progress.js";

/** A value in SI, or a unit string ("0.2 mm"). */
export type QuantityValue = number | string;

/**
 * How one input varies. A plain value is held at nominal. Plus-minus and
 * percent bands are sampled uniformly in the Monte Carlo; a normal input's
 * worst-case band is mean +- 3 sd.
 */
export type ToleranceSpec =
  | { readonly nominal: QuantityValue; readonly plusMinus: QuantityValue }
  | { readonly nominal: QuantityValue; readonly percent: number }
  | { readonly distribution: "normal"; readonly mean: QuantityValue; readonly sd: QuantityValue }
  | { readonly distribution: "uniform"; readonly min: QuantityValue; readonly max: QuantityValue };

/** An input of a tolerance analysis: a nominal value (number, unit string, choice, vector) or a tolerance. */
export type ToleranceValue = QuantityValue | readonly QuantityValue[] | ToleranceSpec;

export interface ToleranceOptions {
  /** Monte Carlo samples: a whole number from 0 to 1e6 (default 10000; 0 skips the Monte Carlo). */
  readonly samples?: number;
  /** Seed of the generator, a whole number (default 1). Same seed, same samples. */
  readonly seed?: number;
  /**
   * Up to this many toleranced inputs every corner of the box is evaluated: a
   * whole number from 0 to 16 (default 12; 2^16 corners at most); above it only
   * the two corners the slopes point to.
   */
  readonly maxCornerInputs?: number;
}

/** One input's first-order contribution. */
export interface Sensitivity {
  readonly input: string;
  /** d output / d input at nominal, in SI (output unit per input unit). */
  readonly derivative: number;
  /** The unit of the derivative, e.g. "F/m". */
  readonly derivativeUnit: string;
  /** Standard deviation of the input (SI). */
  readonly sd: number;
  /** Share of the RSS variance, 0..1. */
  readonly share: number;
}

export interface ToleranceResult {
  readonly formula: string;
  /** SI unit symbol of the output. */
  readonly unit: string;
  readonly nominal: number;
  readonly worstCase: {
    readonly min: number;
    readonly max: number;
    /** "corners": every corner of the box evaluated; "derivative signs": the two corners the slopes point to. */
    readonly method: "corners" | "derivative signs";
    readonly evaluated: number;
    readonly rejected: number;
  };
  readonly rss: {
    /** Standard deviation of the output from first-order propagation. */
    readonly sd: number;
    /** RSS of each input's band half-width times its slope (the classic "RSS tolerance"). */
    readonly plusMinus: number;
  };
  readonly monteCarlo?: {
    readonly generator: string;
    readonly seed: number;
    readonly samples: number;
    readonly accepted: number;
    /** Samples outside an input's domain or breaking a relation, not computed. */
    readonly rejected: number;
    readonly mean: number;
    readonly sd: number;
    readonly p1: number;
    readonly p5: number;
    readonly p50: number;
    readonly p95: number;
    readonly p99: number;
    readonly min: number;
    readonly max: number;
  };
  /** Largest share first. */
  readonly sensitivities: readonly Sensitivity[];
  /** Remarks on the method: non-monotonic inputs, clipped bands, rejected corners. */
  readonly remarks: readonly string[];
  /**
   * Warnings and cautions over the sampled range, one per code: the text at
   * nominal when the note applies there, else the text at its worst sample.
   */
  readonly warnings: readonly Note[];
  readonly cautions: readonly Note[];
  /**
   * Every note raised over the sampled range with its count and worst sample.
   * Samples are numbered in the order evaluated: 0 is the nominal, then the
   * worst-case corners, then the band scans along each input (17 points per
   * input), then the Monte Carlo samples (rejected ones keep their number).
   */
  readonly notes: readonly NoteSummary[];
  /** How many samples were checked for notes (computed points only). */
  readonly notesOver: number;
}

export interface Varied {
  readonly name: string;
  readonly spec: QuantityInput;
  readonly nominal: number;
  readonly lo: number;
  readonly hi: number;
  readonly sd: number;
  readonly kind: "uniform" | "normal";
}

/**
 * Tolerance analysis of a formula with scalar output: worst-case bounds (box
 * corners, checked against slopes), first-order RSS with each input's share,
 * and a seeded Monte Carlo (xoshiro128**) with percentiles.
 *
 * `options.signal` and `options.onProgress` are checked every 1024 corners and
 * every 1024 Monte Carlo samples (progress counts the worst-case corners, then
 * the samples); a synchronous call sees an abort made before it started or
 * from its own onProgress.
 *
 * @example
 * tolerance(parallelPlateCapacitance, { area: 1e-4, gap: { nominal: 1e-4, percent: 5 } }).worstCase;
 */
export function tolerance<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O>,
  inputs: { readonly [K in keyof I & string]?: ToleranceValue },
  options: ToleranceOptions & LongRunOptions = {},
): ToleranceResult {
  return analyse(formula as unknown as AnyFormula, inputs as Record<string, unknown>, options, options, "tolerance");
}

/**
 * JSON form: `{ formula, inputs, options }` with unit strings; returns plain
 * JSON. Progress and cancellation (not JSON) come in the second argument.
 */
export function toleranceRequest(request: {
  readonly formula: string;
  readonly inputs: Readonly<Record<string, unknown>>;
  readonly options?: ToleranceOptions;
}, options?: LongRunOptions): ToleranceResult {
  if (typeof request !== "object" || request === null) {
    throw new FormulaError("wrong_type", { input: "request", value: request, expected: "an object { formula, inputs }" });
  }
  return analyse(getFormula(request.formula), request.inputs, request.options ?? {}, options, "toleranceRequest");
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function analyse(formula: AnyFormula, inputs: unknown, options: ToleranceOptions, long: LongRunOptions | undefined, tool: string): ToleranceResult {
  const plan = planTolerance(formula, inputs, options, long, tool);
  const t = plan.ticker;
  const { corners, samples } = plan;
  // Ticks below the total only: fraction 1 is finish()'s.
  const hook = long?.signal !== undefined || long?.onProgress !== undefined ? (done: number) => t.tick(corners + done) : undefined;
  const parts = samples > 0 ? [monteCarloRange(formula, plan.b, plan.varied, plan.seed, plan.sampleOffset, 0, samples, hook)] : [];
  const result = finishTolerance(plan, parts);
  t.finish();
  return result;
}

/**
 * Everything a tolerance analysis computes before its Monte Carlo (nominal,
 * slopes, RSS, corners, band scans) and what the Monte Carlo and the summary
 * need. Cheap next to the Monte Carlo, so workers and shards each make it again
 * from the request rather than receive it.
 */
export interface TolerancePlan {
  readonly formula: AnyFormula;
  /** The inputs held at nominal, SI (what `bind` takes). */
  readonly fixed: Readonly<Record<string, unknown>>;
  readonly varied: readonly Varied[];
  readonly samples: number;
  readonly seed: number;
  /** Sample number of the first Monte Carlo sample (the nominal, corners and band scans come first). */
  readonly sampleOffset: number;
  readonly b: Binding;
  readonly collector: NoteCollector;
  readonly notesOver: number;
  readonly nominal: number;
  readonly atNominal: { readonly warnings: readonly Note[]; readonly cautions: readonly Note[] };
  readonly min: number;
  readonly max: number;
  readonly method: "corners" | "derivative signs";
  readonly evaluated: number;
  readonly rejected: number;
  readonly remarks: string[];
  readonly rss: { readonly sd: number; readonly plusMinus: number };
  readonly sensitivities: readonly Sensitivity[];
  readonly unit: string;
  /** Worst-case corners evaluated (the first part of the progress count; the Monte Carlo samples follow). */
  readonly corners: number;
  /** The call's progress and cancellation, over corners + samples; ticked through the corners already. */
  readonly ticker: Ticker;
}

/** What the Monte Carlo over one range of sample numbers found. */
export interface MonteCarloPart {
  /** Samples in the range. */
  readonly samples: number;
  /** The computed results, in sample order (rejected samples left out). */
  readonly values: Float64Array;
  /** The notes over the range's computed samples. */
  readonly notes: CollectedNotes;
}

/**
 * The Monte Carlo samples start..end-1 (sample numbers counted from the first
 * Monte Carlo sample). Sample s draws from stream floor(s / MONTE_CARLO_BLOCK)
 * of the seed (BlockStreams), so every split of 0..samples into ranges gives,
 * range by range, exactly the samples of one run: a range that starts inside
 * a block first replays that block's draws up to its start. `b.x` is varied in
 * place and left at nominal.
 *
 * `between(done)`, when given, is called at every block boundary inside the
 * range with the samples of the range done so far (never with all of them);
 * it may throw (a cancellation) to stop the range.
 */
export function monteCarloRange(
  formula: AnyFormula, b: Binding, varied: readonly Varied[], seed: number, offset: number, start: number, end: number,
  between?: (done: number) => void,
): MonteCarloPart {
  const x = b.x;
  const collector = new NoteCollector(formula, varied.map((v) => v.name));
  const values = new Float64Array(end - start);
  let accepted = 0;
  const n = varied.length;
  const streams = new BlockStreams(seed);
  const first = start - (start % MONTE_CARLO_BLOCK);
  let rng = streams.at(first / MONTE_CARLO_BLOCK);
  // Bounded by end - first <= samples + MONTE_CARLO_BLOCK.
  for (let s = first; s < end; s++) {
    if (s > first && s % MONTE_CARLO_BLOCK === 0) {
      // Once per block: the progress and cancellation check costs nothing per sample.
      if (between !== undefined) between(s - start);
      rng = streams.at(s / MONTE_CARLO_BLOCK);
    }
    let ok = true;
    for (let i = 0; i < n; i++) {
      const v = varied[i]!;
      const t = drawSample(v, rng);
      // A normal sample can step past the largest double: not a value, rejected.
      if (t - t !== 0 || !inDomain(t, v.spec.domain)) ok = false;
      x[v.name] = t;
    }
    if (!ok || s < start) continue;
    const r = b.scalar();
    if (r === r) {
      values[accepted++] = r;
      collector.add(offset + s, x, r);
    }
  }
  for (const v of varied) x[v.name] = v.nominal;
  return { samples: end - start, values: values.subarray(0, accepted), notes: collector.state() };
}

/**
 * The tolerance analysis up to its Monte Carlo (see TolerancePlan). `long`
 * (signal, onProgress) makes the plan's ticker, named `tool`, checked before
 * the nominal is computed and every 1024 corners.
 */
export function planTolerance(formula: AnyFormula, inputs: unknown, options: ToleranceOptions, long?: LongRunOptions, tool = "tolerance"): TolerancePlan {
  const id = formula.id;
  const def = formula.definition;
  if (def.output.components) {
    throw new FormulaError("invalid_argument", { formula: id, detail: "tolerance analysis needs a scalar output; this formula returns components" });
  }
  if (!isPlainObject(inputs)) {
    throw new FormulaError("wrong_type", { formula: id, input: "inputs", value: inputs, expected: "an object of named inputs" });
  }
  const specs = specsOf(formula);
  const plain: Record<string, unknown> = {};
  const varied: Varied[] = [];
  const remarks: string[] = [];
  for (const [name, raw] of Object.entries(inputs)) {
    if (!Object.hasOwn(specs, name)) throw new FormulaError("unknown_input", { formula: id, input: name });
    if (!isPlainObject(raw)) {
      plain[name] = raw;
      continue;
    }
    const spec = specs[name]!;
    if (!isScalarQuantity(spec)) {
      throw new FormulaError("invalid_argument", {
        formula: id, input: name,
        detail: `only scalar quantity inputs can carry a tolerance; ${inputKind(spec)} input is held as given`,
      });
    }
    varied.push(readTolerance(id, name, spec, raw, remarks));
  }
  const fixed = convertInputs(formula, plain);
  if (typeof options !== "object" || options === null || Array.isArray(options)) {
    throw new FormulaError("invalid_argument", { formula: id, input: "options", detail: "options is an object { samples, seed, maxCornerInputs }" });
  }
  const whole = (name: "samples" | "seed" | "maxCornerInputs", fallback: number, min: number, max: number): number => {
    const v = options[name] ?? fallback;
    if (typeof v !== "number" || !Number.isInteger(v) || v < min || v > max) {
      const limits = Number.isFinite(min) ? ` from ${min} to ${max}` : "";
      throw new FormulaError("invalid_argument", { formula: id, input: name, value: typeof v === "number" ? v : undefined, detail: `${name} must be a whole number${limits}` });
    }
    return v;
  };
  const samples = whole("samples", 10000, 0, 1e6);
  const seed = whole("seed", 1, -Infinity, Infinity);
  const maxCorner = whole("maxCornerInputs", 12, 0, 16);
  const corners = varied.length <= maxCorner ? 2 ** varied.length : 2;
  const t = ticker(tool, long, corners + samples);

  // Nominal: the full checks, so a bad nominal input fails as in evaluate.
  const nominalInputs: Record<string, unknown> = { ...fixed };
  for (const v of varied) nominalInputs[v.name] = v.nominal;
  const prepared = formula.prepare(nominalInputs);
  const nominal = formula.run(prepared) as number;
  const atNominal = formula.notes(prepared, nominal);
  const collector = new NoteCollector(formula, varied.map((v) => v.name));
  let sampleIndex = 0;
  let notesOver = 0;
  const collect = (xs: Record<string, unknown>, value: number): void => {
    collector.add(sampleIndex, xs, value);
    notesOver++;
  };
  collect(prepared as Record<string, unknown>, nominal);
  sampleIndex++;

  const probes: Record<string, number> = {};
  for (const v of varied) probes[v.name] = v.nominal;
  const b = bind(formula, fixed, probes);
  const x = b.x;
  const resetNominal = (): void => {
    for (const v of varied) x[v.name] = v.nominal;
  };
  const at = (name: string, value: number): number => {
    x[name] = value;
    const r = b.scalar();
    return r;
  };
  const outUnit = siUnit(outputDimension(def.output, prepared as Record<string, unknown>));

  // ---- slopes (Richardson-extrapolated central differences) ----
  const derivatives = varied.map((v) => {
    resetNominal();
    const d = derivative((t) => at(v.name, t), v, id);
    resetNominal();
    if (d === undefined) remarks.push(`the slope with respect to ${v.name} could not be computed at nominal (a relation or the domain ends there); it is left out of the RSS`);
    return d ?? 0;
  });
  // Scaled sums of squares: slope * sd squared overflows from about 1e154.
  const rssSd = scaledNorm(id, "the RSS standard deviation", derivatives, varied.map((v) => v.sd));
  const rssBand = scaledNorm(id, "the RSS band", derivatives, varied.map((v) => v.hi / 2 - v.lo / 2));
  const sensitivities: Sensitivity[] = varied
    .map((v, i) => {
      const inUnit = siUnit(v.spec.dimension);
      return {
        input: v.name,
        derivative: derivatives[i]!,
        derivativeUnit: `${outUnit || "1"}${inUnit ? `/${inUnit}` : ""}`,
        sd: v.sd,
        share: rssSd.shares[i]!,
      };
    })
    .sort((a, c) => c.share - a.share);

  // ---- worst case ----
  let min = nominal;
  let max = nominal;
  let evaluated = 0;
  let rejected = 0;
  const visit = (): void => {
    const r = b.scalar();
    evaluated++;
    if (r !== r) {
      rejected++;
      sampleIndex++;
      return;
    }
    if (r < min) min = r;
    if (r > max) max = r;
    collect(x, r);
    sampleIndex++;
  };
  const endValue = (v: Varied, high: boolean): number => {
    const e = high ? v.hi : v.lo;
    return v.spec.domain?.integer ? (high ? Math.floor(e) : Math.ceil(e)) : e;
  };
  let method: "corners" | "derivative signs";
  if (varied.length <= maxCorner) {
    method = "corners";
    const n = varied.length;
    for (let mask = 0; mask < 1 << n; mask++) {
      // 2^16 corners at most: a check every 1024 (the last tick is below the total: samples or finish follow).
      if (mask > 0 && (mask & 1023) === 0) t.tick(mask);
      for (let i = 0; i < n; i++) x[varied[i]!.name] = endValue(varied[i]!, (mask & (1 << i)) !== 0);
      visit();
    }
  } else {
    method = "derivative signs";
    remarks.push(`${varied.length} toleranced inputs: only the two corners the slopes point to were evaluated, not all ${2 ** varied.length}`);
    for (const up of [true, false]) {
      varied.forEach((v, i) => (x[v.name] = endValue(v, derivatives[i]! >= 0 === up)));
      visit();
    }
  }
  if (method === "corners" && varied.length > 0) {
    // The corners the slopes at nominal point to should be the extremes when the output is monotonic.
    const slopeCorner = (up: boolean): number => {
      varied.forEach((v, i) => (x[v.name] = endValue(v, derivatives[i]! >= 0 === up)));
      return b.scalar();
    };
    const hi = slopeCorner(true);
    const lo = slopeCorner(false);
    const tol = 1e-9 * Math.max(Math.abs(max), Math.abs(min));
    if ((hi === hi && max - hi > tol) || (lo === lo && lo - min > tol)) {
      remarks.push("the extreme corners are not those the slopes at nominal point to: the output is not monotonic over the tolerance box");
    }
  }
  if (rejected > 0) remarks.push(`${rejected} of ${evaluated} corners break a relation or the domain and were not computed`);
  // Monotonic along each input (others at nominal)? If not, the extremes may lie inside the band.
  for (const v of varied) {
    resetNominal();
    const steps = 16;
    let dir = 0;
    let monotonic = true;
    let prev = NaN;
    for (let k = 0; k <= steps; k++, sampleIndex++) {
      // A weighted mean of the band ends: hi - lo overflows for huge bands.
      let t = v.lo * (1 - k / steps) + v.hi * (k / steps);
      if (v.spec.domain?.integer) t = Math.round(t);
      const r = at(v.name, t);
      if (r !== r) continue;
      collect(x, r);
      if (r < min) min = r;
      if (r > max) max = r;
      if (prev === prev) {
        const s = Math.sign(r - prev);
        if (s !== 0) {
          if (dir !== 0 && s !== dir) monotonic = false;
          dir = s;
        }
      }
      prev = r;
    }
    if (!monotonic) {
      remarks.push(`the output is not monotonic in ${v.name} over its band: the extremes may lie inside the band, so the worst case includes interior samples and the Monte Carlo range`);
    }
  }
  resetNominal();

  return {
    formula, fixed, varied, samples, seed, sampleOffset: sampleIndex, b, collector, notesOver, nominal, atNominal,
    min, max, method, evaluated, rejected, remarks, rss: { sd: rssSd.norm, plusMinus: rssBand.norm }, sensitivities, unit: outUnit,
    corners, ticker: t,
  };
}

/**
 * The result from the plan and the Monte Carlo parts, in sample order (one
 * part per range, the ranges covering 0..samples in order).
 */
export function finishTolerance(plan: TolerancePlan, parts: readonly MonteCarloPart[]): ToleranceResult {
  const { formula, varied, samples, seed, b, collector, nominal, atNominal, method, evaluated, rejected, sensitivities } = plan;
  const id = formula.id;
  const x = b.x;
  const remarks = [...plan.remarks];
  let { min, max } = plan;
  let notesOver = plan.notesOver;
  let monteCarlo: ToleranceResult["monteCarlo"];
  if (samples > 0) {
    let accepted = 0;
    for (const p of parts) accepted += p.values.length;
    // One part (the single-thread run) is used as it is; several are joined in order.
    let values = parts[0]?.values ?? new Float64Array(0);
    if (parts.length > 1) {
      values = new Float64Array(accepted);
      let at = 0;
      for (const p of parts) {
        values.set(p.values, at);
        at += p.values.length;
      }
    }
    for (const p of parts) collector.merge(p.notes);
    notesOver += accepted;
    if (accepted === 0) {
      throw new FormulaError("invalid_argument", { formula: id, detail: "every Monte Carlo sample broke a relation or an input's domain; narrow the tolerances" });
    }
    const acc = values.sort();
    const { mean, sd } = scaledMoments(id, acc);
    const pct = (p: number): number => {
      const pos = (p / 100) * (accepted - 1);
      const i = Math.floor(pos);
      const f = pos - i;
      // Between its neighbours (the clamp catches a one-ulp rounding past them).
      return i + 1 < accepted ? Math.min(acc[i + 1]!, Math.max(acc[i]!, acc[i]! * (1 - f) + acc[i + 1]! * f)) : acc[i]!;
    };
    monteCarlo = {
      generator: `xoshiro128** seeded by splitmix32, one stream per ${MONTE_CARLO_BLOCK} samples (jump-ahead by 2^64); bands uniform, normal inputs by Box-Muller`,
      seed, samples, accepted, rejected: samples - accepted, mean, sd,
      p1: pct(1), p5: pct(5), p50: pct(50), p95: pct(95), p99: pct(99),
      min: acc[0]!, max: acc[accepted - 1]!,
    };
    if (monteCarlo.min < min || monteCarlo.max > max) {
      const bandLimited = varied.every((v) => v.kind === "uniform");
      if (bandLimited) {
        remarks.push("Monte Carlo samples fall outside the corner bounds (the function is not monotonic over the box): the worst case is widened to include them");
        min = Math.min(min, monteCarlo.min);
        max = Math.max(max, monteCarlo.max);
      } else {
        remarks.push("normal inputs: the worst case uses mean +- 3 sd, so Monte Carlo samples can fall outside it");
      }
    }
  }
  const resetNominal = (): void => {
    for (const v of varied) x[v.name] = v.nominal;
  };

  const notes = collector.summaries(x);
  resetNominal();
  // At nominal its own text; a code raised only elsewhere, the text at its worst sample.
  const merge = (here: readonly Note[], kind: "warning" | "caution"): Note[] => {
    const out = [...here];
    for (const s of notes) if (s.kind === kind && !out.some((n) => n.code === s.code)) out.push({ code: s.code, message: s.worst.message });
    return out;
  };
  return {
    formula: id, unit: plan.unit, nominal,
    worstCase: { min, max, method, evaluated, rejected },
    rss: plan.rss,
    ...(monteCarlo ? { monteCarlo } : {}),
    sensitivities, remarks,
    warnings: merge(atNominal.warnings, "warning"), cautions: merge(atNominal.cautions, "caution"),
    notes, notesOver,
  };
}

/**
 * sqrt(sum (a_i b_i)^2) and each term's share of the sum, without forming a
 * square that overflows or underflows: a is divided by its largest magnitude,
 * the products by theirs, so every square lies in [0, 1] before summing.
 * A norm past the largest double is out_of_range (naming `what`).
 */
export function scaledNorm(id: string, what: string, a: readonly number[], b: readonly number[]): { norm: number; shares: number[] } {
  const n = a.length;
  let ma = 0;
  for (let i = 0; i < n; i++) ma = Math.max(ma, Math.abs(a[i]!));
  if (ma === 0) return { norm: 0, shares: new Array<number>(n).fill(0) };
  const c = a.map((ai, i) => (Math.abs(ai) / ma) * Math.abs(b[i]!));
  let mc = 0;
  for (const ci of c) mc = Math.max(mc, ci);
  if (mc === 0) return { norm: 0, shares: new Array<number>(n).fill(0) };
  let q = 0;
  for (const ci of c) q += (ci / mc) ** 2;
  const norm = ma * (mc * Math.sqrt(q));
  if (norm - norm !== 0) {
    throw new FormulaError("out_of_range", { formula: id, detail: `${what} is beyond the double range` });
  }
  return { norm, shares: c.map((ci) => (ci / mc) ** 2 / q) };
}

/**
 * Mean and sample standard deviation of sorted finite values, scaled by the
 * largest magnitude so neither the sum nor the squares overflow: every scaled
 * value lies in [-1, 1], deviations in [-2, 2]. A standard deviation past the
 * largest double (values spread over both signs near it) is out_of_range.
 */
export function scaledMoments(id: string, acc: Float64Array): { mean: number; sd: number } {
  const n = acc.length;
  const m = Math.max(Math.abs(acc[0]!), Math.abs(acc[n - 1]!));
  if (m === 0) return { mean: 0, sd: 0 };
  let sum = 0;
  for (let i = 0; i < n; i++) sum += acc[i]! / m;
  // The scaled mean lies in [-1, 1]; clamp it within the data as the true mean is.
  const scaledMean = sum / n;
  const mean = Math.min(acc[n - 1]!, Math.max(acc[0]!, scaledMean * m));
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (acc[i]! / m - scaledMean) ** 2;
  const sd = n > 1 ? m * Math.sqrt(ss / (n - 1)) : 0;
  if (sd - sd !== 0) throw new FormulaError("out_of_range", { formula: id, detail: "the Monte Carlo standard deviation is beyond the double range" });
  return { mean, sd };
}

export function readTolerance(id: string, name: string, spec: QuantityInput, raw: Record<string, unknown>, remarks: string[]): Varied {
  const q = (field: string, v: unknown): number => {
    if (v === undefined) throw new FormulaError("invalid_argument", { formula: id, input: name, detail: `the tolerance needs "${field}"` });
    return readQuantity(id, name, spec.dimension, v);
  };
  const keys = Object.keys(raw).sort().join(",");
  let nominal: number;
  let lo: number;
  let hi: number;
  let sd: number;
  let kind: "uniform" | "normal" = "uniform";
  const bad = (detail: string): FormulaError => new FormulaError("invalid_argument", { formula: id, input: name, detail });
  if (keys === "nominal,plusMinus" || keys === "nominal,percent") {
    nominal = q("nominal", raw.nominal);
    let h: number;
    if (keys === "nominal,percent") {
      const p = raw.percent;
      if (typeof p !== "number" || !(p >= 0) || !Number.isFinite(p)) throw bad("percent must be a number >= 0");
      h = (Math.abs(nominal) * p) / 100;
    } else {
      h = q("plusMinus", raw.plusMinus);
      if (!(h >= 0)) throw bad("plusMinus must be >= 0");
    }
    lo = nominal - h;
    hi = nominal + h;
    sd = h / Math.sqrt(3);
    if (h - h !== 0 || lo - lo !== 0 || hi - hi !== 0) throw bad("the band reaches beyond the double range (about 1.8e308)");
  } else if (raw.distribution === "normal" && keys === "distribution,mean,sd") {
    kind = "normal";
    nominal = q("mean", raw.mean);
    sd = q("sd", raw.sd);
    if (!(sd >= 0)) throw bad("sd must be >= 0");
    lo = nominal - 3 * sd;
    hi = nominal + 3 * sd;
    if (lo - lo !== 0 || hi - hi !== 0) throw bad("mean +- 3 sd reaches beyond the double range (about 1.8e308)");
  } else if (raw.distribution === "uniform" && keys === "distribution,max,min") {
    lo = q("min", raw.min);
    hi = q("max", raw.max);
    if (!(lo <= hi)) throw bad("min must not exceed max");
    // Halves first: lo + hi and hi - lo overflow for ends near the largest double.
    nominal = lo / 2 + hi / 2;
    sd = (hi / 2 - lo / 2) / Math.sqrt(3);
  } else {
    throw bad('a tolerance is { nominal, plusMinus }, { nominal, percent }, { distribution: "normal", mean, sd } or { distribution: "uniform", min, max }');
  }
  const d = spec.domain;
  if (d?.min !== undefined && lo < d.min) {
    remarks.push(`the band of ${name} reaches below its domain (${d.minExclusive ? ">" : ">="} ${d.min}); worst-case ends are clipped there and Monte Carlo samples outside are rejected`);
    lo = d.minExclusive ? Math.min(nominal, d.min + Math.max(Math.abs(d.min), Math.abs(nominal)) * 1e-9) : d.min;
  }
  if (d?.max !== undefined && hi > d.max) {
    remarks.push(`the band of ${name} reaches above its domain (${d.maxExclusive ? "<" : "<="} ${d.max}); worst-case ends are clipped there and Monte Carlo samples outside are rejected`);
    hi = d.maxExclusive ? Math.max(nominal, d.max - Math.max(Math.abs(d.max), Math.abs(nominal)) * 1e-9) : d.max;
  }
  return { name, spec, nominal, lo, hi, sd, kind };
}

/**
 * d f / d t at the nominal by central differences h, h/2, h/4, h/8 combined by
 * Richardson extrapolation (error O(h^8) for smooth f). h starts at 1e-3 of the
 * input's scale (its nominal or band) and shrinks to stay inside the domain.
 * Undefined when f cannot be computed on both sides.
 */
/** One Monte Carlo draw of a toleranced input (whole numbers rounded); the caller checks the domain. */
export function drawSample(v: Varied, rng: Random): number {
  let t: number;
  if (v.kind === "normal") t = v.nominal + v.sd * rng.normal();
  else {
    // A weighted mean of the band ends: hi - lo overflows for huge bands.
    const u = rng.next();
    t = v.lo * (1 - u) + v.hi * u;
  }
  return v.spec.domain?.integer ? Math.round(t) : t;
}

export function derivative(f: (t: number) => number, v: Varied, _id: string): number | undefined {
  const n = v.nominal;
  const scale = Math.max(Math.abs(n), v.hi / 2 - v.lo / 2, 1e-300);
  let h = 1e-3 * scale;
  const d = v.spec.domain;
  if (d?.min !== undefined) h = Math.min(h, 0.5 * (n - d.min) || h);
  if (d?.max !== undefined) h = Math.min(h, 0.5 * (d.max - n) || h);
  for (let attempt = 0; attempt < 4; attempt++, h /= 16) {
    const levels = 4;
    const t: number[] = [];
    let ok = true;
    for (let j = 0; j < levels; j++) {
      const hj = h / 2 ** j;
      // Near the largest double the probes themselves overflow: no slope from them.
      if (n + hj - (n + hj) !== 0 || n - hj - (n - hj) !== 0) {
        ok = false;
        break;
      }
      // Halves before the difference: f(n + h) - f(n - h) overflows for outputs near the largest double.
      const r = (0.5 * f(n + hj) - 0.5 * f(n - hj)) / hj;
      if (!Number.isFinite(r)) {
        ok = false;
        break;
      }
      t.push(r);
    }
    if (!ok) continue;
    // Neville tableau: after k passes t[j] holds the O(h^(2k+2)) estimate.
    for (let k = 1; k < levels; k++) {
      const w = 4 ** k;
      // t1 + (t1 - t0) / (w - 1), not (w t1 - t0) / (w - 1): w t1 overflows first.
      for (let j = 0; j < levels - k; j++) t[j] = t[j + 1]! + (t[j + 1]! - t[j]!) / (w - 1);
    }
    if (t[0]! - t[0]! !== 0) continue;
    return t[0]!;
  }
  return undefined;
}
