/**
 * Worker threads: speed-up of the parallel entries at 2 workers over the
 * synchronous call (a 1e6-sample Monte Carlo of coaxialCoilsMutualInductance,
 * a 1e6-point Biot-Savart field map), and the small-job overhead near the
 * pool's thresholds. Runs against the built package (dist/node: the pool and
 * its worker file exist only there; `npm run build` first). The pool is warmed
 * (threads started) before timing; its start-up is reported on its own.
 * Each pair is timed alternately, medians of a few rounds, ratios per round.
 */
import { loadavg } from "node:os";
import { type BenchRow, median, sink } from "./util.js";

type Lib = typeof import("../src/index.js");

/**
 * Wall time and the process's CPU time (all threads, user + system), ms, and
 * the minor page faults (first touches of fresh memory, 4 KiB each: a fresh
 * result array costs them in either call, as the allocator hands out reused
 * or new pages).
 */
async function timeIt(f: () => Promise<unknown> | unknown): Promise<{ wall: number; cpu: number; faults: number }> {
  const f0 = process.resourceUsage().minorPageFault;
  const c0 = process.cpuUsage();
  const t0 = process.hrtime.bigint();
  const v = await f();
  const wall = Number(process.hrtime.bigint() - t0) / 1e6;
  const c = process.cpuUsage(c0);
  sink(typeof v === "number" ? v : 1);
  return { wall, cpu: (c.user + c.system) / 1000, faults: process.resourceUsage().minorPageFault - f0 };
}

interface Pair {
  readonly sync: number;
  readonly par: number;
  readonly speedUp: number;
  /** Median CPU ms of each. */
  readonly syncCpu: number;
  readonly parCpu: number;
  /** Median cores the process got while running each (CPU time / wall time). */
  readonly syncCores: number;
  readonly parCores: number;
  /** Median minor page faults of each. */
  readonly syncFaults: number;
  readonly parFaults: number;
}

/**
 * Median ms of each, and the median over rounds of (sync time / parallel
 * time); with the CPU time of each and the cores the process got. On a
 * machine with more runnable threads than cores the scheduler gives the
 * process a share (Linux groups threads by session, sched_autogroup), and a
 * second thread then gains nothing: the cores columns show it.
 */
async function pair(sync: () => unknown, par: () => Promise<unknown>, rounds: number): Promise<Pair> {
  const s: number[] = [];
  const p: number[] = [];
  const r: number[] = [];
  const sc: number[] = [];
  const pc: number[] = [];
  const sf: number[] = [];
  const pf: number[] = [];
  for (let i = 0; i < rounds; i++) {
    const a = await timeIt(sync);
    const b = await timeIt(par);
    s.push(a.wall);
    p.push(b.wall);
    r.push(a.wall / b.wall);
    sc.push(a.cpu);
    pc.push(b.cpu);
    sf.push(a.faults);
    pf.push(b.faults);
  }
  const cores = (cpu: number[], wall: number[]): number => median(cpu.map((c, i) => c / wall[i]!));
  return { sync: median(s), par: median(p), speedUp: median(r), syncCpu: median(sc), parCpu: median(pc), syncCores: cores(sc, s), parCores: cores(pc, p), syncFaults: median(sf), parFaults: median(pf) };
}

const ms = (v: number): string => (v >= 1000 ? `${(v / 1000).toFixed(2)} s` : `${v.toFixed(1)} ms`);
/**
 * Wall times, CPU times, cores and page faults of a pair, for a row's note,
 * and the speed-up two workers could reach on an idle machine from the CPU
 * times (2 x sync CPU / parallel CPU: robust to load, unlike the wall times).
 */
const detail = (x: Pair): string =>
  `${ms(x.sync)} -> ${ms(x.par)}; CPU ${ms(x.syncCpu)} -> ${ms(x.parCpu)} (idle bound ${((2 * x.syncCpu) / x.parCpu).toFixed(2)}x), cores used ${x.syncCores.toFixed(2)} -> ${x.parCores.toFixed(2)}, page faults ${x.syncFaults} -> ${x.parFaults}`;

export async function run(): Promise<BenchRow[]> {
  let lib: Lib;
  try {
    lib = (await import(new URL("../dist/node/index.js", import.meta.url).href)) as Lib;
  } catch {
    return [{ name: "parallel", value: "skipped", note: "needs the built package (npm run build)" }];
  }
  const rows: BenchRow[] = [];
  const load = (): string => `load ${loadavg()[0]!.toFixed(1)}`;
  const coil = lib.coaxialCoilsMutualInductance;
  const inputs = {
    turns1: 100, radius1: { nominal: 0.01, percent: 1 }, length1: { nominal: 0.02, percent: 1 },
    turns2: 50, radius2: { nominal: 0.015, percent: 1 }, length2: 0.01, distance: { nominal: 0.03, plusMinus: 0.001 },
  } as const;

  // Pool start-up: the first parallel call starts two threads, each loading the library.
  const cold = (await timeIt(() => lib.toleranceParallel(coil, inputs, { samples: lib.MIN_PARALLEL_SAMPLES, workers: 2 }))).wall;
  rows.push({ name: "pool start-up (2 threads, first call)", value: ms(cold), note: `a ${lib.MIN_PARALLEL_SAMPLES}-sample Monte Carlo including thread start; ${load()}` });

  const big = await pair(
    () => lib.tolerance(coil, inputs, { samples: 1e6 }),
    () => lib.toleranceParallel(coil, inputs, { samples: 1e6, workers: 2 }),
    3,
  );
  rows.push({ name: "Monte Carlo 1e6 samples, coaxialCoilsMutualInductance: 2 workers", value: `${big.speedUp.toFixed(2)}x`, note: `speed-up (target >= 1.7x); ${detail(big)}; ${load()}` });

  const loop = new Float64Array(3 * 17);
  for (let i = 0; i <= 16; i++) loop.set([0.05 * Math.cos((2 * Math.PI * i) / 16), 0.05 * Math.sin((2 * Math.PI * i) / 16), 0], 3 * i);
  const n = 1_000_000;
  const points = new Float64Array(3 * n);
  for (let p = 0; p < n; p++) points.set([-0.1 + 0.2 * ((p % 1000) / 999), -0.1 + 0.2 * (Math.floor(p / 1000) / 999), 0.01], 3 * p);
  const out = new Float64Array(3 * n);
  const map = await pair(
    () => lib.biotSavart(loop, 1, points, out),
    () => lib.biotSavartParallel(loop, 1, points, { out, workers: 2 }),
    5,
  );
  rows.push({ name: "field map 1e6 points x 16 segments (biotSavart): 2 workers", value: `${map.speedUp.toFixed(2)}x`, note: `speed-up (target >= 1.7x); ${detail(map)}; ${load()}` });

  // A table of 1e6 parts: evaluateColumns against columnsParallel, output arrays reused by both.
  const rowsN = 1_000_000;
  const area = Float64Array.from({ length: rowsN }, (_, i) => 1e-6 * (1 + ((i * 7919) % 1000)));
  const gapCol = Float64Array.from({ length: rowsN }, (_, i) => 1e-6 * (1 + ((i * 104729) % 3000)));
  const colOut = new Float64Array(rowsN);
  const colErrors = new Uint8Array(rowsN);
  const cols = await pair(
    () => lib.evaluateColumns(lib.parallelPlateCapacitance, { area, gap: gapCol }, { output: colOut, errors: colErrors }),
    () => lib.columnsParallel(lib.parallelPlateCapacitance, { area, gap: gapCol }, { output: colOut, errors: colErrors, workers: 2 }),
    5,
  );
  rows.push({ name: "columns 1e6 rows (parallelPlateCapacitance): 2 workers", value: `${cols.speedUp.toFixed(2)}x`, note: `speed-up; ${detail(cols)}; ${load()}` });

  // Small jobs: at and above the pool's thresholds (below them the parallel entries run in the calling thread).
  for (const k of [1, 2, 5]) {
    const samples = k * lib.MIN_PARALLEL_SAMPLES;
    const r = await pair(() => lib.tolerance(coil, inputs, { samples }), () => lib.toleranceParallel(coil, inputs, { samples, workers: 2 }), 7);
    rows.push({ name: `small job: Monte Carlo ${samples} samples, 2 workers`, value: `${r.speedUp.toFixed(2)}x`, note: `speed-up (below 1: the pool does not pay); ${detail(r)}; ${load()}` });
  }
  // A cheap formula (about a hundred nanoseconds a sample): above the count, the timed first samples keep it in the calling thread.
  const plates = { area: { nominal: 1e-4, percent: 2 }, gap: { nominal: 1e-4, plusMinus: 2e-6 } } as const;
  for (const k of [1, 5]) {
    const samples = k * lib.MIN_PARALLEL_SAMPLES;
    const r = await pair(() => lib.tolerance(lib.parallelPlateCapacitance, plates, { samples }), () => lib.toleranceParallel(lib.parallelPlateCapacitance, plates, { samples, workers: 2 }), 7);
    rows.push({ name: `small job: Monte Carlo ${samples} samples of parallelPlateCapacitance, 2 workers`, value: `${r.speedUp.toFixed(2)}x`, note: `speed-up (the estimate keeps it in the calling thread below ${lib.MIN_POOL_MS} ms of work); ${detail(r)}; ${load()}` });
  }
  for (const k of [1, 4]) {
    const pts = (k * lib.MIN_PARALLEL_FIELD_PAIRS) / 16;
    const sub = points.subarray(0, 3 * Math.round(pts));
    const r = await pair(() => lib.biotSavart(loop, 1, sub), () => lib.biotSavartParallel(loop, 1, sub, { workers: 2 }), 7);
    rows.push({ name: `small job: field map ${sub.length / 3} points x 16 segments, 2 workers`, value: `${r.speedUp.toFixed(2)}x`, note: `speed-up; ${detail(r)}; ${load()}` });
  }
  for (const k of [1, 4]) {
    const pointsN = k * lib.MIN_PARALLEL_POINTS;
    const spec = { vary: { gap: { from: 1e-5, to: 1e-3, points: pointsN } }, fixed: { area: 1e-4 } };
    const r = await pair(() => lib.sweep(lib.parallelPlateCapacitance, spec), () => lib.sweepParallel(lib.parallelPlateCapacitance, spec, { workers: 2 }), 7);
    rows.push({ name: `small job: sweep ${pointsN} points (parallelPlateCapacitance), 2 workers`, value: `${r.speedUp.toFixed(2)}x`, note: `speed-up; ${detail(r)}; ${load()}` });
  }
  await lib.closeWorkers();
  return rows;
}
