import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  capacitorDisplacementCurrent, chargingCapacitorField, conductionDisplacementRatio, crossoverFrequency,
  displacementCurrent, displacementCurrentDensity, evaluate, parallelPlateCapacitance, parasiticCouplingCurrent, quantity,
  type Area, type Capacitance, type Conductivity, type Current, type ElectricField, type ElectricFluxRate,
  type Frequency, type Length, type VoltageRate,
} from "../../src/index.js";
import { EPSILON0 } from "../../src/constants/si.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, d, EPS0, MU0, PI } from "../force/oracle.js";

const S = (v: number) => v as Conductivity;
const Hz = (v: number) => v as Frequency;
const m = (v: number) => v as Length;
const A = (v: number) => v as Current;
const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true });

describe("displacementCurrent", () => {
  it("is eps0 epsr dPhi/dt, as a decimal.js oracle", () => {
    checkCases(
      [
        { input: { rate: 1e12, er: 1 }, expected: EPS0.times(1e12).toNumber(), tolerance: 1e-15, source: "decimal.js oracle, CODATA 2022 eps0" },
        { input: { rate: -3.7e9, er: 4.4 }, expected: EPS0.times(-3.7e9).times(4.4).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" },
      ],
      (x) => displacementCurrent({ electricFluxRate: x.rate as ElectricFluxRate, relativePermittivity: x.er }),
    );
  });
});

describe("capacitorDisplacementCurrent", () => {
  it("equals eps A dE/dt between parallel plates with E = V/d (parallelPlateCapacitance)", () => {
    fc.assert(
      fc.property(pos(1e-6, 1), pos(1e-6, 1e-2), pos(1, 100), fc.double({ min: -1e12, max: 1e12, noNaN: true }), (area, gap, er, dvdt) => {
        const cap = parallelPlateCapacitance({ area: area as Area, gap: m(gap), relativePermittivity: er });
        const lead = capacitorDisplacementCurrent({ capacitance: cap, voltageRate: dvdt as VoltageRate });
        // Electric flux through the gap: Phi = E A = (V/d) A, so dPhi/dt = A (dV/dt)/d.
        const gapCurrent = displacementCurrent({ electricFluxRate: ((area * dvdt) / gap) as ElectricFluxRate, relativePermittivity: er });
        expect(relativeError(gapCurrent, lead)).toBeLessThanOrEqual(1e-14);
      }),
    );
  });

  it("equals the conduction current in the leads of a charging RC circuit at every instant", () => {
    // V(t) = V0 (1 - exp(-t/RC)); lead current (V0/R) exp(-t/RC) (Griffiths section 7.3.2 set-up).
    const cap = parallelPlateCapacitance({ area: quantity(1, "m^2"), gap: quantity(1, "mm") }); // ≈ 8.85 nF
    const R = 1e3, V0 = 100, tau = R * cap;
    for (const t of [0, 0.3 * tau, tau, 3 * tau]) {
      const h = 1e-4 * tau;
      const v = (u: number) => V0 * -Math.expm1(-u / tau);
      const dvdt = (v(t + h) - v(t - h)) / (2 * h); // central difference, error ~ (h/tau)^2 / 6
      const displacement = capacitorDisplacementCurrent({ capacitance: cap, voltageRate: dvdt as VoltageRate });
      expectClose(displacement, { expected: (V0 / R) * Math.exp(-t / tau), tolerance: 1e-7, source: "RC charging current, V0/R exp(-t/RC)" });
    }
  });
});

describe("displacementCurrentDensity", () => {
  it("is omega eps E0, as a decimal.js oracle, and warns about dispersion above 100 MHz", () => {
    const j = displacementCurrentDensity({ relativePermittivity: 81, frequency: quantity(1, "MHz"), fieldAmplitude: 1 as ElectricField });
    expectClose(j, { expected: PI.times(2e6).times(EPS0).times(81).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" });
    expect(displacementCurrentDensity.details({ relativePermittivity: 81, frequency: Hz(1e9), fieldAmplitude: 1 as ElectricField }).warnings.map((w) => w.code)).toEqual(["dispersion"]);
  });

  it("gives the conduction/displacement ratio when divided into sigma E0", () => {
    fc.assert(
      fc.property(pos(1e-6, 10), pos(1, 100), pos(1, 1e10), (sigma, er, f) => {
        const jd = displacementCurrentDensity({ relativePermittivity: er, frequency: Hz(f), fieldAmplitude: 1 as ElectricField });
        const ratio = conductionDisplacementRatio({ conductivity: S(sigma), relativePermittivity: er, frequency: Hz(f) });
        expect(relativeError(sigma / jd, ratio)).toBeLessThanOrEqual(1e-14);
      }),
    );
  });
});

describe("conductionDisplacementRatio and crossoverFrequency", () => {
  it("match the seawater textbook answers: ratio 8.9e5, 888, 0.89, 8.9e-3 at 1 kHz, 1 MHz, 1 GHz, 100 GHz", () => {
    // F. T. Ulaby, Fundamentals of Applied Electromagnetics, Problem 6.18: seawater with eps = 81 eps0 and
    // sigma = 4 S/m (statement as stored; the answers are from memory, two significant figures).
    checkCases(
      [
        { input: 1e3, expected: 8.9e5, tolerance: 0.01, source: "Ulaby, Problem 6.18(a) (answer from memory)" },
        { input: 1e6, expected: 888, tolerance: 0.002, source: "Ulaby, Problem 6.18(b) (answer from memory)" },
        { input: 1e9, expected: 0.89, tolerance: 0.01, source: "Ulaby, Problem 6.18(c) (answer from memory)" },
        { input: 1e11, expected: 8.9e-3, tolerance: 0.01, source: "Ulaby, Problem 6.18(d) (answer from memory)" },
      ],
      (f) => conductionDisplacementRatio({ conductivity: S(4), relativePermittivity: 81, frequency: Hz(f) }),
    );
  });

  it("puts the crossover of standard seawater near 1 GHz (TEOS-10 conductivity 4.2914 S/m at S = 35, 15 C)", () => {
    // Conductivity of standard seawater: 42.9140 mS/cm (Culkin and Smith 1980; UNESCO 1983; TEOS-10 gsw_C3515).
    // Relative permittivity about 81 at low frequency (from memory).
    const f = crossoverFrequency({ conductivity: S(4.2914), relativePermittivity: 81 });
    expectClose(f, { expected: d(4.2914).div(PI.times(2).times(EPS0).times(81)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" });
    expect(f).toBeGreaterThan(0.9e9);
    expect(f).toBeLessThan(1e9);
    // At this frequency water already disperses: the warning says so.
    expect(crossoverFrequency.details({ conductivity: S(4.2914), relativePermittivity: 81 }).warnings.map((w) => w.code)).toEqual(["dispersion"]);
  });

  it("orders ground and water as ITU-R P.527 describes: seawater conducts, very dry ground is a dielectric at 10 MHz", () => {
    // Low-frequency values of ITU-R P.527 (from memory): seawater sigma 5 S/m, epsr 70; wet ground 1e-2, 30;
    // medium dry ground 1e-3, 15; very dry ground 1e-4, 3; distilled water 5.5e-6 S/m (25 C), epsr 78.
    const at10MHz = (sigma: number, er: number) => conductionDisplacementRatio({ conductivity: S(sigma), relativePermittivity: er, frequency: Hz(1e7) });
    expect(at10MHz(5, 70)).toBeGreaterThan(100);
    expect(at10MHz(1e-2, 30)).toBeGreaterThan(0.5);
    expect(at10MHz(1e-3, 15)).toBeLessThan(0.2);
    expect(at10MHz(1e-4, 3)).toBeLessThan(0.1);
    // Distilled water crosses over at about 1.3 kHz: a dielectric at any radio frequency.
    const fw = crossoverFrequency({ conductivity: S(5.5e-6), relativePermittivity: 78 });
    expect(fw).toBeGreaterThan(1e3);
    expect(fw).toBeLessThan(2e3);
  });

  it("gives a ratio of exactly one at the crossover frequency", () => {
    fc.assert(
      fc.property(pos(1e-9, 1e3), pos(1, 200), (sigma, er) => {
        const f = crossoverFrequency({ conductivity: S(sigma), relativePermittivity: er });
        expect(Math.abs(conductionDisplacementRatio({ conductivity: S(sigma), relativePermittivity: er, frequency: f }) - 1)).toBeLessThanOrEqual(4e-16 * 4);
      }),
    );
  });

  it("falls as 1/f", () => {
    fc.assert(
      fc.property(pos(1e-6, 10), pos(1, 100), pos(1, 1e9), pos(1.5, 1e3), (sigma, er, f, k) => {
        const r1 = conductionDisplacementRatio({ conductivity: S(sigma), relativePermittivity: er, frequency: Hz(f) });
        const rk = conductionDisplacementRatio({ conductivity: S(sigma), relativePermittivity: er, frequency: Hz(k * f) });
        expect(relativeError(rk * k, r1)).toBeLessThanOrEqual(1e-15);
      }),
    );
  });
});

describe("chargingCapacitorField", () => {
  it("matches the textbook capacitor: R = 1 m plates, 1 nF, 1 Mohm from 2 V, B at 0.5 m after 1 ms is 0.74e-13 T", () => {
    // NCERT Physics Part I (class XII), Example 8.1 (statement as stored; answer 0.74e-13 T from memory):
    // charging current at t = RC is (V/R) e^-1.
    const i = (2 / 1e6) * Math.exp(-1);
    const b = chargingCapacitorField({ current: A(i), plateRadius: m(1), radialDistance: m(0.5) });
    expectClose(b, { expected: 0.74e-13, tolerance: 0.01, source: "NCERT Physics XII Part I, Example 8.1 (answer from memory)" });
  });

  it("is mu0 I r/(2 pi R^2) inside and mu0 I/(2 pi r) outside, as a decimal.js oracle", () => {
    checkCases(
      [
        { input: { r: 0.025 }, expected: MU0.times(0.025).div(PI.times(2).times(D(0.05).pow(2))).toNumber(), tolerance: 1e-15, source: "decimal.js oracle, Ampere-Maxwell (Griffiths Problem 7.34)" },
        { input: { r: 0.2 }, expected: MU0.div(PI.times(2).times(0.2)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle, field of a long wire" },
        { input: { r: 0 }, expected: 0, tolerance: 0, source: "no enclosed displacement current on the axis" },
      ],
      (x) => chargingCapacitorField({ current: A(1), plateRadius: m(0.05), radialDistance: m(x.r) }),
    );
  });

  it("is continuous at the plate edge, grows linearly inside and falls as 1/r outside", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e3, max: 1e3, noNaN: true }).filter((i) => Math.abs(i) > 1e-9), pos(1e-3, 10), pos(0.01, 0.99), (i, R, u) => {
        const at = (r: number) => chargingCapacitorField({ current: A(i), plateRadius: m(R), radialDistance: m(r) });
        const edge = at(R);
        expect(relativeError(at(R * (1 + 1e-12)), edge)).toBeLessThan(1e-11);
        expect(relativeError(at(u * R), u * edge)).toBeLessThan(1e-14);
        expect(relativeError(at(R / u), u * edge)).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("parasiticCouplingCurrent", () => {
  it("gives 1 A through 100 pF at 10 V/ns and carries the leakage and EMC caution", () => {
    const r = evaluate("parasiticCouplingCurrent", { capacitance: "100 pF", voltageSlewRate: "10 V/ns" });
    expectClose(r.value as number, { expected: 1, tolerance: 1e-12, source: "C dV/dt = 100e-12 F * 1e10 V/s" });
    expect(r.cautions[0]!.code).toBe("leakage_and_emc");
    expect(r.cautions[0]!.message).toContain("IEC 60990");
  });

  it("is linear in C and in dV/dt and equals the capacitor displacement current", () => {
    fc.assert(
      fc.property(pos(1e-15, 1e-6), pos(1e-3, 1e12), fc.boolean(), (cap, mag, negative) => {
        const rate = negative ? -mag : mag;
        const i = parasiticCouplingCurrent({ capacitance: cap as Capacitance, voltageSlewRate: rate as VoltageRate });
        expect(i).toBe(capacitorDisplacementCurrent({ capacitance: cap as Capacitance, voltageRate: rate as VoltageRate }));
        expect(relativeError(parasiticCouplingCurrent({ capacitance: (2 * cap) as Capacitance, voltageSlewRate: rate as VoltageRate }), 2 * i)).toBe(0);
      }),
    );
  });
});

// eps0 of the formulas and of the CODATA record agree.
it("uses the CODATA 2022 vacuum permittivity", () => {
  expect(EPSILON0).toBe(EPS0.toNumber());
});
