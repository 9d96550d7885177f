export { cylinderMagnetAxialField, cylinderMagnetField } from "./cylinder.js";
export { blockMagnetField } from "./block.js";
