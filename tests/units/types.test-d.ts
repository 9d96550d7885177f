// Compile-time checks: each @ts-expect-error line must be a type error, so
// `npm run typecheck` fails if the types stop catching these mistakes.
import {
  add, div, inUnit, mul, parallelPlateCapacitance, quantity, sqrt, sub,
  type Area, type Capacitance, type Length, type Voltage,
} from "../../src/index.js";

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
