import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  evaluate, laminationEddyLoss, quantity,
  type Conductivity, type FluxDensity, type Frequency, type Length, type Volume,
} from "../../src/index.js";
import { thickLaminationRatio } from "../../src/windings/lamination.js";
import { agreesWithOracle } from "../capacitance/oracle.js";
import { relativeError } from "../helpers/reference.js";
import { exact } from "./oracle.js";

const D = Decimal.clone({ precision: 60, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
const dec = (v: number) => new D(exact(v).toString());
const EPS = Number.EPSILON;
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true });

const base = {
  thickness: 0.35e-3 as Length,
  conductivity: 2.08e6 as Conductivity,
  frequency: 50 as Frequency,
  peakFluxDensity: 1.5 as FluxDensity,
  volume: 1e-3 as Volume,
};

/**
 * Eddy loss of a lamination from the one-dimensional diffusion equation, independently of the
 * classical formula: in a sheet |x| <= d/2 with surface field H0, H(x) = H0 cosh(kx) / cosh(kd/2),
 * k = (1 + j) / delta, J = dH/dx; loss per volume <|J|^2> / (2 sigma), mean peak flux density
 * |mu H0 tanh(kd/2) / (kd/2)| (e.g. R. L. Stoll, The Analysis of Eddy Currents (1974), ch. 2; from
 * memory). Integrated here by composite Simpson on 2000 intervals, in plain doubles (complex
 * arithmetic written out), in units where delta = 1, sigma = 1, mu = 1 (so omega = 2).
 * Returns loss per volume over the classical pi^2 d^2 f^2 B^2 sigma / 6 = (omega B d)^2 / 24.
 */
function diffusionOverClassical(xi: number): number {
  const half = xi / 2;
  // cosh and sinh of (1 + j) t: cosh t cos t + j sinh t sin t, sinh t cos t + j cosh t sin t.
  const ch = (t: number): [number, number] => [Math.cosh(t) * Math.cos(t), Math.sinh(t) * Math.sin(t)];
  const sh = (t: number): [number, number] => [Math.sinh(t) * Math.cos(t), Math.cosh(t) * Math.sin(t)];
  const abs2 = ([a, b]: [number, number]) => a * a + b * b;
  const c = abs2(ch(half));
  // |k sinh(kx)|^2 / |cosh(kd/2)|^2 with |k|^2 = 2.
  const j2 = (x: number) => (2 * abs2(sh(x))) / c;
  const n = 2000;
  const h = xi / n;
  let s = j2(-half) + j2(half);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * j2(-half + i * h);
  const loss = (s * h) / 3 / (2 * xi);
  // tanh((1 + j) t) / ((1 + j) t) in magnitude: |sinh| / |cosh| / (sqrt 2 t).
  const b = Math.sqrt(abs2(sh(half)) / c) / (Math.SQRT2 * half);
  return loss / ((2 * b * xi) ** 2 / 24);
}

describe("laminationEddyLoss", () => {
  it("is within 5 ulp of pi^2 d^2 f^2 B^2 sigma V / 6 (decimal.js oracle of the classical formula, Bertotti 1998 ch. 12) from 1e-300 to 1e300", () => {
    const worst = new Map<string, number>();
    const pi2 = D.acos(-1).pow(2);
    fc.assert(
      fc.property(decades(-300, 300), decades(-300, 300), decades(-300, 300), decades(-300, 300), decades(-300, 300), (thickness, conductivity, frequency, peakFluxDensity, volume) => {
        const want = pi2.times(dec(thickness).pow(2)).times(dec(frequency).pow(2)).times(dec(peakFluxDensity).pow(2)).times(dec(conductivity)).times(dec(volume)).div(6);
        agreesWithOracle(laminationEddyLoss, { thickness, conductivity, frequency, peakFluxDensity, volume }, want, 5 * EPS, worst);
      }),
      { numRuns: 400 },
    );
    console.log(`laminationEddyLoss: ${((worst.get("laminationEddyLoss") ?? 0) / EPS).toFixed(2)} eps`);
  });

  it("agrees with the loss from the diffusion equation in a sheet much thinner than the skin depth (to 1e-7 at d = 0.01 delta)", () => {
    // The classical formula is the thin-sheet limit of the diffusion solution: 1 - xi^4 / 630 + ...
    expect(Math.abs(diffusionOverClassical(0.01) - 1)).toBeLessThan(1e-7);
    expect(Math.abs(diffusionOverClassical(0.3) - 1)).toBeLessThan(2e-5);
  });

  it("the thin-sheet check's ratio F = (3/xi)(sinh xi - sin xi)/(cosh xi - cos xi) matches the diffusion equation and a decimal.js oracle", () => {
    for (const xi of [1, 1.59, 2, 3, 5, 10, 30]) {
      const x = new D(xi);
      const want = new D(3).div(x).times(x.sinh().minus(x.sin())).div(x.cosh().minus(x.cos()));
      const got = thickLaminationRatio(xi);
      expect(relativeError(got, want.toNumber()), `xi = ${xi}`).toBeLessThan(4 * EPS);
      // The quadrature's own error grows with xi (steep surface layer): 1e-9 up to xi = 10.
      if (xi <= 10) expect(relativeError(got, diffusionOverClassical(xi)), `xi = ${xi}: diffusion quadrature`).toBeLessThan(1e-9);
    }
    // Far beyond, the ratio is 3 / xi with no overflow (e^-xi underflows).
    expect(relativeError(thickLaminationRatio(1e300), 3e-300)).toBeLessThan(2 * EPS);
  });

  it("scales as d^2, f^2, B^2 and sigma, and in proportion to the volume (fast-check)", () => {
    fc.assert(
      fc.property(pos(1e-5, 1e-3), pos(1, 1e4), pos(0.01, 2), pos(1e5, 1e7), pos(1e-6, 1), pos(1.5, 10), (d, f, b, s, v, k) => {
        const x = { thickness: d as Length, conductivity: s as Conductivity, frequency: f as Frequency, peakFluxDensity: b as FluxDensity, volume: v as Volume };
        const p = laminationEddyLoss(x);
        expect(relativeError(laminationEddyLoss({ ...x, thickness: (k * d) as Length }), k * k * p)).toBeLessThan(12 * EPS);
        expect(relativeError(laminationEddyLoss({ ...x, frequency: (k * f) as Frequency }), k * k * p)).toBeLessThan(12 * EPS);
        expect(relativeError(laminationEddyLoss({ ...x, peakFluxDensity: (k * b) as FluxDensity }), k * k * p)).toBeLessThan(12 * EPS);
        expect(relativeError(laminationEddyLoss({ ...x, conductivity: (k * s) as Conductivity }), k * p)).toBeLessThan(12 * EPS);
        expect(relativeError(laminationEddyLoss({ ...x, volume: (k * v) as Volume }), k * p)).toBeLessThan(12 * EPS);
        // The permeability enters only the thin-sheet check, never the loss.
        expect(laminationEddyLoss({ ...x, relativePermeability: 1 })).toBe(p);
      }),
    );
  });

  it("gives zero loss at zero flux density", () => {
    expect(laminationEddyLoss({ ...base, peakFluxDensity: 0 as FluxDensity })).toBe(0);
  });

  it("warns when the sheet is not thin against the skin depth, with the overestimate of the exact solution", () => {
    // 0.35 mm, 2.08 MS/m, mu_r 10,000 (the default): d / delta = 0.709 at 50 Hz, 2.01 at 400 Hz.
    expect(laminationEddyLoss.details(base).warnings).toEqual([]);
    const at400 = laminationEddyLoss.details({ ...base, frequency: 400 as Frequency });
    expect(at400.warnings.map((w) => w.code)).toEqual(["not_thin_against_skin_depth"]);
    // (3/xi)(sinh - sin)/(cosh - cos) at xi = 2.01: 0.975, an overestimate of 2.6 % (diffusion solution above).
    expect(at400.warnings[0]!.message).toMatch(/2\.01 skin depths.*by 2\.[56] %/);
    // A lower permeability, given by the caller, moves the skin depth out: no warning at 400 Hz with mu_r = 1000.
    expect(laminationEddyLoss.details({ ...base, frequency: 400 as Frequency, relativePermeability: 1000 }).warnings).toEqual([]);
    // Just either side of the 1 % threshold (d / delta = 1.59).
    const at = (xi: number) => laminationEddyLoss.details({ ...base, thickness: ((xi / 0.709) * 0.35e-3) as Length }).warnings.length;
    expect(at(1.55)).toBe(0);
    expect(at(1.63)).toBe(1);
  });

  it("cautions above 500 kW/m^3 of loss density (hot core, common practice)", () => {
    const d = (f: number) => laminationEddyLoss.details({ ...base, frequency: f as Frequency, relativePermeability: 1 });
    expect(d(50).cautions).toEqual([]);
    // 2.36 kW/m^3 at 50 Hz grows as f^2: 500 kW/m^3 at about 730 Hz.
    expect(d(700).cautions).toEqual([]);
    expect(d(760).cautions.map((c) => c.code)).toEqual(["hot_core"]);
    expect(d(760).cautions[0]!.message).toContain("Local codes");
  });

  it("reads unit strings, and refuses bad input with a coded error naming the input", () => {
    const r = evaluate("laminationEddyLoss", { thickness: "0.35 mm", conductivity: "2.08 MS/m", frequency: "50 Hz", peakFluxDensity: "1.5 T", volume: "1000 cm^3" });
    expect(relativeError(r.value as number, laminationEddyLoss(base))).toBeLessThan(4 * EPS);
    expect(relativeError(laminationEddyLoss({ ...base, thickness: quantity(0.35, "mm") }), 2.3576)).toBeLessThan(1e-4);
    const bad = (input: Record<string, unknown>, code: string, name: string) =>
      expect(() => evaluate("laminationEddyLoss", { ...base, ...input })).toThrow(expect.objectContaining({ code, input: name }));
    bad({ thickness: -1e-3 }, "out_of_domain", "thickness");
    bad({ thickness: 0 }, "out_of_domain", "thickness");
    bad({ peakFluxDensity: -1 }, "out_of_domain", "peakFluxDensity");
    bad({ relativePermeability: 0 }, "out_of_domain", "relativePermeability");
    bad({ conductivity: "2 H" }, "wrong_dimension", "conductivity");
    bad({ frequency: Number.NaN }, "not_finite", "frequency");
    expect(() => evaluate("laminationEddyLoss", { thickness: "0.35 mm", frequency: "50 Hz", peakFluxDensity: "1 T", volume: "1 m^3" })).toThrow(
      expect.objectContaining({ code: "missing_input", input: "conductivity" }),
    );
  });
});
