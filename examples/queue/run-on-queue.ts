/**
 * The producer and merger of the queue example (producer.ts runs it as a
 * program): splits a tolerance or sweep request into shards (planShards),
 * puts one BullMQ job per shard on the queue, collects each shard's numbers
 * from Redis as its job completes, and merges them (mergeShards) into
 * exactly the result one process computes.
 *
 * Failures end the run with an error, never a hang: a shard the library
 * refuses rethrows the library's FormulaError (no retry: it fails the same way
 * everywhere); a shard that fails otherwise is retried `attempts` times, then
 * ShardQueueError "shard_failed"; a run not done within `timeoutMs` is
 * "timed_out"; an abort through `signal` is the library's "cancelled". Jobs
 * still waiting are removed on the way out.
 */
import { randomUUID } from "node:crypto";
import { Queue, QueueEvents } from "bullmq";
import { Redis } from "ioredis";
import { FormulaError } from "../../src/core/errors.js";
import { cancelledError, type LongRunOptions, ticker } from "../../src/core/progress.js";
import { mergeShards, planShards, type Shard, type ShardResult, type SweepShardRequest, type ToleranceShardRequest } from "../../src/tools/shards.js";

/** The requests this example runs on the queue: tolerance and sweeps (columns shards exist in the library; their results are not encoded here). */
export type QueueRequest = ToleranceShardRequest | SweepShardRequest;
import type { SweepResult } from "../../src/tools/sweep.js";
import type { ToleranceResult } from "../../src/tools/tolerance.js";
import {
  connectionOf, DEFAULT_QUEUE, DEFAULT_RESULT_TTL_MS, decodeShard, formulaErrorFrom, ShardQueueError,
  type ShardJobData, type ShardJobReturn,
} from "./shard-jobs.js";

export interface QueueRunOptions extends LongRunOptions {
  /** redis://host:port, the Redis the workers use. */
  readonly redisUrl: string;
  readonly queue?: string;
  /** Shards to split the request into (planShards may make fewer). */
  readonly shards: number;
  /** The whole run's time limit, ms. Default 10 minutes. */
  readonly timeoutMs?: number;
  /** Tries per shard for failures outside the library (a crashed worker, a Redis error). Default 3. */
  readonly attempts?: number;
  /** How often unfinished jobs are looked up besides the event stream, ms. Default 2000. */
  readonly pollMs?: number;
  /** Called for each shard merged in: which worker ran it, its bytes and compute time. */
  readonly onShard?: (shard: Shard, receipt: ShardJobReturn) => void;
}

/** What a run cost, besides its result. */
export interface QueueRunStats {
  readonly shards: number;
  /** Bytes of job data put on the queue (each shard repeats the whole request). */
  readonly jobBytes: number;
  /** Bytes of shard numbers fetched from Redis. */
  readonly resultBytes: number;
  /** Which worker ran how many shards. */
  readonly byWorker: Readonly<Record<string, number>>;
  readonly mergeMs: number;
}

export function runOnQueue(request: ToleranceShardRequest, options: QueueRunOptions): Promise<{ result: ToleranceResult; stats: QueueRunStats }>;
export function runOnQueue(request: SweepShardRequest, options: QueueRunOptions): Promise<{ result: SweepResult; stats: QueueRunStats }>;
export function runOnQueue(request: QueueRequest, options: QueueRunOptions): Promise<{ result: ToleranceResult | SweepResult; stats: QueueRunStats }>;
export async function runOnQueue(request: QueueRequest, options: QueueRunOptions): Promise<{ result: ToleranceResult | SweepResult; stats: QueueRunStats }> {
  // Checked here, as one run checks it: a bad request fails before any job exists.
  const shards = planShards(request, options.shards);
  const { results, stats } = await runShardsOnQueue(shards, options);
  const t0 = performance.now();
  const result = mergeShards(results) as ToleranceResult | SweepResult;
  return { result, stats: { ...stats, mergeMs: performance.now() - t0 } };
}

/**
 * Runs the given shards on the queue and returns their results (in shard
 * order). runOnQueue's middle part; on its own for callers that plan or merge
 * elsewhere (and for the test, which hands it a shard the library refuses).
 */
export async function runShardsOnQueue(
  shards: readonly Shard[],
  options: QueueRunOptions,
): Promise<{ results: ShardResult[]; stats: Omit<QueueRunStats, "mergeMs"> }> {
  const total = shards.reduce((s, x) => s + (x.end - x.start), 0);
  const progress = ticker("runOnQueue", options, total);
  const queueName = options.queue ?? DEFAULT_QUEUE;
  // A producer gives up on Redis after about 20 s of failed reconnects (a
  // worker keeps trying for ever): its connections then end, and so does the process.
  const retryStrategy = (times: number): number | null => (times > 20 ? null : Math.min(200 * times, 1000));
  const connection = { ...connectionOf(options.redisUrl), retryStrategy };
  const run = randomUUID();
  const jobId = (s: Shard): string => `${run}-${s.index}`;
  const byId = new Map(shards.map((s) => [jobId(s), s]));

  const results = new Map<string, ShardResult>();
  const collecting = new Set<string>();
  const byWorker: Record<string, number> = {};
  let resultBytes = 0;
  let jobBytes = 0;
  let done = 0;
  let settle!: (e?: unknown) => void;
  const finished = new Promise<void>((resolve, reject) => {
    settle = (e?: unknown) => (e === undefined ? resolve() : reject(e));
  });
  const fail = (e: unknown): void => settle(e);
  // Awaited below; this keeps a failure before that point from counting as unhandled.
  finished.catch(() => undefined);
  // Every step waits for Redis; a failure, the time limit or an abort ends the wait.
  const unlessEnded = <T>(step: Promise<T>): Promise<T> => Promise.race([step, finished.then(() => step)]);

  // The time limit and the signal hold from the start, Redis reachable or not.
  let lastConnectionError = "";
  const timeoutMs = options.timeoutMs ?? 600_000;
  const timer = setTimeout(() => {
    const open = shards.filter((s) => !results.has(jobId(s))).map((s) => s.index + 1);
    const hint = lastConnectionError ? `Redis at ${options.redisUrl}: ${lastConnectionError}` : `are workers running on queue "${queueName}"?`;
    fail(new ShardQueueError("timed_out", undefined, `${open.length} of ${shards.length} shards unfinished after ${timeoutMs} ms (shards ${open.slice(0, 10).join(", ")}${open.length > 10 ? ", ..." : ""}); ${hint}`));
  }, timeoutMs);
  const onAbort = (): void => fail(cancelledError("runOnQueue", options.signal));
  options.signal?.addEventListener("abort", onAbort, { once: true });

  const store = new Redis(options.redisUrl, { maxRetriesPerRequest: 3, retryStrategy });
  const queue = new Queue<ShardJobData, ShardJobReturn>(queueName, { connection });
  let events: QueueEvents | undefined;
  // Connection trouble is retried by ioredis; keep the last message for the time-out's text.
  const onError = (e: unknown): void => void (lastConnectionError = e instanceof Error ? e.message : String(e));
  store.on("error", onError);
  queue.on("error", onError);
  let pollTimer: ReturnType<typeof setInterval> | undefined;
  try {
    // Read the event stream from the Redis server's clock now, so no event of
    // this run's jobs can be missed between subscribing and adding them.
    const [sec, usec] = await unlessEnded(store.time());
    events = new QueueEvents(queueName, { connection, lastEventId: `${Number(sec) * 1000 + Math.floor(Number(usec) / 1000) - 1}-0` });
    events.on("error", onError);
    await unlessEnded(events.waitUntilReady());

    const collect = async (id: string, receipt: ShardJobReturn): Promise<void> => {
      const shard = byId.get(id);
      // The event and the poll may both report one job: collect it once.
      if (!shard || collecting.has(id)) return;
      collecting.add(id);
      const key = resultKey(run, shard);
      const blob = await store.getBuffer(key);
      if (blob === null) throw new ShardQueueError("result_missing", shard, `key ${key} (expired or evicted: raise the result TTL or Redis's maxmemory)`);
      results.set(id, decodeShard(shard, blob, receipt));
      await store.del(key);
      resultBytes += blob.length;
      byWorker[receipt.by] = (byWorker[receipt.by] ?? 0) + 1;
      options.onShard?.(shard, receipt);
      done += shard.end - shard.start;
      if (results.size === shards.length) settle();
      else progress.tick(done);
    };
    const failed = (id: string, reason: string): void => {
      const shard = byId.get(id);
      if (shard) fail(formulaErrorFrom(reason, shard) ?? new ShardQueueError("shard_failed", shard, reason));
    };
    events.on("completed", ({ jobId: id, returnvalue }) => {
      if (byId.has(id)) collect(id, returnvalue as unknown as ShardJobReturn).catch(fail);
    });
    events.on("failed", ({ jobId: id, failedReason }) => failed(id, failedReason));

    // The event stream is the fast path; this looks up what is still open, in
    // case an event was trimmed away or the events connection dropped.
    const poll = async (): Promise<void> => {
      for (const [id, shard] of byId) {
        if (collecting.has(id)) continue;
        // The state first: a job read before it finishes has no return value yet.
        const state = await queue.getJobState(id);
        if (state === "unknown") fail(new ShardQueueError("shard_failed", shard, "its job is gone from the queue (removed by someone else?)"));
        if (state !== "completed" && state !== "failed") continue;
        const job = await queue.getJob(id);
        if (job && state === "completed") await collect(id, job.returnvalue);
        else if (job) failed(id, job.failedReason);
      }
    };
    let polling = false;
    pollTimer = setInterval(() => {
      if (polling) return;
      polling = true;
      poll().catch(fail).finally(() => (polling = false));
    }, options.pollMs ?? 2000);

    const bulk = shards.map((shard) => {
      const data: ShardJobData = { run, shard, resultKey: resultKey(run, shard) };
      jobBytes += Buffer.byteLength(JSON.stringify(data));
      return {
        name: shard.request.kind,
        data,
        opts: {
          jobId: jobId(shard),
          attempts: options.attempts ?? 3,
          backoff: { type: "exponential", delay: 500 },
          // Kept until this run has read them; removed below, or after an hour by BullMQ if this process dies.
          removeOnComplete: { age: DEFAULT_RESULT_TTL_MS / 1000 },
          removeOnFail: { age: DEFAULT_RESULT_TTL_MS / 1000 },
        },
      };
    });
    await unlessEnded(queue.addBulk(bulk));
    if (shards.length === 0) settle();
    await finished;
    progress.finish();
    return {
      results: shards.map((s) => results.get(jobId(s))!),
      stats: { shards: shards.length, jobBytes, resultBytes, byWorker },
    };
  } catch (e) {
    if (e instanceof FormulaError || e instanceof ShardQueueError) throw e;
    // Anything else came from Redis or the connection to it (ioredis, BullMQ).
    throw new ShardQueueError("redis_error", undefined, `${options.redisUrl}: ${e instanceof Error ? e.message : String(e)}${lastConnectionError ? ` (${lastConnectionError})` : ""}`, e);
  } finally {
    clearTimeout(timer);
    clearInterval(pollTimer);
    options.signal?.removeEventListener("abort", onAbort);
    // Waiting jobs of a failed run would only waste workers: remove them. A job
    // being run cannot be removed (it is locked); its numbers expire with the TTL.
    // Bounded, and skipped without a connection: they would wait for Redis forever.
    if (store.status === "ready") {
      await within(5000, Promise.allSettled(shards.flatMap((s) => [queue.remove(jobId(s)), store.del(resultKey(run, s))])));
      await within(5000, Promise.allSettled([events?.close(), queue.close()]));
    }
    await within(2000, Promise.allSettled([events?.disconnect(), queue.disconnect()]));
    store.disconnect();
  }
}

/** Waits for `step`, at most `ms`. */
function within(ms: number, step: Promise<unknown>): Promise<unknown> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  return Promise.race([step, new Promise((resolve) => (timer = setTimeout(resolve, ms)))]).finally(() => clearTimeout(timer));
}

function resultKey(run: string, shard: Shard): string {
  return `emquant:shard-result:${run}:${shard.index}`;
}
