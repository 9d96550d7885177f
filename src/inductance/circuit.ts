import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { GOVERN, HAZARDOUS_ENERGY } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { Scaled, moderate, scaledProduct, twoProduct } from "../math/scaled.js";

const CIRCUITS = { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed." } as const;

/**
 * The stored-energy hazard: at or above HAZARDOUS_ENERGY (20 J, IEC 60950-1:2005
 * 1.2.8.10, now IEC 62368-1; from memory) the energy released when the current
 * is interrupted is treated as a hazard. Below it no caution: an inductor
 * storing microjoules is not a hazard, and a caution on every call protects no one.
 */
export function storedEnergyCaution<X>(energy: (x: X, value: number | readonly number[]) => number) {
  return {
    code: "stored_energy",
    when: (x: X, w: number | readonly number[]) => energy(x, w) >= HAZARDOUS_ENERGY,
    measure: (x: X, w: number | readonly number[]) => energy(x, w),
    message: (x: X, w: number | readonly number[]) =>
      `${formatNumber(energy(x, w), 3)} J stored, at or above the ${HAZARDOUS_ENERGY} J hazardous energy level (IEC 60950-1:2005, 1.2.8.10; now IEC 62368-1; from memory): interrupting the current releases it as an arc, heat or forces on conductors; provide a rated dump or freewheeling path and discharge before work. ${GOVERN}`,
  } as const;
}
/** The caution on a formula whose result is the stored energy. */
const STORED_ENERGY = /* @__PURE__ */ storedEnergyCaution((_x: unknown, w) => w as number);

/** When the 1e-12 rounding tolerance of the coupling relation admits M above sqrt(L1 L2): k - 1. */
function couplingExcess(x: { mutualInductance: number; inductance1: number; inductance2: number }): number {
  return x.mutualInductance / (Math.sqrt(x.inductance1) * Math.sqrt(x.inductance2)) - 1;
}

function clampedMessage(x: { mutualInductance: number; inductance1: number; inductance2: number }): string {
  return `mutualInductance exceeds sqrt(inductance1 inductance2) by ${couplingExcess(x).toPrecision(3)} of it (coupling coefficient above 1, admitted as rounding by the coupling relation): the pair is taken as perfectly coupled (k = 1) instead of returning a negative or unphysical result`;
}

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
 * Scaled for extreme magnitudes: every representable result to a few ulp,
 * `out_of_range` beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 * A `stored_energy` caution from 20 J (the hazardous energy level). Whatever
 * the energy, interrupting the current produces a voltage L dI/dt that can arc
 * and destroy semiconductors (said in the description, since it always holds).
 *
 * Reference: Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed. (2013), sec. 6.4 (from memory);
 * IEC 60950-1:2005, 1.2.8.10 for the 20 J level (from memory).
 *
 * @example
 * inductorEnergy({ inductance: quantity(10, "mH"), current: quantity(5, "A") }); // 0.125 J
 */
export const inductorEnergy = /* @__PURE__ */ defineFormula({
  id: "inductorEnergy",
  title: "Energy stored in an inductor",
  category: "inductance",
  description:
    "Magnetic energy stored in a linear inductor carrying a current. Interrupting the current (opening a switch, a broken connection) produces a voltage L dI/dt that can arc, break insulation and destroy semiconductors: provide a clamp or freewheeling path.",
  equation: "W = L I^2 / 2",
  inputs: [
    { name: "inductance", dimension: "Inductance", description: "Inductance", domain: POSITIVE, example: 0.01 },
    { name: "current", dimension: "Current", description: "Current through the inductor", example: 5 },
  ],
  output: { dimension: "Energy", description: "Stored energy" },
  cautions: [STORED_ENERGY],
  source: [
    { ...CIRCUITS, locator: "sec. 6.4 (energy stored in an inductor) (from memory)" },
    { authors: "IEC", year: 2005, title: "IEC 60950-1: Information technology equipment - Safety - Part 1: General requirements", locator: "1.2.8.10, hazardous energy level 20 J (from memory)" },
  ],
  // I^2 could overflow (or L I^2 underflow) in an intermediate step: scaled outside moderate magnitudes.
  compute: (x) => {
    const i = Math.abs(x.current);
    return moderate(x.inductance) && moderate(i) ? 0.5 * x.inductance * i * i : scaledProduct([0.5, x.inductance, i, i]);
  },
});

/** L1 L2 - M^2 to about one ulp even when M is close to sqrt(L1 L2); moderate magnitudes. */
function detInductance(l1: number, l2: number, mutual: number): number {
  const [p, e] = twoProduct(l1, l2);
  const [q, f] = twoProduct(mutual, mutual);
  return p - q + (e - f); // p - q is exact when the products are within a factor 2
}

/**
 * L1 L2 - M^2 for any magnitudes, as v 2^exp. The mantissas (in [1, 2)) are
 * multiplied exactly by twoProduct, and M^2 is brought to L1 L2's exponent by
 * a power of two (exact); where M^2 is below 2^-120 of L1 L2 it cannot change
 * the result. v is negative when M > sqrt(L1 L2).
 */
function detScaled(l1: number, l2: number, mutual: number): { v: number; exp: number } {
  const a = Scaled.of(l1);
  const b = Scaled.of(l2);
  const exp = a.e + b.e;
  const [p, e] = twoProduct(a.m, b.m);
  if (mutual === 0) return { v: p + e, exp };
  const c = Scaled.of(mutual);
  const d = 2 * c.e - exp; // M^2 = (c.m^2 2^d) 2^exp; the coupling relation keeps d <= 2
  if (d < -120) return { v: p + e, exp };
  const [q, f] = twoProduct(c.m, c.m);
  const scale = 2 ** d;
  return { v: p - q * scale + (e - f * scale), exp };
}

/** a + b for finite a, b whose sum is positive, halved first where the sum of two large terms could overflow. */
function sumScaled(a: number, b: number): Scaled {
  if (Math.abs(a) < 2 ** 1000 && Math.abs(b) < 2 ** 1000) return Scaled.of(Math.max(0, a + b));
  return Scaled.of(Math.max(0, a / 2 + b / 2)).times(2);
}

/**
 * Total inductance of two coupled inductors in series.
 *
 * L = L1 + L2 + 2M (aiding) or L1 + L2 - 2M (opposing), with L1, L2 the
 * self-inductances and M >= 0 the mutual inductance in H; L in H.
 *
 * The opposing sum is computed as (L1 - M) + (L2 - M): for a tightly coupled
 * pair each difference is exact in floating point (Sterbenz), so the small
 * result keeps full relative precision. Sums of positive terms overflow only
 * when the result does; a subnormal sum is exact and returned as it is. If M
 * exceeds sqrt(L1 L2) within the coupling relation's rounding tolerance and the
 * opposing sum would be negative, 0 (perfect coupling) is returned with a
 * `coupling_clamped` warning.
 *
 * Reference: Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed. (2013), sec. 13.2 (from memory).
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
  validity: [
    {
      code: "coupling_clamped",
      when: (x) => x.connection === "opposing" && seriesOpposing(x) < 0,
      measure: (x) => couplingExcess(x),
      message: (x) => clampedMessage(x),
    },
  ],
  source: { ...CIRCUITS, locator: "sec. 13.2 (series-aiding and series-opposing connections) (from memory)" },
  // Sums of positive terms cannot overflow unless the result does; no scaling needed.
  compute: (x) =>
    x.connection === "aiding" ? x.inductance1 + x.inductance2 + 2 * x.mutualInductance : Math.max(0, seriesOpposing(x)),
});

/** (L1 - M) + (L2 - M): exact differences near perfect coupling, no cancellation left; negative only when M > sqrt(L1 L2). */
function seriesOpposing(x: { mutualInductance: number; inductance1: number; inductance2: number }): number {
  return x.inductance1 - x.mutualInductance + (x.inductance2 - x.mutualInductance);
}

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
 * ch. 13 (coupled inductors) (from memory); derived from the two mesh equations.
 * Scaled (exact mantissa products) for extreme magnitudes: every representable
 * result to a few ulp, `out_of_range` beyond the double range or below the
 * smallest subnormal (2^-1074; a subnormal result is returned). If M exceeds sqrt(L1 L2) within the coupling
 * relation's rounding tolerance, the pair is taken as perfectly coupled with a
 * `coupling_clamped` warning.
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
  validity: [
    {
      code: "coupling_clamped",
      when: (x) => couplingExcess(x) > 0 && detScaled(x.inductance1, x.inductance2, x.mutualInductance).v < 0,
      measure: (x) => couplingExcess(x),
      message: (x) => clampedMessage(x),
    },
  ],
  source: { ...CIRCUITS, locator: "ch. 13 (coupled inductors) (from memory)" },
  compute: (x) => {
    const L1 = x.inductance1;
    const L2 = x.inductance2;
    const M = x.mutualInductance;
    if (moderate(L1) && moderate(L2) && (M === 0 || moderate(M))) {
      // Products of moderate magnitudes and their rounding errors stay normal: twoProduct is exact.
      const det = Math.max(0, detInductance(L1, L2, M)); // L1 L2 - M^2
      if (x.connection === "opposing") return det / (L1 + L2 + 2 * M);
      const den = L1 - M + (L2 - M); // L1 + L2 - 2M, exact differences
      if (den <= 0) return L1; // equal coils, perfect coupling: they act as one
      return det / den;
    }
    const { v, exp } = detScaled(L1, L2, M);
    const den =
      x.connection === "opposing"
        ? Scaled.of(L1).plus(Scaled.of(L2)).plus(Scaled.of(M).times(2))
        : sumScaled(L1 - M, L2 - M); // differences of positives never overflow
    if (den.m === 0) return L1; // as above: equal coils, perfect coupling
    if (v <= 0) return 0; // perfect coupling (or M above sqrt(L1 L2), with a warning)
    return Scaled.of(v, exp).div(den).toNumber();
  },
});
