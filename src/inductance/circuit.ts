import { defineFormula } from "../core/formula.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";

const CIRCUITS = { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed." } as const;

/** Cautions for anything that stores magnetic energy. */
export const STORED_MAGNETIC_ENERGY_CAUTIONS = [
  {
    code: "flyback_voltage",
    message:
      "interrupting an inductor's current (opening a switch, a broken connection) produces a high voltage L dI/dt that can arc, break insulation and destroy semiconductors: provide a clamp or freewheeling path",
  },
  {
    code: "stored_energy",
    message:
      "stored magnetic energy is released as heat, arcs or forces on conductors when the current is interrupted; large inductors and magnets can hold lethal energy: discharge through a rated dump path before work",
  },
  {
    code: "codes_govern",
    message: "these results support engineering judgement; local codes, standards and licensed practice govern any real installation",
  },
] as const;

const COUPLING_RELATION = {
  rule: "mutualInductance <= sqrt(inductance1 * inductance2) (coupling coefficient at most 1)",
  holds: (x: { mutualInductance: number; inductance1: number; inductance2: number }) =>
    x.mutualInductance <= Math.sqrt(x.inductance1) * Math.sqrt(x.inductance2) * (1 + 1e-12),
};

const CONNECTION = {
  choices: ["aiding", "opposing"],
  description: "Whether the coils' fluxes add (aiding) or subtract (opposing)",
  default: "aiding",
  example: "aiding",
} as const;

/** The inputs of two coupled inductors, shared by the series and parallel connections. */
const COUPLED_PAIR = [
  { name: "inductance1", dimension: "Inductance", description: "Self-inductance of the first inductor", domain: POSITIVE, example: 1e-5 },
  { name: "inductance2", dimension: "Inductance", description: "Self-inductance of the second inductor", domain: POSITIVE, example: 2e-5 },
  { name: "mutualInductance", dimension: "Inductance", description: "Mutual inductance (magnitude)", domain: NON_NEGATIVE, default: 0, example: 5e-6 },
  { name: "connection", ...CONNECTION },
] as const;

/**
 * Energy stored in an inductor's magnetic field.
 *
 * W = L I^2 / 2, with L the inductance in H and I the current in A; W in J.
 *
 * Linear inductor (constant L); for a saturating core integrate i dPsi instead.
 *
 * Reference: Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed. (2013), sec. 6.4.
 *
 * @example
 * inductorEnergy({ inductance: quantity(10, "mH"), current: quantity(5, "A") }); // 0.125 J
 */
export const inductorEnergy = /* @__PURE__ */ defineFormula({
  id: "inductorEnergy",
  title: "Energy stored in an inductor",
  category: "inductance",
  description: "Magnetic energy stored in a linear inductor carrying a current.",
  equation: "W = L I^2 / 2",
  inputs: [
    { name: "inductance", dimension: "Inductance", description: "Inductance", domain: POSITIVE, example: 0.01 },
    { name: "current", dimension: "Current", description: "Current through the inductor", example: 5 },
  ],
  output: { dimension: "Energy", description: "Stored energy" },
  cautions: STORED_MAGNETIC_ENERGY_CAUTIONS,
  source: { ...CIRCUITS, locator: "sec. 6.4 (energy stored in an inductor)" },
  compute: (x) => 0.5 * x.inductance * x.current * x.current,
});

/** a b as an unevaluated sum hi + lo, exactly (Dekker's product with Veltkamp's split). */
function twoProduct(a: number, b: number): [number, number] {
  const p = a * b;
  const SPLIT = 134217729; // 2^27 + 1
  const ca = SPLIT * a;
  const ahi = ca - (ca - a);
  const alo = a - ahi;
  const cb = SPLIT * b;
  const bhi = cb - (cb - b);
  const blo = b - bhi;
  return [p, ahi * bhi - p + ahi * blo + alo * bhi + alo * blo];
}

/** L1 L2 - M^2 to about one ulp even when M is close to sqrt(L1 L2). */
function detInductance(l1: number, l2: number, mutual: number): number {
  const [p, e] = twoProduct(l1, l2);
  const [q, f] = twoProduct(mutual, mutual);
  return p - q + (e - f); // p - q is exact when the products are within a factor 2
}

/**
 * Total inductance of two coupled inductors in series.
 *
 * L = L1 + L2 + 2M (aiding) or L1 + L2 - 2M (opposing), with L1, L2 the
 * self-inductances and M >= 0 the mutual inductance in H; L in H.
 *
 * The opposing sum is computed as (L1 - M) + (L2 - M): for a tightly coupled
 * pair each difference is exact in floating point (Sterbenz), so the small
 * result keeps full relative precision.
 *
 * Reference: Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed. (2013), sec. 13.2.
 *
 * @example
 * seriesInductance({ inductance1: quantity(10, "uH"), inductance2: quantity(20, "uH"), mutualInductance: quantity(5, "uH") }); // 40 µH
 */
export const seriesInductance = /* @__PURE__ */ defineFormula({
  id: "seriesInductance",
  title: "Series inductance with coupling",
  category: "inductance",
  description: "Inductance of two magnetically coupled inductors connected in series, fluxes aiding or opposing.",
  equation: "L = L1 + L2 +/- 2M",
  inputs: COUPLED_PAIR,
  output: { dimension: "Inductance", description: "Total inductance" },
  relations: [COUPLING_RELATION],
  source: { ...CIRCUITS, locator: "sec. 13.2 (series-aiding and series-opposing connections)" },
  compute: (x) =>
    x.connection === "aiding"
      ? x.inductance1 + x.inductance2 + 2 * x.mutualInductance
      : // (L1 - M) + (L2 - M): exact differences near perfect coupling, no cancellation left.
        Math.max(0, x.inductance1 - x.mutualInductance + (x.inductance2 - x.mutualInductance)),
});

/**
 * Total inductance of two coupled inductors in parallel.
 *
 * L = (L1 L2 - M^2) / (L1 + L2 - 2M) (aiding) or (L1 L2 - M^2) / (L1 + L2 + 2M)
 * (opposing), with L1, L2 and M >= 0 in H; L in H.
 *
 * Near perfect coupling both L1 L2 - M^2 and L1 + L2 - 2M cancel: the products
 * are formed exactly (Dekker's two-product) and the denominator as
 * (L1 - M) + (L2 - M), so the result keeps its digits; for equal, perfectly
 * coupled coils the limit L1 is returned.
 *
 * Reference: Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed. (2013),
 * ch. 13 (coupled inductors); derived from the two mesh equations.
 *
 * @example
 * parallelInductance({ inductance1: quantity(10, "uH"), inductance2: quantity(10, "uH"), mutualInductance: 0 }); // 5 µH
 */
export const parallelInductance = /* @__PURE__ */ defineFormula({
  id: "parallelInductance",
  title: "Parallel inductance with coupling",
  category: "inductance",
  description: "Inductance of two magnetically coupled inductors connected in parallel, fluxes aiding or opposing.",
  equation: "L = (L1 L2 - M^2) / (L1 + L2 -/+ 2M)",
  inputs: COUPLED_PAIR,
  output: { dimension: "Inductance", description: "Total inductance" },
  relations: [COUPLING_RELATION],
  source: { ...CIRCUITS, locator: "ch. 13 (coupled inductors)" },
  compute: (x) => {
    const M = x.mutualInductance;
    const det = Math.max(0, detInductance(x.inductance1, x.inductance2, M)); // L1 L2 - M^2
    if (x.connection === "opposing") return det / (x.inductance1 + x.inductance2 + 2 * M);
    const den = x.inductance1 - M + (x.inductance2 - M); // L1 + L2 - 2M, exact differences
    if (den <= 0) return x.inductance1; // equal coils, perfect coupling: they act as one
    return det / den;
  },
});
