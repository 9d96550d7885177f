// Flux, fields and magnetic circuits. Every formula exported here is found by the registry.
export { magneticFlux, transformerEmf, transformerPeakFluxDensity, motionalEmf } from "./induction.js";
export {
  reluctance, gappedCoreInductance, coreFluxDensity, gapFringingFactor, inductanceFactor, inductanceFromFactor,
} from "./magnetic-circuit.js";
export { skinDepth, coreLoss } from "./losses.js";
export { coreLossForWaveform } from "./waveform-loss.js";
export {
  wireField, loopAxialField, loopField, solenoidAxialField, helmholtzCenterField, toroidField,
} from "./field-sources.js";
export { solenoidField } from "./solenoid-field.js";
export { pointChargeField, lineChargeField, chargedSphereField } from "./electric-fields.js";
export { solveMagneticCircuit } from "./circuit-solver.js";
export type { MagneticBranch, MagneticCircuit, MagneticCircuitSolution } from "./circuit-solver.js";
export { biotSavart } from "./biot-savart.js";
export { closedSurfaceFlux, checkClosedSurface, sphereMesh, boxMesh } from "./surface-flux.js";
export type { TriangleMesh, VectorField, SurfaceFlux } from "./surface-flux.js";
export { exposureReferenceLevel } from "./exposure.js";
