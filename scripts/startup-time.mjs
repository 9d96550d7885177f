// Start-up times of the built package, as a user meets them: median wall time
// of N fresh processes each for bare `node -e ""`, `import "emquant"`, and the
// CLI's help, compute (with common unit strings, and with one left to mathjs) and a small sweep (job thread). Run after `npm run build`;
// `node scripts/startup-time.mjs [runs]`. Prints times and ratios to bare node
// (a benchmark, not a test: no thresholds). Last, the import's own time read
// inside the process.
// Beside the wall time, each process's own CPU time (user + system, all its
// threads, read at exit): on a shared machine wall time grows with the other
// load, CPU time much less, so compare changes by CPU time and the ratios, and
// quote the load averages printed with the table.
import { spawnSync } from "node:child_process";
import { loadavg } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const runs = Number(process.argv[2] ?? 15);
const entry = join(root, "dist", "node", "index.js");
const cli = join(root, "dist", "node", "cli.js");
const cases = [
  ["bare node (node -e \"\")", ["-e", ""]],
  ["import \"emquant\" (built Node entry)", ["--input-type=module", "-e", `await import(${JSON.stringify(entry)})`]],
  ["emquant help", [cli, "help"]],
  ["emquant compute with unit strings", [cli, "compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm"]],
  // A long unit name is left to mathjs: this one also loads the mathjs unit subset.
  ["emquant compute, a unit string read by mathjs", [cli, "compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 millimeter"]],
  // A long command starts the CLI's job thread (src/cli/job.ts): a two-point sweep is mostly that start.
  ["emquant sweep, two points (job thread)", [cli, "sweep", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm..0.2 mm", "--points", "2"]],
];

function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

// Preloaded into every case alike (bare node too): the main thread writes the
// process's CPU time (every thread's) in microseconds to file descriptor 3 when
// it exits. Worker threads inherit the preload and write nothing.
const cpuAtExit = `data:text/javascript,import{writeSync}from"node:fs";import{isMainThread}from"node:worker_threads";if(isMainThread)process.on("exit",()=>{const u=process.cpuUsage();writeSync(3,String(u.user+u.system))})`;

const results = [];
const load = () => loadavg().map((x) => x.toFixed(2)).join(" ");
const loadBefore = load();
// Interleaved rounds, so a burst of load on the machine hits every case alike.
const times = cases.map(() => []);
const cpu = cases.map(() => []);
for (let r = 0; r < runs; r++) {
  cases.forEach(([, args], i) => {
    const t = process.hrtime.bigint();
    const p = spawnSync(process.execPath, ["--import", cpuAtExit, ...args], { stdio: ["ignore", "ignore", "inherit", "pipe"] });
    if (p.status !== 0) throw new Error(`${cases[i][0]} exited ${p.status}`);
    times[i].push(Number(process.hrtime.bigint() - t) / 1e6);
    cpu[i].push(Number(p.output[3].toString()) / 1000);
  });
}
const bare = median(times[0]);
const bareCpu = median(cpu[0]);
cases.forEach(([name], i) => {
  const m = median(times[i]);
  const c = median(cpu[i]);
  results.push({
    name,
    medianMs: Math.round(m),
    ratioToBareNode: Number((m / bare).toFixed(2)),
    cpuMs: Math.round(c),
    cpuRatioToBareNode: Number((c / bareCpu).toFixed(2)),
  });
});
console.table(results);
// The import statement's own time, read inside the process (hrtime around
// `await import`): what a program that already runs pays to load the package,
// without node's own start. Both readings go into the README.
const inProcess = [];
for (let r = 0; r < runs; r++) {
  const code = `const t=process.hrtime.bigint();await import(${JSON.stringify(entry)});process.stdout.write(String(Number(process.hrtime.bigint()-t)/1e6))`;
  const p = spawnSync(process.execPath, ["--input-type=module", "-e", code], { encoding: "utf8" });
  if (p.status !== 0) throw new Error(`in-process import exited ${p.status}`);
  inProcess.push(Number(p.stdout));
}
console.log(`import "emquant" alone, timed inside the process: median ${median(inProcess).toFixed(1)} ms`);
console.log(`${runs} runs each, Node ${process.versions.node}, ${new Date().toISOString().slice(0, 16)}Z, load average (1, 5, 15 min) ${loadBefore} before, ${load()} after`);
