import { availableParallelism } from "node:os";
import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import type { Piscina } from "piscina";
import { cancelledError, PROGRESS_INTERVAL_MS } from "../core/progress.js";
import { CANCEL_CELL, controlCells, finalCell, type PoolTask, type PoolWatch, progressCell, type TaskOutcome } from "./pool-tasks.js";

/*
 * The worker pool of the Node build (it replaces pool.ts there): one piscina
 * pool per process, created on the first parallel call (piscina is imported
 * then, not when emquant loads). Threads start as tasks need them and end
 * after IDLE_MS without work; idle threads do not keep the process alive, and
 * closeWorkers() ends them at once.
 *
 * From source (vitest, tsx) the pool threads load pool-worker.node.ts through
 * tsx's loader, or the bundle of it that EMQUANT_POOL_WORKER names (tests);
 * from the built package, dist/node/pool-worker.js (the variable is not read).
 */

/** Idle time after which a pool thread ends, ms. */
const IDLE_MS = 5000;
/** Most threads the pool holds (several calls at once share it). */
const MAX_THREADS = 64;

let pool: Piscina | undefined;

/** True: Node's build runs parallel calls on worker threads. */
export const poolAvailable = true;

/** Threads the parallel calls use when `workers` is left out: the cores Node reports. */
export function defaultWorkers(): number {
  return availableParallelism();
}

async function thePool(): Promise<Piscina> {
  if (pool !== undefined) return pool;
  const here = import.meta.url;
  const fromSource = here.endsWith(".ts");
  // From source only: EMQUANT_POOL_WORKER may name a bundle of pool-worker.node.ts
  // (the test run builds one, tests/global-setup.ts), which threads load without tsx.
  const bundled = fromSource ? process.env.EMQUANT_POOL_WORKER : undefined;
  const viaTsx = fromSource && !bundled;
  const { Piscina: Pool } = await import("piscina");
  pool ??= new Pool({
    filename: bundled ? pathToFileURL(bundled).href : new URL(fromSource ? "./pool-worker.node.ts" : "./pool-worker.js", here).href,
    minThreads: 0,
    maxThreads: MAX_THREADS,
    idleTimeout: IDLE_MS,
    ...(viaTsx ? { execArgv: ["--import", createRequire(here).resolve("tsx")] } : {}),
  });
  return pool;
}

/** Wait before a cancel takes tasks that have not started out of piscina's queue, ms. */
const WITHDRAW_MS = 20;

/** Tasks of parallel calls handed to the pool and not yet settled (queued in piscina or running). */
let inFlight = 0;

/**
 * Runs the tasks with at most `workers` of them in flight, and returns their
 * outcomes in task order. The caller has checked `workers`.
 *
 * With `watch`: every task gets the call's shared control array and its slot
 * (pool-tasks.ts), and the task stores its items done there between blocks.
 * `watch.progress(done)` gets the sum over the tasks after each task
 * completes and every PROGRESS_INTERVAL_MS while tasks run. A cancel (the
 * signal's abort, at any time, or `progress` throwing, as Ticker.tick does
 * for an abort from onProgress) sets the cancel flag, which running tasks
 * read between blocks; queues no more tasks; withdraws from piscina's queue
 * the tasks no thread has started (after WITHDRAW_MS); waits for the running
 * ones to stop (within one block); and then
 * rejects with "cancelled" (or what `progress` threw). So when the promise
 * settles, none of this call's tasks is queued or running.
 *
 * A task that throws anything but a FormulaError (a thread crash) cancels the
 * others the same way before its error is rethrown.
 */
export async function runOnPool(tool: string, tasks: readonly PoolTask[], workers: number, watch: PoolWatch = {}): Promise<TaskOutcome[]> {
  const { signal, progress } = watch;
  const p = await thePool();
  if (signal?.aborted) throw cancelledError(tool, signal);
  const out = new Array<TaskOutcome>(tasks.length);
  const control = new Int32Array(new SharedArrayBuffer(4 * controlCells(tasks.length))).fill(-1);
  control[CANCEL_CELL] = 0;
  // Tasks whose result this thread has received: counted by their final cell, the others by their progress cell.
  const received = new Uint8Array(tasks.length);
  // The reason the call stops early (set once), and the piscina withdrawals of the tasks in flight.
  let stop: { readonly error: unknown } | undefined;
  const withdraw = new Map<number, AbortController>();
  const withdrawTimers: ReturnType<typeof setTimeout>[] = [];
  const cancel = (error: unknown): void => {
    if (stop !== undefined) return;
    stop = { error };
    Atomics.store(control, CANCEL_CELL, 1);
    // A task not started yet (-1) is either posted to an idle thread, where it starts within
    // moments, reads the flag and returns, or still in piscina's queue waiting for a thread to
    // load (seconds from source): after WITHDRAW_MS, take what has not started out of the
    // queue. piscina ends the thread of a task that started meanwhile: none is left running
    // either way; the wait only spares idle threads a restart.
    const late = setTimeout(() => {
      for (const [i, c] of withdraw) if (Atomics.load(control, progressCell(i)) < 0) c.abort();
    }, WITHDRAW_MS);
    withdrawTimers.push(late);
  };
  const report = (): void => {
    if (progress === undefined || stop !== undefined) return;
    let done = 0;
    for (let i = 0; i < tasks.length; i++) done += Math.max(0, Atomics.load(control, received[i] === 1 ? finalCell(i) : progressCell(i)));
    try {
      progress(done);
    } catch (e) {
      cancel(e);
    }
  };
  const onAbort = (): void => cancel(cancelledError(tool, signal));
  signal?.addEventListener("abort", onAbort, { once: true });
  const timer = progress !== undefined ? setInterval(report, PROGRESS_INTERVAL_MS) : undefined;
  let next = 0;
  // `workers` lanes, each taking the next task when its last one is done:
  // bounded by the number of tasks.
  const lane = async (): Promise<void> => {
    while (next < tasks.length && stop === undefined) {
      const i = next++;
      const c = new AbortController();
      withdraw.set(i, c);
      inFlight++;
      try {
        out[i] = (await p.run({ ...tasks[i], control, slot: i }, { signal: c.signal })) as TaskOutcome;
        received[i] = 1;
      } catch (e) {
        // A withdrawal after a cancel rejects here as piscina's AbortError: the cancel's own error is reported.
        if (stop === undefined) cancel(e);
      } finally {
        inFlight--;
        withdraw.delete(i);
      }
      report();
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.min(workers, tasks.length) }, lane));
  } finally {
    if (timer !== undefined) clearInterval(timer);
    for (const w of withdrawTimers) clearTimeout(w);
    signal?.removeEventListener("abort", onAbort);
  }
  if (stop !== undefined) throw stop.error;
  return out;
}

/**
 * Whether any task of a parallel call is queued on the pool or running (the
 * count of such tasks). After a parallel call settles, by success, error or
 * cancellation, its tasks are no longer counted.
 */
export function poolBusy(): number {
  return inFlight + (pool?.queueSize ?? 0);
}

/** Threads alive in the pool now. */
export function workerThreads(): number {
  return pool?.threads.length ?? 0;
}

/** Ends every pool thread now (the next parallel call starts new ones). */
export async function closeWorkers(): Promise<void> {
  const p = pool;
  pool = undefined;
  if (p !== undefined) await p.destroy();
}
