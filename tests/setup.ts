import { join } from "node:path";
import fc from "fast-check";
import { expect, inject } from "vitest";
import { typedArrayEquality } from "./helpers/typed-array-equality.js";

/**
 * Every property test runs from one fixed seed, so a run (CI above all) is
 * reproducible and cannot fail by the luck of the draw. FC_SEED=<number>
 * runs other cases; FC_SEED=random draws a new seed each run, for exploring.
 */
const seed = process.env.FC_SEED;
fc.configureGlobal(seed === "random" ? {} : { seed: Number(seed ?? 20261202) });

// Pool threads load this run's bundle of their module instead of the source
// through tsx (tests/global-setup.ts; src/tools/pool.node.ts reads the
// variable when it runs from source).
process.env.EMQUANT_POOL_WORKER = join(inject("testBuild"), "pool-worker.js");

// Typed arrays compared in one loop instead of vitest's per-element path (tests/helpers/typed-array-equality.ts).
// Added once per process: with isolate off this file runs before every test file in the same worker.
const added = Symbol.for("emquant.typedArrayEquality");
if (!(globalThis as Record<symbol, unknown>)[added]) {
  expect.addEqualityTesters([typedArrayEquality]);
  (globalThis as Record<symbol, unknown>)[added] = true;
}
