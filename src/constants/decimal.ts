import type { Decimal } from "decimal.js";
import type { CodataRecord } from "./codata.js";
import { loadDecimal } from "./load-decimal.js";

/**
 * High-precision values of CODATA records, as decimal.js numbers. Kept apart
 * from ./codata.ts so that bundles of typed formulas never load decimal.js.
 *
 * The decimal is built from the record's exact published string, so it carries
 * every published digit whatever the precision of `D` (decimal.js rounds only
 * the results of operations, not constructed values).
 *
 * @example
 * const D = Decimal.clone({ precision: 40 });
 * const mu0 = constantDecimal(constant("vacuumPermeability"), D);
 * const c = constantDecimal(constant("speedOfLight"), D);
 * D.div(1, mu0.times(c.pow(2))); // ≈ 8.8541878188e-12 (eps0)
 */
export function constantDecimal(record: CodataRecord, D: typeof Decimal = loadDecimal()): Decimal {
  return new D(record.decimal);
}

/** The record's standard uncertainty as a decimal.js number (zero for exact values). */
export function uncertaintyDecimal(record: CodataRecord, D: typeof Decimal = loadDecimal()): Decimal {
  return new D(record.uncertainty);
}
