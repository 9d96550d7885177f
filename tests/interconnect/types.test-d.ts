// Compile-time checks for the transmission-line family: each @ts-expect-error
// line must be a type error, so `npm run typecheck` fails if the types stop catching it.
import {
  microstripEffectivePermittivity, microstripImpedance, quantity, type Length, type Resistance,
} from "../../src/index.js";

const w: Length = quantity(0.3, "mm");
const h: Length = quantity(0.16, "mm");
const z: Resistance = microstripImpedance({ width: w, height: h, relativePermittivity: 4.4, frequency: quantity(2.4, "GHz") });
const e: number = microstripEffectivePermittivity({ width: w, height: h, thickness: quantity(35, "um") });
export const ok = [z, e];

// @ts-expect-error a frequency is not a length
microstripImpedance({ width: quantity(1, "GHz"), height: h });
// @ts-expect-error the impedance is a Resistance, not a Length
export const wrong: Length = microstripImpedance({ width: w, height: h });
// @ts-expect-error height is required
microstripEffectivePermittivity({ width: w });
// @ts-expect-error frequency must be a Frequency, not a plain number
microstripImpedance({ width: w, height: h, frequency: 1e9 });
