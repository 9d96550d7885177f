export * from "./types.js";
export { quantity, inUnit } from "./quantity.js";
export type { UnitSymbol, QuantityOf, UnitFor } from "./unit-symbols.js";
export { add, sub, mul, div, sqrt, neg } from "./arithmetic.js";
export { DIMENSIONS, describeExponents, nameExponents } from "./dimensions.js";
export type { DimensionName, Exponents } from "./dimensions.js";
// Human-readable values with SI prefixes (the library's one formatter; no mathjs).
export { formatQuantity } from "./display.js";
export type { Precision } from "./display.js";
