import { MU0 } from "../constants/si.js";
import { ellipticByComplement, ellipticD, ellipticEMinusOne } from "../math/elliptic.js";
import { logOfRatio } from "../math/ratios.js";
import { Scaled, exponentOf, ldexp, moderate } from "../math/scaled.js";

/**
 * Nagaoka's coefficient K_N for a cylindrical current sheet of radius r and
 * length l, from k^2 = 4r^2/(4r^2 + l^2), k'^2 = l^2/(4r^2 + l^2):
 *   K_N = 4 / (3 pi k') [ (k'^2/k^2) (K - E) + E - k ]        (Nagaoka 1909)
 *       = 4 / (3 pi k') [ k'^2 D(m) + (E - 1) + k'^2/(1 + k) ],
 * since 1 - k = k'^2/(1 + k) and (K - E)/k^2 = D. In the textbook form E - k
 * cancels for short coils (k -> 1: both ~ 1, difference ~ k'^2 ln(4/k')); here
 * every term is positive (E - 1 from its series near m = 1), so no digits are
 * lost at either end. k and k' come from hypot of the geometry, not 1 - k^2.
 * A plain double that may underflow for the flattest coils (for notes and
 * ratios); `nagaokaScaled` is the form for results.
 */
export function nagaoka(radius: number, length: number): number {
  if (length / radius < PANCAKE) return (length / radius) * ((logOfRatio(radius, length) + LN8_MINUS_HALF) / Math.PI); // may underflow: for notes
  return nagaokaShape(radius, length);
}

/** Below this length/radius (k' < 1e-9) the pancake expansion is used. */
const PANCAKE = 2e-9;
/** 3 ln 2 - 1/2 = ln 8 - 1/2, to the last digit. */
const LN8_MINUS_HALF = 1.5794415416798359;

/**
 * Pancake limit: K_N = (2/pi) k' (ln(4/k') - 1/2) (1 + O(k'^2 ln k')), from the
 * expansions DLMF 19.12.1-2; below k' = 1e-9 the neglected part is < 1e-16.
 * With k' = l/(2r) (1 + O(k'^2)) this is (l/(pi r)) (ln(8r/l) - 1/2), formed
 * scaled so that a representable coefficient of a very flat coil is not lost.
 */
function pancake(radius: number, length: number): Scaled {
  return Scaled.of(length)
    .times((logOfRatio(radius, length) + LN8_MINUS_HALF) / Math.PI)
    .div(radius);
}

/** Nagaoka's coefficient as a scaled number: for the flattest coils a result that the plain double would lose to underflow is kept (see src/math/scaled.ts for the range policy). */
export function nagaokaScaled(radius: number, length: number): Scaled {
  return length / radius < PANCAKE ? pancake(radius, length) : Scaled.of(nagaokaShape(radius, length));
}

/**
 * pi r K_N / l for l < r (a short coil): ln(8r/l) - 1/2 in the pancake limit
 * (the 1/(pi r) of the expansion cancels), so it never overflows or underflows.
 */
export function shortCoilFactor(radius: number, length: number): number {
  if (length / radius < PANCAKE) return logOfRatio(radius, length) + LN8_MINUS_HALF;
  return Math.PI * (radius / length) * nagaokaShape(radius, length);
}

// The general branch, for l >= 2e-9 r. Outside moderate magnitudes both
// lengths are first scaled by the power of two that brings l into [1, 2)
// (exact), so 2r and the hypot neither overflow nor underflow; r may underflow only when r/l < 2^-1022, where K = 1
// to the last digit.
function nagaokaShape(radius: number, length: number): number {
  let r = radius;
  let l = length;
  if (!(moderate(r) && moderate(l))) {
    const s = -exponentOf(length);
    r = ldexp(radius, s);
    l = ldexp(length, s);
  }
  const h = Math.hypot(2 * r, l);
  const k = (2 * r) / h;
  const kc = l / h;
  const m = k * k;
  const mc = kc * kc;
  const bracket = mc * ellipticD(m, mc) + ellipticEMinusOne(m, mc) + mc / (1 + k);
  return (4 * bracket) / (3 * Math.PI * kc);
}

/** Scratch for ellipticByComplement's [K, E, D, E - 1]. */
const ELLIPTIC = /* @__PURE__ */ new Float64Array(4);

/**
 * Mutual inductance of two coaxial circular filaments, radii a and b, axial
 * distance d (Maxwell), in Landen's form M = 2 mu0 sqrt(ab) k1^(3/2) D(k1^2), with
 * r1 = hypot(a - b, d), r2 = hypot(a + b, d) and k1 = 4ab/(r1 + r2)^2: the
 * textbook form subtracts two nearly equal terms when the loops are far apart
 * (M ~ 1/d^3); this one has no subtraction. Evaluated for any magnitudes. Half-lengths keep r1 + r2 finite for
 * radii near the largest double; k1 = (a/h)(b/h) with h = (r1 + r2)/2 <= 2 max.
 * The complement of k1^2 is k1'^2 = (1 - k1)(1 + k1) with 1 - k1 = r1/h: for
 * circles 1e-321 m apart with 1 km radii r1/h underflows, so ln(1/k1') is then
 * taken from logarithms of r1 and h, which is all D's logarithmic form needs
 * (D ~ ln(4/k1') - 1, DLMF 19.12). M ~ mu0 a (ln(8a/d) - 2) there, 0.94 H.
 */
export function maxwellMutual(a: number, b: number, d: number): number {
  const r1 = Math.hypot(a - b, d);
  const h = 0.5 * r1 + Math.hypot(0.5 * a + 0.5 * b, 0.5 * d);
  const k1 = (a / h) * (b / h);
  const t = r1 / h; // 1 - k1 without cancellation
  const kc1 = Math.sqrt(t) * Math.sqrt(1 + k1);
  // Below 2^-1000 t has lost bits (or is 0): take the logarithm from r1 and h instead.
  const lnInvKc = t < 2 ** -1000 ? 0.5 * (Math.log(h) - Math.log(r1) - Math.log1p(k1)) : undefined;
  ellipticByComplement(kc1, ELLIPTIC, lnInvKc);
  // (sqrt(a) sqrt(b) k1) first: when k1^(3/2) alone would underflow, this product has not yet.
  return 2 * MU0 * (Math.sqrt(a) * Math.sqrt(b) * k1) * Math.sqrt(k1) * ELLIPTIC[2]!;
}
