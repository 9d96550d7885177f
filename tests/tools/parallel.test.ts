import { afterAll, describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { defineFormula } from "../../src/core/formula.js";
import { biotSavart } from "../../src/flux/biot-savart.js";
import { mutualInductance, polylineSelfInductance } from "../../src/inductance/neumann.js";
import { coaxialCoilsMutualInductance } from "../../src/inductance/index.js";
import {
  MIN_PARALLEL_FIELD_PAIRS, MIN_PARALLEL_POINTS, MIN_PARALLEL_SAMPLES, MIN_PARALLEL_SEGMENT_PAIRS,
  biotSavartParallel, mutualInductanceParallel, polylineSelfInductanceParallel, sweepParallel, toleranceParallel,
} from "../../src/tools/parallel.js";
import { closeWorkers, workerThreads } from "../../src/tools/pool.node.js";
import { sweep } from "../../src/tools/sweep.js";
import { tolerance } from "../../src/tools/tolerance.js";
import { expectFormulaError } from "../helpers/errors.js";

// Bit-identical results for any worker count: each parallel call is compared
// with the synchronous call (one thread, in order) by exact equality.
const COUNTS = [1, 2, 3];

afterAll(async () => {
  await closeWorkers();
});

describe("parallel tolerance", () => {
  const inputs = {
    area: { nominal: 1e-4, percent: 2 },
    gap: { distribution: "normal", mean: 1e-4, sd: 3e-6 },
    relativePermittivity: { distribution: "uniform", min: 4.3, max: 4.5 },
  } as const;
  const samples = MIN_PARALLEL_SAMPLES + 12_345;

  it("gives the synchronous result bit for bit with 1, 2 and 3 workers", async () => {
    const one = tolerance(parallelPlateCapacitance, inputs, { samples, seed: 11 });
    for (const workers of COUNTS) {
      const r = await toleranceParallel(parallelPlateCapacitance, inputs, { samples, seed: 11, workers });
      expect(r, `workers ${workers}`).toStrictEqual(one);
    }
    expect(workerThreads()).toBeGreaterThan(0);
  });
});
