import { FormulaError } from "../core/errors.js";
import { designReportHtml, designReportMarkdown } from "../designs/report.js";
import type { LongRunOptions } from "../core/progress.js";
import { designTolerance, evaluateDesign } from "../designs/tools.js";
import type { DesignSpec } from "../designs/spec.js";
import { formatQuantity } from "../units/display.js";

// `emquant design <file.json>`: evaluate a design file, print its steps and
// checks, and write the calculation report. Kept apart from run.ts so the
// command's file handling stays in one place.

/** File access the design command needs; main.ts passes node:fs. */
export interface DesignFiles {
  readText(path: string): string;
  writeText(path: string, text: string): void;
}

export interface DesignCommandOptions {
  readonly file: string;
  readonly json: boolean;
  readonly tolerance: boolean;
  readonly samples?: number | undefined;
  readonly seed?: number | undefined;
  readonly report?: string | undefined;
  readonly markdown?: string | undefined;
  readonly date?: string | undefined;
  /** Cancellation and progress of the tolerance run (the job thread's). */
  readonly longRun?: LongRunOptions | undefined;
}

/** Largest design file read, in characters: a design is small; this bounds memory for a stray file. */
const MAX_FILE = 1_000_000;

/** Returns the exit status: 0 all checks pass, 3 a check fails (FormulaErrors propagate to the caller). */
export function designCommand(o: DesignCommandOptions, files: DesignFiles, out: (t: string) => void): number {
  let text: string;
  try {
    text = files.readText(o.file);
  } catch (e) {
    throw new FormulaError("invalid_argument", { input: "file", value: o.file, detail: `cannot read the design file: ${(e as Error).message}` });
  }
  if (text.length > MAX_FILE) throw new FormulaError("invalid_argument", { input: "file", value: o.file, detail: `a design file is at most ${MAX_FILE} characters` });
  let spec: DesignSpec;
  try {
    spec = JSON.parse(text) as DesignSpec;
  } catch (e) {
    throw new FormulaError("unparsable", { input: "file", value: o.file, detail: `not JSON: ${(e as Error).message}` });
  }
  const result = evaluateDesign(spec);
  const tolerance = o.tolerance ? designTolerance(spec, { ...(o.samples !== undefined ? { samples: o.samples } : {}), ...(o.seed !== undefined ? { seed: o.seed } : {}), ...o.longRun }) : undefined;
  const reportOptions = { ...(tolerance ? { tolerance } : {}), ...(o.date ? { date: o.date } : {}) };
  if (o.report) files.writeText(o.report, designReportHtml(result, reportOptions));
  if (o.markdown) files.writeText(o.markdown, designReportMarkdown(result, reportOptions));
  if (o.json) {
    out(JSON.stringify({ design: result, ...(tolerance ? { tolerance } : {}) }, null, 2));
  } else {
    out(result.title);
    for (const s of result.steps) out(`  ${s.name} = ${formatQuantity(s.value, s.unit)}   (${s.formula})`);
    for (const d of result.derived) out(`  ${d.name} = ${formatQuantity(d.value, d.unit)}   (${d.expression})`);
    for (const k of result.checks) out(`  ${k.pass ? "pass" : "FAIL"}  ${k.rule}   margin ${formatQuantity(k.margin, k.unit)}`);
    if (tolerance) {
      for (const k of tolerance.checks) {
        if (k.failureProbability !== undefined) out(`  ${k.rule}: fails in ${(k.failureProbability * 100).toFixed(2)} % of ${tolerance.accepted} Monte Carlo samples`);
      }
    }
    for (const n of result.warnings) out(`  warning [${n.code}] ${n.step}: ${n.message}`);
    for (const n of result.cautions) out(`  CAUTION [${n.code}] ${n.step}: ${n.message}`);
    if (o.report) out(`report written to ${o.report}`);
    if (o.markdown) out(`report written to ${o.markdown}`);
  }
  return result.passed ? 0 : 3;
}
