// The actuator forces against decimal.js oracles of their published
// equations, from the exact decimal values of the double inputs and CODATA
// 2022 constants, over inputs log-spread across the double range. Bounds in
// eps = 2^-52 (relative): one rounding per factor and divisor of the scaled
// product, plus the constants' roundings; the loop force adds its complete
// elliptic integrals (a few ulp each, tests/math/elliptic.test.ts).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { coaxialLoopsForce, combDriveForce, electrostaticForce, gapPullForce, gappedCorePullForce, pullInVoltage } from "../../src/index.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { agreesWithOracle, D, type Dec, exact } from "../capacitance/oracle.js";
import { loopsForceOracleDecimal } from "./loops-oracle.js";

const EPS = Number.EPSILON;
const MU0 = constantDecimal(constant("vacuumPermeability"), D);
const EPS0 = constantDecimal(constant("vacuumPermittivity"), D);
const RUNS = 300;
const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);

const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const signed = (lo: number, hi: number) => fc.tuple(decades(lo, hi), fc.boolean()).map(([v, n]) => (n ? -v : v));
const magnitude = decades(-300, 300);
const anySign = signed(-300, 300);
const count = fc.oneof(fc.integer({ min: 1, max: 1000 }), decades(0, 300).map(Math.round));

describe("actuator forces against a decimal.js oracle, 1e-300 to 1e300", () => {
  it("the gap pull is within 3 ulp of B^2 A / (2 mu0)", () => {
    fc.assert(fc.property(anySign, magnitude, (fluxDensity, poleArea) => {
      agrees(gapPullForce, { fluxDensity, poleArea }, exact(fluxDensity).pow(2).times(exact(poleArea)).div(MU0.times(2)), 3 * EPS);
    }), { numRuns: RUNS });
  });

  it("the gapped-core pull is within 6 ulp of mu0 N^2 I^2 A / (2 (g + l/mu_r)^2)", () => {
    fc.assert(fc.property(count, anySign, magnitude, magnitude, magnitude, magnitude, (turns, current, poleArea, gapLength, pathLength, relativePermeability) => {
      const g = exact(gapLength).plus(exact(pathLength).div(exact(relativePermeability)));
      const want = MU0.times(exact(turns).pow(2)).times(exact(current).pow(2)).times(exact(poleArea)).div(g.pow(2).times(2));
      agrees(gappedCorePullForce, { turns, current, poleArea, gapLength, pathLength, relativePermeability }, want, 6 * EPS);
    }), { numRuns: RUNS });
  });

  it("the plate force is within 4 ulp of eps0 eps_r A V^2 / (2 g^2)", () => {
    fc.assert(fc.property(magnitude, magnitude, anySign, decades(0, 300), (area, gap, voltage, relativePermittivity) => {
      const want = EPS0.times(exact(relativePermittivity)).times(exact(area)).times(exact(voltage).pow(2)).div(exact(gap).pow(2).times(2));
      agrees(electrostaticForce, { area, gap, voltage, relativePermittivity }, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the pull-in voltage is within 4 ulp of sqrt(8 k g^3 / (27 eps0 eps_r A))", () => {
    fc.assert(fc.property(magnitude, magnitude, magnitude, decades(0, 300), (springConstant, gap, area, relativePermittivity) => {
      const want = exact(springConstant).times(exact(gap).pow(3)).times(8).div(EPS0.times(27).times(exact(relativePermittivity)).times(exact(area))).sqrt();
      agrees(pullInVoltage, { springConstant, gap, area, relativePermittivity }, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the comb-drive force is within 3 ulp of n eps0 t V^2 / g", () => {
    fc.assert(fc.property(count, magnitude, magnitude, anySign, (fingers, thickness, gap, voltage) => {
      agrees(combDriveForce, { fingers, thickness, gap, voltage }, EPS0.times(exact(fingers)).times(exact(thickness)).times(exact(voltage).pow(2)).div(exact(gap)), 3 * EPS);
    }), { numRuns: RUNS });
  });

  it("the coaxial-loop force is within 12 ulp of Babic and Akyel's K, E form, from touching (1e-15 of a radius) to far apart (1e6 radii), at any size", () => {
    const ratio = (lo: number, hi: number) => decades(lo, hi);
    fc.assert(fc.property(anySign, anySign, magnitude, ratio(-6, 6), fc.oneof(ratio(-15, 6), fc.constant(0)), fc.boolean(), (current1, current2, radius1, rb, rd, equal) => {
      const radius2 = equal ? radius1 : radius1 * rb;
      const distance = radius1 * rd;
      fc.pre(Number.isFinite(radius2) && radius2 > 0 && (distance > 0 || radius2 !== radius1) && Number.isFinite(distance));
      agrees(coaxialLoopsForce, { current1, current2, radius1, radius2, distance }, loopsForceOracleDecimal(current1, current2, radius1, radius2, distance), 12 * EPS);
    }), { numRuns: RUNS });
  });

  it("reports the worst error measured per formula (in eps)", () => {
    console.log(`actuator forces worst relative error / eps: ${[...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`).join(", ")}`);
    expect(worst.size).toBe(6);
    expect(worst.get("coaxialLoopsForce")!).toBeLessThan(12 * EPS);
  });
});
