/**
 * The capacitive level probe of level-sensor.json written as typed
 * TypeScript (the same JSON is `levelProbe.spec`). An invented design of our own.
 */
import { coaxialCapacitance, design, parallelCapacitance, quantity } from "../../src/index.js";

export const levelProbe = design("Capacitive level probe for a diesel day tank")
  .input("rodRadius", "Length", quantity(3, "mm"))
  .input("tubeRadius", "Length", { nominal: quantity(10, "mm"), plusMinus: quantity(0.1, "mm") })
  .input("probeLength", "Length", quantity(1, "m"))
  .input("level", "Length", quantity(0.4, "m"))
  .input("liquidPermittivity", "Dimensionless", { distribution: "normal", mean: 2.1, sd: 0.05 })
  .derived("dryLength", "Length", "probeLength - level")
  .step("wetCapacitance", coaxialCapacitance, (r) => ({
    innerRadius: r.rodRadius, outerRadius: r.tubeRadius, length: r.level, relativePermittivity: r.liquidPermittivity,
  }))
  .step("dryCapacitance", coaxialCapacitance, (r) => ({ innerRadius: r.rodRadius, outerRadius: r.tubeRadius, length: r.dryLength }))
  .step("probeCapacitance", parallelCapacitance, (r) => ({ capacitance1: r.wetCapacitance, capacitance2: r.dryCapacitance }))
  .step("emptyCapacitance", coaxialCapacitance, (r) => ({ innerRadius: r.rodRadius, outerRadius: r.tubeRadius, length: r.probeLength }))
  .step("fullCapacitance", coaxialCapacitance, (r) => ({
    innerRadius: r.rodRadius, outerRadius: r.tubeRadius, length: r.probeLength, relativePermittivity: r.liquidPermittivity,
  }))
  .derived("span", "Capacitance", "fullCapacitance - emptyCapacitance")
  .derived("sensitivity", "Permittivity", "span / probeLength")
  .check("span > 40 pF")
  .check("probeCapacitance < 1 nF")
  .check("sensitivity > 0.4 pF/cm");
