// Compile-time checks for the flux family: each @ts-expect-error line must be a type error.
import {
  coreFluxDensity, exposureReferenceLevel, gappedCoreInductance, inductanceFromFactor, loopField, magneticFlux, quantity, skinDepth,
  solveMagneticCircuit, transformerPeakFluxDensity,
  type ElectricField, type FluxDensity, type Inductance, type Length, type MagneticFlux,
} from "../../src/index.js";

const B = quantity(0.2, "T");
const A = quantity(1, "cm^2");
const l = quantity(100, "mm");
const g = quantity(0.5, "mm");
const I = quantity(1, "A");

export const phi: MagneticFlux = magneticFlux({ fluxDensity: B, area: A, angle: quantity(30, "deg") });
export const L: Inductance = gappedCoreInductance({ turns: 20, pathLength: l, area: A, relativePermeability: 2000, gapLength: g });
export const field: readonly FluxDensity[] = loopField({ current: I, radius: l, radialDistance: g, axialDistance: g });
export const depth: Length = skinDepth({ conductivity: quantity(58, "MS/m"), frequency: quantity(60, "Hz") });
export const bPeak: FluxDensity = transformerPeakFluxDensity({ voltage: quantity(230, "V"), frequency: quantity(50, "Hz"), turns: 800, area: quantity(10, "cm^2") });
export const L2: Inductance = inductanceFromFactor({ inductanceFactor: quantity(250, "nH"), turns: 20 });
export const sol = solveMagneticCircuit({ branches: [{ from: 0, to: 1, reluctance: 1e6 as never, mmf: I }] });

// @ts-expect-error an angle is an Angle (write quantity(30, "deg")), not a plain number
magneticFlux({ fluxDensity: B, area: A, angle: 30 });
// @ts-expect-error a length is not an area
magneticFlux({ fluxDensity: B, area: l });
// @ts-expect-error a flux density is not a magnetic flux
export const wrongOut: MagneticFlux = coreFluxDensity({ turns: 20, current: I, pathLength: l, area: A, gapLength: g });
// @ts-expect-error A_L is an Inductance (H per turn squared), not a plain number
inductanceFromFactor({ inductanceFactor: 250e-9, turns: 20 });
// @ts-expect-error loopField returns components, not a single quantity
export const scalarLoop: FluxDensity = loopField({ current: I, radius: l, radialDistance: g, axialDistance: g });
// @ts-expect-error the branch reluctance must be a Reluctance, not a length
solveMagneticCircuit({ branches: [{ from: 0, to: 1, reluctance: l }] });

// The exposure level's output dimension follows the `quantity` choice.
export const bRef: FluxDensity = exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "public", quantity: "fluxDensity" });
export const eRef: ElectricField = exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "occupational", quantity: "electricField" });
declare const which: "fluxDensity" | "electricField";
export const either: FluxDensity | ElectricField = exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "public", quantity: which });
// @ts-expect-error an electric-field level is not a flux density
export const wrongRef: FluxDensity = exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "public", quantity: "electricField" });
// @ts-expect-error a level of either kind is not known to be a flux density
export const unsure: FluxDensity = exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "public", quantity: which });
// @ts-expect-error not a group of the guideline
exposureReferenceLevel({ frequency: quantity(50, "Hz"), group: "workers", quantity: "fluxDensity" });
// @ts-expect-error a length is not a frequency
exposureReferenceLevel({ frequency: quantity(50, "m"), group: "public", quantity: "fluxDensity" });
