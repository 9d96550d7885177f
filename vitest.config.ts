import { resolve } from "node:path";
import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    // The test build counts loop iterations (tests/reliability/termination): the
    // library's no-op src/math/loop-count.ts is replaced by the counting helper.
    alias: [{ find: /^(?:.*\/)?loop-count\.js$/, replacement: resolve(import.meta.dirname, "tests/helpers/loop-count.ts") }],
  },
  test: {
    include: ["tests/**/*.test.ts"],
    testTimeout: 60_000,
    setupFiles: ["tests/setup.ts"],
  },
});
