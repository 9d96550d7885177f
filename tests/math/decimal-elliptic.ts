// High-precision oracle for complete elliptic integrals: the arithmetic-geometric
// mean in decimal.js (DLMF 19.8.1 for K; 19.8.6, the sum of 2^(n-1) c_n^2, for E).
// The working precision is chosen per call so that textbook expressions that
// cancel in double precision (K - E at tiny m, Maxwell's (2 - m) K - 2 E) can be
// evaluated exactly as written.
import Decimal from "decimal.js";

export type Dec = Decimal;

const clones = new Map<number, typeof Decimal>();
/** A decimal.js constructor with `digits` significant digits (cached). */
export function dec(digits = 60): typeof Decimal {
  let c = clones.get(digits);
  if (!c) {
    c = Decimal.clone({ precision: digits, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
    clones.set(digits, c);
  }
  return c;
}

/**
 * K(m) and E(m) at `digits` significant digits. m and mc are taken as given
 * (exact decimal values of the doubles); mc defaults to 1 - m computed exactly.
 */
export function ellipticKE(m: number | Dec, mc?: number | Dec, digits = 60): { K: Dec; E: Dec } {
  const D = dec(digits);
  const M = new D(m);
  const MC = mc === undefined ? new D(1).minus(M) : new D(mc);
  let a = new D(1);
  let b = MC.sqrt();
  let sum = M.div(2); // 2^(-1) c_0^2, c_0^2 = m
  let pow = new D(0.5);
  const eps = new D(10).pow(-digits + 2);
  for (let n = 0; n < 400; n++) {
    const an = a.plus(b).div(2);
    const bn = a.times(b).sqrt();
    const cn = a.minus(b).div(2);
    a = an;
    b = bn;
    pow = pow.times(2);
    sum = sum.plus(pow.times(cn).times(cn));
    if (cn.abs().lte(eps.times(a))) break;
  }
  const K = D.acos(-1).div(a.times(2));
  return { K, E: K.times(new D(1).minus(sum)) };
}

/**
 * The exact value of a double as a decimal (new Decimal(x) would take the
 * shortest round-trip string, which differs from the double by up to half an ulp
 * and matters when the oracle evaluates a difference such as D - 2a).
 */
export function exact(x: number, digits = 60): Dec {
  const D = dec(digits);
  if (x === 0) return new D(0);
  const s = Math.abs(x).toString(2);
  const v = new D(`0b${s}`);
  return x < 0 ? v.neg() : v;
}

/**
 * Carlson's R_F and R_D at `digits` significant digits by the duplication
 * theorem (DLMF 19.26.18 for R_F, 19.26.20 for R_D; the steps of DLMF 19.36.1)
 * iterated until the arguments agree to 10^-(digits/2) relative, then the
 * first-order term (the error is the square of that spread). This is the
 * definition iterated at high precision, not the double-precision algorithm
 * with its Taylor tail. Arguments are the exact decimal values of the doubles.
 */
export function carlsonDecimal(kind: "F" | "D", x: number, y: number, z: number, digits = 80): Dec {
  const D = dec(digits);
  let X = exact(x, digits);
  let Y = exact(y, digits);
  let Z = exact(z, digits);
  let f = new D(1);
  let sum = new D(0);
  const eps = new D(10).pow(-Math.floor(digits / 2) - 2);
  for (let n = 0; n < 4000; n++) {
    const mx = D.max(X, Y, Z);
    const mn = D.min(X, Y, Z);
    if (mx.minus(mn).lte(eps.times(mx))) break;
    const sx = X.sqrt();
    const sy = Y.sqrt();
    const sz = Z.sqrt();
    const lam = sx.times(sy).plus(sx.times(sz)).plus(sy.times(sz));
    if (kind === "D") sum = sum.plus(f.div(sz.times(Z.plus(lam))));
    X = X.plus(lam).div(4);
    Y = Y.plus(lam).div(4);
    Z = Z.plus(lam).div(4);
    f = f.div(4);
  }
  if (kind === "F") return X.plus(Y).plus(Z).div(3).pow(-0.5);
  const A = X.plus(Y).plus(Z.times(3)).div(5);
  return f.times(A.pow(-1.5)).plus(sum.times(3));
}
