/**
 * Named dimensions, declared once as data. Exponents are of
 * [length, mass, time, current, temperature, amount, luminous intensity, angle].
 *
 * Angle is kept as its own (eighth) base so that an angle in radians and a pure
 * ratio cannot be swapped by mistake; mathjs does the same with ANGLE.
 * `unit` is the coherent SI symbol used for output, written so mathjs parses it.
 */
export const DIMENSIONS = {
  Dimensionless: { exps: [0, 0, 0, 0, 0, 0, 0, 0], unit: "" },
  Angle: { exps: [0, 0, 0, 0, 0, 0, 0, 1], unit: "rad" },
  Length: { exps: [1, 0, 0, 0, 0, 0, 0, 0], unit: "m" },
  Area: { exps: [2, 0, 0, 0, 0, 0, 0, 0], unit: "m^2" },
  Volume: { exps: [3, 0, 0, 0, 0, 0, 0, 0], unit: "m^3" },
  AreaProduct: { exps: [4, 0, 0, 0, 0, 0, 0, 0], unit: "m^4" },
  Time: { exps: [0, 0, 1, 0, 0, 0, 0, 0], unit: "s" },
  Frequency: { exps: [0, 0, -1, 0, 0, 0, 0, 0], unit: "Hz" },
  Mass: { exps: [0, 1, 0, 0, 0, 0, 0, 0], unit: "kg" },
  Current: { exps: [0, 0, 0, 1, 0, 0, 0, 0], unit: "A" },
  Temperature: { exps: [0, 0, 0, 0, 1, 0, 0, 0], unit: "K" },
  Amount: { exps: [0, 0, 0, 0, 0, 1, 0, 0], unit: "mol" },
  Charge: { exps: [0, 0, 1, 1, 0, 0, 0, 0], unit: "C" },
  Voltage: { exps: [2, 1, -3, -1, 0, 0, 0, 0], unit: "V" },
  ElectricField: { exps: [1, 1, -3, -1, 0, 0, 0, 0], unit: "V/m" },
  ElectricFlux: { exps: [3, 1, -3, -1, 0, 0, 0, 0], unit: "V m" },
  ElectricFluxRate: { exps: [3, 1, -4, -1, 0, 0, 0, 0], unit: "V m/s" },
  VoltageRate: { exps: [2, 1, -4, -1, 0, 0, 0, 0], unit: "V/s" },
  CurrentRate: { exps: [0, 0, -1, 1, 0, 0, 0, 0], unit: "A/s" },
  Capacitance: { exps: [-2, -1, 4, 2, 0, 0, 0, 0], unit: "F" },
  Inductance: { exps: [2, 1, -2, -2, 0, 0, 0, 0], unit: "H" },
  Resistance: { exps: [2, 1, -3, -2, 0, 0, 0, 0], unit: "ohm" },
  Conductance: { exps: [-2, -1, 3, 2, 0, 0, 0, 0], unit: "S" },
  Conductivity: { exps: [-3, -1, 3, 2, 0, 0, 0, 0], unit: "S/m" },
  Permittivity: { exps: [-3, -1, 4, 2, 0, 0, 0, 0], unit: "F/m" },
  Permeability: { exps: [1, 1, -2, -2, 0, 0, 0, 0], unit: "H/m" },
  MagneticFlux: { exps: [2, 1, -2, -1, 0, 0, 0, 0], unit: "Wb" },
  FluxDensity: { exps: [0, 1, -2, -1, 0, 0, 0, 0], unit: "T" },
  MagneticFieldStrength: { exps: [-1, 0, 0, 1, 0, 0, 0, 0], unit: "A/m" },
  Reluctance: { exps: [-2, -1, 2, 2, 0, 0, 0, 0], unit: "1/H" },
  Force: { exps: [1, 1, -2, 0, 0, 0, 0, 0], unit: "N" },
  Pressure: { exps: [-1, 1, -2, 0, 0, 0, 0, 0], unit: "Pa" },
  Energy: { exps: [2, 1, -2, 0, 0, 0, 0, 0], unit: "J" },
  Power: { exps: [2, 1, -3, 0, 0, 0, 0, 0], unit: "W" },
  PowerDensity: { exps: [-1, 1, -3, 0, 0, 0, 0, 0], unit: "W/m^3" },
  Velocity: { exps: [1, 0, -1, 0, 0, 0, 0, 0], unit: "m/s" },
  Acceleration: { exps: [1, 0, -2, 0, 0, 0, 0, 0], unit: "m/s^2" },
  Momentum: { exps: [1, 1, -1, 0, 0, 0, 0, 0], unit: "kg m/s" },
  CurrentDensity: { exps: [-2, 0, 0, 1, 0, 0, 0, 0], unit: "A/m^2" },
  ChargeDensity: { exps: [-3, 0, 1, 1, 0, 0, 0, 0], unit: "C/m^3" },
  SurfaceChargeDensity: { exps: [-2, 0, 1, 1, 0, 0, 0, 0], unit: "C/m^2" },
  LineChargeDensity: { exps: [-1, 0, 1, 1, 0, 0, 0, 0], unit: "C/m" },
  NumberDensity: { exps: [-3, 0, 0, 0, 0, 0, 0, 0], unit: "1/m^3" },
  ChargeToMass: { exps: [0, -1, 1, 1, 0, 0, 0, 0], unit: "C/kg" },
  MagneticMoment: { exps: [2, 0, 0, 1, 0, 0, 0, 0], unit: "J/T" },
  Stiffness: { exps: [0, 1, -2, 0, 0, 0, 0, 0], unit: "N/m" },
  MagneticRigidity: { exps: [1, 1, -2, -1, 0, 0, 0, 0], unit: "T m" },
  FluxDensityGradient: { exps: [-1, 1, -2, -1, 0, 0, 0, 0], unit: "T/m" },
  // Current per voltage^(3/2) of a space-charge-limited gun: the one declared
  // quantity with half-integer exponents (kg^-1.5 s^4.5 A^2.5); the type-level
  // tables run in halves for it (scripts/gen-exponent-table.mjs).
  Perveance: { exps: [-3, -1.5, 4.5, 2.5, 0, 0, 0, 0], unit: "A/V^1.5" },
} as const;

/** The name of a declared dimension ("Length", "Capacitance", ...). */
export type DimensionName = keyof typeof DIMENSIONS;

/** Exponent vector [L, M, T, I, Θ, N, J, angle]; whole numbers or halves (perveance). */
export type Exponents = readonly [number, number, number, number, number, number, number, number];

const BASE_SYMBOLS = ["m", "kg", "s", "A", "K", "mol", "cd", "rad"] as const;

/** Readable form of an exponent vector, e.g. "m^2 kg s^-3 A^-1", "m^-3 kg^-1.5 s^4.5 A^2.5". */
export function describeExponents(exps: Exponents): string {
  const parts: string[] = [];
  exps.forEach((e, i) => {
    if (e !== 0) parts.push(e === 1 ? BASE_SYMBOLS[i]! : `${BASE_SYMBOLS[i]}^${e}`);
  });
  return parts.length === 0 ? "dimensionless" : parts.join(" ");
}

/** The declared name of an exponent vector, or its base-unit description. */
export function nameExponents(exps: Exponents): string {
  for (const [name, d] of Object.entries(DIMENSIONS)) {
    if (sameExponents(d.exps, exps)) return name;
  }
  return describeExponents(exps);
}

export function sameExponents(a: Exponents, b: Exponents): boolean {
  for (let i = 0; i < 8; i++) if (a[i] !== b[i]) return false;
  return true;
}
