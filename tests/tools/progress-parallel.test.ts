import { afterAll, afterEach, beforeEach, describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { biotSavart } from "../../src/flux/biot-savart.js";
import { mutualInductance, polylineSelfInductance } from "../../src/inductance/neumann.js";
import { pieceLimit } from "../../src/tools/chunks.js";
import {
  MIN_PARALLEL_FIELD_PAIRS, MIN_PARALLEL_POINTS, MIN_PARALLEL_SAMPLES, MIN_PARALLEL_SEGMENT_PAIRS,
  biotSavartParallel, mutualInductanceParallel, polylineSelfInductanceParallel, poolSplit, sweepParallel, toleranceParallel,
} from "../../src/tools/parallel.js";
import { closeWorkers, poolBusy, workerThreads } from "../../src/tools/pool.node.js";
import { sweep } from "../../src/tools/sweep.js";
import { tolerance } from "../../src/tools/tolerance.js";
import { expectCancelledAsync, expectReports, expectStoppedAt, steppedClock, watch } from "./progress-harness.js";

// Progress and cancellation of the parallel entries with workers: 2, on the
// pool (sizes above the MIN_PARALLEL_* thresholds) and in the calling thread
// (below them). Each watched call equals the synchronous call bit for bit;
// aborted from onProgress at 10 %, 50 % and 99 %, or from a timer set when
// the call starts, it rejects "cancelled" and leaves no pool task queued or
// running (poolBusy() is 0 when the promise settles). On the pool, tasks are
// made small through the test seam (poolSplit: 100 per worker, and every
// task under 1 % of the work, so a completion lies within 1 % of any fraction
// whatever order the tasks finish in); in the calling thread, pieces through
// pieceLimit. The clock steps so that every tick reports (harness).

const AT = [0.1, 0.5, 0.99];
let clock: { restore(): void };
const split = poolSplit.chunksPerWorker;
const minPoolMs = poolSplit.minPoolMs;
const limit = pieceLimit.items;
beforeEach(() => {
  clock = steppedClock();
  poolSplit.chunksPerWorker = 100;
  // Above the counts, to the pool whatever the timed first items say.
  poolSplit.minPoolMs = 0;
});
afterEach(() => {
  clock.restore();
  poolSplit.chunksPerWorker = split;
  poolSplit.minPoolMs = minPoolMs;
  pieceLimit.items = limit;
});
afterAll(async () => {
  await closeWorkers();
  expect(workerThreads()).toBe(0);
});

const circle = (n: number, r: number, z: number): Float64Array => {
  const a = new Float64Array(3 * (n + 1));
  for (let i = 0; i <= n; i++) a.set([r * Math.cos((2 * Math.PI * i) / n), r * Math.sin((2 * Math.PI * i) / n), z], 3 * i);
  return a;
};
const plates = { area: { nominal: 1e-4, percent: 2 }, gap: { nominal: 1e-4, plusMinus: 2e-6 } } as const;
const fieldPoints = (n: number): Float64Array => Float64Array.from({ length: 3 * n }, (_, k) => (k % 3 === 2 ? 0.01 : 0.03 * Math.sin(k)));

interface Case {
  readonly name: string;
  /** Items of the in-thread call (the piece cap is 1/200 of them); 0 on the pool. */
  readonly pieces: number;
  readonly sync: () => unknown;
  readonly parallel: (options: object) => Promise<unknown>;
}

/**
 * A field result (a Float64Array) as its bytes, so equality is bit for bit (NaN payloads, -0), and its
 * properties beside the elements. The bytes as a plain Uint8Array: compared in one loop
 * (tests/helpers/typed-array-equality.ts), where a Buffer or an object of every index went element by element.
 */
const bits = (r: unknown): unknown =>
  r instanceof Float64Array ? { bytes: new Uint8Array(r.buffer, r.byteOffset, r.byteLength), rest: Object.fromEntries(Object.entries(r).filter(([k]) => !/^\d+$/.test(k))) } : r;

const loopPath = circle(1000, 0.05, 0);
const points = fieldPoints(Math.ceil(MIN_PARALLEL_FIELD_PAIRS / 1000) + 7);
const fewPoints = fieldPoints(20_000);
const a = circle(200, 0.1, 0);
const b = circle(30, 0.07, 0.02);
// 300 segments: the longest row (299 pairs) is under 1 % of the pairs, so whichever task is last, a report lies in [0.99, 1).
const self = circle(300, 0.1, 0);
const coil = circle(40, 0.1, 0);

const onPool: Case[] = [
  {
    name: "toleranceParallel", pieces: 0,
    sync: () => tolerance(parallelPlateCapacitance, plates, { samples: 204_800, seed: 3 }),
    parallel: (o) => toleranceParallel(parallelPlateCapacitance, plates, { samples: 204_800, seed: 3, workers: 2, ...o }),
  },
  {
    name: "sweepParallel", pieces: 0,
    sync: () => sweep(parallelPlateCapacitance, { vary: { gap: { from: -1e-5, to: 1e-3, points: MIN_PARALLEL_POINTS } }, fixed: { area: 1e-4 } }),
    parallel: (o) => sweepParallel(parallelPlateCapacitance, { vary: { gap: { from: -1e-5, to: 1e-3, points: MIN_PARALLEL_POINTS } }, fixed: { area: 1e-4 } }, { workers: 2, ...o }),
  },
  {
    name: "biotSavartParallel", pieces: 0,
    sync: () => biotSavart(loopPath, 3, points),
    parallel: (o) => biotSavartParallel(loopPath, 3, points, { workers: 2, ...o }),
  },
  {
    name: "mutualInductanceParallel", pieces: 0,
    sync: () => mutualInductance(a, b),
    parallel: (o) => mutualInductanceParallel(a, b, { workers: 2, ...o }),
  },
  {
    name: "polylineSelfInductanceParallel", pieces: 0,
    sync: () => polylineSelfInductance(self, 1e-3),
    parallel: (o) => polylineSelfInductanceParallel(self, 1e-3, { workers: 2, ...o }),
  },
];

const inThread: Case[] = [
  {
    name: "sweepParallel", pieces: 200_000,
    sync: () => sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-5, to: 1e-3, points: 200_000 } }, fixed: { area: 1e-4 } }),
    parallel: (o) => sweepParallel(parallelPlateCapacitance, { vary: { gap: { from: 1e-5, to: 1e-3, points: 200_000 } }, fixed: { area: 1e-4 } }, { workers: 2, ...o }),
  },
  {
    name: "biotSavartParallel", pieces: 20_000,
    sync: () => biotSavart(coil, 3, fewPoints),
    parallel: (o) => biotSavartParallel(coil, 3, fewPoints, { workers: 2, ...o }),
  },
  {
    name: "mutualInductanceParallel", pieces: 200,
    sync: () => mutualInductance(circle(200, 0.1, 0), circle(20, 0.07, 0.02)),
    parallel: (o) => mutualInductanceParallel(circle(200, 0.1, 0), circle(20, 0.07, 0.02), { workers: 2, ...o }),
  },
  {
    name: "polylineSelfInductanceParallel", pieces: 90,
    sync: () => polylineSelfInductance(circle(90, 0.1, 0), 1e-3),
    parallel: (o) => polylineSelfInductanceParallel(circle(90, 0.1, 0), 1e-3, { workers: 2, ...o }),
  },
];

it("the sizes lie on the sides of the pool thresholds they are meant to", () => {
  expect(1000 * points.length / 3).toBeGreaterThanOrEqual(MIN_PARALLEL_FIELD_PAIRS);
  expect(200 * 30).toBeGreaterThanOrEqual(MIN_PARALLEL_SEGMENT_PAIRS);
  expect((300 * 299) / 2).toBeGreaterThanOrEqual(MIN_PARALLEL_SEGMENT_PAIRS);
  expect(204_800).toBeGreaterThanOrEqual(MIN_PARALLEL_SAMPLES);
  expect(200_000).toBeLessThan(MIN_PARALLEL_POINTS);
  expect(40 * 20_000).toBeLessThan(MIN_PARALLEL_FIELD_PAIRS);
  expect(200 * 20).toBeLessThan(MIN_PARALLEL_SEGMENT_PAIRS);
  expect((90 * 89) / 2).toBeLessThan(MIN_PARALLEL_SEGMENT_PAIRS);
});

// Generous runner timeouts: without the test run's bundle (tests/global-setup.ts)
// each pool thread loads the library through tsx, which takes tens of seconds on
// a loaded machine.
for (const [where, cases] of [["on the pool", onPool], ["in the calling thread", inThread]] as const) {
  describe.each(cases)(`$name ${where}`, { timeout: 300_000 }, ({ pieces, sync, parallel }) => {
    beforeEach(() => {
      if (pieces > 0) pieceLimit.items = Math.max(1, Math.floor(pieces / 200));
    });

    it("gives the synchronous result bit for bit when watched, with monotone reports ending at 1 once", async () => {
      const w = watch();
      const r = await parallel(w.options);
      expect(poolBusy()).toBe(0);
      expect(bits(r)).toStrictEqual(bits(sync()));
      expectReports(w, true);
    });

    it.each(AT)("rejects 'cancelled' with no task left when aborted from onProgress at %s", async (at) => {
      const w = watch(at);
      await expectCancelledAsync(() => parallel(w.options), w);
      expect(poolBusy()).toBe(0);
      expectStoppedAt(w, at);
    });

    it("rejects 'cancelled' with no task left when aborted from a timer while it runs", async () => {
      const w = watch();
      const timer = setTimeout(() => w.controller.abort(w.reason), 0);
      try {
        await expectCancelledAsync(() => parallel(w.options), w);
      } finally {
        clearTimeout(timer);
      }
      expect(poolBusy()).toBe(0);
      expectReports(w, false, false);
    });
  });
}

describe("the pool after cancellations", { timeout: 300_000 }, () => {
  it("runs the next call to the same result (no stale cancel flag or progress)", async () => {
    const w = watch(0.5);
    await expectCancelledAsync(() => onPool[0]!.parallel(w.options), w);
    const r = await onPool[0]!.parallel({});
    expect(r).toStrictEqual(onPool[0]!.sync());
    expect(poolBusy()).toBe(0);
  });

  it("rejects at once, before any task, with a signal aborted before the call", async () => {
    const w = watch();
    w.controller.abort(w.reason);
    await expectCancelledAsync(() => onPool[1]!.parallel(w.options), w);
    expect(w.reports).toEqual([]);
    expect(poolBusy()).toBe(0);
  });
});
