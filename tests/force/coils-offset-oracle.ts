// decimal.js oracle of the attraction of two coaxial current sheets (single-layer
// coils) for centre distances small against the windings, where the double
// integral of the filament force (tests/force/coils-oracle.ts) is a signed
// integrand whose parts cancel to the size of the offset.
//
// Maxwell's mutual inductance of coaxial circles, integrated over both windings
// (Maxwell, Treatise (1873), art. 701, m0 = M0 / mu0 as written there), gives for
// coils of half lengths h1, h2 at centre distance d
//
//   M(d) / (mu0 N1 N2) = (1 / (l1 l2)) int_{-h2}^{h2} int_{-h1}^{h1} m0(d + z2 - z1) dz1 dz2,
//
// and the attraction G = -dM/dd / (mu0 N1 N2), with Phi' = m0 and Phi odd (m0 is
// even), is
//
//   G(d) l1 l2 = Phi(d + c) + Phi(d - c) - Phi(d + s) - Phi(d - s)
//              = int_{c - d}^{c + d} m0(u) du - int_{s - d}^{s + d} m0(u) du,
//
// c = |h1 - h2|, s = h1 + h2: two integrals over windows of width 2d, both of a
// positive integrand and neither cancelling as d -> 0. Their first terms give the
// slope at concentric coils, G ~ 2 d [m0(c) - m0(s)] / (l1 l2), except for equal
// radii and equal lengths (c = 0, m0 ~ a [ln(8a/u) - 2] as u -> 0, Maxwell's
// nearly-touching circles), where
//
//   G ~ 2 d [a (ln(8a/d) - 1) - m0(s)] / (l1 l2):
//
// the force of identical coils falls as d ln(1/d), not as d. `concentricAttraction`
// evaluates these leading terms (relative error O((d / min(a, b, c))^2 ln)).
//
// The windows are integrated by Gauss-Legendre panels graded geometrically towards
// u = 0 (where m0 is log-singular for equal radii, and has branch points |a - b|
// off the real axis otherwise), the last panel at a log singularity by tanh-sinh
// (the rules of tests/force/coils-oracle.ts).
import { dec, exact, type Dec } from "../math/decimal-elliptic.js";
import { gaussLegendreDecimal, maxwellM0, tanhSinhDecimal } from "./coils-oracle.js";

const ORDER = 40; // Gauss-Legendre points per panel: Bernstein ratio 3 or more on every panel, 3^-80 = 1e-38
const GRADE = 0.25;

/** Working digits: 40, plus Maxwell's bracket's loss at the farthest argument and the spread of sizes. */
function digitsFor(a: number, l1: number, b: number, l2: number, d: number, extra: number): number {
  const span = Math.max(a, b, l1, l2, d);
  const far = (l1 + l2) / 2 + d;
  const mFar = (4 * (a / span) * (b / span)) / (((a + b) / span) ** 2 + (far / span) ** 2);
  const lg = (v: number) => Math.ceil(Math.max(0, Math.log10(v)));
  // The two windows' difference cancels like l_min / s when one coil is much shorter than the other, and
  // like (l / a)^2 for flat coils of unequal radii whose windows reach past each other (d of order l:
  // m0 is smooth there, and the four terms of Phi cancel to its third derivative): the spread of sizes twice.
  return Math.min(1000, 40 + extra + lg(1 / mFar) + 2 * lg(span / Math.min(a, b, l1, l2)) + lg(far / Math.min(l1, l2)));
}

/** int_lo^hi m0(u) du for 0 <= lo < hi, graded towards u = 0. */
function windowIntegral(A: Dec, B: Dec, lo: Dec, hi: Dec, digits: number): Dec {
  const D = dec(digits);
  const { x: nodes, w: weights } = gaussLegendreDecimal(ORDER, digits);
  const m0 = (u: Dec): Dec => maxwellM0(A, B, u, digits);
  const panel = (p: Dec, q: Dec): Dec => {
    const c = p.plus(q).div(2), hw = q.minus(p).div(2);
    let s = new D(0);
    for (let i = 0; i < ORDER; i++) s = s.plus(weights[i]!.times(m0(c.plus(hw.times(nodes[i]!)))));
    return s.times(hw);
  };
  const sigma = A.minus(B).abs(); // branch points of m0 at +-i sigma (a log singularity at 0 when sigma = 0)
  let total = new D(0);
  let x = hi;
  // Bound: x shrinks by 4 per step; it stops at lo / 4 or sigma, or (sigma = lo = 0) below 1e-30 of hi: at most 60 steps.
  for (let j = 0; j < 60; j++) {
    const next = x.times(GRADE);
    if (next.lte(lo) || x.lte(sigma)) {
      // [lo, x]: at least a panel's width from the nearest singular point, or within sigma of 0 (ratio 1 + sqrt 2 or more).
      total = total.plus(panel(lo, x));
      return total;
    }
    if (lo.isZero() && sigma.isZero() && next.lt(hi.times(1e-30))) break;
    total = total.plus(panel(next, x));
    x = next;
  }
  // [0, x] with m0 log-singular at 0: tanh-sinh, whose nodes crowd the end doubly exponentially.
  const ts = tanhSinhDecimal(digits, 1 / 16);
  let s = new D(0);
  for (let j = 0; j < ts.q.length; j++) {
    const u = x.times(ts.q[j]!);
    if (u.isZero()) continue;
    s = s.plus(ts.weight[j]!.times(m0(u)));
  }
  return total.plus(s.times(x));
}

/** int_{centre - d}^{centre + d} m0, centre >= 0, folded about u = 0 (m0 is even). */
function window(A: Dec, B: Dec, centre: Dec, half: Dec, digits: number): Dec {
  const D = dec(digits);
  if (centre.gte(half.times(2))) {
    // The window lies at least its half width from u = 0 (Bernstein ratio 2 + sqrt 3 or more): one
    // panel in the offset, d sum w_i m0(c + d x_i), so that d far below an ulp of c keeps its digits
    // (c + d rounded at the working precision moves m0 by 10^-digits of itself, not the width).
    const { x: nodes, w: weights } = gaussLegendreDecimal(ORDER, digits);
    let s = new D(0);
    for (let i = 0; i < ORDER; i++) s = s.plus(weights[i]!.times(maxwellM0(A, B, centre.plus(half.times(nodes[i]!)), digits)));
    return s.times(half);
  }
  const lo = centre.minus(half);
  const hi = centre.plus(half);
  if (lo.gte(0)) return windowIntegral(A, B, lo, hi, digits);
  return windowIntegral(A, B, new D(0), hi, digits).plus(windowIntegral(A, B, new D(0), lo.neg(), digits));
}

export interface OffsetOracleOptions {
  extraDigits?: number;
}

/** G = -dM/dd / (mu0 N1 N2) in m, positive = attraction, by the two windows (any d > 0; meant for small d). */
export function offsetAttractionOracle(a: number, l1: number, b: number, l2: number, d: number, options: OffsetOracleOptions = {}): Dec {
  const digits = digitsFor(a, l1, b, l2, d, options.extraDigits ?? 0);
  const A = exact(a, digits), B = exact(b, digits), H1 = exact(l1, digits).div(2), H2 = exact(l2, digits).div(2), Dd = exact(d, digits);
  const c = H1.minus(H2).abs();
  const s = H1.plus(H2);
  const g = window(A, B, c, Dd, digits).minus(window(A, B, s, Dd, digits));
  return g.div(exact(l1, digits).times(exact(l2, digits)));
}

/**
 * The leading term of G for d -> 0 (see the header): 2 d [m0(c) - m0(s)] / (l1 l2), and for equal
 * radii and lengths 2 d [a (ln(8a/d) - 1) - m0(s)] / (l1 l2). No quadrature.
 */
export function concentricAttraction(a: number, l1: number, b: number, l2: number, d: number, digits = 60): Dec {
  const D = dec(digits);
  const A = exact(a, digits), B = exact(b, digits), H1 = exact(l1, digits).div(2), H2 = exact(l2, digits).div(2), Dd = exact(d, digits);
  const c = H1.minus(H2).abs();
  const s = H1.plus(H2);
  const inner = c.isZero() && A.eq(B) ? A.times(new D(8).times(A).div(Dd).ln().minus(1)) : maxwellM0(A, B, c, digits);
  return Dd.times(2).times(inner.minus(maxwellM0(A, B, s, digits))).div(exact(l1, digits).times(exact(l2, digits)));
}
