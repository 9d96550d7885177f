/**
 * A worker process of the queue example: one shard worker (shard-worker.ts)
 * until SIGTERM or SIGINT, which let the current shard finish first. Start as
 * many as you like, on as many hosts as you like, all pointing at the same
 * Redis; the code is the same everywhere.
 *
 * Run: REDIS_URL=redis://10.0.0.5:6379 npx tsx examples/queue/worker.ts
 *      (env QUEUE picks another queue; WORKER_NAME names this worker in receipts)
 */
import { DEFAULT_QUEUE, DEFAULT_REDIS_URL } from "./shard-jobs.js";
import { startShardWorker } from "./shard-worker.js";

const worker = startShardWorker({
  redisUrl: process.env.REDIS_URL ?? DEFAULT_REDIS_URL,
  queue: process.env.QUEUE ?? DEFAULT_QUEUE,
  ...(process.env.WORKER_NAME ? { name: process.env.WORKER_NAME } : {}),
});
const stop = (): void => {
  void worker.close().then(() => process.exit(0));
};
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
await worker.ready();
// Whoever started this process may wait for this line before enqueuing.
console.log(`ready ${worker.name}`);
