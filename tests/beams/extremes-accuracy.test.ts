// Every beam and plasma formula against a decimal.js oracle of its published
// equation, from the exact decimal values of the double inputs and CODATA 2022
// constants, over inputs log-spread across the double range. Bounds in
// eps = 2^-52 (relative): one rounding per scaled operation plus the constants'.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  bendingRadius, childLangmuirCurrentDensity, debyeLength, lorentzFactor, magneticRigidity, particleMomentum, particleSpeed,
  perveance, plasmaFrequency, quadrupoleFocalLength,
} from "../../src/index.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { agreesWithOracle, D, type Dec, exact, PI } from "../capacitance/oracle.js";

const EPS = Number.EPSILON;
const C = constantDecimal(constant("speedOfLight"), D);
const EPS0 = constantDecimal(constant("vacuumPermittivity"), D);
const KB = constantDecimal(constant("boltzmannConstant"), D);
const E = constantDecimal(constant("elementaryCharge"), D);
const RUNS = 300;
const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);

const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const signed = (lo: number, hi: number) => fc.tuple(decades(lo, hi), fc.boolean()).map(([v, n]) => (n ? -v : v));
const magnitude = decades(-300, 300);
const anySign = signed(-300, 300);
const energy = fc.oneof(fc.constant(0), magnitude);

describe("beam formulas against a decimal.js oracle, 1e-300 to 1e300", () => {
  it("gamma is within 2 ulp of 1 + T/(m c^2)", () => {
    fc.assert(fc.property(energy, magnitude, (kineticEnergy, mass) => {
      agrees(lorentzFactor, { kineticEnergy, mass }, exact(kineticEnergy).div(exact(mass).times(C.pow(2))).plus(1), 2 * EPS);
    }), { numRuns: RUNS });
  });

  it("the speed is within 4 ulp of c sqrt(t (2 + t)) / (1 + t), t = T/(m c^2)", () => {
    fc.assert(fc.property(energy, magnitude, (kineticEnergy, mass) => {
      const t = exact(kineticEnergy).div(exact(mass).times(C.pow(2)));
      agrees(particleSpeed, { kineticEnergy, mass }, C.times(t.times(t.plus(2)).sqrt()).div(t.plus(1)), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the momentum is within 4 ulp of sqrt(T (T + 2 m c^2)) / c", () => {
    fc.assert(fc.property(energy, magnitude, (kineticEnergy, mass) => {
      const T = exact(kineticEnergy);
      agrees(particleMomentum, { kineticEnergy, mass }, T.times(T.plus(exact(mass).times(C.pow(2)).times(2))).sqrt().div(C), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("rigidity, bending radius and focal length are within 2 ulp of p/|q|, p/(|q| B), B rho/(g l)", () => {
    fc.assert(fc.property(magnitude, anySign, magnitude, magnitude, (p, q, b, l) => {
      agrees(magneticRigidity, { momentum: p, charge: q }, exact(p).div(exact(q).abs()), 2 * EPS);
      agrees(bendingRadius, { momentum: p, charge: q, fluxDensity: b }, exact(p).div(exact(q).abs().times(exact(b))), 2 * EPS);
      agrees(quadrupoleFocalLength, { rigidity: p, gradient: b, length: l }, exact(p).div(exact(b).times(exact(l))), 2 * EPS);
    }), { numRuns: RUNS });
  });

  it("the Child-Langmuir density is within 6 ulp of (4 eps0/9) sqrt(2|q|/m) V^(3/2)/d^2", () => {
    fc.assert(fc.property(magnitude, magnitude, anySign, magnitude, (voltage, gap, charge, mass) => {
      const V = exact(voltage);
      const want = EPS0.times(4).div(9).times(exact(charge).abs().times(2).div(exact(mass)).sqrt()).times(V.times(V.sqrt())).div(exact(gap).pow(2));
      agrees(childLangmuirCurrentDensity, { voltage, gap, charge, mass }, want, 6 * EPS);
    }), { numRuns: RUNS });
  });

  it("the perveance is within 4 ulp of I / V^(3/2)", () => {
    fc.assert(fc.property(magnitude, magnitude, (current, voltage) => {
      const V = exact(voltage);
      agrees(perveance, { current, voltage }, exact(current).div(V.times(V.sqrt())), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the plasma frequency and Debye length are within 4 ulp of their equations", () => {
    fc.assert(fc.property(magnitude, anySign, magnitude, magnitude, (density, charge, mass, temperature) => {
      agrees(plasmaFrequency, { density, charge, mass }, exact(density).times(exact(charge).pow(2)).div(EPS0.times(exact(mass))).sqrt().div(PI.times(2)), 4 * EPS);
      agrees(debyeLength, { temperature, density }, EPS0.times(KB).times(exact(temperature)).div(exact(density).times(E.pow(2))).sqrt(), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("reports the worst error measured per formula (in eps)", () => {
    console.log(`beams worst relative error / eps: ${[...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`).join(", ")}`);
    expect(worst.size).toBe(10);
  });
});
