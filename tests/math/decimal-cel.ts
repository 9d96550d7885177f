// High-precision oracle for Bulirsch's generalized complete elliptic integral
// cel(kc, p, c, s): Bulirsch's Gauss transformation (Numer. Math. 13 (1969) 305,
// as restated by Derby and Olbert, Am. J. Phys. 78 (2010) 229, appendix) carried
// out in decimal.js at `digits` significant digits, iterated until the two means
// agree to 10^-(digits/2) (the error left is the square of that). The double
// routine in src/math/cel.ts stops at 2^-27; this one is checked on its own
// against the AGM values of K and E (tests/math/cel.test.ts).
import { dec, exact, type Dec } from "./decimal-elliptic.js";

export function celDecimal(kc: number | Dec, p: number | Dec, c: number | Dec, s: number | Dec, digits = 60): Dec {
  const D = dec(digits);
  const val = (v: number | Dec) => (typeof v === "number" ? exact(v, digits) : new D(v));
  let k = val(kc).abs();
  let pp = val(p).sqrt();
  let ss = val(s).div(pp);
  let cc = val(c);
  let em = new D(1);
  let f = cc;
  cc = cc.plus(ss.div(pp));
  let g = k.div(pp);
  ss = ss.plus(f.times(g)).times(2);
  pp = g.plus(pp);
  g = em;
  em = k.plus(em);
  let kk = k;
  const tol = new D(10).pow(-Math.ceil(digits / 2) - 2);
  for (let n = 0; n < 200 && g.minus(k).abs().gt(g.times(tol)); n++) {
    k = kk.sqrt().times(2);
    kk = k.times(em);
    f = cc;
    cc = cc.plus(ss.div(pp));
    g = kk.div(pp);
    ss = ss.plus(f.times(g)).times(2);
    pp = g.plus(pp);
    g = em;
    em = k.plus(em);
  }
  return D.acos(-1).div(2).times(ss.plus(cc.times(em))).div(em.times(em.plus(pp)));
}
