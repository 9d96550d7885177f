import { ELEMENTARY_CHARGE, SPEED_OF_LIGHT } from "../constants/si.js";
import { formatNumber } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";

// Shared caution texts and input specs of the force and particle formulas.

/**
 * Fault-current forces: the caution applies from 1 kA. Busbar systems and the
 * short-circuit currents whose mechanical effects IEC 60865-1:2011 (3rd ed.;
 * edition from memory) calculates are in the kA range (tens of kA peak in
 * low-voltage switchboards); a conductor carrying 1 kA or more is a power
 * conductor whose supports must be checked for the fault current, while signal
 * wires, voice coils and small actuators stay far below it. The 1 kA line is
 * common practice, not a figure from the standard.
 */
export const FAULT_CURRENT_THRESHOLD = 1e3;

/**
 * The fault-current caution for a force computed from a current; `amps` picks
 * the current (for two conductors, the geometric mean of their magnitudes).
 */
export function faultCurrentCaution<X>(amps: (x: X) => number) {
  return {
    code: "fault_current_force",
    when: (x: X): boolean => amps(x) >= FAULT_CURRENT_THRESHOLD,
    measure: (x: X): number => amps(x),
    message: (x: X): string =>
      `${formatNumber(amps(x), 3)} A is in the range of busbar and short-circuit currents (caution from 1 kA, common practice): ` +
      "the force grows with the square of the current, so a fault of ten times this current gives a hundred times the force, " +
      "enough to bend busbars, break supports and throw conductors. Size conductors and supports for the peak short-circuit " +
      `current by IEC 60865-1:2011 (short-circuit currents, calculation of effects), not for the rated current. ${GOVERN}`,
  } as const;
}

/**
 * Beam caution from 5 keV kinetic energy: where a beam of that energy or more
 * stops it makes X-rays that can leave thin walls, and radiation-protection
 * rules treat apparatus accelerating electrons through more than about 5 kV as
 * an X-ray source (common practice, from memory).
 */
export const BEAM_ENERGY_THRESHOLD = 5e3 * ELEMENTARY_CHARGE;

/** The beam caution on a kinetic energy picked from the inputs (J per particle). */
export function beamCautionFor<X>(energy: (x: X) => number) {
  return {
    code: "particle_beam",
    when: (x: X): boolean => energy(x) >= BEAM_ENERGY_THRESHOLD,
    measure: (x: X): number => energy(x),
    message: (x: X): string =>
      `a kinetic energy of ${formatNumber(energy(x) / ELEMENTARY_CHARGE, 3)} eV per particle is at or above 5 keV, where a beam makes X-rays ` +
      "where it stops (common practice, from memory): charged-particle beams are a radiation hazard directly and through those X-rays; " +
      `shielding, interlocks and radiation-protection rules apply. ${GOVERN}`,
  } as const;
}

export const beamCaution = beamCautionFor((x: { readonly kineticEnergy: number }) => x.kineticEnergy);

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

/**
 * Pinch points: the caution applies from 140 N. ISO/TS 15066:2016 (collaborative
 * robots), Annex A, Table A.2, gives 140 N as the largest quasi-static contact
 * force permissible on the hand and fingers (280 N transient) (from memory). An
 * actuator that closes a gap with this force or more can trap and crush fingers;
 * below it a trapped finger can still be hurt by sharp edges or by the speed of
 * closing, which the force alone does not tell.
 */
export const PINCH_FORCE_THRESHOLD = 140;

/** The pinch-point caution for a force; `newtons` picks its magnitude (default |value|). */
export function pinchCaution<X>(newtons: (x: X, value: number | readonly number[]) => number = (_x, v) => Math.abs(v as number)) {
  return {
    code: "pinch_point",
    when: (x: X, v: number | readonly number[]): boolean => newtons(x, v) >= PINCH_FORCE_THRESHOLD,
    measure: (x: X, v: number | readonly number[]): number => newtons(x, v),
    message: (x: X, v: number | readonly number[]): string =>
      `a force of ${formatNumber(newtons(x, v), 3)} N is at or above 140 N, the largest quasi-static contact force ISO/TS 15066:2016 ` +
      "(Annex A, Table A.2; from memory) permits on the hand and fingers: a gap this force closes is a pinch and crush point. " +
      "Guard it or keep hands out by design (ISO 13857 safety distances), and remember that the force rises steeply as the gap closes. " +
      GOVERN,
  } as const;
}
