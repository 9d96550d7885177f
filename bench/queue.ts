/**
 * The job-queue example (examples/queue/): wall time of one request run
 * through BullMQ on a private redis-server with 1 worker process against 2,
 * as a ratio, and what a shard costs (bytes, round trip). Both worker counts
 * are running at once on two queues (an idle worker waits on Redis and takes
 * no CPU), and their runs alternate, so load changes hit both alike. Needs
 * redis-server (Debian: apt-get install redis-server); skipped without it.
 */
import { spawnSync } from "node:child_process";
import { loadavg } from "node:os";
import { findRedisServer, startLocalRedis } from "../examples/queue/local-redis.js";
import { buildWorker, startWorkerProcesses } from "../examples/queue/local-workers.js";
import { type QueueRequest, runOnQueue } from "../examples/queue/run-on-queue.js";
import { coilSweep, coilTolerance } from "../examples/queue/scenario.js";
import { planShards, runShard, type SweepShardRequest, type ToleranceShardRequest } from "../src/tools/shards.js";
import { type BenchRow, median } from "./util.js";

const ms = (v: number): string => (v >= 1000 ? `${(v / 1000).toFixed(2)} s` : `${v.toFixed(1)} ms`);
const load = (): string => `load ${loadavg()[0]!.toFixed(1)}`;

export async function run(): Promise<BenchRow[]> {
  if (findRedisServer() === undefined) return [{ name: "queue", value: "skipped", note: "needs redis-server (apt-get install redis-server)" }];
  const rows: BenchRow[] = [];
  const [file, redis] = await Promise.all([buildWorker(), startLocalRedis()]);
  const one = await startWorkerProcesses(file, 1, redis.url, { queue: "bench-one" });
  const two = await startWorkerProcesses(file, 2, redis.url, { queue: "bench-two" });
  try {
    const time = async (request: QueueRequest, queue: string, shards: number): Promise<number> => {
      const t0 = performance.now();
      await runOnQueue(request, { redisUrl: redis.url, queue, shards, timeoutMs: 1_800_000 });
      return performance.now() - t0;
    };
    const compare = async (label: string, request: QueueRequest, shards: number, rounds: number): Promise<void> => {
      // Warm both queues' workers (JIT, connections) on a small copy first.
      const small: QueueRequest = request.kind === "tolerance" ? { ...request, options: { ...request.options, samples: 20_000 } } : { ...request, vary: Object.fromEntries(Object.entries(request.vary).map(([k, a]) => [k, { ...a!, points: 50 }])) };
      await time(small, "bench-one", 2);
      await time(small, "bench-two", 2);
      const a: number[] = [];
      const b: number[] = [];
      const r: number[] = [];
      for (let i = 0; i < rounds; i++) {
        const t1 = await time(request, "bench-one", shards);
        const t2 = await time(request, "bench-two", shards);
        a.push(t1);
        b.push(t2);
        r.push(t1 / t2);
      }
      rows.push({ name: `queue: ${label}, 2 worker processes vs 1`, value: `${median(r).toFixed(2)}x`, note: `speed-up (wall time, ${shards} shards, producer and Redis on the same machine); ${ms(median(a))} -> ${ms(median(b))}; ${load()}` });
    };
    await compare("Monte Carlo 1e6 samples, coaxialCoilsMutualInductance", coilTolerance, 16, 2);
    const sweep: SweepShardRequest = { ...coilSweep, vary: { distance: { ...coilSweep.vary.distance!, points: 500 }, radius2: { ...coilSweep.vary.radius2!, points: 500 } } };
    await compare("sweep 500 x 500 points, coaxialCoilsMutualInductance", sweep, 16, 2);

    // What a shard costs: one round trip through the queue for a shard with
    // next to no work (a 64-point sweep in 64 shards, one worker).
    const tiny: SweepShardRequest = { kind: "sweep", formula: "parallelPlateCapacitance", vary: { gap: { from: "10 um", to: "1 mm", points: 64 } }, fixed: { area: "1 cm^2" } };
    const trips: number[] = [];
    for (let i = 0; i < 5; i++) trips.push((await time(tiny, "bench-one", 64)) / 64);
    rows.push({ name: "queue: cost of a shard with no work", value: ms(median(trips)), note: `per shard, one worker (add, take, run, SET result, complete, event, GET, DEL: about 8 Redis round trips); ${load()}` });

    // Bytes: a tolerance shard's numbers as JSON, as base64 and as the bytes the example stores.
    const [shard] = planShards({ ...coilTolerance, options: { samples: 65_536, seed: 1 } } as ToleranceShardRequest, 1);
    const values = Float64Array.from(runShard(shard!).values);
    const json = Buffer.byteLength(JSON.stringify(Array.from(values)));
    const b64 = Buffer.from(values.buffer).toString("base64").length;
    rows.push({ name: "queue: bytes per Monte Carlo sample in a shard result", value: `${(values.byteLength / values.length).toFixed(1)} B`, note: `as stored (Float64Array bytes in a Redis key, once); JSON numbers ${(json / values.length).toFixed(1)} B, base64 ${(b64 / values.length).toFixed(1)} B, and a job's return value is stored twice (job hash and event stream)` });
    const jobBytes = Buffer.byteLength(JSON.stringify(planShards(coilTolerance, 16)[0]));
    rows.push({ name: "queue: bytes of job data per shard", value: `${jobBytes} B`, note: "the whole request repeated in every shard (coaxialCoilsMutualInductance, 7 inputs with tolerances)" });
  } finally {
    await Promise.allSettled([one.stop(), two.stop()]);
    await redis.stop();
  }
  // Not a check: the machine's redis-server version for the record.
  const version = spawnSync(findRedisServer()!, ["--version"], { encoding: "utf8" }).stdout.match(/v=([\d.]+)/)?.[1] ?? "?";
  rows.push({ name: "queue: Redis", value: version, note: "redis-server started by the benchmark on 127.0.0.1, no persistence" });
  return rows;
}
