/**
 * The queue example's own scenario (invented coils, not a product): a
 * 1e6-sample Monte Carlo of the mutual inductance of two coaxial coils, and a
 * 1000 x 1000 map of it over their distance and the second coil's radius
 * (coils apart: overlapping coils cost about 16 times as much per point).
 */
import type { SweepShardRequest, ToleranceShardRequest } from "../../src/tools/shards.js";

export const coilTolerance: ToleranceShardRequest = {
  kind: "tolerance",
  formula: "coaxialCoilsMutualInductance",
  inputs: {
    turns1: 100, radius1: { nominal: "10 mm", percent: 1 }, length1: { nominal: "20 mm", percent: 1 },
    turns2: 50, radius2: { nominal: "15 mm", percent: 1 }, length2: "10 mm", distance: { nominal: "30 mm", plusMinus: "1 mm" },
  },
  options: { samples: 1_000_000, seed: 2026 },
};

export const coilSweep: SweepShardRequest = {
  kind: "sweep",
  formula: "coaxialCoilsMutualInductance",
  vary: { distance: { from: "20 mm", to: "80 mm", points: 1000 }, radius2: { from: "5 mm", to: "30 mm", points: 1000 } },
  fixed: { turns1: 100, radius1: "10 mm", length1: "20 mm", turns2: 50, length2: "10 mm" },
};
