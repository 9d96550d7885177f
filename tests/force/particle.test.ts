import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  cyclotronFrequency, driftVelocity, evaluate, FormulaError, gyroradius, quantity, relativisticGyroradius,
  type Charge, type ElectricField, type Energy, type FluxDensity, type Vec3, type Velocity,
} from "../../src/index.js";
import { alphaParticle, constant, electron, proton } from "../../src/constants/index.js";
import { ELECTRON_MASS, SPEED_OF_LIGHT } from "../../src/constants/si.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { C, D, E, ME } from "./oracle.js";

const c = SPEED_OF_LIGHT;
const T = (v: number) => v as FluxDensity;
const J = (v: number) => v as Energy;
const mps = (v: number) => v as Velocity;
const GAUSS = 1e-4;
const EV = 1.602176634e-19;
const vecE = (v: readonly number[]) => v as unknown as Vec3<ElectricField>;
const vecB = (v: readonly number[]) => v as unknown as Vec3<FluxDensity>;
const PRESETS = [electron, proton, alphaParticle] as const;
const preset = fc.constantFrom(...PRESETS);

describe("cyclotronFrequency", () => {
  it("reproduces the CODATA 2022 electron charge-to-mass quotient: 2 pi f / B = |e/m_e|", () => {
    const f = cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: quantity(1, "T") });
    // CODATA 2022: e/m_e = -1.758 820 008 38(55) e11 C/kg (the record below holds the published string).
    expectClose(2 * Math.PI * f, { expected: 1.75882000838e11, tolerance: 1e-9, source: "CODATA 2022 electron charge-to-mass quotient" });
    expect(constant("electronChargeToMassQuotient").decimal).toBe("-1.75882000838e11");
  });

  it("is about 15.2 MHz for a proton in 1 T (derived from CODATA 2022 q/m_p)", () => {
    const f = cyclotronFrequency({ charge: proton.charge, mass: proton.mass, fluxDensity: quantity(1, "T") });
    // CODATA 2022 proton charge-to-mass quotient 9.578 833 1430(30) e7 C/kg; f = (q/m_p) B / (2 pi).
    expectClose(f, { expected: 9.578833143e7 / (2 * Math.PI), tolerance: 1e-9, source: "derived from CODATA 2022 e/m_p" });
    expect(f / 1e6).toBeCloseTo(15.2, 1);
  });

  it("matches the plasma-formulary gyrofrequencies per gauss: 1.76e7 rad/s (electron), 9.58e3 rad/s (proton)", () => {
    // NRL Plasma Formulary, fundamental plasma parameters: omega_ce = 1.76e7 B, omega_ci = 9.58e3 Z mu^-1 B
    // rad/s with B in gauss (three significant figures).
    const we = 2 * Math.PI * cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: T(GAUSS) });
    const wp = 2 * Math.PI * cyclotronFrequency({ charge: proton.charge, mass: proton.mass, fluxDensity: T(GAUSS) });
    expectClose(we, { expected: 1.76e7, tolerance: 3e-3, source: "NRL Plasma Formulary, omega_ce" });
    expectClose(wp, { expected: 9.58e3, tolerance: 3e-3, source: "NRL Plasma Formulary, omega_ci (Z = 1, mu = 1)" });
  });

  it("does not depend on the speed (non-relativistic): 2 pi r / v is the same period 1/f at every speed", () => {
    fc.assert(
      fc.property(preset, fc.double({ min: 1, max: 0.01 * c, noNaN: true }), fc.double({ min: 1e-6, max: 20, noNaN: true }), (p, v, b) => {
        const f = cyclotronFrequency({ charge: p.charge, mass: p.mass, fluxDensity: T(b) });
        const r = gyroradius({ mass: p.mass, speed: mps(v), charge: p.charge, fluxDensity: T(b) });
        expect(relativeError((2 * Math.PI * r) / v, 1 / f)).toBeLessThan(1e-14);
      }),
    );
  });

  it("falls by gamma = 1 + T/(m c^2) when a kinetic energy is given", () => {
    fc.assert(
      fc.property(preset, fc.double({ min: 0, max: 1e-9, noNaN: true }), (p, t) => {
        const f0 = cyclotronFrequency({ charge: p.charge, mass: p.mass, fluxDensity: T(1) });
        const f = cyclotronFrequency({ charge: p.charge, mass: p.mass, fluxDensity: T(1), kineticEnergy: J(t) });
        const gamma = 1 + t / (p.mass * c * c);
        expect(relativeError(f * gamma, f0)).toBeLessThan(1e-14);
      }),
    );
  });

  it("takes particle presets in typed code and plain SI or unit strings through evaluate", () => {
    const typed = cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: quantity(0.1, "T") });
    const r = evaluate("cyclotronFrequency", { charge: electron.charge, mass: "9.1093837139e-31 kg", fluxDensity: "1 kG" });
    expectClose(r.value as number, { expected: typed, tolerance: 1e-12, source: "same inputs, typed and evaluate" });
    expect(r.cautions.map((x) => x.code)).toEqual(["strong_field"]);
  });
});

describe("gyroradius", () => {
  it("matches the plasma-formulary electron gyroradius 2.38 T_e^1/2 / B cm (T_e in eV, B in gauss)", () => {
    // NRL Plasma Formulary: r_e = 2.38 T_e^1/2 B^-1 cm with the thermal speed v_Te = (k T_e / m_e)^1/2 (from memory).
    const v = Math.sqrt(EV / ELECTRON_MASS); // 1 eV
    const r = gyroradius({ mass: electron.mass, speed: mps(v), charge: electron.charge, fluxDensity: T(GAUSS) });
    expectClose(r, { expected: 2.38e-2, tolerance: 3e-3, source: "NRL Plasma Formulary, r_e at 1 eV, 1 G (from memory)" });
  });

  it("gives 5.686 mm for an electron at 1e6 m/s in 1 mT, as a decimal.js oracle of m v/(|q| B)", () => {
    const r = gyroradius({ mass: electron.mass, speed: quantity(1e6, "m/s"), charge: electron.charge, fluxDensity: quantity(1, "mT") });
    expectClose(r, { expected: ME.times(1e6).div(E.times("1e-3")).toNumber(), tolerance: 1e-15, source: "decimal.js oracle, CODATA 2022 m_e" });
  });

  it("warns above 0.1 c with the size of the relativistic error", () => {
    const d = gyroradius.details({ mass: electron.mass, speed: mps(0.5 * c), charge: electron.charge, fluxDensity: T(1) });
    // gamma(0.5 c) = 1.1547; 1 - 1/gamma = 13.4 %.
    expect(d.warnings[0]!.code).toBe("relativistic_speed");
    expect(d.warnings[0]!.message).toContain("13 %");
    expect(gyroradius.details({ mass: electron.mass, speed: mps(0.05 * c), charge: electron.charge, fluxDensity: T(1) }).warnings).toEqual([]);
  });

  it("rejects a speed at c, a zero charge and a zero field with their rules", () => {
    const code = (f: () => unknown) => { try { f(); } catch (e) { return (e as FormulaError).code; } return undefined; };
    expect(code(() => gyroradius({ mass: electron.mass, speed: mps(c), charge: electron.charge, fluxDensity: T(1) }))).toBe("out_of_domain");
    expect(code(() => gyroradius({ mass: electron.mass, speed: mps(1), charge: 0 as Charge, fluxDensity: T(1) }))).toBe("out_of_domain");
    expect(code(() => gyroradius({ mass: electron.mass, speed: mps(1), charge: electron.charge, fluxDensity: T(0) }))).toBe("out_of_domain");
  });
});

describe("relativisticGyroradius", () => {
  it("gives the rigidity B r = 3.3356 T m of a 1 GeV/c electron (p/e with p = 1e9 eV/c, exact SI c and e)", () => {
    // pc = 1 GeV: T = sqrt((1 GeV)^2 + (m_e c^2)^2) - m_e c^2, in decimal.js.
    const mc2 = ME.times(C.pow(2));
    const pc = E.times(1e9);
    const t = pc.pow(2).plus(mc2.pow(2)).sqrt().minus(mc2);
    const r = relativisticGyroradius({ mass: electron.mass, kineticEnergy: J(t.toNumber()), charge: electron.charge, fluxDensity: T(1) });
    expectClose(r, { expected: D.div(1e9, C).toNumber(), tolerance: 1e-13, source: "B rho = p/e = 1e9 V / c = 3.33564 T m (exact SI)" });
  });

  it("gives 4.744 cm for a 1 MeV electron in 0.1 T, as a decimal.js oracle of sqrt(T(T + 2mc^2))/(c|q|B)", () => {
    const t = E.times(1e6);
    const expected = t.times(t.plus(ME.times(C.pow(2)).times(2))).sqrt().div(C.times(E).times("0.1"));
    const r = relativisticGyroradius({ mass: electron.mass, kineticEnergy: quantity(1, "MeV"), charge: electron.charge, fluxDensity: quantity(0.1, "T") });
    expectClose(r, { expected: expected.toNumber(), tolerance: 1e-14, source: "decimal.js oracle" });
  });

  it("tends to the non-relativistic gyroradius as T -> 0 (ratio sqrt(1 + T/(2 m c^2)))", () => {
    fc.assert(
      fc.property(preset, fc.double({ min: 1e-300, max: 1e-6, noNaN: true }), fc.double({ min: 1e-4, max: 10, noNaN: true }), (p, tau, b) => {
        const t = tau * p.mass * c * c; // T/(m c^2) = tau
        const v = Math.sqrt((2 * t) / p.mass); // non-relativistic speed of kinetic energy T
        const rel = relativisticGyroradius({ mass: p.mass, kineticEnergy: J(t), charge: p.charge, fluxDensity: T(b) });
        const nr = gyroradius({ mass: p.mass, speed: mps(v), charge: p.charge, fluxDensity: T(b) });
        expect(relativeError(rel, nr)).toBeLessThan(tau / 4 + 1e-14);
      }),
    );
  });

  it("equals gamma times the non-relativistic radius at the same speed, at any energy", () => {
    fc.assert(
      fc.property(preset, fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (p, tau) => {
        const mc2 = D(p.mass).times(C.pow(2));
        const gamma = D(1).plus(tau);
        const v = C.times(D(1).minus(D(1).div(gamma.pow(2))).sqrt()).toNumber();
        const rel = relativisticGyroradius({ mass: p.mass, kineticEnergy: J(mc2.times(tau).toNumber()), charge: p.charge, fluxDensity: T(1) });
        const nr = gyroradius({ mass: p.mass, speed: mps(v), charge: p.charge, fluxDensity: T(1) });
        expect(relativeError(rel, gamma.toNumber() * nr)).toBeLessThan(1e-13);
      }),
    );
  });

  it("carries the beam caution from 5 keV (X-rays where the beam stops; common practice, from memory), not below", () => {
    const at = (t: string) => evaluate("relativisticGyroradius", { mass: electron.mass, kineticEnergy: t, charge: electron.charge, fluxDensity: "0.1 mT" });
    expect(at("10 MeV").cautions.map((x) => x.code)).toEqual(["particle_beam"]);
    expect(at("5 keV").cautions.map((x) => x.code)).toEqual(["particle_beam"]);
    expect(at("4.9 keV").cautions).toEqual([]);
    expect(at("10 MeV").cautions[0]!.message).toContain("5 keV");
    expect(at("10 MeV").cautions[0]!.message).toMatch(/licensed practice govern/);
  });

  it("uses the library's one strong-field rule (ICNIRP thresholds, from 200 uT) on the flux density", () => {
    const notes = (b: string) => evaluate("cyclotronFrequency", { charge: proton.charge, mass: proton.mass, fluxDensity: b }).cautions;
    expect(notes("100 uT")).toEqual([]);
    expect(notes("1 mT").map((x) => x.code)).toEqual(["strong_field"]);
    expect(notes("1 mT")[0]!.message).toContain("ICNIRP");
    expect(notes("1 mT")[0]!.message).toContain("0.5 mT");
  });
});

describe("driftVelocity", () => {
  it("is E/B along E x B for perpendicular fields, whatever the charge", () => {
    const v = driftVelocity({ electricField: vecE([1e3, 0, 0]), fluxDensity: vecB([0, 0, 0.01]) });
    // x-hat cross z-hat = -y-hat.
    expect(v[0]).toBe(0);
    expect(v[2]).toBe(0);
    expectClose(v[1]!, { expected: -1e5, tolerance: 1e-15, source: "E/B = 1e3 / 0.01, Jackson section 12.3" });
  });

  it("is perpendicular to E and B and keeps only the perpendicular part of E", () => {
    const comp = fc.double({ min: -1e4, max: 1e4, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(comp, comp, comp), fc.tuple(comp, comp, comp).filter((b) => Math.hypot(...b) > 1e-2), (e, b) => {
        let v: readonly number[];
        try {
          v = driftVelocity({ electricField: vecE(e), fluxDensity: vecB(b) });
        } catch (err) {
          // out_of_range is right only when every component of E x B / B^2 (decimal.js,
          // the exact cross product of the double inputs) rounds to zero: below half the
          // smallest subnormal, 2^-1075.
          expect((err as FormulaError).code).toBe("out_of_range");
          const [ex, ey, ez] = e.map((c) => new D(c));
          const [bx, by, bz] = b.map((c) => new D(c));
          const b2 = bx!.pow(2).plus(by!.pow(2)).plus(bz!.pow(2));
          const exact = [ey!.times(bz!).minus(ez!.times(by!)), ez!.times(bx!).minus(ex!.times(bz!)), ex!.times(by!).minus(ey!.times(bx!))];
          for (const c of exact) expect(c.div(b2).abs().lte(new D(2).pow(-1075))).toBe(true);
          return;
        }
        const nb = Math.hypot(...b), ne = Math.hypot(...e), nv = Math.hypot(...v);
        const vb = v[0]! * b[0] + v[1]! * b[1] + v[2]! * b[2];
        const ve = v[0]! * e[0] + v[1]! * e[1] + v[2]! * e[2];
        expect(Math.abs(vb)).toBeLessThanOrEqual(1e-13 * nv * nb + 1e-300);
        expect(Math.abs(ve)).toBeLessThanOrEqual(1e-13 * nv * ne + 1e-300);
        // |v| = |E_perp| / |B| = |E x B| / B^2.
        const cx = [e[1] * b[2] - e[2] * b[1], e[2] * b[0] - e[0] * b[2], e[0] * b[1] - e[1] * b[0]];
        // The slack covers subnormal E (e.g. 5e-324), where the plain cross product in
        // this check underflows but the library's scaled form does not.
        expect(Math.abs(nv - Math.hypot(...cx) / (nb * nb))).toBeLessThanOrEqual(1e-12 * (ne / nb) + 1e-300);
      }),
    );
  });

  it("warns that no drift frame exists when E/B reaches c, and when E has a part along B", () => {
    const fast = driftVelocity.details({ electricField: vecE([4e8, 0, 0]), fluxDensity: vecB([0, 0, 1]) });
    expect(fast.warnings.map((w) => w.code)).toEqual(["no_drift_frame"]);
    const tilted = driftVelocity.details({ electricField: vecE([1e3, 0, 1e2]), fluxDensity: vecB([0, 0, 0.01]) });
    expect(tilted.warnings.map((w) => w.code)).toEqual(["parallel_electric_field"]);
    const slow = driftVelocity.details({ electricField: vecE([1e3, 0, 0]), fluxDensity: vecB([0, 0, 0.01]) });
    expect(slow.warnings).toEqual([]);
  });

  it("rejects a zero flux density", () => {
    expect(() => driftVelocity({ electricField: vecE([1, 0, 0]), fluxDensity: vecB([0, 0, 0]) })).toThrow(FormulaError);
  });

  it("does not overflow for extreme fields (no B^2 formed)", () => {
    const v = driftVelocity({ electricField: vecE([1e-200, 0, 0]), fluxDensity: vecB([0, 0, 1e-200]) });
    expectClose(-v[1]!, { expected: 1, tolerance: 1e-15, source: "E/B = 1" });
  });
});
