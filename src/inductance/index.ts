export {
  nagaokaCoefficient, solenoidInductance, longSolenoidInductance, wheelerSolenoidInductance, multilayerCoilInductance,
} from "./solenoid.js";
export { toroidInductance, circularToroidInductance } from "./toroid.js";
export { coaxialInductance, twoWireInductance, straightWireInductance, loopInductance } from "./lines.js";
export { coaxialLoopsMutualInductance, coaxialCoilsMutualInductance, couplingCoefficient } from "./mutual.js";
export { planarSpiralInductance, modifiedWheelerSpiralInductance } from "./planar.js";
export { inductorEnergy, seriesInductance, parallelInductance } from "./circuit.js";
export { mutualInductance, polylineSelfInductance } from "./neumann.js";
export type { Polyline, NeumannOptions } from "./neumann.js";
