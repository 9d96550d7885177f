import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";

const GROVER = { authors: "F. W. Grover", year: 1946, title: "Inductance Calculations: Working Formulas and Tables" } as const;

/** acosh(1 + s) for s >= 0 built from the small part: log1p(s + sqrt(s (2 + s))); ln(2(1 + s)) once s is huge. */
export function acosh1p(s: number): number {
  if (s > 1e8) return Math.LN2 + Math.log1p(s); // acosh(x) = ln(2x) - 1/(4x^2) - ..., the rest is below 1e-17
  return Math.log1p(s + Math.sqrt(s * (2 + s)));
}

/**
 * Rosa's partial self-inductance of a straight round wire (length l, radius r, SI),
 * written without cancellation: asinh(l/r) = ln((l + sqrt(l^2 + r^2))/r) and
 * r - sqrt(l^2 + r^2) = -l^2/(sqrt(l^2 + r^2) + r). Shared with the polyline solver.
 */
export function wirePartialSelf(l: number, r: number): number {
  return ((MU0 * l) / (2 * Math.PI)) * (Math.asinh(l / r) - l / (Math.hypot(l, r) + r) + 0.25);
}

/**
 * External inductance of a coaxial line between its conductors.
 *
 * L = mu0 l ln(b/a) / (2 pi), with a the inner conductor's radius, b the outer
 * conductor's inner radius and l the length, all in m; L in H.
 *
 * Counts only the field between the conductors: the high-frequency inductance
 * (current on the facing surfaces). At low frequency a solid inner conductor
 * adds mu0 l/(8 pi). Computed with log1p((b - a)/a) for thin gaps.
 *
 * Reference: Griffiths, Introduction to Electrodynamics, 4th ed. (2017), sec. 7.2.3;
 * Grover (1946), coaxial lines.
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
  source: { authors: "D. J. Griffiths", year: 2017, title: "Introduction to Electrodynamics, 4th ed.", locator: "sec. 7.2.3 (inductance), coaxial cable" },
  // log1p of the exact difference keeps b close to a accurate.
  compute: (x) => (MU0 * x.length * Math.log1p((x.outerRadius - x.innerRadius) / x.innerRadius)) / (2 * Math.PI),
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
 * built from s so nearly touching wires keep full precision.
 *
 * Reference: S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in
 * Communication Electronics, 3rd ed. (1994), table of transmission-line parameters.
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
      message: (x) =>
        `length is only ${(x.length / x.separation).toPrecision(3)} separations: the per-length formula neglects end effects of order separation/length`,
    },
  ],
  source: { authors: "S. Ramo, J. R. Whinnery, T. Van Duzer", year: 1994, title: "Fields and Waves in Communication Electronics, 3rd ed.", locator: "parallel-wire line parameters" },
  // acosh(1 + s) from s = (D - 2a)/(2a), formed by an exact subtraction near touching.
  compute: (x) => ((MU0 * x.length) / Math.PI) * acosh1p((x.separation - 2 * x.wireRadius) / (2 * x.wireRadius)),
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
 *
 * Validity: uniform current (skin depth well above r); the radius enters as the
 * mutual-inductance distance, which assumes a long wire (warning for l < 10 r).
 * A partial inductance: only closed loops have a measurable inductance.
 *
 * Reference: E. B. Rosa, "The self and mutual inductances of linear conductors",
 * Bull. Bureau of Standards 4 (1908) 301-344; Grover (1946), straight conductors.
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
      message: (x) =>
        `length is ${(x.length / x.radius).toPrecision(3)} radii: the formula takes the radius as the wire's own mean distance and the internal term l/4, both derived for a long wire`,
    },
  ],
  source: { authors: "E. B. Rosa", year: 1908, title: "The self and mutual inductances of linear conductors, Bull. Bureau of Standards 4, 301-344", locator: "straight cylindrical wire" },
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
 * when a > R/10).
 *
 * Reference: Grover (1946), circular rings of round wire; E. B. Rosa and
 * F. W. Grover, Bull. Bureau of Standards 8 (1912), formulas for circular rings.
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
      message: (x) =>
        `wireRadius/loopRadius = ${(x.wireRadius / x.loopRadius).toPrecision(3)}: the thin-ring formula neglects terms of order (a/R)^2 ln(8R/a), no longer small above 0.1`,
    },
  ],
  source: { ...GROVER, locator: "circular ring of round wire" },
  compute: (x) => MU0 * x.loopRadius * (Math.log((8 * x.loopRadius) / x.wireRadius) - 1.75),
});
