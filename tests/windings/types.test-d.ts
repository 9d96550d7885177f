// Compile-time checks for the windings family: each @ts-expect-error line must be a type error.
import {
  areaProduct, dowellAcResistanceFactor, dowellRoundWireAcResistanceFactor, inductorAreaProduct, inUnit, laminationEddyLoss, leakageInductance, quantity, roundWireAcResistanceFactor,
  solenoidInductanceRoundWire, wireGaugeDiameter, wireResistance, windowFillFactor, type AreaProduct, type Inductance, type Length, type Power, type Resistance, type Volume,
} from "../../src/index.js";

export const d: Length = wireGaugeDiameter({ gauge: "4/0" });
export const r: Resistance = wireResistance({ length: quantity(2, "m"), diameter: d, temperature: quantity(350, "K"), material: "aluminium" });
export const k: number = roundWireAcResistanceFactor({ diameter: d, frequency: quantity(50, "Hz") });

// @ts-expect-error a gauge is a size name from the table, not a number
wireGaugeDiameter({ gauge: 24 });
// @ts-expect-error 41 is not an AWG size of ASTM B258
wireGaugeDiameter({ gauge: "41" });
// @ts-expect-error the material is copper or aluminium
wireResistance({ length: quantity(2, "m"), diameter: d, material: "silver" });
// @ts-expect-error the temperature is a Temperature, not a length
wireResistance({ length: quantity(2, "m"), diameter: d, temperature: quantity(20, "mm") });
// @ts-expect-error a resistance is not a length
export const wrong: Length = wireResistance({ length: quantity(2, "m"), diameter: d });
// @ts-expect-error the frequency is required
roundWireAcResistanceFactor({ diameter: d });
export const fr: number = dowellAcResistanceFactor({ layers: 4, penetrationRatio: 1.2 });
export const fw: number = dowellRoundWireAcResistanceFactor({ layers: 3, wireDiameter: d, pitch: quantity(0.6, "mm"), frequency: quantity(100, "kHz") });
// @ts-expect-error the pitch is a length
dowellRoundWireAcResistanceFactor({ layers: 3, wireDiameter: d, pitch: 0.6, frequency: quantity(100, "kHz") });
// @ts-expect-error the penetration ratio is required
dowellAcResistanceFactor({ layers: 4 });
export const pe: Power = laminationEddyLoss({ thickness: quantity(0.35, "mm"), conductivity: quantity(2, "MS/m"), frequency: quantity(50, "Hz"), peakFluxDensity: quantity(1.5, "T"), volume: quantity(100, "cm^3") });
// @ts-expect-error the volume is a Volume, not an area
laminationEddyLoss({ thickness: quantity(0.35, "mm"), conductivity: quantity(2, "MS/m"), frequency: quantity(50, "Hz"), peakFluxDensity: quantity(1.5, "T"), volume: quantity(100, "cm^2") });
// @ts-expect-error the conductivity has no default
laminationEddyLoss({ thickness: quantity(0.35, "mm"), frequency: quantity(50, "Hz"), peakFluxDensity: quantity(1.5, "T"), volume: quantity(100, "cm^3") });
export const ls: Inductance = solenoidInductanceRoundWire({ turns: 20, radius: quantity(1, "cm"), length: quantity(2, "cm"), wireDiameter: quantity(0.8, "mm") });
// @ts-expect-error the wire diameter is required: without it this is solenoidInductance
solenoidInductanceRoundWire({ turns: 20, radius: quantity(1, "cm"), length: quantity(2, "cm") });
// @ts-expect-error an inductance is not a length
export const wrongSolenoid: Length = solenoidInductanceRoundWire({ turns: 20, radius: quantity(1, "cm"), length: quantity(2, "cm"), wireDiameter: quantity(0.8, "mm") });
export const ll: Inductance = leakageInductance({ turns: 40, meanTurnLength: quantity(8, "cm"), windingHeight: quantity(25, "mm"), innerBuild: quantity(1.5, "mm"), outerBuild: quantity(1.5, "mm"), spacing: quantity(0.5, "mm") });
export const ap: AreaProduct = areaProduct({ apparentPower: quantity(210, "W"), waveformFactor: 4, windowUtilization: 0.4, peakFluxDensity: quantity(0.15, "T"), frequency: quantity(100, "kHz"), currentDensity: quantity(4, "A/mm^2") });
export const apCm4: number = inUnit(inductorAreaProduct({ energy: quantity(2, "mJ"), peakFluxDensity: quantity(0.3, "T"), currentDensity: quantity(4, "A/mm^2"), windowUtilization: 0.4 }), "cm^4");
export const fill: number = windowFillFactor({ turns: 40, wireArea: quantity(0.5, "mm^2"), windowArea: quantity(60, "mm^2") });
// @ts-expect-error an area product is not a volume
export const wrongAp: Volume = ap;
// @ts-expect-error the wire area is an Area, not a diameter
windowFillFactor({ turns: 40, wireArea: quantity(0.8, "mm"), windowArea: quantity(60, "mm^2") });
// @ts-expect-error the leakage needs the spacing between the windings
leakageInductance({ turns: 40, meanTurnLength: quantity(8, "cm"), windingHeight: quantity(25, "mm"), innerBuild: quantity(1.5, "mm"), outerBuild: quantity(1.5, "mm") });
