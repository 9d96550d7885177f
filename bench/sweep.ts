/**
 * `sweep` over a grid against a hand-written Float64Array loop computing the
 * same grid and formula (one-axis sweeps of 100 000 and 1000 points, and a
 * 300 x 300 two-axis sweep). Target: within 1.5x for the large sweeps.
 */
import { EPSILON0 } from "../src/constants/si.js";
import { parallelPlateCapacitance } from "../src/index.js";
import { sweep } from "../src/tools/index.js";
import { type BenchRow, compare, ns, times } from "./util.js";

export async function run(): Promise<BenchRow[]> {
  if (typeof sweep !== "function") return [{ name: "sweep vs Float64Array loop", value: "n/a", note: "src/tools sweep not present" }];
  const rows: BenchRow[] = [];
  for (const n of [100_000, 1000]) {
    const from = 1e-4;
    const to = 1e-3;
    const t = compare(
      {
        sweep: () => {
          const r = sweep(parallelPlateCapacitance, { vary: { gap: { from, to, points: n } }, fixed: { area: 1e-4, relativePermittivity: 4.4 } });
          return r.output.values[n - 1]!;
        },
        loop: () => {
          const gap = new Float64Array(n);
          const out = new Float64Array(n);
          const step = (to - from) / (n - 1);
          for (let i = 0; i < n; i++) gap[i] = from + i * step;
          for (let i = 0; i < n; i++) out[i] = (EPSILON0 * 4.4 * 1e-4) / gap[i]!;
          return out[n - 1]!;
        },
      },
      n,
      n > 10_000 ? 11 : 101,
    );
    const what = n > 10_000 ? " (target <= 1.5x)" : "; a plot-sized sweep, where the fixed cost per call (reading the axes and fixed inputs, checking them once) weighs more";
    rows.push({ name: `sweep (1 axis, ${n.toExponential().replace("e+", "e")} points) vs Float64Array loop`, value: times(1 / t.ratio.loop!), note: `sweep ${ns(t.ns.sweep!)}/point, loop ${ns(t.ns.loop!)}/point${what}` });
  }
  {
    const n = 300;
    const t = compare(
      {
        sweep: () => {
          const r = sweep(parallelPlateCapacitance, {
            vary: { area: { from: 1e-5, to: 1e-3, points: n, scale: "log" }, gap: { from: 1e-5, to: 1e-3, points: n } },
            fixed: { relativePermittivity: 4.4 },
          });
          return r.output.values[n * n - 1]!;
        },
        loop: () => {
          const area = new Float64Array(n);
          const gap = new Float64Array(n);
          const out = new Float64Array(n * n);
          const ratioA = Math.log(1e-3 / 1e-5) / (n - 1);
          const step = (1e-3 - 1e-5) / (n - 1);
          for (let i = 0; i < n; i++) {
            area[i] = 1e-5 * Math.exp(i * ratioA);
            gap[i] = 1e-5 + i * step;
          }
          for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = (EPSILON0 * 4.4 * area[i]!) / gap[j]!;
          return out[n * n - 1]!;
        },
      },
      n * n,
      11,
    );
    rows.push({ name: "sweep (2 axes, 300 x 300) vs Float64Array loop", value: times(1 / t.ratio.loop!), note: `sweep ${ns(t.ns.sweep!)}/point, loop ${ns(t.ns.loop!)}/point (target <= 1.5x); the sweep also runs its note pass (the fringing warning's count and worst point over the grid), the loop does not` });
  }
  return rows;
}
