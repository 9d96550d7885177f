// Beam and plasma formulas: published values (CODATA 2022 rest energies, the
// exact SI values of c and e, the NRL Plasma Formulary's numerical forms),
// decimal.js oracles of the published equations, and properties.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  bendingRadius, childLangmuirCurrentDensity, debyeLength, evaluate, lorentzFactor, magneticRigidity, particleMomentum,
  particleSpeed, perveance, plasmaFrequency, quantity, solveRequest, quadrupoleFocalLength, gyroradius, relativisticGyroradius, formatQuantity,
  type Area, type Current, type Energy, type FluxDensity, type FluxDensityGradient, type Length, type MagneticRigidity, type Momentum,
  type NumberDensity, type Temperature, type Voltage,
} from "../../src/index.js";
import { electron, proton } from "../../src/constants/index.js";
import { ELEMENTARY_CHARGE, SPEED_OF_LIGHT } from "../../src/constants/si.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { codeOf } from "../helpers/errors.js";
import { createNotebookMath } from "../../src/notebook/index.js";
import { C, D, ME } from "../force/oracle.js";

const J = (v: number) => v as Energy;
const eV = ELEMENTARY_CHARGE;
/** m_e c^2 = 0.51099895069 MeV (CODATA 2022, electron mass energy equivalent in MeV). */
const ME_C2_MEV = new D("0.51099895069");

describe("relativistic kinematics", () => {
  it("gives the electron's gamma, speed and momentum at 1 MeV from the CODATA 2022 rest energy 0.51099895069 MeV", () => {
    const g = new D(1).plus(new D(1).div(ME_C2_MEV));
    const beta = new D(1).minus(new D(1).div(g.pow(2))).sqrt();
    const t = { kineticEnergy: J(1e6 * eV), mass: electron.mass };
    // The rest energy from m_e c^2 in joules agrees with the MeV figure to its 11 digits: 1e-10 tolerance.
    expectClose(lorentzFactor(t), { expected: g.toNumber(), tolerance: 1e-10, source: "CODATA 2022 m_e c^2 = 0.51099895069 MeV" });
    expectClose(particleSpeed(t), { expected: beta.times(SPEED_OF_LIGHT).toNumber(), tolerance: 1e-10, source: "CODATA 2022 m_e c^2; c exact" });
    // p c = sqrt(T (T + 2 m c^2)) in MeV, to kg m/s with e and c exact.
    const pc = new D(1).times(new D(1).plus(ME_C2_MEV.times(2))).sqrt();
    expectClose(particleMomentum(t), { expected: pc.times(1e6).times(eV).div(SPEED_OF_LIGHT).toNumber(), tolerance: 1e-10, source: "CODATA 2022 m_e c^2; E^2 = (pc)^2 + (mc^2)^2" });
  });

  it("keeps full precision at a kinetic energy of 1e-12 of the rest energy (no cancellation)", () => {
    const e0 = ME.times(C.pow(2)); // decimal.js, CODATA 2022 m_e, c exact
    const T = e0.times("1e-12").toNumber();
    const t = new D(T).div(e0); // the exact ratio for the double T
    const x = { kineticEnergy: J(T), mass: electron.mass };
    expectClose(lorentzFactor(x) - 1, { expected: t.toNumber(), tolerance: 1e-4, source: "gamma - 1 = t; the sum 1 + 1e-12 keeps 4 digits of t" });
    expectClose(particleSpeed(x), { expected: t.times(t.plus(2)).sqrt().div(t.plus(1)).times(C).toNumber(), tolerance: 4 * Number.EPSILON, source: "decimal.js oracle of c sqrt(t(2+t))/(1+t)" });
    expectClose(particleMomentum(x), { expected: ME.times(C).times(t.times(t.plus(2)).sqrt()).toNumber(), tolerance: 4 * Number.EPSILON, source: "decimal.js oracle of m c sqrt(t(2+t))" });
  });

  it("agrees with the non-relativistic limits and with the existing gyroradius formulas", () => {
    fc.assert(fc.property(fc.double({ min: 1e-20, max: 1e-10, noNaN: true }), (T) => {
      const x = { kineticEnergy: J(T), mass: electron.mass };
      const v = particleSpeed(x);
      const p = particleMomentum(x);
      // p = gamma m v exactly (a relation between the three results).
      expect(relativeError(p, lorentzFactor(x) * (electron.mass as number) * v)).toBeLessThan(8 * Number.EPSILON);
      const r = bendingRadius({ momentum: p as Momentum, charge: electron.charge, fluxDensity: 0.01 as FluxDensity });
      const rg = relativisticGyroradius({ mass: electron.mass, kineticEnergy: J(T), charge: electron.charge, fluxDensity: 0.01 as FluxDensity });
      expect(relativeError(r, rg)).toBeLessThan(8 * Number.EPSILON);
    }));
    const slow = { kineticEnergy: J(1e-25), mass: proton.mass };
    const vClassical = Math.sqrt((2 * 1e-25) / (proton.mass as number));
    expect(relativeError(particleSpeed(slow), vClassical)).toBeLessThan(1e-10);
    expect(relativeError(gyroradius({ mass: proton.mass, speed: particleSpeed(slow), charge: proton.charge, fluxDensity: 1 as FluxDensity }),
      bendingRadius({ momentum: particleMomentum(slow), charge: proton.charge, fluxDensity: 1 as FluxDensity }))).toBeLessThan(1e-10);
  });

  it("stays below c and increases with energy", () => {
    fc.assert(fc.property(fc.double({ min: -30, max: 30, noNaN: true }), (p) => {
      const e0 = (electron.mass as number) * SPEED_OF_LIGHT ** 2;
      const v1 = particleSpeed({ kineticEnergy: J(e0 * 10 ** p), mass: electron.mass });
      const v2 = particleSpeed({ kineticEnergy: J(e0 * 10 ** p * 1.5), mass: electron.mass });
      expect(v1).toBeLessThanOrEqual(SPEED_OF_LIGHT);
      expect(v2).toBeGreaterThanOrEqual(v1);
    }));
  });
});

describe("beam optics", () => {
  it("gives a rigidity of 3.3356 T m per GeV/c per elementary charge (1e9 / c, c exact; CODATA)", () => {
    const p = (1e9 * eV) / SPEED_OF_LIGHT; // 1 GeV/c in kg m/s
    expectClose(magneticRigidity({ momentum: p as Momentum, charge: proton.charge }), { expected: 1e9 / 299792458, tolerance: 2 * Number.EPSILON, source: "B rho = p/e, 1e9/c T m with c exact (SI)" });
    expect(magneticRigidity({ momentum: p as Momentum, charge: proton.charge }).toFixed(4)).toBe("3.3356");
    // Doubly charged: half the rigidity.
    expectClose(magneticRigidity({ momentum: p as Momentum, charge: (2 * eV) as never }), { expected: 0.5e9 / 299792458, tolerance: 2 * Number.EPSILON, source: "B rho = p/(2e)" });
    expect(codeOf(() => magneticRigidity({ momentum: p as Momentum, charge: 0 as never }))).toBe("out_of_domain");
  });

  it("bends a 1 GeV/c proton on a 3.3356 m radius in 1 T, and gives the thin-lens focal length B rho / (g l)", () => {
    const p = ((1e9 * eV) / SPEED_OF_LIGHT) as Momentum;
    expectClose(bendingRadius({ momentum: p, charge: proton.charge, fluxDensity: 1 as FluxDensity }), { expected: 1e9 / 299792458, tolerance: 2 * Number.EPSILON, source: "rho = p/(eB), c exact" });
    checkCases([
      { input: [3.3356, 10, 0.2], expected: 1.6678, tolerance: 1e-15, source: "f = B rho/(g l) (Wiedemann 2015, ch. 7; from memory), by hand" },
      { input: [20, 50, 0.5], expected: 0.8, tolerance: 1e-15, source: "f = B rho/(g l), by hand" },
    ], ([r, g, l]) => quadrupoleFocalLength({ rigidity: r as MagneticRigidity, gradient: g as FluxDensityGradient, length: l as Length }));
    const r = evaluate("quadrupoleFocalLength", { rigidity: "1 T m", gradient: "40 T/m", length: "0.3 m" });
    expect(r.warnings.map((w) => w.code)).toEqual(["thick_lens"]);
  });
});

describe("space charge and plasma", () => {
  it("gives the electron Child-Langmuir constant 2.33e-6 A V^-3/2 (NRL Plasma Formulary, from memory)", () => {
    const j = childLangmuirCurrentDensity({ voltage: 1 as Voltage, gap: 1 as Length });
    expect(relativeError(j, 2.334e-6)).toBeLessThan(1e-3);
    // decimal.js oracle of (4 eps0/9) sqrt(2 e / m_e) V^1.5 / d^2 (CODATA 2022).
    const eps0 = new D("8.8541878188e-12");
    const want = eps0.times(4).div(9).times(new D(eV).times(2).div(ME).sqrt()).times(new D(1000).pow(1.5)).div(new D(0.01).pow(2));
    expectClose(childLangmuirCurrentDensity({ voltage: 1000 as Voltage, gap: 0.01 as Length }), { expected: want.toNumber(), tolerance: 4 * Number.EPSILON, source: "decimal.js oracle, Child (1911) / Langmuir (1913)" });
  });

  it("warns where the non-relativistic law fails and cautions about the beam and the voltage", () => {
    const r = evaluate("childLangmuirCurrentDensity", { voltage: "20 kV", gap: "5 mm" });
    expect(r.warnings.map((w) => w.code)).toEqual(["relativistic_energy"]);
    expect(r.cautions.map((c) => c.code).sort()).toEqual(["high_voltage", "particle_beam"]);
    expect(evaluate("childLangmuirCurrentDensity", { voltage: "100 V", gap: "5 mm" }).warnings).toEqual([]);
    // Protons: the same diode passes sqrt(m_e / m_p) of the electron current density.
    const ratio = childLangmuirCurrentDensity({ voltage: 100 as Voltage, gap: 1e-3 as Length, charge: proton.charge, mass: proton.mass }) /
      childLangmuirCurrentDensity({ voltage: 100 as Voltage, gap: 1e-3 as Length });
    expect(relativeError(ratio, Math.sqrt((electron.mass as number) / (proton.mass as number)))).toBeLessThan(4 * Number.EPSILON);
  });

  it("gives f_pe = 8.98 sqrt(n) Hz and lambda_D = 7.43e2 sqrt(T_eV / n_cm3) cm (NRL Plasma Formulary, from memory)", () => {
    expect(relativeError(plasmaFrequency({ density: 1e18 as NumberDensity }), 8.98e9)).toBeLessThan(1e-3);
    // 1 eV = 11604.518 K (e / k_B, exact SI); n = 1e12 cm^-3 = 1e18 m^-3: 7.43e-4 cm.
    expect(relativeError(debyeLength({ temperature: 11604.518 as Temperature, density: 1e18 as NumberDensity }), 7.43e-6)).toBeLessThan(1e-3);
    // The proton plasma frequency is sqrt(m_e/m_p) of the electron's.
    const fp = plasmaFrequency({ density: 1e18 as NumberDensity, charge: proton.charge, mass: proton.mass });
    expect(relativeError(fp / plasmaFrequency({ density: 1e18 as NumberDensity }), Math.sqrt((electron.mass as number) / (proton.mass as number)))).toBeLessThan(4 * Number.EPSILON);
  });

  it("ties the Debye length to the plasma frequency: lambda_D omega_pe = sqrt(k T / m_e) (Chen 2016, sec. 4.3, from memory)", () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 1e9, noNaN: true }), fc.double({ min: 1e6, max: 1e30, noNaN: true }), (T, n) => {
      const lhs = debyeLength({ temperature: T as Temperature, density: n as NumberDensity }) * 2 * Math.PI * plasmaFrequency({ density: n as NumberDensity });
      expect(relativeError(lhs, Math.sqrt((1.380649e-23 * T) / (electron.mass as number)))).toBeLessThan(1e-14);
    }));
  });
});

describe("perveance", () => {
  it("gives a planar diode the perveance (4 eps0/9) sqrt(2e/m_e) A/d^2 at every voltage, tying it to the Child-Langmuir law", () => {
    // decimal.js oracle of the planar-diode perveance (Child 1911, Langmuir 1913; CODATA 2022 eps0, e, m_e): no V left in it.
    const eps0 = new D("8.8541878188e-12");
    fc.assert(fc.property(
      fc.double({ min: -3, max: 6, noNaN: true }), fc.double({ min: -6, max: 0, noNaN: true }), fc.double({ min: -8, max: 2, noNaN: true }),
      (lv, ld, la) => {
        const [voltage, gap, area] = [10 ** lv, 10 ** ld, 10 ** la];
        const current = childLangmuirCurrentDensity({ voltage: voltage as Voltage, gap: gap as Length }) * area;
        const want = eps0.times(4).div(9).times(new D(eV).times(2).div(ME).sqrt()).times(new D(area)).div(new D(gap).pow(2)).toNumber();
        // The current density and the product with the area round a few times each: 16 ulp.
        expect(relativeError(perveance({ current: current as Current, voltage: voltage as Voltage }), want)).toBeLessThan(16 * Number.EPSILON);
      },
    ));
    // The electron constant as handbooks print it: 2.33e-6 A/V^1.5 for A = d^2 (NRL Plasma Formulary, from memory).
    const k = perveance({ current: childLangmuirCurrentDensity({ voltage: 1e4 as Voltage, gap: 1e-2 as Length }) * 1e-4 as Current, voltage: 1e4 as Voltage });
    expect(relativeError(k, 2.334e-6)).toBeLessThan(1e-3);
  });

  it("gives the SLAC 5045 klystron gun, 414 A at 350 kV, its 2.0 microperveance (SLAC klystron data, from memory)", () => {
    checkCases([
      { input: [414, 350e3], expected: 2.0e-6, tolerance: 1e-3, source: "SLAC 5045 klystron: 350 kV, 414 A, 2.0 uK (from memory)" },
      { input: [1, 1], expected: 1, tolerance: 0, source: "K = I / V^(3/2), by hand" },
      { input: [8, 4], expected: 1, tolerance: 0, source: "8 / 4^(3/2) = 1, by hand" },
      { input: [1e-3, 1e4], expected: 1e-9, tolerance: 2 * Number.EPSILON, source: "1e-3 / (1e4)^(3/2), by hand" },
    ], ([i, v]) => perveance({ current: i as Current, voltage: v as Voltage }));
  });

  it("reads and prints its half-integer unit A/V^1.5 with a prefix on the ampere, as guns are quoted", () => {
    const r = evaluate("perveance", { current: "414 A", voltage: "350 kV" });
    expect(r.unit).toBe("A/V^1.5");
    expect(formatQuantity(r.value as number, r.unit)).toBe("1.999 uA/V^1.5");
    expect(formatQuantity(2e-9, "A/V^1.5")).toBe("2 nA/V^1.5");
    // Written back as input (a target for solve), the printed text reads as the same quantity.
    const s = solveRequest({ formula: "perveance", solveFor: "voltage", target: "2 uA/V^1.5", inputs: { current: "414 A" } });
    expect(relativeError(s.value as number, (414 / 2e-6) ** (2 / 3))).toBeLessThan(1e-9);
    expect(quantity(2, "uA/V^1.5")).toBe(2e-6);
    // The notebook's mathjs reads and prints the half-integer unit too.
    expect(String(createNotebookMath().evaluate("perveance(414 A, 350 kV)")).split("\n")[0]).toBe("1.999 uA/V^1.5");
    expect(codeOf(() => solveRequest({ formula: "perveance", solveFor: "voltage", target: "2 uA/V", inputs: { current: "414 A" } }))).toBe("wrong_dimension");
  });

  it("refuses a current or a voltage that is not positive and a current where the voltage goes, naming the input", () => {
    expect(codeOf(() => evaluate("perveance", { current: "1 A", voltage: "0 V" }))).toBe("out_of_domain");
    expect(codeOf(() => evaluate("perveance", { current: "-1 A", voltage: "1 kV" }))).toBe("out_of_domain");
    expect(codeOf(() => evaluate("perveance", { current: "1 A", voltage: "1 kA" }))).toBe("wrong_dimension");
  });
});
