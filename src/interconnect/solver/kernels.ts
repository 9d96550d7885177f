/**
 * Kernels of the 2-D field solver: the potential and the vertical field of the
 * charge elements, in free space with eps0 = 1 (the solver multiplies by eps0
 * at the end), with the 2-D log kernel
 *   phi(p) = -(1/(2 pi)) int sigma(q) ln|p - q| ds_q,   E = -grad phi.
 *
 * Elements (Harrington 1968, ch. 1-2: pulse and entire-domain expansion functions):
 *  - a straight panel carrying a uniform line density (pulse basis), integrated
 *    in closed form, so near and self terms are exact;
 *  - a circle carrying the density cos(n theta) or sin(n theta) (entire-domain
 *    Fourier basis), whose potential is the classical multipole expansion:
 *      n = 0:  -R ln(max(r, R)),
 *      n >= 1: (R/(2n)) (min(r, R)/max(r, R))^n cos(n theta)  [or sin],
 *    exact inside and outside (continuous potential, jump 1 x cos(n theta) in
 *    the normal field at r = R).
 * Ground planes enter through images evaluated at mirrored observation points
 * (an image density -sigma(Mq) has potential -phi(Mp) and vertical field
 * +E_y(Mp)), and the second plane of a two-plane section through the smooth
 * remainder of the closed-form strip Green's function (slabRemainder).
 */

const INV2PI = 1 / (2 * Math.PI);
const LN2 = Math.LN2;

/** A straight panel from (ax, ay) to (bx, by) with a uniform density. */
export interface Panel {
  readonly kind: "panel";
  readonly ax: number;
  readonly ay: number;
  readonly bx: number;
  readonly by: number;
  readonly length: number;
}

/** Density cos(n theta) (or sin) on the circle of centre (cx, cy), radius r; theta from +x. */
export interface CircleMode {
  readonly kind: "mode";
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
  readonly n: number;
  readonly sine: boolean;
}

export type Element = Panel | CircleMode;

/** u ln(u^2 + d^2), with the limit 0 at u = d = 0. */
function uLog(u: number, d2: number): number {
  const s = u * u + d2;
  return s === 0 ? 0 : u * Math.log(s);
}

/**
 * -(1/2pi) int over the panel of ln|p - q| ds_q, from the antiderivative
 *   int ln sqrt(u^2 + d^2) du = (u/2) ln(u^2 + d^2) - u + |d| atan(u/|d|)
 * (u along the panel from the point's foot, d its distance from the panel's
 * line). The difference of arctangents is the angle the panel subtends,
 * taken as one atan2 so it keeps its digits at small |d|.
 */
export function panelPotential(p: Panel, px: number, py: number): number {
  const L = p.length;
  const tx = (p.bx - p.ax) / L;
  const ty = (p.by - p.ay) / L;
  const wx = px - 0.5 * (p.ax + p.bx);
  const wy = py - 0.5 * (p.ay + p.by);
  const s = wx * tx + wy * ty;
  const d = wy * tx - wx * ty;
  const hi = s + 0.5 * L;
  const lo = s - 0.5 * L;
  const d2 = d * d;
  const ad = Math.abs(d);
  const I = 0.5 * (uLog(hi, d2) - uLog(lo, d2)) - L + (ad === 0 ? 0 : ad * Math.atan2(ad * L, d2 + hi * lo));
  return -INV2PI * I;
}

/**
 * Vertical field of the panel: E = (1/2pi) int (p - q)/|p - q|^2 ds_q, whose
 * components along the panel and along its normal (-ty, tx) are
 *   (1/4pi) ln((hi^2 + d^2)/(lo^2 + d^2))  and  (1/2pi) sign(d) x subtended angle.
 * On the panel itself (d = 0) the normal part is its principal value, 0.
 */
export function panelFieldY(p: Panel, px: number, py: number): number {
  const L = p.length;
  const tx = (p.bx - p.ax) / L;
  const ty = (p.by - p.ay) / L;
  const wx = px - 0.5 * (p.ax + p.bx);
  const wy = py - 0.5 * (p.ay + p.by);
  const s = wx * tx + wy * ty;
  const d = wy * tx - wx * ty;
  const hi = s + 0.5 * L;
  const lo = s - 0.5 * L;
  const d2 = d * d;
  const et = ty === 0 ? 0 : 0.5 * INV2PI * Math.log((hi * hi + d2) / (lo * lo + d2));
  const en = d === 0 ? 0 : INV2PI * Math.sign(d) * Math.atan2(Math.abs(d) * L, d2 + hi * lo);
  return et * ty + en * tx;
}

/** Potential of a circle mode (multipole form; exact inside and outside). */
export function modePotential(m: CircleMode, px: number, py: number): number {
  const dx = px - m.cx;
  const dy = py - m.cy;
  const rho = Math.hypot(dx, dy);
  const R = m.r;
  if (m.n === 0) return -R * Math.log(Math.max(rho, R));
  const t = rho > R ? R / rho : rho / R;
  const th = Math.atan2(dy, dx) * m.n;
  return (R / (2 * m.n)) * Math.pow(t, m.n) * (m.sine ? Math.sin(th) : Math.cos(th));
}

/** Vertical field of a circle mode, from E_r and E_theta of the multipole form. */
export function modeFieldY(m: CircleMode, px: number, py: number): number {
  const dx = px - m.cx;
  const dy = py - m.cy;
  const rho = Math.hypot(dx, dy);
  if (rho === 0) return m.n === 1 ? (m.sine ? -0.5 : 0) : 0; // inside: the n = 1 field is uniform
  const R = m.r;
  const c = dx / rho;
  const s = dy / rho;
  let er: number;
  let et: number;
  if (m.n === 0) {
    er = rho > R ? R / rho : 0;
    et = 0;
  } else {
    const outside = rho > R;
    const t = outside ? R / rho : rho / R;
    const f = (R / (2 * rho)) * Math.pow(t, m.n);
    const th = Math.atan2(dy, dx) * m.n;
    const cn = Math.cos(th);
    const sn = Math.sin(th);
    // cos mode: outside E_r = f cos, E_t = f sin; inside E_r = -f cos, E_t = f sin.
    // sin mode: cos -> sin and sin -> -cos.
    const a = m.sine ? sn : cn;
    const b = m.sine ? -cn : sn;
    er = outside ? f * a : -f * a;
    et = f * b;
  }
  return er * s + et * c;
}

export function potential(e: Element, px: number, py: number): number {
  return e.kind === "panel" ? panelPotential(e, px, py) : modePotential(e, px, py);
}

export function fieldY(e: Element, px: number, py: number): number {
  return e.kind === "panel" ? panelFieldY(e, px, py) : modeFieldY(e, px, py);
}

/** ln|sinh(a + i b)| without overflow: |sinh|^2 = sinh^2 a + sin^2 b. */
function lnAbsSinh(a: number, b: number): number {
  const aa = Math.abs(a);
  if (aa > 20) return aa - LN2; // the dropped terms are below e^-40
  const sh = Math.sinh(aa);
  const sn = Math.sin(b);
  return 0.5 * Math.log(sh * sh + sn * sn);
}

/** ln|sinh(u)/u|, by its series near u = 0 (x^2/6 - x^4/180 + x^6/2835). */
function lnAbsSinhc(a: number, b: number): number {
  const r2 = a * a + b * b;
  if (r2 < 1e-4) {
    const re2 = a * a - b * b; // Re u^2
    const re4 = re2 * re2 - 4 * a * a * b * b; // Re u^4
    const re6 = re2 * re4 - 2 * a * b * (4 * a * b * re2); // Re u^6 = Re(u^2) Re(u^4) - Im(u^2) Im(u^4), Im u^4 = 2 Re(u^2) Im(u^2)
    return re2 / 6 - re4 / 180 + re6 / 2835;
  }
  return lnAbsSinh(a, b) - 0.5 * Math.log(r2);
}

/**
 * Smooth remainder of the Green's function between grounded planes y = 0 and
 * y = b (eps0 = 1). The strip 0 < y < b maps to a half plane by w = exp(pi z/b),
 * which gives
 *   G(z, z0) = -(1/2pi) ln| sinh(k(z - z0)) / sinh(k(z - conj z0)) |,  k = pi/(2b).
 * Taking out the three logarithmic singularities (the charge, its image in
 * y = 0, its image in y = b),
 *   G = g(z - z0) - g(z - conj z0) - g(z - conj z0 - 2ib) + S,
 *   g(w) = -(1/2pi) ln|w|,
 *   S = (1/2pi) [ln k - ln|sinh u / u| + ln|sinh v/(v (v - i pi))|],  u = k(z - z0), v = k(z - conj z0).
 * S is analytic in both points while they stay inside the strip (the next zeros
 * of sinh u, sinh v are 2b away), so Gauss-Legendre integrates it to rounding.
 * As |x - x0| grows, G decays like exp(-pi |x - x0|/b); S cancels the images' growth.
 */
export function slabRemainder(px: number, py: number, qx: number, qy: number, k: number, lnK: number): number {
  const ua = k * (px - qx);
  const ub = k * (py - qy);
  const vb = k * (py + qy);
  // ln|sinh v/(v (v - i pi))| = ln|sinh v| - ln|v| - ln|v - i pi|
  const lnV = lnAbsSinh(ua, vb) - 0.5 * Math.log(ua * ua + vb * vb) - 0.5 * Math.log(ua * ua + (vb - Math.PI) * (vb - Math.PI));
  return INV2PI * (lnK - lnAbsSinhc(ua, ub) + lnV);
}
