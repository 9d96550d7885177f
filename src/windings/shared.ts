// Conductor materials shared by the windings family: one definition each.
import { POSITIVE } from "../core/spec.js";

/**
 * Annealed copper at 20 degC: resistivity 1/58 ohm mm^2/m, conductivity 58.0 MS/m
 * (IEC 60028, International Annealed Copper Standard).
 */
export const ANNEALED_COPPER_CONDUCTIVITY = 58e6;
/** Annealed copper resistivity at 20 degC, ohm m (1/58 ohm mm^2/m, IEC 60028). */
export const COPPER_RESISTIVITY_20C = 1 / 58e6;
/** Temperature coefficient of resistance of annealed copper at 20 degC, 1/K (IEC 60028). */
export const COPPER_ALPHA_20C = 0.00393;
/**
 * Hard-drawn aluminium for electrical purposes at 20 degC: 0.028264 ohm mm^2/m
 * (61.0 % IACS), IEC 60889 / IEC 60111 (from memory).
 */
export const ALUMINIUM_RESISTIVITY_20C = 0.028264e-6;
/** Temperature coefficient of the same aluminium at 20 degC, 1/K (IEC 60889; from memory). */
export const ALUMINIUM_ALPHA_20C = 0.00403;
/** 20 degC in kelvin: the reference temperature of the resistivities above. */
export const REFERENCE_TEMPERATURE = 293.15;

/** The conductivity of a winding's conductor, default annealed copper. Spread it. */
export const CONDUCTOR_CONDUCTIVITY = {
  dimension: "Conductivity",
  description: "Conductivity of the conductor (default annealed copper at 20 degC, IEC 60028: 58.0 MS/m)",
  default: ANNEALED_COPPER_CONDUCTIVITY,
  domain: POSITIVE,
  example: ANNEALED_COPPER_CONDUCTIVITY,
} as const;

/** Sources of the material constants above. */
export const IEC_60028 = {
  authors: "IEC",
  year: 1925,
  title: "IEC 60028: International standard of resistance for copper",
  locator: "annealed copper 1/58 ohm mm^2/m and 0.00393/K at 20 degC (year from memory)",
} as const;
export const IEC_60889 = {
  authors: "IEC",
  year: 1987,
  title: "IEC 60889: Hard-drawn aluminium wire for overhead line conductors (resistivity as IEC 60111)",
  locator: "0.028264 ohm mm^2/m and 0.00403/K at 20 degC (from memory)",
} as const;
