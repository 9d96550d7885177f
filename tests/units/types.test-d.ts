// Compile-time checks: each @ts-expect-error line must be a type error, so
// `npm run typecheck` fails if the types stop catching these mistakes.
import {
  add, div, inUnit, mul, parallelPlateCapacitance, quantity, sqrt, sub,
  type Area, type Capacitance, type Length, type Voltage,
} from "../../src/index.js";
import type {
  Angle, Charge, Current, FluxDensity, Inductance, MagneticFlux, Mass, Resistance, Time,
} from "../../src/index.js";
import { electron, proton } from "../../src/constants/index.js";
import { magneticFlux } from "../../src/index.js";

const gap: Length = quantity(0.1, "mm");
const area: Area = quantity(1, "cm^2");
const c: Capacitance = parallelPlateCapacitance({ area, gap });
const c2: Capacitance = parallelPlateCapacitance({ area, gap, relativePermittivity: 4.4 });
export const ok = [c, c2, add(gap, gap), sub(area, area), inUnit(c, "pF"), inUnit(gap, "mil")];

// A length where an area is required does not compile.
// @ts-expect-error area is an Area, not a Length
parallelPlateCapacitance({ area: gap, gap });
// @ts-expect-error a plain number is not a Length
parallelPlateCapacitance({ area, gap: 0.001 });
// @ts-expect-error missing required input
parallelPlateCapacitance({ area });
// @ts-expect-error unknown input name
parallelPlateCapacitance({ area, gap, epsilon: 2 });
// @ts-expect-error wrong-dimension unit symbol where a Length is required
export const badLength: Length = quantity(1, "pF");
// @ts-expect-error unknown unit symbol
quantity(1, "furlong");
// @ts-expect-error inUnit only takes units of the quantity's dimension
inUnit(gap, "pF");
// @ts-expect-error adding a length to an area
add(gap, area);
// @ts-expect-error subtracting a voltage from a length
sub(gap, quantity(1, "V") as Voltage);

// Products and quotients carry their dimensions.
export const a2: Area = mul(gap, gap);
export const l2: Length = div(area, gap);
export const l3: Length = sqrt(area);
// @ts-expect-error the product of two lengths is not a length
export const wrongProduct: Length = mul(gap, gap);
// @ts-expect-error square root of a length has an odd exponent
sqrt(gap);
// @ts-expect-error volume from area/length is not an area
export const wrongQuotient: Area = div(area, gap);

// ---- more misuse the types must catch ----

const current: Current = quantity(2, "A");
const time: Time = quantity(1, "ms");
const voltage: Voltage = quantity(5, "V");
const b: FluxDensity = quantity(10, "mT");
const inductance: Inductance = quantity(4.7, "uH");
const angle: Angle = quantity(30, "deg");
export const okMore = [
  inUnit(b, "G"), inUnit(b, "mT"), inUnit(current, "At"), inUnit(angle, "deg"), inUnit(inductance, "nH"),
  inUnit(electron.mass, "Da"), inUnit(proton.charge, "C"),
];

// inUnit with a unit of another dimension, for several dimensions.
// @ts-expect-error a capacitance cannot be read in henries
inUnit(c, "nH");
// @ts-expect-error an inductance cannot be read in farads
inUnit(inductance, "pF");
// @ts-expect-error a flux density cannot be read in webers (that is flux)
inUnit(b, "Wb");
// @ts-expect-error a flux density cannot be read in oersted (that is field strength)
inUnit(b, "Oe");
// @ts-expect-error a voltage cannot be read in amperes
inUnit(voltage, "A");
// @ts-expect-error a current cannot be read in volts
inUnit(current, "kV");
// @ts-expect-error an angle cannot be read as a length
inUnit(angle, "mm");
// @ts-expect-error a mass cannot be read in electron volts (energy)
inUnit(electron.mass, "eV");
// @ts-expect-error a charge cannot be read in kilograms
inUnit(electron.charge, "kg");

// Angles are their own kind: a plain number or a ratio is not an angle.
// @ts-expect-error a plain number is not an Angle
export const badAngle: Angle = 0.5;
// @ts-expect-error a length is not an Angle
export const badAngle2: Angle = gap;

// A formula with an Angle input takes an Angle, not a plain number (radians or degrees?).
export const fluxOk = magneticFlux({ fluxDensity: b, area, angle });
export const fluxOk2 = magneticFlux({ fluxDensity: b, area, angle: quantity(0.5, "rad") });
// @ts-expect-error a plain number where an Angle is required
magneticFlux({ fluxDensity: b, area, angle: 30 });
// @ts-expect-error a length where an Angle is required
magneticFlux({ fluxDensity: b, area, angle: gap });
// @ts-expect-error a field strength (Oe) where a flux density is required
magneticFlux({ fluxDensity: quantity(10, "Oe"), area, angle });

// Particle presets are typed.
export const qe: Charge = electron.charge;
export const me: Mass = electron.mass;
// @ts-expect-error a particle's mass is not a charge
export const badCharge: Charge = electron.mass;

// Products and quotients with the wrong target.
export const charge: Charge = mul(current, time);
export const resistance: Resistance = div(voltage, current);
export const flux: MagneticFlux = mul(b, area);
// @ts-expect-error current times time is a charge, not a voltage
export const wrong1: Voltage = mul(current, time);
// @ts-expect-error volts per ampere is a resistance, not a capacitance
export const wrong2: Capacitance = div(voltage, current);
// @ts-expect-error flux density times area is a flux, not a flux density
export const wrong3: FluxDensity = mul(b, area);
// @ts-expect-error flux over area is a flux density, not an inductance
export const wrong4: Inductance = div(flux, area);
// @ts-expect-error a charge over a mass is not a mass
export const wrong5: Mass = div(electron.charge, electron.mass);
// @ts-expect-error square root of a time has an odd exponent
sqrt(time);
// @ts-expect-error adding a charge to a current
add(charge, current);
