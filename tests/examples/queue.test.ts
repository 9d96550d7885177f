/*
 * The queue example end to end: a private redis-server, two worker processes
 * (plain node, from the bundled examples/queue/worker.ts), the producer and
 * merger in this process. The reference is the same request computed by one
 * process (toleranceRequest / sweepRequest), and the check is bit for bit:
 * this test is about carrying work over a real queue without changing a bit,
 * not about the formulas, whose values are checked against published
 * references in tests/inductance, tests/capacitance and tests/flux.
 *
 * Skipped, with a message, only where redis-server is not installed and this
 * is not CI; in CI (env CI, or EMQUANT_REQUIRE_REDIS set by .ci/run) a missing
 * server fails the test.
 */
import { Queue, QueueEvents } from "bullmq";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startLocalRedis, findRedisServer, type LocalRedis } from "../../examples/queue/local-redis.js";
import { buildWorker, startWorkerProcesses, type WorkerProcesses } from "../../examples/queue/local-workers.js";
import { runOnQueue, runShardsOnQueue } from "../../examples/queue/run-on-queue.js";
import { coilTolerance } from "../../examples/queue/scenario.js";
import { connectionOf, ShardQueueError } from "../../examples/queue/shard-jobs.js";
import { type ShardWorker, startShardWorker } from "../../examples/queue/shard-worker.js";
import { FormulaError } from "../../src/core/errors.js";
import type { Progress } from "../../src/core/progress.js";
import { planShards, type SweepShardRequest, type ToleranceShardRequest } from "../../src/tools/shards.js";
import { sweepRequest, type SweepResult } from "../../src/tools/sweep.js";
import { toleranceRequest } from "../../src/tools/tolerance.js";

const required = Boolean(process.env.CI) || Boolean(process.env.EMQUANT_REQUIRE_REDIS);
const installed = findRedisServer() !== undefined;
if (!installed && !required) {
  console.warn("tests/examples/queue.test.ts skipped: redis-server is not installed (Debian: apt-get install -y --no-install-recommends redis-server). In CI this test fails instead.");
}

// Plain Uint8Arrays, which tests/setup.ts's equality tester compares in one loop (a Buffer goes element by element).
const bytes = (a: Float64Array | Uint8Array): Uint8Array => new Uint8Array(a.buffer, a.byteOffset, a.byteLength);

/** Every number of a sweep result as bytes, and the rest as JSON, for an exact comparison. */
function sweepBytes(s: SweepResult): { values: Uint8Array; components: Record<string, Uint8Array>; computed: Uint8Array; rest: string } {
  const { output, computed, ...rest } = s;
  const { values, components, ...meta } = output;
  return {
    values: bytes(values),
    components: Object.fromEntries(Object.entries(components ?? {}).map(([k, v]) => [k, bytes(v)])),
    computed: bytes(computed),
    rest: JSON.stringify({ ...rest, meta, axes: s.axes.map((a) => ({ ...a, values: [...bytes(a.values)] })) }),
  };
}

describe.skipIf(!installed && !required)("the job-queue example (BullMQ on a private redis-server, two worker processes)", () => {
  let redis: LocalRedis | undefined;
  let workers: WorkerProcesses | undefined;
  let workerFile = "";

  beforeAll(async () => {
    const [file, server] = await Promise.all([buildWorker(), startLocalRedis()]);
    redis = server;
    workerFile = file;
    workers = await startWorkerProcesses(file, 2, server.url);
  }, 180_000);

  afterAll(async () => {
    await workers?.stop();
    await redis?.stop();
  }, 30_000);

  it("merges a Monte Carlo tolerance run from shards on two workers into one process's result, every statistic and percentile bit for bit", async () => {
    const request: ToleranceShardRequest = { ...coilTolerance, options: { samples: 60_000, seed: 11 } };
    const seen: Progress[] = [];
    const { result, stats } = await runOnQueue(request, { redisUrl: redis!.url, shards: 12, timeoutMs: 120_000, onProgress: (p) => seen.push(p) });
    const one = toleranceRequest(request);

    const mc = result.monteCarlo!;
    const ref = one.monteCarlo!;
    const keys = ["samples", "accepted", "rejected", "mean", "sd", "p1", "p5", "p50", "p95", "p99", "min", "max"] as const;
    expect(bytes(Float64Array.from(keys, (k) => mc[k]))).toEqual(bytes(Float64Array.from(keys, (k) => ref[k])));
    expect(result).toStrictEqual(one);
    // Both processes took shards; 8 bytes per sample came back, once.
    expect(Object.keys(stats.byWorker).sort()).toEqual(workers!.names);
    expect(stats.resultBytes).toBe(8 * 60_000);
    // Progress in samples: never decreasing, ending at 1.
    expect(seen.length).toBeGreaterThan(0);
    expect(seen.every((p, i) => i === 0 || p.done >= seen[i - 1]!.done)).toBe(true);
    expect(seen.at(-1)).toEqual({ fraction: 1, done: 60_000, total: 60_000 });
  });

  it("merges a two-axis sweep with points not computed into one process's result, every value and flag bit for bit", async () => {
    // innerRadius >= outerRadius breaks the coaxial line's relation: those points are NaN and flagged 0.
    const request: SweepShardRequest = {
      kind: "sweep", formula: "coaxialCapacitance",
      vary: { innerRadius: { from: "0.1 mm", to: "3 mm", points: 300 }, outerRadius: { from: "0.5 mm", to: "2 mm", points: 200 } },
      fixed: { length: "1 m", relativePermittivity: 2.25 },
    };
    const { result } = await runOnQueue(request, { redisUrl: redis!.url, shards: 7, timeoutMs: 120_000 });
    const one = sweepRequest(request);
    expect(one.notComputed).toBeGreaterThan(0);
    expect(result.notComputed).toBe(one.notComputed);
    expect(sweepBytes(result)).toEqual(sweepBytes(one));
  });

  it("merges a sweep of a formula with field components, each component bit for bit", async () => {
    const request: SweepShardRequest = {
      kind: "sweep", formula: "loopField",
      vary: { radialDistance: { from: "0 m", to: "0.3 m", points: 150 }, axialDistance: { from: "-0.2 m", to: "0.2 m", points: 120 } },
      fixed: { current: "5 A", radius: "0.1 m" },
    };
    const { result } = await runOnQueue(request, { redisUrl: redis!.url, shards: 5, timeoutMs: 120_000 });
    const one = sweepRequest(request);
    expect(Object.keys(result.output.components ?? {})).toEqual(["radial", "axial"]);
    expect(sweepBytes(result)).toEqual(sweepBytes(one));
  });

  it("finishes with one run's result when a worker dies mid-shard: its shard is run again by another once its lock lapses", async () => {
    // A queue of its own and a 1 s job lock for the worker that dies (the default is 5 minutes). The worker process that
    // dies is alone on the queue when the first shard is taken, so it is the one holding that
    // shard when SIGKILL ends it; the worker that takes over runs in this process, started then.
    const queue = "emquant-shards-crash";
    const victim = await startWorkerProcesses(workerFile, 1, redis!.url, { queue, env: { LOCK_MS: "1000" } });
    const events = new QueueEvents(queue, { connection: connectionOf(redis!.url) });
    await events.waitUntilReady();
    let stalled = 0;
    events.on("stalled", () => stalled++);
    let survivor: ShardWorker | undefined;
    const takenOver = new Promise<void>((resolve, reject) => {
      events.once("active", () => {
        victim.kill("worker-1").then(() => {
          // A long lock of its own (a loaded machine may hold its event loop over a second per
          // shard), and a check for stalled jobs every half second.
          survivor = startShardWorker({ redisUrl: redis!.url, queue, name: "survivor", lockMs: 60_000, stalledCheckMs: 500 });
          return survivor.ready();
        }).then(resolve, reject);
      });
    });
    try {
      const request: ToleranceShardRequest = { ...coilTolerance, options: { samples: 3 * 8192, seed: 5 } };
      const { result, stats } = await runOnQueue(request, { redisUrl: redis!.url, queue, shards: 3, timeoutMs: 60_000 });
      await takenOver;
      expect(result).toStrictEqual(toleranceRequest(request));
      // Every shard was finished by the survivor; the one the dead worker held was found stalled and run again.
      expect(stats.byWorker).toEqual({ survivor: 3 });
      expect(stalled).toBe(1);
    } finally {
      await events.close();
      await survivor?.close();
      await victim.stop();
    }
  });

  it("fails at once with the library's coded error when a worker's shard is refused, without retrying it", async () => {
    const [shard] = planShards({ ...coilTolerance, options: { samples: 4096, seed: 1 } }, 1);
    const events = new QueueEvents("emquant-shards", { connection: connectionOf(redis!.url) });
    await events.waitUntilReady();
    let started = 0;
    events.on("active", () => started++);
    try {
      // A range past the request's samples: runShard refuses it on the worker.
      const run = runShardsOnQueue([{ ...shard!, end: 5000 }], { redisUrl: redis!.url, shards: 1, attempts: 3, timeoutMs: 60_000 });
      const error = await run.catch((e: unknown) => e);
      expect(error).toBeInstanceOf(FormulaError);
      expect(error).toMatchObject({ code: "invalid_argument", input: "shard" });
      expect((error as Error).message).toContain("on a queue worker");
      for (let i = 0; i < 50 && started === 0; i++) await new Promise((r) => setTimeout(r, 100));
      expect(started).toBe(1);
    } finally {
      await events.close();
    }
  });

  it("ends with timed_out, not a hang, when no worker serves the queue, and leaves no job behind", async () => {
    const queue = "emquant-shards-unserved";
    const run = runOnQueue({ ...coilTolerance, options: { samples: 8192, seed: 1 } }, { redisUrl: redis!.url, queue, shards: 4, timeoutMs: 1500 });
    const error = await run.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ShardQueueError);
    expect(error).toMatchObject({ code: "timed_out" });
    expect((error as Error).message).toContain("4 of 4 shards unfinished");
    const q = new Queue(queue, { connection: connectionOf(redis!.url) });
    try {
      expect(await q.getJobCounts("waiting", "active", "delayed", "completed", "failed")).toEqual({ waiting: 0, active: 0, delayed: 0, completed: 0, failed: 0 });
    } finally {
      await q.close();
    }
  });

  it("ends with the library's cancelled error when its signal aborts", async () => {
    const controller = new AbortController();
    const run = runOnQueue({ ...coilTolerance, options: { samples: 8192, seed: 1 } }, { redisUrl: redis!.url, queue: "emquant-shards-unserved", shards: 2, signal: controller.signal });
    setTimeout(() => controller.abort(new Error("user stop")), 300);
    const error = await run.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(FormulaError);
    expect(error).toMatchObject({ code: "cancelled", formula: "runOnQueue" });
    expect((error as Error).cause).toEqual(new Error("user stop"));
  });

  it("ends with redis_error, not a hang, when Redis cannot be reached", async () => {
    // Port 9 (discard) on the loopback interface: nothing listens there.
    const error = await runOnQueue({ ...coilTolerance, options: { samples: 4096, seed: 1 } }, { redisUrl: "redis://127.0.0.1:9", shards: 2, timeoutMs: 20_000 }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ShardQueueError);
    expect(error).toMatchObject({ code: "redis_error" });
    expect((error as Error).message).toContain("redis://127.0.0.1:9");
  });

  it("refuses a bad request before anything is queued, as one run does", async () => {
    const bad = { ...coilTolerance, inputs: { ...coilTolerance.inputs, distance: "-1 mm" } };
    const error = await runOnQueue(bad, { redisUrl: "redis://127.0.0.1:1", shards: 4 }).catch((e: unknown) => e);
    const direct = (() => {
      try {
        toleranceRequest(bad);
      } catch (e) {
        return e;
      }
    })();
    expect(error).toBeInstanceOf(FormulaError);
    expect(error).toMatchObject({ code: (direct as FormulaError).code, input: "distance" });
  });
});
