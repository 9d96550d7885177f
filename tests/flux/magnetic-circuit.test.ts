import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FormulaError, coreFluxDensity, evaluate, gapFringingFactor, gappedCoreInductance, inductanceFactor, inductanceFromFactor,
  reluctance, solveMagneticCircuit,
  type Area, type Current, type Inductance, type Length, type MagneticBranch, type Reluctance,
} from "../../src/index.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, MU0 } from "./oracle.js";

const mm = (v: number) => (v * 1e-3) as Length;
const m = (v: number) => v as Length;
const m2 = (v: number) => v as Area;
const MU0_NUM = MU0.toNumber();

import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { MAX_BRANCHES, MAX_NODES } from "../../src/flux/circuit-solver.js";

describe("reluctance", () => {
  it("of a 1 mm air gap of 1 cm^2 is l / (mu0 A) (decimal.js oracle)", () => {
    checkCases(
      [
        { input: { l: 1e-3, A: 1e-4, mur: 1 }, expected: new D("1e-3").div(MU0.times("1e-4")).toNumber(), tolerance: 1e-15, source: "decimal.js oracle of l / (mu0 mur A)" },
        { input: { l: 0.1, A: 1e-4, mur: 2000 }, expected: new D("0.1").div(MU0.times(2000).times("1e-4")).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" },
      ],
      (x) => reluctance({ length: m(x.l), area: m2(x.A), relativePermeability: x.mur }),
    );
  });

  it("adds in series: a path cut in two has the reluctance of the whole (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.double({ min: 1, max: 1e5, noNaN: true }), (l, frac, mur) => {
        const whole = reluctance({ length: m(l), area: m2(1e-4), relativePermeability: mur });
        const parts = reluctance({ length: m(l * frac), area: m2(1e-4), relativePermeability: mur }) + reluctance({ length: m(l * (1 - frac)), area: m2(1e-4), relativePermeability: mur });
        expect(relativeError(parts, whole)).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("gappedCoreInductance", () => {
  it("equals N^2 / (core + gap reluctance)", () => {
    const N = 20;
    const core = reluctance({ length: mm(100), area: m2(1e-4), relativePermeability: 2000 });
    const gap = reluctance({ length: mm(0.5), area: m2(1e-4) });
    const L = gappedCoreInductance({ turns: N, pathLength: mm(100), area: m2(1e-4), relativePermeability: 2000, gapLength: mm(0.5) });
    expect(relativeError(L, (N * N) / (core + gap))).toBeLessThan(1e-14);
  });

  it("tends to mu0 N^2 A / g as the core permeability grows (fast-check)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), fc.double({ min: 1e-5, max: 1e-2, noNaN: true }), fc.double({ min: 1e-6, max: 1e-2, noNaN: true }), (N, g, A) => {
        const L = gappedCoreInductance({ turns: N, pathLength: m(0.1), area: m2(A), relativePermeability: 1e15, gapLength: m(g) });
        expect(relativeError(L, (MU0_NUM * N * N * A) / g)).toBeLessThan(1e-10); // l / mur / g <= 1e-11
      }),
    );
  });

  it("is A_L N^2 with A_L from inductanceFactor (IEC 60205 effective parameters), for any fringing factor 1", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1000 }), fc.double({ min: 1, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1e-3, noNaN: true }), (N, mur, g) => {
        const inputs = { pathLength: mm(50), area: m2(5e-5), relativePermeability: mur, gapLength: m(g) };
        const AL = inductanceFactor(inputs);
        const viaFactor = inductanceFromFactor({ inductanceFactor: AL, turns: N });
        expect(relativeError(viaFactor, gappedCoreInductance({ ...inputs, turns: N }))).toBeLessThan(1e-14);
      }),
    );
  });

  it("warns about fringing for gaps above 1 % of sqrt(area) unless a fringing factor is given", () => {
    const base = { turns: 20, pathLength: mm(100), area: m2(1e-4), relativePermeability: 2000, gapLength: mm(0.5) };
    expect(gappedCoreInductance.details(base).warnings.map((w) => w.code)).toContain("fringing");
    expect(gappedCoreInductance.details({ ...base, fringingFactor: 1.2 }).warnings).toHaveLength(0);
    expect(gappedCoreInductance.details({ ...base, gapLength: mm(0.05) }).warnings).toHaveLength(0);
  });
});

describe("the core-based formulas and relative permeability", () => {
  const base = { turns: 20, pathLength: mm(100), area: m2(1e-4), gapLength: mm(0.05) };

  it("accept any relative permeability above 0 and warn below 1, where the material guides no flux", () => {
    for (const mur of [0.5, 0.999994]) {
      expect(gappedCoreInductance.details({ ...base, relativePermeability: mur }).warnings.map((w) => w.code)).toEqual(["not_a_magnetic_core"]);
      expect(coreFluxDensity.details({ ...base, current: 1 as Current, relativePermeability: mur }).warnings.map((w) => w.code)).toEqual(["not_a_magnetic_core"]);
      expect(inductanceFactor.details({ pathLength: mm(100), area: m2(1e-4), gapLength: mm(0.05), relativePermeability: mur }).warnings.map((w) => w.code)).toEqual(["not_a_magnetic_core"]);
    }
    expect(gappedCoreInductance.details({ ...base, relativePermeability: 1 }).warnings).toEqual([]);
    expect(gappedCoreInductance.details({ ...base, relativePermeability: 2000 }).warnings).toEqual([]);
  });

  it("leave the reluctance of a section of any material unwarned (l / (mu0 mur A) holds for any mur)", () => {
    expect(reluctance.details({ length: m(0.1), area: m2(1e-4), relativePermeability: 0.5 }).warnings).toEqual([]);
    expect(() => reluctance({ length: m(0.1), area: m2(1e-4), relativePermeability: 0 })).toThrow(/relativePermeability/);
  });
});

describe("inductanceFromFactor", () => {
  it("gives 100 uH from A_L = 250 nH and 20 turns (L = A_L N^2, IEC 60205 convention)", () => {
    const r = evaluate("inductanceFromFactor", { inductanceFactor: "250 nH", turns: 20 });
    expectClose(r.value as number, { input: "250 nH, 20 turns", expected: 1e-4, tolerance: 1e-15, source: "A_L N^2 arithmetic" });
    expect(() => inductanceFromFactor({ inductanceFactor: 250e-9 as Inductance, turns: 0 })).toThrow(FormulaError);
  });
});

describe("coreFluxDensity", () => {
  it("is mu0 N I / (g + l / mur) (decimal.js oracle) and flux / area from solveMagneticCircuit", () => {
    const expected = MU0.times(20 * 10).div(new D("5e-4").plus(new D("0.1").div(2000))).toNumber();
    const B = coreFluxDensity({ turns: 20, current: 10 as Current, pathLength: mm(100), area: m2(1e-4), relativePermeability: 2000, gapLength: mm(0.5) });
    expectClose(B, { input: "20 turns, 10 A, l 100 mm, g 0.5 mm, mur 2000", expected, tolerance: 1e-14, source: "decimal.js oracle" });
    const sol = solveMagneticCircuit({ branches: [
      { from: 0, to: 1, reluctance: reluctance({ length: mm(100), area: m2(1e-4), relativePermeability: 2000 }), mmf: 200 as Current },
      { from: 1, to: 0, reluctance: reluctance({ length: mm(0.5), area: m2(1e-4) }) },
    ] });
    expect(relativeError(sol.flux[0]! / 1e-4, B)).toBeLessThan(1e-14);
  });

  it("warns when the given saturation flux density is reached", () => {
    const x = { turns: 20, current: 10 as Current, pathLength: mm(100), area: m2(1e-4), relativePermeability: 2000, gapLength: mm(0.5) };
    expect(coreFluxDensity.details({ ...x, saturationFluxDensity: 0.4 as never }).warnings.map((w) => w.code)).toContain("saturation");
    expect(coreFluxDensity.details({ ...x, saturationFluxDensity: 0.5 as never }).warnings.map((w) => w.code)).not.toContain("saturation");
  });
});

describe("gapFringingFactor", () => {
  it("is 1 + (g / sqrt(A)) ln(2G / g) (McLyman 2004, fringing flux; decimal.js oracle)", () => {
    const expected = new D(1).plus(new D("5e-4").div(new D("1e-4").sqrt()).times(D.ln(new D("0.04").div("5e-4")))).toNumber();
    expectClose(gapFringingFactor({ gapLength: mm(0.5), area: m2(1e-4), windowLength: mm(20) }), {
      input: "g 0.5 mm, A 1 cm^2, G 20 mm", expected, tolerance: 1e-15, source: "McLyman (2004) fringing flux factor (equation as given in the handbook, from memory), decimal.js oracle",
    });
  });

  it("tends to 1 as the gap closes and grows with the gap (fast-check)", () => {
    expect(gapFringingFactor({ gapLength: m(1e-9), area: m2(1e-4), windowLength: mm(20) }) - 1).toBeLessThan(1e-5);
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e-3, noNaN: true }), (g) => {
        const f1 = gapFringingFactor({ gapLength: m(g), area: m2(1e-4), windowLength: mm(20) });
        const f2 = gapFringingFactor({ gapLength: m(1.5 * g), area: m2(1e-4), windowLength: mm(20) });
        expect(f1).toBeGreaterThan(1);
        expect(f2).toBeGreaterThan(f1);
      }),
    );
  });

  it("rejects a gap longer than twice the window, and warns for large gaps", () => {
    expect(() => evaluate("gapFringingFactor", { gapLength: "50 mm", area: "1 cm^2", windowLength: "20 mm" })).toThrow(/gapLength < 2 \* windowLength/);
    expect(gapFringingFactor.details({ gapLength: mm(2), area: m2(1e-4), windowLength: mm(20) }).warnings.map((w) => w.code)).toContain("large_gap");
  });
});

describe("solveMagneticCircuit", () => {
  const R = (v: number) => v as Reluctance;
  const F = (v: number) => v as Current;

  it("splits flux between parallel legs in inverse proportion to their reluctance", () => {
    const s = solveMagneticCircuit({ branches: [
      { from: 0, to: 1, reluctance: R(1e5), mmf: F(100) },
      { from: 1, to: 0, reluctance: R(2e5) },
      { from: 1, to: 0, reluctance: R(6e5) },
    ] });
    // Series-parallel by hand: R_total = 1e5 + (2e5 || 6e5) = 2.5e5; Phi = 100 / 2.5e5 = 4e-4, split 3:1.
    expect(relativeError(s.flux[0]!, 4e-4)).toBeLessThan(1e-14);
    expect(relativeError(s.flux[1]!, 3e-4)).toBeLessThan(1e-14);
    expect(relativeError(s.flux[2]!, 1e-4)).toBeLessThan(1e-14);
  });

  it("conserves flux at every node and satisfies each branch's Hopkinson law in random networks (fast-check)", () => {
    const branch = (nodes: number) =>
      fc.record({
        from: fc.integer({ min: 0, max: nodes - 1 }),
        to: fc.integer({ min: 0, max: nodes - 1 }),
        reluctance: fc.double({ min: 1e3, max: 1e9, noNaN: true }),
        mmf: fc.double({ min: -1e3, max: 1e3, noNaN: true }),
      });
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 7 }).chain((n) =>
          fc.tuple(fc.constant(n), fc.array(branch(n), { minLength: 1, maxLength: 14 })),
        ),
        ([n, raw]) => {
          // A spanning chain keeps every node connected; random extra branches make meshes.
          const chain = Array.from({ length: n - 1 }, (_, i) => ({ from: i, to: i + 1, reluctance: 1e6, mmf: 10 * i }));
          const branches = [...chain, ...raw.filter((b) => b.from !== b.to)] as unknown as MagneticBranch[];
          const s = solveMagneticCircuit({ branches });
          const net = new Array<number>(n).fill(0);
          let scale = 0;
          branches.forEach((b, k) => {
            net[b.from]! -= s.flux[k]!;
            net[b.to]! += s.flux[k]!;
            // Rounding scale: the sizes of the terms that make up the branch flux.
            scale = Math.max(scale, (Math.abs(s.potential[b.from]!) + Math.abs(s.potential[b.to]!) + Math.abs(b.mmf ?? 0)) / b.reluctance);
            const drop = s.potential[b.from]! - s.potential[b.to]! + (b.mmf ?? 0);
            expect(Math.abs(drop / b.reluctance - s.flux[k]!)).toBeLessThanOrEqual(1e-12 * (Math.abs(s.flux[k]!) + scale) + 1e-300);
          });
          for (const v of net) expect(Math.abs(v)).toBeLessThanOrEqual(1e-9 * scale + 1e-300);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("rejects unusable circuits with invalid_argument naming the input", () => {
    const bad = (c: unknown) => {
      try {
        solveMagneticCircuit(c as never);
      } catch (e) {
        expect(e).toBeInstanceOf(FormulaError);
        expect((e as FormulaError).code).toBe("invalid_argument");
        return (e as FormulaError).input;
      }
      throw new Error("expected an error");
    };
    expect(bad({ branches: [] })).toBe("branches");
    expect(bad({ branches: [{ from: 0, to: 0, reluctance: 1 }] })).toBe("branches[0]");
    expect(bad({ branches: [{ from: 0, to: 1, reluctance: -1 }] })).toBe("branches[0].reluctance");
    expect(bad({ branches: [{ from: 0, to: 1.5, reluctance: 1 }] })).toBe("branches[0].to");
    expect(bad({ branches: [{ from: 0, to: 1, reluctance: 1, mmf: Number.NaN }] })).toBe("branches[0].mmf");
    expect(bad({ branches: [{ from: 0, to: 1, reluctance: 1 }, { from: 2, to: 3, reluctance: 1 }] })).toBe("branches");
  });

  it("refuses circuits above its stated size (node numbers below 1000, at most 100,000 branches)", () => {
    const code = (c: unknown) => {
      try {
        solveMagneticCircuit(c as never);
      } catch (e) {
        return `${(e as FormulaError).code}:${(e as FormulaError).input}`;
      }
      return "no error";
    };
    // A node number of 1e9 once allocated a billion-entry array before failing.
    expect(code({ branches: [{ from: 0, to: 1e9, reluctance: 1 }] })).toBe("invalid_argument:branches[0].to");
    expect(code({ branches: [{ from: 0, to: 1000, reluctance: 1 }] })).toBe("invalid_argument:branches[0].to");
    const many = Array.from({ length: 100_001 }, () => ({ from: 0, to: 1, reluctance: 1 }));
    expect(code({ branches: many })).toBe("invalid_argument:branches");
    // The largest allowed: a chain through nodes 0..999 solves, with its loops reported.
    const chain = Array.from({ length: 999 }, (_, i) => ({ from: i, to: i + 1, reluctance: 1, mmf: i === 0 ? 1 : 0 }));
    chain.push({ from: 999, to: 0, reluctance: 1, mmf: 0 });
    resetLoopCount();
    const sol = solveMagneticCircuit({ branches: chain as never });
    expect(sol.flux.length).toBe(1000);
    // Union-find with path halving: each walk at most 1000 steps, all walks together
    // O((branches + nodes) log nodes); 2 (1000 + 1000) log2(1000) is about 40,000.
    expect(loopCount().largest).toBeLessThanOrEqual(40_000);
    expect([MAX_NODES, MAX_BRANCHES]).toEqual([1000, 100_000]);
  });
});
