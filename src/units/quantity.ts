import { FormulaError } from "../core/errors.js";
import type { QuantityOf, UnitFor, UnitSymbol } from "./unit-symbols.js";
import { scaleNumber, unscalePower } from "./decimal-scale.js";
import { lookupUnit, type UnitEntry } from "./unit-table.js";

/**
 * A typed quantity from a value and a unit symbol literal. The SI value is the
 * decimal the value reads as, times the unit's decimal factor, correctly
 * rounded: `quantity(10, "uH")` is exactly 1e-5, `quantity(0.45, "mm")`
 * exactly 0.00045 (a plain `10 * 1e-6` is 1.0000000000000002e-5).
 *
 * @example
 * const gap = quantity(0.2, "mm"); // Length, 2e-4 (metres)
 * const area = quantity(1, "cm^2"); // Area, 1e-4 (square metres)
 */
export function quantity<U extends UnitSymbol>(value: number, unit: U): QuantityOf<U> {
  const e = entryOf(unit);
  return (e[1] === undefined ? value * e[0] : scaleNumber(value, e[1])) as QuantityOf<U>;
}

/**
 * The value of a quantity expressed in a unit of the same dimension.
 *
 * @example
 * inUnit(quantity(4.7, "uF"), "nF"); // ≈ 4700
 */
export function inUnit<Q extends number>(q: Q, unit: UnitFor<Q>): number {
  const e = entryOf(unit as string);
  // A power-of-ten unit rounds once (q * 1e12 for pF: 1e12 is exact, 1e-12 is not).
  return (e[1] === undefined ? undefined : unscalePower(q, e[1])) ?? q / e[0];
}

function entryOf(unit: string): UnitEntry {
  const entry = lookupUnit(unit);
  // Reachable only from untyped JavaScript: the types admit table symbols only.
  if (entry === undefined) {
    throw new FormulaError("unparsable", { value: unit, detail: "not in the typed unit table; evaluate() reads any unit string" });
  }
  return entry;
}
