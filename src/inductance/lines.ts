import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { acoshOfRatio, cappedRatio, logOfRatio } from "../math/ratios.js";
import { exponentOf, ldexp, moderate, scaledProduct } from "../math/scaled.js";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);
const MU0_OVER_PI = MU0 / Math.PI;

const GROVER = { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables" } as const;

/** 3 ln 2 - 7/4 = ln 8 - 7/4, to the last digit (loop inductance). */
const LN8_MINUS_7_4 = 0.3294415416798359;

/**
 * Rosa's partial self-inductance of a straight round wire (length l, radius r, SI):
 *   (mu0 l/(2 pi)) [ asinh(l/r) - l/(sqrt(l^2 + r^2) + r) + 1/4 ],
 * written without cancellation: asinh(l/r) = ln((l + sqrt(l^2 + r^2))/r) and
 * r - sqrt(l^2 + r^2) = -l^2/(sqrt(l^2 + r^2) + r). The bracket is at least 1/4
 * and its first two terms never cancel badly (asinh t >= t/(sqrt(1+t^2)+1)).
 * asinh(l/r) is ln 2 + ln(l/r) once l/r > 1e8 (the neglected 1/(4 t^2) is below
 * 1e-17 of it), so l/r may overflow; the ratio in the middle term is formed with
 * both lengths scaled to [1, 2) by one power of two, so its sum cannot
 * overflow. Infinity (`out_of_range`) when the result leaves the normal range.
 * Shared with the polyline solver.
 */
export function wirePartialSelf(l: number, r: number): number {
  const t = l / r;
  const asinh = t > 1e8 ? Math.LN2 + logOfRatio(l, r) : Math.asinh(t);
  let middle: number;
  if (moderate(l) && moderate(r)) middle = l / (Math.hypot(l, r) + r);
  else {
    const s = -exponentOf(Math.max(l, r));
    const ls = ldexp(l, s);
    const rs = ldexp(r, s);
    middle = ls / (Math.hypot(ls, rs) + rs);
  }
  const bracket = asinh - middle + 0.25;
  return moderate(l) ? MU0_OVER_2PI * l * bracket : scaledProduct([MU0_OVER_2PI, l, bracket]);
}

/**
 * External inductance of a coaxial line between its conductors.
 *
 * L = mu0 l ln(b/a) / (2 pi), with a the inner conductor's radius, b the outer
 * conductor's inner radius and l the length, all in m; L in H.
 *
 * Counts only the field between the conductors: the high-frequency inductance
 * (current on the facing surfaces). At low frequency a solid inner conductor
 * adds mu0 l/(8 pi). Computed with log1p((b - a)/a) for thin gaps and ln b - ln a
 * where b/a overflows; every representable result to a few ulp, `out_of_range`
 * beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (Pearson, 2013),
 * ch. 7 (from memory).
 *
 * @example
 * coaxialInductance({ innerRadius: quantity(0.5, "mm"), outerRadius: quantity(1.75, "mm"), length: quantity(1, "m") }); // ≈ 251 nH
 */
export const coaxialInductance = /* @__PURE__ */ defineFormula({
  id: "coaxialInductance",
  title: "Coaxial line inductance (external)",
  category: "inductance",
  description: "Inductance of a coaxial line from the field between the conductors (high-frequency value; internal inductance of the conductors excluded).",
  equation: "L = mu0 l ln(b/a) / (2 pi)",
  inputs: [
    { name: "innerRadius", dimension: "Length", description: "Radius of the inner conductor", domain: POSITIVE, example: 0.0005 },
    { name: "outerRadius", dimension: "Length", description: "Inner radius of the outer conductor", domain: POSITIVE, example: 0.00175 },
    { name: "length", dimension: "Length", description: "Length of the line", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Inductance", description: "External inductance" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson)", locator: "ch. 7, inductance of a coaxial cable (from memory)" },
  // logRatio keeps b close to a accurate and never forms an overflowing b/a;
  // the logarithm is in [1e-16, 1500], so only the length can need scaling.
  compute: (x) => {
    const ln = logOfRatio(x.outerRadius, x.innerRadius);
    return moderate(x.length) ? MU0_OVER_2PI * x.length * ln : scaledProduct([MU0_OVER_2PI, x.length, ln]);
  },
});

/**
 * External inductance of a two-wire line (parallel round wires, go and return).
 *
 * L = (mu0 l / pi) acosh(D / (2a)), with a the wire radius, D the centre-to-centre
 * separation and l the length, all in m; L in H.
 *
 * Exact for surface currents (high frequency), proximity effect included; it
 * tends to (mu0 l/pi) ln(D/a) for D >> a. At low frequency each wire adds
 * mu0 l/(8 pi) of internal inductance. End effects are neglected (warning when
 * the line is shorter than 10 separations). acosh(1 + s), s = (D - 2a)/(2a), is
 * built from s so nearly touching wires keep full precision; every representable
 * result to a few ulp, `out_of_range` beyond the double range or below the
 * smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Reference: S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in
 * Communication Electronics, 3rd ed. (1994), table of transmission-line parameters
 * (from memory).
 *
 * @example
 * twoWireInductance({ wireRadius: quantity(0.5, "mm"), separation: quantity(5, "mm"), length: quantity(1, "m") }); // ≈ 917 nH
 */
export const twoWireInductance = /* @__PURE__ */ defineFormula({
  id: "twoWireInductance",
  title: "Two-wire line inductance (external)",
  category: "inductance",
  description: "Loop inductance of two long parallel round wires carrying opposite currents, from the exact external field of surface currents.",
  equation: "L = (mu0 l / pi) acosh(D / (2a))",
  inputs: [
    { name: "wireRadius", dimension: "Length", description: "Radius of each wire", domain: POSITIVE, example: 0.0005 },
    { name: "separation", dimension: "Length", description: "Centre-to-centre distance of the wires", domain: POSITIVE, example: 0.005 },
    { name: "length", dimension: "Length", description: "Length of the line", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Inductance", description: "External loop inductance" },
  relations: [{ rule: "separation > 2 wireRadius (the wires must not overlap)", holds: (x) => x.separation > 2 * x.wireRadius }],
  validity: [
    {
      code: "end_effects",
      when: (x) => x.length < 10 * x.separation,
      measure: (x) => cappedRatio(10 * x.separation, x.length),
      message: (x) =>
        `length is only ${(x.length / x.separation).toPrecision(3)} separations: the per-length formula neglects end effects of order separation/length`,
    },
  ],
  source: { authors: "S. Ramo, J. R. Whinnery, T. Van Duzer", year: 1994, title: "Fields and Waves in Communication Electronics, 3rd ed.", locator: "parallel-wire line parameters (from memory)" },
  // acoshRatio: acosh(1 + s) from the exact difference near touching, ln terms
  // (no D^2) far apart; in [1e-8, 1500], so only the length can need scaling.
  compute: (x) => {
    const ach = acoshOfRatio(x.separation, 2 * x.wireRadius);
    return moderate(x.length) ? MU0_OVER_PI * x.length * ach : scaledProduct([MU0_OVER_PI, x.length, ach]);
  },
});

/**
 * Low-frequency self-inductance of a straight round wire (partial inductance).
 *
 * L = mu0/(2 pi) [ l ln((l + sqrt(l^2 + r^2))/r) - sqrt(l^2 + r^2) + r + l/4 ],
 * with l the length and r the radius in m; L in H. The last term is the internal
 * inductance of a uniform current. For l >> r it tends to (mu0 l/(2 pi))(ln(2l/r) - 3/4).
 *
 * Computed as (mu0 l/(2 pi)) [ asinh(l/r) - l/(sqrt(l^2 + r^2) + r) + 1/4 ]: the
 * logarithm is asinh(l/r) (no ratio of nearly equal numbers) and r - sqrt(l^2 + r^2)
 * is rewritten as -l^2/(sqrt(l^2 + r^2) + r), which does not cancel for l << r.
 * Scaled for extreme magnitudes (l/r up to 1e600 and beyond): every
 * representable result to a few ulp, `out_of_range` beyond the double range or
 * below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Validity: uniform current (skin depth well above r); the radius enters as the
 * mutual-inductance distance, which assumes a long wire (warning for l < 10 r).
 * A partial inductance: only closed loops have a measurable inductance.
 *
 * Reference: E. B. Rosa, "The self and mutual inductances of linear conductors",
 * Bull. Bureau of Standards 4 (1908) 301-344; Grover (1946), straight conductors
 * (from memory).
 *
 * @example
 * straightWireInductance({ length: quantity(10, "cm"), radius: quantity(0.5, "mm") }); // ≈ 104 nH
 */
export const straightWireInductance = /* @__PURE__ */ defineFormula({
  id: "straightWireInductance",
  title: "Straight wire self-inductance",
  category: "inductance",
  description: "Partial self-inductance of a straight round wire at low frequency (uniform current), including the internal inductance.",
  equation: "L = mu0/(2 pi) [ l asinh(l/r) - sqrt(l^2 + r^2) + r + l/4 ]",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the wire", domain: POSITIVE, example: 0.1 },
    { name: "radius", dimension: "Length", description: "Radius of the wire", domain: POSITIVE, example: 0.0005 },
  ],
  output: { dimension: "Inductance", description: "Partial self-inductance" },
  validity: [
    {
      code: "short_wire",
      when: (x) => x.length < 10 * x.radius,
      measure: (x) => cappedRatio(10 * x.radius, x.length),
      message: (x) =>
        `length is ${(x.length / x.radius).toPrecision(3)} radii: the formula takes the radius as the wire's own mean distance and the internal term l/4, both derived for a long wire`,
    },
  ],
  source: { authors: "E. B. Rosa", year: 1908, title: "The self and mutual inductances of linear conductors, Bull. Bureau of Standards 4, 301-344", locator: "straight cylindrical wire (volume, pages and formula from memory)" },
  compute: (x) => wirePartialSelf(x.length, x.radius),
});

/**
 * Low-frequency self-inductance of a circular loop of round wire.
 *
 * L = mu0 R (ln(8R/a) - 7/4), with R the loop radius (to the wire centre) and a
 * the wire radius in m; L in H. Includes the internal inductance of a uniform
 * current (-7/4 = -2 + 1/4).
 *
 * Validity: thin wire; terms of order (a/R)^2 ln(8R/a) are neglected (warning
 * when a > R/10). Computed as ln(R/a) + (ln 8 - 7/4), two positive terms (no
 * 8R to overflow); every representable result to a few ulp, `out_of_range`
 * beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * Reference: Grover (1946), circular rings of round wire; E. B. Rosa and
 * F. W. Grover, Bull. Bureau of Standards 8 (1912), formulas for circular rings
 * (from memory).
 *
 * @example
 * loopInductance({ loopRadius: quantity(5, "cm"), wireRadius: quantity(0.5, "mm") }); // ≈ 310 nH
 */
export const loopInductance = /* @__PURE__ */ defineFormula({
  id: "loopInductance",
  title: "Circular loop inductance",
  category: "inductance",
  description: "Self-inductance of a single circular loop of thin round wire at low frequency.",
  equation: "L = mu0 R (ln(8R/a) - 7/4)",
  inputs: [
    { name: "loopRadius", dimension: "Length", description: "Radius of the loop (to the wire centre)", domain: POSITIVE, example: 0.05 },
    { name: "wireRadius", dimension: "Length", description: "Radius of the wire", domain: POSITIVE, example: 0.0005 },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: [{ rule: "wireRadius < loopRadius", holds: (x) => x.wireRadius < x.loopRadius }],
  validity: [
    {
      code: "thick_wire",
      when: (x) => x.wireRadius > 0.1 * x.loopRadius,
      measure: (x) => x.wireRadius / (0.1 * x.loopRadius),
      message: (x) =>
        `wireRadius/loopRadius = ${(x.wireRadius / x.loopRadius).toPrecision(3)}: the thin-ring formula neglects terms of order (a/R)^2 ln(8R/a), no longer small above 0.1`,
    },
  ],
  source: { ...GROVER, locator: "circular ring of round wire (from memory)" },
  compute: (x) => {
    const bracket = logOfRatio(x.loopRadius, x.wireRadius) + LN8_MINUS_7_4; // ln(8R/a) - 7/4, in [0.33, 1500]
    return moderate(x.loopRadius) ? MU0 * x.loopRadius * bracket : scaledProduct([MU0, x.loopRadius, bracket]);
  },
});
