// How constantDecimal gets decimal.js. This is the version for bundlers and the
// source tree: a static import, so a bundler includes decimal.js only in bundles
// that reach constantDecimal. The Node build replaces this module with
// load-decimal.node.ts (see tsup.config.ts), which requires decimal.js on first
// use so that `import "emquant"` does not load it (about 8 ms of start-up).
// The named export: under node16/nodenext a CommonJS consumer's default import of
// decimal.js is its module namespace, which cannot name a type (TS2709).
import { Decimal } from "decimal.js";

/** The decimal.js constructor. */
export function loadDecimal(): typeof Decimal {
  return Decimal;
}
