/**
 * Runs every benchmark module and prints one markdown table with the machine,
 * Node version and date. Built by scripts/bench.mjs into out/bench.mjs and run
 * with plain node (`npm run bench`); loaders such as tsx wrap imports in
 * getters and distort the timing of small functions.
 *
 * Modules written elsewhere (bench/neumann.ts, bench/biot-savart.ts, any other
 * bench/*.ts exporting run()) are included when present: the build resolves
 * "bench-optional" to them.
 */
import { cpus, loadavg } from "node:os";
import optional from "bench-optional";
import * as bundleSize from "./bundle-size.js";
import * as evaluateBench from "./evaluate.js";
import * as sweepBench from "./sweep.js";
import * as typed from "./typed.js";
import { type BenchRow, sinkTotal } from "./util.js";

interface BenchModule {
  run(): Promise<BenchRow[]>;
}

const modules: [string, BenchModule][] = [
  ["typed", typed],
  ["evaluate", evaluateBench],
  ["sweep", sweepBench],
  ...optional.map((o): [string, BenchModule] => [o.name, o.module as BenchModule]),
  ["bundle-size", bundleSize],
];

async function main(): Promise<void> {
  const rows: BenchRow[] = [];
  // `npm run bench -- parallel columns` runs only the modules named (file names in bench/).
  const only = process.argv.slice(2);
  for (const [name, m] of modules.filter(([n]) => only.length === 0 || only.includes(n))) {
    try {
      rows.push(...(await m.run()));
    } catch (e) {
      rows.push({ name: `${name} (failed)`, value: "error", note: String((e as Error)?.message ?? e).slice(0, 120) });
    }
  }
  const esc = (s: string): string => s.replace(/\|/g, "\\|");
  const out = [
    `emquant benchmarks: ${cpus()[0]?.model ?? "unknown CPU"} (${cpus().length} threads), Node ${process.version}, ${new Date().toISOString().slice(0, 10)}, load average ${loadavg().map((l) => l.toFixed(1)).join(" ")}`,
    "Ratios from one process run; medians of interleaved runs; random inputs, every result consumed.",
    "",
    "| benchmark | result | note |",
    "| --- | --- | --- |",
    ...rows.map((r) => `| ${esc(r.name)} | ${esc(r.value)} | ${esc(r.note)} |`),
  ];
  console.log(out.join("\n"));
  if (sinkTotal() < 0) console.log("");
}

await main();
