// Compile-time checks for the magnet formulas.
import { cylinderMagnetAxialField, quantity, type FluxDensity } from "../../src/index.js";

export const b: FluxDensity = cylinderMagnetAxialField({ remanence: quantity(1.3, "T"), radius: quantity(5, "mm"), length: quantity(1, "cm"), axialDistance: quantity(2, "cm") });
// @ts-expect-error a field strength in A/m is not a remanence in T
cylinderMagnetAxialField({ remanence: quantity(1, "A/m"), radius: quantity(5, "mm"), length: quantity(1, "cm"), axialDistance: quantity(2, "cm") });
