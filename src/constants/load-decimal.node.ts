// Node build of load-decimal.ts: decimal.js is required on first use,
// synchronously, so importing the package does not load it.
import { createRequire } from "node:module";
import type { Decimal } from "decimal.js";

let cached: typeof Decimal | undefined;

/** The decimal.js constructor. */
export function loadDecimal(): typeof Decimal {
  cached ??= (createRequire(import.meta.url)("decimal.js") as { Decimal: typeof Decimal }).Decimal;
  return cached;
}
