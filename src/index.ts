// The package root. Typed formulas and units never load mathjs; `evaluate`
// creates its private mathjs instance on first use.
export * from "./units/index.js";
export { FormulaError, ERROR_CODES } from "./core/errors.js";
export type { ErrorCode, FormulaErrorFields } from "./core/errors.js";
export { PROGRESS_INTERVAL_MS } from "./core/progress.js";
export type { AbortSignalLike, LongRunOptions, Progress } from "./core/progress.js";
export { defineFormula, isFormula, domainRule } from "./core/formula.js";
export type { Formula, AnyFormula } from "./core/formula.js";
export type * from "./core/spec.js";
export { POSITIVE, NON_NEGATIVE, AT_LEAST_ONE, COUNT, TURNS } from "./core/spec.js";
export { seriesOf } from "./core/series.js";
export type { SeriesCheck } from "./core/series.js";
export { evaluate } from "./core/evaluate.js";
export type { EvaluateResult, RawInput } from "./core/evaluate.js";
export { listFormulas, getFormula } from "./core/registry.js";
export * from "./constants/index.js";
// decimal.js is only pulled into a bundle that uses these two.
export { constantDecimal, uncertaintyDecimal } from "./constants/decimal.js";
export * from "./capacitance/index.js";
export * from "./inductance/index.js";
export * from "./flux/index.js";
export * from "./force/index.js";
export * from "./displacement/index.js";
export * from "./interconnect/index.js";
export * from "./beams/index.js";
export * from "./magnets/index.js";
export * from "./windings/index.js";
export * from "./tools/index.js";
export * from "./notebook/index.js";
export * from "./designs/index.js";
export { VERSION } from "./version.js";
export * from "./interconnect/field-solver.js";
// Types that appear in the signatures above, exported so users can name them.
export type { NoteSummary } from "./tools/notes.js";
export type { BiotSavartField, BiotSavartOptions } from "./flux/biot-savart.js";
