import { MU0, SPEED_OF_LIGHT } from "../constants/si.js";
import { AT_LEAST_ONE, NON_NEGATIVE } from "../core/spec.js";

/** The family's category, in plain words. */
export const CATEGORY = "transmission line";

/** Impedance of free space eta0 = mu0 c, ohm (CODATA 2022 mu0, exact c). */
export const ETA0 = MU0 * SPEED_OF_LIGHT;

/** The substrate's relative permittivity: 1 for air, 4.4 for a typical glass-epoxy board. */
export const SUBSTRATE_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the substrate (1 for air)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 4.4,
} as const;

/** Strip (copper) thickness; 0 means an infinitely thin strip. */
export const STRIP_THICKNESS = {
  dimension: "Length",
  description: "Thickness of the strip conductor (0 for an infinitely thin strip)",
  default: 0,
  domain: NON_NEGATIVE,
  example: 3.5e-5,
} as const;

/**
 * ln(1 + a/b) for a, b >= 0, b > 0, without forming an overflowing or
 * underflowing a/b: log1p(a/b) while a <= b, else ln a - ln b + log1p(b/a)
 * (the two logarithms then differ by at least ln 1 = 0 and their sum's
 * cancellation is bounded by log1p(b/a) >= 0, which only adds).
 */
export function logOnePlusRatio(a: number, b: number): number {
  if (a <= b) return Math.log1p(a / b);
  return Math.log(a) - Math.log(b) + Math.log1p(b / a);
}
