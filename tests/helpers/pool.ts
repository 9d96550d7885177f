import { afterAll, beforeAll, expect } from "vitest";
import { poolSplit } from "../../src/tools/parallel.js";
import { closeWorkers, workerThreads } from "../../src/tools/pool.node.js";

/**
 * For a file that tests the pool: calls above the MIN_PARALLEL_* counts go to
 * the pool whatever their timed first items say (the seam poolSplit.minPoolMs
 * at 0), so the pool is tested on any machine. The seam is restored and the
 * pool's threads closed (none left) after the file.
 */
export function poolAboveCounts(): void {
  const minPoolMs = poolSplit.minPoolMs;
  beforeAll(() => {
    poolSplit.minPoolMs = 0;
  });
  afterAll(async () => {
    poolSplit.minPoolMs = minPoolMs;
    await closeWorkers();
    expect(workerThreads()).toBe(0);
  });
}
