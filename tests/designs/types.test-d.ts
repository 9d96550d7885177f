// Compile-time checks for typed designs: a binding of the wrong dimension does not compile.
import { design, inductanceFactor, inductanceFromFactor, quantity, type FluxDensity, type Inductance, type Length } from "../../src/index.js";

const d = design("typed inductor")
  .input("pathLength", "Length", quantity(69, "mm"))
  .input("area", "Area", quantity(84, "mm^2"))
  .input("gap", "Length", { nominal: quantity(0.5, "mm"), percent: 5 })
  .input("turns", "Dimensionless", 20)
  .step("factor", inductanceFactor, (r) => ({ pathLength: r.pathLength, area: r.area, relativePermeability: 2000, gapLength: r.gap }))
  .step("inductance", inductanceFromFactor, (r) => ({ inductanceFactor: r.factor, turns: r.turns }))
  .check("inductance > 20 uH");
const L: Inductance = d.evaluate().values.inductance;
const g: Length = d.evaluate().values.pathLength;
export const ok = [L, g];

// @ts-expect-error the gap is a length; an area does not bind to it
design("x").input("area", "Area", quantity(1, "mm^2")).step("f", inductanceFactor, (r) => ({ pathLength: quantity(1, "m"), area: r.area, relativePermeability: 1, gapLength: r.area }));
// @ts-expect-error a step's result has its quantity type: an inductance is not a flux density
export const wrong: FluxDensity = d.evaluate().values.inductance;
// @ts-expect-error an unknown name is not a reference
d.step("again", inductanceFromFactor, (r) => ({ inductanceFactor: r.nothing, turns: r.turns }));
// @ts-expect-error an input's value must be of its stated dimension
design("x").input("gap", "Length", quantity(1, "mm^2"));
