import { FormulaError } from "../core/errors.js";

/**
 * CODATA recommended values of the fundamental physical constants, 2022
 * (the default) and 2018, as records: the published value as an exact decimal
 * string, its standard uncertainty, the SI unit, and the value as a number.
 *
 * Formulas do not read these records; they use the plain numbers in ./si.ts
 * (tests check the two agree). Use these records to cite a value, to compare
 * editions, or to compute with more digits (see ./decimal.ts).
 *
 * Since the 2019 SI, c, h, e, k and N_A are exact by definition; mu0 and eps0
 * are measured (through the fine-structure constant) and carry an uncertainty.
 */

/** The CODATA adjustments held here, newest (the default) first. */
export const CODATA_EDITIONS = ["2022", "2018"] as const;

/** A CODATA adjustment year. */
export type CodataEdition = (typeof CODATA_EDITIONS)[number];

/** Where each edition's values are published. */
export const CODATA_REFERENCES: Readonly<Record<CodataEdition, string>> = Object.freeze({
  "2022":
    "E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, The 2022 CODATA Recommended Values of the Fundamental Physical Constants (web version 9.0, NIST, 2024), physics.nist.gov/constants; P. J. Mohr et al., CODATA Recommended Values of the Fundamental Physical Constants: 2022, Rev. Mod. Phys. 97, 025002 (2025)",
  "2018":
    "E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, The 2018 CODATA Recommended Values of the Fundamental Physical Constants (web version 8.0, NIST, 2019), physics.nist.gov/constants; Rev. Mod. Phys. 93, 025010 (2021)",
});

/** One recommended value of one CODATA edition. */
export interface CodataRecord {
  /** camelCase key, e.g. "vacuumPermeability". */
  readonly key: CodataKey;
  /** The quantity's name as CODATA lists it. */
  readonly name: string;
  /** Usual symbol in plain text, e.g. "mu0". */
  readonly symbol: string;
  /** The published value as an exact decimal string, e.g. "1.25663706127e-6". */
  readonly decimal: string;
  /** Standard uncertainty as a decimal string in the same unit; "0" when exact. */
  readonly uncertainty: string;
  /** SI unit symbol ("" for a pure number). */
  readonly unit: string;
  /** True for values fixed by the definition of the SI (and values derived exactly from them). */
  readonly exact: boolean;
  /** The value as the nearest double. */
  readonly value: number;
  /** Standard uncertainty divided by |value|; 0 when exact. */
  readonly relativeUncertainty: number;
  readonly edition: CodataEdition;
}

// Name, symbol and unit are the same in both editions.
const META = {
  speedOfLight: ["speed of light in vacuum", "c", "m s^-1"],
  planckConstant: ["Planck constant", "h", "J Hz^-1"],
  elementaryCharge: ["elementary charge", "e", "C"],
  boltzmannConstant: ["Boltzmann constant", "k", "J K^-1"],
  avogadroConstant: ["Avogadro constant", "N_A", "mol^-1"],
  electronVolt: ["electron volt", "eV", "J"],
  vacuumPermeability: ["vacuum magnetic permeability", "mu0", "N A^-2"],
  vacuumPermittivity: ["vacuum electric permittivity", "eps0", "F m^-1"],
  vacuumImpedance: ["characteristic impedance of vacuum", "Z0", "ohm"],
  fineStructureConstant: ["fine-structure constant", "alpha", ""],
  electronMass: ["electron mass", "m_e", "kg"],
  protonMass: ["proton mass", "m_p", "kg"],
  neutronMass: ["neutron mass", "m_n", "kg"],
  atomicMassConstant: ["atomic mass constant", "m_u", "kg"],
  alphaParticleMass: ["alpha particle mass", "m_alpha", "kg"],
  deuteronMass: ["deuteron mass", "m_d", "kg"],
  muonMass: ["muon mass", "m_mu", "kg"],
  electronChargeToMassQuotient: ["electron charge to mass quotient", "-e/m_e", "C kg^-1"],
  bohrMagneton: ["Bohr magneton", "mu_B", "J T^-1"],
  nuclearMagneton: ["nuclear magneton", "mu_N", "J T^-1"],
} as const;

/** Key of a constant held in every edition. */
export type CodataKey = keyof typeof META;

type Row = readonly [decimal: string, uncertainty: string];
type Rows = Readonly<Record<CodataKey, Row>>;

// Values and uncertainties exactly as published (digit groups joined, the
// uncertainty written with the value's power of ten), so each line can be read
// against the table.
const EXACT = "0";

// Exact since the 2019 SI (defining constants, and the electronvolt from e): the same in both editions.
const DEFINING = {
  speedOfLight: ["299792458", EXACT],
  planckConstant: ["6.62607015e-34", EXACT],
  elementaryCharge: ["1.602176634e-19", EXACT],
  boltzmannConstant: ["1.380649e-23", EXACT],
  avogadroConstant: ["6.02214076e23", EXACT],
  electronVolt: ["1.602176634e-19", EXACT],
} as const;

// CODATA 2022 (NIST web version 9.0, May 2024).
const ROWS_2022: Rows = {
  ...DEFINING,
  vacuumPermeability: ["1.25663706127e-6", "0.00000000020e-6"],
  vacuumPermittivity: ["8.8541878188e-12", "0.0000000014e-12"],
  vacuumImpedance: ["376.730313412", "0.000000059"],
  fineStructureConstant: ["7.2973525643e-3", "0.0000000011e-3"],
  electronMass: ["9.1093837139e-31", "0.0000000028e-31"],
  protonMass: ["1.67262192595e-27", "0.00000000052e-27"],
  neutronMass: ["1.67492750056e-27", "0.00000000085e-27"],
  atomicMassConstant: ["1.66053906892e-27", "0.00000000052e-27"],
  alphaParticleMass: ["6.6446573450e-27", "0.0000000021e-27"],
  deuteronMass: ["3.3435837768e-27", "0.0000000010e-27"],
  muonMass: ["1.883531627e-28", "0.000000042e-28"],
  electronChargeToMassQuotient: ["-1.75882000838e11", "0.00000000055e11"],
  bohrMagneton: ["9.2740100657e-24", "0.0000000029e-24"],
  nuclearMagneton: ["5.0507837393e-27", "0.0000000016e-27"],
};

// CODATA 2018 (NIST web version 8.0, May 2019).
const ROWS_2018: Rows = {
  ...DEFINING,
  vacuumPermeability: ["1.25663706212e-6", "0.00000000019e-6"],
  vacuumPermittivity: ["8.8541878128e-12", "0.0000000013e-12"],
  vacuumImpedance: ["376.730313668", "0.000000057"],
  fineStructureConstant: ["7.2973525693e-3", "0.0000000011e-3"],
  electronMass: ["9.1093837015e-31", "0.0000000028e-31"],
  protonMass: ["1.67262192369e-27", "0.00000000051e-27"],
  neutronMass: ["1.67492749804e-27", "0.00000000095e-27"],
  atomicMassConstant: ["1.66053906660e-27", "0.00000000050e-27"],
  alphaParticleMass: ["6.6446573357e-27", "0.0000000020e-27"],
  deuteronMass: ["3.3435837724e-27", "0.0000000010e-27"],
  muonMass: ["1.883531627e-28", "0.000000042e-28"],
  electronChargeToMassQuotient: ["-1.75882001076e11", "0.00000000053e11"],
  bohrMagneton: ["9.2740100783e-24", "0.0000000028e-24"],
  nuclearMagneton: ["5.0507837461e-27", "0.0000000015e-27"],
};

function buildEdition(edition: CodataEdition, rows: Rows): Readonly<Record<CodataKey, CodataRecord>> {
  const out = {} as Record<CodataKey, CodataRecord>;
  for (const key of Object.keys(META) as CodataKey[]) {
    const [name, symbol, unit] = META[key];
    const [decimal, uncertainty] = rows[key];
    const value = Number(decimal);
    const u = Number(uncertainty);
    out[key] = Object.freeze({
      key, name, symbol, decimal, uncertainty, unit,
      exact: uncertainty === EXACT,
      value,
      relativeUncertainty: u / Math.abs(value),
      edition,
    });
  }
  return Object.freeze(out);
}

/** CODATA 2022 recommended values (the library's default edition), keyed by camelCase name. */
export const codata2022 = /* @__PURE__ */ buildEdition("2022", ROWS_2022);

/** CODATA 2018 recommended values, keyed by camelCase name. */
export const codata2018 = /* @__PURE__ */ buildEdition("2018", ROWS_2018);

/** Keys of every constant held, in table order. */
export const CODATA_KEYS: readonly CodataKey[] = /* @__PURE__ */ Object.freeze(Object.keys(META) as CodataKey[]);

/**
 * A constant's record from a CODATA edition (2022 unless named).
 * Unknown keys or editions are FormulaError "invalid_argument" naming `key` or `edition`.
 *
 * @example
 * constant("vacuumPermeability").decimal; // "1.25663706127e-6"
 * constant("vacuumPermeability", "2018").value; // 1.25663706212e-6
 */
export function constant(key: CodataKey, edition: CodataEdition = "2022"): CodataRecord {
  const table = edition === "2022" ? codata2022 : edition === "2018" ? codata2018 : undefined;
  if (table === undefined) {
    throw new FormulaError("invalid_argument", {
      input: "edition", value: edition, detail: `${describe(edition)} is not a CODATA edition held here; use one of ${CODATA_EDITIONS.join(", ")}`,
    });
  }
  if (typeof key !== "string" || !Object.hasOwn(table, key)) {
    throw new FormulaError("invalid_argument", {
      input: "key", value: key, detail: `${describe(key)} is not a constant held here; use one of ${CODATA_KEYS.join(", ")}`,
    });
  }
  return table[key];
}

function describe(v: unknown): string {
  return typeof v === "string" ? JSON.stringify(v.length > 40 ? `${v.slice(0, 37)}...` : v) : String(typeof v);
}
