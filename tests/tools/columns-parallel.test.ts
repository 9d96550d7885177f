// columnsParallel: the rows of evaluateColumns split over worker threads give
// evaluateColumns' own result bit for bit for any worker count (values, codes,
// row messages, notes), whatever form the columns take. evaluateColumns itself
// is checked row by row against evaluate in columns.test.ts; here the
// synchronous call is the reference.
import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import type { Progress } from "../../src/core/progress.js";
import { evaluateColumns, MAX_COLUMN_ROWS } from "../../src/tools/columns.js";
import { columnsParallel, MIN_PARALLEL_ROWS } from "../../src/tools/columns-parallel.js";
import { MAX_WORKERS } from "../../src/tools/parallel.js";
import { workerThreads } from "../../src/tools/pool.node.js";
import { poolAboveCounts } from "../helpers/pool.js";
import { expectSameColumns } from "../helpers/columns.js";
import { expectRejection } from "../helpers/errors.js";
import { steppedClock } from "./progress-harness.js";

// Tables above MIN_PARALLEL_ROWS go to the pool whatever their timed first rows say.
poolAboveCounts();

const N = MIN_PARALLEL_ROWS + 1234;

/** A table of parts with bad rows of several kinds and rows that raise the fringing warning (invented values). */
function table(): Record<string, unknown> {
  const area = new Float64Array(N).map((_, i) => 1e-6 * (1 + ((i * 7919) % 1000)));
  const gap: (number | string)[] = Array.from({ length: N }, (_, i) => `${1 + ((i * 104729) % 3000)} um`);
  gap[17] = "-0.1 mm"; // out of domain
  gap[N - 3] = "3 kg"; // wrong dimension
  gap[1000] = "abc"; // unreadable
  area[5] = Number.NaN; // not finite
  area[N - 100] = Number.NaN;
  const relativePermittivity = Array.from({ length: N }, (_, i) => 1 + (i % 9));
  return { area, gap, relativePermittivity };
}

// Generous runner timeouts: from source without the test run's bundle, each pool thread loads the library through tsx.
describe("columnsParallel gives evaluateColumns' result bit for bit", { timeout: 300_000 }, () => {
  it("numbers, unit strings and number arrays, with bad rows and notes, at 1, 2 and 3 workers", async () => {
    const inputs = table();
    const one = evaluateColumns(parallelPlateCapacitance, inputs);
    expect(one.failed).toBe(5);
    expect(one.notes.length).toBeGreaterThan(0);
    for (const workers of [1, 2, 3]) {
      const r = await columnsParallel(parallelPlateCapacitance, inputs, { workers });
      expectSameColumns(r, one, `workers ${workers}`);
      // Plain arrays, as evaluateColumns makes them, on the pool too.
      expect([r.output.values.buffer, r.errors.buffer].map((b) => b instanceof ArrayBuffer)).toEqual([true, true]);
    }
    expect(workerThreads()).toBeGreaterThan(0);
  });

  it("choice columns and outputs with components", async () => {
    const shapes = ["square", "hexagonal", "octagonal", "circular", "triangle", ""];
    const spiral = { outerDiameter: 2e-3, innerDiameter: 1e-3, turns: 5, shape: Array.from({ length: N }, (_, i) => shapes[i % shapes.length]!) };
    expectSameColumns(await columnsParallel("planarSpiralInductance", spiral, { workers: 2 }), evaluateColumns("planarSpiralInductance", spiral), "choices");
    const field = {
      current: 1, radius: 0.1,
      radialDistance: Float64Array.from({ length: N }, (_, i) => (i % 1001) * 2e-4),
      axialDistance: Float64Array.from({ length: N }, (_, i) => ((i % 13) - 6) * 1e-3),
    };
    const one = evaluateColumns("loopField", field);
    expect(one.failed).toBeGreaterThan(0); // points on the wire
    const r = await columnsParallel("loopField", field, { workers: 3 });
    expectSameColumns(r, one, "components");
    expect(r.output.values).toBe(r.output.components!.radial);
  });

  it("fills the caller's arrays (plain or shared) over a row range, leaving the other rows as they were", async () => {
    const inputs = table();
    const from = 1000;
    const to = N - 7;
    const one = evaluateColumns(parallelPlateCapacitance, inputs, { output: new Float64Array(N).fill(-1), errors: new Uint8Array(N).fill(99), from, to });
    for (const shared of [false, true]) {
      const output = shared ? new Float64Array(new SharedArrayBuffer(N * 8)) : new Float64Array(N);
      const errors = shared ? new Uint8Array(new SharedArrayBuffer(N)) : new Uint8Array(N);
      output.fill(-1);
      errors.fill(99);
      const r = await columnsParallel(parallelPlateCapacitance, inputs, { output, errors, from, to, workers: 2 });
      expect(r.output.values).toBe(output);
      expect(r.errors).toBe(errors);
      expectSameColumns(r, one, shared ? "shared arrays" : "plain arrays");
    }
  });

  it("shared input columns are read in place and left unchanged", async () => {
    const area = new Float64Array(new SharedArrayBuffer(N * 8)).map((_, i) => 1e-6 * (1 + (i % 500)));
    const gap = new Float64Array(new SharedArrayBuffer(N * 8)).map((_, i) => (i === 77 ? -1 : 1e-5 * (1 + (i % 300))));
    const before = [area.slice(), gap.slice()];
    const one = evaluateColumns(parallelPlateCapacitance, { area, gap });
    expectSameColumns(await columnsParallel(parallelPlateCapacitance, { area, gap }, { workers: 2 }), one, "shared columns");
    expect([area, gap]).toEqual(before);
  });
});

describe("columnsParallel: bounds, progress and cancellation", { timeout: 300_000 }, () => {
  it("refuses a worker count that is not a whole number from 1 to MAX_WORKERS, naming workers", async () => {
    for (const workers of [0, 1.5, MAX_WORKERS + 1, Number.NaN, "2"]) {
      const e = await expectRejection(columnsParallel(parallelPlateCapacitance, { area: [1e-4], gap: [1e-3] }, { workers: workers as number }));
      expect([e.code, e.input], String(workers)).toEqual(["invalid_argument", "workers"]);
    }
  });

  it("refuses a column longer than MAX_COLUMN_ROWS, naming it, before reading any cell", async () => {
    const e = await expectRejection(columnsParallel(parallelPlateCapacitance, { area: 1e-4, gap: new Float64Array(MAX_COLUMN_ROWS + 1) }, { workers: 2 }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "gap"]);
  });

  it("names bad inputs and options as evaluateColumns does", async () => {
    const e = await expectRejection(columnsParallel(parallelPlateCapacitance, { area: [1e-4, 2e-4], gap: [1e-3] }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "gap"]);
    const f = await expectRejection(columnsParallel(parallelPlateCapacitance, { area: [1e-4], gap: [1e-3] }, { from: 2 }));
    expect([f.code, f.input]).toEqual(["invalid_argument", "from"]);
    const g = await expectRejection(columnsParallel(parallelPlateCapacitance, { area: [1e-4], gap: [1e-3] }, { onProgress: 3 as never }));
    expect([g.code, g.input]).toEqual(["invalid_argument", "onProgress"]);
  });

  it("reports progress that never goes back and ends at fraction 1, on the pool and in the calling thread", async () => {
    const inputs = table();
    for (const [rows, workers] of [[N, 2], [MIN_PARALLEL_ROWS - 1, 2]] as const) {
      const seen: Progress[] = [];
      const part = rows === N ? inputs : { area: (inputs.area as Float64Array).subarray(0, rows), gap: (inputs.gap as string[]).slice(0, rows) };
      const r = await columnsParallel(parallelPlateCapacitance, part, { workers, onProgress: (p) => seen.push(p) });
      expectSameColumns(r, evaluateColumns(parallelPlateCapacitance, part), `progress, ${rows} rows`);
      expect(seen.at(-1)).toEqual({ fraction: 1, done: rows, total: rows });
      for (let i = 1; i < seen.length; i++) expect(seen[i]!.done).toBeGreaterThanOrEqual(seen[i - 1]!.done);
    }
  });

  it("ends with 'cancelled' for an abort before the call, from onProgress, or while the pool runs", async () => {
    const inputs = table();
    const before = new AbortController();
    before.abort("stop");
    const a = await expectRejection(columnsParallel(parallelPlateCapacitance, inputs, { signal: before.signal, workers: 2 }));
    expect([a.code, a.cause]).toEqual(["cancelled", "stop"]);
    // The clock steps on every reading, so the first report comes before the call ends however
    // fast the threads are (with the real clock a quick call reports only its end, at fraction 1).
    const clock = steppedClock();
    try {
      for (const rows of [N, MIN_PARALLEL_ROWS - 1]) {
        const c = new AbortController();
        const part = { area: (inputs.area as Float64Array).subarray(0, rows), gap: (inputs.gap as string[]).slice(0, rows) };
        const e = await expectRejection(columnsParallel(parallelPlateCapacitance, part, { signal: c.signal, workers: 2, onProgress: () => c.abort() }));
        expect(e.code, `${rows} rows`).toBe("cancelled");
      }
    } finally {
      clock.restore();
    }
    const c = new AbortController();
    const p = columnsParallel(parallelPlateCapacitance, inputs, { signal: c.signal, workers: 1 });
    setImmediate(() => c.abort());
    expect((await expectRejection(p)).code).toBe("cancelled");
  });
});
