// Compile-time checks for a series input (coreLossForWaveform's waveform): each @ts-expect-error line must be a type error.
import { coreLossForWaveform, quantity, type FluxDensity, type Power } from "../../src/index.js";

const steinmetz = { coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: quantity(100, "kHz"), volume: quantity(5, "cm^3") };
const wave: readonly FluxDensity[] = [0, 0.1, 0, -0.1].map((b) => quantity(b, "T"));

const p: Power = coreLossForWaveform({ ...steinmetz, waveform: wave });
void p;

// @ts-expect-error a waveform is a series, not one flux density
coreLossForWaveform({ ...steinmetz, waveform: quantity(0.1, "T") });
// @ts-expect-error samples must be flux densities, not lengths
coreLossForWaveform({ ...steinmetz, waveform: [quantity(1, "mm"), quantity(2, "mm")] });
// @ts-expect-error plain numbers carry no dimension
coreLossForWaveform({ ...steinmetz, waveform: [0, 0.1, 0, -0.1] });
// @ts-expect-error the waveform is required
coreLossForWaveform({ ...steinmetz });
