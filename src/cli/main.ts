#!/usr/bin/env node
// The `emquant` command. All behaviour lives in run.ts (tested in-process and spawned);
// chart.ts adds the charts (`--svg`), loading vega only when one is asked for.
import { readFileSync, writeFileSync } from "node:fs";
import { runCliWithCharts } from "./chart.js";

void runCliWithCharts(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
  files: { readText: (path) => readFileSync(path, "utf8"), writeText: (path, text) => writeFileSync(path, text) },
}).then((status) => {
  process.exitCode = status;
});
