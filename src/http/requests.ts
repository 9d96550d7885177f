import type { SweepResult } from "../tools/sweep.js";
import type { HandlerLimits } from "./limits.js";
import { isObject, overLimit } from "./refusal.js";

/*
 * The checks and answer shapes the synchronous routes and the jobs share, so
 * a job's result is the body the synchronous route gives for the same request.
 */

/**
 * The tolerance options to run with: over-limit values refused, the sample
 * count defaulted within the limit. Only numbers are compared here; a value of
 * the wrong type or shape is left to the library, whose checks name it.
 */
export function checkTolerance(body: Record<string, unknown>, limits: Pick<HandlerLimits, "maxSamples" | "maxCornerInputs">): unknown {
  const o = body.options ?? {};
  if (!isObject(o)) return o;
  if (typeof o.samples === "number" && !(o.samples <= limits.maxSamples)) throw overLimit("samples", limits.maxSamples, "samples");
  if (typeof o.maxCornerInputs === "number" && !(o.maxCornerInputs <= limits.maxCornerInputs)) {
    throw overLimit("maxCornerInputs", limits.maxCornerInputs, "corner inputs");
  }
  // Unset: the library's defaults (10000 samples, 12 corner inputs), lowered to a server's tighter limits.
  return {
    ...o,
    ...(o.samples === undefined ? { samples: Math.min(10_000, limits.maxSamples) } : {}),
    ...(o.maxCornerInputs === undefined ? { maxCornerInputs: Math.min(12, limits.maxCornerInputs) } : {}),
  };
}

/** Refuses a sweep grid over the points limit, before computing. */
export function checkSweep(body: Record<string, unknown>, limits: Pick<HandlerLimits, "maxSweepPoints">): void {
  if (!isObject(body.vary)) return;
  const axes = Object.values(body.vary);
  // The library refuses more than two axes before computing; two at most are counted here.
  if (axes.length > 2) return;
  let total = 1;
  for (const a of axes) if (isObject(a) && typeof a.points === "number") total *= a.points;
  if (!(total <= limits.maxSweepPoints)) throw overLimit("points", limits.maxSweepPoints, "points per sweep");
}

/** A sweep result as JSON: typed arrays as arrays, and null (not NaN, which JSON lacks) where a point was not computed. */
export function sweepAnswer(r: SweepResult): unknown {
  const column = (values: Float64Array): (number | null)[] => Array.from(values, (v, k) => (r.computed[k] ? v : null));
  const components = r.output.components;
  return {
    formula: r.formula,
    axes: r.axes.map((a) => ({ name: a.name, unit: a.unit, scale: a.scale, values: Array.from(a.values) })),
    output: {
      name: r.output.name, description: r.output.description, unit: r.output.unit, values: column(r.output.values),
      ...(components ? { components: Object.fromEntries(Object.entries(components).map(([k, v]) => [k, column(v)])) } : {}),
    },
    notComputed: r.notComputed,
    notes: r.notes,
  };
}
