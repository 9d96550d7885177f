// Coaxial and two-wire impedance, delay, reflection and the terminated line:
// published values (labelled), consistency with the library's per-length
// capacitance and inductance, properties, and the run-time face.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  coaxialCapacitance, coaxialImpedance, coaxialInductance, evaluate, lineInputImpedance, propagationDelay, quantity,
  reflectionCoefficient, returnLoss, standingWaveRatio, twoWireCapacitance, twoWireImpedance, twoWireInductance,
  type Frequency, type Length, type Resistance,
} from "../../src/index.js";
import { expectFormulaError } from "../helpers/errors.js";
import { checkCases, type ReferenceCase } from "../helpers/reference.js";

const m = (v: number) => v as Length;
const ohm = (v: number) => v as Resistance;
const hz = (v: number) => v as Frequency;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const C0 = 299792458;

describe("line impedances against published values", () => {
  it("coaxial impedance of the 7 mm precision air line and of RG-58/U", () => {
    const cases: ReferenceCase<{ a: number; b: number; er: number }>[] = [
      {
        name: "7 mm air line: 3.04 mm / 7.00 mm", input: { a: 1.52e-3, b: 3.5e-3, er: 1 }, expected: 50, tolerance: 1e-3,
        source: "IEEE Std 287, 7 mm precision coaxial connector: conductor diameters 3.04 mm and 7.00 mm, 50 ohm nominal (from memory)",
      },
      {
        name: "RG-58/U: 0.81 mm / 2.95 mm, solid polyethylene", input: { a: 0.405e-3, b: 1.475e-3, er: 2.25 }, expected: 53.5, tolerance: 0.05, // the inner conductor is stranded (19 x 0.18 mm on some makes) and the figures are nominal
        source: "RF coaxial cable data tables, RG-58/U nominal 53.5 ohm (from memory); polyethylene epsr 2.25 (Pozar, 4th ed., table of dielectrics; from memory)",
      },
    ];
    checkCases(cases, (x) => coaxialImpedance({ innerRadius: m(x.a), outerRadius: m(x.b), relativePermittivity: x.er }));
  });

  it("standing-wave ratio and return loss follow the published VSWR table", () => {
    // VSWR 1.5 <-> |Gamma| 0.2 <-> 13.98 dB; VSWR 2.0 <-> 0.333 <-> 9.54 dB (common practice tables, from memory).
    const src = "VSWR / return-loss conversion table: 1.5 -> 13.98 dB, 2.0 -> 9.54 dB, 3.0 -> 6.02 dB (common practice, from memory)";
    const loads: [number, number, number][] = [[75, 1.5, 13.98], [25, 2, 9.54], [150, 3, 6.02]];
    for (const [r, swr, rl] of loads) {
      const x = { loadResistance: ohm(r), characteristicImpedance: ohm(50) };
      checkCases([{ input: x, expected: swr, tolerance: 1e-12, source: src }], (v) => standingWaveRatio(v));
      checkCases([{ input: x, expected: rl, tolerance: 5e-4, source: src }], (v) => returnLoss(v));
    }
  });
});

const size = fc.double({ min: -6, max: 2, noNaN: true }).map((p) => 10 ** p);
const gap = fc.double({ min: -9, max: 3, noNaN: true }).map((p) => 1 + 10 ** p);
const er = fc.double({ min: 1, max: 100, noNaN: true });

describe("line properties", () => {
  it("Z0 = sqrt(L'/C') and delay = sqrt(L'C') with the library's per-length capacitance and inductance (coaxial and two-wire)", () => {
    fc.assert(fc.property(size, gap, er, (a, g, e) => {
      const b = a * g;
      fc.pre(b > a);
      const cC = coaxialCapacitance({ innerRadius: m(a), outerRadius: m(b), length: m(1), relativePermittivity: e });
      const cL = coaxialInductance({ innerRadius: m(a), outerRadius: m(b), length: m(1) });
      expect(rel(coaxialImpedance({ innerRadius: m(a), outerRadius: m(b), relativePermittivity: e }), Math.sqrt(cL / cC))).toBeLessThan(1e-12);
      expect(rel(propagationDelay({ length: m(1), effectivePermittivity: e }), Math.sqrt(cL * cC))).toBeLessThan(1e-9);
      const wC = twoWireCapacitance({ wireRadius: m(a), separation: m(2 * b), length: m(1), relativePermittivity: e });
      const wL = twoWireInductance({ wireRadius: m(a), separation: m(2 * b), length: m(1) });
      expect(rel(twoWireImpedance({ wireRadius: m(a), separation: m(2 * b), relativePermittivity: e }), Math.sqrt(wL / wC))).toBeLessThan(1e-12);
      expect(rel(propagationDelay({ length: m(1), effectivePermittivity: e }), Math.sqrt(wL * wC))).toBeLessThan(1e-9);
    }));
  });

  it("reflection, return loss and standing-wave ratio agree: SWR = (1 + |G|)/(1 - |G|), RL = -20 log10 |G|", () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 1e4, noNaN: true }), fc.double({ min: 1, max: 1e3, noNaN: true }), (r, z0) => {
      fc.pre(Math.abs(r - z0) > 1e-6 * z0 && r > 1e-6);
      const x = { loadResistance: ohm(r), characteristicImpedance: ohm(z0) };
      const g = reflectionCoefficient(x);
      expect(Math.abs(g)).toBeLessThanOrEqual(1);
      expect(rel(standingWaveRatio(x), (1 + Math.abs(g)) / (1 - Math.abs(g)))).toBeLessThan(1e-9);
      expect(rel(returnLoss(x), -20 * Math.log10(Math.abs(g)))).toBeLessThan(1e-9);
      // Swapping load and line flips the sign of Gamma and keeps SWR and RL.
      const y = { loadResistance: ohm(z0), characteristicImpedance: ohm(r) };
      expect(reflectionCoefficient(y)).toBeCloseTo(-g, 14);
      expect(rel(standingWaveRatio(y), standingWaveRatio(x))).toBeLessThan(1e-15);
    }));
    expect(reflectionCoefficient({ loadResistance: ohm(0), characteristicImpedance: ohm(50) })).toBe(-1);
    expect(reflectionCoefficient({ loadResistance: ohm(50), characteristicImpedance: ohm(50) })).toBe(0);
  });

  it("the terminated line: a matched load is seen as Z0, a half wave repeats the load, a quarter wave inverts it, a short is j Z0 tan(beta l)", () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 1e3, noNaN: true }), fc.double({ min: 1, max: 1e3, noNaN: true }), fc.double({ min: 1e6, max: 1e10, noNaN: true }), er, (r, z0, f, e) => {
      const lambda = C0 / f / Math.sqrt(e);
      const at = (load: number, len: number) =>
        lineInputImpedance({ loadResistance: ohm(load), characteristicImpedance: ohm(z0), length: m(len), frequency: hz(f), effectivePermittivity: e });
      const matched = at(z0, 0.37 * lambda);
      expect(rel(matched[0]!, z0)).toBeLessThan(1e-12);
      expect(Math.abs(matched[1]!)).toBeLessThan(1e-12 * z0);
      const half = at(r, lambda / 2);
      expect(rel(half[0]!, r)).toBeLessThan(1e-9);
      const quarter = at(r, lambda / 4);
      expect(rel(quarter[0]!, (z0 * z0) / r)).toBeLessThan(1e-9);
      const short = at(0, 0.1 * lambda);
      expect(short[0]).toBe(0);
      expect(rel(short[1]!, z0 * Math.tan((2 * Math.PI * 0.1 * lambda) / lambda))).toBeLessThan(1e-9);
    }));
  });

  it("the input impedance is passive and its magnitude of reflection is the load's, whatever the length", () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 1e3, noNaN: true }), fc.double({ min: 1, max: 1e3, noNaN: true }), fc.double({ min: 1e-3, max: 10, noNaN: true }), (r, z0, len) => {
      const [re, im] = lineInputImpedance({ loadResistance: ohm(r), characteristicImpedance: ohm(z0), length: m(len), frequency: hz(1e8) });
      expect(re!).toBeGreaterThanOrEqual(0);
      // |Gamma_in| = |(Zin - Z0)/(Zin + Z0)| equals |Gamma_load| on a lossless line.
      const gin = Math.hypot(re! - z0, im!) / Math.hypot(re! + z0, im!);
      expect(Math.abs(gin - Math.abs((r - z0) / (r + z0)))).toBeLessThan(1e-9);
    }));
  });
});

describe("line formulas through evaluate", () => {
  it("unit strings give the typed values", () => {
    expect(evaluate("coaxialImpedance", { innerRadius: "0.45 mm", outerRadius: "1.47 mm", relativePermittivity: 2.25 }).value)
      .toBe(coaxialImpedance({ innerRadius: quantity(0.45, "mm"), outerRadius: quantity(1.47, "mm"), relativePermittivity: 2.25 }));
    expect(evaluate("propagationDelay", { length: "10 cm", effectivePermittivity: 3.3 }).unit).toBe("s");
    const z = evaluate("lineInputImpedance", { loadResistance: "100 ohm", characteristicImpedance: "50 ohm", length: "2.5 cm", frequency: "3 GHz" });
    expect(z.value as readonly number[]).toHaveLength(2);
    expect(rel((z.value as number[])[0]!, 25)).toBeLessThan(2e-3);
  });

  it("bad input is a coded error naming the input; a match has no finite return loss", () => {
    expect(expectFormulaError(() => evaluate("coaxialImpedance", { innerRadius: "2 mm", outerRadius: "1 mm" })).code).toBe("out_of_domain");
    expect(expectFormulaError(() => evaluate("twoWireImpedance", { wireRadius: "1 mm", separation: "1.5 mm" })).code).toBe("out_of_domain");
    expect(expectFormulaError(() => evaluate("reflectionCoefficient", { loadResistance: "-1 ohm", characteristicImpedance: "50 ohm" })).input).toBe("loadResistance");
    expect(expectFormulaError(() => evaluate("standingWaveRatio", { loadResistance: "1 ohm", characteristicImpedance: "0 ohm" })).input).toBe("characteristicImpedance");
    expect(expectFormulaError(() => evaluate("returnLoss", { loadResistance: "50 ohm", characteristicImpedance: "50 ohm" })).code).toBe("out_of_range");
    expect(expectFormulaError(() => evaluate("lineInputImpedance", { loadResistance: "50 ohm", characteristicImpedance: "50 ohm", length: "1 m", frequency: "1 s" })).input).toBe("frequency");
  });

  it("warns when the line is so long that the phase depends on digits the inputs lack", () => {
    const r = evaluate("lineInputImpedance", { loadResistance: "75 ohm", characteristicImpedance: "50 ohm", length: "10000 km", frequency: "100 GHz" });
    expect(r.warnings.map((w) => w.code)).toContain("phase_precision");
  });
});
