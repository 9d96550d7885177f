/**
 * Worker processes on this machine, for the queue example's test and
 * benchmark (on real hosts, start worker.ts by whatever runs your services).
 *
 * buildWorker bundles worker.ts and the library into one file for plain
 * `node` (esbuild; bullmq and ioredis stay external, loaded from
 * node_modules): a process then starts without a TypeScript loader compiling
 * the library's few hundred files again in every process (about 3 s of CPU
 * each under tsx here, against under 2 s for the bundle).
 */
import { type ChildProcess, spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { resolve } from "node:path";
import { build } from "esbuild";
import { exited, readyLine } from "./local-redis.js";

/** The repository: from this file, or from a bundle of it in out/ (the benchmark's). */
function root(): string {
  let dir = import.meta.dirname;
  for (let up = 0; up < 4 && !existsSync(resolve(dir, "examples/queue/worker.ts")); up++) dir = resolve(dir, "..");
  return dir;
}

/** Writes the bundle (default out/queue/worker.mjs) and returns its path. */
export async function buildWorker(outfile = resolve(root(), "out/queue/worker.mjs")): Promise<string> {
  await build({
    entryPoints: [resolve(root(), "examples/queue/worker.ts")],
    outfile,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    // bullmq and ioredis load from node_modules; the library's unit parser is bundled with the
    // few mathjs modules it uses (external, a process would load all of mathjs at its first unit
    // string: about 3 s of CPU per process under load, against a fraction of a second bundled).
    external: ["bullmq", "ioredis"],
    logLevel: "warning",
  });
  return outfile;
}

export interface WorkerProcesses {
  readonly names: readonly string[];
  /** SIGTERM (each finishes its current shard), SIGKILL after `graceMs`. */
  stop(graceMs?: number): Promise<void>;
  /** SIGKILL to one worker now (as a crash or a lost host would end it); resolves when it has exited. */
  kill(name: string): Promise<void>;
}

/**
 * Starts `count` worker processes from the bundle against `redisUrl` and
 * resolves when each has printed its "ready" line; rejects with a worker's
 * output if one exits first or is not ready within `readyMs`.
 */
export async function startWorkerProcesses(file: string, count: number, redisUrl: string, options: { readonly queue?: string; readonly readyMs?: number; readonly env?: Readonly<Record<string, string>> } = {}): Promise<WorkerProcesses> {
  const names = Array.from({ length: count }, (_, i) => `worker-${i + 1}`);
  const children = names.map((name) =>
    spawn(process.execPath, [file], {
      env: { ...process.env, REDIS_URL: redisUrl, WORKER_NAME: name, ...(options.queue ? { QUEUE: options.queue } : {}), ...options.env },
      stdio: ["ignore", "pipe", "pipe"],
    }),
  );
  const kill = (): void => children.forEach((c) => c.kill("SIGKILL"));
  process.once("exit", kill);
  const stop = async (graceMs = 10_000): Promise<void> => {
    process.off("exit", kill);
    const timer = setTimeout(kill, graceMs);
    children.forEach((c) => c.kill("SIGTERM"));
    await Promise.all(children.map(exited));
    clearTimeout(timer);
  };
  const readyMs = options.readyMs ?? 120_000;
  try {
    await Promise.all(children.map((child, i) => readyLine(child, `ready ${names[i]}`, names[i]!, readyMs)));
  } catch (e) {
    await stop(0);
    throw e;
  }
  // Their stderr (connection trouble) shows in ours; stdout keeps draining, so a full pipe never blocks a worker.
  children.forEach((c) => c.stderr!.on("data", (d: Buffer) => process.stderr.write(d)));
  const killOne = async (name: string): Promise<void> => {
    const child = children[names.indexOf(name)];
    if (child === undefined) throw new Error(`no worker named ${name}`);
    child.kill("SIGKILL");
    await exited(child);
  };
  return { names, stop, kill: killOne };
}
