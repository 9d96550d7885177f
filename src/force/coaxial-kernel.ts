// The axial force between coaxial circular filaments, as the derivative of
// Maxwell's mutual inductance, in a form without cancellation; and its
// integral over two coaxial current sheets (single-layer coils).
import { ellipticByComplement } from "../math/elliptic.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";
import { exponentOf, ldexp } from "../math/scaled.js";
import { type Corner, cornerWidth, linearWeightPanel, sum3 } from "../math/sum3.js";

/** Scratch for ellipticByComplement's [K, E, D, E - 1]. */
const ELLIPTIC = /* @__PURE__ */ new Float64Array(4);

/** Below this r1/h the bracket's D term is below 2^-880 of its E term and is left out (see loopForceTerms). */
const TOUCHING = 2 ** -900;

/**
 * The attraction -dM/dd / mu0 of two coaxial circles (radii a, b, axial
 * distance d >= 0) as factors and divisors whose product it is, for
 * `scaledProduct` (no intermediate overflow or underflow).
 *
 * Derivation. Maxwell's M = mu0 sqrt(ab) f(k), and Landen's transformation
 * (as in src/inductance/shared.ts, maxwellMutual) gives f = 2 k1^(3/2) D(k1^2)
 * = 2 k1^(-1/2) (K(k1) - E(k1)), k1 = 4ab/(r1 + r2)^2, with r1 = hypot(a - b, d),
 * r2 = hypot(a + b, d). With dK/dk = E/(k k'^2) - K/k and dE/dk = (E - K)/k
 * (DLMF 19.4.1), d(K - E)/dk = k E / k'^2, so
 *   df/dk1 = k1^(1/2) [2 E1 / k1'^2 - D1],
 * and dr/dd = d/r gives dk1/dd = -2 k1 d / (r1 r2). Hence
 *   -dM/dd = 2 mu0 sqrt(ab) k1^(3/2) (d / (r1 r2)) [2 E1 / k1'^2 - D1].
 * Every factor is positive and the bracket subtracts at most a quarter of its
 * first term (D1 k1'^2 / (2 E1) <= pi/4 / pi at k1 = 0, and falls as k1 grows), so no
 * digits are lost; the textbook bracket 2K - (2 - k^2) E / k'^2 (Babic and Akyel 2008)
 * cancels like m^2 for distant loops. k1'^2 = t (1 + k1) with t = 1 - k1 = r1/h,
 * h = (r1 + r2)/2, formed without cancellation.
 *
 * Touching filaments (t < 2^-900): D1 ~ ln(4/k1') - 1 < 750 against 2 E1/k1'^2 > 2^900,
 * so the bracket is 2 E1 h / ((1 + k1) r1) to far below an ulp; r1 appears twice as a
 * divisor so that its square never underflows.
 *
 * The caller scales the lengths so that max(a, b, d) is near 1 (the attraction
 * is scale-free: dM/dd has the dimension of mu0 alone).
 */
export function loopForceTerms(a: number, b: number, d: number): { factors: number[]; divisors: number[] } {
  const r1 = Math.hypot(a - b, d);
  const r2 = Math.hypot(a + b, d);
  const h = 0.5 * r1 + 0.5 * r2;
  const p = a / h;
  const q = b / h;
  const k1 = p * q;
  const t = r1 / h; // 1 - k1 without cancellation
  const kc1 = Math.sqrt(t) * Math.sqrt(1 + k1);
  // Below 2^-1000 t has lost bits (or is 0): take ln(1/k1') from r1 and h instead (as maxwellMutual).
  const lnInvKc = t < 2 ** -1000 ? 0.5 * (Math.log(h) - Math.log(r1) - Math.log1p(k1)) : undefined;
  ellipticByComplement(kc1, ELLIPTIC, lnInvKc);
  const e1 = ELLIPTIC[1]!;
  const d1 = ELLIPTIC[2]!;
  // sqrt(ab) k1^(3/2) = a b sqrt(p q) / h: p, q and their roots as separate factors (none underflows alone).
  const base = [2, Math.sqrt(a), Math.sqrt(b), p, q, Math.sqrt(p), Math.sqrt(q), d];
  if (t < TOUCHING) {
    base.push(2 * e1, h);
    return { factors: base, divisors: [r1, r2, 1 + k1, r1] };
  }
  base.push((2 * e1) / (t * (1 + k1)) - d1);
  return { factors: base, divisors: [r1, r2] };
}

/**
 * v A(v), the attraction times the distance, for v far below the coils' size: flat in v there
 * (a for equal radii, up to O(v^2 ln v)); below 2^-500 taken at 2^-500, where the plain product
 * of loopAttraction would underflow (subnormal distances).
 */
function flatAttraction(a: number, b: number, v: number): number {
  const at = Math.max(v, 2 ** -500);
  return at * loopAttraction(a, b, at);
}

/** -dM/dd / mu0 as a plain double (for the quadrature, at unit scale). */
function loopAttraction(a: number, b: number, v: number): number {
  const { factors, divisors } = loopForceTerms(a, b, v);
  let s = 1;
  for (const f of factors) s *= f;
  for (const g of divisors) s /= g;
  return s;
}

const GRADE = 0.25; // ratio of successive graded panels towards v = 0
const ORDER = 20; // Gauss-Legendre points per panel

/**
 * The attraction of two coaxial current sheets, -dM/dd / (mu0 N1 N2), for
 * radii a, b, lengths l1, l2 and centre distance d >= 0, at unit scale, as
 * factors and divisors for `scaledProduct` (the sum and the powers of two that
 * kept its terms near 1: see the weights' and terms' scaling below).
 *
 * Differentiating Maxwell's formula integrated over both windings,
 *   M(d) = (N1 N2 / (l1 l2)) int w(t) M0(d + t) dt,
 * with w(t) the overlap length of the first winding and the second shifted by
 * t (a trapezoid, corners at t = +-(h1 + h2), +-|h1 - h2|), gives
 *   -dM/dd = (N1 N2 / (l1 l2)) int w(t) A(d + t) dt,  A(u) = -dM0/du,
 * A odd in u (the filament attraction, `loopForceTerms`, times sign u).
 *   - d >= h1 + h2 (no overlap): u = d + t > 0 everywhere, weight w(u - d).
 *   - d < h1 + h2 (overlapping windings): A ~ 1/u near u = 0 for equal radii, a
 *     principal value; folding u and -u gives
 *       int_0^(d + h1 + h2) [w(v - d) - w(v + d)] A(v) dv   (w is even),
 *     whose weight is bounded (w is Lipschitz): the length of [|v - d|, v + d]
 *     inside [|h1 - h2|, h1 + h2].
 * Either way the weight is linear between corners (`Corner`), and is taken
 * there by linear interpolation from the corners' exact weights at the node's
 * offset from the piece's start, never as a difference of w values: a weight of
 * order d or l2 next to positions of order l1 would carry ulp(l1) (1e-10
 * relative for nearly concentric coils, d = 1e-6 l, and 1e-12 for a 0.01 m coil
 * deep inside a 1.7 m one, measured against tests/force/coils-oracle.ts).
 * Each piece is smooth; 20 Gauss-Legendre points per panel, panels shrinking by
 * 4 towards u = 0 where a piece starts within a quarter of its end from it. (By 5,
 * panels [0.2 u, u] of the far field, A ~ u^-4, kept only 2e-14: long coils.)
 */
export function coaxialSheetsAttraction(a: number, l1: number, b: number, l2: number, d: number): { factors: number[]; divisors: number[] } {
  const hmax = Math.max(l1, l2) / 2;
  const hmin = Math.min(l1, l2) / 2;
  const lmin = 2 * hmin;
  const corner = (x: number, y: number, z: number, weight: number): Corner => ({ x, y, z, at: sum3(x * hmax, y * hmin, z * d), weight });
  const gap = sum3(d, -hmax, -hmin); // d - (h1 + h2), exactly as far as it matters
  let corners: Corner[];
  if (gap >= 0) {
    // u = d + t: the trapezoid's corners in u, weights 0, l_min, l_min, 0.
    corners = [corner(-1, -1, 1, 0), corner(-1, 1, 1, lmin), corner(1, -1, 1, lmin), corner(1, 1, 1, 0)];
  } else {
    corners = [
      corner(0, 0, 0, 0),
      corner(1, 1, 1, 0), // v = d + outer: |v - d| = outer
      corner(1, 1, -1, Math.min(2 * Math.min(d, -gap), lmin)), // v = outer - d: v + d = outer
      corner(1, -1, 1, Math.min(2 * d, lmin)), // v = inner + d: |v - d| = inner
    ];
    const innerMinusD = sum3(hmax, -hmin, -d);
    if (innerMinusD > 0) corners.push(corner(1, -1, -1, 0)); // v = inner - d: v + d = inner
    else if (innerMinusD < 0) corners.push(corner(-1, 1, 1, Math.min(-2 * innerMinusD, lmin))); // v = d - inner: |v - d| = inner
  }
  // The weights are at most l_min and, for nearly concentric coils, of the order of d (subnormal
  // at the least offsets): brought to [1, 2) by a power of two (exact, also for subnormals), so
  // that no product in the sum underflows; the power goes back with the result (`scale`). Without
  // it the sum lost 1e-9 of itself at d = 1e-310 and all of it at a few subnormal steps.
  const k = -exponentOf(Math.max(...corners.map((c) => c.weight)));
  corners = corners.map((c) => ({ ...c, weight: ldexp(c.weight, k) }));
  const width = (p: Corner, q: Corner): number => cornerWidth(p, q, hmax, hmin, d);
  corners.sort((p, q) => width(q, p));
  const rule = gaussLegendre(ORDER);
  const { nodes, weights } = rule;
  // The sum's terms are of the size A(L) L, L the windings' extent: for flat coils of unequal radii
  // (lengths 1e-160 of a radius and less) about L^2, which underflowed (0 at 1e-200). Scaled by
  // 2^j to about 1 (exact: a power of two; j = 0 for coils of comparable sizes), j returned with the result.
  const extent = hmax + hmin;
  const j = Math.max(-1000, Math.min(1000, -(exponentOf(loopAttraction(a, b, extent)) + exponentOf(extent))));
  const unit = ldexp(1, j);
  const attraction = (v: number): number => loopAttraction(a, b, v) * unit;
  let total = 0;
  for (let i = 0; i + 1 < corners.length; i++) {
    const p = corners[i]!;
    const q = corners[i + 1]!;
    const span = width(p, q);
    if (!(span > 0)) continue; // coinciding corners
    // A piece shorter than 2^-64 of the windings' span. From u = 0 (nearly concentric equal coils)
    // its nodes could round onto u = 0 itself (centre distances of a few subnormal steps); it adds
    // int_0^span (slope o) A(o) do = weight(span) (v A(v)), v A(v) flat there (the touching-filament
    // limit a of the attraction, or ~0 for unequal radii): 1/ln(l/d) of the whole. Away from u = 0
    // it starts at |h1 - h2| - d, at least 2^-53 of the windings' span as long as that is a normal
    // number at unit scale, so far more than its width from u = 0: one panel in the fraction of its
    // width (the slope itself, a weight over a subnormal width, would overflow). It adds about
    // (d / |h1 - h2|) / ln of the whole, not negligible where the turns of equal radii nearly meet
    // (6e-6 when skipped, as this did, for lengths 2^-52 apart 2.5e-20 off centre).
    if (!(span > (hmax + hmin) * 2 ** -64)) {
      if (p.at === 0) total += q.weight * flatAttraction(a, b, span) * unit;
      else {
        let s = 0;
        for (let i = 0; i < ORDER; i++) {
          const t = 0.5 + 0.5 * nodes[i]!;
          s += weights[i]! * (p.weight + (q.weight - p.weight) * t) * attraction(p.at + span * t);
        }
        total += 0.5 * s * span;
      }
      continue;
    }
    const slope = (q.weight - p.weight) / span;
    // One panel at offsets [lo, hi] from the piece's start.
    const panel = (lo: number, hi: number): number => linearWeightPanel(rule, p.weight, slope, p.at, lo, hi, attraction);
    const near = p.at;
    const far = near + span;
    // Graded in the position itself towards u = 0 (offsets from near; near < far / 4, so no digits are lost).
    // One panel in s = ln u over [near, hi] (for the tail below 1e-16 of the piece, see graded).
    const logPanel = (hi: number): number => {
      const s0 = Math.log(near);
      const hs = 0.5 * (Math.log(hi) - s0);
      let sum = 0;
      for (let i = 0; i < ORDER; i++) {
        const v = Math.exp(s0 + hs * (1 + nodes[i]!));
        const weight = p.weight + slope * (v - near);
        if (weight > 0) sum += weights[i]! * weight * flatAttraction(a, b, v);
      }
      return sum * hs * unit;
    };
    total += near >= GRADE * far ? panel(0, span) : graded(near, far, (lo, hi) => panel(lo === near ? 0 : lo - near, hi - near), logPanel);
  }
  return { factors: [total, ldexp(1, -k), ldexp(1, -j)], divisors: [l1, l2] };
}

/**
 * Panels [GRADE hi, hi] from v = far down to v = near (singular end at v = 0).
 * Bound: hi shrinks by 4 each step and the loop stops once hi GRADE < far 1e-16:
 * at most ceil(16 / log10(4)) + 1 = 28 iterations (cap 60). What is left, [near, hi]
 * with hi below 1e-16 of the piece, is one panel in v when near = 0 (the integrand
 * is bounded there, so it adds below 1e-16) and otherwise one panel in ln v
 * (`tail`): nearly concentric equal coils (d < 1e-16 l) carry a weight 2d against
 * the filament attraction ~ 1/v from v = d up, 2d ln(l/d) in all, whose decades
 * below 1e-16 l are no small part (the sum came out 10 times low at d = 1e-200 l,
 * 0 before the weights were exact); v A(v) is flat there, as ln v runs.
 */
function graded(near: number, far: number, panel: (lo: number, hi: number) => number, tail: (hi: number) => number): number {
  let total = 0;
  let hi = far;
  let j = 0;
  for (; j < 60; j++) {
    const lo = hi * GRADE;
    if (lo <= near) {
      total += panel(near, hi);
      break;
    }
    if (lo < far * 1e-16) {
      total += near > 0 ? tail(hi) : panel(near, hi);
      break;
    }
    total += panel(lo, hi);
    hi = lo;
  }
  countLoop(j + 1);
  return total;
}
