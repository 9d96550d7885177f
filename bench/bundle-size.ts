/**
 * Bundle size for a consumer that imports one typed formula: esbuild bundles,
 * minifies and tree-shakes a small entry against the library source, and the
 * gzip size is reported (target under 5 kB), with a check that mathjs is not
 * in the bundle. Importing `evaluate` (which pulls in mathjs) is shown for contrast.
 */
import { resolve } from "node:path";
import { gzipSync } from "node:zlib";
import { build } from "esbuild";
import type { BenchRow } from "./util.js";

/** Strings that appear only in mathjs's code. */
const MATHJS_MARKERS = ["typed-function", "Cannot convert", "BigNumber", "createUnit"];

async function size(entry: string): Promise<{ raw: number; gzip: number; mathjs: boolean }> {
  const result = await build({
    stdin: { contents: entry, resolveDir: process.cwd(), loader: "ts" },
    bundle: true,
    minify: true,
    format: "esm",
    platform: "browser",
    target: "es2022",
    write: false,
    logLevel: "silent",
  });
  const code = result.outputFiles[0]!.contents;
  const text = new TextDecoder().decode(code);
  return { raw: code.length, gzip: gzipSync(code, { level: 9 }).length, mathjs: MATHJS_MARKERS.some((m) => text.includes(m)) };
}

const kB = (n: number): string => `${(n / 1024).toFixed(2)} kB`;

export async function run(): Promise<BenchRow[]> {
  const src = JSON.stringify(resolve("src/index.ts"));
  const one = await size(
    `import { parallelPlateCapacitance, quantity } from ${src};\n` +
      `console.log(parallelPlateCapacitance({ area: quantity(1, "cm^2"), gap: quantity(0.1, "mm") }));`,
  );
  const ev = await size(`import { evaluate } from ${src};\nconsole.log(evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" }).value);`);
  return [
    {
      name: "bundle: parallelPlateCapacitance + quantity (gzip)",
      value: kB(one.gzip),
      note: `minified ${kB(one.raw)}; mathjs ${one.mathjs ? "INCLUDED (unexpected)" : "not included"} (target < 5 kB gzip)`,
    },
    {
      name: "bundle: evaluate (gzip, for contrast)",
      value: kB(ev.gzip),
      note: `minified ${kB(ev.raw)}; mathjs ${ev.mathjs ? "included" : "not detected"}; every registry formula is reachable by id`,
    },
  ];
}
