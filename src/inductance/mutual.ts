import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { COUNT, NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { ellipticByComplement } from "../math/elliptic.js";
import { gaussLegendre } from "../math/quadrature.js";
import { maxwellMutual } from "./shared.js";

const MAXWELL = {
  authors: "J. C. Maxwell",
  year: 1873,
  title: "A Treatise on Electricity and Magnetism, vol. 2",
  locator: "art. 701 (mutual inductance of two coaxial circles)",
} as const;

/** Scratch for ellipticByComplement's [K, E, D, E - 1]. */
const ELLIPTIC = /* @__PURE__ */ new Float64Array(4);

/**
 * Maxwell's formula in Landen's form, M = 2 mu0 sqrt(ab) k1^(3/2) D(k1^2), with
 * r1 = hypot(a - b, d), r2 = hypot(a + b, d) and k1 = 4ab/(r1 + r2)^2 (as
 * maxwellMutual), evaluated for any magnitudes. Half-lengths keep r1 + r2 finite for
 * radii near the largest double; k1 = (a/h)(b/h) with h = (r1 + r2)/2 <= 2 max.
 * The complement of k1^2 is k1'^2 = (1 - k1)(1 + k1) with 1 - k1 = r1/h: for
 * circles 1e-321 m apart with 1 km radii r1/h underflows, so ln(1/k1') is then
 * taken from logarithms of r1 and h, which is all D's logarithmic form needs
 * (D ~ ln(4/k1') - 1, DLMF 19.12). M ~ mu0 a (ln(8a/d) - 2) there, 0.94 H.
 */
function coaxialCirclesMutual(a: number, b: number, d: number): number {
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
 * Reference: Maxwell, Treatise (1873), vol. 2, art. 701; Grover (1946), coaxial circles.
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
      message: "the circles are within 1 % of a radius of each other: real wires of comparable radius are not filaments there; use the wires' geometric mean distance",
    },
  ],
  source: MAXWELL,
  compute: (x) => coaxialCirclesMutual(x.radius1, x.radius2, x.distance),
});

const GRADE = 0.2; // ratio of successive graded panels towards u = 0
const ORDER = 20; // Gauss-Legendre points per panel

/**
 * (1/(l1 l2)) times the double integral over both windings of the filament
 * mutual inductance: int w(u) M(a, b, u) du, where w(u) is the overlap length of
 * the first winding with the second shifted by u (piecewise linear). The
 * integral is split at w's corners and at u = 0, where M has a logarithmic
 * singularity (a = b) or a peak of width |a - b|; panels shrink geometrically
 * towards u = 0 (ratio 0.2), which keeps the nearest singularity at least half a
 * panel away and gives about 1e-14 relative with 20 points per panel.
 */
export function coaxialSheetsMutual(a: number, l1: number, b: number, l2: number, d: number): number {
  const h1 = l1 / 2;
  const h2 = l2 / 2;
  const w = (u: number): number => Math.max(0, Math.min(h1, d + h2 - u) - Math.max(-h1, d - h2 - u));
  const cuts = [d - h1 - h2, d - Math.abs(h1 - h2), d + Math.abs(h1 - h2), d + h1 + h2];
  if (cuts[0]! < 0 && cuts[3]! > 0) cuts.push(0);
  cuts.sort((p, q) => p - q);
  const { nodes, weights } = gaussLegendre(ORDER);
  let total = 0;
  const panel = (lo: number, hi: number, sign: number): number => {
    const c = 0.5 * (lo + hi);
    const h = 0.5 * (hi - lo);
    let s = 0;
    for (let i = 0; i < ORDER; i++) {
      const v = c + h * nodes[i]!;
      s += weights[i]! * w(sign * v) * maxwellMutual(a, b, v);
    }
    return s * h;
  };
  for (let i = 0; i + 1 < cuts.length; i++) {
    const p = cuts[i]!;
    const q = cuts[i + 1]!;
    if (!(q > p)) continue;
    // Map to v = |u| in [P, Q]; M is even in u.
    const sign = q <= 0 ? -1 : 1;
    const P = sign > 0 ? p : -q;
    const Q = sign > 0 ? q : -p;
    let hi = Q;
    for (let j = 0; j < 60; j++) {
      const lo = hi * GRADE;
      if (lo <= P || lo < Q * 1e-16) {
        total += panel(P, hi, sign);
        break;
      }
      total += panel(lo, hi, sign);
      hi = lo;
    }
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
 * quadrature (relative error about 1e-13, checked against Nagaoka's closed form
 * for a sheet with itself). The coils may overlap or nest (different radii).
 *
 * Reference: Maxwell's formula integrated over both windings, as in Grover (1946),
 * coaxial single-layer coils; Maxwell, Treatise (1873), art. 701.
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
      message: "a coil of fewer than 10 turns is not a uniform current sheet; near the windings the result is no longer accurate",
    },
  ],
  source: [MAXWELL, { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables", locator: "coaxial single-layer coils" }],
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
 * Fundamentals of Electric Circuits, 5th ed. (2013), sec. 13.3.
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
      message: (_x, k) => `|k| = ${Math.abs(k as number).toPrecision(4)} exceeds 1, which no passive pair of inductors can reach: the inputs are inconsistent`,
    },
  ],
  source: { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed.", locator: "sec. 13.3 (coupling coefficient)" },
  // sqrt of each factor: L1 L2 could underflow for tiny inductances.
  compute: (x) => x.mutualInductance / (Math.sqrt(x.inductance1) * Math.sqrt(x.inductance2)),
});
