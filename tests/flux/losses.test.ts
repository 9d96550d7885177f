import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { coreLoss, evaluate, skinDepth, type Conductivity, type FluxDensity, type Frequency, type Volume } from "../../src/index.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, MU0, PI } from "./oracle.js";

const S = (v: number) => v as Conductivity;
const Hz = (v: number) => v as Frequency;

describe("skinDepth", () => {
  it("of annealed copper (IEC 60028, 58.0 MS/m) matches handbook skin depths at 50 Hz, 60 Hz and 100 kHz", () => {
    checkCases(
      [
        // Handbook tables of copper skin depth (e.g. Terman, Radio Engineers' Handbook; ITT Reference Data for Engineers),
        // recalled to two or three figures: from memory.
        { input: { f: 60 }, expected: 8.5e-3, tolerance: 0.01, source: "copper at 60 Hz ~ 8.5 mm, handbook tables (from memory)" },
        { input: { f: 50 }, expected: 9.35e-3, tolerance: 0.01, source: "copper at 50 Hz ~ 9.3-9.4 mm, handbook tables (from memory)" },
        { input: { f: 100e3 }, expected: 0.209e-3, tolerance: 0.01, source: "copper at 100 kHz ~ 0.21 mm, handbook tables (from memory)" },
      ],
      (x) => skinDepth({ conductivity: S(58e6), frequency: Hz(x.f) }),
    );
  });

  it("is 1 / sqrt(pi f mu0 mur sigma) to full precision (decimal.js oracle)", () => {
    const oracle = (f: number, mur: number, sigma: number) => new D(1).div(PI.times(f).times(MU0).times(mur).times(sigma).sqrt()).toNumber();
    checkCases(
      [
        { input: { f: 60, mur: 1, sigma: 58e6 }, expected: oracle(60, 1, 58e6), tolerance: 1e-15, source: "decimal.js oracle" },
        { input: { f: 400, mur: 700, sigma: 2e6 }, expected: oracle(400, 700, 2e6), tolerance: 1e-15, source: "decimal.js oracle" },
      ],
      (x) => skinDepth({ conductivity: S(x.sigma), frequency: Hz(x.f), relativePermeability: x.mur }),
    );
  });

  it("halves when the frequency is four times higher (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e9, noNaN: true }), fc.double({ min: 1e5, max: 1e8, noNaN: true }), (f, sigma) => {
        const a = skinDepth({ conductivity: S(sigma), frequency: Hz(f) });
        const b = skinDepth({ conductivity: S(sigma), frequency: Hz(4 * f) });
        expect(relativeError(b, a / 2)).toBeLessThan(1e-15);
      }),
    );
  });

  it("accepts copper's diamagnetic relative permeability, 0.999994, without a warning (CRC Handbook of Chemistry and Physics, magnetic susceptibility of copper; from memory)", () => {
    const d = skinDepth.details({ conductivity: S(58e6), frequency: Hz(60), relativePermeability: 0.999994 });
    expect(d.warnings).toEqual([]);
    expect(relativeError(d.value, skinDepth({ conductivity: S(58e6), frequency: Hz(60) }) / Math.sqrt(0.999994))).toBeLessThan(1e-15);
  });

  it("warns when the material is not a good conductor at that frequency", () => {
    expect(skinDepth.details({ conductivity: S(1e-3), frequency: Hz(1e9) }).warnings.map((w) => w.code)).toContain("not_a_good_conductor");
    expect(evaluate("skinDepth", { conductivity: "58 MS/m", frequency: "60 Hz" }).warnings).toHaveLength(0);
  });
});

describe("coreLoss", () => {
  it("is k f^alpha B^beta V (Steinmetz; decimal.js oracle)", () => {
    const expected = new D("1.5").times(new D(1e5).pow("1.4")).times(new D("0.1").pow("2.5")).times("5e-6").toNumber();
    const P = coreLoss({ coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: Hz(1e5), peakFluxDensity: 0.1 as FluxDensity, volume: 5e-6 as Volume });
    expectClose(P, { input: "k 1.5, alpha 1.4, beta 2.5, 100 kHz, 0.1 T, 5 cm^3", expected, tolerance: 1e-14, source: "decimal.js oracle" });
  });

  it("reduces to Steinmetz's 1892 hysteresis law, loss per cycle proportional to B^1.6, with alpha = 1", () => {
    // C. P. Steinmetz, Trans. AIEE 9 (1892): hysteresis energy per cycle ~ eta B^1.6.
    const perCycle = (B: number, f: number) =>
      coreLoss({ coefficient: 100, frequencyExponent: 1, fluxExponent: 1.6, frequency: Hz(f), peakFluxDensity: B as FluxDensity, volume: 1e-3 as Volume }) / f;
    expect(relativeError(perCycle(1, 50), perCycle(1, 400))).toBeLessThan(1e-14);
    expect(relativeError(perCycle(1, 50) / perCycle(0.5, 50), Math.pow(2, 1.6))).toBeLessThan(1e-14);
  });

  it("scales linearly with volume and as f^alpha, B^beta (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 2, noNaN: true }), fc.double({ min: 2, max: 3, noNaN: true }),
        fc.double({ min: 1e3, max: 1e6, noNaN: true }), fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        (a, b, f, B) => {
          const base = { coefficient: 2, frequencyExponent: a, fluxExponent: b, frequency: Hz(f), peakFluxDensity: B as FluxDensity, volume: 1e-6 as Volume };
          const P = coreLoss(base);
          expect(relativeError(coreLoss({ ...base, volume: 3e-6 as Volume }), 3 * P)).toBeLessThan(1e-14);
          expect(relativeError(coreLoss({ ...base, frequency: Hz(2 * f) }), Math.pow(2, a) * P)).toBeLessThan(1e-13);
          expect(relativeError(coreLoss({ ...base, peakFluxDensity: (2 * B) as FluxDensity }), Math.pow(2, b) * P)).toBeLessThan(1e-13);
        },
      ),
    );
  });

  it("states the fitted-range assumption in its description and cautions about hot cores only above 500 kW/m^3 (common practice)", () => {
    expect(coreLoss.definition.description).toMatch(/fitted/);
    const at = (B: number) => coreLoss.details({ coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: Hz(500e3), peakFluxDensity: B as FluxDensity, volume: 5e-6 as Volume });
    // At 0.1 T the density k f^a B^b = 1.5 (5e5)^1.4 0.1^2.5 is 4.5e5 W/m^3, just below the line; at 0.3 T, 7e6.
    expect(at(0.1).warnings).toEqual([]);
    expect(at(0.1).cautions).toEqual([]);
    const hot = at(0.3).cautions;
    expect(hot.map((c) => c.code)).toEqual(["hot_core"]);
    expect(hot[0]!.message).toMatch(/500 kW\/m\^3.*common practice.*Local codes, standards and licensed practice govern/);
  });

  it("warns when an exponent is outside its usual range (alpha 1 to 3, beta 1.5 to 3.5; common practice), a sign of mixed units", () => {
    const codes = (a: number, b: number) =>
      coreLoss.details({ coefficient: 1.5, frequencyExponent: a, fluxExponent: b, frequency: Hz(1e3), peakFluxDensity: 0.1 as FluxDensity, volume: 5e-6 as Volume }).warnings.map((w) => w.code);
    expect(codes(1, 1.5)).toEqual([]);
    expect(codes(3, 3.5)).toEqual([]);
    expect(codes(0.9, 2.5)).toEqual(["unusual_exponents"]);
    expect(codes(1.4, 3.6)).toEqual(["unusual_exponents"]);
  });

  it("prints a finite loss density in its caution even where the density itself overflows", () => {
    const d = coreLoss.details({ coefficient: 1e300, frequencyExponent: 1, fluxExponent: 2, frequency: Hz(1), peakFluxDensity: 1 as FluxDensity, volume: 1e-300 as Volume });
    expect(d.cautions[0]!.message).not.toMatch(/Infinity|NaN/);
  });
});
