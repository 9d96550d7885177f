#!/usr/bin/env node
// The `emquant` command. All behaviour lives in run.ts (tested in-process and spawned);
// chart.ts adds the charts (`--svg`), loading vega only when one is asked for.
import { runCliWithCharts } from "./chart.js";

void runCliWithCharts(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
}).then((status) => {
  process.exitCode = status;
});
