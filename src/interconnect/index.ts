export { microstripImpedance, microstripEffectivePermittivity } from "./microstrip.js";
export {
  coaxialImpedance, twoWireImpedance, propagationDelay, reflectionCoefficient, returnLoss, standingWaveRatio,
  lineInputImpedance,
} from "./lines.js";
