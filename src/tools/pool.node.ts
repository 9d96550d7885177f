import { availableParallelism } from "node:os";
import { createRequire } from "node:module";
import type { Piscina } from "piscina";
import type { PoolTask, TaskOutcome } from "./pool-tasks.js";

/*
 * The worker pool of the Node build (it replaces pool.ts there): one piscina
 * pool per process, created on the first parallel call (piscina is imported
 * then, not when emquant loads). Threads start as tasks need them and end
 * after IDLE_MS without work; idle threads do not keep the process alive, and
 * closeWorkers() ends them at once.
 *
 * From source (vitest, tsx) the pool threads load pool-worker.node.ts through
 * tsx's loader; from the built package, dist/node/pool-worker.js.
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
  const { Piscina: Pool } = await import("piscina");
  pool ??= new Pool({
    filename: new URL(fromSource ? "./pool-worker.node.ts" : "./pool-worker.js", here).href,
    minThreads: 0,
    maxThreads: MAX_THREADS,
    idleTimeout: IDLE_MS,
    ...(fromSource ? { execArgv: ["--import", createRequire(here).resolve("tsx")] } : {}),
  });
  return pool;
}

/**
 * Runs the tasks with at most `workers` of them in flight, and returns their
 * outcomes in task order. The caller has checked `workers`.
 */
export async function runOnPool(_tool: string, tasks: readonly PoolTask[], workers: number): Promise<TaskOutcome[]> {
  const p = await thePool();
  const out = new Array<TaskOutcome>(tasks.length);
  let next = 0;
  // `workers` lanes, each taking the next task when its last one is done:
  // bounded by the number of tasks.
  const lane = async (): Promise<void> => {
    while (next < tasks.length) {
      const i = next++;
      out[i] = (await p.run(tasks[i])) as TaskOutcome;
    }
  };
  await Promise.all(Array.from({ length: Math.min(workers, tasks.length) }, lane));
  return out;
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
