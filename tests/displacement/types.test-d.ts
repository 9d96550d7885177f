// Compile-time checks for the displacement family: each @ts-expect-error line
// must be a type error, so `npm run typecheck` fails if the types stop catching it.
import * as emquant from "../../src/index.js";
import { dielectricRelaxationFrequency, parasiticCouplingCurrent, quantity, type Current, type Frequency } from "../../src/index.js";

export const f: Frequency = dielectricRelaxationFrequency({ conductivity: quantity(4, "S/m"), relativePermittivity: 81 });
export const i: Current = parasiticCouplingCurrent({ capacitance: quantity(100, "pF"), voltageSlewRate: quantity(10, "V/ns") });

// @ts-expect-error the old name is gone (renamed dielectricRelaxationFrequency, no alias)
export const old = emquant.crossoverFrequency;
// @ts-expect-error a relaxation frequency is not a current
export const wrong: Current = dielectricRelaxationFrequency({ conductivity: quantity(4, "S/m"), relativePermittivity: 81 });
// @ts-expect-error the stray capacitance is a Capacitance, not a length
parasiticCouplingCurrent({ capacitance: quantity(1, "mm"), voltageSlewRate: quantity(10, "V/ns") });
