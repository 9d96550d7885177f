import { FormulaError } from "../core/errors.js";
import type { Capacitance } from "../units/types.js";

// Variable-arity helpers, not registry formulas: a formula has a fixed set of
// named inputs, these take any number of capacitances.

function check(name: string, caps: readonly number[]): void {
  if (!Array.isArray(caps) || caps.length === 0) {
    throw new FormulaError("invalid_argument", { formula: name, input: "capacitances", detail: "give at least one capacitance" });
  }
  for (let i = 0; i < caps.length; i++) {
    const c: unknown = caps[i];
    const input = `capacitances[${i}]`;
    if (typeof c !== "number") throw new FormulaError("wrong_type", { formula: name, input, value: c, expected: "a capacitance in F" });
    if (c - c !== 0) throw new FormulaError("not_finite", { formula: name, input, value: c });
    if (!(c > 0)) throw new FormulaError("out_of_domain", { formula: name, input, value: c, rule: "> 0" });
  }
}

/**
 * Capacitance of capacitors in series: 1 / C = sum of 1 / C_i, in F.
 *
 * Method: computed as c_min / sum(c_min / C_i). Every term is at most 1 and the
 * smallest is exactly 1, so nothing overflows or underflows harmfully however
 * far apart the values are (1e-200 F with 1e200 F gives 1e-200 F), and the
 * result never exceeds the smallest capacitance.
 *
 * Throws FormulaError for an empty list ("invalid_argument") and for a value that
 * is not a positive finite number ("wrong_type", "not_finite", "out_of_domain").
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017), Sec. 2.5.4.
 *
 * @example
 * seriesCapacitance(quantity(10, "nF"), quantity(10, "nF")); // ≈ 5e-9 F
 */
export function seriesCapacitance(...capacitances: Capacitance[]): Capacitance {
  check("seriesCapacitance", capacitances);
  let min = capacitances[0]!;
  for (const c of capacitances) if (c < min) min = c;
  let sum = 0;
  for (const c of capacitances) sum += min / c;
  return (min / sum) as Capacitance;
}

/**
 * Capacitance of capacitors in parallel: C = sum of C_i, in F.
 *
 * Throws FormulaError for an empty list ("invalid_argument"), for a value that is
 * not a positive finite number, and "out_of_range" when the sum overflows.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2017), Sec. 2.5.4.
 *
 * @example
 * parallelCapacitance(quantity(10, "nF"), quantity(22, "nF")); // ≈ 3.2e-8 F
 */
export function parallelCapacitance(...capacitances: Capacitance[]): Capacitance {
  check("parallelCapacitance", capacitances);
  let sum = 0;
  for (const c of capacitances) sum += c;
  if (sum === Infinity) throw new FormulaError("out_of_range", { formula: "parallelCapacitance", detail: "the sum exceeds the largest number" });
  return sum as Capacitance;
}
