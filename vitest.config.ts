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
  },
});
