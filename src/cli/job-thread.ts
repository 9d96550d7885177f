import { readFileSync, writeFileSync } from "node:fs";
import { parentPort, workerData } from "node:worker_threads";
import { runCli } from "./run.js";

/*
 * The job thread of a long command (job.ts starts it): runs the command line
 * here, so the main thread's event loop stays free to draw the progress line
 * and to take SIGINT and SIGTERM. Everything the command writes goes to the
 * main thread as messages, in order; the exit status comes last.
 *
 * Cancelling: the main thread sets `stop[0]`; the next progress report of the
 * library call (at most every PROGRESS_INTERVAL_MS, between chunks of work)
 * sees it and aborts the call's AbortSignal, which ends the call with a
 * "cancelled" error before its next chunk.
 */

/** What the job thread tells the main thread. */
export type JobMessage =
  | { readonly kind: "progress"; readonly fraction: number }
  | { readonly kind: "out"; readonly text: string }
  | { readonly kind: "err"; readonly text: string }
  | { readonly kind: "chart"; readonly spec: Record<string, unknown>; readonly path: string }
  | { readonly kind: "done"; readonly status: number };

/** What the main thread gives the job thread. */
export interface JobData {
  readonly argv: readonly string[];
  /** One Int32 on shared memory: 0 run, 1 cancel. */
  readonly stop: Int32Array;
}

if (parentPort !== null) {
  const port = parentPort;
  const { argv, stop } = workerData as JobData;
  const post = (m: JobMessage): void => port.postMessage(m);
  const controller = new AbortController();
  const status = runCli(argv, {
    out: (text) => post({ kind: "out", text }),
    err: (text) => post({ kind: "err", text }),
    files: { readText: (path) => readFileSync(path, "utf8"), writeText: (path, text) => writeFileSync(path, text) },
    chart: (spec, path) => post({ kind: "chart", spec, path }),
    longRun: {
      signal: controller.signal,
      onProgress: (p) => {
        if (Atomics.load(stop, 0) !== 0) controller.abort(new Error("interrupted"));
        else post({ kind: "progress", fraction: p.fraction });
      },
    },
  });
  post({ kind: "done", status });
}
