#!/usr/bin/env node
// The `emquant` command. All behaviour lives in run.ts (tested in-process and spawned).
import { runCli } from "./run.js";

const status = runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
});
process.exitCode = status;
