import type { DimensionTypes } from "./types.js";

/**
 * The unit symbols accepted by `quantity()` and `inUnit()` as string literals,
 * with their dimension and SI factor: the one place they are written. Symbols
 * follow mathjs spelling ("u" for micro, "^" for powers) so the same text works
 * in runtime unit strings.
 *
 * This is a finite table, not a grammar: the compiler checks a literal against
 * it, and run-time strings from users go through the unit-string reader instead.
 *
 * The typed path never imports this module at run time: the dimension names
 * would cost about 0.3 kB gzip in a bundle of one typed formula, and the types
 * are all it needs from them. `quantity()` reads the factors from
 * unit-factors.ts, which scripts/gen-unit-factors.ts writes from this table
 * (tests/units/unit-table.test.ts checks that it is current).
 */

// Prefixes as powers of ten: the factor is built as a decimal, never as a product of doubles.
export const PREFIXES = {
  P: 15, T: 12, G: 9, M: 6, k: 3, "": 0, c: -2, m: -3, u: -6, n: -9, p: -12, f: -15,
} as const;
type Prefix = keyof typeof PREFIXES;

// Symbols that take any SI prefix: [dimension, SI factor of the unprefixed symbol].
export const PREFIXABLE = {
  m: ["Length", 1],
  s: ["Time", 1],
  g: ["Mass", 1e-3],
  A: ["Current", 1],
  K: ["Temperature", 1],
  mol: ["Amount", 1],
  Hz: ["Frequency", 1],
  C: ["Charge", 1],
  V: ["Voltage", 1],
  F: ["Capacitance", 1],
  H: ["Inductance", 1],
  ohm: ["Resistance", 1],
  S: ["Conductance", 1],
  Wb: ["MagneticFlux", 1],
  T: ["FluxDensity", 1],
  N: ["Force", 1],
  Pa: ["Pressure", 1],
  J: ["Energy", 1],
  W: ["Power", 1],
  eV: ["Energy", 1.602176634e-19],
  "V/m": ["ElectricField", 1],
  "A/m": ["MagneticFieldStrength", 1],
  "V/s": ["VoltageRate", 1],
  "A/s": ["CurrentRate", 1],
  "m/s": ["Velocity", 1],
  "S/m": ["Conductivity", 1],
  "H/m": ["Permeability", 1],
  "F/m": ["Permittivity", 1],
  "C/m": ["LineChargeDensity", 1],
  "W/m^3": ["PowerDensity", 1],
  // The prefix goes on the ampere, as guns are quoted: "1 uA/V^1.5" (one microperveance).
  "A/V^1.5": ["Perveance", 1],
} as const;
type PrefixableSymbol = keyof typeof PREFIXABLE;

// Symbols that stand as they are.
export const FIXED = {
  "": ["Dimensionless", 1],
  rad: ["Angle", 1],
  mrad: ["Angle", 1e-3],
  deg: ["Angle", Math.PI / 180],
  "m^2": ["Area", 1],
  "cm^2": ["Area", 1e-4],
  "mm^2": ["Area", 1e-6],
  "um^2": ["Area", 1e-12],
  "m^3": ["Volume", 1],
  "cm^3": ["Volume", 1e-6],
  "mm^3": ["Volume", 1e-9],
  "m^4": ["AreaProduct", 1],
  "cm^4": ["AreaProduct", 1e-8],
  "mm^4": ["AreaProduct", 1e-12],
  mil: ["Length", 2.54e-5],
  in: ["Length", 0.0254],
  min: ["Time", 60],
  h: ["Time", 3600],
  "V/us": ["VoltageRate", 1e6],
  "V/ns": ["VoltageRate", 1e9],
  "kV/us": ["VoltageRate", 1e9],
  "A/us": ["CurrentRate", 1e6],
  "A/m^2": ["CurrentDensity", 1],
  "A/mm^2": ["CurrentDensity", 1e6],
  "C/m^2": ["SurfaceChargeDensity", 1],
  "C/m^3": ["ChargeDensity", 1],
  "1/m^3": ["NumberDensity", 1],
  "1/cm^3": ["NumberDensity", 1e6],
  "kW/m^3": ["PowerDensity", 1e3],
  "mW/cm^3": ["PowerDensity", 1e3],
  "km/s": ["Velocity", 1e3],
  "m/s^2": ["Acceleration", 1],
  "kg m/s": ["Momentum", 1],
  "C/kg": ["ChargeToMass", 1],
  "J/T": ["MagneticMoment", 1],
  "N/m": ["Stiffness", 1],
  "T m": ["MagneticRigidity", 1],
  "T/m": ["FluxDensityGradient", 1],
  "1/H": ["Reluctance", 1],
  "A/Wb": ["Reluctance", 1],
  At: ["Current", 1],
  G: ["FluxDensity", 1e-4],
  mG: ["FluxDensity", 1e-7],
  Mx: ["MagneticFlux", 1e-8],
  Oe: ["MagneticFieldStrength", 1000 / (4 * Math.PI)],
  Da: ["Mass", 1.66053906892e-27],
  u: ["Mass", 1.66053906892e-27],
} as const;

type Fixed = typeof FIXED;
type Prefixable = typeof PREFIXABLE;

/** Every unit symbol literal the typed API accepts. */
export type UnitSymbol = keyof Fixed | `${Prefix}${PrefixableSymbol}`;

type DimNameOf<U extends string> = U extends keyof Fixed
  ? Fixed[U][0]
  : U extends `${Prefix}${infer B}`
    ? B extends PrefixableSymbol
      ? Prefixable[B][0]
      : never
    : never;

/** The quantity type a unit symbol measures: `QuantityOf<"pF">` is `Capacitance`. */
export type QuantityOf<U extends UnitSymbol> = DimensionTypes[DimNameOf<U>];

/** Unit symbols whose quantity type is Q (for `inUnit`). */
export type UnitFor<Q extends number> = {
  [U in UnitSymbol]: [QuantityOf<U>] extends [Q] ? ([Q] extends [QuantityOf<U>] ? U : never) : never;
}[UnitSymbol];


/** The dimension name of a unit symbol of the typed table, or undefined. */
export function unitDimension(symbol: string): string | undefined {
  if (Object.hasOwn(FIXED, symbol)) return FIXED[symbol as keyof Fixed][0];
  for (const p of Object.keys(PREFIXES)) {
    const base = symbol.slice(p.length);
    if (symbol.startsWith(p) && Object.hasOwn(PREFIXABLE, base)) return PREFIXABLE[base as PrefixableSymbol][0];
  }
  return undefined;
}
