// High-precision oracles (decimal.js) for the windings family.
//
// R_ac / R_dc of a round wire two independent ways:
// - Kelvin functions of q = sqrt(2) a / delta by their ascending series (DLMF 10.65.3:
//   ber q = sum (-1)^k (q/2)^(4k) / ((2k)!)^2, bei q = sum (-1)^k (q/2)^(4k+2) / ((2k+1)!)^2),
//   differentiated term by term, in the textbook ratio
//   R_ac / R_dc = (q / 2) (ber q bei' q - bei q ber' q) / (ber'^2 q + bei'^2 q)
//   (e.g. S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in Communication Electronics,
//   3rd ed., sec. 5.6; from memory). At 90 digits the series' cancellation (up to
//   e^{(sqrt 2 - 1) q} ... about 15 digits at q = 80) costs nothing.
// - Hankel's expansion (DLMF 10.17.3) of J0 and J1 at z = (1 - j) a / delta, optimally truncated,
//   for a / delta >= 25 where its error, about e^{-2|z|}, is below 1e-30.
// The two agree to 30 digits where both apply (tests/windings/extremes-accuracy.test.ts).
import Decimal from "decimal.js";
import { exactDecimal } from "../helpers/exact-decimal.js";

export const D = Decimal.clone({ precision: 90, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
export type Dec = InstanceType<typeof D>;
export const PI = D.acos(-1);
export const MU0 = new D("1.25663706127e-6");

/** R_ac / R_dc from Kelvin functions of q = sqrt(2) x (DLMF 10.65.3 series), for q up to about 80. */
export function kelvinRatio(x: Dec | number): Dec {
  const q = new D(x).times(new D(2).sqrt());
  const h = q.div(2); // q/2
  const h4 = h.pow(4);
  // ber = sum (-1)^k h^(4k) / ((2k)!)^2, ber' = sum (-1)^k 4k h^(4k-1) / (2 ((2k)!)^2)
  // bei = sum (-1)^k h^(4k+2) / ((2k+1)!)^2, bei' = sum (-1)^k (4k+2) h^(4k+1) / (2 ((2k+1)!)^2)
  let ber = new D(0), berP = new D(0), bei = new D(0), beiP = new D(0);
  let fe = new D(1); // (2k)!
  let fo = new D(1); // (2k+1)!
  let hp = new D(1); // h^(4k)
  const tiny = new D("1e-100");
  for (let k = 0; k < 2000; k++) {
    if (k > 0) {
      fe = fe.times(2 * k - 1).times(2 * k);
      hp = hp.times(h4);
    }
    fo = fe.times(2 * k + 1);
    const sign = k % 2 === 0 ? 1 : -1;
    const te = hp.div(fe.pow(2)).times(sign);
    const to = hp.times(h.pow(2)).div(fo.pow(2)).times(sign);
    ber = ber.plus(te);
    bei = bei.plus(to);
    if (k > 0) berP = berP.plus(te.times(4 * k).div(h).div(2));
    beiP = beiP.plus(to.times(4 * k + 2).div(h).div(2));
    if (k > 5 && te.abs().lt(tiny) && to.abs().lt(tiny)) break;
  }
  return q.div(2).times(ber.times(beiP).minus(bei.times(berP))).div(berP.pow(2).plus(beiP.pow(2)));
}

interface C { re: Dec; im: Dec }
const add = (a: C, b: C): C => ({ re: a.re.plus(b.re), im: a.im.plus(b.im) });
const sub = (a: C, b: C): C => ({ re: a.re.minus(b.re), im: a.im.minus(b.im) });
const mul = (a: C, b: C): C => ({ re: a.re.times(b.re).minus(a.im.times(b.im)), im: a.re.times(b.im).plus(a.im.times(b.re)) });
const div = (a: C, b: C): C => {
  const n = b.re.times(b.re).plus(b.im.times(b.im));
  return { re: a.re.times(b.re).plus(a.im.times(b.im)).div(n), im: a.im.times(b.re).minus(a.re.times(b.im)).div(n) };
};
const cx = (re: Dec | number, im: Dec | number): C => ({ re: new D(re), im: new D(im) });

/** R_ac / R_dc = Re[(z/2) J0(z)/J1(z)], z = (1 - j) x, by Hankel's expansion (DLMF 10.17.3), for x >= 25. */
export function hankelRatio(x: Dec | number): Dec {
  const X = new D(x);
  const w = cx(X.times(2).pow(-1), X.times(2).pow(-1)); // 1/z
  const pq = (nu: number): { P: C; Q: C } => {
    let P = cx(1, 0), Q = cx(0, 0), a = new D(1), wk = cx(1, 0);
    let prev: Dec | undefined;
    for (let k = 1; k < 1000; k++) {
      a = a.times(4 * nu * nu - (2 * k - 1) ** 2).div(8 * k);
      wk = mul(wk, w);
      const term = { re: a.times(wk.re), im: a.times(wk.im) };
      const mag = term.re.abs().plus(term.im.abs());
      if (prev && mag.gt(prev)) break; // optimal truncation: stop at the smallest term
      prev = mag;
      const s = Math.floor(k / 2) % 2 === 0 ? 1 : -1;
      const signed = { re: term.re.times(s), im: term.im.times(s) };
      if (k % 2 === 0) P = add(P, signed);
      else Q = add(Q, signed);
      if (mag.lt("1e-100")) break;
    }
    return { P, Q };
  };
  const { P: P0, Q: Q0 } = pq(0);
  const { P: P1, Q: Q1 } = pq(1);
  // tan w0 with w0 = z - pi/4, from cos and sin of the complex argument:
  // tan(a + jb) = (sin 2a + j sinh 2b) / (cos 2a + cosh 2b). Beyond x = 120 it is -j to
  // within e^{-2x} < 1e-104 (and decimal.js's sin, cos, cosh of huge arguments would be slow).
  let t = cx(0, -1);
  if (X.lte(120)) {
    const a = X.minus(PI.div(4)), b = X.neg();
    const den = a.times(2).cos().plus(b.times(2).cosh());
    t = cx(a.times(2).sin().div(den), b.times(2).sinh().div(den));
  }
  const ratio = div(sub(P0, mul(t, Q0)), add(mul(t, P1), Q1));
  return mul(cx(X.div(2), X.neg().div(2)), ratio).re;
}

/** R_ac / R_dc at x = a / delta to about 30 digits: Kelvin series up to 25, Hankel beyond. */
export function acRatio(x: Dec | number): Dec {
  return new D(x).lte(25) ? kelvinRatio(x) : hankelRatio(x);
}

/** The exact value of a double as a decimal. */
export function exact(x: number): Dec {
  return exactDecimal(x, D);
}
