import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { FormulaError } from "../../src/core/errors.js";
import { defineFormula } from "../../src/core/formula.js";
import { biotSavart } from "../../src/flux/biot-savart.js";
import { mutualInductance, polylineSelfInductance } from "../../src/inductance/neumann.js";
import {
  MAX_WORKERS, MIN_PARALLEL_FIELD_PAIRS, MIN_PARALLEL_POINTS, MIN_PARALLEL_SAMPLES, MIN_PARALLEL_SEGMENT_PAIRS,
  biotSavartParallel, mutualInductanceParallel, polylineSelfInductanceParallel, poolSplit, splitRange, sweepParallel, toleranceParallel,
} from "../../src/tools/parallel.js";
import { closeWorkers, workerThreads } from "../../src/tools/pool.node.js";
import { poolAboveCounts } from "../helpers/pool.js";
import { sweep } from "../../src/tools/sweep.js";
import { tolerance } from "../../src/tools/tolerance.js";
import { expectRejection } from "../helpers/errors.js";

// Bit-identical results for any worker count: each parallel call is compared
// with the synchronous call (one thread, in order) by exact equality. The
// pool's threads are started once and shared by the tests below, then closed.
// Calls above the MIN_PARALLEL_* counts go to the pool whatever their timed
// first items say (the seam poolSplit.minPoolMs at 0), so the pool is tested on
// any machine; the estimate itself has its own test below.
const COUNTS = [1, 2, 3];
poolAboveCounts();

describe("the estimate of the work", { timeout: 300_000 }, () => {
  it("keeps a call above the counts in the calling thread when its timed first items say the rest is short, with the same result", async () => {
    await closeWorkers();
    poolSplit.minPoolMs = Number.POSITIVE_INFINITY;
    try {
      const spec = { vary: { gap: { from: -1e-5, to: 1e-3, points: MIN_PARALLEL_POINTS + 5 } }, fixed: { area: 1e-4 } };
      const r = await sweepParallel(parallelPlateCapacitance, spec, { workers: 2 });
      const one = sweep(parallelPlateCapacitance, spec);
      expect(Buffer.from(r.output.values.buffer).equals(Buffer.from(one.output.values.buffer))).toBe(true);
      expect(r.notes).toStrictEqual(one.notes);
      const plates = { area: { nominal: 1e-4, percent: 2 }, gap: { nominal: 1e-4, plusMinus: 2e-6 } };
      const t = await toleranceParallel(parallelPlateCapacitance, plates, { samples: MIN_PARALLEL_SAMPLES + 3000, seed: 9, workers: 2 });
      expect(t).toStrictEqual(tolerance(parallelPlateCapacitance, plates, { samples: MIN_PARALLEL_SAMPLES + 3000, seed: 9 }));
      // No thread was started.
      expect(workerThreads()).toBe(0);
    } finally {
      poolSplit.minPoolMs = 0;
    }
  });
});

describe("worker count and formulas", () => {
  it("refuses a worker count that is not a whole number from 1 to MAX_WORKERS, naming workers", async () => {
    for (const workers of [0, -1, 1.5, MAX_WORKERS + 1, Number.NaN, "2"]) {
      const e = await expectRejection(toleranceParallel(parallelPlateCapacitance, { area: 1e-4, gap: 1e-4 }, { workers: workers as number }));
      expect([e.code, e.input], String(workers)).toEqual(["invalid_argument", "workers"]);
    }
  });

  it("refuses a formula that is not the registry's own (threads look formulas up by id)", async () => {
    const own = defineFormula({
      id: "parallelPlateCapacitance", title: "t", category: "capacitance", description: "d", equation: "C = x",
      inputs: [{ name: "gap", dimension: "Length", description: "g", example: 1 }],
      output: { dimension: "Length", description: "o" }, source: { authors: "common practice" }, compute: (x: { gap: number }) => x.gap,
    } as never);
    const e = await expectRejection(sweepParallel(own as never, { vary: { gap: { from: 1, to: 2, points: 3 } } } as never, { workers: 2 }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "formula"]);
  });

  it("splits ranges into contiguous pieces on the alignment, covering every index once", () => {
    for (const [total, workers, align] of [[10, 3, 1], [5000, 2, 1024], [1, 8, 1], [1_000_000, 3, 1024]] as const) {
      const r = splitRange(total, workers, align);
      expect(r[0]![0]).toBe(0);
      expect(r.at(-1)![1]).toBe(total);
      for (let i = 1; i < r.length; i++) {
        expect(r[i]![0]).toBe(r[i - 1]![1]);
        expect(r[i]![0] % align).toBe(0);
      }
    }
  });
});

// Generous runner timeouts: without the test run's bundle (tests/global-setup.ts) each pool
// thread loads the library through tsx, which takes tens of seconds on a loaded machine
// (not a timing check of the results).
describe("parallel calls on the pool give the synchronous result bit for bit", { timeout: 300_000 }, () => {
  it("tolerance Monte Carlo (uniform and normal inputs, notes) with 1, 2 and 3 workers", async () => {
    const inputs = {
      area: { nominal: 1e-4, percent: 2 },
      gap: { distribution: "normal", mean: 1e-4, sd: 3e-6 },
      relativePermittivity: { distribution: "uniform", min: 4.3, max: 4.5 },
    } as const;
    const samples = MIN_PARALLEL_SAMPLES + 12_345;
    const one = tolerance(parallelPlateCapacitance, inputs, { samples, seed: 11 });
    for (const workers of COUNTS) {
      const r = await toleranceParallel(parallelPlateCapacitance, inputs, { samples, seed: 11, workers });
      expect(r, `workers ${workers}`).toStrictEqual(one);
    }
    // The pool was used (threads idle until they time out or are closed).
    expect(workerThreads()).toBeGreaterThan(0);
  });

  it("sweeps of one and two inputs with 1, 2 and 3 workers, notes included", async () => {
    const specs = [
      { vary: { gap: { from: 1e-6, to: 1e-2, points: MIN_PARALLEL_POINTS + 333, scale: "log" as const } }, fixed: { area: "1 cm^2" } },
      { vary: { gap: { from: -1e-4, to: 1e-2, points: 500 }, area: { from: 1e-6, to: 1, points: 500, scale: "log" as const } } },
    ];
    for (const spec of specs) {
      const one = sweep(parallelPlateCapacitance, spec);
      for (const workers of COUNTS) {
        const r = await sweepParallel(parallelPlateCapacitance, spec, { workers });
        expect(r.notComputed).toBe(one.notComputed);
        expect(r.notes).toStrictEqual(one.notes);
        expect(Buffer.compare(Buffer.from(r.output.values.slice().buffer), Buffer.from(one.output.values.slice().buffer)), `workers ${workers}`).toBe(0);
        expect(Buffer.compare(Buffer.from(r.computed.slice()), Buffer.from(one.computed.slice()))).toBe(0);
        // Plain arrays, as sweep returns them, on the pool too.
        expect(r.output.values.buffer).toBeInstanceOf(ArrayBuffer);
      }
    }
  });

  it("Biot-Savart field maps, with the inside-conductor warning, and the first bad point's error", async () => {
    const loop = new Float64Array([1, 1, 0, -1, 1, 0, -1, -1, 0, 1, -1, 0, 1, 1, 0]);
    const n = Math.ceil(MIN_PARALLEL_FIELD_PAIRS / 4) + 101;
    const points = new Float64Array(3 * n);
    for (let p = 0; p < n; p++) {
      points[3 * p] = -1.5 + (3 * (p % 997)) / 997 + 1e-7;
      points[3 * p + 1] = 0.99955 + (p % 13) * 1e-4;
      points[3 * p + 2] = ((p % 7) - 3) * 1e-3;
    }
    const one = biotSavart(loop, 2, points, undefined, { wireRadius: 5e-4 });
    expect(one.warnings.length).toBe(1);
    for (const workers of COUNTS) {
      const r = await biotSavartParallel(loop, 2, points, { wireRadius: 5e-4, workers });
      expect(Buffer.compare(Buffer.from(r.buffer), Buffer.from(one.buffer)), `workers ${workers}`).toBe(0);
      expect(r.warnings).toStrictEqual(one.warnings);
      expect(r.buffer).toBeInstanceOf(ArrayBuffer);
    }
    // Two points on the filament, both in the second half: the error names the first, as the synchronous call does.
    const bad = points.slice();
    bad.set([0, 1, 0], 3 * (n - 50));
    bad.set([1, 0, 0], 3 * (n - 10));
    let expected: FormulaError | undefined;
    try {
      biotSavart(loop, 2, bad);
    } catch (e) {
      expected = e as FormulaError;
    }
    const e = await expectRejection(biotSavartParallel(loop, 2, bad, { workers: 3 }));
    expect([e.code, e.message]).toEqual([expected!.code, expected!.message]);
  });

  it("Biot-Savart field maps into a given plain or shared output array, from plain or shared points", async () => {
    const loop = new Float64Array([1, 1, 0, -1, 1, 0, -1, -1, 0, 1, -1, 0, 1, 1, 0]);
    const n = Math.ceil(MIN_PARALLEL_FIELD_PAIRS / 4) + 7;
    const plain = new Float64Array(3 * n);
    for (let p = 0; p < 3 * n; p++) plain[p] = 0.3 * Math.sin(p * 0.7) + 0.01;
    const sharedPoints = new Float64Array(new SharedArrayBuffer(plain.length * 8));
    sharedPoints.set(plain);
    const one = biotSavart(loop, 2, plain);
    for (const points of [plain, sharedPoints]) {
      for (const out of [new Float64Array(plain.length + 3).fill(7), new Float64Array(new SharedArrayBuffer((plain.length + 3) * 8)).fill(7)]) {
        const r = await biotSavartParallel(loop, 2, points, { out, workers: 2 });
        expect(r).toBe(out);
        expect(Buffer.compare(Buffer.from(out.buffer, 0, plain.length * 8), Buffer.from(one.buffer)), `${points === plain ? "plain" : "shared"} points`).toBe(0);
        // Entries past the points are left as they were.
        expect(Array.from(out.subarray(plain.length))).toEqual([7, 7, 7]);
      }
    }
    // The caller's points are read, never written.
    expect(Buffer.compare(Buffer.from(sharedPoints.buffer), Buffer.from(plain.buffer))).toBe(0);
  });

  it("Neumann mutual and self-inductance of polylines with 1, 2 and 3 workers", async () => {
    const circle = (n: number, r: number, z: number): Float64Array => {
      const a = new Float64Array(3 * (n + 1));
      for (let i = 0; i <= n; i++) a.set([r * Math.cos((2 * Math.PI * i) / n), r * Math.sin((2 * Math.PI * i) / n), z], 3 * i);
      return a;
    };
    const a = circle(100, 0.1, 0);
    const b = circle(60, 0.07, 0.02);
    expect(100 * 60).toBeGreaterThanOrEqual(MIN_PARALLEL_SEGMENT_PAIRS);
    const m = mutualInductance(a, b);
    const coil = circle(130, 0.05, 0);
    expect((130 * 129) / 2).toBeGreaterThanOrEqual(MIN_PARALLEL_SEGMENT_PAIRS);
    const l = polylineSelfInductance(coil, 5e-4);
    for (const workers of COUNTS) {
      expect(Object.is(await mutualInductanceParallel(a, b, { workers }), m), `workers ${workers}`).toBe(true);
      expect(Object.is(await polylineSelfInductanceParallel(coil, 5e-4, { workers }), l), `workers ${workers}`).toBe(true);
    }
  });

  it("leaves no thread running once the pool is closed", async () => {
    await closeWorkers();
    expect(workerThreads()).toBe(0);
  });
});
