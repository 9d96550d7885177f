import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { solveRequest } from "../../src/tools/solve.js";
import { sweepRequest } from "../../src/tools/sweep.js";
import { toleranceRequest } from "../../src/tools/tolerance.js";

// JSON.parse makes "__proto__" an own key; names of Object.prototype members must not pass for inputs.
const requests: [string, () => unknown][] = [
  ["sweep over __proto__", () => sweepRequest(JSON.parse('{"formula":"parallelPlateCapacitance","vary":{"__proto__":{"from":1,"to":2,"points":2}},"fixed":{"area":1}}'))],
  ["sweep over constructor", () => sweepRequest(JSON.parse('{"formula":"parallelPlateCapacitance","vary":{"constructor":{"from":1,"to":2,"points":2}},"fixed":{"area":1}}'))],
  ["solve for constructor", () => solveRequest(JSON.parse('{"formula":"parallelPlateCapacitance","solveFor":"constructor","target":1,"inputs":{"area":1}}'))],
  ["solve for toString with a range", () => solveRequest(JSON.parse('{"formula":"parallelPlateCapacitance","solveFor":"toString","target":1,"inputs":{"area":1},"options":{"range":[1,2]}}'))],
  ["tolerance on constructor", () => toleranceRequest(JSON.parse('{"formula":"parallelPlateCapacitance","inputs":{"constructor":{"nominal":1,"percent":1}}}'))],
  ["tolerance with __proto__ inputs", () => toleranceRequest(JSON.parse('{"formula":"parallelPlateCapacitance","inputs":{"__proto__":{"area":1}}}'))],
  ["solve with a null request", () => solveRequest(null as never)],
  ["sweep with a string request", () => sweepRequest("gap" as never)],
  ["tolerance with inputs missing", () => toleranceRequest({ formula: "parallelPlateCapacitance" } as never)],
];

describe("the JSON request forms on hostile input", () => {
  for (const [name, fn] of requests) {
    it(`answer ${name} with a FormulaError`, () => {
      expect(fn).toThrow(FormulaError);
    });
  }
});
