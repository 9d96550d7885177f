export { parallelPlateCapacitance } from "./parallel-plate.js";
export { coaxialCapacitance } from "./coaxial.js";
export { sphericalCapacitance, isolatedSphereCapacitance } from "./sphere.js";
export { twoWireCapacitance, wireOverPlaneCapacitance } from "./wires.js";
export { capacitorEnergy, capacitorCharge } from "./stored-energy.js";
export { seriesCapacitance, parallelCapacitance } from "./combine.js";
