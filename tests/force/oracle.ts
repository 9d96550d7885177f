// decimal.js oracle for the force, particle and displacement closed forms: 50
// significant digits, constants from the published CODATA 2022 strings.
import Decimal from "decimal.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";

export const D = Decimal.clone({ precision: 50 });
export type Dec = Decimal;

export const MU0 = constantDecimal(constant("vacuumPermeability"), D);
export const EPS0 = constantDecimal(constant("vacuumPermittivity"), D);
export const C = constantDecimal(constant("speedOfLight"), D);
export const E = constantDecimal(constant("elementaryCharge"), D);
export const ME = constantDecimal(constant("electronMass"), D);
export const MP = constantDecimal(constant("protonMass"), D);
export const PI = D.acos(-1);

/** A double as a decimal (its shortest round-trip string; exact enough at 1e-16 tolerances). */
export const d = (x: number): Dec => new D(x);
