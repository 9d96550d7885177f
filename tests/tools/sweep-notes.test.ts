// Notes travel with sweeps: each note code's count and worst point, checked
// against the formula's own notes called point by point (an independent path:
// prepare, run and notes per point, no sweep machinery).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { AnyFormula } from "../../src/core/formula.js";
import { sweep, type SweepResult } from "../../src/tools/sweep.js";
import { withoutCodeGeneration } from "../helpers/no-eval.js";
import { isQuantity, specsOf, withExamples } from "../reliability/harness.js";
import { makeMeasured, makeMeasuredVector, measured, measuredVector } from "./note-fixtures.js";

/** Counts, worst measure and first index per code, from formula.notes point by point over a sweep's grid. */
function pointByPoint(f: AnyFormula, r: SweepResult, fixed: Record<string, unknown>) {
  const n1 = r.axes.length === 2 ? r.axes[1]!.values.length : 1;
  const found = new Map<string, { count: number; max: number; first: number }>();
  const conditions = [...(f.definition.validity ?? []), ...(f.definition.cautions ?? [])];
  for (let k = 0; k < r.computed.length; k++) {
    const inputs: Record<string, unknown> = { ...fixed, [r.axes[0]!.name]: r.axes[0]!.values[Math.floor(k / n1)] };
    if (r.axes.length === 2) inputs[r.axes[1]!.name] = r.axes[1]!.values[k % n1];
    let x;
    let value;
    try {
      x = f.prepare(inputs);
      value = f.run(x);
    } catch {
      expect(r.computed[k], `point ${k} fails on its own but is marked computed`).toBe(0);
      continue;
    }
    expect(r.computed[k], `point ${k} computes on its own but is not marked computed`).toBe(1);
    const n = f.notes(x, value);
    for (const note of [...n.warnings, ...n.cautions]) {
      const cond = conditions.find((c) => c.code === note.code)!;
      const m = cond.measure ? cond.measure(x as never, value) : -Infinity;
      const e = found.get(note.code) ?? { count: 0, max: -Infinity, first: k };
      found.set(note.code, { count: e.count + 1, max: Math.max(e.max, m), first: e.first });
    }
  }
  return found;
}

function expectAgree(f: AnyFormula, r: SweepResult, fixed: Record<string, unknown>): void {
  const expected = pointByPoint(f, r, fixed);
  expect(r.notes.map((s) => s.code).sort(), f.id).toEqual([...expected.keys()].sort());
  for (const s of r.notes) {
    const e = expected.get(s.code)!;
    expect(s.count, `${f.id} ${s.code}`).toBe(e.count);
    if (s.worst.measure !== undefined) expect(s.worst.measure, `${f.id} ${s.code}`).toBe(e.max);
    else expect(s.worst.index, `${f.id} ${s.code} (no measure: the first point)`).toBe(e.first);
    // The message is the one formula.notes gives at the worst point.
    const x = f.prepare({ ...fixed, ...s.worst.inputs });
    const n = f.notes(x, f.run(x));
    expect([...n.warnings, ...n.cautions].find((m) => m.code === s.code)?.message, `${f.id} ${s.code}`).toBe(s.worst.message);
  }
}

describe("sweep results carry the notes found on the grid", () => {
  it("counts each note and finds the largest measure on a 2-D grid, with relations failing in part of it", () => {
    const r = sweep(measured, { vary: { a: { from: 1, to: 10, points: 10 }, b: { from: 1, to: 5, points: 5 } } });
    expectAgree(measured, r, {});
    const large = r.notes.find((s) => s.code === "large")!;
    // a < 9 holds for a = 1..8; y = a b > 10 at 2 + 3 + 3 + 4 + 4 + 4 points (a = 3..8), counted by hand.
    expect(large.count).toBe(20);
    expect(large.worst).toMatchObject({ inputs: { a: 8, b: 5 }, measure: 40, message: "y is 40" });
    const always = r.notes.find((s) => s.code === "always_here")!;
    expect(always).toMatchObject({ kind: "caution", count: 40, worst: { index: 0, inputs: { a: 1, b: 1 } } });
    expect(r.notes[0]!.kind).toBe("warning");
  });

  it("gives the same notes from the fallback loop (no code generation)", () => {
    const spec = { vary: { a: { from: 1, to: 10, points: 10 }, b: { from: 1, to: 5, points: 5 } } };
    // A fresh formula: no generated loop or scan is cached for it yet.
    const fresh = makeMeasured();
    const general = withoutCodeGeneration(() => sweep(fresh, spec));
    expect(general.notes).toEqual(sweep(measured, spec).notes);
    expectAgree(fresh, general, {});
  });

  it("hands every output component to the conditions, on both loops", () => {
    const spec = { vary: { a: { from: 1, to: 6, points: 6 } }, fixed: { b: 3 } };
    const r = sweep(measuredVector, spec);
    expectAgree(measuredVector, r, { b: 3 });
    expect(r.notes[0]).toMatchObject({ code: "deep", count: 3, worst: { inputs: { a: 6 }, measure: 18 } });
    const fresh = makeMeasuredVector();
    expect(withoutCodeGeneration(() => sweep(fresh, spec)).notes).toEqual(r.notes);
  });

  it("gives an empty list when nothing on the grid raises a note", () => {
    expect(sweep(measuredVector, { vary: { a: { from: 1, to: 2, points: 3 } }, fixed: { b: 1 } }).notes).toEqual([]);
  });

  it("agrees with formula.notes point by point for every registry formula with notes, on one- and two-input grids", () => {
    const cases = withExamples()
      .filter(({ f }) => (f.definition.validity?.length ?? 0) + (f.definition.cautions?.length ?? 0) > 0)
      .map(({ f, ex }) => ({ f, ex, names: specsOf(f).filter(([, s]) => isQuantity(s) && !s.vector).map(([n]) => n) }))
      .filter((c) => c.names.length > 0);
    fc.assert(
      fc.property(
        fc.constantFrom(...cases), fc.nat(), fc.nat(), fc.integer({ min: -4, max: 4 }), fc.integer({ min: 1, max: 4 }), fc.integer({ min: 2, max: 7 }), fc.boolean(),
        ({ f, ex, names }, pick0, pick1, shift, width, points, two) => {
          const name0 = names[pick0 % names.length]!;
          const name1 = names[pick1 % names.length]!;
          const axis = (n: string) => {
            const v = ex[n] as number;
            // Decades around the example (or around 1 when it is 0), sign kept.
            const base = v === 0 ? 1 : v;
            return { from: base * 10 ** shift, to: base * 10 ** (shift + width), points, scale: "log" as const };
          };
          const vary: Record<string, unknown> = { [name0]: axis(name0) };
          if (two && name1 !== name0) vary[name1] = axis(name1);
          const fixed = { ...ex };
          for (const n of Object.keys(vary)) delete fixed[n];
          let r;
          try {
            r = sweep(f, { vary, fixed } as never);
          } catch {
            return; // a grid with no point in an input's domain is refused as a whole: nothing to compare
          }
          expectAgree(f, r, fixed);
        },
      ),
      { numRuns: 150 },
    );
  });
});
