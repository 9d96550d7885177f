export {
  nagaokaCoefficient, solenoidInductance, idealSolenoidInductance, wheelerSolenoidInductance, multilayerCoilInductance,
} from "./solenoid.js";
export { toroidInductance, circularToroidInductance } from "./toroid.js";
export { coaxialInductance, twoWireInductance, straightWireInductance, loopInductance } from "./lines.js";
export { coaxialLoopsMutualInductance, coaxialCoilsMutualInductance, couplingCoefficient } from "./mutual.js";
export { planarSpiralInductance, planarSpiralInductanceWheeler } from "./planar.js";
export { inductorEnergy, seriesInductance, parallelInductance } from "./circuit.js";
export { mutualInductance, polylineSelfInductance } from "./neumann.js";
export type { Polyline, NeumannOptions } from "./neumann.js";
