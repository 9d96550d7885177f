/**
 * The test build's replacement for src/math/loop-count.ts (see the alias in
 * vitest.config.ts): it adds up the iterations every loop reports, so tests can
 * check that a call ran a bounded number of iterations.
 */
const state = { total: 0, largest: 0 };

export function countLoop(iterations: number): void {
  state.total += iterations;
  if (iterations > state.largest) state.largest = iterations;
}

/** Zero the counters (call before the call being measured). */
export function resetLoopCount(): void {
  state.total = 0;
  state.largest = 0;
}

/** Iterations since the last reset: all loops together, and the longest single loop. */
export function loopCount(): { readonly total: number; readonly largest: number } {
  return { total: state.total, largest: state.largest };
}
