import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { AnyFormula, InputSpec } from "../../src/index.js";
import * as inductance from "../../src/inductance/index.js";
import { isFormula } from "../../src/index.js";
import { relativeError } from "../helpers/reference.js";

const formulas = Object.values(inductance).filter(isFormula) as AnyFormula[];
const inputsOf = (f: AnyFormula) => Object.entries(f.definition.inputs as Record<string, InputSpec>);
const isLength = (s: InputSpec) => "dimension" in s && s.dimension === "Length";

function example(f: AnyFormula): Record<string, unknown> {
  const x: Record<string, unknown> = {};
  for (const [k, s] of inputsOf(f)) x[k] = s.example;
  return x;
}

describe("inductance formulas (all)", () => {
  it("every geometric inductance scales linearly when all lengths scale (property)", () => {
    const geometric = formulas.filter(
      (f) => f.definition.output.dimension === "Inductance" && inputsOf(f).some(([, s]) => isLength(s)),
    );
    expect(geometric.length).toBeGreaterThanOrEqual(14);
    for (const f of geometric) {
      fc.assert(
        fc.property(fc.double({ min: 1e-4, max: 1e4, noNaN: true }), fc.double({ min: 0.7, max: 1.3, noNaN: true }), (s, jiggle) => {
          const x = example(f);
          // move one length a little so the check is not tied to the example point
          const lengthNames = inputsOf(f).filter(([, sp]) => isLength(sp)).map(([k]) => k);
          const first = lengthNames[0]!;
          const moved = { ...x, [first]: (x[first] as number) * jiggle };
          let base: number;
          try {
            base = f.run(f.prepare(moved)) as number;
          } catch {
            return; // the move broke a relation (e.g. inner < outer): nothing to check
          }
          const scaled: Record<string, unknown> = { ...moved };
          for (const k of lengthNames) scaled[k] = (moved[k] as number) * s;
          const got = f.run(f.prepare(scaled)) as number;
          expect(relativeError(got, s * base), f.id).toBeLessThan(1e-12);
        }),
        { numRuns: 25 },
      );
    }
  });

  it("inductorEnergy grows as I^2 and couplingCoefficient is unchanged by a common scale (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 10, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.boolean(), fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (L, amps, negative, s) => {
        const I = negative ? -amps : amps;
        const W = inductance.inductorEnergy.run({ inductance: L, current: I });
        expect(relativeError(inductance.inductorEnergy.run({ inductance: L, current: 3 * I }), 9 * W)).toBeLessThan(1e-15);
        const k = inductance.couplingCoefficient.run({ mutualInductance: 0.3 * L, inductance1: L, inductance2: 2 * L });
        const ks = inductance.couplingCoefficient.run({ mutualInductance: 0.3 * L * s, inductance1: L * s, inductance2: 2 * L * s });
        expect(relativeError(ks, k)).toBeLessThan(1e-15);
      }),
    );
  });

  it("every formula has a named source and examples that satisfy its relations", () => {
    for (const f of formulas) {
      const srcs = ([] as { authors: string; title: string }[]).concat(f.definition.source as never);
      expect(srcs.length, f.id).toBeGreaterThan(0);
      for (const s of srcs) expect(s.authors.length * s.title.length, f.id).toBeGreaterThan(0);
      expect(() => f.run(f.prepare(example(f))), f.id).not.toThrow();
    }
  });
});
