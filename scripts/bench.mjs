// Builds bench/run.ts with esbuild into out/bench.mjs and runs it with plain node
// (no tsx: its module transform turns imports into getters and distorts the
// timing of small functions). Optional benchmark modules written by others
// (bench/neumann.ts, bench/biot-savart.ts) are bundled when they exist.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { resolve } from "node:path";
import { build } from "esbuild";

const root = resolve(import.meta.dirname, "..");
const OPTIONAL = ["neumann", "biot-savart"];

const optionalPlugin = {
  name: "bench-optional",
  setup(b) {
    b.onResolve({ filter: /^bench-optional$/ }, () => ({ path: "bench-optional", namespace: "bench-optional" }));
    b.onLoad({ filter: /.*/, namespace: "bench-optional" }, () => {
      const present = OPTIONAL.filter((n) => existsSync(resolve(root, "bench", `${n}.ts`)));
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
  // esbuild is used by the bundle-size check.
  external: ["mathjs", "esbuild"],
  plugins: [optionalPlugin],
  logLevel: "warning",
});

const r = spawnSync(process.execPath, [resolve(root, "out/bench.mjs")], { stdio: "inherit", cwd: root });
process.exit(r.status ?? 1);
