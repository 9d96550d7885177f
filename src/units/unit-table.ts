import { type DecimalFactor, decimalFactor, scaleDecimal } from "./decimal-scale.js";
import { FIXED_FACTORS, PREFIX_EXPONENTS, PREFIXABLE_FACTORS } from "./unit-factors.js";

export type { QuantityOf, UnitFor, UnitSymbol } from "./unit-symbols.js";

/**
 * A table entry: SI factor (the double nearest the exact factor), and the
 * factor as a decimal (coefficient, power of ten) when it is one, so that
 * `quantity(10, "uH")` is exactly the double nearest 1e-5. Factors that are
 * not decimals (deg = pi/180, Oe = 1000/(4 pi)) have none. The dimension is
 * the type's business (unit-symbols.ts), not the run time's.
 */
export type UnitEntry = readonly [factor: number, decimal: DecimalFactor | undefined];

let table: Map<string, UnitEntry> | undefined;

function entry(factor: number, prefixExponent = 0): UnitEntry {
  const d = decimalFactor(factor);
  if (d === undefined) return [factor * 10 ** prefixExponent, undefined];
  const exact: DecimalFactor = [d[0], d[1] + prefixExponent];
  return [scaleDecimal("1", exact[0], exact[1])!, exact];
}

function buildTable(): Map<string, UnitEntry> {
  const t = new Map<string, UnitEntry>();
  for (const [sym, f] of Object.entries(PREFIXABLE_FACTORS)) {
    for (const [p, pe] of Object.entries(PREFIX_EXPONENTS)) t.set(p + sym, entry(f, pe));
  }
  // Fixed symbols win where a prefix happens to spell the same text ("min", "mG").
  for (const [sym, f] of Object.entries(FIXED_FACTORS)) t.set(sym, entry(f));
  return t;
}

/** [SI factor, decimal factor] of a unit symbol, or undefined if the symbol is not in the table. */
export function lookupUnit(symbol: string): UnitEntry | undefined {
  table ??= buildTable();
  return table.get(symbol);
}

/** Every unit symbol of the typed table (prefixed forms spelled out), for tests, hints and docs. */
export function listUnitSymbols(): string[] {
  table ??= buildTable();
  return [...table.keys()];
}
