import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";

const CIRCUITS = { authors: "C. K. Alexander, M. N. O. Sadiku", year: 2013, title: "Fundamentals of Electric Circuits, 5th ed." } as const;

/** The two capacitors, shared by the series and parallel connections. */
const PAIR = [
  { name: "capacitance1", dimension: "Capacitance", description: "Capacitance of the first capacitor", domain: POSITIVE, example: 1e-8 },
  { name: "capacitance2", dimension: "Capacitance", description: "Capacitance of the second capacitor", domain: POSITIVE, example: 2.2e-8 },
] as const;

/**
 * Capacitance of two capacitors in series.
 *
 * C = C1 C2 / (C1 + C2) (1 / C = 1 / C1 + 1 / C2), with C1, C2 and C in F.
 * For more than two, apply it in turn: series(series(C1, C2), C3).
 *
 * Method: with a the smaller and b the larger capacitance, C = a / (1 + a / b).
 * The quotient a / b is at most 1, so nothing overflows (1e308 F with 1e308 F
 * gives 5e307 F) and the product C1 C2, which could overflow or underflow, is
 * never formed; when a / b underflows the result is a, as it should be. Three
 * roundings: within 1.5 ulp of the exact value, and never above the smaller
 * capacitance.
 *
 * Validity: ideal capacitors; the voltage divides in inverse proportion to the
 * capacitances (leakage and tolerance make real series stacks need balancing
 * resistors, common practice).
 *
 * Reference: C. K. Alexander, M. N. O. Sadiku, Fundamentals of Electric
 * Circuits, 5th ed. (2013), sec. 6.3 (series and parallel capacitors; section from memory).
 *
 * @example
 * seriesCapacitance({ capacitance1: quantity(10, "nF"), capacitance2: quantity(10, "nF") }); // ≈ 5e-9 F
 */
export const seriesCapacitance = /* @__PURE__ */ defineFormula({
  id: "seriesCapacitance",
  title: "Series capacitance",
  category: "capacitance",
  description: "Capacitance of two capacitors connected in series (reciprocals add).",
  equation: "C = C1 C2 / (C1 + C2)",
  inputs: PAIR,
  output: { dimension: "Capacitance", description: "Total capacitance" },
  source: { ...CIRCUITS, locator: "sec. 6.3, series and parallel capacitors (section from memory)" },
  // Smaller over (1 + smaller/larger): the ratio is in (0, 1], so no overflow or
  // harmful underflow, and no product of the two capacitances.
  compute: (x) => {
    const a = Math.min(x.capacitance1, x.capacitance2);
    const b = Math.max(x.capacitance1, x.capacitance2);
    return a / (1 + a / b);
  },
});

/**
 * Capacitance of two capacitors in parallel.
 *
 * C = C1 + C2, with C1, C2 and C in F. For more than two, apply it in turn.
 *
 * Method: one addition, correctly rounded (half an ulp); a sum beyond the
 * largest double is `out_of_range`.
 *
 * Reference: C. K. Alexander, M. N. O. Sadiku, Fundamentals of Electric
 * Circuits, 5th ed. (2013), sec. 6.3 (section from memory).
 *
 * @example
 * parallelCapacitance({ capacitance1: quantity(10, "nF"), capacitance2: quantity(22, "nF") }); // ≈ 3.2e-8 F
 */
export const parallelCapacitance = /* @__PURE__ */ defineFormula({
  id: "parallelCapacitance",
  title: "Parallel capacitance",
  category: "capacitance",
  description: "Capacitance of two capacitors connected in parallel (capacitances add).",
  equation: "C = C1 + C2",
  inputs: PAIR,
  output: { dimension: "Capacitance", description: "Total capacitance" },
  source: { ...CIRCUITS, locator: "sec. 6.3, series and parallel capacitors (section from memory)" },
  compute: (x) => x.capacitance1 + x.capacitance2,
});
