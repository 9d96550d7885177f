import { AT_LEAST_ONE } from "../core/spec.js";

/** The dielectric's relative permittivity: 1 for vacuum (and, to 0.06 %, dry air). */
export const RELATIVE_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the dielectric (1 for vacuum)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 4.4,
} as const;
