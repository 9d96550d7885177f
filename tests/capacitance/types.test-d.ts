// Compile-time checks for the capacitance family: each @ts-expect-error line
// must be a type error, so `npm run typecheck` fails if the types stop catching it.
import {
  capacitorCharge, capacitorEnergy, coaxialCapacitance, parallelCapacitance, quantity, seriesCapacitance,
  twoWireCapacitance, type Capacitance, type Charge, type Energy, type Length,
} from "../../src/index.js";

const r: Length = quantity(0.45, "mm");
const c: Capacitance = coaxialCapacitance({ innerRadius: r, outerRadius: quantity(1.47, "mm"), length: quantity(1, "m") });
const w: Energy = capacitorEnergy({ capacitance: c, voltage: quantity(5, "V") });
const q: Charge = capacitorCharge({ capacitance: quantity(1, "uF"), voltage: quantity(5, "kV") });
const s: Capacitance = seriesCapacitance({ capacitance1: c, capacitance2: quantity(10, "pF") });
const p: Capacitance = parallelCapacitance({ capacitance1: c, capacitance2: s });
export const ok = [w, q, s, p, twoWireCapacitance({ wireRadius: r, separation: quantity(2, "mm"), length: quantity(3, "m") })];

// @ts-expect-error a capacitance is not a length
coaxialCapacitance({ innerRadius: c, outerRadius: r, length: r });
// @ts-expect-error the stored energy is an Energy, not a Charge
export const wrongCharge: Charge = capacitorEnergy({ capacitance: c, voltage: quantity(5, "V") });
// @ts-expect-error voltage must be a Voltage, not a plain number
capacitorEnergy({ capacitance: c, voltage: 5 });
// @ts-expect-error a length cannot be put in series with capacitors
seriesCapacitance({ capacitance1: c, capacitance2: r });
// @ts-expect-error both capacitances are required
parallelCapacitance({ capacitance1: c });
// @ts-expect-error separation is required
twoWireCapacitance({ wireRadius: r, length: r });
