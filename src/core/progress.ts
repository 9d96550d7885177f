import { FormulaError } from "./errors.js";

/*
 * Progress and cancellation for long calls (sweeps, tolerance, columns, the
 * field and force solvers, particle tracing, designs). Every long call takes
 * `signal` and `onProgress` in its options and drives one Ticker: the loop
 * calls `tick(done)` between chunks of work (never per item, so the check
 * costs nothing measurable), and `finish()` once at the end.
 *
 * - The signal is read at every tick: an aborted signal ends the call within
 *   one chunk with a "cancelled" FormulaError (its `cause` is the signal's
 *   reason). A signal aborted before the call starts ends it before any work.
 * - onProgress is called at most once per PROGRESS_INTERVAL_MS (the first
 *   tick always reports), with `done` never decreasing, and once more with
 *   fraction 1 when the work completes; never after a cancellation.
 *
 * A synchronous call can only see an abort made before it started or from
 * inside its own onProgress (the event loop does not run meanwhile); the
 * asynchronous entries (the *Parallel calls) yield between chunks, so any
 * abort reaches them.
 */

/** What onProgress receives. */
export interface Progress {
  /** done / total, 0..1; exactly 1 once, at the end. */
  readonly fraction: number;
  /** Items finished (points, samples, rows, segment pairs, steps: the call's own unit). */
  readonly done: number;
  /** Items in the whole call. */
  readonly total: number;
}

/**
 * What the library reads of an AbortSignal. Any AbortSignal (Node's, the
 * browser's) fits; declared here so that the library's types need neither
 * the DOM library nor @types/node in a consumer's compilation.
 */
export interface AbortSignalLike {
  readonly aborted: boolean;
  readonly reason?: unknown;
  addEventListener(type: "abort", listener: () => void, options?: { readonly once?: boolean }): void;
  removeEventListener(type: "abort", listener: () => void): void;
}

/** The options every long call accepts. */
export interface LongRunOptions {
  /** Ends the call within one chunk of work, with a "cancelled" FormulaError. */
  readonly signal?: AbortSignalLike;
  /** Called with the progress at most every PROGRESS_INTERVAL_MS, and once at the end with fraction 1. */
  readonly onProgress?: (progress: Progress) => void;
}

/** True when the options ask for progress or cancellation (else a long call runs its loop in one piece, as before). */
export function watched(options: LongRunOptions | undefined): boolean {
  return options !== undefined && options !== null && (options.signal !== undefined || options.onProgress !== undefined);
}

/** Least time between two onProgress calls, ms. */
export const PROGRESS_INTERVAL_MS = 100;

/** The "cancelled" error of `tool`, carrying the signal's reason as its cause. */
export function cancelledError(tool: string, signal: AbortSignalLike | undefined): FormulaError {
  const e = new FormulaError("cancelled", { formula: tool, detail: "the call was cancelled through its AbortSignal" });
  if (signal !== undefined) Object.defineProperty(e, "cause", { value: signal.reason, enumerable: false, configurable: true });
  return e;
}

/** One long call's progress and cancellation. */
export interface Ticker {
  /** Throws "cancelled" if the signal is aborted; reports `done` when the interval has passed. */
  tick(done: number): void;
  /** Reports fraction 1 (after a last cancellation check). */
  finish(): void;
  /** Throws "cancelled" if the signal is aborted (no report). */
  check(): void;
}

// Looked up per call (a test may replace performance.now to drive the report
// rate), and only when a long call runs: in Node 20 the first read of the
// global `performance` loads perf_hooks, which `import "emquant"` need not pay.
const now = (): number => (typeof performance !== "undefined" ? performance.now() : Date.now());

/**
 * The Ticker of a call of `tool` over `total` items. Checks the options'
 * `signal` and `onProgress` (invalid_argument naming them) and throws
 * "cancelled" at once if the signal is already aborted.
 */
export function ticker(tool: string, options: LongRunOptions | undefined, total: number): Ticker {
  const signal = options?.signal;
  const report = options?.onProgress;
  if (signal !== undefined && (typeof signal !== "object" || signal === null || typeof (signal as { aborted?: unknown }).aborted !== "boolean")) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "signal", detail: "signal is an AbortSignal" });
  }
  if (report !== undefined && typeof report !== "function") {
    throw new FormulaError("invalid_argument", { formula: tool, input: "onProgress", detail: "onProgress is a function" });
  }
  const check = (): void => {
    if (signal?.aborted) throw cancelledError(tool, signal);
  };
  check();
  let last = -Infinity;
  let best = 0;
  const size = total > 0 ? total : 0;
  const send = (done: number): void => {
    best = Math.min(size, Math.max(best, done));
    report!({ fraction: size === 0 ? 1 : best / size, done: best, total: size });
  };
  return {
    check,
    tick(done: number): void {
      check();
      if (report === undefined) return;
      const t = now();
      if (t - last < PROGRESS_INTERVAL_MS) return;
      last = t;
      send(done);
      // The callback may have aborted the signal: stop before the next chunk.
      check();
    },
    finish(): void {
      check();
      if (report !== undefined) {
        best = size;
        report({ fraction: 1, done: size, total: size });
      }
    },
  };
}

/** Resolves on the next turn of the event loop, so abort events and timers run between chunks. */
export function nextTurn(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof setImmediate === "function") setImmediate(resolve);
    else setTimeout(resolve, 0);
  });
}
