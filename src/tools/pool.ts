import { FormulaError } from "../core/errors.js";
import type { PoolTask, TaskOutcome } from "./pool-tasks.js";

/** How a caller of runOnPool follows and stops its tasks (see pool.node.ts). */
export interface PoolWatch {
  /** Aborting it cancels the call: no more tasks start, running ones stop within one block, the promise rejects "cancelled". */
  readonly signal?: AbortSignal;
  /** Items done so far over all tasks (each task's own unit, summed); throwing cancels the call with that error. */
  readonly progress?: (done: number) => void;
}

/*
 * The worker pool as the browser (ESM) build has it: none. Node's build
 * replaces this file with pool.node.ts (tsup.config.ts, vitest.config.ts), so
 * piscina and node:worker_threads never reach a browser bundle.
 */

/** False: this build has no worker threads. */
export const poolAvailable = false;

/** Threads the parallel calls use when `workers` is left out: here the calling thread alone. */
export function defaultWorkers(): number {
  return 1;
}

/** Refuses: there is no pool in this build. */
export function runOnPool(tool: string, _tasks: readonly PoolTask[], _workers: number, _watch?: PoolWatch): Promise<TaskOutcome[]> {
  return Promise.reject(
    new FormulaError("invalid_argument", {
      formula: tool,
      input: "workers",
      detail: "worker threads are available in Node only; in this build leave workers out and the call computes in this thread",
    }),
  );
}

/** Tasks queued or running on the pool: always 0 here. */
export function poolBusy(): number {
  return 0;
}

/** Threads alive in the pool: always 0 here. */
export function workerThreads(): number {
  return 0;
}

/** Nothing to shut down here. */
export async function closeWorkers(): Promise<void> {}
