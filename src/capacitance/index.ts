export { parallelPlateCapacitance } from "./parallel-plate.js";
