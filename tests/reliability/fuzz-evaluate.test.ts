/**
 * Fuzz: `evaluate(id, inputs)` and the typed calls (the formula functions and
 * `formula.details`) under hostile inputs over the whole double range, unit
 * strings, choice words, vectors, prototype keys, extra and missing keys and
 * non-objects. Every call returns finite numbers and clean text, or throws a
 * FormulaError with a public code, within its loop bound (fuzz-check.ts).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import { numericInputsFor, perFormula } from "./fuzz-cases.js";
import { countLoop } from "../helpers/loop-count.js";
import { judge, LOOP_BOUND_PER_EVALUATION, show } from "./fuzz-check.js";
import { driveSync, expectClean, newDrive } from "./fuzz-drive.js";
import { evaluate } from "../../src/core/evaluate.js";
import { CASES } from "./fuzz-runners.js";

const evaluated = newDrive();
const typed = newDrive();

describe("fuzz: evaluate and the typed calls", () => {
  it(`the case counts of all fuzz paths add up to at least 1e5`, () => {
    expect(Object.values(CASES).reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(100_000);
  });

  it("the verdict flags a result that is not finite, a foreign throw, a NaN word and a loop over its bound (the checks can fail)", () => {
    expect(judge(() => ({ value: Infinity }), {}).violations).toHaveLength(1);
    expect(judge(() => ({ warnings: [{ message: "ratio NaN" }] }), {}).violations).toHaveLength(1);
    expect(judge(() => (null as unknown as { x: number }).x, {}).violations[0]).toMatch(/^threw TypeError/);
    expect(judge(() => (countLoop(LOOP_BOUND_PER_EVALUATION + 1), 1), {}).violations[0]).toMatch(/loop iterations/);
    // The user's own text quoted back is not the library writing NaN.
    expect(judge(() => ({ message: 'could not be read: "NaN m"' }), { gap: "NaN m" }).violations).toEqual([]);
  });

  it(`${CASES.evaluate} evaluate cases: a finite result or a coded FormulaError, clean text, bounded loops`, () => {
    driveSync(evaluated, "evaluate", CASES.evaluate);
    expectClean(evaluated, CASES.evaluate);
  });

  it(`${CASES.typed} typed calls and details: a finite result or a coded FormulaError, clean text, bounded loops`, () => {
    driveSync(typed, "typed", CASES.typed);
    expectClean(typed, CASES.typed);
  });
});

// These two once never returned: a complete elliptic integral whose complementary
// parameter underflowed to 0 (a point a vanishing distance from a loop's wire,
// coincident loops). They must now give a clean verdict like any case.
describe("the former hangs", () => {
  it("a field point 1e-200 m from a loop's wire and 1 km loops 1e-321 m apart give finite values", () => {
    const reproducers = [
      { id: "loopField", inputs: { current: 1, radius: 0.1, radialDistance: 0.1, axialDistance: 1e-200 } },
      { id: "coaxialLoopsMutualInductance", inputs: { radius1: 1000, radius2: 1000, distance: 1e-321 } },
    ];
    for (const r of reproducers) expect(judge(() => evaluate(r.id, r.inputs), r).violations, r.id).toEqual([]);
  });
});

describe("fuzz: the typed call's fast path agrees with evaluate", () => {
  const RUNS = 10_000;
  it(`on ${RUNS} cases of plain numbers: the same value bit for bit, or the same error code and input`, () => {
    fc.assert(
      fc.property(perFormula((f) => numericInputsFor(f).map((x) => ({ f, x }))), ({ f, x }) => {
        const typed = outcome(() => f(x as never));
        const careful = outcome(() => evaluate(f.id, x).value);
        expect(typed, `${f.id} ${show(x)}`).toEqual(careful);
      }),
      { numRuns: RUNS },
    );
  });
});

/** The value, or the FormulaError's code and input (anything else is rethrown). */
function outcome(call: () => unknown): unknown {
  try {
    return { value: call() };
  } catch (e) {
    if (e instanceof FormulaError) return { code: e.code, input: e.input };
    throw e;
  }
}
