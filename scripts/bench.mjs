// Builds bench/run.ts with esbuild into out/bench.mjs and runs it with plain node
// (no tsx: its module transform turns imports into getters and distorts the
// timing of small functions). Benchmark modules written by others
// (bench/neumann.ts, bench/biot-savart.ts, ...) are bundled when they exist.
import { spawnSync } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import { resolve } from "node:path";
import { build } from "esbuild";

const root = resolve(import.meta.dirname, "..");
// Modules run.ts imports itself; every other bench/*.ts exporting run() is added.
const OWN = new Set(["run", "util", "typed", "evaluate", "sweep", "bundle-size"]);
const optionalModules = () =>
  readdirSync(resolve(root, "bench"))
    .filter((f) => f.endsWith(".ts") && !f.endsWith(".d.ts") && !OWN.has(f.slice(0, -3)))
    .filter((f) => /export\s+(async\s+)?function\s+run\s*\(/.test(readFileSync(resolve(root, "bench", f), "utf8")))
    .map((f) => f.slice(0, -3))
    .sort();

const optionalPlugin = {
  name: "bench-optional",
  setup(b) {
    b.onResolve({ filter: /^bench-optional$/ }, () => ({ path: "bench-optional", namespace: "bench-optional" }));
    b.onLoad({ filter: /.*/, namespace: "bench-optional" }, () => {
      const present = optionalModules();
      const lines = present.map((n, i) => `import * as m${i} from ${JSON.stringify(resolve(root, "bench", `${n}.ts`))};`);
      lines.push(`export default [${present.map((n, i) => `{ name: ${JSON.stringify(n)}, module: m${i} }`).join(", ")}];`);
      return { contents: lines.join("\n"), loader: "js", resolveDir: root };
    });
  },
};

await build({
  entryPoints: [resolve(root, "bench/run.ts")],
  outfile: resolve(root, "out/bench.mjs"),
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  // mathjs and esbuild stay external: mathjs is only the comparison baseline,
  // esbuild is used by the bundle-size check (and bundles the queue example's
  // worker); bullmq and ioredis are the queue example's, loaded as installed.
  external: ["mathjs", "esbuild", "bullmq", "ioredis"],
  plugins: [optionalPlugin],
  logLevel: "warning",
});

const r = spawnSync(process.execPath, [resolve(root, "out/bench.mjs"), ...process.argv.slice(2)], { stdio: "inherit", cwd: root });
process.exit(r.status ?? 1);
