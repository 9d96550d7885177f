export { cylinderMagnetAxialField } from "./cylinder.js";
