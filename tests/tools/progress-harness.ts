import { expect, vi } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { type LongRunOptions, PROGRESS_INTERVAL_MS, type Progress } from "../../src/core/progress.js";

/*
 * Shared by the progress and cancellation tests. The ticker reports at most
 * once per PROGRESS_INTERVAL_MS of performance.now(); `steppedClock` makes
 * that clock step by the interval on every call, so every tick reports and
 * the tests depend on the order of events only, never on how fast the
 * machine is. (Piece sizes follow the real clock: chunks.ts binds it at load.)
 */
export function steppedClock(): { restore(): void } {
  let t = 0;
  const spy = vi.spyOn(performance, "now").mockImplementation(() => (t += PROGRESS_INTERVAL_MS));
  return { restore: () => spy.mockRestore() };
}

/** One watched call: its options, its reports, and reports seen after the abort (must stay 0). */
export interface Watch {
  readonly controller: AbortController;
  readonly options: Required<LongRunOptions>;
  readonly reports: Progress[];
  readonly reason: Error;
  afterAbort: number;
}

/** Options whose onProgress records every report and aborts at the first fraction >= `at` (below 1); never aborts without `at`. */
export function watch(at?: number): Watch {
  const controller = new AbortController();
  const reason = new Error("stopped by the test");
  const w: Watch = {
    controller, reason, reports: [], afterAbort: 0,
    options: {
      signal: controller.signal,
      onProgress: (p) => {
        if (controller.signal.aborted) w.afterAbort++;
        w.reports.push(p);
        if (at !== undefined && p.fraction >= at && p.fraction < 1) controller.abort(reason);
      },
    },
  };
  return w;
}

/**
 * The reports of a call are monotone (done never falls, fraction = done /
 * total, one total), end at 1 exactly once when it completed and never reach
 * 1 when cancelled, and none came after the abort.
 */
export function expectReports(w: Watch, completed: boolean, someReports = true): void {
  const r = w.reports;
  if (someReports) expect(r.length).toBeGreaterThan(0);
  const bad: string[] = [];
  for (let i = 0; i < r.length; i++) {
    const p = r[i]!;
    if (p.total !== r[0]!.total) bad.push(`report ${i}: total ${p.total} != ${r[0]!.total}`);
    if (!(p.fraction >= 0 && p.fraction <= 1) || p.fraction !== (p.total === 0 ? 1 : p.done / p.total)) bad.push(`report ${i}: fraction ${p.fraction} for ${p.done}/${p.total}`);
    if (i > 0 && p.done < r[i - 1]!.done) bad.push(`report ${i}: done fell from ${r[i - 1]!.done} to ${p.done}`);
  }
  expect(bad).toEqual([]);
  const ones = r.filter((p) => p.fraction === 1).length;
  expect(ones).toBe(completed ? 1 : 0);
  if (completed) expect(r.at(-1)!.fraction).toBe(1);
  expect(w.afterAbort).toBe(0);
}

/** The "cancelled" error a call ended with (its cause the signal's reason). */
export function expectCancelled(run: () => unknown, w: Watch): FormulaError {
  let caught: unknown;
  try {
    run();
  } catch (e) {
    caught = e;
  }
  return checkCancelled(caught, w);
}

export async function expectCancelledAsync(run: () => Promise<unknown>, w: Watch): Promise<FormulaError> {
  let caught: unknown;
  try {
    await run();
  } catch (e) {
    caught = e;
  }
  return checkCancelled(caught, w);
}

function checkCancelled(caught: unknown, w: Watch): FormulaError {
  expect(caught, "the call should end with a cancelled FormulaError").toBeInstanceOf(FormulaError);
  const e = caught as FormulaError;
  expect(e.code).toBe("cancelled");
  expect((e as { cause?: unknown }).cause).toBe(w.reason);
  return e;
}

/** A watched call that aborted at fraction `at`: its last report is at or past `at`, below 1. */
export function expectStoppedAt(w: Watch, at: number): void {
  expectReports(w, false);
  const last = w.reports.at(-1)!;
  expect(last.fraction).toBeGreaterThanOrEqual(at);
  expect(last.fraction).toBeLessThan(1);
}
