/**
 * A worker process of the queue example: takes shards off the BullMQ queue,
 * runs each with the library's runShard, writes its numbers into Redis and
 * returns a small receipt. Start as many as you like, on as many hosts as you
 * like, all pointing at the same Redis; the code is the same everywhere.
 *
 * Run: REDIS_URL=redis://10.0.0.5:6379 npx tsx examples/queue/worker.ts
 *      (env QUEUE picks another queue; WORKER_NAME names this worker in receipts)
 *
 * A shard runs synchronously and holds this process's event loop meanwhile, so
 * BullMQ cannot renew the job's lock while it runs: plan shards that finish
 * well within LOCK_MS (the producer's shard count decides their size). A
 * shard that overruns it is taken as stalled and run again by another worker;
 * that is harmless (the same numbers land under the same key) but wasted.
 */
import { hostname } from "node:os";
import { pathToFileURL } from "node:url";
import { UnrecoverableError, Worker } from "bullmq";
import { Redis } from "ioredis";
import { FormulaError } from "../../src/core/errors.js";
import { runShard } from "../../src/tools/shards.js";
import { DEFAULT_QUEUE, DEFAULT_REDIS_URL, DEFAULT_RESULT_TTL_MS, encodeShard, formulaErrorReason, type ShardJobData, type ShardJobReturn } from "./shard-jobs.js";

/** A job's lock, ms: the longest a shard may hold the event loop before it counts as stalled. */
export const LOCK_MS = 60_000;

export interface ShardWorkerOptions {
  /** redis://host:port (the Redis every producer and worker share). */
  readonly redisUrl: string;
  readonly queue?: string;
  /** Shown in receipts; default host:pid. */
  readonly name?: string;
  readonly lockMs?: number;
  /** How often stalled jobs (a worker died mid-shard) are looked for, ms. Default LOCK_MS / 2. */
  readonly stalledCheckMs?: number;
  readonly resultTtlMs?: number;
}

/** A running worker; close() lets the current shard finish, then disconnects. */
export interface ShardWorker {
  readonly name: string;
  ready(): Promise<void>;
  close(): Promise<void>;
}

/** BullMQ's connection options from a redis:// URL (BullMQ opens its own connections). */
export function connectionOf(url: string): { host: string; port: number; username?: string; password?: string; db?: number } {
  const u = new URL(url);
  if (u.protocol !== "redis:") throw new Error(`REDIS_URL must be redis://host:port, got ${JSON.stringify(url)}`);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : undefined;
  return {
    host: u.hostname || "127.0.0.1",
    port: u.port ? Number(u.port) : 6379,
    ...(u.username ? { username: decodeURIComponent(u.username) } : {}),
    ...(u.password ? { password: decodeURIComponent(u.password) } : {}),
    ...(db !== undefined && Number.isInteger(db) ? { db } : {}),
  };
}

export function startShardWorker(options: ShardWorkerOptions): ShardWorker {
  const name = options.name ?? `${hostname()}:${process.pid}`;
  const ttl = options.resultTtlMs ?? DEFAULT_RESULT_TTL_MS;
  const lockMs = options.lockMs ?? LOCK_MS;
  const store = new Redis(options.redisUrl, { maxRetriesPerRequest: 3, lazyConnect: true });
  const worker = new Worker<ShardJobData, ShardJobReturn>(
    options.queue ?? DEFAULT_QUEUE,
    async (job) => {
      const { shard, resultKey } = job.data;
      const t0 = performance.now();
      let result;
      try {
        result = runShard(shard);
      } catch (e) {
        // A library error is the request's fault, not this worker's: it would
        // fail the same way on every attempt and every host, so no retry.
        if (e instanceof FormulaError) throw new UnrecoverableError(formulaErrorReason(e));
        throw e;
      }
      const ms = performance.now() - t0;
      const { blob, meta } = encodeShard(result);
      // SET overwrites: a shard run twice (a retry, a stalled job taken over)
      // writes the same bytes under the same key, so re-running is harmless.
      await store.set(resultKey, blob, "PX", ttl);
      return { ...meta, bytes: blob.length, by: name, ms };
    },
    {
      connection: connectionOf(options.redisUrl),
      concurrency: 1,
      lockDuration: lockMs,
      stalledInterval: options.stalledCheckMs ?? lockMs / 2,
      maxStalledCount: 2,
      autorun: true,
    },
  );
  // Errors of the connection are retried by ioredis; log them, never crash on them.
  worker.on("error", (e) => console.error(`worker ${name}: ${String(e?.message ?? e)}`));
  return {
    name,
    async ready() {
      await Promise.all([worker.waitUntilReady(), store.connect()]);
    },
    async close() {
      await worker.close();
      store.disconnect();
    },
  };
}

// Run as a program: one worker, until SIGTERM or SIGINT (the current shard finishes first).
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const w = startShardWorker({
    redisUrl: process.env.REDIS_URL ?? DEFAULT_REDIS_URL,
    queue: process.env.QUEUE ?? DEFAULT_QUEUE,
    ...(process.env.WORKER_NAME ? { name: process.env.WORKER_NAME } : {}),
  });
  const stop = (): void => {
    void w.close().then(() => process.exit(0));
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
  await w.ready();
  // The test and the benchmark wait for this line before they enqueue.
  console.log(`ready ${w.name}`);
}
