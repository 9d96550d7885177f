// Solve's options are checked like inputs, and its search and refinement are
// bounded loops whose iterations the test build counts (tests/helpers/loop-count.ts).
import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { SOLVE_LIMITS, solveDetails, solveRequest } from "../../src/tools/solve.js";
import { expectFormulaError } from "../helpers/errors.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";

const given = { target: 100e-12, area: 1e-4 } as never;

describe("solve options", () => {
  it("refuses every unusable option value with invalid_argument naming the option", () => {
    const cases: [string, unknown][] = [
      ["decades", NaN], ["decades", {}], ["decades", -3], ["decades", 0], ["decades", 2.5], ["decades", 301], ["decades", "12"],
      ["samplesPerDecade", NaN], ["samplesPerDecade", 1], ["samplesPerDecade", 8.5], ["samplesPerDecade", 101], ["samplesPerDecade", Infinity],
      ["range", [2, 1]], ["range", [1, 1]], ["range", [0, Infinity]], ["range", [NaN, 1]], ["range", [1]], ["range", "1..2"], ["range", {}],
      ["tolerance", 1e-9],
    ];
    for (const [name, value] of cases) {
      const e = expectFormulaError(() => solveDetails(parallelPlateCapacitance, "gap", given, { [name]: value } as never));
      expect(e.code, `${name} = ${String(value)}`).toBe("invalid_argument");
      expect(e.input, `${name} = ${String(value)}`).toBe(name);
      expect(e.message).not.toMatch(/Infinity|NaN|undefined/);
    }
    expect(expectFormulaError(() => solveDetails(parallelPlateCapacitance, "gap", given, 5 as never)).input).toBe("options");
  });

  it("checks the options of a JSON request the same way, and reads range ends as unit strings", () => {
    const req = { formula: "parallelPlateCapacitance", solveFor: "gap", target: "100 pF", inputs: { area: "1 cm^2" } };
    expect(expectFormulaError(() => solveRequest({ ...req, options: { decades: NaN } })).input).toBe("decades");
    expect(expectFormulaError(() => solveRequest({ ...req, options: { range: ["1 mm", "1 um"] } })).input).toBe("range");
    expect(expectFormulaError(() => solveRequest({ ...req, options: [] as never })).input).toBe("options");
    // gap = eps0 A / C = 8.8541878188e-12 * 1e-4 / 1e-10 = 8.854e-6 m (CODATA 2022 eps0).
    expect(solveRequest({ ...req, options: { range: ["1 um", "1 mm"], decades: 300, samplesPerDecade: 2 } }).value).toBeCloseTo(8.8541878188e-6, 15);
  });

  it("takes the limits themselves", () => {
    for (const options of [{ decades: 2, samplesPerDecade: 2 }, { decades: 300, samplesPerDecade: 100 }]) {
      expect(solveDetails(parallelPlateCapacitance, "gap", given, options).value).toBeCloseTo(8.8541878188e-6, 15);
    }
  });
});

describe("solve's loops", () => {
  it("stays within the stated bounds at the widest search: 61,207 evaluations per search, 200 per refinement", () => {
    resetLoopCount();
    solveDetails(parallelPlateCapacitance, "gap", { target: 1e-300, area: 1e-4 } as never, { decades: 300, samplesPerDecade: 100 });
    const { total, largest } = loopCount();
    expect(largest).toBeGreaterThan(SOLVE_LIMITS.refineIterations);
    expect(largest).toBeLessThanOrEqual(61_207);
    // The search, the ring building (each index moves once) and one refinement.
    expect(total).toBeLessThanOrEqual(2 * 61_207 + SOLVE_LIMITS.refineIterations + 2);
  });

  it("reports a short search for the default options", () => {
    resetLoopCount();
    solveDetails(parallelPlateCapacitance, "gap", given);
    const { total, largest } = loopCount();
    expect(total).toBeGreaterThan(0);
    // Default log grid: 2 * 12 * 8 + 2 points at most, one refinement of at most 200 iterations.
    expect(largest).toBeLessThanOrEqual(2 * 12 * 8 + 2 + SOLVE_LIMITS.refineIterations);
  });
});
