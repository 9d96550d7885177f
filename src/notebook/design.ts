import type { MathJsInstance } from "mathjs";
import { FormulaError } from "../core/errors.js";
import { designReportHtml, designReportMarkdown } from "../designs/report.js";
import type { DesignResult } from "../designs/run.js";
import type { DesignSpec } from "../designs/spec.js";
import { evaluateDesign } from "../designs/tools.js";
import { formatQuantity } from "../units/display.js";

// `design(...)` in a notebook: a design file's object (or its JSON text) in,
// the evaluated design out, shown as a short summary where a notebook prints
// text and as the calculation report where it renders HTML.

/** An evaluated design as a notebook shows it. */
export class DesignView {
  constructor(readonly result: DesignResult) {}

  /** Steps, derived quantities and checks, one line each. */
  toString(): string {
    const r = this.result;
    const lines = [r.title];
    for (const s of [...r.steps, ...r.derived]) lines.push(`  ${s.name} = ${formatQuantity(s.value, s.unit)}`);
    for (const k of r.checks) lines.push(`  ${k.pass ? "pass" : "FAIL"}  ${k.rule}   margin ${formatQuantity(k.margin, k.unit)}`);
    for (const n of r.warnings) lines.push(`  warning [${n.code}] ${n.step}: ${n.message}`);
    for (const n of r.cautions) lines.push(`  CAUTION [${n.code}] ${n.step}: ${n.message}`);
    return lines.join("\n");
  }

  /** mathjs's format() and the notebook's printer call this. */
  format(): string {
    return this.toString();
  }

  /** The calculation report as Markdown. */
  toMarkdown(): string {
    return designReportMarkdown(this.result);
  }

  /** The calculation report as one HTML document, for kernels that render HTML. */
  toHTML(): string {
    return designReportHtml(this.result);
  }
}

/** Evaluate a design given as an object from an expression or as JSON text; units in it become unit strings. */
export function notebookDesign(math: MathJsInstance, spec: unknown): DesignView {
  let data = spec;
  if (typeof spec === "string") {
    try {
      data = JSON.parse(spec);
    } catch (e) {
      throw new FormulaError("unparsable", { formula: "design", input: "design", value: spec, detail: `not JSON: ${(e as Error).message}` });
    }
  }
  return new DesignView(evaluateDesign(plain(math, data, 0) as DesignSpec));
}

// Units written in an expression ({ gap: 0.5 mm }) become the unit strings a design file holds.
function plain(math: MathJsInstance, v: unknown, depth: number): unknown {
  if (depth > 8) return v;
  if (math.isUnit(v)) return v.format({ precision: 17 });
  if (math.isMatrix(v)) return plain(math, v.toArray(), depth + 1);
  if (Array.isArray(v)) return v.map((x) => plain(math, x, depth + 1));
  if (typeof v === "object" && v !== null) {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v)) out[k] = plain(math, (v as Record<string, unknown>)[k], depth + 1);
    return out;
  }
  return v;
}
