/**
 * A worker process of the queue example: one shard worker (shard-worker.ts)
 * until SIGTERM or SIGINT, which let the current shard finish first. Start as
 * many as you like, on as many hosts as you like, all pointing at the same
 * Redis; the code is the same everywhere.
 *
 * Run: REDIS_URL=redis://10.0.0.5:6379 npx tsx examples/queue/worker.ts
 *      (env QUEUE picks another queue; WORKER_NAME names this worker in receipts;
 *      LOCK_MS sets the job lock, see shard-worker.ts, e.g. shorter in a test
 *      that kills a worker and waits for its shard to be taken over)
 */
import { DEFAULT_QUEUE, DEFAULT_REDIS_URL } from "./shard-jobs.js";
import { startShardWorker } from "./shard-worker.js";

/** LOCK_MS from the environment: a whole number of milliseconds from 100, or the default. */
function lockMs(): number | undefined {
  const text = process.env.LOCK_MS;
  if (text === undefined || text === "") return undefined;
  const ms = Number(text);
  if (!Number.isInteger(ms) || ms < 100) throw new Error(`LOCK_MS must be a whole number of milliseconds from 100, not "${text}"`);
  return ms;
}

const worker = startShardWorker({
  redisUrl: process.env.REDIS_URL ?? DEFAULT_REDIS_URL,
  queue: process.env.QUEUE ?? DEFAULT_QUEUE,
  ...(process.env.WORKER_NAME ? { name: process.env.WORKER_NAME } : {}),
  ...(lockMs() !== undefined ? { lockMs: lockMs() } : {}),
});
const stop = (): void => {
  void worker.close().then(() => process.exit(0));
};
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
await worker.ready();
// Whoever started this process may wait for this line before enqueuing.
console.log(`ready ${worker.name}`);
