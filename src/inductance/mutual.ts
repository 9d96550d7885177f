import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { COUNT, NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";
import { type Corner, cornerWidth, linearWeightPanel, sum3 } from "../math/sum3.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate } from "../math/scaled.js";
import { maxwellMutual } from "./shared.js";

const MAXWELL = {
  authors: "J. C. Maxwell",
  year: 1873,
  title: "A Treatise on Electricity and Magnetism, vol. 2",
  locator: "art. 701 (mutual inductance of two coaxial circles) (from memory)",
} as const;

/**
 * Mutual inductance of two coaxial circular filaments (Maxwell's formula).
 *
 * M = mu0 sqrt(a b) [ (2/k - k) K(k) - (2/k) E(k) ], k^2 = 4ab / ((a + b)^2 + d^2),
 * with a, b the radii and d the axial distance between the planes of the
 * circles, in m; K, E complete elliptic integrals; M in H.
 *
 * Exact for thin filaments. Computed in Landen's form 2 mu0 sqrt(ab) k1^(3/2) D(k1^2),
 * k1 = 4ab/(r1 + r2)^2 with r1, r2 the least and greatest distances between the
 * circles: full precision when the circles are far apart (M ~ 1/d^3, where the
 * textbook form cancels) and when they nearly touch.
 *
 * Reference: Maxwell, Treatise (1873), vol. 2, art. 701; Grover (1946), coaxial circles
 * (from memory).
 *
 * @example
 * coaxialLoopsMutualInductance({ radius1: quantity(5, "cm"), radius2: quantity(5, "cm"), distance: quantity(5, "cm") }); // ≈ 24.7 nH
 */
export const coaxialLoopsMutualInductance = /* @__PURE__ */ defineFormula({
  id: "coaxialLoopsMutualInductance",
  title: "Mutual inductance of coaxial circles",
  category: "inductance",
  description: "Mutual inductance of two coaxial circular filaments (thin loops), exact (Maxwell's formula).",
  equation: "M = mu0 sqrt(ab) [ (2/k - k) K(k) - (2/k) E(k) ], k^2 = 4ab/((a+b)^2 + d^2)",
  inputs: [
    { name: "radius1", dimension: "Length", description: "Radius of the first circle", domain: POSITIVE, example: 0.05 },
    { name: "radius2", dimension: "Length", description: "Radius of the second circle", domain: POSITIVE, example: 0.05 },
    { name: "distance", dimension: "Length", description: "Axial distance between the planes of the circles", domain: NON_NEGATIVE, example: 0.05 },
  ],
  output: { dimension: "Inductance", description: "Mutual inductance" },
  relations: [
    { rule: "the circles must not coincide (distance > 0 or radius1 != radius2)", holds: (x) => x.distance > 0 || x.radius1 !== x.radius2 },
  ],
  validity: [
    {
      code: "thin_filaments",
      when: (x) => Math.hypot(x.radius1 - x.radius2, x.distance) < 0.01 * Math.min(x.radius1, x.radius2),
      measure: (x) => cappedRatio(0.01 * Math.min(x.radius1, x.radius2), Math.hypot(x.radius1 - x.radius2, x.distance)),
      message: "the circles are within 1 % of a radius of each other: real wires of comparable radius are not filaments there; use the wires' geometric mean distance",
    },
  ],
  source: MAXWELL,
  compute: (x) => maxwellMutual(x.radius1, x.radius2, x.distance),
});

const GRADE = 0.25; // ratio of successive graded panels towards u = 0
const ORDER = 20; // Gauss-Legendre points per panel

/**
 * (1/(l1 l2)) times the double integral over both windings of the filament
 * mutual inductance: int w(t) M(a, b, |d + t|) dt, where w(t) is the overlap
 * length of the first winding with the second shifted by u = d + t (a trapezoid
 * with corners at t = +-(h1 + h2), +-|h1 - h2|).
 *
 * The weight is linear between corners (and the point u = 0, where M has a
 * logarithmic singularity for a = b, or a peak of width |a - b|), and is taken
 * by linear interpolation from the corners' exact weights at each node's offset
 * from its piece's start; the corners' positions and the widths between them are
 * formed from whole coefficients of the half lengths and d (sum3). A weight or a
 * width of the size of the shorter coil next to positions of the size of the
 * longer one would otherwise carry ulp(l1) (9e-13 relative for a coil 0.01 long
 * at the end of one 1000 long, measured against tests/inductance/oracle.ts), and
 * far apart ulp(d) (the reason the weight was first written in t, not u).
 * A piece that reaches within a quarter of its far end's |u| from u = 0 is
 * integrated on panels shrinking geometrically towards it; 20 Gauss-Legendre
 * points per panel.
 */
export function coaxialSheetsMutual(a: number, l1: number, b: number, l2: number, d: number): number {
  const hmax = Math.max(l1, l2) / 2;
  const hmin = Math.min(l1, l2) / 2;
  const lmin = 2 * hmin;
  const corner = (x: number, y: number, z: number, weight: number): Corner => ({ x, y, z, at: sum3(x * hmax, y * hmin, z * d), weight });
  // u = d + t at the trapezoid's corners; weights 0, l_min, l_min, 0.
  const corners = [corner(-1, -1, 1, 0), corner(-1, 1, 1, lmin), corner(1, -1, 1, lmin), corner(1, 1, 1, 0)];
  const gap = corners[0]!.at; // d - (h1 + h2)
  if (gap < 0) {
    // u = 0 (t = -d) lies inside: w(d) = l_min up to |h1 - h2|, then (h1 + h2) - d.
    corners.push(corner(0, 0, 0, sum3(hmax, -hmin, -d) >= 0 ? lmin : -gap));
  }
  const width = (p: Corner, q: Corner): number => cornerWidth(p, q, hmax, hmin, d);
  corners.sort((p, q) => width(q, p));
  const rule = gaussLegendre(ORDER);
  const mutual = (v: number): number => maxwellMutual(a, b, v);
  let total = 0;
  for (let i = 0; i + 1 < corners.length; i++) {
    const p = corners[i]!;
    const q = corners[i + 1]!;
    const span = width(p, q);
    // A piece shorter than 2^-64 of the windings' span adds below about 1e-18 of the integral even
    // next to the logarithmic singularity (length times ln(1/length)), and its nodes could round
    // onto u = 0 itself (centre distances of a few subnormal steps): skip it (and coinciding corners).
    if (!(span > (hmax + hmin) * 2 ** -64)) continue;
    // Integrate in v = |u| from the end nearer to u = 0 (pieces do not straddle it).
    const [start, end] = q.at <= 0 ? [q, p] : [p, q];
    const near = Math.abs(start.at);
    const slope = (end.weight - start.weight) / span;
    // One panel at offsets [lo, hi] from the near end.
    const panel = (lo: number, hi: number): number => linearWeightPanel(rule, start.weight, slope, near, lo, hi, mutual);
    const far = near + span;
    if (near >= GRADE * far) {
      total += panel(0, span);
      continue;
    }
    // Panels [GRADE hi, hi] from v = far down to v = near. Bound: hi shrinks by 4 each step and
    // the loop stops once hi GRADE < far 1e-16, so at most ceil(16 / log10(4)) + 1 = 28 iterations.
    let hi = far;
    let j = 0;
    for (; j < 60; j++) {
      const lo = hi * GRADE;
      if (lo <= near || lo < far * 1e-16) {
        total += panel(0, hi - near);
        break;
      }
      total += panel(lo - near, hi - near);
      hi = lo;
    }
    countLoop(j + 1);
  }
  return total / (l1 * l2);
}

/**
 * Mutual inductance of two coaxial single-layer coils (current sheets).
 *
 * M = (N1 N2 / (l1 l2)) int int M0(a, b, z2 - z1) dz1 dz2, with M0 Maxwell's
 * filament formula, a and b the coil radii, l1 and l2 the winding lengths and d
 * the distance between the coils' centres, all in m; M in H.
 *
 * Exact for uniform current sheets; evaluated by graded Gauss-Legendre
 * quadrature with the overlap weight written relative to the centre distance,
 * so distant coils keep their digits: relative error below 4e-15 (measured
 * 8.9e-16) against a decimal.js oracle of the difference-of-Nagaoka-sheets form
 * for equal radii, from touching coils to centre distances of 1e8 coil lengths,
 * at sizes from 1e-200 m to 1e200 m (tests/inductance/extremes-accuracy.test.ts).
 * The coils may overlap or nest (different radii).
 *
 * Reference: Maxwell's formula integrated over both windings, as in Grover (1946),
 * coaxial single-layer coils (from memory); Maxwell, Treatise (1873), art. 701 (from memory).
 *
 * @example
 * coaxialCoilsMutualInductance({ turns1: 100, radius1: quantity(1, "cm"), length1: quantity(2, "cm"),
 *   turns2: 50, radius2: quantity(1.5, "cm"), length2: quantity(1, "cm"), distance: quantity(3, "cm") }); // ≈ 6.24 µH
 */
export const coaxialCoilsMutualInductance = /* @__PURE__ */ defineFormula({
  id: "coaxialCoilsMutualInductance",
  title: "Mutual inductance of coaxial solenoids",
  category: "inductance",
  description: "Mutual inductance of two coaxial single-layer coils treated as uniform current sheets (Maxwell's formula integrated over both windings).",
  equation: "M = (N1 N2/(l1 l2)) int int M0(a, b, z2 - z1) dz1 dz2",
  inputs: [
    { name: "turns1", dimension: "Dimensionless", description: "Turns of the first coil", domain: COUNT, example: 100 },
    { name: "radius1", dimension: "Length", description: "Radius of the first coil", domain: POSITIVE, example: 0.01 },
    { name: "length1", dimension: "Length", description: "Winding length of the first coil", domain: POSITIVE, example: 0.02 },
    { name: "turns2", dimension: "Dimensionless", description: "Turns of the second coil", domain: COUNT, example: 50 },
    { name: "radius2", dimension: "Length", description: "Radius of the second coil", domain: POSITIVE, example: 0.015 },
    { name: "length2", dimension: "Length", description: "Winding length of the second coil", domain: POSITIVE, example: 0.01 },
    { name: "distance", dimension: "Length", description: "Axial distance between the coils' centres", domain: NON_NEGATIVE, example: 0.03 },
  ],
  output: { dimension: "Inductance", description: "Mutual inductance" },
  validity: [
    {
      code: "few_turns",
      when: (x) => x.turns1 < 10 || x.turns2 < 10,
      measure: (x) => 10 / Math.min(x.turns1, x.turns2),
      message: "a coil of fewer than 10 turns is not a uniform current sheet; near the windings the result is no longer accurate",
    },
  ],
  source: [MAXWELL, { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables", locator: "coaxial single-layer coils (from memory)" }],
  // M is linear in the lengths: integrate at unit size (a power-of-two scale, so the
  // rescaling is exact) and scale back; the quadrature's internal products then
  // neither underflow nor overflow for tiny or huge coils.
  compute: (x) => {
    const s = 2 ** Math.round(Math.log2(Math.max(x.radius1, x.radius2, x.length1, x.length2, Math.abs(x.distance))));
    const m = coaxialSheetsMutual(x.radius1 / s, x.length1 / s, x.radius2 / s, x.length2 / s, x.distance / s);
    return x.turns1 * x.turns2 * m * s;
  },
});

/**
 * Coupling coefficient of two inductors.
 *
 * k = M / sqrt(L1 L2), with M the mutual inductance and L1, L2 the
 * self-inductances in H; k dimensionless, |k| <= 1 for any physical pair.
 *
 * Reference: any circuits text, e.g. C. K. Alexander and M. N. O. Sadiku,
 * Fundamentals of Electric Circuits, 5th ed. (2013), sec. 13.3 (from memory).
 *
 * @example
 * couplingCoefficient({ mutualInductance: quantity(5, "uH"), inductance1: quantity(10, "uH"), inductance2: quantity(10, "uH") }); // 0.5
 */
export const couplingCoefficient = /* @__PURE__ */ defineFormula({
  id: "couplingCoefficient",
  title: "Coupling coefficient",
  category: "inductance",
  description: "Magnetic coupling coefficient k = M / sqrt(L1 L2) of two inductors.",
  equation: "k = M / sqrt(L1 L2)",
  inputs: [
    { name: "mutualInductance", dimension: "Inductance", description: "Mutual inductance (sign by the dot convention)", example: 5e-6 },
    { name: "inductance1", dimension: "Inductance", description: "Self-inductance of the first inductor", domain: POSITIVE, example: 1e-5 },
    { name: "inductance2", dimension: "Inductance", description: "Self-inductance of the second inductor", domain: POSITIVE, example: 1e-5 },
  ],
  output: { dimension: "Dimensionless", description: "Coupling coefficient" },
  validity: [
    {
      code: "coupling_above_one",
      when: (_x, k) => Math.abs(k as number) > 1,
      measure: (_x, k) => Math.abs(k as number),
      message: (_x, k) => `|k| = ${Math.abs(k as number).toPrecision(4)} exceeds 1, which no passive pair of inductors can reach: the inputs are inconsistent`,
    },
  ],
  source: { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed.", locator: "sec. 13.3 (coupling coefficient) (from memory)" },
  // Plain while the magnitudes are moderate (sqrt of each factor); otherwise
  // |M| / sqrt(L1 L2) on scaled numbers, where L1 L2 cannot overflow or underflow.
  compute: (x) => {
    const M = x.mutualInductance;
    const L1 = x.inductance1;
    const L2 = x.inductance2;
    if (moderate(L1) && moderate(L2) && (M === 0 || moderate(Math.abs(M)))) return M / (Math.sqrt(L1) * Math.sqrt(L2));
    const k = Scaled.of(Math.abs(M)).div(Scaled.of(L1).times(L2).sqrt()).toNumber();
    return M < 0 ? -k : k;
  },
});
