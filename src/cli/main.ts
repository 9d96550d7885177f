#!/usr/bin/env node
// The `emquant` command. All behaviour lives in run.ts (tested in-process and spawned).
import { readFileSync, writeFileSync } from "node:fs";
import { runCli } from "./run.js";

const status = runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
  files: { readText: (path) => readFileSync(path, "utf8"), writeText: (path, text) => writeFileSync(path, text) },
});
process.exitCode = status;
