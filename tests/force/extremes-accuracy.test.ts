// Every force and particle formula against a decimal.js oracle of its
// published equation, from the exact decimal values of the double inputs and
// CODATA 2022 constants, over inputs log-spread across the double range
// (1e-300..1e300, both signs where the domain allows; speeds below c). Bounds
// per formula in eps = 2^-52 (relative): one rounding per factor and divisor
// in scaledProduct plus the rounding of the constants as doubles; vector
// results component by component (cross.ts: exact products, accurate sums).
// Results out of the normal range: see agreesWithOracle.
import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  cyclotronFrequency, driftVelocity, gyroradius, hallVoltage, lorentzForce, magneticPressure, parallelWiresForce,
  relativisticGyroradius, wireForce,
} from "../../src/index.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { agreesWithOracle, D, type Dec, exact, PI, vectorAgreesWithOracle } from "../capacitance/oracle.js";

const EPS = Number.EPSILON;
const MU0 = constantDecimal(constant("vacuumPermeability"), D);
const C = constantDecimal(constant("speedOfLight"), D);
const C_SI = 299792458;
const RUNS = 300;
const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);

// The cross-product oracle adds terms from 1e-600 to 1e600 exactly: 1400 digits hold every one.
const Wide = Decimal.clone({ precision: 1400, minE: -9e15, maxE: 9e15 });
const wide = (x: number) => new Wide(exact(x));
/** c + a x b, exactly, then times q, as 50-digit decimals. */
function crossOracle(q: number, a: readonly number[], b: readonly number[], c?: readonly number[], divisor?: Decimal): Dec[] {
  const out: Dec[] = [];
  for (let i = 0; i < 3; i++) {
    const j = (i + 1) % 3, k = (i + 2) % 3;
    let s = wide(a[j]!).times(wide(b[k]!)).minus(wide(a[k]!).times(wide(b[j]!)));
    if (c) s = s.plus(wide(c[i]!));
    s = s.times(wide(q));
    if (divisor) s = s.div(divisor);
    out.push(new D(s.toSignificantDigits(60)));
  }
  return out;
}

const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
const signed = (lo: number, hi: number) => fc.tuple(decades(lo, hi), fc.boolean()).map(([v, n]) => (n ? -v : v));
const magnitude = decades(-300, 300);
const anySign = signed(-300, 300);
const speed = decades(-300, Math.log10(0.999 * C_SI));
/** A vector component: zero sometimes, else log-spread of either sign. */
const component = (lo: number, hi: number) => fc.oneof(fc.constant(0), signed(lo, hi));
const vector = (lo: number, hi: number) => fc.tuple(component(lo, hi), component(lo, hi), component(lo, hi));

describe("force and particle formulas against a decimal.js oracle, 1e-300 to 1e300", () => {
  it("the Lorentz force is within 3 ulp of q (E + v x B) per component, also where v x B nearly cancels E", () => {
    fc.assert(fc.property(anySign, vector(-300, 300), vector(-300, Math.log10(C_SI / 2)), vector(-300, 300), (charge, e, v, b) => {
      const x = { charge, electricField: e, velocity: v, fluxDensity: b };
      vectorAgreesWithOracle(lorentzForce, x, crossOracle(charge, v, b, e), 3 * EPS, worst);
    }), { numRuns: RUNS });
    // A velocity filter that balances to the last digit of the doubles: E_y = v_x B_z rounded.
    for (const [vx, bz] of [[1e5, 0.1], [2.5e7, 3e-3], [1e-200, 1e200]] as const) {
      const e = [0, vx * bz, 0];
      const x = { charge: -1.602176634e-19, electricField: e, velocity: [vx, 0, 0], fluxDensity: [0, 0, bz] };
      vectorAgreesWithOracle(lorentzForce, x, crossOracle(x.charge, x.velocity, x.fluxDensity, e), 3 * EPS, worst);
    }
  });

  it("the E x B drift is within 6 ulp of E x B / |B|^2 per component", () => {
    fc.assert(fc.property(vector(-300, 300), vector(-300, 300), (e, b) => {
      fc.pre(b.some((v) => v !== 0));
      const b2 = b.reduce((s, v) => s.plus(wide(v).pow(2)), new Wide(0));
      vectorAgreesWithOracle(driftVelocity, { electricField: e, fluxDensity: b }, crossOracle(1, e, b, undefined, b2), 6 * EPS, worst);
    }), { numRuns: RUNS });
  });

  it("the wire force is within 3 ulp of I l B sin(theta), sin taken of the double angle", () => {
    fc.assert(fc.property(anySign, magnitude, magnitude, fc.double({ min: 1e-3, max: Math.PI - 1e-3, noNaN: true }), (current, length, fluxDensity, angle) => {
      const want = exact(current).times(exact(length)).times(exact(fluxDensity)).times(D.sin(exact(angle)));
      agrees(wireForce, { current, length, fluxDensity, angle }, want, 3 * EPS);
    }), { numRuns: RUNS });
  });

  it("the parallel-wire force is within 4 ulp of mu0 I1 I2 l / (2 pi d)", () => {
    fc.assert(fc.property(anySign, anySign, magnitude, magnitude, (current1, current2, separation, length) => {
      const want = MU0.div(PI.times(2)).times(exact(current1)).times(exact(current2)).times(exact(length)).div(exact(separation));
      agrees(parallelWiresForce, { current1, current2, separation, length }, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the magnetic pressure is within 2 ulp of B^2 / (2 mu0)", () => {
    fc.assert(fc.property(anySign, (fluxDensity) => {
      agrees(magneticPressure, { fluxDensity }, exact(fluxDensity).pow(2).div(MU0.times(2)), 2 * EPS);
    }), { numRuns: RUNS });
  });

  it("the Hall voltage is within 3 ulp of I B / (n q t)", () => {
    fc.assert(fc.property(anySign, anySign, magnitude, magnitude, anySign, (current, fluxDensity, carrierDensity, thickness, carrierCharge) => {
      const want = exact(current).times(exact(fluxDensity)).div(exact(carrierDensity).times(exact(carrierCharge)).times(exact(thickness)));
      agrees(hallVoltage, { current, fluxDensity, carrierDensity, thickness, carrierCharge }, want, 3 * EPS);
    }), { numRuns: RUNS });
  });

  it("the cyclotron frequency is within 4 ulp of |q| B / (2 pi (m + T/c^2))", () => {
    fc.assert(fc.property(anySign, magnitude, magnitude, fc.oneof(fc.constant(0), magnitude), (charge, mass, fluxDensity, kineticEnergy) => {
      const gm = exact(mass).plus(exact(kineticEnergy).div(C.pow(2)));
      agrees(cyclotronFrequency, { charge, mass, fluxDensity, kineticEnergy }, exact(charge).abs().times(exact(fluxDensity)).div(PI.times(2).times(gm)), 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("the gyroradius is within 2 ulp of m v / (|q| B)", () => {
    fc.assert(fc.property(magnitude, speed, anySign, magnitude, (mass, v, charge, fluxDensity) => {
      const want = exact(mass).times(exact(v)).div(exact(charge).abs().times(exact(fluxDensity)));
      agrees(gyroradius, { mass, speed: v, charge, fluxDensity }, want, 2 * EPS);
    }), { numRuns: RUNS });
  });

  it("the relativistic gyroradius is within 4 ulp of sqrt(T (T + 2 m c^2)) / (c |q| B)", () => {
    fc.assert(fc.property(magnitude, fc.oneof(fc.constant(0), magnitude), anySign, magnitude, (mass, kineticEnergy, charge, fluxDensity) => {
      const t = exact(kineticEnergy);
      const want = t.times(t.plus(exact(mass).times(C.pow(2)).times(2))).sqrt().div(C.times(exact(charge).abs()).times(exact(fluxDensity)));
      agrees(relativisticGyroradius, { mass, kineticEnergy, charge, fluxDensity }, want, 4 * EPS);
    }), { numRuns: RUNS });
  });

  it("keeps the issue's reproducers: squares and products that overflow or underflow before the result does", () => {
    // B^2 underflows for 1e-160 T although the pressure, 4e-315 Pa, is subnormal: out_of_range or that subnormal.
    agrees(magneticPressure, { fluxDensity: 1e-160 }, exact(1e-160).pow(2).div(MU0.times(2)), 2 * EPS);
    // I1 I2 overflows: 1e200 A with 1e200 A at 1e200 m.
    agrees(parallelWiresForce, { current1: 1e200, current2: 1e200, separation: 1e200, length: 1e-100 },
      MU0.div(PI.times(2)).times(exact(1e200)).times(exact(1e200)).times(exact(1e-100)).div(exact(1e200)), 4 * EPS);
    // n q t underflows: a 1e-300 m sheet with 1e-10 carriers of 1e-19 C.
    agrees(hallVoltage, { current: 1e-300, fluxDensity: 1e-10, carrierDensity: 1e-10, thickness: 1e-300, carrierCharge: -1.602176634e-19 },
      exact(1e-300).times(exact(1e-10)).div(exact(1e-10).times(exact(-1.602176634e-19)).times(exact(1e-300))), 3 * EPS);
    // A 1e300 kg "particle" at 1e308 J: T + 2 m c^2 overflows.
    const t = exact(1e308);
    agrees(relativisticGyroradius, { mass: 1e300, kineticEnergy: 1e308, charge: 1, fluxDensity: 1 },
      t.times(t.plus(exact(1e300).times(C.pow(2)).times(2))).sqrt().div(C), 4 * EPS);
    expect(() => lorentzForce({ charge: 1e300 as never, electricField: [1e300, 0, 0] as never, velocity: [0, 0, 0] as never, fluxDensity: [0, 0, 0] as never }))
      .toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as Error);
  });

  it("reports the worst error measured per formula (in eps)", () => {
    console.log(`force worst relative error / eps: ${[...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`).join(", ")}`);
    expect(worst.size).toBe(9);
  });
});
