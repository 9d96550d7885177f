import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { getFormula } from "../../src/core/registry.js";
import { pieceLimit, timedHead } from "../../src/tools/chunks.js";
import { evaluateColumns } from "../../src/tools/columns.js";
import { CANCEL_CELL, controlCells, finalCell, progressCell, runTask, type PoolTask } from "../../src/tools/pool-tasks.js";
import { layoutSweep, planSweep, sweep, sweepRequest } from "../../src/tools/sweep.js";
import { planTolerance, tolerance, toleranceRequest } from "../../src/tools/tolerance.js";
import { expectCancelled, expectReports, expectStoppedAt, steppedClock, watch } from "./progress-harness.js";

// Progress and cancellation of the synchronous tools. Every call is made
// three ways: plainly, watched to the end (the same result, bit for bit, and
// reports that are monotone and end at 1 once), and aborted from onProgress at
// 10 %, 50 % and 99 % (a "cancelled" error carrying the signal's reason, no
// report after the abort). Pieces are capped at 1/200 of the work through the
// test seam (pieceLimit), so a piece boundary lies within 1 % of any fraction.

const AT = [0.1, 0.5, 0.99];
let clock: { restore(): void };
const limit = pieceLimit.items;
beforeEach(() => {
  clock = steppedClock();
});
afterEach(() => {
  clock.restore();
  pieceLimit.items = limit;
});

interface Case {
  readonly name: string;
  /** Items of the call: the piece cap is set to 1/200 of them. */
  readonly items: number;
  readonly call: (options: object | undefined) => unknown;
}

const N = 100_000;
const gaps = Float64Array.from({ length: N }, (_, i) => 1e-5 + i * 1e-9);
const plates = { area: { nominal: 1e-4, percent: 2 }, gap: { nominal: 1e-4, plusMinus: 2e-6 } } as const;
const cases: Case[] = [
  { name: "sweep (one axis)", items: N, call: (o) => sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-5, to: 1e-3, points: N } }, fixed: { area: 1e-4 } }, o) },
  {
    name: "sweepRequest (two axes, unit strings, points outside the domain)", items: 300 * 300,
    call: (o) => sweepRequest({ formula: "parallelPlateCapacitance", vary: { area: { from: "1 mm^2", to: "1 cm^2", points: 300 }, gap: { from: "-0.1 mm", to: "1 mm", points: 300 } } }, o),
  },
  // 200 blocks of 1024 samples: a check at every block boundary.
  { name: "tolerance", items: 204_800, call: (o) => tolerance(parallelPlateCapacitance, plates, { samples: 204_800, seed: 5, ...o }) },
  { name: "toleranceRequest", items: 204_800, call: (o) => toleranceRequest({ formula: "parallelPlateCapacitance", inputs: plates, options: { samples: 204_800 } }, o as never) },
  { name: "evaluateColumns", items: N, call: (o) => evaluateColumns(parallelPlateCapacitance, { area: "1 cm^2", gap: gaps }, o ?? {}) },
  { name: "evaluateColumns over a range of rows", items: N / 2, call: (o) => evaluateColumns(parallelPlateCapacitance, { area: "1 cm^2", gap: gaps }, { from: N / 4, to: (3 * N) / 4, ...o }) },
];

describe.each(cases)("$name", ({ items, call }) => {
  it("gives the plain result bit for bit when watched, with monotone reports ending at 1 once", () => {
    pieceLimit.items = Math.floor(items / 200);
    const plain = call(undefined);
    const w = watch();
    expect(call(w.options)).toStrictEqual(plain);
    expectReports(w, true);
    // Not every piece: the clock steps, so every tick reported; there were many.
    expect(w.reports.length).toBeGreaterThan(50);
  });

  it.each(AT)("stops with 'cancelled' when aborted from onProgress at %s of the work", (at) => {
    pieceLimit.items = Math.floor(items / 200);
    const w = watch(at);
    expectCancelled(() => call(w.options), w);
    expectStoppedAt(w, at);
  });

  it("does no work with a signal aborted before the call, and reports nothing", () => {
    const w = watch();
    w.controller.abort(w.reason);
    expectCancelled(() => call(w.options), w);
    expect(w.reports).toEqual([]);
  });

  it("refuses a signal that is not an AbortSignal and an onProgress that is not a function, naming them", () => {
    for (const [key, value] of [["signal", { aborted: "no" }], ["onProgress", 3]] as const) {
      let code: unknown;
      let input: unknown;
      try {
        call({ [key]: value });
      } catch (e) {
        ({ code, input } = e as { code: unknown; input: unknown });
      }
      expect([code, input]).toEqual(["invalid_argument", key]);
    }
  });
});

describe("the timed first items of a call that may go to the pool", () => {
  it("runs pieces from the start on multiples of the alignment, at most an eighth of the items, and estimates the rest", () => {
    const ranges: [number, number][] = [];
    const seen: number[] = [];
    const { done, restMs } = timedHead(1024 * 1000, (a, b) => ranges.push([a, b]), (d) => seen.push(d), 1024, 1024);
    expect(ranges[0]![0]).toBe(0);
    for (let i = 1; i < ranges.length; i++) expect(ranges[i]![0]).toBe(ranges[i - 1]![1]);
    expect(ranges.every(([a, b]) => a % 1024 === 0 && b % 1024 === 0 && b > a)).toBe(true);
    expect(ranges.at(-1)![1]).toBe(done);
    expect(seen).toEqual(ranges.map(([, b]) => b));
    expect(done).toBeLessThanOrEqual(1024 * 1000 / 8);
    expect(Number.isFinite(restMs) && restMs >= 0).toBe(true);
    // A range of fewer items than the alignment is done whole.
    expect(timedHead(5, () => {}, () => {}, 1024, 1024).done).toBe(5);
  });
});

describe("a pool task's block hook", () => {
  it("stores the samples done at each block boundary, then the task's size when finished", () => {
    const f = getFormula("parallelPlateCapacitance");
    const plan = planTolerance(f, plates, { samples: 10 * 1024 });
    const control = new Int32Array(new SharedArrayBuffer(4 * controlCells(1))).fill(-1);
    control[CANCEL_CELL] = 0;
    const varied = plan.varied.map(({ spec: _spec, ...rest }) => rest);
    const task: PoolTask = { kind: "tolerance", formula: f.id, fixed: plan.fixed, varied, seed: 1, offset: plan.sampleOffset, start: 0, end: 10 * 1024, control, slot: 0 };
    const out = runTask(task);
    expect(out.ok).toBe(true);
    // The last boundary inside the range is the start of the tenth block.
    expect([control[progressCell(0)], control[finalCell(0)]]).toEqual([9 * 1024, 10 * 1024]);
  });

  it("stores a columns task's rows done between its pieces, and gives the rows and notes of the unwatched task", () => {
    // Rows of invented plates, some raising the fringing warning; pieces capped at 1/10 of the rows.
    const n = 20_000;
    const table = (): Extract<PoolTask, { kind: "columns" }>["table"] => ({
      formula: "parallelPlateCapacitance", rows: n,
      numbers: [
        { name: "area", data: Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + (i % 97))) },
        { name: "gap", data: Float64Array.from({ length: n }, (_, i) => 1e-5 * (1 + (i % 301))) },
      ],
      choices: [], fixed: {}, probes: { area: 1e-6, gap: 1e-5 },
      values: new Float64Array(n), components: [], errors: new Uint8Array(n),
    });
    const plain = table();
    const one = runTask({ kind: "columns", table: plain, start: 0, end: n });
    pieceLimit.items = n / 10;
    const watchedTable = table();
    const control = new Int32Array(new SharedArrayBuffer(4 * controlCells(1))).fill(-1);
    control[CANCEL_CELL] = 0;
    const out = runTask({ kind: "columns", table: watchedTable, start: 0, end: n, control, slot: 0 });
    expect(out).toStrictEqual(one);
    expect(Buffer.from(watchedTable.values.buffer).equals(Buffer.from(plain.values.buffer))).toBe(true);
    // Pieces grow from 256 rows; the last boundary lies within the last tenth of the rows.
    expect(control[progressCell(0)]).toBeGreaterThanOrEqual(n - n / 10);
    expect(control[progressCell(0)]).toBeLessThan(n);
    expect(control[finalCell(0)]).toBe(n);
  });

  it("fills a sweep task's range over a reused buffer as over a fresh one (the range is cleared first)", () => {
    const f = getFormula("parallelPlateCapacitance");
    const spec = { vary: { gap: { from: -1e-5, to: 1e-3, points: 5000 } }, fixed: { area: 1e-4 } };
    const plan = planSweep(f, spec);
    const fresh = new SharedArrayBuffer(plan.bytes);
    layoutSweep(plan, fresh, true);
    const used = new SharedArrayBuffer(plan.bytes);
    const bytes = new Uint8Array(used);
    bytes.fill(0x55);
    bytes.set(new Uint8Array(fresh, 0, 5000 * 8));
    const a = runTask({ kind: "sweep", formula: f.id, spec, buffer: fresh, start: 0, end: 5000 });
    const b = runTask({ kind: "sweep", formula: f.id, spec, buffer: used, start: 0, end: 5000 });
    expect(b).toStrictEqual(a);
    expect(a.ok && a.value).toBeGreaterThan(0); // negative gaps are not computed
    expect(Buffer.from(used).equals(Buffer.from(fresh))).toBe(true);
  });

  it("ends a task before its work when the cancel flag is set, as a cancelled outcome", () => {
    const f = getFormula("parallelPlateCapacitance");
    const plan = planSweep(f, { vary: { gap: { from: 1e-5, to: 1e-3, points: 5000 } }, fixed: { area: 1e-4 } });
    const buffer = new SharedArrayBuffer(plan.bytes);
    layoutSweep(plan, buffer, true);
    const control = new Int32Array(new SharedArrayBuffer(4 * controlCells(1))).fill(-1);
    control[CANCEL_CELL] = 1;
    const out = runTask({ kind: "sweep", formula: f.id, spec: { vary: { gap: { from: 1e-5, to: 1e-3, points: 5000 } }, fixed: { area: 1e-4 } }, buffer, start: 0, end: 5000, control, slot: 0 });
    expect(out.ok ? "ok" : out.error.code).toBe("cancelled");
    expect([control[progressCell(0)], control[finalCell(0)]]).toEqual([0, -1]);
    expect(new Uint8Array(buffer, plan.bytes - 5000).every((c) => c === 0)).toBe(true);
  });
});
