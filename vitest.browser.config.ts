// `npm run test:browser`: the page's end-to-end test in headless Chromium
// (tests/browser/*.e2e.ts). Kept apart from `npm test`, whose include
// (tests/**/*.test.ts) does not match these files, so nothing runs twice.
import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/browser/**/*.e2e.ts"],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    // One browser, one file: tests in order, sharing the page.
    fileParallelism: false,
  },
});
