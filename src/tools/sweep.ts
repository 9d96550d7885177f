import { FormulaError } from "../core/errors.js";
import type { AnyFormula, Formula } from "../core/formula.js";
import { getFormula } from "../core/registry.js";
import { outputDimension, type InputSpecs, type OutputSpec, type QuantityInput } from "../core/spec.js";
import { bind, convertInputs, inDomain, inputKind, isScalarQuantity, readQuantity, siUnit, specsOf } from "./convert.js";
import { noteConditions, noteSummary, type NoteSummary } from "./notes.js";
import { axisTitle, axisUnit, largestMagnitude } from "./axis-units.js";
import { computePoints, scanNotes, type Grid, type SweptInput } from "./sweep-points.js";
import type { QuantityValue } from "./tolerance.js";
import { type LongRunOptions, ticker, watched } from "../core/progress.js";
import { inPieces, tickBelow } from "./chunks.js";

/** One swept input: `points` values from `from` to `to`, evenly spaced or geometric. */
export interface SweepAxisSpec {
  readonly from: QuantityValue;
  readonly to: QuantityValue;
  readonly points: number;
  /** "linear" (default) or "log" (geometric spacing; needs from and to of one sign). */
  readonly scale?: "linear" | "log";
}

export interface SweepSpec<N extends string = string> {
  /** One or two inputs to vary. */
  readonly vary: { readonly [K in N]?: SweepAxisSpec };
  /** The other inputs: numbers in SI, unit strings, choice words, 3-arrays. */
  readonly fixed?: Readonly<Record<string, unknown>>;
}

export interface SweepAxis {
  readonly name: string;
  /** SI unit symbol of the input. */
  readonly unit: string;
  readonly scale: "linear" | "log";
  readonly values: Float64Array;
}

/**
 * A grid of results. For two axes the arrays are row-major: index = i * n1 + j,
 * i along axes[0], j along axes[1].
 *
 * NaN appears here and nowhere else in the library: it marks a point that was
 * not computed (an input outside its domain, a relation broken, or a result out
 * of range). `computed[k]` is 1 where a value was computed, 0 where not.
 *
 * All the arrays are views into one ArrayBuffer (a sweep allocates once);
 * `slice()` one to keep or transfer it apart from the others.
 */
export interface SweepResult {
  readonly formula: string;
  readonly axes: readonly SweepAxis[];
  readonly output: {
    readonly name: string;
    readonly description: string;
    readonly unit: string;
    /** Scalar output values; for formulas with components, the first component. */
    readonly values: Float64Array;
    /** One array per named component (vector outputs), same layout as `values`. */
    readonly components?: Readonly<Record<string, Float64Array>>;
  };
  readonly computed: Uint8Array;
  readonly notComputed: number;
  /**
   * The warnings and cautions raised anywhere on the grid, one entry per
   * condition: kind, how many computed points raised it, and the worst point
   * (largest measure; the first point for always-on cautions) with its inputs
   * and message there. Warnings first, in definition order.
   */
  readonly notes: readonly NoteSummary[];
}

/**
 * Evaluate a formula over a grid of one or two inputs into Float64Arrays.
 * The fixed inputs are checked once; per point one reused inputs object is
 * updated and only the domain checks of the varied inputs, the relations and
 * compute run. Whole-number inputs (counts) are rounded to whole numbers.
 *
 * @example
 * sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 10 } }, fixed: { area: 1e-4 } });
 */
export function sweep<I extends InputSpecs, O extends OutputSpec>(
  formula: Formula<I, O> | string,
  spec: SweepSpec<keyof I & string>,
  options?: LongRunOptions,
): SweepResult {
  const f = typeof formula === "string" ? getFormula(formula) : (formula as unknown as AnyFormula);
  return run(f, spec as SweepSpec, options, "sweep");
}

/** JSON form: `{ formula, vary, fixed }` with unit strings; `options` as sweep's. */
export function sweepRequest(request: { readonly formula: string } & SweepSpec, options?: LongRunOptions): SweepResult {
  if (typeof request !== "object" || request === null) {
    throw new FormulaError("wrong_type", { input: "request", value: request, expected: "an object { formula, vary, fixed }" });
  }
  return run(getFormula(request.formula), request, options, "sweepRequest");
}

/** Most points of one sweep (both axes together). */
export const MAX_POINTS = 4_000_000;

function run(formula: AnyFormula, spec: SweepSpec, options: LongRunOptions | undefined, tool: string): SweepResult {
  const plan = planSweep(formula, spec);
  const t = ticker(tool, options, plan.total);
  const arrays = layoutSweep(plan, new ArrayBuffer(plan.bytes), true);
  const grid = bindGrid(plan, arrays);
  let failed = 0;
  if (!watched(options)) failed = computePoints(formula, grid.g, grid.axis0, grid.axis1);
  else {
    // In pieces with a tick between: points are independent, so the values are those of one loop.
    const work = (start: number, end: number): void => {
      failed += computePoints(formula, grid.g, grid.axis0, grid.axis1, start, end);
    };
    inPieces(0, plan.total, work, (done) => tickBelow(t, done, plan.total));
  }
  const result = finishSweep(plan, arrays, grid, failed);
  t.finish();
  return result;
}

/** A checked sweep request: its axes, sizes and the layout of its one buffer. */
export interface SweepPlan {
  readonly formula: AnyFormula;
  readonly axes: readonly AxisPlan[];
  readonly fixed: Readonly<Record<string, unknown>>;
  readonly n0: number;
  readonly n1: number;
  readonly total: number;
  readonly components: readonly string[] | undefined;
  /** Bytes of the buffer holding every array of the result. */
  readonly bytes: number;
}

/** The checks of a sweep request, before any point is computed. */
export function planSweep(formula: AnyFormula, spec: SweepSpec): SweepPlan {
  const id = formula.id;
  const def = formula.definition;
  const specs = specsOf(formula);
  if (typeof spec !== "object" || spec === null || typeof spec.vary !== "object" || spec.vary === null) {
    throw new FormulaError("invalid_argument", { formula: id, input: "vary", detail: "give { vary: { input: { from, to, points } } }" });
  }
  const names = Object.keys(spec.vary);
  if (names.length < 1 || names.length > 2) {
    throw new FormulaError("invalid_argument", { formula: id, input: "vary", detail: "vary one or two inputs" });
  }
  const fixedRaw = spec.fixed ?? {};
  const plans = names.map((name) => {
    const s = Object.hasOwn(specs, name) ? specs[name] : undefined;
    if (s === undefined) throw new FormulaError("unknown_input", { formula: id, input: name });
    if (!isScalarQuantity(s)) throw new FormulaError("invalid_argument", { formula: id, input: name, detail: `only scalar quantity inputs can be swept; ${inputKind(s)} input is held as given` });
    if (typeof fixedRaw === "object" && fixedRaw !== null && Object.hasOwn(fixedRaw, name)) {
      throw new FormulaError("invalid_argument", { formula: id, input: name, detail: "an input cannot be both swept and fixed" });
    }
    return axisPlan(id, name, s, (spec.vary as Record<string, SweepAxisSpec>)[name]!);
  });
  const n0 = plans[0]!.points;
  const n1 = plans.length === 2 ? plans[1]!.points : 1;
  if (n0 * n1 > MAX_POINTS) throw new FormulaError("invalid_argument", { formula: id, input: "points", detail: `at most ${MAX_POINTS} points in all` });
  const comps = def.output.components as readonly string[] | undefined;
  const total = n0 * n1;
  const fixed = convertInputs(formula, fixedRaw, names);
  // Every array of the result is a view into one buffer: on small and medium
  // sweeps each typed-array allocation costs more than computing its points
  // (bench/sweep.ts), so a sweep allocates once.
  const nc = comps?.length ?? 0;
  const doubles = plans.reduce((sum, p) => sum + p.points, 0) + total * (1 + nc);
  return { formula, axes: plans, fixed, n0, n1, total, components: comps, bytes: doubles * 8 + total };
}

/** The result arrays of a sweep as views into `buffer`. */
export interface SweepArrays {
  readonly axes: readonly SweepAxis[];
  readonly values: Float64Array;
  readonly components: readonly Float64Array[] | undefined;
  readonly computed: Uint8Array;
}

/**
 * Lays the result arrays out in `buffer` (plan.bytes long): axes, values,
 * components, computed. With `fill` the axis values are written; a worker
 * handed a buffer already filled reads them.
 */
export function layoutSweep(plan: SweepPlan, buffer: ArrayBufferLike, fill: boolean): SweepArrays {
  let offset = 0;
  const take = (n: number): Float64Array => {
    const view = new Float64Array(buffer, offset, n);
    offset += n * 8;
    return view;
  };
  const axes = plan.axes.map((p) => {
    const values = take(p.points);
    return fill ? fillAxis(p, values) : { name: p.name, unit: siUnit(p.spec.dimension), scale: p.scale, values };
  });
  const values = take(plan.total);
  const components = plan.components ? plan.components.map(() => take(plan.total)) : undefined;
  const computed = new Uint8Array(buffer, offset, plan.total);
  return { axes, values, components, computed };
}

/** A sweep's grid, bound to its fixed inputs, as the point loops take it. */
export interface BoundGrid {
  readonly g: Grid;
  readonly axis0: SweptInput;
  readonly axis1: SweptInput | undefined;
}

/** Checks the fixed inputs (probed with in-domain axis values) and builds the grid the loops run on. */
export function bindGrid(plan: SweepPlan, arrays: SweepArrays): BoundGrid {
  const formula = plan.formula;
  const specs = specsOf(formula);
  const { axes } = arrays;
  // Probe the fixed inputs with in-domain values of the swept ones: the first in-domain grid value.
  const probes: Record<string, number> = {};
  for (const a of axes) {
    const s = specs[a.name] as QuantityInput;
    probes[a.name] = a.values.find((v) => inDomain(v, s.domain)) ?? a.values[0]!;
  }
  const b = bind(formula, plan.fixed, probes);
  const relations = formula.definition.relations ?? [];
  const compute = formula.definition.compute as (x: unknown) => unknown;
  const name0 = axes[0]!.name;
  const name1 = axes.length === 2 ? axes[1]!.name : undefined;
  const v0 = axes[0]!.values;
  const v1 = name1 !== undefined ? axes[1]!.values : new Float64Array(1);
  const holds = relations.map((r) => r.holds) as ((x: unknown) => boolean)[];
  const g: Grid = { o: b.x, compute, holds, v0, v1, values: arrays.values, components: arrays.components ?? [], computed: arrays.computed };
  const axis0: SweptInput = [name0, (specs[name0] as QuantityInput).domain];
  const axis1: SweptInput | undefined = name1 === undefined ? undefined : [name1, (specs[name1] as QuantityInput).domain];
  return { g, axis0, axis1 };
}

/** The result from a computed grid: the notes scan over every computed point, then the result object. */
export function finishSweep(plan: SweepPlan, arrays: SweepArrays, grid: BoundGrid, failed: number): SweepResult {
  const formula = plan.formula;
  const def = formula.definition;
  const comps = plan.components;
  const notes = gridNotes(formula, grid.g, grid.axis0[0], grid.axis1?.[0], failed);
  const { values, computed } = arrays;
  const componentArrays = arrays.components;
  return {
    formula: formula.id,
    axes: arrays.axes,
    output: {
      name: formula.id,
      description: def.output.description,
      unit: siUnit(outputDimension(def.output, grid.g.o as Record<string, unknown>)),
      values,
      ...(comps && componentArrays ? { components: Object.fromEntries(comps.map((c, i) => [c, componentArrays[i]!])) } : {}),
    },
    computed,
    notComputed: failed,
    notes,
  };
}

/**
 * The notes of a computed grid: a second pass over the computed points
 * (scanNotes), run only when the formula has conditions, so the point loops
 * stay as lean as before (bench/sweep.ts measures them). Messages are built
 * once per condition, at its worst point.
 */
function gridNotes(formula: AnyFormula, g: Grid, name0: string, name1: string | undefined, failed: number): NoteSummary[] {
  const { conditions, kinds } = noteConditions(formula);
  const { o, v0, v1, values, components, computed } = g;
  if (conditions.length === 0 || failed === computed.length) return [];
  const scan = scanNotes(formula, g, name0, name1, conditions);
  const n1 = name1 === undefined ? 1 : v1.length;
  const out: NoteSummary[] = [];
  for (let c = 0; c < conditions.length; c++) {
    if (scan.counts[c] === 0) continue;
    const k = scan.index[c]!;
    const inputs: Record<string, number> = { [name0]: v0[(k / n1) | 0]! };
    if (name1 !== undefined) inputs[name1] = v1[k % n1]!;
    Object.assign(o, inputs);
    const value = components.length === 0 ? values[k]! : components.map((arr) => arr[k]!);
    out.push(noteSummary(conditions[c]!, kinds[c]!, scan.counts[c]!, k, scan.measure[c]!, inputs, o, value));
  }
  return out;
}

export interface AxisPlan {
  readonly name: string;
  readonly spec: QuantityInput;
  readonly from: number;
  readonly to: number;
  readonly points: number;
  readonly scale: "linear" | "log";
}

function axisPlan(id: string, name: string, spec: QuantityInput, a: SweepAxisSpec): AxisPlan {
  if (typeof a !== "object" || a === null) {
    throw new FormulaError("invalid_argument", { formula: id, input: name, detail: "an axis is { from, to, points, scale }" });
  }
  const from = readQuantity(id, name, spec.dimension, a.from);
  const to = readQuantity(id, name, spec.dimension, a.to);
  const points = a.points;
  if (typeof points !== "number" || !Number.isInteger(points) || points < 1 || points > MAX_POINTS) {
    throw new FormulaError("invalid_argument", { formula: id, input: name, value: points, detail: "points must be a whole number from 1" });
  }
  const scale = a.scale ?? "linear";
  if (scale !== "linear" && scale !== "log") {
    throw new FormulaError("invalid_argument", { formula: id, input: name, value: scale, detail: 'scale is "linear" or "log"' });
  }
  if (scale === "log" && !(from * to > 0)) {
    throw new FormulaError("invalid_argument", { formula: id, input: name, detail: "a log sweep needs from and to of the same sign, not zero" });
  }
  return { name, spec, from, to, points, scale };
}

/**
 * The axis values. Every value lies between `from` and `to` and is finite for
 * any finite ends: linear values step from `from` (by half-steps when
 * `to - from` overflows), log values are exp of evenly spaced logs,
 * all kept within the ends.
 */
function fillAxis(p: AxisPlan, values: Float64Array): SweepAxis {
  const { from, to, scale } = p;
  const last = p.points - 1;
  // Branches hoisted out of the loops: this runs once per grid value. A multiply
  // per value, not a divide: its rounding error is far below the spacing, and
  // both ends are set exactly below.
  if (scale === "log") {
    // Log spacing by exp of interpolated logs (sign carried separately).
    const sign = Math.sign(from);
    const la = Math.log(Math.abs(from));
    const lb = Math.log(Math.abs(to));
    const small = Math.min(Math.abs(from), Math.abs(to));
    const large = Math.max(Math.abs(from), Math.abs(to));
    const step = (lb - la) / last;
    for (let i = 1; i < last; i++) values[i] = sign * Math.min(large, Math.max(small, Math.exp(la + i * step)));
  } else {
    // from + i * step, the spacing users expect (1..10 in 10 points gives
    // whole numbers); when to - from overflows (ends of opposite sign near the
    // largest double), half-steps added twice: from + i h is between from and
    // the midpoint and adding i h again reaches at most to. The clamp catches
    // the one-ulp rounding past an end.
    const lo = Math.min(from, to);
    const hi = Math.max(from, to);
    const span = to - from;
    if (span - span === 0) {
      const step = span / last;
      for (let i = 1; i < last; i++) values[i] = Math.min(hi, Math.max(lo, from + i * step));
    } else {
      const half = (to / 2 - from / 2) / last;
      for (let i = 1; i < last; i++) values[i] = Math.min(hi, Math.max(lo, from + i * half + i * half));
    }
  }
  values[0] = from;
  if (last > 0) values[last] = to;
  if (p.spec.domain?.integer) for (let i = 0; i < p.points; i++) values[i] = Math.round(values[i]!);
  return { name: p.name, unit: siUnit(p.spec.dimension), scale, values };
}

// ---- export ----

function header(name: string, unit: string): string {
  const h = unit ? `${name} (${unit})` : name;
  return /[",\n]/.test(h) ? `"${h.replace(/"/g, '""')}"` : h;
}

/**
 * CSV text: one row per point, swept inputs first, then the output (and its
 * components); the header carries the SI units. Points not computed have empty
 * output cells. Numbers are written with full precision (round-trip).
 */
export function sweepToCsv(result: SweepResult): string {
  const cols = result.axes.map((a) => header(a.name, a.unit));
  const comps = result.output.components ? Object.entries(result.output.components) : [];
  if (comps.length === 0) cols.push(header(result.output.name, result.output.unit));
  for (const [c] of comps) cols.push(header(`${result.output.name}.${c}`, result.output.unit));
  const lines = [cols.join(",")];
  const n1 = result.axes.length === 2 ? result.axes[1]!.values.length : 1;
  const total = result.output.values.length;
  for (let k = 0; k < total; k++) {
    const i = Math.floor(k / n1);
    const j = k % n1;
    const row: string[] = [String(result.axes[0]!.values[i])];
    if (result.axes.length === 2) row.push(String(result.axes[1]!.values[j]));
    const ok = result.computed[k] === 1;
    if (comps.length === 0) row.push(ok ? String(result.output.values[k]) : "");
    for (const [, arr] of comps) row.push(ok ? String(arr[k]) : "");
    lines.push(row.join(","));
  }
  return `${lines.join("\n")}\n`;
}

/**
 * A Vega-Lite v5 specification with the data inline: a line chart for one
 * swept input, a heatmap (rect marks coloured by the output) for two. Points
 * not computed are left out. Log-spaced axes get log scales.
 *
 * The inline data stays in SI at full precision; the chart shows each axis in
 * engineering units with a prefix chosen from the data ("gap (mm)",
 * "coaxialCapacitance (pF)"), through a calculate transform per field.
 */
export function sweepToVegaLite(result: SweepResult): Record<string, unknown> {
  const out = result.output;
  const n1 = result.axes.length === 2 ? result.axes[1]!.values.length : 1;
  const values: Record<string, number>[] = [];
  for (let k = 0; k < out.values.length; k++) {
    if (result.computed[k] !== 1) continue;
    const row: Record<string, number> = { [result.axes[0]!.name]: result.axes[0]!.values[Math.floor(k / n1)]! };
    if (result.axes.length === 2) row[result.axes[1]!.name] = result.axes[1]!.values[k % n1]!;
    row[out.name] = out.values[k]!;
    values.push(row);
  }
  // One displayed field per SI field: "<name> shown", the SI value over the prefix factor.
  const fields = [
    ...result.axes.map((a) => ({ name: a.name, unit: axisUnit(a.unit, largestMagnitude(a.values)) })),
    { name: out.name, unit: axisUnit(out.unit, largestMagnitude(out.values, result.computed)) },
  ];
  const shown = (name: string): string => `${name} shown`;
  const title = (i: number): string => axisTitle(fields[i]!.name, fields[i]!.unit);
  const a0 = result.axes[0]!;
  const base = {
    $schema: "https://vega.github.io/schema/vega-lite/v5.json",
    description: `${out.description} (${result.formula})`,
    title: out.description,
    width: 480,
    height: 300,
    data: { values },
    transform: fields.map((f) => ({ calculate: `datum[${JSON.stringify(f.name)}] / ${f.unit.factor}`, as: shown(f.name) })),
  };
  if (result.axes.length === 1) {
    return {
      ...base,
      mark: { type: "line", point: values.length <= 50 },
      encoding: {
        x: { field: shown(a0.name), type: "quantitative", title: title(0), ...(a0.scale === "log" ? { scale: { type: "log" } } : {}) },
        y: { field: shown(out.name), type: "quantitative", title: title(1) },
      },
    };
  }
  const a1 = result.axes[1]!;
  return {
    ...base,
    mark: "rect",
    encoding: {
      x: { field: shown(a0.name), type: "ordinal", title: title(0), axis: { format: ".3~g" } },
      y: { field: shown(a1.name), type: "ordinal", title: title(1), sort: "descending", axis: { format: ".3~g" } },
      // Legend below the plot, so its title (the unit) is not cut short beside it.
      color: { field: shown(out.name), type: "quantitative", title: title(2), legend: { orient: "bottom", direction: "horizontal", titleLimit: 480, gradientLength: 240 } },
    },
  };
}
