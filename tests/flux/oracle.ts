// High-precision oracles (decimal.js, 40 digits) for closed forms used in the flux tests.
import Decimal from "decimal.js";

export const D = Decimal.clone({ precision: 40 });
export type Dec = InstanceType<typeof D>;
export const PI = D.acos(-1);
/** mu0, CODATA 2022 (the value the library uses). */
export const MU0 = new D("1.25663706127e-6");
/** eps0, CODATA 2022. */
export const EPS0 = new D("8.8541878188e-12");

/**
 * K(m) and E(m) by the arithmetic-geometric mean (DLMF 19.8.1 and 19.8.6):
 * K = pi / (2 AGM(1, sqrt(1 - m))), E = K (1 - sum 2^(n-1) c_n^2), c_0^2 = m.
 */
export function ellipticKE(m: Dec): { K: Dec; E: Dec } {
  let a = new D(1);
  let b = new D(1).minus(m).sqrt();
  let sum = m.div(2); // 2^-1 c_0^2
  let pow = new D(1); // 2^(n-1) for n = 1
  const eps = new D("1e-38");
  for (let n = 1; n < 200; n++) {
    const c = a.minus(b).div(2);
    const an = a.plus(b).div(2);
    b = a.times(b).sqrt();
    a = an;
    sum = sum.plus(pow.times(c.pow(2)));
    pow = pow.times(2);
    if (c.abs().lt(eps)) break;
  }
  const K = PI.div(a.times(2));
  return { K, E: K.times(new D(1).minus(sum)) };
}

/**
 * Field of a circular loop by Smythe's textbook expression (W. R. Smythe, Static and
 * Dynamic Electricity, 3rd ed., sec. 7.10; J. D. Jackson 3rd ed. sec. 5.5), evaluated
 * in 40 digits so its cancellations do not matter:
 *   B_z   = mu0 I / (2 pi beta) [K + (a^2 - rho^2 - z^2) E / alpha^2]
 *   B_rho = mu0 I z / (2 pi rho beta) [-K + (a^2 + rho^2 + z^2) E / alpha^2]
 * with alpha^2 = (a - rho)^2 + z^2, beta^2 = (a + rho)^2 + z^2, m = 4 a rho / beta^2.
 */
export function loopFieldOracle(current: number, radius: number, rho: number, z: number): [number, number] {
  // Exact decimal expansions of the doubles (toPrecision(100)), so the oracle sees the same inputs.
  const I = exact(current);
  const a = exact(radius);
  const r = exact(rho);
  const zz = exact(z);
  const alpha2 = a.minus(r).pow(2).plus(zz.pow(2));
  const beta2 = a.plus(r).pow(2).plus(zz.pow(2));
  const beta = beta2.sqrt();
  const m = a.times(r).times(4).div(beta2);
  const { K, E } = ellipticKE(m);
  const pre = MU0.times(I).div(PI.times(2).times(beta));
  const bz = pre.times(K.plus(a.pow(2).minus(r.pow(2)).minus(zz.pow(2)).times(E).div(alpha2)));
  const br = r.isZero()
    ? new D(0)
    : pre.times(zz).div(r).times(K.neg().plus(a.pow(2).plus(r.pow(2)).plus(zz.pow(2)).times(E).div(alpha2)));
  return [br.toNumber(), bz.toNumber()];
}

/** The exact value of a double as a Decimal (its full binary expansion). */
export function exact(x: number): Dec {
  return new D(x.toPrecision(100));
}
