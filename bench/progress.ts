/**
 * The cost of progress and cancellation: each long tool called plainly and
 * with a signal and an onProgress (the loop then runs in time-sized pieces
 * with a tick between them), on the same request, in one run. Target: no
 * measurable slowdown (a ratio within the run-to-run noise, about 1.00-1.05).
 */
import { parallelPlateCapacitance } from "../src/index.js";
import { evaluateColumns, sweep, tolerance } from "../src/tools/index.js";
import { type BenchRow, compare, randomArray, times } from "./util.js";

export async function run(): Promise<BenchRow[]> {
  if (typeof sweep !== "function" || sweep.length < 3) return [{ name: "progress overhead", value: "n/a", note: "long-run options not present" }];
  const watched = (): { signal: AbortSignal; onProgress: () => void } => ({ signal: new AbortController().signal, onProgress: () => {} });
  const rows: BenchRow[] = [];
  const N = 1_000_000;
  const spec = { vary: { gap: { from: 1e-5, to: 1e-3, points: N } }, fixed: { area: 1e-4, relativePermittivity: 4.4 } } as const;
  const s = compare({ plain: () => sweep(parallelPlateCapacitance, spec).output.values[N - 1]!, watched: () => sweep(parallelPlateCapacitance, spec, watched()).output.values[N - 1]! }, N, 11);
  rows.push({ name: "sweep 1e6 points, watched vs plain", value: times(s.ratio.watched!), note: "signal + onProgress: pieces of about 4 ms with a tick between" });
  const gap = randomArray(N, 1e-5, 1e-3, 12);
  const out = new Float64Array(N);
  const errors = new Uint8Array(N);
  const c = compare({
    plain: () => evaluateColumns(parallelPlateCapacitance, { area: 1e-4, gap }, { output: out, errors }).output.values[N - 1]!,
    watched: () => evaluateColumns(parallelPlateCapacitance, { area: 1e-4, gap }, { output: out, errors, ...watched() }).output.values[N - 1]!,
  }, N, 11);
  rows.push({ name: "evaluateColumns 1e6 rows, watched vs plain", value: times(c.ratio.watched!), note: "output arrays reused; pieces of about 4 ms" });
  const inputs = { area: { nominal: 1e-4, percent: 2 }, gap: { nominal: 1e-4, plusMinus: 2e-6 } } as const;
  const M = 200_000;
  const t = compare({
    plain: () => tolerance(parallelPlateCapacitance, inputs, { samples: M }).monteCarlo!.mean,
    watched: () => tolerance(parallelPlateCapacitance, inputs, { samples: M, ...watched() }).monteCarlo!.mean,
  }, M, 11);
  rows.push({ name: "tolerance 2e5 samples, watched vs plain", value: times(t.ratio.watched!), note: "a check every 1024 samples" });
  return rows;
}
