// Every displacement formula against a 50-digit decimal.js oracle of its
// published equation, from the exact decimal values of the double inputs and
// CODATA 2022 constants, over inputs log-spread across the double range
// (1e-300..1e300, both signs where the domain allows). Bounds per formula in
// eps = 2^-52 (relative): one rounding per factor and divisor in scaledProduct
// plus the rounding of the constants (eps0, mu0 / (2 pi), 2 pi) as doubles.
// Results out of the normal range: see agreesWithOracle.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  capacitorDisplacementCurrent, chargingCapacitorField, conductionDisplacementRatio, dielectricRelaxationFrequency,
  displacementCurrent, displacementCurrentDensity, parasiticCouplingCurrent,
} from "../../src/index.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { agreesWithOracle, D, type Dec, EPS0, exact, PI } from "../capacitance/oracle.js";

const EPS = Number.EPSILON;
const MU0 = constantDecimal(constant("vacuumPermeability"), D);
const RUNS = 300;
const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);

/** 10^p for p in [lo, hi], optionally either sign. */
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const signed = (lo: number, hi: number) => fc.tuple(decades(lo, hi), fc.boolean()).map(([v, n]) => (n ? -v : v));
const magnitude = decades(-300, 300);
const anySign = signed(-300, 300);
const permittivity = fc.oneof(fc.constant(1), decades(0, 300));

describe("displacement formulas against a 50-digit decimal.js oracle, 1e-300 to 1e300", () => {
  it("displacement current is within 3 ulp of eps0 epsr dPhi/dt (Ampere-Maxwell displacement term)", () => {
    fc.assert(fc.property(anySign, permittivity, (electricFluxRate, relativePermittivity) => {
      const x = { electricFluxRate, relativePermittivity };
      agrees(displacementCurrent, x, EPS0.times(exact(relativePermittivity)).times(exact(electricFluxRate)), 3 * EPS);
    }), { numRuns: RUNS });
  });

  it("capacitor and parasitic coupling currents are within 1 ulp of C dV/dt", () => {
    fc.assert(fc.property(magnitude, anySign, (capacitance, rate) => {
      const want = exact(capacitance).times(exact(rate));
      agrees(capacitorDisplacementCurrent, { capacitance, voltageRate: rate }, want, EPS);
      agrees(parasiticCouplingCurrent, { capacitance, voltageSlewRate: rate }, want, EPS);
    }), { numRuns: RUNS });
  });

  it("displacement current density is within 4 ulp of 2 pi f eps0 epsr E0", () => {
    fc.assert(fc.property(magnitude, permittivity, magnitude, (frequency, relativePermittivity, fieldAmplitude) => {
      const x = { relativePermittivity, frequency, fieldAmplitude };
      const want = PI.times(2).times(exact(frequency)).times(EPS0).times(exact(relativePermittivity)).times(exact(fieldAmplitude));
      agrees(displacementCurrentDensity, x, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the conduction/displacement ratio and the relaxation frequency are within 4 ulp of sigma / (2 pi f eps0 epsr) and sigma / (2 pi eps0 epsr)", () => {
    fc.assert(fc.property(magnitude, permittivity, magnitude, (conductivity, relativePermittivity, frequency) => {
      const twoPiEps = PI.times(2).times(EPS0).times(exact(relativePermittivity));
      agrees(conductionDisplacementRatio, { conductivity, relativePermittivity, frequency }, exact(conductivity).div(twoPiEps.times(exact(frequency))), 4 * EPS);
      agrees(dielectricRelaxationFrequency, { conductivity, relativePermittivity }, exact(conductivity).div(twoPiEps), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the charging-capacitor field is within 4 ulp of mu0 I r / (2 pi R^2) inside and mu0 I / (2 pi r) outside", () => {
    fc.assert(fc.property(anySign, magnitude, fc.oneof(decades(-30, 0), decades(0, 30)), (current, plateRadius, ratio) => {
      const radialDistance = plateRadius * ratio;
      fc.pre(Number.isFinite(radialDistance));
      const x = { current, plateRadius, radialDistance };
      const k = MU0.div(PI.times(2)).times(exact(current));
      const want = radialDistance <= plateRadius
        ? k.times(exact(radialDistance)).div(exact(plateRadius).pow(2))
        : k.div(exact(radialDistance));
      agrees(chargingCapacitorField, x, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("keeps the issue's reproducers: products that overflow or underflow before the result does", () => {
    // eps0 * epsr overflows for epsr = 1e300 while the current is 8.85e-12 * 1e300 * 1e-300.
    agrees(displacementCurrent, { electricFluxRate: 1e-300, relativePermittivity: 1e300 }, EPS0.times(exact(1e300)).times(exact(1e-300)), 3 * EPS);
    // 2 pi f eps0 overflows in the denominator, sigma is huge too.
    agrees(conductionDisplacementRatio, { conductivity: 1e300, relativePermittivity: 1, frequency: 1e300 },
      exact(1e300).div(PI.times(2).times(EPS0).times(exact(1e300))), 4 * EPS);
    // R^2 underflows for R = 1e-200 m.
    agrees(chargingCapacitorField, { current: 1e-200, plateRadius: 1e-200, radialDistance: 1e-200 },
      MU0.div(PI.times(2)).times(exact(1e-200)).div(exact(1e-200)), 4 * EPS);
    // A product below the smallest double is out_of_range, never a silent 0.
    expect(() => capacitorDisplacementCurrent({ capacitance: 1e-200 as never, voltageRate: 1e-200 as never })).toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as Error);
  });

  it("reports the worst error measured per formula (in eps)", () => {
    console.log(`displacement worst relative error / eps: ${[...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`).join(", ")}`);
    expect(worst.size).toBe(7);
  });
});
