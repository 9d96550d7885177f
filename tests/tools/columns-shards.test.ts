import { describe, expect, it } from "vitest";
import { evaluateColumns } from "../../src/tools/columns.js";
import { type ColumnsShardRequest, type ColumnsShardResult, mergeShards, planShards, runShard } from "../../src/tools/shards.js";
import { expectSameColumns } from "../helpers/columns.js";
import { expectFormulaError } from "../helpers/errors.js";

// Columns shards travel as JSON, as a job queue would send them: each shard
// and its result go through JSON.stringify / JSON.parse, and the merge is
// compared with one evaluateColumns call over the whole table, bit for bit.
const viaJson = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

const n = 3001;
/** Parts with bad rows (negative gap, wrong unit, unreadable cell) and rows raising the fringing warning; invented values. */
const plates: ColumnsShardRequest = {
  kind: "columns",
  formula: "parallelPlateCapacitance",
  inputs: {
    area: { values: Array.from({ length: n }, (_, i) => 1 + ((i * 7919) % 500)), unit: "mm^2" },
    gap: Array.from({ length: n }, (_, i) => (i === 17 ? "-0.1 mm" : i === 2000 ? "3 kg" : i === 1500 ? "abc" : `${1 + ((i * 104729) % 3000)} um`)),
    relativePermittivity: 4.4,
  },
};
/** A choice column and an output with components. */
const spirals: ColumnsShardRequest = {
  kind: "columns",
  formula: "planarSpiralInductance",
  inputs: { outerDiameter: "2 mm", innerDiameter: "1 mm", turns: 5, shape: Array.from({ length: 101 }, (_, i) => ["square", "circular", "triangle", ""][i % 4]!) },
};
const loops: ColumnsShardRequest = {
  kind: "columns",
  formula: "loopField",
  inputs: { current: 1, radius: 0.1, radialDistance: Array.from({ length: 257 }, (_, i) => (i % 11) * 0.02), axialDistance: Array.from({ length: 257 }, (_, i) => ((i % 5) - 2) * 0.01) },
};

describe("columns shards", () => {
  it("merge a table split into 1, 2, 3 and 7 shards, arriving in any order, into one run's result", () => {
    for (const request of [plates, spirals, loops]) {
      const one = evaluateColumns(request.formula, request.inputs);
      if (request === plates) {
        expect(one.failed).toBe(3);
        expect(one.notes.length).toBeGreaterThan(0);
      }
      for (const count of [1, 2, 3, 7]) {
        const results = planShards(request, count).map((s) => viaJson(runShard(viaJson(s)))).reverse();
        expectSameColumns(mergeShards(results), one, `${request.formula}, ${count} shards`);
      }
    }
  });

  it("refuses a bad table when planning, and a missing, repeated or foreign shard or a short result when merging", () => {
    expect(expectFormulaError(() => planShards({ ...plates, inputs: { ...plates.inputs, relativePermittivity: [1, 2] } }, 2)).input).toBe("relativePermittivity");
    expect(expectFormulaError(() => planShards({ ...plates, inputs: { ...plates.inputs, relativePermittivity: 0.5 } }, 2)).input).toBe("relativePermittivity");
    const results = planShards(plates, 3).map((s) => viaJson(runShard(s)));
    const other = planShards({ ...plates, inputs: { ...plates.inputs, relativePermittivity: 2 } }, 3).map((s) => runShard(s));
    const short: ColumnsShardResult = { ...results[1]!, values: results[1]!.values.slice(1) };
    for (const broken of [results.slice(1), [results[0]!, results[0]!, results[1]!, results[2]!], [results[0]!, results[1]!, other[2]!], [results[0]!, short, results[2]!]]) {
      const e = expectFormulaError(() => mergeShards(broken));
      expect([e.code, e.input]).toEqual(["invalid_argument", "shards"]);
    }
    expect(expectFormulaError(() => runShard({ ...planShards(plates, 2)[1]!, end: n + 1 })).input).toBe("shard");
  });
});
