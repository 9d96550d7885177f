import { resolve } from "node:path";
import { defineConfig, type Options } from "tsup";

// Public entry points, in one place: subpath name -> source. A new subpath
// (e.g. http: "src/http/index.ts") goes here and in package.json "exports";
// scripts/check-package.mjs checks that every entry has both.
export const ENTRIES: Record<string, string> = {
  index: "src/index.ts",
  http: "src/http/index.ts",
};
// The command-line program (ESM only, Node only) and the thread its long commands run on
// (src/cli/job.ts finds cli-job.js beside itself).
const BIN = { cli: "src/cli/main.ts", "cli-job": "src/cli/job-thread.ts" };
// The module each worker thread of the parallel calls loads (Node only; src/tools/pool.node.ts finds it beside itself).
const WORKER = { "pool-worker": "src/tools/pool-worker.node.ts" };

const common: Options = {
  target: "es2022",
  sourcemap: false,
  // Dependencies stay external so a consumer's bundler dedupes and tree-shakes them.
  // vega and vega-lite: optional, loaded by the CLI only when it draws a chart (src/cli/chart.ts).
  external: ["mathjs", "decimal.js", "piscina", "vega", "vega-lite"],
};

// In the Node build the loaders (the two of mathjs, the one of decimal.js)
// become their *.node.ts versions, which require the package (or the prebuilt
// subset) on first use instead of importing it at load time: `import "emquant"`
// then loads neither mathjs nor decimal.js. Likewise the worker pool
// (src/tools/pool.ts, none in the browser build) becomes pool.node.ts, which
// imports piscina on the first parallel call.
const nodeLoaders = {
  name: "emquant-node-loaders",
  setup(build: { onResolve: (o: { filter: RegExp }, f: (a: { path: string; resolveDir: string }) => { path: string }) => void }) {
    build.onResolve({ filter: /\/(load-(subset|full|decimal)|pool)\.js$/ }, (args) => ({
      path: resolve(args.resolveDir, args.path.replace(/\.js$/, ".node.ts")),
    }));
  },
};

export default defineConfig([
  // 1. One ESM file per source module, for bundlers: with "sideEffects": false
  //    a consumer's bundler keeps only the modules a program reaches.
  {
    ...common,
    entry: ["src/**/*.ts", "!src/cli/**", "!src/**/*.node.ts"],
    bundle: false,
    format: ["esm"],
    outDir: "dist/esm",
  },
  // 2. Node: bundled ESM entries (fast to load) and the CLI, sharing chunks.
  {
    ...common,
    entry: { ...ENTRIES, ...BIN, ...WORKER },
    format: ["esm"],
    splitting: true,
    outDir: "dist/node",
    esbuildPlugins: [nodeLoaders],
    dts: { entry: ENTRIES },
  },
  // 3. Node: CommonJS for require(); import.meta.url shimmed for the loaders.
  {
    ...common,
    entry: ENTRIES,
    format: ["cjs"],
    outDir: "dist/node",
    shims: true,
    esbuildPlugins: [nodeLoaders],
    dts: { entry: ENTRIES },
  },
  // 4. The unit-parsing subset of mathjs, prebuilt with mathjs inlined, required
  //    by the Node loaders on first use (dist/node/mathjs-subset.cjs).
  {
    ...common,
    entry: { "mathjs-subset": "src/units/mathjs-subset.ts" },
    format: ["cjs"],
    outDir: "dist/node",
    external: [],
    noExternal: ["mathjs"],
    minify: true,
  },
]);
