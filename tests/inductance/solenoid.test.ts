import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MU0 } from "../../src/constants/si.js";
import {
  FormulaError, evaluate, longSolenoidInductance, multilayerCoilInductance, nagaokaCoefficient, solenoidInductance,
  wheelerSolenoidInductance, type Length,
} from "../../src/index.js";
import { coaxialSheetsMutual } from "../../src/inductance/mutual.js";
import { checkCases, expectClose, relativeError, type ReferenceCase } from "../helpers/reference.js";
import { dec, ellipticKE } from "../math/decimal-elliptic.js";

const m = (v: number) => v as Length;

/**
 * Nagaoka's coefficient from the textbook expression (Nagaoka 1909)
 *   K = 4/(3 pi k') [ (k'^2/k^2)(K - E) + E - k ],
 * evaluated in decimal.js with enough digits to survive its cancellation
 * (E - k ~ k'^2 ln(4/k') for short coils, K - E ~ k^2 for long ones).
 */
function nagaokaOracle(r: number, l: number): number {
  const ratio = Math.max(l / (2 * r), (2 * r) / l);
  const digits = 50 + Math.ceil(2 * Math.log10(Math.max(1, ratio)));
  const D = dec(digits);
  const four_r2 = new D(r).times(2).pow(2);
  const l2 = new D(l).pow(2);
  const S = four_r2.plus(l2);
  const mm = four_r2.div(S);
  const mc = l2.div(S);
  const { K, E } = ellipticKE(mm, mc, digits);
  const k = mm.sqrt();
  const kc = mc.sqrt();
  const bracket = mc.div(mm).times(K.minus(E)).plus(E).minus(k);
  return bracket.times(4).div(D.acos(-1).times(3).times(kc)).toNumber();
}

describe("nagaokaCoefficient", () => {
  it("matches Nagaoka's table", () => {
    // Nagaoka (1909) table as reprinted in Grover, Inductance Calculations (1946),
    // 4-decimal values for diameter/length 2r/l; values from memory.
    const src = "Nagaoka (1909) / Grover (1946) single-layer coil table, from memory";
    const cases: ReferenceCase<number>[] = [
      [0.1, 0.9588], [0.2, 0.9201], [0.5, 0.8181], [1, 0.6884], [2, 0.5255], [5, 0.3198], [10, 0.2033],
    ].map(([d, k]) => ({ input: d!, expected: k!, tolerance: 6e-5 / k!, source: src }));
    checkCases(cases, (diameterOverLength) => nagaokaCoefficient({ radius: m(diameterOverLength / 2), length: m(1) }));
  });

  it("matches the decimal.js oracle of the textbook expression to 1e-13 from pancakes to needles", () => {
    for (let e = -12; e <= 12; e += 0.5) {
      const l = Math.pow(10, e);
      expectClose(nagaokaCoefficient({ radius: m(1), length: m(l) }), {
        input: { radius: 1, length: l }, expected: nagaokaOracle(1, l), tolerance: 1e-13,
        source: "decimal.js oracle of Nagaoka's expression (K, E by AGM)",
      });
    }
  });

  it("matches the oracle at random shapes (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -15, max: 15, noNaN: true }), (e) => {
        const l = Math.pow(10, e);
        expectClose(nagaokaCoefficient({ radius: m(1), length: m(l) }), {
          input: l, expected: nagaokaOracle(1, l), tolerance: 1e-13, source: "decimal.js oracle",
        });
      }),
      { numRuns: 80 },
    );
  });

  it("has the long-coil and pancake limits", () => {
    // Long coil: K = 1 - 8r/(3 pi l) + ... ; pancake: K -> (2/pi) k' (ln(4/k') - 1/2) (from the DLMF 19.12 expansions).
    const l = 1e7;
    expectClose(nagaokaCoefficient({ radius: m(1), length: m(l) }), { expected: 1 - 8 / (3 * Math.PI * l), tolerance: 1e-13, source: "long-coil expansion" });
    const kc = 1e-12 / 2; // l = 1e-12, r = 1: k' = l / sqrt(4r^2 + l^2)
    expectClose(nagaokaCoefficient({ radius: m(1), length: m(1e-12) }), {
      expected: (2 / Math.PI) * kc * (Math.log(4 / kc) - 0.5), tolerance: 1e-13, source: "pancake expansion",
    });
  });
});

describe("solenoidInductance", () => {
  it("is the long-solenoid value times Nagaoka's coefficient", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10000 }), fc.double({ min: 1e-4, max: 1, noNaN: true }), fc.double({ min: 1e-4, max: 1, noNaN: true }), (N, r, l) => {
        const exact = solenoidInductance({ turns: N, radius: m(r), length: m(l) });
        const ideal = (MU0 * N * N * Math.PI * r * r) / l;
        expectClose(exact, { input: { N, r, l }, expected: ideal * nagaokaOracle(r, l), tolerance: 1e-13, source: "mu0 N^2 pi r^2/l times the decimal oracle of K" });
      }),
      { numRuns: 60 },
    );
  });

  it("scales with N^2 and linearly with all lengths", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1000 }), fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        (N, r, l, s) => {
          const L = solenoidInductance({ turns: N, radius: m(r), length: m(l) });
          expect(relativeError(solenoidInductance({ turns: 2 * N, radius: m(r), length: m(l) }), 4 * L)).toBeLessThan(1e-15);
          expect(relativeError(solenoidInductance({ turns: N, radius: m(s * r), length: m(s * l) }), s * L)).toBeLessThan(1e-13);
        },
      ),
    );
  });

  it("tends to the long-solenoid formula for long coils", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e3, max: 1e9, noNaN: true }), (ratio) => {
        const x = { turns: 100, radius: m(0.01), length: m(0.01 * ratio) };
        const err = relativeError(solenoidInductance(x), longSolenoidInductance(x));
        // 1 - K = 8r/(3 pi l) + O((r/l)^2): the gap shrinks as 0.85 r/l
        expect(err).toBeLessThan(0.86 / ratio);
        expect(err).toBeGreaterThan(0.84 / ratio);
      }),
    );
  });

  it("equals the mutual inductance of a current sheet with itself (independent quadrature)", () => {
    for (const [r, l] of [[0.01, 0.02], [0.01, 0.001], [0.01, 1], [0.05, 0.0001]] as const) {
      expectClose(solenoidInductance({ turns: 1, radius: m(r), length: m(l) }), {
        input: { r, l }, expected: coaxialSheetsMutual(r, l, r, l, 0), tolerance: 1e-12,
        source: "Maxwell's filament formula integrated over the sheet twice (Gauss-Legendre)",
      });
    }
  });

  it("rejects fractional turns and non-positive lengths with FormulaError", () => {
    const e1 = (() => { try { evaluate("solenoidInductance", { turns: 2.5, radius: 0.01, length: 0.02 }); } catch (e) { return e; } })();
    expect(e1).toBeInstanceOf(FormulaError);
    expect((e1 as FormulaError).code).toBe("out_of_domain");
    expect((e1 as FormulaError).input).toBe("turns");
    const e2 = (() => { try { evaluate("solenoidInductance", { turns: 10, radius: "-1 mm", length: 0.02 }); } catch (e) { return e; } })();
    expect((e2 as FormulaError).code).toBe("out_of_domain");
    expect((e2 as FormulaError).input).toBe("radius");
  });
});

describe("longSolenoidInductance", () => {
  it("warns with the error in per cent when the coil is not long", () => {
    const r = evaluate("longSolenoidInductance", { turns: 100, radius: "1 cm", length: "2 cm" });
    const w = r.warnings.find((n) => n.code === "short_coil");
    expect(w).toBeDefined();
    // 1/K - 1 = 1/0.6884 - 1 = 45.3 %
    expect(w!.message).toContain("45.3 %");
    expect(evaluate("longSolenoidInductance", { turns: 100, radius: "1 cm", length: "1 m" }).warnings).toHaveLength(0);
  });
});

describe("wheelerSolenoidInductance", () => {
  it("is within Wheeler's stated 1 % (0.6 % measured, as the doc comment says) of the exact current sheet for length > 0.8 radius", () => {
    // Wheeler (1928): accurate to about 1 % for l > 0.8 r (from memory); the doc comment
    // states 0.6 % measured against the current sheet, which this checks.
    fc.assert(
      fc.property(fc.double({ min: 0.8, max: 1e6, noNaN: true }), fc.integer({ min: 1, max: 1000 }), (ratio, N) => {
        const x = { turns: N, radius: m(0.01), length: m(0.01 * ratio) };
        expect(relativeError(wheelerSolenoidInductance(x), solenoidInductance(x))).toBeLessThan(0.006);
      }),
      { numRuns: 300 },
    );
  });

  it("warns below length = 0.8 radius", () => {
    expect(evaluate("wheelerSolenoidInductance", { turns: 10, radius: "1 cm", length: "5 mm" }).warnings.map((w) => w.code)).toContain("short_coil");
    expect(evaluate("wheelerSolenoidInductance", { turns: 10, radius: "1 cm", length: "2 cm" }).warnings).toHaveLength(0);
  });
});

describe("multilayerCoilInductance", () => {
  /**
   * A rectangular winding section of uniform current density as a stack of
   * concentric current sheets: L = (N/n)^2 sum_i sum_j M(r_i, r_j), the
   * sheet-to-sheet mutual inductance integrated by quadrature (Maxwell's
   * formula), midpoint layers. Independent of Wheeler's fit.
   */
  function layeredSheets(N: number, a: number, b: number, c: number, layers: number): number {
    const radii = Array.from({ length: layers }, (_, i) => a - c / 2 + ((i + 0.5) * c) / layers);
    let s = 0;
    for (const ri of radii) for (const rj of radii) s += coaxialSheetsMutual(ri, b, rj, b, 0);
    return (N / layers) ** 2 * s;
  }

  it("is within a few per cent of a layered current-sheet computation for a balanced shape", () => {
    // Balanced: 6a = 9b = 10c (a = 15 mm, b = 10 mm, c = 9 mm). Wheeler states about 1 %;
    // measured 0.5 %. The check allows 1.5 %: the 24-layer midpoint sum itself moves by
    // about 0.06 % when the layers are doubled.
    const x = { turns: 300, meanRadius: m(0.015), length: m(0.01), depth: m(0.009) };
    const ref = layeredSheets(300, 0.015, 0.01, 0.009, 24);
    expect(relativeError(multilayerCoilInductance(x), ref)).toBeLessThan(0.015);
    expect(multilayerCoilInductance.details(x).warnings).toHaveLength(0);
  });

  it("requires the winding depth to fit inside the mean radius", () => {
    expect(() => evaluate("multilayerCoilInductance", { turns: 10, meanRadius: 0.01, length: 0.01, depth: 0.02 })).toThrow(/depth < 2 meanRadius/);
  });

  it("warns when the shape is far from balanced", () => {
    const r = evaluate("multilayerCoilInductance", { turns: 10, meanRadius: 0.01, length: 0.2, depth: 0.002 });
    expect(r.warnings.map((w) => w.code)).toContain("unbalanced_shape");
  });
});
