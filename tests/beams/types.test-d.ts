// Compile-time checks for the beam formulas: each @ts-expect-error line must be a type error.
import {
  magneticRigidity, particleSpeed, quadrupoleFocalLength, quantity, type MagneticRigidity, type Velocity,
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
