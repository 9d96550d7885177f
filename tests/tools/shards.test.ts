import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { mergeShards, planShards, runShard, type SweepShardRequest, type SweepShardResult, type ToleranceShardRequest } from "../../src/tools/shards.js";
import { sweepRequest } from "../../src/tools/sweep.js";
import { toleranceRequest } from "../../src/tools/tolerance.js";
import { expectFormulaError } from "../helpers/errors.js";
import type { Progress } from "../../src/core/progress.js";
import type { ColumnsShardRequest } from "../../src/tools/columns-shards.js";

// Shards run anywhere and travel as JSON: every check below sends the shard
// and its result through JSON.stringify / JSON.parse, as a job queue would,
// and compares the merge with one run of the same request, exactly.
const viaJson = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

const toleranceJob: ToleranceShardRequest = {
  kind: "tolerance",
  formula: "coaxialCoilsMutualInductance",
  inputs: {
    turns1: 100, radius1: { nominal: "10 mm", percent: 1 }, length1: "20 mm",
    turns2: 50, radius2: { distribution: "normal", mean: "15 mm", sd: "0.1 mm" }, length2: "10 mm",
    distance: { distribution: "uniform", min: "28 mm", max: "32 mm" },
  },
  options: { samples: 5000, seed: 21 },
};

const sweepJob: SweepShardRequest = {
  kind: "sweep",
  formula: "parallelPlateCapacitance",
  vary: { gap: { from: "-0.01 mm", to: "1 mm", points: 61 }, area: { from: "1 mm^2", to: "1 m^2", points: 47, scale: "log" } },
};

function runAll<R extends ToleranceShardRequest | SweepShardRequest>(request: R, count: number): unknown[] {
  return planShards(request, count).map((s) => viaJson(runShard(viaJson(s) as never)));
}

describe("shards", () => {
  it("merge a Monte Carlo tolerance run split into 1, 2, 3 and 7 shards into one run's result", () => {
    const one = toleranceRequest(toleranceJob);
    for (const count of [1, 2, 3, 7]) {
      const shards = planShards(toleranceJob, count);
      expect(shards.length).toBe(Math.min(count, Math.ceil(5000 / 1024)));
      // Any order of arrival.
      const results = runAll(toleranceJob, count).reverse();
      expect(mergeShards(results as never), `${count} shards`).toStrictEqual(one);
    }
  });

  it("merge a two-input sweep split into 1, 2, 3 and 7 shards into one run's result, points not computed included", () => {
    const one = sweepRequest(sweepJob);
    expect(one.notComputed).toBeGreaterThan(0);
    for (const count of [1, 2, 3, 7]) {
      const merged = mergeShards(runAll(sweepJob, count) as SweepShardResult[]);
      expect(merged.notComputed).toBe(one.notComputed);
      expect(merged.notes).toStrictEqual(one.notes);
      expect(Buffer.compare(Buffer.from(merged.output.values.slice().buffer), Buffer.from(one.output.values.slice().buffer)), `${count} shards`).toBe(0);
      expect([...merged.computed]).toEqual([...one.computed]);
    }
  });

  it("refuses a bad request when planning, a bad shard count, and a missing, repeated or foreign shard when merging", () => {
    expect(expectFormulaError(() => planShards({ ...sweepJob, formula: "noSuchFormula" }, 2)).code).toBe("unknown_formula");
    expect(expectFormulaError(() => planShards({ ...toleranceJob, kind: "grid" } as never, 2)).input).toBe("kind");
    for (const count of [0, 1.5, 10_001]) expect(expectFormulaError(() => planShards(sweepJob, count)).input).toBe("count");
    const results = runAll(sweepJob, 3);
    for (const broken of [results.slice(1), [results[0], results[0], results[1], results[2]], [...results.slice(0, 2), runAll({ ...sweepJob, fixed: { relativePermittivity: 2 } }, 3)[2]]]) {
      const e = expectFormulaError(() => mergeShards(broken as never));
      expect([e.code, e.input]).toEqual(["invalid_argument", "shards"]);
    }
    const shard = planShards(sweepJob, 2)[1]!;
    expect(expectFormulaError(() => runShard({ ...shard, end: 1e9 })).input).toBe("shard");
    expect(() => mergeShards([] as never)).toThrow(FormulaError);
  });

  it("keep a negative zero through JSON, so the merge is still one run's result bit for bit", () => {
    // A wire carrying -1 A in a field swept through 0 T: F = I L B sin(angle) is -0 N there.
    const sweep: SweepShardRequest = { kind: "sweep", formula: "wireForce", vary: { fluxDensity: { from: "-1 T", to: "1 T", points: 5 } }, fixed: { current: "-1 A", length: "1 m" } };
    const one = sweepRequest(sweep);
    expect(Object.is(one.output.values[2], -0)).toBe(true);
    const merged = mergeShards(runAll(sweep, 2) as SweepShardResult[]);
    expect(Object.is(merged.output.values[2], -0)).toBe(true);
    expect(Buffer.compare(Buffer.from(merged.output.values.slice().buffer), Buffer.from(one.output.values.slice().buffer))).toBe(0);
    // Every Monte Carlo sample is -0 N: the current varies, the field is held at 0 T.
    const tolerance: ToleranceShardRequest = { kind: "tolerance", formula: "wireForce", inputs: { current: { nominal: "-1 A", percent: 5 }, length: "1 m", fluxDensity: "0 T" }, options: { samples: 3000, seed: 4 } };
    const runs = runAll(tolerance, 3);
    expect(JSON.stringify(runs)).toContain('"-0"');
    expect(mergeShards(runs as never)).toStrictEqual(toleranceRequest(tolerance));
  });

  it("report progress over the shard's range and stop with 'cancelled' when aborted from onProgress", async () => {
    const { pieceLimit } = await import("../../src/tools/chunks.js");
    const columns: ColumnsShardRequest = { kind: "columns", formula: "parallelPlateCapacitance", inputs: { area: Array.from({ length: 4000 }, (_, i) => 1e-4 * (1 + i)), gap: "1 mm" } };
    const jobs = [toleranceJob, sweepJob, columns] as const;
    // Pieces of at most 512 items, so even a fast machine passes several piece boundaries.
    const saved = pieceLimit.items;
    pieceLimit.items = 512;
    try {
      for (const job of jobs) {
        const shard = planShards(job, 2)[1]!;
        const seen: Progress[] = [];
        const plain = runShard(shard as never);
        const watched = runShard(shard as never, { onProgress: (p) => seen.push(p) });
        expect(watched, job.kind).toStrictEqual(plain);
        const total = shard.end - shard.start;
        expect(seen.at(-1), job.kind).toStrictEqual({ fraction: 1, done: total, total });
        expect(seen.filter((p) => p.fraction === 1).length).toBe(1);
        for (let i = 1; i < seen.length; i++) expect(seen[i]!.done).toBeGreaterThanOrEqual(seen[i - 1]!.done);
        const controller = new AbortController();
        const e = expectFormulaError(() => runShard(shard as never, { signal: controller.signal, onProgress: () => controller.abort() }));
        expect([e.code, job.kind]).toEqual(["cancelled", job.kind]);
        controller.abort();
        expect(expectFormulaError(() => runShard(shard as never, { signal: controller.signal })).code).toBe("cancelled");
      }
    } finally {
      pieceLimit.items = saved;
    }
    expect(expectFormulaError(() => runShard(planShards(sweepJob, 2)[0]!, { onProgress: 5 as never })).input).toBe("onProgress");
  });
});
