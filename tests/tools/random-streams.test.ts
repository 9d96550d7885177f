import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { jump, MONTE_CARLO_BLOCK, seededState, step } from "../../src/tools/random.js";
import { finishTolerance, monteCarloRange, planTolerance } from "../../src/tools/tolerance.js";
import type { AnyFormula } from "../../src/core/formula.js";

/*
 * The Monte Carlo's random streams. The jump-ahead is checked against an
 * independent computation: xoshiro128**'s state transition is linear over
 * GF(2), so 2^64 steps are the transition matrix squared 64 times (built here
 * from `step` itself, column by column). The split invariance is checked by
 * running the sample ranges of several splits and joining them.
 */

type Matrix = Uint32Array[]; // 128 columns, each 4 words: column j = image of basis vector j

function transition(): Matrix {
  const cols: Matrix = [];
  for (let j = 0; j < 128; j++) {
    const s = new Uint32Array(4);
    s[j >>> 5] = 1 << (j & 31);
    step(s);
    cols.push(s);
  }
  return cols;
}

function apply(m: Matrix, v: Uint32Array): Uint32Array {
  const out = new Uint32Array(4);
  for (let j = 0; j < 128; j++) {
    if ((v[j >>> 5]! >>> (j & 31)) & 1) for (let w = 0; w < 4; w++) out[w] = out[w]! ^ m[j]![w]!;
  }
  return out;
}

function square(m: Matrix): Matrix {
  return m.map((col) => apply(m, col));
}

describe("Monte Carlo random streams", () => {
  it("jumps exactly 2^64 steps: the reference jump equals the transition matrix raised to 2^64 over GF(2)", () => {
    let m = transition();
    // The matrix is the transition itself: one step of a random state agrees.
    const s = seededState(12345);
    const once = Uint32Array.from(s);
    step(once);
    expect([...apply(m, s)]).toEqual([...once]);
    for (let k = 0; k < 64; k++) m = square(m);
    const jumped = Uint32Array.from(s);
    jump(jumped);
    expect([...jumped]).toEqual([...apply(m, s)]);
  });

  it("gives, for every split of the samples into ranges (inside blocks too), the samples and notes of one run", () => {
    const inputs = {
      area: { nominal: 1e-4, percent: 2 },
      gap: { distribution: "normal", mean: 1e-4, sd: 3e-5 },
      relativePermittivity: { distribution: "uniform", min: 4.3, max: 4.5 },
    };
    const samples = 3 * MONTE_CARLO_BLOCK + 517;
    const f = parallelPlateCapacitance as unknown as AnyFormula;
    const run = (cuts: number[]): ReturnType<typeof finishTolerance> => {
      const plan = planTolerance(f, inputs, { samples, seed: 5 });
      const bounds = [0, ...cuts, samples];
      const parts = bounds.slice(1).map((end, i) => monteCarloRange(f, plan.b, plan.varied, plan.seed, plan.sampleOffset, bounds[i]!, end));
      return finishTolerance(plan, parts);
    };
    const one = run([]);
    expect(one.monteCarlo!.rejected).toBeGreaterThan(0); // normal draws past the gap's domain
    for (const cuts of [[1], [MONTE_CARLO_BLOCK], [700, 701, 2500], [17, MONTE_CARLO_BLOCK * 2 + 3, samples - 1]]) {
      expect(run(cuts), cuts.join(",")).toStrictEqual(one);
    }
  });
});
