export {
  displacementCurrent, capacitorDisplacementCurrent, displacementCurrentDensity, conductionDisplacementRatio,
  crossoverFrequency, chargingCapacitorField, parasiticCouplingCurrent,
} from "./displacement-current.js";
