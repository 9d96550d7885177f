import { defineConfig } from "tsup";

export default defineConfig({
  entry: { index: "src/index.ts", cli: "src/cli/main.ts", http: "src/http/index.ts" },
  format: ["esm", "cjs"],
  dts: { entry: { index: "src/index.ts", http: "src/http/index.ts" } },
  sourcemap: true,
  clean: true,
  treeshake: true,
  target: "es2022",
  // Keep dependencies external so consumers' bundlers can tree-shake them.
  // vega and vega-lite: optional, loaded by the CLI only when it draws a chart (src/cli/chart.ts).
  external: ["mathjs", "decimal.js", "vega", "vega-lite"],
});
