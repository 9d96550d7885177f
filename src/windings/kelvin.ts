// The AC/DC resistance ratio of a round wire as a function of x = radius / skin depth,
// from Bessel functions of the complex argument z = (1 - j) x (Kelvin functions).
//
// The internal impedance per length of a round wire of radius a is
// Z = (k / (2 pi a sigma)) J0(k a) / J1(k a), k = (1 - j) / delta (time factor e^{j omega t});
// with R_dc = 1 / (pi a^2 sigma),
//   R_ac / R_dc = Re[(z / 2) J0(z) / J1(z)],  z = k a = (1 - j) x,  x = a / delta.
// In Kelvin functions of q = sqrt(2) x this is the textbook
//   (q / 2) (ber q bei' q - bei q ber' q) / (ber'^2 q + bei'^2 q).
//
// Two regions (errors measured against a decimal.js oracle in
// tests/windings/extremes-accuracy.test.ts):
// - x <= SERIES_LIMIT = 12: the ascending series of J0 and J1 (DLMF 10.2.2). With
//   u = x^2 / 2, -z^2/4 = j u, so J0 = sum (j u)^k / (k!)^2 and (z/2)^-1 J1 = sum (j u)^k / (k! (k+1)!).
//   The terms' signs rotate with j^k; the largest term exceeds |J0| by about e^{(sqrt 2 - 1) x}
//   (about 2^7 at x = 12), so up to 7 bits are lost: 1e-14 worst, just below 12, 1e-15 below 8.
//   R_ac/R_dc - 1 is formed from the difference of the two series, term by term
//   (no cancellation), so the excess ~ x^4 / 48 (= q^4 / 192) keeps its digits too.
// - x > 12: Hankel's expansion (DLMF 10.17.3) J_nu(z) ~ sqrt(2/(pi z)) (cos w P_nu - sin w Q_nu),
//   w = z - nu pi / 2 - pi / 4. Its smallest term, about e^{-2|z|}, is below 1e-14 from
//   |z| = sqrt(2) 12 on: within 1e-15 there. Both exponentials are kept through
//   tan w = -j (1 - E) / (1 + E), E = e^{-2 j w}: no overflow for any x, and the small
//   exponential still counts near the crossover, where e^{-2x} ~ 4e-11.

import { countLoop } from "../math/loop-count.js";

/** Crossover between the ascending series and Hankel's expansion (see the error bounds above). */
export const SERIES_LIMIT = 12;
/** Most terms either expansion sums (a loop of at most this many iterations). */
const MAX_TERMS = 32;
/** A term below this fraction of the sum no longer changes it (2^-60 < half an ulp). */
const NEGLIGIBLE = 2 ** -60;

/**
 * R_ac / R_dc of a round wire for x = radius / skin depth >= 0 (any finite x; Infinity
 * gives Infinity, reported by the formula as out_of_range). Within 1e-14 relative.
 */
export function roundWireResistanceRatio(x: number): number {
  if (x <= SERIES_LIMIT) return 1 + seriesExcess(x);
  return hankelRatio(x);
}

/**
 * R_ac / R_dc - 1 by the ascending series, for 0 <= x <= 12. Loop bound: at most
 * MAX_TERMS = 32 terms. At x = 12 (u = 72) term 32 is 72^32 / (32!)^2 = 4e-12 against
 * |J0| ~ 1e4: 4e-16 relative, inside the error stated above; fewer terms for smaller x.
 */
export function seriesExcess(x: number): number {
  const u = 0.5 * x * x;
  // a + jb = J0, c + jd = S1 = sum (ju)^k/(k!(k+1)!), and (a - c) + j (b - d) summed apart.
  let a = 1, b = 0, c = 1, d = 0, ac = 0, bd = 0;
  let t = 1; // u^k / (k!)^2
  let k = 1;
  for (; k <= MAX_TERMS; k++) {
    t = (t * u) / (k * k);
    const s = t / (k + 1); // u^k / (k! (k+1)!)
    const diff = t - s; // t k / (k + 1): exact enough, s < t / 2
    switch (k & 3) {
      case 0: a += t; c += s; ac += diff; break;
      case 1: b += t; d += s; bd += diff; break;
      case 2: a -= t; c -= s; ac -= diff; break;
      default: b -= t; d -= s; bd -= diff; break;
    }
    if (t <= NEGLIGIBLE * (Math.abs(a) + Math.abs(b))) break;
  }
  countLoop(Math.min(k, MAX_TERMS));
  // Re(J0 / S1) - 1 = (c (a - c) + d (b - d)) / (c^2 + d^2).
  return (c * ac + d * bd) / (c * c + d * d);
}

/**
 * R_ac / R_dc by Hankel's expansion, for x > 12. Loop bound: at most MAX_TERMS = 32 terms.
 * Term k of the expansion is a_k(nu) / z^k, shrinking by about (2k - 1)^2 / (8 k |z|) per
 * step; at |z| = 17 (x = 12) term 32 is below 1e-14 of the sum (measured), and for large x
 * the loop ends after a few terms (x = 1e6: 3).
 */
export function hankelRatio(x: number): number {
  // 1/z = (1 + j) / (2 x); powers w^k = (1 + j)^k / (2x)^k held as a complex number.
  const h = 0.5 / x;
  let wr = 1, wi = 0; // w^k
  let a0 = 1, a1 = 1; // a_k(0), a_k(1) (DLMF 10.17.1)
  let p0r = 1, p0i = 0, q0r = 0, q0i = 0, p1r = 1, p1i = 0, q1r = 0, q1i = 0;
  let k = 1;
  for (; k <= MAX_TERMS; k++) {
    const m = (2 * k - 1) * (2 * k - 1);
    a0 = (a0 * -m) / (8 * k);
    a1 = (a1 * (4 - m)) / (8 * k);
    const nr = (wr - wi) * h, ni = (wr + wi) * h; // w^k = w^(k-1) (1 + j) h
    wr = nr; wi = ni;
    // P gets the even k with sign (-1)^(k/2), Q the odd k with sign (-1)^((k-1)/2).
    const sign = (k & 2) === 0 ? 1 : -1;
    if ((k & 1) === 0) {
      p0r += sign * a0 * wr; p0i += sign * a0 * wi;
      p1r += sign * a1 * wr; p1i += sign * a1 * wi;
    } else {
      q0r += sign * a0 * wr; q0i += sign * a0 * wi;
      q1r += sign * a1 * wr; q1i += sign * a1 * wi;
    }
    if (Math.abs(a0) * (Math.abs(wr) + Math.abs(wi)) <= NEGLIGIBLE) break;
  }
  countLoop(Math.min(k, MAX_TERMS));
  // E = e^{-2 j w0} = e^{-2x} (sin 2x + j cos 2x); t = tan w0 = -j (1 - E) / (1 + E).
  // Beyond x = 40, |E| = e^{-2x} < 2e-35 cannot change the sum (and 2x may overflow).
  const e = x < 40 ? Math.exp(-2 * x) : 0;
  const er = e === 0 ? 0 : e * Math.sin(2 * x), ei = e === 0 ? 0 : e * Math.cos(2 * x);
  // (1 - E) / (1 + E), then times -j.
  const nr = 1 - er, ni = -ei, dr = 1 + er, di = ei;
  const dd = dr * dr + di * di;
  const gr = (nr * dr + ni * di) / dd, gi = (ni * dr - nr * di) / dd;
  const tr = gi, ti = -gr;
  // J0 / J1 = (P0 - t Q0) / (t P1 + Q1)
  const numR = p0r - (tr * q0r - ti * q0i), numI = p0i - (tr * q0i + ti * q0r);
  const denR = tr * p1r - ti * p1i + q1r, denI = tr * p1i + ti * p1r + q1i;
  const den2 = denR * denR + denI * denI;
  const rr = (numR * denR + numI * denI) / den2, ri = (numI * denR - numR * denI) / den2;
  // Re[(z/2) (rr + j ri)] with z/2 = (x/2)(1 - j): (x / 2) (rr + ri).
  return 0.5 * x * (rr + ri);
}
