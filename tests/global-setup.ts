import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { build } from "esbuild";
import type { TestProject } from "vitest/node";

/*
 * Once per test run (vitest's globalSetup): bundles the modules that tests
 * start as new threads or processes - the pool thread's module, the CLI and
 * its job thread, the OpenAPI script - from the current source into one temporary folder, with
 * the names the Node build gives them (tsup.config.ts), so the CLI finds
 * cli-job.js beside itself as the built program does.
 *
 * Why: started from source, every pool thread and every CLI process loads
 * the library through tsx's loader, about 2.5 s of CPU per thread or process
 * on this machine, against 0.2 s for this bundle (measured: two pool threads
 * 5.0 s vs 0.36 s of CPU; `compute` as a process 5.1 s vs 0.26 s).
 *
 * The bundle resolves modules as tsx does (plain esbuild: src/**, the
 * browser-neutral loaders, pool.ts for the CLI), and bundles the packages
 * too, since the folder is outside the project's node_modules (vega and
 * vega-lite stay out: only the CLI's --svg loads them, and no spawned test
 * uses it). The folder is removed when the run ends.
 *
 * Tests get the folder by inject("testBuild"); tests/setup.ts hands the pool
 * thread's file to src/tools/pool.node.ts (EMQUANT_POOL_WORKER, read only
 * when the library runs from source) and tests/helpers/spawn-cli.ts starts
 * the CLI from it.
 */

declare module "vitest" {
  export interface ProvidedContext {
    /** The folder of this run's bundles: pool-worker.js, cli.js, cli-job.js, openapi.js. */
    testBuild: string;
  }
}

const root = resolve(import.meta.dirname, "..");

export default async function setup(project: TestProject): Promise<() => void> {
  const dir = mkdtempSync(join(tmpdir(), "emquant-test-build-"));
  await build({
    entryPoints: {
      "pool-worker": resolve(root, "src/tools/pool-worker.node.ts"),
      cli: resolve(root, "src/cli/main.ts"),
      "cli-job": resolve(root, "src/cli/job-thread.ts"),
      openapi: resolve(root, "scripts/openapi.ts"),
    },
    outdir: dir,
    bundle: true,
    splitting: true,
    platform: "node",
    format: "esm",
    external: ["vega", "vega-lite"],
    logLevel: "warning",
  });
  project.provide("testBuild", dir);
  return () => rmSync(dir, { recursive: true, force: true });
}
