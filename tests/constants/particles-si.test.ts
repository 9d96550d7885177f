import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { codata2022 } from "../../src/constants/codata.js";
import { constantDecimal, uncertaintyDecimal } from "../../src/constants/decimal.js";
import * as constants from "../../src/constants/index.js";
import {
  PARTICLES, alphaParticle, deuteron, electron, muon, neutron, positron, proton,
} from "../../src/constants/particles.js";
import * as si from "../../src/constants/si.js";
import { expectClose } from "../helpers/reference.js";

describe("plain SI numbers used by formulas (si.ts)", () => {
  // Each number must be the CODATA 2022 record's value exactly (same double).
  const PAIRS: readonly (readonly [keyof typeof si, keyof typeof codata2022])[] = [
    ["SPEED_OF_LIGHT", "speedOfLight"],
    ["ELEMENTARY_CHARGE", "elementaryCharge"],
    ["PLANCK", "planckConstant"],
    ["BOLTZMANN", "boltzmannConstant"],
    ["MU0", "vacuumPermeability"],
    ["EPSILON0", "vacuumPermittivity"],
    ["ELECTRON_MASS", "electronMass"],
    ["PROTON_MASS", "protonMass"],
    ["NEUTRON_MASS", "neutronMass"],
    ["ATOMIC_MASS_CONSTANT", "atomicMassConstant"],
    ["ALPHA_PARTICLE_MASS", "alphaParticleMass"],
    ["DEUTERON_MASS", "deuteronMass"],
    ["MUON_MASS", "muonMass"],
  ];

  it.each(PAIRS)("%s equals CODATA 2022 %s", (name, key) => {
    expect(si[name]).toBe(codata2022[key].value);
  });

  it("every number exported by si.ts is checked against a record", () => {
    expect(Object.keys(si).sort()).toEqual(PAIRS.map(([n]) => n).sort());
  });
});

describe("particle presets", () => {
  it("charge-to-mass of the electron equals CODATA 2022 -e/m_e within its relative uncertainty", () => {
    const q = codata2022.electronChargeToMassQuotient;
    expectClose(electron.charge / electron.mass, {
      name: "electron e/m", expected: q.value, tolerance: q.relativeUncertainty,
      source: "CODATA 2022 electron charge to mass quotient -1.75882000838(55)e11 C/kg",
    });
  });

  it("charge-to-mass of the proton equals CODATA 2022 e/m_p within its uncertainty (9.5788331430(30)e7 C/kg)", () => {
    // CODATA 2022 proton charge to mass quotient (NIST listing, web version 9.0).
    const D = Decimal.clone({ precision: 40 });
    const published = new D("9.5788331430e7");
    const u = new D("0.0000000030e7");
    expect(new D(proton.charge / proton.mass).minus(published).abs().lte(u)).toBe(true);
  });

  it("charges are signed whole multiples of the exact elementary charge", () => {
    const e = codata2022.elementaryCharge.value;
    expect(electron.charge).toBe(-e);
    expect(positron.charge).toBe(e);
    expect(proton.charge).toBe(e);
    expect(neutron.charge).toBe(0);
    expect(alphaParticle.charge).toBe(2 * e);
    expect(deuteron.charge).toBe(e);
    expect(muon.charge).toBe(-e);
    for (const p of Object.values(PARTICLES)) expect(p.charge).toBe(p.chargeNumber * e);
  });

  it("masses are the CODATA 2022 values", () => {
    expect(electron.mass).toBe(codata2022.electronMass.value);
    expect(positron.mass).toBe(codata2022.electronMass.value);
    expect(proton.mass).toBe(codata2022.protonMass.value);
    expect(neutron.mass).toBe(codata2022.neutronMass.value);
    expect(alphaParticle.mass).toBe(codata2022.alphaParticleMass.value);
    expect(deuteron.mass).toBe(codata2022.deuteronMass.value);
    expect(muon.mass).toBe(codata2022.muonMass.value);
  });

  it("mass ratios agree with CODATA 2022's published ratios", () => {
    // CODATA 2022 (NIST listing, web version 9.0): proton-electron mass ratio
    // 1836.152673426(32), muon-electron 206.7682827(46), alpha particle-electron
    // 7294.29954171(17), deuteron-electron 3670.482967655(63), neutron-electron 1838.68366200(74).
    // The quotient of two masses each rounded to 11 digits is good to about 1e-10.
    const cases = [
      [proton, 1836.152673426],
      [muon, 206.7682827],
      [alphaParticle, 7294.29954171],
      [deuteron, 3670.482967655],
      [neutron, 1838.6836620],
    ] as const;
    for (const [p, ratio] of cases) {
      expectClose(p.mass / electron.mass, { name: `${p.name}/electron mass`, expected: ratio, tolerance: 1e-9, source: "CODATA 2022 mass ratio" });
    }
  });

  it("presets are frozen and listed in PARTICLES", () => {
    expect(Object.isFrozen(PARTICLES)).toBe(true);
    expect(Object.keys(PARTICLES).sort()).toEqual(["alphaParticle", "deuteron", "electron", "muon", "neutron", "positron", "proton"]);
    for (const p of Object.values(PARTICLES)) {
      expect(Object.isFrozen(p)).toBe(true);
      expect(Number.isFinite(p.charge) && p.mass > 0).toBe(true);
    }
  });
});

describe("decimal helpers", () => {
  it("keep every published digit whatever the working precision", () => {
    const D5 = Decimal.clone({ precision: 5 });
    expect(constantDecimal(codata2022.vacuumPermeability, D5).toString()).toBe("0.00000125663706127");
    expect(uncertaintyDecimal(codata2022.vacuumPermeability, D5).toString()).toBe("2e-16");
    expect(uncertaintyDecimal(codata2022.speedOfLight).isZero()).toBe(true);
  });
});

describe("constants index", () => {
  it("exports the records, particles and SI numbers but not the decimal.js helpers", () => {
    const names = Object.keys(constants);
    for (const n of ["codata2022", "codata2018", "CODATA_EDITIONS", "constant", "PARTICLES", "electron", "MU0"]) expect(names).toContain(n);
    expect(names).not.toContain("constantDecimal");
  });
});
