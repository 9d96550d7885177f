// Compile-time checks for the inductance formulas: each @ts-expect-error line must be a type error.
import {
  coaxialLoopsMutualInductance, inductorEnergy, planarSpiralInductance, quantity, seriesInductance, solenoidInductance,
  toroidInductance, type Energy, type Inductance, type Length,
} from "../../src/index.js";

const r: Length = quantity(1, "cm");
const l: Length = quantity(2, "cm");
const L: Inductance = solenoidInductance({ turns: 100, radius: r, length: l });
const M: Inductance = coaxialLoopsMutualInductance({ radius1: r, radius2: r, distance: l });
const W: Energy = inductorEnergy({ inductance: L, current: quantity(2, "A") });
const T: Inductance = toroidInductance({ turns: 10, innerRadius: r, outerRadius: l, height: r });
const P: Inductance = planarSpiralInductance({ turns: 5, outerDiameter: l, innerDiameter: r, shape: "octagonal" });
const S: Inductance = seriesInductance({ inductance1: L, inductance2: L, mutualInductance: M, connection: "opposing" });
export const ok = [L, M, W, T, P, S];

// @ts-expect-error an inductance is not an energy
export const wrongOutput: Energy = solenoidInductance({ turns: 100, radius: r, length: l });
// @ts-expect-error a length where a current is required
inductorEnergy({ inductance: L, current: r });
// @ts-expect-error unknown shape word
planarSpiralInductance({ turns: 5, outerDiameter: l, innerDiameter: r, shape: "triangle" });
// @ts-expect-error missing length
solenoidInductance({ turns: 100, radius: r });
// @ts-expect-error an inductance where a length is required
coaxialLoopsMutualInductance({ radius1: L, radius2: r, distance: l });
// @ts-expect-error the connection is a choice word
seriesInductance({ inductance1: L, inductance2: L, connection: "series" });
