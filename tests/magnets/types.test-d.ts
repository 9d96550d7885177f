// Compile-time checks for the magnet formulas.
import { cylinderMagnetAxialField, quantity, type FluxDensity } from "../../src/index.js";

export const b: FluxDensity = cylinderMagnetAxialField({ remanence: quantity(1.3, "T"), radius: quantity(5, "mm"), length: quantity(1, "cm"), axialDistance: quantity(2, "cm") });
// @ts-expect-error a field strength in A/m is not a remanence in T
cylinderMagnetAxialField({ remanence: quantity(1, "A/m"), radius: quantity(5, "mm"), length: quantity(1, "cm"), axialDistance: quantity(2, "cm") });

import { blockMagnetField, cylinderMagnetField, solenoidField, type Current, type Length, type Vec3 } from "../../src/index.js";
export const bc = cylinderMagnetField({ remanence: quantity(1.3, "T"), radius: quantity(5, "mm"), length: quantity(1, "cm"), radialDistance: quantity(3, "mm"), axialDistance: quantity(2, "cm") });
export const bcr: FluxDensity = bc[0]!;
// @ts-expect-error the result is a [radial, axial] pair, not one flux density
export const bcWrong: FluxDensity = bc;
export const bb = blockMagnetField({ remanence: quantity(1.2, "T"), sizeX: quantity(1, "cm"), sizeY: quantity(1, "cm"), sizeZ: quantity(5, "mm"), position: [0.003, 0.002, 0.006] as unknown as Vec3<Length> });
export const bbz: FluxDensity = bb[2]!;
// @ts-expect-error the position is a vector of lengths, not one length
blockMagnetField({ remanence: quantity(1.2, "T"), sizeX: quantity(1, "cm"), sizeY: quantity(1, "cm"), sizeZ: quantity(5, "mm"), position: quantity(1, "cm") });
export const bs = solenoidField({ current: 1 as Current, turns: 100, radius: quantity(1, "cm"), length: quantity(10, "cm"), radialDistance: quantity(5, "mm"), axialDistance: quantity(0, "m") });
// @ts-expect-error the axial position is axialDistance here (solenoidAxialField's axialPosition is not an input)
solenoidField({ current: 1 as Current, turns: 100, radius: quantity(1, "cm"), length: quantity(10, "cm"), radialDistance: quantity(5, "mm"), axialPosition: quantity(0, "m") });
