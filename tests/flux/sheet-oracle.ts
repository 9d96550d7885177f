// decimal.js oracle of the field of a cylindrical current sheet as published by
// Derby and Olbert, Am. J. Phys. 78 (2010) 229 (B_rho and B_z in terms of cel), with
// cel evaluated in decimal (tests/math/decimal-cel.ts, itself checked against the
// defining integral and the AGM). Returns [F_rho, F_z] with B = mu0 K [F_rho, F_z].
import { celDecimal } from "../math/decimal-cel.js";
import { dec, ellipticKE, exact, type Dec } from "../math/decimal-elliptic.js";

/** Digits enough for the cancellation of the two end terms far away (about (distance / size)^3). */
export function sheetDigits(a: number, l: number, rho: number, z: number): number {
  const size = Math.min(a, l);
  const far = Math.max(1, Math.hypot(rho, z) / size);
  return Math.min(400, 60 + Math.ceil(4 * Math.log10(far)) + Math.ceil(Math.abs(Math.log10(a / l))));
}

export function sheetOracle(a: number, l: number, rho: number, z: number, digits = sheetDigits(a, l, rho, z)): [Dec, Dec] {
  const D = dec(digits);
  const A = exact(a, digits), B = exact(l, digits).div(2), R = exact(rho, digits), Z = exact(z, digits);
  const gamma = A.minus(R).div(A.plus(R));
  let fr = new D(0);
  let fz = new D(0);
  for (const [sign, zs] of [[1, Z.plus(B)], [-1, Z.minus(B)]] as const) {
    const h = zs.pow(2).plus(A.plus(R).pow(2)).sqrt();
    const kc = zs.pow(2).plus(A.minus(R).pow(2)).sqrt().div(h);
    const c1 = celDecimal(kc, 1, 1, -1, digits);
    let c2: Dec;
    if (gamma.isZero()) {
      const mc = kc.pow(2);
      c2 = ellipticKE(new D(1).minus(mc), mc, digits).K; // the mean of the two sides of the sheet
    } else c2 = celDecimal(kc, gamma.pow(2), 1, gamma, digits);
    fr = fr.plus(A.div(h).times(c1).times(sign));
    fz = fz.plus(zs.div(h).times(c2).times(sign));
  }
  const pi = D.acos(-1);
  return [fr.div(pi), fz.div(pi).times(A).div(A.plus(R))];
}
