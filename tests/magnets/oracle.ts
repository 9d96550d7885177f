// decimal.js oracle of the axial field of a cylinder magnet, as published.
import { dec, exact } from "../math/decimal-elliptic.js";

/** Furlani (2001), ch. 4 (from memory): (B_r/2)[(z+L/2)/sqrt((z+L/2)^2+R^2) - (z-L/2)/sqrt((z-L/2)^2+R^2)] at enough digits for its cancellation. */
export function cylinderOracle(br: number, r: number, l: number, z: number) {
  const far = Math.max(1, Math.abs(z) / Math.min(r, l));
  const digits = Math.min(1000, 60 + Math.ceil(3 * Math.log10(far)) + Math.ceil(Math.abs(Math.log10(r / l))));
  const D = dec(digits);
  const R = exact(r, digits), L = exact(l, digits), Z = exact(z, digits);
  const u1 = Z.plus(L.div(2)), u2 = Z.minus(L.div(2));
  const term = (u: typeof R) => u.div(u.pow(2).plus(R.pow(2)).sqrt());
  return new D(exact(br, digits)).div(2).times(term(u1).minus(term(u2)));
}

