export { cylinderMagnetAxialField, cylinderMagnetField } from "./cylinder.js";
