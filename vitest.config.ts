import { availableParallelism } from "node:os";
import { resolve } from "node:path";
import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    // The test build counts loop iterations (tests/reliability/termination): the
    // library's no-op src/math/loop-count.ts is replaced by the counting helper.
    alias: [
      { find: /^(?:.*\/)?loop-count\.js$/, replacement: resolve(import.meta.dirname, "tests/helpers/loop-count.ts") },
      // Tests run in Node: the worker pool is Node's, as in the Node build (tsup.config.ts).
      { find: /^\.\/pool\.js$/, replacement: resolve(import.meta.dirname, "src/tools/pool.node.ts") },
    ],
  },
  test: {
    include: ["tests/**/*.test.ts"],
    testTimeout: 60_000,
    setupFiles: ["tests/setup.ts"],
    // Bundles the pool thread's module, the CLI and the OpenAPI script once per
    // run, so pool threads and spawned processes start without tsx (tests/global-setup.ts).
    globalSetup: ["tests/global-setup.ts"],
    // Test files share one module graph per worker instead of re-importing
    // and re-evaluating src/ (mathjs, the registry) for every file: measured
    // on tests/core, tests/units, tests/flux (20 files, same machine, same
    // load), import time fell from 131 s to 11 s and CPU time from 55 s to
    // 15 s. The price: module and global state outlives a file, so a test
    // that changes it restores it (DEVELOPERS.md, "Tests: speed").
    isolate: false,
    // One test file per core at a time (vitest's default leaves one core out:
    // on 2 cores, one file at a time). On 10 of the slowest files (oracles,
    // solvers, fuzz), load 8-10 from other work: 223 s wall with one worker,
    // 193 s with two, for 3 % more CPU (each worker imports src/ once).
    maxWorkers: availableParallelism(),
  },
});
