import { FormulaError } from "../core/errors.js";
import type { QuantityOf, UnitFor, UnitSymbol } from "./unit-table.js";
import { lookupUnit } from "./unit-table.js";

/**
 * A typed quantity from a value and a unit symbol literal.
 *
 * @example
 * const gap = quantity(0.2, "mm"); // Length, 2e-4 (metres)
 * const area = quantity(1, "cm^2"); // Area, 1e-4 (square metres)
 */
export function quantity<U extends UnitSymbol>(value: number, unit: U): QuantityOf<U> {
  return (value * factor(unit)) as QuantityOf<U>;
}

/**
 * The value of a quantity expressed in a unit of the same dimension.
 *
 * @example
 * inUnit(quantity(4.7, "uF"), "nF"); // ≈ 4700
 */
export function inUnit<Q extends number>(q: Q, unit: UnitFor<Q>): number {
  return q / factor(unit as string);
}

function factor(unit: string): number {
  const entry = lookupUnit(unit);
  // Reachable only from untyped JavaScript: the types admit table symbols only.
  if (entry === undefined) {
    throw new FormulaError("unparsable", { value: unit, detail: "not in the typed unit table; evaluate() reads any unit string" });
  }
  return entry[1];
}
