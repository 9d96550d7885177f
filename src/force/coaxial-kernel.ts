// The axial force between coaxial circular filaments, as the derivative of
// Maxwell's mutual inductance, in a form without cancellation; and its
// integral over two coaxial current sheets (single-layer coils).
import { ellipticByComplement } from "../math/elliptic.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";

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

/** -dM/dd / mu0 as a plain double (for the quadrature, at unit scale). */
function loopAttraction(a: number, b: number, v: number): number {
  const { factors, divisors } = loopForceTerms(a, b, v);
  let s = 1;
  for (const f of factors) s *= f;
  for (const g of divisors) s /= g;
  return s;
}

const GRADE = 0.2; // ratio of successive graded panels towards v = 0
const ORDER = 20; // Gauss-Legendre points per panel

/**
 * The attraction of two coaxial current sheets, -dM/dd / (mu0 N1 N2), for
 * radii a, b, lengths l1, l2 and centre distance d >= 0, at unit scale.
 *
 * Differentiating Maxwell's formula integrated over both windings,
 *   M(d) = (N1 N2 / (l1 l2)) int w(t) M0(d + t) dt,
 * with w(t) the overlap length of the first winding and the second shifted by
 * t (a trapezoid, corners at t = +-(h1 + h2), +-|h1 - h2|), gives
 *   -dM/dd = (N1 N2 / (l1 l2)) int w(t) A(d + t) dt,  A(u) = -dM0/du,
 * A odd in u (the filament attraction, `loopForceTerms`, times sign u).
 *   - d >= h1 + h2 (no overlap): u > 0 everywhere; integrate in t (d kept out of
 *     the nodes, so distant coils keep their digits, as in coaxialSheetsMutual),
 *     graded towards u = 0 when the coils nearly touch.
 *   - d < h1 + h2 (overlapping windings): A ~ 1/u near u = 0 for equal radii, a
 *     principal value; folding u and -u gives
 *       int_0^(d + h1 + h2) [w(v - d) - w(v + d)] A(v) dv   (w is even),
 *     whose integrand is bounded (w is Lipschitz), graded towards v = 0. d is of
 *     the order of the coils here, so v - d loses nothing that shows.
 * Each piece between the trapezoid's corners is smooth; 20 Gauss-Legendre
 * points per panel, panels shrinking by 5 towards the singular end.
 */
export function coaxialSheetsAttraction(a: number, l1: number, b: number, l2: number, d: number): number {
  const h1 = l1 / 2;
  const h2 = l2 / 2;
  const w = (t: number): number => Math.max(0, Math.min(h1, h2 - t) - Math.max(-h1, -h2 - t));
  const outer = h1 + h2;
  const inner = Math.abs(h1 - h2);
  const { nodes, weights } = gaussLegendre(ORDER);
  let total = 0;
  if (d >= outer) {
    const cuts = [-outer, -inner, inner, outer];
    // One panel in t: u = d + t.
    const panelT = (lo: number, hi: number): number => {
      const c = 0.5 * (lo + hi);
      const hw = 0.5 * (hi - lo);
      let s = 0;
      for (let i = 0; i < ORDER; i++) {
        const t = c + hw * nodes[i]!;
        s += weights[i]! * w(t) * loopAttraction(a, b, d + t);
      }
      return s * hw;
    };
    // One panel in v = u = d + t, for pieces close to u = 0 (d is of the order of l there).
    const panelV = (lo: number, hi: number): number => {
      const c = 0.5 * (lo + hi);
      const hw = 0.5 * (hi - lo);
      let s = 0;
      for (let i = 0; i < ORDER; i++) {
        const v = c + hw * nodes[i]!;
        s += weights[i]! * w(v - d) * loopAttraction(a, b, v);
      }
      return s * hw;
    };
    for (let i = 0; i + 1 < cuts.length; i++) {
      const p = cuts[i]!;
      const q = cuts[i + 1]!;
      if (!(q - p > outer * 2 ** -64)) continue; // empty piece (equal lengths): see coaxialSheetsMutual
      const near = d + p;
      const far = d + q;
      total += near >= GRADE * far ? panelT(p, q) : graded(near, far, panelV);
    }
  } else {
    // Folded: v in [0, d + outer], corners where v - d or v + d is a corner of w.
    const top = d + outer;
    const cuts = [0, top];
    for (const c of [outer, inner, -inner, -outer]) {
      for (const v of [c + d, c - d]) if (v > 0 && v < top) cuts.push(v);
    }
    cuts.sort((x, y) => x - y);
    const panelF = (lo: number, hi: number): number => {
      const c = 0.5 * (lo + hi);
      const hw = 0.5 * (hi - lo);
      let s = 0;
      for (let i = 0; i < ORDER; i++) {
        const v = c + hw * nodes[i]!;
        const weight = w(v - d) - w(v + d);
        if (weight !== 0) s += weights[i]! * weight * loopAttraction(a, b, v);
      }
      return s * hw;
    };
    for (let i = 0; i + 1 < cuts.length; i++) {
      const p = cuts[i]!;
      const q = cuts[i + 1]!;
      if (!(q - p > outer * 2 ** -64)) continue;
      total += p >= GRADE * q ? panelF(p, q) : graded(p, q, panelF);
    }
  }
  return total / (l1 * l2);
}

/**
 * Panels [GRADE hi, hi] from v = far down to v = near (singular end at v = 0).
 * Bound: hi shrinks by 5 each step and the loop stops once hi GRADE < far 1e-16
 * (the integrand is bounded, or logarithmic at worst, so what is left is below
 * 1e-16 of the piece): at most ceil(16 / log10(5)) + 1 = 24 iterations (cap 60).
 */
function graded(near: number, far: number, panel: (lo: number, hi: number) => number): number {
  let total = 0;
  let hi = far;
  let j = 0;
  for (; j < 60; j++) {
    const lo = hi * GRADE;
    if (lo <= near || lo < far * 1e-16) {
      total += panel(near, hi);
      break;
    }
    total += panel(lo, hi);
    hi = lo;
  }
  countLoop(j + 1);
  return total;
}
