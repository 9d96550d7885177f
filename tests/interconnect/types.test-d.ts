// Compile-time checks for the transmission-line family: each @ts-expect-error
// line must be a type error, so `npm run typecheck` fails if the types stop catching it.
import {
  coaxialImpedance, lineInputImpedance, microstripEffectivePermittivity, microstripImpedance, propagationDelay, quantity,
  reflectionCoefficient, twoWireImpedance, striplineImpedance, coplanarWaveguideImpedance, coupledMicrostripImpedance,
  traceCurrentForTemperatureRise, type Current, type Length, type Resistance, type Time,
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

const z0: Resistance = coaxialImpedance({ innerRadius: quantity(0.45, "mm"), outerRadius: quantity(1.47, "mm"), relativePermittivity: 2.25 });
const t: Time = propagationDelay({ length: quantity(10, "cm"), effectivePermittivity: 3.3 });
const zin: readonly Resistance[] = lineInputImpedance({ loadResistance: quantity(75, "ohm"), characteristicImpedance: z0, length: w, frequency: quantity(1, "GHz") });
export const ok2 = [t, zin, reflectionCoefficient({ loadResistance: z0, characteristicImpedance: quantity(50, "ohm") })];
// @ts-expect-error the delay is a Time, not a Length
export const wrongDelay: Length = propagationDelay({ length: w });
// @ts-expect-error a length is not a load resistance
reflectionCoefficient({ loadResistance: w, characteristicImpedance: z0 });
// @ts-expect-error the input impedance has two components, not one scalar
export const wrongZin: Resistance = lineInputImpedance({ loadResistance: z0, characteristicImpedance: z0, length: w, frequency: quantity(1, "GHz") });
// @ts-expect-error twoWireImpedance needs the separation
twoWireImpedance({ wireRadius: w });

export const ok3 = [
  striplineImpedance({ width: w, groundSpacing: quantity(0.6, "mm") }),
  coplanarWaveguideImpedance({ width: w, gap: h, height: quantity(0.5, "mm"), backing: "grounded" }),
  coupledMicrostripImpedance({ width: w, spacing: h, height: h, mode: "even" }),
];
// @ts-expect-error the backing is "none" or "grounded"
coplanarWaveguideImpedance({ width: w, gap: h, height: h, backing: "metal" });
// @ts-expect-error the mode is required
coupledMicrostripImpedance({ width: w, spacing: h, height: h });

const amps: Current = traceCurrentForTemperatureRise({ width: w, thickness: quantity(35, "um"), temperatureRise: quantity(10, "K"), layer: "internal" });
export const ok4 = [amps];
// @ts-expect-error the layer is "external" or "internal"
traceCurrentForTemperatureRise({ width: w, thickness: h, temperatureRise: quantity(10, "K"), layer: "outer" });
// @ts-expect-error the rise is a Temperature, not a plain number
traceCurrentForTemperatureRise({ width: w, thickness: h, temperatureRise: 10 });
// @ts-expect-error the result is a Current, not a Length
export const wrongAmps: Length = traceCurrentForTemperatureRise({ width: w, thickness: h, temperatureRise: quantity(10, "K") });
