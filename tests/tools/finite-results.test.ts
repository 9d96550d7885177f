// Nothing non-finite escapes the tools: every field of a sweep or tolerance
// result is a finite number (NaN only where a sweep marks a point not computed),
// and no text anywhere says "Infinity", "NaN" or "undefined".
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError } from "../../src/core/errors.js";
import type { AnyFormula } from "../../src/core/formula.js";
import { sweep, sweepRequest, type SweepResult } from "../../src/tools/sweep.js";
import { toleranceRequest } from "../../src/tools/tolerance.js";
import { fixtureShellVector } from "../reliability/fixtures.js";
import { isQuantity, specsOf, withExamples } from "../reliability/harness.js";

/** Every number in `v` finite and no text that reads as a program's internals; returns the first problem. */
function problem(v: unknown, path = "result"): string | undefined {
  if (typeof v === "number") return Number.isFinite(v) ? undefined : `${path} is ${v}`;
  if (typeof v === "string") return /Infinity|NaN|undefined/.test(v) ? `${path} says "${v}"` : undefined;
  if (v instanceof Float64Array || v instanceof Uint8Array) return undefined; // checked apart (NaN marks not computed)
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const p = problem(v[i], `${path}[${i}]`);
      if (p) return p;
    }
    return undefined;
  }
  if (typeof v === "object" && v !== null) {
    for (const [k, x] of Object.entries(v)) {
      const p = problem(x, `${path}.${k}`);
      if (p) return p;
    }
  }
  return undefined;
}

/** A sweep's arrays: finite axes; every computed point finite in every component; NaN exactly where not computed. */
function sweepProblem(r: SweepResult): string | undefined {
  for (const a of r.axes) for (const v of a.values) if (!Number.isFinite(v)) return `axis ${a.name} has ${v}`;
  const arrays = [r.output.values, ...Object.values(r.output.components ?? {})];
  let notComputed = 0;
  for (let k = 0; k < r.computed.length; k++) {
    if (r.computed[k] === 1) {
      for (const arr of arrays) if (!Number.isFinite(arr[k])) return `point ${k} is marked computed with ${arr[k]}`;
    } else notComputed++;
  }
  if (notComputed !== r.notComputed) return `notComputed ${r.notComputed} but ${notComputed} points are unmarked`;
  return problem({ notes: r.notes, formula: r.formula, output: r.output.name });
}

/** Scalar quantity inputs of a formula. */
function scalarInputs(f: AnyFormula): string[] {
  return specsOf(f).filter(([, s]) => isQuantity(s) && !s.vector).map(([n]) => n);
}

/** A double from +-1e-300 to +-1e308 (sign, decade, mantissa), or zero. */
const wide = fc.tuple(fc.boolean(), fc.integer({ min: -300, max: 307 }), fc.double({ min: 1, max: 9.99, noNaN: true }), fc.nat(20))
  .map(([neg, e, m, z]) => (z === 0 ? 0 : (neg ? -1 : 1) * m * 10 ** e));

describe("sweeps never produce a non-finite axis value or a non-finite computed point", () => {
  it("sweeps the whole double range, -1.7e308 to 1.7e308, with finite axis values and no NaN marked computed (the reported case)", () => {
    const r = sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: -1.7e308, to: 1.7e308, points: 11 } }, fixed: { area: 1e300 } });
    expect(sweepProblem(r)).toBeUndefined();
    // Evenly spaced through zero: the middle point of an odd count is the midpoint, 0.
    expect(r.axes[0]!.values[5]).toBe(0);
    expect(r.axes[0]!.values[10]).toBe(1.7e308);
    // Negative and zero gaps are outside the domain; the five positive ones compute.
    expect(r.notComputed).toBe(6);
    for (let k = 6; k < 11; k++) expect(r.output.values[k]).toBeGreaterThan(0);
  });

  it("keeps log axes within their ends at the largest double", () => {
    const r = sweepRequest({ formula: "parallelPlateCapacitance", vary: { area: { from: 1e-300, to: Number.MAX_VALUE, points: 1000, scale: "log" } }, fixed: { gap: 1e-3 } });
    expect(sweepProblem(r)).toBeUndefined();
    const a = r.axes[0]!.values;
    for (let i = 1; i < a.length; i++) expect(a[i]!).toBeGreaterThanOrEqual(a[i - 1]!);
  });

  it("gives every registry formula only finite results or a FormulaError over spans from tiny to huge", () => {
    const cases = withExamples().flatMap(({ f, ex }) => scalarInputs(f).map((name) => ({ f, ex, name })));
    fc.assert(
      fc.property(fc.constantFrom(...cases), wide, wide, fc.integer({ min: 1, max: 12 }), fc.boolean(), ({ f, ex, name }, from, to, points, log) => {
        const fixed = { ...ex };
        delete fixed[name];
        try {
          const r = sweep(f, { vary: { [name]: { from, to, points, scale: log ? "log" : "linear" } }, fixed } as never);
          const p = sweepProblem(r);
          expect(p, `${f.id} ${name} ${from}..${to}`).toBeUndefined();
        } catch (e) {
          if (!(e instanceof FormulaError)) throw e;
          expect(problem(e.message), `${f.id}: ${e.message}`).toBeUndefined();
        }
      }),
      { numRuns: 400 },
    );
  });

  it("checks every component of a component output on the huge span too", () => {
    const r = sweep(fixtureShellVector, { vary: { innerRadius: { from: -1.7e308, to: 1.7e308, points: 9 } }, fixed: { outerRadius: 1e308, turns: 1e300, position: [1e8, 1, 1] } } as never);
    expect(sweepProblem(r)).toBeUndefined();
  });
});

describe("tolerance analyses return only finite fields", () => {
  it("keeps the RSS and the shares finite for an area of 1e170 +- 50 % (the reported case: squares overflowed)", () => {
    const r = toleranceRequest({ formula: "parallelPlateCapacitance", inputs: { area: { nominal: 1e170, percent: 50 }, gap: 1e-3 }, options: { samples: 2000 } });
    expect(problem(r)).toBeUndefined();
    // First-order propagation of C = eps0 A / d, uniform band: sd = (dC/dA) * 0.5 A / sqrt(3) (GUM, JCGM 100:2008, eq. 10 and 4.3.7).
    // eps0 = 8.8541878188e-12 F/m (CODATA 2022); the slope eps0 / d is taken from CODATA, not from the library.
    const expected = (8.8541878188e-12 / 1e-3) * 0.5e170 / Math.sqrt(3);
    expect(Math.abs(r.rss.sd - expected) / expected).toBeLessThan(1e-9);
    expect(r.sensitivities[0]!.share).toBe(1);
  });

  it("refuses a band beyond the double range with invalid_argument naming the input", () => {
    for (const area of [{ nominal: 1.5e308, percent: 50 }, { distribution: "normal", mean: 1e308, sd: 1e308 }, { nominal: 1e308, plusMinus: 1e308 }]) {
      try {
        toleranceRequest({ formula: "parallelPlateCapacitance", inputs: { area, gap: 1e-3 } });
        expect.fail("expected a FormulaError");
      } catch (e) {
        expect(e).toBeInstanceOf(FormulaError);
        expect((e as FormulaError).code).toBe("invalid_argument");
        expect((e as FormulaError).input).toBe("area");
      }
    }
  });

  it("gives finite moments for a uniform band spanning both signs near the largest double", () => {
    // Q = C V with V uniform over +-1.5e308 and C = 1: the sum of the samples and their squares overflow unscaled.
    const r = toleranceRequest({ formula: "capacitorCharge", inputs: { capacitance: 1, voltage: { distribution: "uniform", min: -1.5e308, max: 1.5e308 } }, options: { samples: 500 } });
    expect(problem(r)).toBeUndefined();
    // A uniform band's sd is its width / sqrt(12) (GUM, JCGM 100:2008, 4.3.7): 3e308 / sqrt(12) = 8.66e307; 500 samples land within 10 %.
    expect(r.monteCarlo!.sd / 8.660254037844386e307).toBeGreaterThan(0.9);
    expect(r.monteCarlo!.sd / 8.660254037844386e307).toBeLessThan(1.1);
  });

  it("gives every registry formula only finite fields or a FormulaError for nominals 1e-300 to 1e300 and tolerances 0-99 %", () => {
    const cases = withExamples()
      .filter(({ f }) => !f.definition.output.components)
      .flatMap(({ f, ex }) => scalarInputs(f).map((name) => ({ f, ex, name })));
    fc.assert(
      fc.property(fc.constantFrom(...cases), fc.integer({ min: -300, max: 300 }), fc.double({ min: 1, max: 9.99, noNaN: true }), fc.integer({ min: 0, max: 99 }), ({ f, ex, name }, e, m, percent) => {
        const inputs = { ...ex, [name]: { nominal: m * 10 ** e, percent } };
        try {
          const r = toleranceRequest({ formula: f.id, inputs, options: { samples: 100 } });
          expect(problem(r), `${f.id} ${name} = ${m}e${e} +- ${percent} %`).toBeUndefined();
        } catch (err) {
          if (!(err instanceof FormulaError)) throw err;
          expect(problem(err.message), `${f.id}: ${err.message}`).toBeUndefined();
        }
      }),
      { numRuns: 300 },
    );
  });
});
