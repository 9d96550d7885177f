import { formatNumber } from "../core/format.js";
import { GOVERN, magnitude } from "../core/hazards.js";
import { AT_LEAST_ONE } from "../core/spec.js";

/** Relative permittivity of the medium around charges (1 for vacuum). */
export const MEDIUM_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the surrounding medium (1 for vacuum)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 1,
} as const;

/**
 * Dielectric strength of dry air at sea level in a uniform field, about 3 MV/m
 * (common practice; the figure quoted for centimetre gaps at 1 atm).
 */
export const AIR_BREAKDOWN_FIELD = 3e6;

/** Caution for electric fields at or beyond the breakdown strength of air; measure: |E| in V/m. */
export const BREAKDOWN_CAUTION = {
  code: "air_breakdown",
  when: (_x: unknown, value: number | readonly number[]): boolean => magnitude(value) >= AIR_BREAKDOWN_FIELD,
  measure: (_x: unknown, value: number | readonly number[]): number => magnitude(value),
  message: (_x: unknown, value: number | readonly number[]): string =>
    `field ${formatNumber(magnitude(value), 3)} V/m reaches the ~3 MV/m breakdown strength of dry air at sea level (uniform field; common practice): ` +
    `expect corona or arcing in air, and treat the source as high voltage. ${GOVERN}`,
} as const;
