import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  coaxialCapacitance, coreFluxDensity, coreLoss, inductanceFactor, inductanceFromFactor, inductorEnergy, parallelCapacitance,
  roundWireAcResistanceFactor, temperatureRise, wireGaugeDiameter, wireResistance,
} from "../../src/index.js";
import { designTolerance, evaluateDesign, solveDesign, sweepDesign } from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";
import { expectFormulaError } from "../helpers/errors.js";

// Designs are checked against the formulas they chain, each called by hand:
// a design adds wiring, not physics, so every value must be identical.

const load = (name: string): DesignSpec => JSON.parse(readFileSync(new URL(`../../examples/designs/${name}.json`, import.meta.url), "utf8"));
const inductor = load("gapped-inductor");
const probe = load("level-sensor");

const stepValue = (r: ReturnType<typeof evaluateDesign>, name: string): number => {
  const s = r.steps.find((x) => x.name === name) ?? r.derived.find((x) => x.name === name);
  if (!s) throw new Error(`no ${name}`);
  return s.value;
};

describe("a design evaluates to its formulas called by hand", () => {
  it("the gapped inductor's every step equals the single formula with the same SI inputs", () => {
    const r = evaluateDesign(inductor);
    const core = { pathLength: 0.069, area: 84e-6, relativePermeability: 2000, gapLength: 0.5e-3 } as never;
    const al = inductanceFactor(core) as number;
    expect(stepValue(r, "inductanceFactor")).toBe(al);
    const L = inductanceFromFactor({ inductanceFactor: al, turns: 20 } as never) as number;
    expect(stepValue(r, "inductance")).toBe(L);
    const B = coreFluxDensity({ turns: 20, current: 6, pathLength: 0.069, area: 84e-6, relativePermeability: 2000, gapLength: 0.5e-3, saturationFluxDensity: 0.39 } as never) as number;
    expect(stepValue(r, "peakFluxDensity")).toBe(B);
    const swing = (B * 1.8) / 6;
    expect(stepValue(r, "fluxSwing")).toBe(swing);
    const volume = 0.069 * 84e-6;
    expect(stepValue(r, "coreVolume")).toBe(volume);
    const P = coreLoss({ coefficient: 3.7, frequencyExponent: 1.4, fluxExponent: 2.6, frequency: 200e3, peakFluxDensity: swing / 2, volume } as never) as number;
    expect(stepValue(r, "coreLoss")).toBe(P);
    expect(stepValue(r, "storedEnergy")).toBe(inductorEnergy({ inductance: L, current: 6 } as never) as number);
    // The winding: AWG 18, 20 turns of 45 mm at 100 degC (373.15 K), ripple 1.8 A at 200 kHz.
    const d = wireGaugeDiameter({ gauge: "18" } as never) as number;
    expect(stepValue(r, "wireDiameter")).toBe(d);
    const rdc = wireResistance({ length: 20 * 0.045, diameter: d, temperature: 373.15 } as never) as number;
    expect(stepValue(r, "dcResistance")).toBe(rdc);
    const fac = roundWireAcResistanceFactor({ diameter: d, frequency: 200e3 } as never) as number;
    expect(stepValue(r, "acFactor")).toBe(fac);
    const winding = rdc * (6 - 1.8 / 2) ** 2 + fac * rdc * (1.8 / Math.sqrt(12)) ** 2;
    expect(stepValue(r, "windingLoss")).toBe(winding);
    expect(stepValue(r, "totalLoss")).toBe(P + winding);
    expect(stepValue(r, "temperatureRise")).toBe(temperatureRise({ loss: P + winding, surfaceArea: 20e-4 } as never) as number);
    // Checks compare the same numbers with the limits in SI.
    const byRule = Object.fromEntries(r.checks.map((k) => [k.rule, k]));
    expect(byRule["peakFluxDensity < 0.3 T"]).toMatchObject({ pass: B < 0.3, left: B, right: 0.3, margin: 0.3 - B, unit: "T" });
    expect(byRule["inductance >= 20 uH"]!.right).toBeCloseTo(20e-6, 20);
    expect(r.passed).toBe(r.checks.every((k) => k.pass));
  });

  it("the level probe's capacitances equal the coaxial formula by hand, and its notes name their steps", () => {
    const r = evaluateDesign(probe);
    const wet = coaxialCapacitance({ innerRadius: 3e-3, outerRadius: 10e-3, length: 0.4, relativePermittivity: 2.1 } as never) as number;
    const dry = coaxialCapacitance({ innerRadius: 3e-3, outerRadius: 10e-3, length: 1 - 0.4 } as never) as number;
    expect(stepValue(r, "wetCapacitance")).toBe(wet);
    expect(stepValue(r, "dryCapacitance")).toBe(dry);
    expect(stepValue(r, "probeCapacitance")).toBe(parallelCapacitance({ capacitance1: wet, capacitance2: dry } as never) as number);
    for (const w of r.warnings) expect(r.steps.map((s) => s.name)).toContain(w.step);
    expect(r.warnings.some((w) => w.code === "end_effects" && w.step === "wetCapacitance")).toBe(true);
  });

  it("each step reports its formula's equation, source and the inputs it received", () => {
    const r = evaluateDesign(inductor);
    const s = r.steps.find((x) => x.name === "coreLoss")!;
    expect(s.formula).toBe("coreLoss");
    expect(s.equation).toBe(coreLoss.definition.equation);
    expect(s.source).toBe(coreLoss.definition.source);
    expect(s.inputs.find((i) => i.name === "frequency")).toEqual({ name: "frequency", value: 200e3, unit: "Hz" });
  });
});

describe("tolerance through the chain", () => {
  // An independent Monte Carlo of the inductor chain, written by hand with its own
  // generator (mulberry32, public domain) and the typed formulas.
  function handMonteCarlo(n: number): { L: number[]; B: number[]; fails: number } {
    let a = 0x2545f491;
    const rand = (): number => {
      a = (a + 0x6d2b79f5) | 0;
      let t = Math.imul(a ^ (a >>> 15), 1 | a);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const L: number[] = [];
    const B: number[] = [];
    let fails = 0;
    for (let i = 0; i < n; i++) {
      const gap = 0.45e-3 + 0.1e-3 * rand();
      const current = 6 * (0.95 + 0.1 * rand());
      const al = inductanceFactor({ pathLength: 0.069, area: 84e-6, relativePermeability: 2000, gapLength: gap } as never) as number;
      L.push(inductanceFromFactor({ inductanceFactor: al, turns: 20 } as never) as number);
      const b = coreFluxDensity({ turns: 20, current, pathLength: 0.069, area: 84e-6, relativePermeability: 2000, gapLength: gap, saturationFluxDensity: 0.39 } as never) as number;
      B.push(b);
      if (!(b < 0.3)) fails++;
    }
    return { L, B, fails };
  }
  const meanSd = (xs: number[]): { mean: number; sd: number } => {
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    return { mean, sd: Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (xs.length - 1)) };
  };

  it("agrees with a hand-written Monte Carlo of the same chain within sampling error (4 standard errors)", () => {
    const n = 20_000;
    const t = designTolerance(inductor, { samples: n });
    const hand = handMonteCarlo(n);
    for (const [name, xs] of [["inductance", hand.L], ["peakFluxDensity", hand.B]] as const) {
      const q = t.quantities.find((x) => x.name === name)!;
      const h = meanSd(xs);
      const mc = q.monteCarlo!;
      // Means: difference of two independent sample means; sds: standard error of a sd is about sd / sqrt(2 (n - 1)).
      expect(Math.abs(mc.mean - h.mean)).toBeLessThan(4 * Math.sqrt((mc.sd ** 2 + h.sd ** 2) / n));
      expect(Math.abs(mc.sd - h.sd)).toBeLessThan(4 * h.sd * Math.sqrt(2 / (2 * (n - 1))));
    }
    const p = hand.fails / n;
    const check = t.checks.find((k) => k.rule === "peakFluxDensity < 0.3 T")!;
    expect(p).toBeGreaterThan(0.05); // the check is near its limit: a real failure probability to compare
    expect(Math.abs(check.failureProbability! - p)).toBeLessThan(4 * Math.sqrt((2 * p * (1 - p)) / n));
    expect(check.passAtNominal).toBe(true);
    expect(check.passAtCorners).toBe(false);
  });

  it("a shared input is drawn once per sample: the wet and full capacitances move together", () => {
    // Both steps read liquidPermittivity and tubeRadius; drawn once per sample, their ratio is fixed (0.4 of the length).
    const t = designTolerance(probe, { samples: 4000 });
    const full = t.quantities.find((q) => q.name === "fullCapacitance")!;
    const wet = t.quantities.find((q) => q.name === "wetCapacitance")!;
    expect(wet.monteCarlo!.sd / full.monteCarlo!.sd).toBeCloseTo(0.4, 12);
    expect(wet.worstCase.max / full.worstCase.max).toBeCloseTo(0.4, 12);
  });

  it("RSS sensitivities are the slopes of the chain: d inductance / d gap matches a hand central difference", () => {
    const t = designTolerance(inductor, { samples: 0 });
    const s = t.quantities.find((q) => q.name === "inductance")!.rss.sensitivities.find((x) => x.input === "gapLength")!;
    const L = (gap: number): number =>
      inductanceFromFactor({ inductanceFactor: inductanceFactor({ pathLength: 0.069, area: 84e-6, relativePermeability: 2000, gapLength: gap } as never), turns: 20 } as never) as number;
    const h = 1e-9;
    expect(s.derivative).toBeCloseTo((L(0.5e-3 + h) - L(0.5e-3 - h)) / (2 * h), 6);
    expect(s.unit).toBe("H/m");
  });

  it("the same seed gives the same result", () => {
    expect(designTolerance(probe, { samples: 500, seed: 7 })).toEqual(designTolerance(probe, { samples: 500, seed: 7 }));
  });
});

describe("solve through the chain", () => {
  it("a continuous input round-trips: the gap for 60 uH gives 60 uH", () => {
    const s = solveDesign(inductor, { input: "gapLength", output: "inductance", target: "60 uH" });
    expect(s.rounded).toBe(false);
    expect(Math.abs(s.achieved / 60e-6 - 1)).toBeLessThan(1e-12);
    const again = evaluateDesign({ ...inductor, inputs: { ...inductor.inputs, gapLength: s.value } });
    expect(stepValue(again, "inductance")).toBe(s.achieved);
  });

  it("turns are rounded to the whole number nearest the target, and the achieved value is reported", () => {
    const s = solveDesign(inductor, { input: "turns", output: "inductance", target: "40 uH" });
    expect(Number.isInteger(s.value)).toBe(true);
    expect(s.rounded).toBe(true);
    const at = (n: number): number => stepValue(evaluateDesign({ ...inductor, inputs: { ...inductor.inputs, turns: n } }), "inductance");
    expect(s.achieved).toBe(at(s.value));
    for (const other of [s.value - 1, s.value + 1]) expect(Math.abs(at(other) - 40e-6)).toBeGreaterThanOrEqual(Math.abs(s.achieved - 40e-6));
  });

  it("an unreachable target is no_solution", () => {
    expect(expectFormulaError(() => solveDesign(inductor, { input: "turns", output: "inductance", target: "-1 H" })).code).toBe("no_solution");
  });
});

describe("sweeps of a design", () => {
  it("every point equals the design evaluated at that input, and checks give a pass/fail mask", () => {
    const s = sweepDesign(inductor, { input: "peakCurrent", from: "4 A", to: "8 A", points: 9 });
    const b = s.outputs.find((o) => o.name === "peakFluxDensity")!;
    s.values.forEach((i, k) => {
      const r = evaluateDesign({ ...inductor, inputs: { ...inductor.inputs, peakCurrent: i } });
      expect(b.values[k]).toBe(stepValue(r, "peakFluxDensity"));
      expect(s.checks[0]!.pass[k]).toBe(r.checks[0]!.pass);
    });
    expect(s.checks[0]!.pass).toContain(true);
    expect(s.checks[0]!.pass).toContain(false);
  });
});
