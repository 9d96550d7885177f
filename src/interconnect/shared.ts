import { MU0, SPEED_OF_LIGHT } from "../constants/si.js";
import { AT_LEAST_ONE, NON_NEGATIVE } from "../core/spec.js";
import { ellipticByComplement } from "../math/elliptic.js";
import { ldexp } from "../math/scaled.js";

/** The family's category, in plain words. */
export const CATEGORY = "transmission line";

/** Impedance of free space eta0 = mu0 c, ohm (CODATA 2022 mu0, exact c). */
export const ETA0 = MU0 * SPEED_OF_LIGHT;

/**
 * A trace rise above 45 K puts copper in a 25 degC room above 70 degC, where brief contact can
 * burn (touch-temperature limits for accessible parts, e.g. IEC 62368-1; from memory): the same
 * threshold as the windings' hot surface.
 */
export const HOT_TRACE_RISE = 45;

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
 * ln(1 + a/b) for a >= 0, b >= 0 (not both 0), without an overflowing a/b:
 * log1p of the quotient (one rounding, condition number at most 1) while it is
 * finite; once a/b overflows, ln a - ln b, whose terms then differ by more
 * than 709, so the subtraction loses nothing (the neglected log1p(b/a) is
 * below 1e-308). A zero b gives Infinity (the caller's out_of_range).
 */
export function logOnePlusRatio(a: number, b: number): number {
  const q = a / b;
  return q <= Number.MAX_VALUE ? Math.log1p(q) : Math.log(a) - Math.log(b);
}

/** (a - b, a + b) scaled by one power of two so the sum cannot overflow: their ratio is unchanged. */
export function differenceAndSum(a: number, b: number): [number, number] {
  const big = a > 2 ** 1000 || b > 2 ** 1000;
  const x = big ? ldexp(a, -2) : a;
  const y = big ? ldexp(b, -2) : b;
  // x - y is exact when x and y are within a factor 2 (Sterbenz); elsewhere it has no cancellation.
  return [x - y, x + y];
}

const K_OUT = /* @__PURE__ */ new Float64Array(4);

/**
 * K(k)/K(k') from m = k^2 and mc = k'^2 = 1 - m, each also given as its
 * logarithm (from the geometry) so the ratio stays right where m or mc
 * underflows: ellipticByComplement takes the complementary modulus and, in
 * its logarithmic limit, ln(1/k') directly (src/math/elliptic.ts).
 */
export function ellipticRatio(m: number, mc: number, lnM: number, lnMc: number): number {
  ellipticByComplement(Math.sqrt(mc), K_OUT, -0.5 * lnMc);
  const k = K_OUT[0]!;
  ellipticByComplement(Math.sqrt(m), K_OUT, -0.5 * lnM);
  return k / K_OUT[0]!;
}
