// Compile-time checks for the beam formulas: each @ts-expect-error line must be a type error.
import {
  div, magneticRigidity, mul, particleSpeed, perveance, quadrupoleFocalLength, quantity, sqrt,
  type Current, type MagneticRigidity, type Perveance, type Quantity, type Velocity, type Voltage,
} from "../../src/index.js";
import { electron, proton } from "../../src/constants/index.js";

export const v: Velocity = particleSpeed({ kineticEnergy: quantity(1, "MeV"), mass: electron.mass });
export const br: MagneticRigidity = magneticRigidity({ momentum: quantity(1e-19, "kg m/s"), charge: proton.charge });
export const f = quadrupoleFocalLength({ rigidity: br, gradient: quantity(10, "T/m"), length: quantity(20, "cm") });

// @ts-expect-error a voltage is not a kinetic energy
particleSpeed({ kineticEnergy: quantity(1, "MV"), mass: electron.mass });
// @ts-expect-error a field where the gradient goes
quadrupoleFocalLength({ rigidity: br, gradient: quantity(1, "T"), length: quantity(20, "cm") });
// @ts-expect-error a mass where the charge goes
magneticRigidity({ momentum: quantity(1e-19, "kg m/s"), charge: proton.mass });

// Perveance has half-integer exponents (A/V^1.5): the typed arithmetic keeps them exact.
export const k: Perveance = perveance({ current: quantity(414, "A"), voltage: quantity(350, "kV") });
export const k2: Perveance = quantity(2, "uA/V^1.5");
const kv = mul(k, quantity(350, "kV"));
// K V is A/V^0.5: m^-1 kg^-0.5 s^1.5 A^1.5.
export const kvExact: Quantity<readonly [-1, -0.5, 1.5, 1.5, 0, 0, 0, 0]> = kv;
// Back to a current: (K V) times V^(1/2) has no typed route (sqrt(V) is refused), but K V / (K V) is a plain ratio.
export const one: number = div(kv, kv);
// V^1.5 from current / perveance, and back: current / V^1.5 is a Perveance again.
const v15 = div(quantity(414, "A"), k);
export const kBack: Perveance = div(quantity(414, "A"), v15);
// @ts-expect-error a perveance is not a current
export const notCurrent: Current = k;
// @ts-expect-error V^1.5 is not a voltage
export const notVoltage: Voltage = v15;
// @ts-expect-error the square root of a half-integer exponent (a quarter) is refused
sqrt(k);
// @ts-expect-error the square root of an odd exponent stays refused (V^0.5 is a slip, not a quantity of the trade)
sqrt(quantity(1, "kV"));
// @ts-expect-error a current per volt is not a perveance
perveance({ current: quantity(1, "A"), voltage: quantity(1, "A") });
