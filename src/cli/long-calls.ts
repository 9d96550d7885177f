import type { LongRunOptions } from "../core/progress.js";
import { designTolerance } from "../designs/tools.js";
import { evaluateCsv } from "../tools/columns-csv.js";
import { sweepRequest } from "../tools/sweep.js";
import { toleranceRequest } from "../tools/tolerance.js";

/*
 * The four long calls of the command line with the options parameter agreed
 * for progress and cancellation (LongRunOptions: signal, onProgress), typed
 * here as that API has them.
 *
 * A local shim while the library's signatures catch up on this branch: the
 * calls themselves are the library's own; only their declared parameter
 * lists are widened. Once sweepRequest, toleranceRequest, evaluateCsv (through
 * evaluateColumns) and designTolerance declare LongRunOptions, this file
 * reduces to re-exports and run.ts, columns.ts and design.ts call them directly.
 */

export const sweepRequestLong = sweepRequest as (request: Parameters<typeof sweepRequest>[0], options?: LongRunOptions) => ReturnType<typeof sweepRequest>;

export const toleranceRequestLong = toleranceRequest as (request: Parameters<typeof toleranceRequest>[0], options?: LongRunOptions) => ReturnType<typeof toleranceRequest>;

export const evaluateCsvLong = evaluateCsv as (
  formula: Parameters<typeof evaluateCsv>[0],
  csv: Parameters<typeof evaluateCsv>[1],
  fixed?: Parameters<typeof evaluateCsv>[2],
  options?: NonNullable<Parameters<typeof evaluateCsv>[3]> & LongRunOptions,
) => ReturnType<typeof evaluateCsv>;

export const designToleranceLong = designTolerance as (
  d: Parameters<typeof designTolerance>[0],
  options?: NonNullable<Parameters<typeof designTolerance>[1]> & LongRunOptions,
) => ReturnType<typeof designTolerance>;
