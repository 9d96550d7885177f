import { describe, expect, it, vi } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { PROGRESS_INTERVAL_MS, type Progress, ticker } from "../../src/core/progress.js";

describe("ticker: progress and cancellation of long calls", () => {
  it("reports the first tick, then at most once per interval, never backwards, and ends at 1", () => {
    vi.useFakeTimers({ toFake: ["performance"] });
    try {
      const seen: Progress[] = [];
      const t = ticker("tool", { onProgress: (p) => seen.push(p) }, 100);
      t.tick(10);
      t.tick(20); // within the interval: not reported
      vi.advanceTimersByTime(PROGRESS_INTERVAL_MS);
      t.tick(5); // a lower count never shows as a step back
      t.finish();
      expect(seen.map((p) => p.done)).toEqual([10, 10, 100]);
      expect(seen.at(-1)).toEqual({ fraction: 1, done: 100, total: 100 });
    } finally {
      vi.useRealTimers();
    }
  });

  it("an aborted signal ends the call at the next tick with a coded error carrying the reason", () => {
    const c = new AbortController();
    const t = ticker("tool", { signal: c.signal }, 10);
    t.tick(1);
    c.abort("user");
    let err: unknown;
    try {
      t.tick(2);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(FormulaError);
    expect((err as FormulaError).code).toBe("cancelled");
    expect((err as Error).cause).toBe("user");
  });

  it("an abort from inside onProgress stops before the next chunk; a signal aborted before the call stops it at once", () => {
    const c = new AbortController();
    const t = ticker("tool", { signal: c.signal, onProgress: () => c.abort() }, 10);
    expect(() => t.tick(1)).toThrow(expect.objectContaining({ code: "cancelled" }));
    expect(() => ticker("tool", { signal: AbortSignal.abort() }, 10)).toThrow(expect.objectContaining({ code: "cancelled" }));
  });

  it("refuses a signal that is not an AbortSignal and an onProgress that is not a function, naming them", () => {
    expect(() => ticker("tool", { signal: {} as AbortSignal }, 1)).toThrow(expect.objectContaining({ code: "invalid_argument", input: "signal" }));
    expect(() => ticker("tool", { onProgress: 3 as unknown as () => void }, 1)).toThrow(expect.objectContaining({ code: "invalid_argument", input: "onProgress" }));
  });

  it("an empty call reports fraction 1 at the end", () => {
    const seen: Progress[] = [];
    ticker("tool", { onProgress: (p) => seen.push(p) }, 0).finish();
    expect(seen).toEqual([{ fraction: 1, done: 0, total: 0 }]);
  });
});
