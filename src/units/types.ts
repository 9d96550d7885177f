import type { DIMENSIONS, Exponents } from "./dimensions.js";
import type { DiffTable, HalfTable, SumTable } from "./exponent-table.js";

declare const dimensionBrand: unique symbol;

/**
 * A plain `number` in coherent SI units, branded at type level with its
 * dimension. The brand exists only for the compiler: at run time a quantity is
 * the number itself, so typed code runs as fast as plain arithmetic.
 */
export type Quantity<E extends Exponents> = number & { readonly [dimensionBrand]: E };

type Exps<N extends keyof typeof DIMENSIONS> = (typeof DIMENSIONS)[N]["exps"];

// Named quantities. Each is an alias so compiler messages say "Capacitance"
// rather than an exponent tuple.
export type Angle = Quantity<Exps<"Angle">>;
export type Length = Quantity<Exps<"Length">>;
export type Area = Quantity<Exps<"Area">>;
export type Volume = Quantity<Exps<"Volume">>;
/** Area times area, m^4: a core's window area times its cross-section (McLyman's area product). */
export type AreaProduct = Quantity<Exps<"AreaProduct">>;
export type Time = Quantity<Exps<"Time">>;
export type Frequency = Quantity<Exps<"Frequency">>;
export type Mass = Quantity<Exps<"Mass">>;
export type Current = Quantity<Exps<"Current">>;
export type Temperature = Quantity<Exps<"Temperature">>;
export type Amount = Quantity<Exps<"Amount">>;
export type Charge = Quantity<Exps<"Charge">>;
export type Voltage = Quantity<Exps<"Voltage">>;
export type ElectricField = Quantity<Exps<"ElectricField">>;
export type ElectricFlux = Quantity<Exps<"ElectricFlux">>;
export type ElectricFluxRate = Quantity<Exps<"ElectricFluxRate">>;
export type VoltageRate = Quantity<Exps<"VoltageRate">>;
export type CurrentRate = Quantity<Exps<"CurrentRate">>;
export type Capacitance = Quantity<Exps<"Capacitance">>;
export type Inductance = Quantity<Exps<"Inductance">>;
export type Resistance = Quantity<Exps<"Resistance">>;
export type Conductance = Quantity<Exps<"Conductance">>;
export type Conductivity = Quantity<Exps<"Conductivity">>;
export type Permittivity = Quantity<Exps<"Permittivity">>;
export type Permeability = Quantity<Exps<"Permeability">>;
export type MagneticFlux = Quantity<Exps<"MagneticFlux">>;
export type FluxDensity = Quantity<Exps<"FluxDensity">>;
export type MagneticFieldStrength = Quantity<Exps<"MagneticFieldStrength">>;
export type Reluctance = Quantity<Exps<"Reluctance">>;
export type Force = Quantity<Exps<"Force">>;
export type Pressure = Quantity<Exps<"Pressure">>;
export type Energy = Quantity<Exps<"Energy">>;
export type Power = Quantity<Exps<"Power">>;
export type PowerDensity = Quantity<Exps<"PowerDensity">>;
export type Velocity = Quantity<Exps<"Velocity">>;
export type Acceleration = Quantity<Exps<"Acceleration">>;
export type Momentum = Quantity<Exps<"Momentum">>;
export type CurrentDensity = Quantity<Exps<"CurrentDensity">>;
export type ChargeDensity = Quantity<Exps<"ChargeDensity">>;
export type SurfaceChargeDensity = Quantity<Exps<"SurfaceChargeDensity">>;
export type LineChargeDensity = Quantity<Exps<"LineChargeDensity">>;
export type NumberDensity = Quantity<Exps<"NumberDensity">>;
export type ChargeToMass = Quantity<Exps<"ChargeToMass">>;
/** Spring constant (force per displacement), N/m. */
export type Stiffness = Quantity<Exps<"Stiffness">>;
/** Magnetic rigidity B rho = p / q of a beam, T m. */
export type MagneticRigidity = Quantity<Exps<"MagneticRigidity">>;
/** Field gradient (of a quadrupole), T/m. */
export type FluxDensityGradient = Quantity<Exps<"FluxDensityGradient">>;
export type MagneticMoment = Quantity<Exps<"MagneticMoment">>;
/** Perveance I / V^(3/2) of a space-charge-limited gun, A/V^1.5 (half-integer SI exponents). */
export type Perveance = Quantity<Exps<"Perveance">>;
/** Magnetomotive force is measured in amperes (ampere-turns). */
export type MagnetomotiveForce = Current;
/**
 * A pure number. Plain numbers are accepted where a dimensionless input is
 * expected, and the quotient of two like quantities is assignable to it.
 */
export type Dimensionless = number;

/**
 * The TypeScript type of a value of the named dimension. Dimensionless inputs
 * take plain numbers (relative permittivity, turns).
 */
export interface DimensionTypes {
  Dimensionless: Dimensionless;
  Angle: Angle;
  Length: Length;
  Area: Area;
  Volume: Volume;
  AreaProduct: AreaProduct;
  Time: Time;
  Frequency: Frequency;
  Mass: Mass;
  Current: Current;
  Temperature: Temperature;
  Amount: Amount;
  Charge: Charge;
  Voltage: Voltage;
  ElectricField: ElectricField;
  ElectricFlux: ElectricFlux;
  ElectricFluxRate: ElectricFluxRate;
  VoltageRate: VoltageRate;
  CurrentRate: CurrentRate;
  Capacitance: Capacitance;
  Inductance: Inductance;
  Resistance: Resistance;
  Conductance: Conductance;
  Conductivity: Conductivity;
  Permittivity: Permittivity;
  Permeability: Permeability;
  MagneticFlux: MagneticFlux;
  FluxDensity: FluxDensity;
  MagneticFieldStrength: MagneticFieldStrength;
  Reluctance: Reluctance;
  Force: Force;
  Pressure: Pressure;
  Energy: Energy;
  Power: Power;
  PowerDensity: PowerDensity;
  Velocity: Velocity;
  Acceleration: Acceleration;
  Momentum: Momentum;
  CurrentDensity: CurrentDensity;
  ChargeDensity: ChargeDensity;
  SurfaceChargeDensity: SurfaceChargeDensity;
  LineChargeDensity: LineChargeDensity;
  NumberDensity: NumberDensity;
  ChargeToMass: ChargeToMass;
  MagneticMoment: MagneticMoment;
  Stiffness: Stiffness;
  MagneticRigidity: MagneticRigidity;
  FluxDensityGradient: FluxDensityGradient;
  Perveance: Perveance;
}

/** A 3-vector of quantities of one dimension (Cartesian x, y, z). */
export type Vec3<Q extends number = number> = readonly [Q, Q, Q];

// ---- type-level exponent arithmetic (flat table lookups, no recursion) ----
type K<N extends number> = `${N}`;
type Num<T> = T extends number ? T : never;
type Sum<A extends number, B extends number> = K<A> extends keyof SumTable
  ? K<B> extends keyof SumTable[K<A>]
    ? Num<SumTable[K<A>][K<B>]>
    : never
  : never;
type Diff<A extends number, B extends number> = K<A> extends keyof DiffTable
  ? K<B> extends keyof DiffTable[K<A>]
    ? Num<DiffTable[K<A>][K<B>]>
    : never
  : never;
type Half<A extends number> = K<A> extends keyof HalfTable ? Num<HalfTable[K<A>]> : never;

/** Exponents of a product. */
export type MulExponents<A extends Exponents, B extends Exponents> = readonly [
  Sum<A[0], B[0]>, Sum<A[1], B[1]>, Sum<A[2], B[2]>, Sum<A[3], B[3]>,
  Sum<A[4], B[4]>, Sum<A[5], B[5]>, Sum<A[6], B[6]>, Sum<A[7], B[7]>,
];
/** Exponents of a quotient. */
export type DivExponents<A extends Exponents, B extends Exponents> = readonly [
  Diff<A[0], B[0]>, Diff<A[1], B[1]>, Diff<A[2], B[2]>, Diff<A[3], B[3]>,
  Diff<A[4], B[4]>, Diff<A[5], B[5]>, Diff<A[6], B[6]>, Diff<A[7], B[7]>,
];
/** Exponents of a square root; `never` somewhere when an exponent is odd. */
export type SqrtExponents<A extends Exponents> = readonly [
  Half<A[0]>, Half<A[1]>, Half<A[2]>, Half<A[3]>,
  Half<A[4]>, Half<A[5]>, Half<A[6]>, Half<A[7]>,
];
export type NeverIn<E extends Exponents> = [E[0]] extends [never] ? true : [E[1]] extends [never] ? true : [E[2]] extends [never] ? true : [E[3]] extends [never] ? true : [E[4]] extends [never] ? true : [E[5]] extends [never] ? true : [E[6]] extends [never] ? true : [E[7]] extends [never] ? true : false;
/** Exponents of a quantity type. */
export type ExponentsOf<Q> = Q extends Quantity<infer E> ? E : Q extends number ? readonly [0, 0, 0, 0, 0, 0, 0, 0] : never;
/** `Quantity<E>`, or `never` when some exponent fell outside the tables (odd root). */
export type QuantityOrNever<E extends Exponents> = NeverIn<E> extends true ? never : Quantity<E>;

// ---- naming results: a product's type reads "Area", not an exponent tuple ----
type KeyOf<E extends Exponents> = `${E[0]},${E[1]},${E[2]},${E[3]},${E[4]},${E[5]},${E[6]},${E[7]}`;
/** Named quantity by exponent key ("2,0,0,0,0,0,0,0" -> "Area"); one flat mapped type, no recursion. */
type NameByKey = { [N in keyof DimensionTypes as KeyOf<ExponentsOf<DimensionTypes[N]>>]: N };
/**
 * The named quantity type with exponents E (`Area` for [2,0,...]), else
 * `Quantity<E>`. Results of mul/div/sqrt go through it so that a dimension
 * mistake made with them is reported with names: "'Area' is not assignable
 * to type 'Length'".
 */
export type Named<E extends Exponents> = NeverIn<E> extends true
  ? Quantity<E>
  : KeyOf<E> extends keyof NameByKey
    ? DimensionTypes[NameByKey[KeyOf<E>]]
    : Quantity<E>;
