// Via and trace parasitics (published values, properties, oracles) and
// synthesis through solve: the width for a target impedance, evaluated back.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  coaxialImpedance, coplanarWaveguideImpedance, coupledMicrostripImpedance, evaluate, microstripImpedance, quantity, solve,
  straightWireInductance, striplineImpedance, traceInductance, traceResistance, twoWireImpedance, viaInductance,
  type Length, type Resistance, type Temperature,
} from "../../src/index.js";
import { checkCases, type ReferenceCase } from "../helpers/reference.js";
import { D, exact, PI } from "./oracle.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { constant } from "../../src/constants/index.js";

const m = (v: number) => v as Length;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const MU0 = constantDecimal(constant("vacuumPermeability"), D);

describe("via and trace parasitics", () => {
  it("copper trace resistance follows IEC 60028: 1 m of 1 mm^2 is 17.24 mohm at 20 degC, times 1 + 0.00393 (T - 20 degC)", () => {
    const cases: ReferenceCase<{ t: number }>[] = [
      { name: "20 degC", input: { t: 293.15 }, expected: 1 / 58, tolerance: 1e-12, source: "IEC 60028: annealed copper 1/58 ohm mm^2/m at 20 degC (from memory)" },
      { name: "85 degC", input: { t: 358.15 }, expected: (1 / 58) * (1 + 0.00393 * 65), tolerance: 1e-12, source: "IEC 60028: alpha20 = 0.00393 /K (from memory)" },
    ];
    checkCases(cases, (x) => traceResistance({ length: m(1), width: m(1e-3), thickness: m(1e-3), temperature: x.t as Temperature }));
    // Unit strings in degC are converted with their offset.
    expect(rel(evaluate("traceResistance", { length: "1 m", width: "1 mm", thickness: "1 mm", temperature: "85 degC" }).value as number, (1 / 58) * 1.25545)).toBeLessThan(1e-12);
  });

  it("via inductance is within a few ulp of Goldfarb and Pucel's expression as printed (50-digit oracle)", () => {
    fc.assert(fc.property(fc.double({ min: -290, max: 290, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), (p, q) => {
      const h = 10 ** p;
      const r = h * 10 ** q;
      const H = exact(h);
      const R = exact(r);
      const root = R.pow(2).plus(H.pow(2)).sqrt();
      const want = MU0.div(PI.times(2)).times(H.times(H.plus(root).div(R).ln()).plus(R.minus(root).times(1.5)));
      const got = viaInductance({ height: m(h), radius: m(r) });
      expect(exact(got).minus(want).abs().div(want).toNumber()).toBeLessThan(16 * Number.EPSILON);
    }), { numRuns: 200 });
  });

  it("trace inductance is within a few ulp of Ruehli's long-bar form and matches a round wire of the same geometric mean distance", () => {
    fc.assert(fc.property(fc.double({ min: -290, max: 290, noNaN: true }), fc.double({ min: -4, max: -1, noNaN: true }), fc.double({ min: 0.02, max: 1, noNaN: true }), (p, q, aspect) => {
      const l = 10 ** p;
      const w = l * 10 ** q;
      const t = w * aspect;
      const L = exact(l);
      const s = exact(w).plus(exact(t));
      const want = MU0.times(L).div(PI.times(2)).times(L.times(2).div(s).ln().plus(0.5).plus(s.times(0.2235).div(L)));
      const got = traceInductance({ length: m(l), width: m(w), thickness: m(t) });
      expect(exact(got).minus(want).abs().div(want).toNumber()).toBeLessThan(8 * Number.EPSILON);
    }), { numRuns: 200 });
    // Grover's geometric mean distance of a rectangle, 0.2235 (w + t), equals that of a round wire r e^(-1/4):
    // the bar and that wire have the same long-line inductance (Grover 1946, table of GMDs; from memory).
    const [l, w, t] = [1, 1e-3, 1e-3];
    const r = 0.2235 * (w + t) * Math.exp(0.25);
    expect(rel(traceInductance({ length: m(l), width: m(w), thickness: m(t) }), straightWireInductance({ length: m(l), radius: m(r) }))).toBeLessThan(2e-3);
  });

  it("longer or thinner traces have more inductance and resistance; vias grow with height", () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.double({ min: 1e-5, max: 1e-3, noNaN: true }), fc.double({ min: 1.01, max: 4, noNaN: true }), (l, w, k) => {
      const x = { length: m(l), width: m(w), thickness: m(35e-6) };
      expect(traceInductance({ ...x, length: m(l * k) })).toBeGreaterThan(traceInductance(x));
      expect(traceInductance({ ...x, width: m(w / k) })).toBeGreaterThan(traceInductance(x));
      expect(rel(traceResistance({ ...x, length: m(l * k) }), k * traceResistance(x))).toBeLessThan(1e-14);
      expect(viaInductance({ height: m(l * k), radius: m(w) })).toBeGreaterThan(viaInductance({ height: m(l), radius: m(w) }));
    }));
  });
});

describe("synthesis through solve: the width for a target impedance, evaluated back", () => {
  const ohm = (v: number) => v as Resistance;
  it("solves the microstrip width for 50 ohm on FR-4 and evaluates back to 50 ohm", () => {
    const w = solve(microstripImpedance, "width", { height: quantity(1.6, "mm"), relativePermittivity: 4.4, target: ohm(50) });
    expect(rel(microstripImpedance({ width: w, height: quantity(1.6, "mm"), relativePermittivity: 4.4 }), 50)).toBeLessThan(1e-9);
    // About 3 mm (common practice: w ~ 1.9 h for 50 ohm on FR-4, from memory).
    expect(w / 1.6e-3).toBeGreaterThan(1.8);
    expect(w / 1.6e-3).toBeLessThan(2);
  });

  it("every impedance formula of the family solves for its geometry and evaluates back", () => {
    const back = <T>(z: number, f: (w: number) => number, solveW: () => number) => {
      const w = solveW();
      expect(rel(f(w), z)).toBeLessThan(1e-9);
    };
    back(50, (w) => microstripImpedance({ width: m(w), height: m(2e-4), relativePermittivity: 3.5, thickness: m(3.5e-5), frequency: quantity(5, "GHz") }),
      () => solve(microstripImpedance, "width", { height: m(2e-4), relativePermittivity: 3.5, thickness: m(3.5e-5), frequency: quantity(5, "GHz"), target: ohm(50) }));
    back(50, (w) => striplineImpedance({ width: m(w), groundSpacing: m(6e-4), relativePermittivity: 4.4, thickness: m(1.7e-5) }),
      () => solve(striplineImpedance, "width", { groundSpacing: m(6e-4), relativePermittivity: 4.4, thickness: m(1.7e-5), target: ohm(50) }));
    back(50, (w) => coplanarWaveguideImpedance({ width: m(w), gap: m(1.5e-4), height: m(5e-4), relativePermittivity: 4.4, backing: "grounded" }),
      () => solve(coplanarWaveguideImpedance, "width", { gap: m(1.5e-4), height: m(5e-4), relativePermittivity: 4.4, backing: "grounded", target: ohm(50) }));
    back(70, (w) => coplanarWaveguideImpedance({ width: m(w), gap: m(1.5e-4), height: m(5e-4), relativePermittivity: 4.4, backing: "none" }),
      () => solve(coplanarWaveguideImpedance, "width", { gap: m(1.5e-4), height: m(5e-4), relativePermittivity: 4.4, backing: "none", target: ohm(70) }));
    back(60, (w) => coupledMicrostripImpedance({ width: m(w), spacing: m(2e-4), height: m(2e-4), relativePermittivity: 4.4, mode: "even" }),
      () => solve(coupledMicrostripImpedance, "width", { spacing: m(2e-4), height: m(2e-4), relativePermittivity: 4.4, mode: "even", target: ohm(60) }));
    back(40, (w) => coupledMicrostripImpedance({ width: m(w), spacing: m(2e-4), height: m(2e-4), relativePermittivity: 4.4, mode: "odd" }),
      () => solve(coupledMicrostripImpedance, "width", { spacing: m(2e-4), height: m(2e-4), relativePermittivity: 4.4, mode: "odd", target: ohm(40) }));
    back(75, (b) => coaxialImpedance({ innerRadius: m(4.5e-4), outerRadius: m(b), relativePermittivity: 2.25 }),
      () => solve(coaxialImpedance, "outerRadius", { innerRadius: m(4.5e-4), relativePermittivity: 2.25, target: ohm(75) }));
    back(300, (d) => twoWireImpedance({ wireRadius: m(5e-4), separation: m(d) }),
      () => solve(twoWireImpedance, "separation", { wireRadius: m(5e-4), target: ohm(300) }));
  });
});
