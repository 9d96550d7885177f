export { microstripImpedance, microstripEffectivePermittivity } from "./microstrip.js";
export {
  coaxialImpedance, twoWireImpedance, propagationDelay, reflectionCoefficient, returnLoss, standingWaveRatio,
  lineInputImpedance,
} from "./lines.js";
export {
  striplineImpedance, coplanarWaveguideImpedance, coplanarWaveguideEffectivePermittivity, coupledMicrostripImpedance,
} from "./planar.js";
export { lineCouplingCoefficient, nearEndCrosstalk } from "./coupling.js";
export { viaInductance, traceInductance, traceResistance } from "./parasitics.js";
export { traceCurrentForTemperatureRise } from "./current-capacity.js";
