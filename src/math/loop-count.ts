/**
 * Loop accounting for the termination tests. Every iterative algorithm in the
 * library (elliptic integrals, series, root finding, quadrature, the solvers,
 * solve's search, particle tracing) reports how many iterations it ran when
 * its loop ends. In the library this does nothing and costs nothing (an empty
 * function the engine inlines away); the test build (vitest.config.ts) swaps
 * this module for tests/helpers/loop-count.ts, which adds the counts up so a
 * test can state a fixed bound per call without a timer.
 */
export function countLoop(_iterations: number): void {}
