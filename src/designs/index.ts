// Designs: chained calculations with checks, tolerance through the chain and a calculation report.
export { design, DesignBuilder } from "./spec.js";
export type { DesignSpec, DesignStepSpec, DesignBinding, DesignInputValue, Ref, Refs, Bindings, TypedTolerance } from "./spec.js";
export { DESIGN_LIMITS } from "./compile.js";
export { EXPRESSION_LIMITS } from "./expression.js";
export { evaluateDesign, designTolerance, solveDesign, sweepDesign, DESIGN_TOOL_LIMITS } from "./tools.js";
export type {
  DesignLike, DesignToleranceOptions, DesignToleranceResult, DesignQuantitySpread, DesignSolveRequest, DesignSolveResult,
  DesignSweepRequest, DesignSweepResult,
} from "./tools.js";
export type { DesignResult, DesignStepResult, DesignDerivedResult, DesignCheckResult, DesignInputResult, DesignNote } from "./run.js";
export { designReportMarkdown, designReportHtml } from "./report.js";
export type { ReportOptions } from "./report.js";
export { designSchema } from "./schema.js";
