import Decimal from "decimal.js";
import fc from "fast-check";
import { evaluate as mathEvaluate } from "mathjs";
import { describe, expect, it } from "vitest";
import {
  lcCharacteristicImpedance, quantity, resonantFrequency, rogowskiMutualInductance, seriesQualityFactor, toroidInductance,
  type Capacitance, type Inductance, type Length, type Resistance,
} from "../../src/index.js";
import { agreesWithOracle } from "../capacitance/oracle.js";
import { relativeError } from "../helpers/reference.js";
import { exact } from "./oracle.js";

const D = Decimal.clone({ precision: 60, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
const PI = D.acos(-1);
const MU0 = new D("1.25663706127e-6");
const EPS = Number.EPSILON;
const dec = (v: number) => new D(exact(v).toString());
const decades = fc.double({ min: -300, max: 300, noNaN: true }).map((p) => 10 ** p);
const worst = new Map<string, number>();


describe("resonantFrequency, lcCharacteristicImpedance, seriesQualityFactor", () => {
  it("agree with mathjs evaluating 1/(2 pi sqrt(L C)), sqrt(L/C) and sqrt(L/C)/R with units", () => {
    const f = mathEvaluate("1 / (2 pi sqrt(100 uH * 10 nF))").toNumber("Hz") as number;
    const z = mathEvaluate("sqrt(100 uH / 10 nF)").toNumber("ohm") as number;
    const L = quantity(100, "uH"), C = quantity(10, "nF");
    expect(relativeError(resonantFrequency({ inductance: L, capacitance: C }), f)).toBeLessThan(1e-14);
    expect(relativeError(lcCharacteristicImpedance({ inductance: L, capacitance: C }), z)).toBeLessThan(1e-14);
    expect(relativeError(seriesQualityFactor({ resistance: quantity(2, "ohm"), inductance: L, capacitance: C }), z / 2)).toBeLessThan(1e-14);
  });

  it("are within 3 ulp of their closed forms (decimal.js oracle) from 1e-300 to 1e300", () => {
    fc.assert(
      fc.property(decades, decades, decades, (inductance, capacitance, resistance) => {
        agreesWithOracle(resonantFrequency, { inductance, capacitance }, new D(1).div(PI.times(2).times(dec(inductance).times(dec(capacitance)).sqrt())), 3 * EPS, worst);
        agreesWithOracle(lcCharacteristicImpedance, { inductance, capacitance }, dec(inductance).div(dec(capacitance)).sqrt(), 2 * EPS, worst);
        agreesWithOracle(seriesQualityFactor, { resistance, inductance, capacitance }, dec(inductance).div(dec(capacitance)).sqrt().div(dec(resistance)), 3 * EPS, worst);
      }),
      { numRuns: 300 },
    );
    console.log([...worst].map(([k, v]) => `${k}: ${(v / EPS).toFixed(2)} eps`).join("\n"));
  });

  it("Q equals omega0 L / R and 1 / (omega0 C R) at resonance (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1, noNaN: true }), fc.double({ min: 1e-12, max: 1e-3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (l, c, r) => {
        const w0 = 2 * Math.PI * resonantFrequency({ inductance: l as Inductance, capacitance: c as Capacitance });
        const q = seriesQualityFactor({ resistance: r as Resistance, inductance: l as Inductance, capacitance: c as Capacitance });
        expect(relativeError(q, (w0 * l) / r)).toBeLessThan(1e-14);
        expect(relativeError(q, 1 / (w0 * c * r))).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("rogowskiMutualInductance", () => {
  it("is within 3 ulp of mu0 N h ln(b/a) / (2 pi) (Ward and Exon 1993; decimal.js oracle), also for b just above a", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1e6 }), decades, fc.oneof(fc.double({ min: 1e-15, max: 1e-3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true })), decades, (turns, innerRadius, gap, height) => {
        const outerRadius = innerRadius * (1 + gap);
        fc.pre(Number.isFinite(outerRadius) && outerRadius > innerRadius);
        const want = MU0.times(turns).times(dec(height)).times(dec(outerRadius).div(dec(innerRadius)).ln()).div(PI.times(2));
        agreesWithOracle(rogowskiMutualInductance, { turns, innerRadius, outerRadius, height }, want, 3 * EPS, worst);
      }),
      { numRuns: 300 },
    );
  });

  it("is the self-inductance of the same winding on an air core divided by the turns (toroidInductance, mu_r = 1)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), fc.double({ min: 1e-3, max: 0.1, noNaN: true }), fc.double({ min: 1.01, max: 5, noNaN: true }), fc.double({ min: 1e-3, max: 0.1, noNaN: true }), (turns, a, k, h) => {
        const g = { turns, innerRadius: a as Length, outerRadius: (a * k) as Length, height: h as Length };
        const self = toroidInductance({ ...g, relativePermeability: 1 });
        expect(relativeError(rogowskiMutualInductance(g), self / turns)).toBeLessThan(1e-14);
      }),
    );
  });
});
