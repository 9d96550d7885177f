export {
  displacementCurrent, capacitorDisplacementCurrent, displacementCurrentDensity, conductionDisplacementRatio,
  dielectricRelaxationFrequency, chargingCapacitorField, parasiticCouplingCurrent,
} from "./displacement-current.js";
