import { SPEED_OF_LIGHT } from "../constants/si.js";

// Shared caution texts and input specs of the force and particle formulas.

/**
 * Flux density above which implanted medical devices may be disturbed:
 * 0.5 mT (5 gauss), the line commonly drawn around MRI and magnet rooms
 * (common practice).
 */
export const IMPLANT_FIELD_LIMIT = 0.5e-3;

export const IMPLANT_FIELD_MESSAGE =
  "flux density above 0.5 mT (the 5 gauss line, common practice): keep people with pacemakers, " +
  "defibrillators or other implanted medical devices out, and keep loose ferromagnetic objects away; " +
  "local codes and licensed practice govern";

export const FAULT_FORCE_MESSAGE =
  "under short-circuit (fault) current the force grows with the square of the peak current and can bend " +
  "busbars, break supports and throw conductors: size conductors and supports for the peak short-circuit " +
  "current by IEC 60865-1 (short-circuit currents, calculation of effects), not for the rated current; " +
  "local codes and licensed practice govern";

export const BEAM_MESSAGE =
  "charged-particle beams are a radiation hazard (directly, and through X-rays made where the beam stops); " +
  "shielding, interlocks and radiation-protection rules apply; local codes and licensed practice govern";

/** A signed charge in C; negative for the electron. Presets: `electron.charge`, `proton.charge`. */
export const CHARGE = {
  dimension: "Charge",
  description: "Signed charge of the particle (electron.charge = -1.602176634e-19 C)",
  example: -1.602176634e-19,
} as const;

/** A rest mass in kg. Presets: `electron.mass`, `proton.mass`. */
export const PARTICLE_MASS = {
  dimension: "Mass",
  description: "Rest mass of the particle (electron.mass = 9.1093837139e-31 kg)",
  domain: { min: 0, minExclusive: true },
  example: 9.1093837139e-31,
} as const;

/** Lorentz factor of a speed, written 1/sqrt((1-b)(1+b)) so it stays exact near b = 1. */
export function lorentzFactor(speed: number): number {
  const b = speed / SPEED_OF_LIGHT;
  return 1 / Math.sqrt((1 - b) * (1 + b));
}
