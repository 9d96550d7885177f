export { lorentzForce, wireForce, parallelWiresForce, magneticPressure, hallVoltage } from "./lorentz.js";
export { cyclotronFrequency, gyroradius, relativisticGyroradius, driftVelocity } from "./particle.js";
export { traceParticle } from "./trace.js";
export type { FieldFunction, FieldSource, TraceOptions, ParticleTrace } from "./trace.js";
export { coaxialLoopsForce, coaxialCoilsForce } from "./coaxial.js";
export { gapPullForce, gappedCorePullForce, electrostaticForce, pullInVoltage, combDriveForce } from "./actuators.js";
export { pathForce, MAX_PANELS } from "./path-force.js";
