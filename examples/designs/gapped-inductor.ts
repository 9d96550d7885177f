/**
 * The gapped-core inductor of gapped-inductor.json written as typed
 * TypeScript: each binding is checked for dimension by the compiler, and the
 * design is the same JSON (`gappedInductor.spec`). An invented design of our own.
 */
import {
  coreFluxDensity, coreLoss, design, inductanceFactor, inductanceFromFactor, inductorEnergy, quantity,
  roundWireAcResistanceFactor, temperatureRise, wireGaugeDiameter, wireResistance,
} from "../../src/index.js";

export const gappedInductor = design("Gapped-core output inductor for a 48 V to 12 V buck converter")
  .input("pathLength", "Length", quantity(69, "mm"))
  .input("coreArea", "Area", quantity(84, "mm^2"))
  .input("coreRelativePermeability", "Dimensionless", 2000)
  .input("gapLength", "Length", { nominal: quantity(0.5, "mm"), plusMinus: quantity(0.05, "mm") })
  .input("turns", "Dimensionless", 20)
  .input("peakCurrent", "Current", { nominal: quantity(6, "A"), percent: 5 })
  .input("rippleCurrent", "Current", quantity(1.8, "A"))
  .input("switchingFrequency", "Frequency", quantity(200, "kHz"))
  .input("saturationFluxDensity", "FluxDensity", quantity(0.39, "T"))
  .input("steinmetzCoefficient", "Dimensionless", 3.7)
  .input("frequencyExponent", "Dimensionless", 1.4)
  .input("fluxExponent", "Dimensionless", 2.6)
  .input("meanTurnLength", "Length", quantity(45, "mm"))
  .input("windingTemperature", "Temperature", quantity(373.15, "K"))
  .input("surfaceArea", "Area", quantity(20, "cm^2"))
  .step("inductanceFactor", inductanceFactor, (r) => ({
    pathLength: r.pathLength, area: r.coreArea, relativePermeability: r.coreRelativePermeability, gapLength: r.gapLength,
  }))
  .step("inductance", inductanceFromFactor, (r) => ({ inductanceFactor: r.inductanceFactor, turns: r.turns }))
  .step("peakFluxDensity", coreFluxDensity, (r) => ({
    turns: r.turns, current: r.peakCurrent, pathLength: r.pathLength, area: r.coreArea,
    relativePermeability: r.coreRelativePermeability, gapLength: r.gapLength, saturationFluxDensity: r.saturationFluxDensity,
  }))
  .derived("fluxSwing", "FluxDensity", "peakFluxDensity * rippleCurrent / peakCurrent")
  .derived("coreVolume", "Volume", "pathLength * coreArea")
  .derived("fluxAmplitude", "FluxDensity", "fluxSwing / 2")
  .step("coreLoss", coreLoss, (r) => ({
    coefficient: r.steinmetzCoefficient, frequencyExponent: r.frequencyExponent, fluxExponent: r.fluxExponent,
    frequency: r.switchingFrequency, peakFluxDensity: r.fluxAmplitude, volume: r.coreVolume,
  }))
  .step("storedEnergy", inductorEnergy, (r) => ({ inductance: r.inductance, current: r.peakCurrent }))
  .step("wireDiameter", wireGaugeDiameter, () => ({ gauge: "18" }))
  .derived("windingLength", "Length", "turns * meanTurnLength")
  .step("dcResistance", wireResistance, (r) => ({ length: r.windingLength, diameter: r.wireDiameter, temperature: r.windingTemperature }))
  .step("acFactor", roundWireAcResistanceFactor, (r) => ({ diameter: r.wireDiameter, frequency: r.switchingFrequency }))
  // DC at the average current, the triangular ripple's r.m.s. (ripple / sqrt 12) at the switching frequency.
  .derived("windingLoss", "Power", "dcResistance * (peakCurrent - rippleCurrent / 2)^2 + acFactor * dcResistance * (rippleCurrent / sqrt(12))^2")
  .derived("totalLoss", "Power", "coreLoss + windingLoss")
  .step("temperatureRise", temperatureRise, (r) => ({ loss: r.totalLoss, surfaceArea: r.surfaceArea }))
  .check("peakFluxDensity < 0.3 T")
  .check("inductance >= 20 uH")
  .check("coreLoss < 1 W")
  .check("temperatureRise <= 40 K");
