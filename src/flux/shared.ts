import { AT_LEAST_ONE } from "../core/spec.js";

/** Relative permeability of a core material (1 for air and vacuum). */
export const RELATIVE_PERMEABILITY = {
  dimension: "Dimensionless",
  description: "Relative permeability of the core material (1 for air)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 2000,
} as const;

/** Relative permittivity of the medium around charges (1 for vacuum). */
export const MEDIUM_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the surrounding medium (1 for vacuum)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 1,
} as const;


/**
 * Flux density above which implanted medical devices (pacemakers, defibrillators)
 * may be affected: the commonly cited 0.5 mT (5 G) line. ICNIRP, "Guidelines on
 * limits of exposure to static magnetic fields", Health Physics 96 (2009) 504-514,
 * notes interference with implanted devices below the general limits; device
 * makers' guidance uses 0.5 mT. Treated here as common practice.
 */
export const IMPLANT_FIELD_LIMIT = 0.5e-3;

/** The strong-field caution shared by field-source formulas (value = |B| or components). */
export const IMPLANT_CAUTION = {
  code: "strong_field",
  when: (_x: unknown, value: number | readonly number[]): boolean => magnitude(value) >= IMPLANT_FIELD_LIMIT,
  message: (_x: unknown, value: number | readonly number[]): string =>
    `flux density ${(magnitude(value) * 1e3).toPrecision(3)} mT is at or above the 0.5 mT (5 G) line commonly cited ` +
    "for pacemakers and other implanted medical devices (ICNIRP 2009 static-field guidance, device makers' guidance; common practice): " +
    "mark and restrict the area; above a few mT loose iron parts can also be pulled in. Local codes and licensed practice govern.",
} as const;

/**
 * Extra-low-voltage line: 50 V a.c. rms (120 V ripple-free d.c.), the upper
 * bound of voltage band I in IEC 60449 / IEC 61140 (from memory).
 */
export const ELV_AC_RMS = 50;

/** Dielectric strength of dry air at sea level for uniform fields, about 3 MV/m (common practice). */
export const AIR_BREAKDOWN_FIELD = 3e6;

/** Caution for electric fields beyond the breakdown strength of air. */
export const BREAKDOWN_CAUTION = {
  code: "air_breakdown",
  when: (_x: unknown, value: number | readonly number[]): boolean => magnitude(value) >= AIR_BREAKDOWN_FIELD,
  message: (_x: unknown, value: number | readonly number[]): string =>
    `field ${(magnitude(value) / 1e6).toPrecision(3)} MV/m reaches the ~3 MV/m breakdown strength of dry air (common practice): ` +
    "expect corona or arcing in air, and treat the source as high voltage. Local codes and licensed practice govern.",
} as const;

/** |value| of a scalar, or the Euclidean norm of components. */
export function magnitude(value: number | readonly number[]): number {
  if (typeof value === "number") return Math.abs(value);
  let s = 0;
  let big = 0;
  for (const v of value) big = Math.max(big, Math.abs(v));
  if (big === 0) return 0;
  for (const v of value) s += (v / big) * (v / big);
  return big * Math.sqrt(s);
}
