import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  dowellAcResistanceFactor, dowellRoundWireAcResistanceFactor, evaluate, skinDepth,
  type Conductivity, type Frequency, type Length,
} from "../../src/index.js";
import { relativeError } from "../helpers/reference.js";
import { exact } from "./oracle.js";

const m = (v: number) => v as Length;
const Hz = (v: number) => v as Frequency;
const EPS = Number.EPSILON;

/**
 * Dowell's layer factor as published (P. L. Dowell, Proc. IEE 113 (1966), eq. (11), from memory):
 * F = D [(sinh 2D + sin 2D)/(cosh 2D - cos 2D) + (2/3)(m^2 - 1)(sinh D - sin D)/(cosh D + cos D)],
 * in 60-digit decimal.js. Below D = 0.5 the four combinations come from the Taylor series of sinh,
 * sin, cosh and cos (DLMF 4.28.2, 4.19.1 and 4.19.2), summed to 1e-70, so the cancellation of
 * cosh 2D - cos 2D (about 4 D^2) and sinh D - sin D (about D^3 / 3) costs nothing:
 * sinh u + sin u = 2 sum u^(4k+1)/(4k+1)!, cosh u - cos u = 2 sum u^(4k+2)/(4k+2)!,
 * sinh D - sin D = 2 sum D^(4k+3)/(4k+3)!, cosh D + cos D = 2 sum D^(4k)/(4k)!.
 * Beyond D = 1000 the hyperbolic ratios are 1 to within e^{-1000}: F = D (1 + (2/3)(m^2 - 1)).
 */
const DD = Decimal.clone({ precision: 60, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
function taylor(x: Decimal, offset: number): Decimal {
  // sum over k of x^(4k + offset) / (4k + offset)!, to a relative 1e-70 (x < 1: at most ~20 terms)
  let term = x.pow(offset);
  for (let j = 2; j <= offset; j++) term = term.div(j);
  let sum = term;
  for (let k = 1; k < 200; k++) {
    const n = 4 * k + offset;
    term = term.times(x.pow(4)).div(new DD(n).times(n - 1).times(n - 2).times(n - 3));
    sum = sum.plus(term);
    if (term.div(sum).abs().lt("1e-70")) break;
  }
  return sum;
}
function dowellOracle(layers: number, delta: number): Decimal {
  const d = new DD(exact(delta).toString());
  const k = new DD(2).div(3).times(new DD(layers).pow(2).minus(1));
  if (delta > 1000) return d.times(k.plus(1));
  const u = d.times(2);
  const [s1, s2] = delta < 0.5
    ? [taylor(u, 1).div(taylor(u, 2)), taylor(d, 3).div(taylor(d, 0))]
    : [u.sinh().plus(u.sin()).div(u.cosh().minus(u.cos())), d.sinh().minus(d.sin()).div(d.cosh().plus(d.cos()))];
  return d.times(s1.plus(k.times(s2)));
}
const relErr = (got: number, want: Decimal) => new Decimal(exact(got).toString()).minus(want).div(want).abs().toNumber();

describe("dowellAcResistanceFactor", () => {
  it("is within 8 ulp of Dowell's equation (decimal.js oracle) for penetration ratios 1e-300 to 1e300 and 1 to 1e6 layers", () => {
    let worst = 0;
    const deltas = fc.double({ min: -300, max: 300, noNaN: true }).map((p) => 10 ** p);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1e6 }), fc.oneof(deltas, fc.double({ min: 0.01, max: 30, noNaN: true })), (layers, delta) => {
        const want = dowellOracle(layers, delta);
        if (want.gt("1.7976931348623157e308")) {
          expect(() => dowellAcResistanceFactor({ layers, penetrationRatio: delta })).toThrow(expect.objectContaining({ code: "out_of_range" }));
          return;
        }
        const got = dowellAcResistanceFactor({ layers, penetrationRatio: delta });
        const err = relErr(got, want);
        worst = Math.max(worst, err);
        expect(err, `m = ${layers}, Delta = ${delta}: got ${got}`).toBeLessThanOrEqual(8 * EPS);
      }),
      { numRuns: 100 },
    );
    for (const delta of [1.999999999, 2, 2.000000001, 0.5, 1, 3]) {
      for (const layers of [1, 2, 10]) expect(relErr(dowellAcResistanceFactor({ layers, penetrationRatio: delta }), dowellOracle(layers, delta))).toBeLessThanOrEqual(8 * EPS);
    }
    console.log(`dowellAcResistanceFactor: worst ${(worst / EPS).toFixed(2)} eps`);
  });

  it("tends to 1 + (5 m^2 - 1) Delta^4 / 45 as the penetration ratio goes to 0 (Dowell's low-frequency limit)", () => {
    // The low-frequency expansion of Dowell's factor, e.g. as used by J. A. Ferreira, Electromagnetic
    // Modelling of Power Electronic Converters (1989), ch. 5 (from memory).
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 50 }), fc.double({ min: 1e-4, max: 0.05, noNaN: true }), (layers, delta) => {
        const excess = dowellAcResistanceFactor({ layers, penetrationRatio: delta }) - 1;
        const lead = ((5 * layers * layers - 1) * delta ** 4) / 45;
        expect(Math.abs(excess - lead)).toBeLessThanOrEqual(0.05 * lead + 4 * EPS);
      }),
    );
  });

  it("tends to Delta (1 + (2/3)(m^2 - 1)) at high frequency and grows with the number of layers", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 100 }), fc.double({ min: 40, max: 1e6, noNaN: true }), (layers, delta) => {
        const f = dowellAcResistanceFactor({ layers, penetrationRatio: delta });
        expect(relativeError(f, delta * (1 + (2 / 3) * (layers * layers - 1)))).toBeLessThan(1e-14);
        expect(dowellAcResistanceFactor({ layers: layers + 1, penetrationRatio: delta })).toBeGreaterThan(f);
      }),
    );
  });

  it("for several layers, the loss at a fixed current (F / Delta) is least at an intermediate layer thickness", () => {
    // With m layers the loss for fixed current is proportional to F / Delta; it has a minimum at a
    // layer thickness below one skin depth for m > 1 (Dowell 1966, optimum thickness; common practice).
    const lossPerDelta = (delta: number) => dowellAcResistanceFactor({ layers: 5, penetrationRatio: delta }) / delta;
    expect(lossPerDelta(0.5)).toBeLessThan(lossPerDelta(0.1));
    expect(lossPerDelta(0.5)).toBeLessThan(lossPerDelta(2));
  });
});

describe("dowellRoundWireAcResistanceFactor", () => {
  it("equals the foil factor at Delta = (pi/4)^(3/4) (d / delta) sqrt(d / p)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20 }), fc.double({ min: 1e-5, max: 3e-3, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }), fc.double({ min: 50, max: 1e7, noNaN: true }), (layers, d, spread, f) => {
        const delta = skinDepth({ conductivity: 58e6 as Conductivity, frequency: Hz(f) });
        const D = Math.pow(Math.PI / 4, 0.75) * (d / delta) * Math.sqrt(1 / spread);
        const got = dowellRoundWireAcResistanceFactor({ layers, wireDiameter: m(d), pitch: m(d * spread), frequency: Hz(f) });
        expect(relativeError(got, dowellAcResistanceFactor({ layers, penetrationRatio: D }))).toBeLessThan(1e-13);
      }),
    );
  });

  it("warns for loosely spaced turns thicker than a skin depth, after Nan and Sullivan", () => {
    const codes = (pitch: number) => dowellRoundWireAcResistanceFactor.details({ layers: 3, wireDiameter: m(0.5e-3), pitch: m(pitch), frequency: Hz(500e3) }).warnings.map((w) => w.code);
    expect(codes(0.55e-3)).toEqual([]);
    expect(codes(1.5e-3)).toEqual(["low_porosity"]);
    expect(() => evaluate("dowellRoundWireAcResistanceFactor", { layers: 3, wireDiameter: "0.5 mm", pitch: "0.4 mm", frequency: "100 kHz" })).toThrow(expect.objectContaining({ code: "out_of_domain" }));
  });
});
