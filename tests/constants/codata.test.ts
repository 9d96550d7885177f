import Decimal from "decimal.js";
import * as mathjs from "mathjs";
import { describe, expect, it } from "vitest";
import {
  CODATA_EDITIONS, CODATA_KEYS, CODATA_REFERENCES, codata2018, codata2022, constant,
  type CodataEdition, type CodataKey,
} from "../../src/constants/codata.js";
import { FormulaError } from "../../src/core/errors.js";
import { expectClose } from "../helpers/reference.js";

const D = Decimal.clone({ precision: 40 });
const dec = (s: string): Decimal => new D(s.replace(/ /g, ""));

// Published value, standard uncertainty, relative standard uncertainty.
// Source: CODATA 2022 recommended values, NIST Fundamental Physical Constants,
// web version 9.0 (E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, 2024),
// physics.nist.gov/constants; paper: P. J. Mohr et al., "CODATA Recommended
// Values of the Fundamental Physical Constants: 2022" (arXiv:2409.03787), Rev. Mod. Phys. 97,
// 025002 (2025; journal reference from memory). Read from a stored machine-generated copy of the NIST listing
// (value, uncertainty and relative uncertainty per constant). Digit groups as NIST prints them.
const PUBLISHED_2022: Record<CodataKey, readonly [string, string, string]> = {
  speedOfLight: ["299 792 458", "0", "0"],
  planckConstant: ["6.626 070 15 e-34", "0", "0"],
  elementaryCharge: ["1.602 176 634 e-19", "0", "0"],
  boltzmannConstant: ["1.380 649 e-23", "0", "0"],
  avogadroConstant: ["6.022 140 76 e23", "0", "0"],
  electronVolt: ["1.602 176 634 e-19", "0", "0"],
  vacuumPermeability: ["1.256 637 061 27 e-6", "0.000 000 000 20 e-6", "1.6e-10"],
  vacuumPermittivity: ["8.854 187 8188 e-12", "0.000 000 0014 e-12", "1.6e-10"],
  vacuumImpedance: ["376.730 313 412", "0.000 000 059", "1.6e-10"],
  fineStructureConstant: ["7.297 352 5643 e-3", "0.000 000 0011 e-3", "1.6e-10"],
  electronMass: ["9.109 383 7139 e-31", "0.000 000 0028 e-31", "3.1e-10"],
  protonMass: ["1.672 621 925 95 e-27", "0.000 000 000 52 e-27", "3.1e-10"],
  neutronMass: ["1.674 927 500 56 e-27", "0.000 000 000 85 e-27", "5.1e-10"],
  atomicMassConstant: ["1.660 539 068 92 e-27", "0.000 000 000 52 e-27", "3.1e-10"],
  alphaParticleMass: ["6.644 657 3450 e-27", "0.000 000 0021 e-27", "3.1e-10"],
  deuteronMass: ["3.343 583 7768 e-27", "0.000 000 0010 e-27", "3.1e-10"],
  muonMass: ["1.883 531 627 e-28", "0.000 000 042 e-28", "2.2e-8"],
  electronChargeToMassQuotient: ["-1.758 820 008 38 e11", "0.000 000 000 55 e11", "3.1e-10"],
  bohrMagneton: ["9.274 010 0657 e-24", "0.000 000 0029 e-24", "3.1e-10"],
  nuclearMagneton: ["5.050 783 7393 e-27", "0.000 000 0016 e-27", "3.1e-10"],
};

// Source: CODATA 2018 recommended values, NIST "Fundamental Physical Constants ---
// Complete Listing, 2018 CODATA adjustment" (allascii.txt, web version 8.0, 2019),
// as stored in SciPy's scipy/constants/codata_constants_2018.txt.
const PUBLISHED_2018: Record<CodataKey, readonly [string, string]> = {
  speedOfLight: ["299 792 458", "0"],
  planckConstant: ["6.626 070 15 e-34", "0"],
  elementaryCharge: ["1.602 176 634 e-19", "0"],
  boltzmannConstant: ["1.380 649 e-23", "0"],
  avogadroConstant: ["6.022 140 76 e23", "0"],
  electronVolt: ["1.602 176 634 e-19", "0"],
  vacuumPermeability: ["1.256 637 062 12 e-6", "0.000 000 000 19 e-6"],
  vacuumPermittivity: ["8.854 187 8128 e-12", "0.000 000 0013 e-12"],
  vacuumImpedance: ["376.730 313 668", "0.000 000 057"],
  fineStructureConstant: ["7.297 352 5693 e-3", "0.000 000 0011 e-3"],
  electronMass: ["9.109 383 7015 e-31", "0.000 000 0028 e-31"],
  protonMass: ["1.672 621 923 69 e-27", "0.000 000 000 51 e-27"],
  neutronMass: ["1.674 927 498 04 e-27", "0.000 000 000 95 e-27"],
  atomicMassConstant: ["1.660 539 066 60 e-27", "0.000 000 000 50 e-27"],
  alphaParticleMass: ["6.644 657 3357 e-27", "0.000 000 0020 e-27"],
  deuteronMass: ["3.343 583 7724 e-27", "0.000 000 0010 e-27"],
  muonMass: ["1.883 531 627 e-28", "0.000 000 042 e-28"],
  electronChargeToMassQuotient: ["-1.758 820 010 76 e11", "0.000 000 000 53 e11"],
  bohrMagneton: ["9.274 010 0783 e-24", "0.000 000 0028 e-24"],
  nuclearMagneton: ["5.050 783 7461 e-27", "0.000 000 0015 e-27"],
};

const TABLES = { "2022": codata2022, "2018": codata2018 } as const;

describe("CODATA 2022 records", () => {
  it("hold every value and uncertainty exactly as NIST publishes them", () => {
    expect(Object.keys(codata2022).sort()).toEqual(Object.keys(PUBLISHED_2022).sort());
    for (const key of CODATA_KEYS) {
      const r = codata2022[key];
      const [value, uncertainty] = PUBLISHED_2022[key];
      expect(dec(r.decimal).eq(dec(value)), `${key} value`).toBe(true);
      expect(dec(r.uncertainty).eq(dec(uncertainty)), `${key} uncertainty`).toBe(true);
    }
  });

  it("give relative uncertainties matching NIST's two-digit relative standard uncertainty", () => {
    for (const key of CODATA_KEYS) {
      const r = codata2022[key];
      const published = Number(PUBLISHED_2022[key][2]);
      if (published === 0) {
        expect(r.relativeUncertainty, key).toBe(0);
      } else {
        // NIST rounds u_r from unrounded values; the quotient of the rounded
        // value and uncertainty agrees to within the two-digit rounding (< 7 %).
        expectClose(r.relativeUncertainty, { name: key, expected: published, tolerance: 0.07, source: "CODATA 2022 relative standard uncertainty (NIST listing)" });
      }
    }
  });

  it("carry the number nearest to the decimal string", () => {
    for (const edition of CODATA_EDITIONS) {
      for (const r of Object.values(TABLES[edition])) {
        expect(r.value, r.key).toBe(Number(r.decimal));
        // The double is within half an ulp of the exact decimal.
        const err = dec(r.decimal).minus(new D(r.value)).abs();
        expect(err.lte(new D(Math.abs(r.value) * 2 ** -53)), r.key).toBe(true);
      }
    }
  });
});

describe("CODATA 2018 records", () => {
  it("hold every value and uncertainty exactly as the NIST 2018 listing gives them", () => {
    for (const key of CODATA_KEYS) {
      const r = codata2018[key];
      const [value, uncertainty] = PUBLISHED_2018[key];
      expect(dec(r.decimal).eq(dec(value)), `${key} value`).toBe(true);
      expect(dec(r.uncertainty).eq(dec(uncertainty)), `${key} uncertainty`).toBe(true);
    }
  });

  // mathjs 15.2.0 ships CODATA 2018 values for these constants (checked one by one:
  // its neutronMass 1.6749271613e-27 and deuteronMass 3.3435830926e-27 are the
  // 1998 values, and its electron volt 1.602176565e-19 J is 2010, so those are not used).
  const math = mathjs as unknown as Record<string, { value: number } | number>;
  const si = (name: string): number => {
    const v = math[name];
    if (typeof v === "number") return v;
    return (v as unknown as mathjs.Unit).toSI().value as unknown as number;
  };
  const MATHJS: readonly (readonly [CodataKey, string])[] = [
    ["speedOfLight", "speedOfLight"],
    ["planckConstant", "planckConstant"],
    ["elementaryCharge", "elementaryCharge"],
    ["boltzmannConstant", "boltzmann"],
    ["avogadroConstant", "avogadro"],
    ["vacuumPermeability", "magneticConstant"],
    ["vacuumPermittivity", "electricConstant"],
    ["fineStructureConstant", "fineStructure"],
    ["electronMass", "electronMass"],
    ["protonMass", "protonMass"],
    ["atomicMassConstant", "atomicMass"],
    ["bohrMagneton", "bohrMagneton"],
    ["nuclearMagneton", "nuclearMagneton"],
  ];

  it.each(MATHJS)("%s agrees with mathjs's %s to the digits mathjs gives", (key, name) => {
    expectClose(codata2018[key].value, { name: key, input: name, expected: si(name), tolerance: 1e-15, source: `mathjs 15.2.0 constant ${name} (CODATA 2018)` });
  });

  it("characteristic impedance of vacuum agrees with mathjs's vacuumImpedance within one unit of the last published digit", () => {
    // mathjs gives 376.730313667 (mu0 c from the rounded mu0); CODATA 2018 publishes 376.730313668.
    expect(Math.abs(codata2018.vacuumImpedance.value - si("vacuumImpedance"))).toBeLessThanOrEqual(1.0000001e-9);
  });
});

describe("consistency of the electromagnetic constants (decimal.js, 40 digits)", () => {
  // The unit of the last published digit of a decimal string: "8.8541878188e-12" -> 1e-22.
  const lastDigit = (s: string): Decimal => {
    const [mantissa, exp = "0"] = s.toLowerCase().split("e");
    const places = (mantissa!.split(".")[1] ?? "").length;
    return new D(10).pow(Number(exp) - places);
  };

  it.each(CODATA_EDITIONS)("eps0 = 1/(mu0 c^2) to the last published digit (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const mu0 = dec(t.vacuumPermeability.decimal);
    const c = dec(t.speedOfLight.decimal);
    const eps0 = dec(t.vacuumPermittivity.decimal);
    const computed = D.div(1, mu0.times(c.pow(2)));
    // Both published values are rounded: half a unit of eps0's last digit plus
    // mu0's half-unit rounding carried through d(eps0)/d(mu0) = -eps0/mu0.
    const bound = lastDigit(t.vacuumPermittivity.decimal).div(2)
      .plus(lastDigit(t.vacuumPermeability.decimal).div(2).times(eps0).div(mu0));
    expect(computed.minus(eps0).abs().lte(bound), `${computed} vs ${eps0}`).toBe(true);
  });

  it.each(CODATA_EDITIONS)("Z0 = mu0 c to the last published digit (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const mu0 = dec(t.vacuumPermeability.decimal);
    const c = dec(t.speedOfLight.decimal);
    const z0 = dec(t.vacuumImpedance.decimal);
    const computed = mu0.times(c);
    const bound = lastDigit(t.vacuumImpedance.decimal).div(2).plus(lastDigit(t.vacuumPermeability.decimal).div(2).times(c));
    expect(computed.minus(z0).abs().lte(bound), `${computed} vs ${z0}`).toBe(true);
  });

  it.each(CODATA_EDITIONS)("mu0 = 2 alpha h / (e^2 c) within the published uncertainty (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const computed = dec(t.fineStructureConstant.decimal).times(2).times(dec(t.planckConstant.decimal))
      .div(dec(t.elementaryCharge.decimal).pow(2).times(dec(t.speedOfLight.decimal)));
    expect(computed.minus(dec(t.vacuumPermeability.decimal)).abs().lte(dec(t.vacuumPermeability.uncertainty))).toBe(true);
  });

  it.each(CODATA_EDITIONS)("-e/m_e agrees with e and m_e within its standard uncertainty (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const computed = dec(t.elementaryCharge.decimal).div(dec(t.electronMass.decimal)).neg();
    const published = dec(t.electronChargeToMassQuotient.decimal);
    expect(computed.minus(published).abs().lte(dec(t.electronChargeToMassQuotient.uncertainty))).toBe(true);
  });

  it.each(CODATA_EDITIONS)("mu_B = e hbar / (2 m_e) within its standard uncertainty (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const pi = D.acos(-1);
    const computed = dec(t.elementaryCharge.decimal).times(dec(t.planckConstant.decimal))
      .div(pi.times(4).times(dec(t.electronMass.decimal)));
    expect(computed.minus(dec(t.bohrMagneton.decimal)).abs().lte(dec(t.bohrMagneton.uncertainty))).toBe(true);
  });
});

describe("exact constants", () => {
  // SI Brochure, 9th ed. (BIPM 2019), the defining constants (section number from memory): c, h, e, k and N_A are fixed
  // numbers; the electron volt is e joules exactly.
  const DEFINING: readonly CodataKey[] = ["speedOfLight", "planckConstant", "elementaryCharge", "boltzmannConstant", "avogadroConstant", "electronVolt"];

  it.each(CODATA_EDITIONS)("are exactly the SI defining constants, with uncertainty \"0\" (CODATA %s)", (edition) => {
    const t = TABLES[edition];
    const exact = CODATA_KEYS.filter((k) => t[k].exact);
    expect(exact.sort()).toEqual([...DEFINING].sort());
    for (const key of CODATA_KEYS) {
      const r = t[key];
      expect(r.uncertainty === "0", key).toBe(r.exact);
      expect(r.relativeUncertainty === 0, key).toBe(r.exact);
    }
  });

  it("the electron volt is the elementary charge in joules", () => {
    for (const edition of CODATA_EDITIONS) {
      expect(dec(TABLES[edition].electronVolt.decimal).eq(dec(TABLES[edition].elementaryCharge.decimal))).toBe(true);
    }
  });

  it("mu0 is no longer exactly 4 pi 1e-7 N/A^2 but within 1e-9 relative of it", () => {
    const fourPi = D.acos(-1).times(4e-7);
    for (const edition of CODATA_EDITIONS) {
      const rel = dec(TABLES[edition].vacuumPermeability.decimal).minus(fourPi).div(fourPi).abs();
      expect(rel.gt(0) && rel.lt(1e-9), edition).toBe(true);
    }
  });
});

describe("constant()", () => {
  it("returns the 2022 record by default and the 2018 record when asked", () => {
    expect(constant("vacuumPermeability")).toBe(codata2022.vacuumPermeability);
    expect(constant("vacuumPermeability", "2018")).toBe(codata2018.vacuumPermeability);
    expect(constant("electronMass").edition).toBe("2022");
  });

  it("records and tables are frozen", () => {
    expect(Object.isFrozen(codata2022)).toBe(true);
    expect(Object.isFrozen(codata2018)).toBe(true);
    expect(Object.isFrozen(codata2022.electronMass)).toBe(true);
    expect(() => {
      (codata2022.electronMass as { value: number }).value = 1;
    }).toThrow(TypeError);
  });

  it("each edition has a reference", () => {
    for (const edition of CODATA_EDITIONS) expect(CODATA_REFERENCES[edition]).toContain(`${edition} CODATA Recommended Values`);
  });

  const bad: readonly (readonly [string, unknown, unknown])[] = [
    ["key", "lightSpeed", "2022"],
    ["key", "__proto__", "2022"],
    ["key", "toString", "2018"],
    ["key", 42, "2022"],
    ["edition", "speedOfLight", "2014"],
    ["edition", "speedOfLight", 2022],
    ["edition", "speedOfLight", null],
  ];
  it.each(bad)("rejects a bad %s with FormulaError invalid_argument", (input, key, edition) => {
    let err: unknown;
    try {
      constant(key as CodataKey, edition as CodataEdition);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(FormulaError);
    expect((err as FormulaError).code).toBe("invalid_argument");
    expect((err as FormulaError).input).toBe(input);
  });
});
