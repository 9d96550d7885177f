import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  capacitorDisplacementCurrent, chargingCapacitorField, conductionDisplacementRatio, dielectricRelaxationFrequency,
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
        // A subnormal rate gives a current below the smallest double: out_of_range (tested in extremes-accuracy).
        fc.pre(dvdt === 0 || Math.abs(dvdt) > 1e-250);
        const cap = parallelPlateCapacitance({ area: area as Area, gap: m(gap), relativePermittivity: er });
        const lead = capacitorDisplacementCurrent({ capacitance: cap, voltageRate: dvdt as VoltageRate });
        // Electric flux through the gap: Phi = E A = (V/d) A, so dPhi/dt = A (dV/dt)/d.
        const gapCurrent = displacementCurrent({ electricFluxRate: ((area * dvdt) / gap) as ElectricFluxRate, relativePermittivity: er });
        expect(relativeError(gapCurrent, lead)).toBeLessThanOrEqual(1e-14);
      }),
    );
  });

  it("equals the conduction current in the leads of a charging RC circuit at every instant", () => {
    // V(t) = V0 (1 - exp(-t/RC)); lead current (V0/R) exp(-t/RC) (RC charging, common practice).
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

describe("conductionDisplacementRatio and dielectricRelaxationFrequency", () => {
  it("gives the loss ratio of seawater (4 S/m, epsr 81) as sigma / (2 pi f eps0 epsr) from 1 kHz to 100 GHz", () => {
    // Seawater: sigma 4 S/m and epsr 81 are the usual low-frequency values (from memory; ITU-R P.527
    // gives curves). The expected values are a decimal.js oracle of the loss ratio sigma/(omega eps)
    // (Cheng 1989, section 8-3, from memory), not printed numbers.
    const want = (f: number) => D(4).div(PI.times(2).times(f).times(EPS0).times(81)).toNumber();
    checkCases(
      [1e3, 1e6, 1e9, 1e11].map((f) => ({ input: f, expected: want(f), tolerance: 4 * Number.EPSILON, source: "decimal.js oracle of sigma / (2 pi f eps0 epsr)" })),
      (f) => conductionDisplacementRatio({ conductivity: S(4), relativePermittivity: 81, frequency: Hz(f) }),
    );
    // Seawater conducts at 1 MHz (ratio about 900) and is a dielectric at 100 GHz (common practice).
    expect(conductionDisplacementRatio({ conductivity: S(4), relativePermittivity: 81, frequency: Hz(1e6) })).toBeGreaterThan(100);
    expect(conductionDisplacementRatio({ conductivity: S(4), relativePermittivity: 81, frequency: Hz(1e11) })).toBeLessThan(0.01);
  });

  it("puts the crossover of standard seawater near 1 GHz (TEOS-10 conductivity 4.2914 S/m at S = 35, 15 C)", () => {
    // Conductivity of standard seawater: 42.9140 mS/cm (Culkin and Smith 1980; UNESCO 1983; TEOS-10 gsw_C3515).
    // Relative permittivity about 81 at low frequency (from memory).
    const f = dielectricRelaxationFrequency({ conductivity: S(4.2914), relativePermittivity: 81 });
    expectClose(f, { expected: d(4.2914).div(PI.times(2).times(EPS0).times(81)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" });
    expect(f).toBeGreaterThan(0.9e9);
    expect(f).toBeLessThan(1e9);
    // At this frequency water already disperses: the warning says so.
    expect(dielectricRelaxationFrequency.details({ conductivity: S(4.2914), relativePermittivity: 81 }).warnings.map((w) => w.code)).toEqual(["dispersion"]);
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
    const fw = dielectricRelaxationFrequency({ conductivity: S(5.5e-6), relativePermittivity: 78 });
    expect(fw).toBeGreaterThan(1e3);
    expect(fw).toBeLessThan(2e3);
  });

  it("gives a ratio of exactly one at the crossover frequency", () => {
    fc.assert(
      fc.property(pos(1e-9, 1e3), pos(1, 200), (sigma, er) => {
        const f = dielectricRelaxationFrequency({ conductivity: S(sigma), relativePermittivity: er });
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
  it("gives the field of a 1 A charging current between 5 cm plates, inside and outside, as the Ampere-Maxwell law", () => {
    // A decimal.js oracle of the Ampere-Maxwell law on a circle about the axis (Griffiths 2013, section 7.3.2,
    // from memory): B = mu0 I r / (2 pi R^2) inside, mu0 I / (2 pi r) outside. Not a printed number.
    const B = (r: number) => chargingCapacitorField({ current: A(1), plateRadius: m(0.05), radialDistance: m(r) });
    // mu0/(2 pi) was exactly 2e-7 T m/A before 2019 (CODATA 2022 mu0 differs by about 1e-10 relative).
    expectClose(B(0.025), { expected: 2e-6, tolerance: 1e-9, source: "mu0/(2 pi) = 2e-7 T m/A (pre-2019 SI) x 1 A x 0.025 m / (0.05 m)^2" });
    expectClose(B(0.1), { expected: 2e-6, tolerance: 1e-9, source: "mu0/(2 pi) = 2e-7 T m/A (pre-2019 SI) x 1 A / 0.1 m" });
  });

  it("is mu0 I r/(2 pi R^2) inside and mu0 I/(2 pi r) outside, as a decimal.js oracle", () => {
    checkCases(
      [
        { input: { r: 0.025 }, expected: MU0.times(0.025).div(PI.times(2).times(D(0.05).pow(2))).toNumber(), tolerance: 1e-15, source: "decimal.js oracle of mu0 I r / (2 pi R^2), Ampere-Maxwell law (Griffiths 2013, section 7.3.2, from memory)" },
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
  it("gives 1 A through 100 pF at 10 V/ns and cautions on touch current from 0.5 mA (IEC 62368-1 ES1, from memory)", () => {
    const r = evaluate("parasiticCouplingCurrent", { capacitance: "100 pF", voltageSlewRate: "10 V/ns" });
    expectClose(r.value as number, { expected: 1, tolerance: 1e-12, source: "C dV/dt = 100e-12 F * 1e10 V/s" });
    expect(r.cautions.map((c) => c.code)).toEqual(["touch_current"]);
    expect(r.cautions[0]!.message).toContain("IEC 60990");
    expect(r.cautions[0]!.message).toContain("0.5 mA");
    // A 4.7 nF Y capacitor on 230 V 50 Hz mains: peak dV/dt = 2 pi 50 x 325 V = 1.02e5 V/s, 0.48 mA: just below.
    expect(evaluate("parasiticCouplingCurrent", { capacitance: "4.7 nF", voltageSlewRate: 2 * Math.PI * 50 * 325 }).cautions).toEqual([]);
    expect(evaluate("parasiticCouplingCurrent", { capacitance: "10 nF", voltageSlewRate: 2 * Math.PI * 50 * 325 }).cautions.map((c) => c.code)).toEqual(["touch_current"]);
    // A 1 pF stray capacitance on a slow edge carries no caution (it fired on everything before).
    expect(evaluate("parasiticCouplingCurrent", { capacitance: "1 pF", voltageSlewRate: "1 V/us" }).cautions).toEqual([]);
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
