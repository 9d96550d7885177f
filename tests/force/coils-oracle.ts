// decimal.js oracle of the axial force between two coaxial current sheets
// (single-layer coils), built from published filament formulas only:
//
//   F = (mu0 N1 N2 I1 I2 / (l1 l2)) G,  G = int_coil2 dz2 int_coil1 dz1 A(z2 - z1),
//
// A(u) = -dM0/du / mu0 the attraction of two coaxial circles (Babic and Akyel
// 2008: the filament force is I1 I2 times minus the derivative of Maxwell's
// mutual inductance). The inner integral over coil 1 is done exactly by that
// relation (the fundamental theorem of calculus), which leaves
//
//   G = int_{d-h2}^{d+h2} [m0(z - h1) - m0(z + h1)] dz,   h = l/2, d the centre distance,
//
// m0 = M0/mu0 = sqrt(ab) [(2/k - k) K(k) - (2/k) E(k)], k^2 = 4ab/((a+b)^2 + u^2)
// (Maxwell, Treatise (1873), art. 701, as written; K and E by the AGM in
// tests/math/decimal-elliptic.ts). The single integral is Gauss-Legendre
// quadrature in decimal (nodes by Newton's method at the working precision),
// on panels graded geometrically (ratio 1/4) towards the points z = +-h1 where
// an argument of m0 vanishes (log-singular for equal radii; a branch point
// |a - b| off the real axis otherwise), down to the distance of that point.
//
// This is not the library's method (src/force/coaxial-kernel.ts integrates
// the force A with the trapezoidal overlap weight); coilsDoubleIntegral below
// evaluates the double integral of Babic and Akyel's force formula as written,
// for separated coils, to check the reduction.
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { dec, ellipticKE, exact, type Dec } from "../math/decimal-elliptic.js";
import { loopsForceOracleDecimal } from "./loops-oracle.js";

/** Gauss-Legendre nodes and weights on [-1, 1] at `digits` (cached). */
const rules = new Map<string, { x: Dec[]; w: Dec[] }>();
export function gaussLegendreDecimal(n: number, digits: number): { x: Dec[]; w: Dec[] } {
  const key = `${n}:${digits}`;
  const hit = rules.get(key);
  if (hit) return hit;
  const D = dec(digits + 10);
  const x: Dec[] = [];
  const w: Dec[] = [];
  const tol = new D(10).pow(-digits - 5);
  for (let i = 0; i < n; i++) {
    let t = new D(Math.cos((Math.PI * (i + 0.75)) / (n + 0.5)));
    let dp = new D(0);
    // Newton from a double guess: quadratic convergence, 2^6 * 1e-7 digits is ample; 12 steps cap.
    for (let it = 0; it < 12; it++) {
      let p0 = new D(1);
      let p1 = t;
      for (let k = 2; k <= n; k++) {
        const p2 = t.times(p1).times(2 * k - 1).minus(p0.times(k - 1)).div(k);
        p0 = p1;
        p1 = p2;
      }
      dp = t.times(p1).minus(p0).times(n).div(t.times(t).minus(1));
      const step = p1.div(dp);
      t = t.minus(step);
      if (step.abs().lt(tol)) break;
    }
    x.push(t);
    w.push(new D(2).div(new D(1).minus(t.times(t)).times(dp.times(dp))));
  }
  const rule = { x, w };
  rules.set(key, rule);
  return rule;
}

/**
 * Tanh-sinh rule on [0, 1] at `digits` (cached): nodes q = 1 / (1 + exp(-2y)), y = (pi/2) sinh(t),
 * t = j step, and weights step (pi/4) cosh(t) / cosh(y)^2 (Takahasi and Mori 1974), truncated where
 * the weight falls below 10^-(digits + 5). q is formed without the cancellation of (1 + tanh y)/2.
 */
const tanhSinhRules = new Map<string, { q: Dec[]; weight: Dec[] }>();
export function tanhSinhDecimal(digits: number, step: number): { q: Dec[]; weight: Dec[] } {
  const key = `${digits}:${step}`;
  const hit = tanhSinhRules.get(key);
  if (hit) return hit;
  const D = dec(digits + 10);
  const h = new D(step);
  const halfPi = D.acos(-1).div(2);
  const tiny = new D(10).pow(-digits - 5);
  const q: Dec[] = [];
  const weight: Dec[] = [];
  // Bound: the weight falls doubly exponentially; at |t| = 7 it is below 1e-400 (digits <= 400). 7/step steps per side.
  const n = Math.ceil(7 / step);
  for (let j = -n; j <= n; j++) {
    const t = h.times(j);
    const y = halfPi.times(D.sinh(t));
    const w = h.times(halfPi).div(2).times(D.cosh(t)).div(D.cosh(y).pow(2));
    if (w.lt(tiny)) continue;
    q.push(new D(1).div(new D(1).plus(D.exp(y.times(-2)))));
    weight.push(w);
  }
  const rule = { q, weight };
  tanhSinhRules.set(key, rule);
  return rule;
}

/** Maxwell's m0 = M0 / mu0 of coaxial circles a, b at axial distance u (all decimals at `digits`). */
export function maxwellM0(a: Dec, b: Dec, u: Dec, digits: number): Dec {
  const D = dec(digits);
  const s = a.plus(b).pow(2).plus(u.pow(2));
  const m = new D(a.times(b).times(4)).div(s);
  const mc = new D(a.minus(b).pow(2).plus(u.pow(2))).div(s);
  const { K, E } = ellipticKE(m, mc, digits);
  const k = m.sqrt();
  const two = new D(2);
  return new D(a.times(b)).sqrt().times(two.div(k).minus(k).times(K).minus(two.div(k).times(E)));
}

export interface SheetsOracleOptions {
  /**
   * Gauss-Legendre points per panel (default 24 + 1.05 log10(span / d): Bernstein parameter 3 on graded
   * panels, 3^-48 = 1e-23 of the integrand's scale, and as many more digits as the signed integrand
   * cancels for nearly concentric coils, where G is of order d against an integrand of order 1).
   */
  order?: number;
  /** Ratio of successive graded panels (default 1/4). */
  grade?: number;
  /** Extra working digits on top of those the cancellation needs. */
  extraDigits?: number;
  /** Step of the tanh-sinh rule on a panel that ends at a log singularity (default 1/16). */
  step?: number;
}

/**
 * G = F / (mu0 N1 N2 I1 I2) in 1/m (positive = attraction): the double integral over both windings, divided by l1 l2, for radii a, b,
 * lengths l1, l2 and centre distance d, from the exact decimal values of the doubles.
 */
export function coilsAttractionOracle(a: number, l1: number, b: number, l2: number, d: number, options: SheetsOracleOptions = {}): Dec {
  const grade = options.grade ?? 0.25;
  const size = Math.min(a, b, l1, l2);
  const span = Math.max(a, b, l1, l2, d);
  // With 24 points only, identical coils 1e-20 and 1e-50 of a length off centre came out 2e-19 and 1e3 off.
  const order = options.order ?? 24 + (d > 0 ? Math.ceil(1.05 * Math.max(0, Math.log10(span / d))) : 0);
  const far = d + l1 / 2 + l2 / 2;
  // Digits: 32 for the result, plus Maxwell's bracket's loss (about log10(1/m) at the farthest
  // argument), the difference m0(z - h1) - m0(z + h1) (log10 of far / l1), the cancellation of
  // the signed integrand near concentric coils (log10 of span / d) and the spread of sizes.
  const mFar = (4 * (a / span) * (b / span)) / (((a + b) / span) ** 2 + (far / span) ** 2); // ratios: no overflow at 1e200 m
  const lg = (v: number) => Math.ceil(Math.max(0, Math.log10(v)));
  const digits = Math.min(400, 32 + (options.extraDigits ?? 0) + lg(1 / mFar) + lg(far / l1) + (d > 0 ? lg(span / d) : 0) + lg(span / size));
  const D = dec(digits);
  const A = exact(a, digits), B = exact(b, digits), H1 = exact(l1, digits).div(2), H2 = exact(l2, digits).div(2), Dd = exact(d, digits);
  const offset = A.minus(B).abs(); // the branch points of m0 sit |a - b| off the real axis
  const { x: nodes, w: weights } = gaussLegendreDecimal(order, digits);
  const g = (z: Dec): Dec => maxwellM0(A, B, z.minus(H1), digits).minus(maxwellM0(A, B, z.plus(H1), digits));
  const panel = (lo: Dec, hi: Dec): Dec => {
    const c = lo.plus(hi).div(2), hw = hi.minus(lo).div(2);
    let s = new D(0);
    for (let i = 0; i < order; i++) s = s.plus(weights[i]!.times(g(c.plus(hw.times(nodes[i]!)))));
    return s.times(hw);
  };
  const singular = [H1, H1.neg()];
  const lo = Dd.minus(H2), hi = Dd.plus(H2);
  const cuts = [lo, hi, ...singular.filter((s) => s.gt(lo) && s.lt(hi))].sort((p, q) => p.comparedTo(q));
  const ts = tanhSinhDecimal(digits, options.step ?? 1 / 16);
  // The last panel [end, end + w dir] by tanh-sinh, whose nodes crowd the ends doubly exponentially
  // (a log singularity at the end costs it nothing). Nodes nearer to the end than 10^(8 - digits) of
  // the coils' span would round onto it (or keep too few digits) and carry less than about that
  // fraction of G times a logarithm: left out.
  const floor = new D(span).times(new D(10).pow(8 - digits));
  const lastPanel = (end: Dec, w: Dec, dir: number): Dec => {
    let s = new D(0);
    for (let j = 0; j < ts.q.length; j++) {
      if (w.times(ts.q[j]!).lt(floor)) continue;
      s = s.plus(ts.weight[j]!.times(g(end.plus(w.times(ts.q[j]!).times(dir)))));
    }
    return s.times(w);
  };
  let total = new D(0);
  // Half a piece [end, mid] (either order), graded towards `end` down to the distance sigma of the
  // nearest singular point (then one Gauss-Legendre panel, 2 or more of its widths from it), or, where
  // the singular point is the end itself (sigma = 0, equal radii), down to 1e-12 of the half and then a
  // tanh-sinh panel. (A tanh-sinh panel at a singular point a little beyond the end, as this took for
  // every sigma below 1e-12 of the half, is not converged: 6e-10 of G low for identical coils 1e-20 of a
  // length off centre, 9e-3 at 1e-200, against tests/force/coils-offset-oracle.ts.)
  const half = (end: Dec, mid: Dec): Dec => {
    const width = mid.minus(end).abs();
    const dir = mid.gt(end) ? 1 : -1;
    const near = singular.map((s) => s.minus(end).abs()).reduce((p, q) => (p.lt(q) ? p : q));
    const sigma = near.pow(2).plus(offset.pow(2)).sqrt();
    const least = width.times(1e-12);
    let sum = new D(0);
    let outer = width;
    // Bound: outer shrinks by `grade` (at most 1/2) per step down to sigma, which is 0 or at least 2^-1074 of
    // the coils' span (the exact value of a double offset): at most about 1100 steps at 1/2 (cap 2200).
    for (let j = 0; j < 2200; j++) {
      if (outer.lte(sigma)) {
        const q = end.plus(outer.times(dir));
        sum = sum.plus(dir > 0 ? panel(end, q) : panel(q, end));
        break;
      }
      if (sigma.isZero() && outer.lte(least)) {
        sum = sum.plus(lastPanel(end, outer, dir));
        break;
      }
      const inner = outer.times(grade);
      const p = end.plus(inner.times(dir)), q = end.plus(outer.times(dir));
      sum = sum.plus(dir > 0 ? panel(p, q) : panel(q, p));
      outer = inner;
    }
    return sum;
  };
  for (let i = 0; i + 1 < cuts.length; i++) {
    const p = cuts[i]!, q = cuts[i + 1]!;
    if (q.lte(p)) continue;
    const mid = p.plus(q).div(2);
    total = total.plus(half(p, mid)).plus(half(q, mid));
  }
  return total.div(exact(l1, digits).times(exact(l2, digits)));
}

/** The force in N from the oracle's attraction g (a stored value or a fresh one): mu0 N1 N2 I1 I2 g (mu0 from the CODATA 2022 string). */
export function forceFromAttraction(i1: number, n1: number, i2: number, n2: number, g: Dec): number {
  const D = dec(60);
  const mu0 = constantDecimal(constant("vacuumPermeability"), D);
  return mu0.times(exact(i1)).times(exact(i2)).times(exact(n1)).times(exact(n2)).times(new D(g)).toNumber();
}

/**
 * Check of the reduction, separated coils only (d > (l1 + l2)/2, the integrand is smooth):
 * the double integral of Babic and Akyel's filament force as written
 * (tests/force/loops-oracle.ts), by an n x n Gauss-Legendre product rule, divided by mu0.
 */
export function coilsDoubleIntegral(a: number, l1: number, b: number, l2: number, d: number, n = 24, digits = 50): Dec {
  const D = dec(digits);
  const { x, w } = gaussLegendreDecimal(n, digits);
  const h1 = exact(l1, digits).div(2), h2 = exact(l2, digits).div(2), dd = exact(d, digits);
  let sum = new D(0);
  for (let i = 0; i < n; i++) {
    const z1 = h1.times(x[i]!);
    for (let j = 0; j < n; j++) {
      const z2 = dd.plus(h2.times(x[j]!));
      // loopsForceOracleDecimal takes doubles: the node distance rounded to a double costs 1e-16 of one term, so
      // the check is good to about 1e-16 (enough to confirm the reduction, not the library's last digits).
      sum = sum.plus(w[i]!.times(w[j]!).times(loopsForceOracleDecimal(1, 1, a, b, z2.minus(z1).toNumber())));
    }
  }
  const mu0 = constantDecimal(constant("vacuumPermeability"), D);
  return sum.times(h1).times(h2).div(mu0).div(exact(l1, digits).times(exact(l2, digits)));
}
