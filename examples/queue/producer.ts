/**
 * The producer of the queue example as a program: runs each request through
 * the queue (run-on-queue.ts: shards, jobs, results, merge) and prints a
 * summary with the result's notes. Start workers first (worker.ts).
 *
 * Run: REDIS_URL=redis://10.0.0.5:6379 npx tsx examples/queue/producer.ts [request.json] [--shards N]
 * A request file holds one shardable request ({ kind: "tolerance", formula,
 * inputs, options } or { kind: "sweep", formula, vary, fixed }); without one
 * the scenario in scenario.ts runs. Ctrl-C cancels (exit status 130).
 */
import { readFileSync } from "node:fs";
import { FormulaError } from "../../src/core/errors.js";
import { formatEngineering } from "../../src/core/format.js";
import { type QueueRequest, runOnQueue } from "./run-on-queue.js";
import { coilSweep, coilTolerance } from "./scenario.js";
import { DEFAULT_REDIS_URL } from "./shard-jobs.js";

const args = process.argv.slice(2);
const at = args.indexOf("--shards");
const count = at >= 0 ? Number(args[at + 1]) : 32;
const file = args.find((a, i) => !a.startsWith("--") && i !== at + 1);
const controller = new AbortController();
process.once("SIGINT", () => controller.abort());

try {
  const requests: QueueRequest[] = file ? [JSON.parse(readFileSync(file, "utf8")) as QueueRequest] : [coilTolerance, coilSweep];
  for (const request of requests) {
    const t0 = performance.now();
    const { result, stats } = await runOnQueue(request, {
      redisUrl: process.env.REDIS_URL ?? DEFAULT_REDIS_URL,
      shards: count,
      signal: controller.signal,
      ...(process.env.QUEUE ? { queue: process.env.QUEUE } : {}),
      onProgress: (p) => process.stderr.write(`\r${request.kind}: ${(p.fraction * 100).toFixed(0)} % (${p.done} of ${p.total})`),
    });
    process.stderr.write("\n");
    if ("monteCarlo" in result && result.monteCarlo) {
      const m = result.monteCarlo;
      const show = (v: number): string => `${formatEngineering(v, 6)} ${result.unit}`;
      console.log(`${result.formula}: ${m.samples} samples, mean ${show(m.mean)}, p1 ${show(m.p1)}, p99 ${show(m.p99)}`);
    } else if ("output" in result) {
      console.log(`${result.formula}: ${result.output.values.length} points, ${result.notComputed} not computed`);
    }
    // Notes travel with the result: show them (cautions bear on safety).
    for (const n of result.notes) console.log(`${n.kind} (${n.count} points): ${n.worst.message}`);
    const seconds = ((performance.now() - t0) / 1000).toFixed(2);
    console.log(`${stats.shards} shards in ${seconds} s; ${stats.jobBytes} bytes of jobs, ${stats.resultBytes} bytes of results; shards by worker ${JSON.stringify(stats.byWorker)}`);
  }
  process.exit(0);
} catch (e) {
  process.stderr.write("\n");
  const code = e instanceof FormulaError || (e instanceof Error && "code" in e) ? `${String((e as { code: unknown }).code)}: ` : "";
  console.error(`${code}${e instanceof Error ? e.message : String(e)}`);
  process.exit(e instanceof FormulaError && e.code === "cancelled" ? 130 : 1);
}
