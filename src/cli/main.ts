#!/usr/bin/env node
// The `emquant` command. All behaviour lives in run.ts (tested in-process and spawned);
// chart.ts adds the charts (`--svg`), loading vega only when one is asked for; a long
// command (sweep, tolerance, columns, design --tolerance) runs on a job thread with a
// progress line and Ctrl-C (job.ts), without loading the formulas in this thread.
import { readFileSync, writeFileSync } from "node:fs";
import * as nodeModule from "node:module";
import { longCommand } from "./args.js";

// Node 22.1 and later keep V8's compiled code of the modules a run loads in a
// cache directory (os.tmpdir()/node-compile-cache, or NODE_COMPILE_CACHE; off
// with NODE_DISABLE_COMPILE_CACHE=1), so a later run skips compiling them: the
// formulas and tools below are imported only after this line. Node 20 lacks it
// (the call is skipped). Only the command does this: `import "emquant"` never
// writes to a user's disk or changes their process.
(nodeModule as { enableCompileCache?: () => unknown }).enableCompileCache?.();

const argv = process.argv.slice(2);
const long = longCommand(argv);
const status: Promise<number> = long !== undefined
  ? import("./job.js").then((job) => job.runLongCommand(argv, long))
  : import("./chart.js").then((chart) =>
      chart.runCliWithCharts(argv, {
        out: (text) => process.stdout.write(`${text}\n`),
        err: (text) => process.stderr.write(`${text}\n`),
        files: { readText: (path) => readFileSync(path, "utf8"), writeText: (path, text) => writeFileSync(path, text) },
      }),
    );
void status.then((s) => {
  process.exitCode = s;
});
