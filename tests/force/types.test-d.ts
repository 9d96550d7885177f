// Compile-time checks for the force, particle and tracing API: each @ts-expect-error
// line must be a type error, so `npm run typecheck` fails if the types stop catching it.
import {
  cyclotronFrequency, driftVelocity, lorentzForce, quantity, relativisticGyroradius, traceParticle, wireForce,
  type ElectricField, type Force, type Frequency, type Length, type Time, type Vec3, type Velocity, type FluxDensity,
} from "../../src/index.js";
import { electron, proton } from "../../src/constants/index.js";

const E = [0, 0, 0] as unknown as Vec3<ElectricField>;
const v = [1e6, 0, 0] as unknown as Vec3<Velocity>;
const B = [0, 0, 1] as unknown as Vec3<FluxDensity>;
const origin = [0, 0, 0] as unknown as Vec3<Length>;

export const force: readonly Force[] = lorentzForce({ charge: proton.charge, electricField: E, velocity: v, fluxDensity: B });
export const f: Frequency = cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: quantity(1, "T") });
export const r: Length = relativisticGyroradius({ mass: electron.mass, kineticEnergy: quantity(1, "MeV"), charge: electron.charge, fluxDensity: quantity(0.1, "T") });
export const vd: readonly Velocity[] = driftVelocity({ electricField: E, fluxDensity: B });
export const path = traceParticle({ particle: electron, position: origin, velocity: v, fluxDensity: B, timeStep: quantity(1, "ns"), steps: 10 });
export const custom = traceParticle({ particle: proton, position: origin, velocity: v, fluxDensity: (_x, _y, z) => [0, 0, 1 + z], timeStep: quantity(1, "ns"), steps: 10 });

// @ts-expect-error a velocity where the field goes
lorentzForce({ charge: proton.charge, electricField: v, velocity: v, fluxDensity: B });
// @ts-expect-error a mass where the charge goes
cyclotronFrequency({ charge: electron.mass, mass: electron.mass, fluxDensity: quantity(1, "T") });
// @ts-expect-error an energy in volts is not an energy
relativisticGyroradius({ mass: electron.mass, kineticEnergy: quantity(1, "MV"), charge: electron.charge, fluxDensity: quantity(0.1, "T") });
// @ts-expect-error the angle is an Angle, not a plain number
wireForce({ current: quantity(1, "A"), length: quantity(1, "m"), fluxDensity: quantity(1, "T"), angle: 1.2 });
// @ts-expect-error a length is not a time step
traceParticle({ particle: electron, position: origin, velocity: v, timeStep: quantity(1, "m"), steps: 10 });
// @ts-expect-error the particle needs a typed charge and mass
traceParticle({ particle: { charge: 1, mass: 1 }, position: origin, velocity: v, timeStep: quantity(1, "ns") as Time, steps: 10 });
// @ts-expect-error a frequency is not a flux density
export const wrong: FluxDensity = cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: quantity(1, "T") });

// ---- actuator forces ----
import { coaxialLoopsForce, gappedCorePullForce, pullInVoltage, type Stiffness } from "../../src/index.js";
export const loopsF: Force = coaxialLoopsForce({ current1: quantity(1, "A"), current2: quantity(1, "A"), radius1: quantity(1, "cm"), radius2: quantity(1, "cm"), distance: quantity(1, "mm") });
export const pull: Force = gappedCorePullForce({ turns: 100, current: quantity(1, "A"), poleArea: quantity(1, "cm^2"), gapLength: quantity(1, "mm"), pathLength: quantity(10, "cm") });
export const vpi = pullInVoltage({ springConstant: quantity(1, "N/m"), gap: quantity(2, "um"), area: quantity(1, "mm^2") });
export const k: Stiffness = quantity(3, "N/m");
// @ts-expect-error a force where the spring constant goes
pullInVoltage({ springConstant: quantity(1, "N"), gap: quantity(2, "um"), area: quantity(1, "mm^2") });
// @ts-expect-error a length where the pole area goes
gappedCorePullForce({ turns: 100, current: quantity(1, "A"), poleArea: quantity(1, "cm"), gapLength: quantity(1, "mm"), pathLength: quantity(10, "cm") });
// @ts-expect-error the distance is a length, not a current
coaxialLoopsForce({ current1: quantity(1, "A"), current2: quantity(1, "A"), radius1: quantity(1, "cm"), radius2: quantity(1, "cm"), distance: quantity(1, "A") });
