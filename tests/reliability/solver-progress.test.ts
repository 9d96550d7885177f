/**
 * Progress and cancellation of the synchronous solvers (src/core/progress.ts):
 * for each solver, an abort from onProgress at 10 %, 50 % and 99 % ends the
 * call with "cancelled" and no later report; progress is monotone and ends at
 * fraction 1 exactly once; a run with the options returns, bit for bit, what
 * a run without them returns; a signal aborted before the call does no work;
 * bad options are refused by name.
 *
 * What the solvers compute is checked against published values in each
 * family's own tests (tests/inductance/neumann, tests/flux/biot-savart, ...);
 * here the inputs are only sized so that a run takes a few hundred ticks.
 * The clock is stubbed so that every tick reports (the real rate is at most
 * one report per PROGRESS_INTERVAL_MS): the tests then see every tick and
 * need no timing.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { type LongRunOptions, PROGRESS_INTERVAL_MS, type Progress } from "../../src/core/progress.js";
import { electron } from "../../src/constants/index.js";
import {
  biotSavart, type FluxDensity, type Length, mutualInductance, pathForce, polylineSelfInductance, type Time, traceParticle, type TraceOptions, type Vec3, type Velocity,
} from "../../src/index.js";
import { errorOf } from "../helpers/errors.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

/** Regular n-gon of radius R at height z, closed (last point = first). */
function polygon(n: number, R: number, z: number): Float64Array {
  const p = new Float64Array(3 * (n + 1));
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n;
    p[3 * i] = R * Math.cos(t);
    p[3 * i + 1] = R * Math.sin(t);
    p[3 * i + 2] = z;
  }
  p.copyWithin(3 * n, 0, 3);
  return p;
}

/** n field points on the axis of a loop of radius 1 m, from z = 0.1 to 2 m. */
function axisPoints(n: number): Float64Array {
  const p = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) p[3 * i + 2] = 0.1 + (1.9 * i) / n;
  return p;
}

/** An electron at 1e6 m/s in 1 mT along z (omega dt = 0.018 at dt = 1e-13 s), every 1000th step stored. */
function electronTrace(steps: number, fluxDensity: TraceOptions["fluxDensity"], o?: LongRunOptions) {
  return traceParticle({
    particle: electron,
    position: [0, 0, 0] as unknown as Vec3<Length>,
    velocity: [1e6, 0, 0] as unknown as Vec3<Velocity>,
    fluxDensity,
    timeStep: 1e-13 as Time,
    steps,
    sampleEvery: 1000,
    ...o,
  });
}

interface Solver {
  readonly name: string;
  /** One call of the solver, with the long-run options given (or none). */
  readonly run: (options?: LongRunOptions) => unknown;
}

const solvers: Solver[] = [
  // 200 x 4096 segment pairs: one row of 4096 pairs per tick, 200 ticks.
  { name: "mutualInductance", run: (o) => mutualInductance(polygon(200, 0.1, 0), polygon(4096, 0.12, 0.05), o) },
  // 1400 segments: 979,300 pairs in about 240 blocks of rows.
  { name: "polylineSelfInductance", run: (o) => polylineSelfInductance(polygon(1400, 0.1, 0), 1e-3, o) },
  // 1024 segments: 256 points per tick, 112 ticks (the last at 111/112 > 0.99).
  { name: "biotSavart", run: (o) => biotSavart(polygon(1024, 1, 0), 1, axisPoints(112 * 256), undefined, o) },
  // 128 segments on path 2: one tick per segment.
  { name: "pathForce", run: (o) => pathForce(polygon(64, 0.1, 0), 3, polygon(128, 0.12, 0.01), -2, o) },
  // Uniform field: a tick every 16384 steps, 128 ticks.
  { name: "traceParticle (uniform field)", run: (o) => electronTrace(128 * 16_384, [0, 0, 1e-3] as unknown as Vec3<FluxDensity>, o) },
  // A field function: a tick every 1024 steps, 128 ticks.
  { name: "traceParticle (field function)", run: (o) => electronTrace(128 * 1024, (_x, _y, z) => [0, 0, 1e-3 * (1 + z)], o) },
];

let clock = 0;
beforeEach(() => {
  // Every reading of the clock is one report interval later: every tick reports.
  vi.spyOn(performance, "now").mockImplementation(() => (clock += PROGRESS_INTERVAL_MS));
});
afterEach(() => {
  vi.restoreAllMocks();
});

/** Checks a list of reports: monotone, within 0..1, and (when complete) ending at 1 exactly once. */
function progressProblems(seen: readonly Progress[], complete: boolean): string[] {
  const wrong: string[] = [];
  const total = seen[0]?.total;
  seen.forEach((p, i) => {
    if (p.total !== total) wrong.push(`report ${i}: total ${p.total} changed from ${total}`);
    if (!(p.fraction >= 0 && p.fraction <= 1)) wrong.push(`report ${i}: fraction ${p.fraction}`);
    if (p.fraction !== (p.total === 0 ? 1 : p.done / p.total)) wrong.push(`report ${i}: fraction ${p.fraction} is not done / total`);
    if (i > 0 && p.done < seen[i - 1]!.done) wrong.push(`report ${i}: done ${p.done} after ${seen[i - 1]!.done}`);
  });
  const ones = seen.filter((p) => p.fraction === 1).length;
  if (complete && (ones !== 1 || seen.at(-1)?.fraction !== 1)) wrong.push(`${ones} reports of fraction 1, last ${seen.at(-1)?.fraction}`);
  if (!complete && ones !== 0) wrong.push(`a cancelled call reported fraction 1`);
  return wrong;
}

describe.each(solvers)("$name: progress and cancellation", ({ run }) => {
  it("reports monotone progress over many ticks, ending at fraction 1 once, and returns what a call without options returns", () => {
    const seen: Progress[] = [];
    const withOptions = run({ signal: new AbortController().signal, onProgress: (p) => seen.push(p) });
    expect(progressProblems(seen, true)).toEqual([]);
    expect(seen.length).toBeGreaterThan(100);
    expect(seen.at(-1)!.done).toBe(seen.at(-1)!.total);
    // Bit for bit (toEqual compares numbers with Object.is, arrays element by element).
    expect(withOptions).toEqual(run());
  });

  it.each([0.1, 0.5, 0.99])("an abort from onProgress at fraction %s ends the call with 'cancelled' and no later report", (at) => {
    const c = new AbortController();
    const seen: Progress[] = [];
    let abortedAfter = -1;
    const e = errorOf(() =>
      run({
        signal: c.signal,
        onProgress: (p) => {
          seen.push(p);
          if (p.fraction >= at && !c.signal.aborted) {
            c.abort(new Error("enough"));
            abortedAfter = seen.length;
          }
        },
      }),
    );
    expect(e?.code).toBe("cancelled");
    expect((e as Error | undefined)?.cause).toEqual(new Error("enough"));
    expect(abortedAfter).toBeGreaterThan(0);
    expect(seen.length).toBe(abortedAfter);
    expect(seen.at(-1)!.fraction).toBeGreaterThanOrEqual(at);
    expect(progressProblems(seen, false)).toEqual([]);
  });

  it("a signal aborted before the call ends it before any work, with no report", () => {
    const seen: Progress[] = [];
    resetLoopCount();
    const e = errorOf(() => run({ signal: AbortSignal.abort(), onProgress: (p) => seen.push(p) }));
    expect(e?.code).toBe("cancelled");
    expect(loopCount().total).toBe(0);
    expect(seen).toEqual([]);
  });

  it("refuses a signal that is not an AbortSignal and an onProgress that is not a function, naming them", () => {
    const signal = errorOf(() => run({ signal: {} as AbortSignal }));
    expect([signal?.code, signal?.input]).toEqual(["invalid_argument", "signal"]);
    const report = errorOf(() => run({ onProgress: "every second" as unknown as () => void }));
    expect([report?.code, report?.input]).toEqual(["invalid_argument", "onProgress"]);
  });
});
