/**
 * Diagnostic, not a test (vitest runs *.test.ts only): finds the fuzz cases
 * that do not terminate, which the suite must skip (KNOWN_HANGS) until their
 * fix lands. The cases of one kind are regenerated from the seed in a worker
 * thread that runs them in order and publishes its position through shared
 * memory; the main thread watches the clock and, when one case runs longer
 * than the limit, records it, terminates the worker and starts a new one after
 * that case.
 *
 *   npx tsx tests/reliability/fuzz-diagnose.ts <kind> [cases] [seed] [limit ms]
 *
 * kinds: see RUNNERS in fuzz-runners.ts, and "reproducers" (the known hangs'
 * reproducers, fuzz-known.ts: none should run over the limit once fixed).
 */
import { isMainThread, parentPort, Worker, workerData } from "node:worker_threads";
import fc from "fast-check";
import { RUNNERS, type RunnerKind } from "./fuzz-runners.js";
import { evaluate } from "../../src/core/evaluate.js";
import { judge, show } from "./fuzz-check.js";
import { HANG_REPRODUCERS } from "./fuzz-known.js";

/** The known hangs' reproducers (fuzz-known.ts), to check a fix: `... reproducers 8` reports none over the limit once fixed. */
const REPRODUCERS = {
  cases: fc.constantFrom(...HANG_REPRODUCERS) as fc.Arbitrary<unknown>,
  run: (c: unknown) => judge(() => evaluate((c as { id: string }).id, (c as { inputs: Record<string, number> }).inputs), c),
};

interface Job {
  kind: RunnerKind | "reproducers";
  cases: number;
  seed: number;
  from: number;
  /** A case that ran over the limit, to print. */
  print: number;
  position: SharedArrayBuffer;
}

// A worker does not inherit the TypeScript loader: it registers tsx, then loads this file.
const BOOT = `import("tsx/esm/api").then((m) => { m.register(); return import(${JSON.stringify(import.meta.url)}); })`;

if (isMainThread) {
  const kind = (process.argv[2] ?? "evaluate") as Job["kind"];
  const cases = Number(process.argv[3] ?? 20000);
  const seed = Number(process.argv[4] ?? 20261202);
  const limit = Number(process.argv[5] ?? 3000);
  const position = new SharedArrayBuffer(8);
  const at = new Int32Array(position);
  const hangs: number[] = [];
  const start = (from: number, print = -1): Promise<void> =>
    new Promise((resolve) => {
      Atomics.store(at, 0, from);
      Atomics.store(at, 1, 0);
      const w = new Worker(BOOT, { eval: true, workerData: { kind, cases, seed, from, print, position } satisfies Job });
      let last = -1;
      let restarted = false;
      let since = Date.now();
      let ready = false;
      const timer = setInterval(() => {
        const i = Atomics.load(at, 0);
        // The clock starts when the worker has booted and drawn its cases.
        if (!ready && Atomics.load(at, 1) === 1) {
          ready = true;
          since = Date.now();
        }
        if (i !== last) {
          last = i;
          since = Date.now();
        } else if (ready && i < cases && Date.now() - since > limit) {
          clearInterval(timer);
          restarted = true;
          hangs.push(i);
          process.stdout.write(`case ${i} ran over ${limit} ms\n`);
          void w.terminate().then(() => resolve(start(i + 1, i)));
        }
      }, 100);
      w.on("message", (m: string) => process.stdout.write(m));
      w.on("exit", () => {
        clearInterval(timer);
        if (!restarted) resolve();
      });
      w.on("error", (e) => process.stdout.write(`worker error at case ${Atomics.load(at, 0)}: ${String(e)}\n`));
    });
  const t0 = Date.now();
  await start(0);
  process.stdout.write(`${kind}: ${cases} cases, seed ${seed}, ${hangs.length} over ${limit} ms, ${((Date.now() - t0) / 1000).toFixed(1)} s\n`);
} else {
  const job = workerData as Job;
  const at = new Int32Array(job.position);
  const runner = job.kind === "reproducers" ? REPRODUCERS : (RUNNERS[job.kind] as unknown as { cases: fc.Arbitrary<unknown>; run: (c: unknown) => unknown });
  const all = fc.sample(runner.cases, { seed: job.seed, numRuns: job.cases });
  if (job.print >= 0) parentPort!.postMessage(`  case ${job.print}: ${show(all[job.print])}\n`);
  Atomics.store(at, 1, 1);
  for (let i = job.from; i < all.length; i++) {
    Atomics.store(at, 0, i);
    const c = all[i];
    const t = Date.now();
    await runner.run(c);
    const ms = Date.now() - t;
    if (ms > 200) parentPort!.postMessage(`slow case ${i} (${ms} ms): ${show(c)}\n`);
  }
}
