// Design tools that work on every registry formula: solve, tolerance, sweeps, catalog JSON.
export { solve, solveDetails, solveRequest } from "./solve.js";
export type { SolvableInput, SolveOptions, SolveRequest, SolveResult } from "./solve.js";
export { tolerance, toleranceRequest } from "./tolerance.js";
export type { QuantityValue, Sensitivity, ToleranceOptions, ToleranceResult, ToleranceSpec, ToleranceValue } from "./tolerance.js";
export { sweep, sweepRequest, sweepToCsv, sweepToVegaLite } from "./sweep.js";
export type { SweepAxis, SweepAxisSpec, SweepResult, SweepSpec } from "./sweep.js";
export { axisTitle, axisUnit } from "./axis-units.js";
export type { AxisUnit } from "./axis-units.js";
export { catalogEntry, formulaCatalog, inputSchema } from "./catalog.js";
export type { CatalogEntry, CatalogInput, CatalogNote } from "./catalog.js";
export type { NoteSummary } from "./notes.js";
export { createRandom } from "./random.js";
export type { Random } from "./random.js";
export { columnsToJson, evaluateColumns, MAX_COLUMN_ROWS, ROW_ERROR_CODES } from "./columns.js";
export type { ColumnInput, ColumnsOptions, ColumnsResult, RowErrorSummary, UnitColumn } from "./columns.js";
export { columnsToCsv, evaluateCsv, MAX_CSV_CHARS, readCsvTable } from "./columns-csv.js";
export type { CsvLimits, CsvTable } from "./columns-csv.js";
export { columnsParallel, MIN_PARALLEL_ROWS } from "./columns-parallel.js";
export {
  MAX_WORKERS, MIN_PARALLEL_FIELD_PAIRS, MIN_PARALLEL_POINTS, MIN_POOL_MS, MIN_PARALLEL_SAMPLES, MIN_PARALLEL_SEGMENT_PAIRS,
  biotSavartParallel, mutualInductanceParallel, polylineSelfInductanceParallel, sweepParallel, toleranceParallel,
} from "./parallel.js";
export type { BiotSavartParallelOptions, ParallelOptions } from "./parallel.js";
export { closeWorkers, poolBusy, workerThreads } from "./pool.js";
export { MAX_SHARDS, mergeShards, planShards, runShard } from "./shards.js";
export type { Shard, ShardRequest, ShardResult, SweepShardRequest, SweepShardResult, ToleranceShardRequest, ToleranceShardResult } from "./shards.js";
export type { ColumnsShardRequest, ColumnsShardResult } from "./columns-shards.js";
export { fromShardValue, toShardValue, type ShardValue } from "./shard-values.js";
export type { CollectedNotes } from "./notes.js";
