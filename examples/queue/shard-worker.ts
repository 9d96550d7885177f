/**
 * The worker of the queue example (worker.ts runs one as a program): takes
 * shards off the BullMQ queue, runs each with the library's runShard, writes
 * its numbers into Redis and returns a small receipt.
 *
 * A shard runs synchronously and holds this process's event loop meanwhile, so
 * BullMQ cannot renew the job's lock while it runs: plan shards that finish
 * well within LOCK_MS (the producer's shard count decides their size). A
 * shard that overruns it is taken as stalled and run again by another worker;
 * that is harmless (the same numbers land under the same key) but wasted.
 */
import { hostname } from "node:os";
import { UnrecoverableError, Worker } from "bullmq";
import { Redis } from "ioredis";
import { FormulaError } from "../../src/core/errors.js";
import { runShard } from "../../src/tools/shards.js";
import { connectionOf, DEFAULT_QUEUE, DEFAULT_RESULT_TTL_MS, encodeShard, formulaErrorReason, type ShardJobData, type ShardJobReturn } from "./shard-jobs.js";

/**
 * A job's lock, ms: the longest a shard may hold the event loop before it
 * counts as stalled, and so about how long a job of a worker that died waits
 * before another worker takes it. Generous, because a shard's cost varies:
 * in the scenario's map, a shard of overlapping coils took 16 s where one of
 * coils apart took 1 s, and under load the lock of 60 s tried first lapsed.
 */
export const LOCK_MS = 300_000;

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
  // Connection errors are retried by ioredis: log them, never crash on them.
  const log = (e: unknown): void => console.error(`worker ${name}: ${e instanceof Error ? e.message : String(e)}`);
  worker.on("error", log);
  store.on("error", log);
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
