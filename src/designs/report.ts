import { GOVERN } from "../core/hazards.js";
import type { Source } from "../core/spec.js";
import { formatQuantity } from "../units/display.js";
import { VERSION } from "../version.js";
import type { DesignResult } from "./run.js";
import { sweepChartSvg } from "./chart.js";
import type { DesignSweepResult, DesignToleranceResult } from "./tools.js";

// A calculation a reviewer can read and sign: the same content as Markdown
// and as one self-contained HTML file (inline style, no scripts, no external
// resources) that prints on A4 or Letter.

export interface ReportOptions {
  /** Tolerance analysis of the same design, shown as a table. */
  readonly tolerance?: DesignToleranceResult;
  /** Date printed on the report (default: today, as YYYY-MM-DD). Set it for reproducible output. */
  readonly date?: string;
  /** Sweeps to chart: a design sweep and the step or derived quantity to plot against its input. */
  readonly sweeps?: readonly { readonly sweep: DesignSweepResult; readonly output: string }[];
}

interface Block {
  readonly heading: string;
  readonly paragraphs?: readonly string[];
  readonly table?: { readonly head: readonly string[]; readonly rows: readonly (readonly string[])[] };
  readonly list?: readonly string[];
  /** An SVG chart (HTML only; Markdown gets the paragraphs that describe it). */
  readonly svg?: string;
}

const q = (v: number, unit: string): string => formatQuantity(v, unit);

function sourceText(s: Source | readonly Source[]): string {
  const list = Array.isArray(s) ? (s as readonly Source[]) : [s as Source];
  return list.map((x) => [x.authors, x.year, x.title, x.locator].filter((p) => p !== undefined).join(", ")).join("; ");
}

function percent(r: number | undefined): string {
  return r === undefined ? "" : `${(r * 100).toFixed(1)} %`;
}

/** The report's content, shared by both formats. */
function blocks(r: DesignResult, options: ReportOptions): Block[] {
  const out: Block[] = [];
  out.push({
    heading: "Inputs",
    table: {
      head: ["Name", "Value", "Tolerance"],
      rows: r.inputs.map((i) => [
        i.name, q(i.value, i.unit),
        i.tolerance ? `${q(i.tolerance.lo, i.unit)} to ${q(i.tolerance.hi, i.unit)} (${i.tolerance.kind})` : "",
      ]),
    },
  });
  for (const s of r.steps) {
    out.push({
      heading: `Step: ${s.name} (${s.title})`,
      paragraphs: [`Equation: ${s.equation}`, `Source: ${sourceText(s.source)}`, `Result: ${s.name} = ${q(s.value, s.unit)}`],
      table: {
        head: ["Input", "Value"],
        rows: s.inputs.map((i) => [i.name, typeof i.value === "number" ? q(i.value, i.unit) : Array.isArray(i.value) ? `[${i.value.map((v) => q(v, i.unit)).join(", ")}]` : String(i.value)]),
      },
      list: [...s.warnings.map((n) => `Warning (${n.code}): ${n.message}`), ...s.cautions.map((n) => `Caution (${n.code}): ${n.message}`)],
    });
  }
  if (r.derived.length > 0) {
    out.push({
      heading: "Derived quantities",
      table: { head: ["Name", "Expression", "Value"], rows: r.derived.map((d) => [d.name, d.expression, q(d.value, d.unit)]) },
    });
  }
  if (r.checks.length > 0) {
    out.push({
      heading: "Checks",
      table: {
        head: ["Check", "Value", "Limit", "Margin", "Result"],
        rows: r.checks.map((k) => [k.rule, q(k.left, k.unit), q(k.right, k.unit), `${q(k.margin, k.unit)} (${percent(k.relativeMargin)})`, k.pass ? "pass" : "FAIL"]),
      },
    });
  }
  const t = options.tolerance;
  if (t) {
    out.push({
      heading: "Tolerance",
      paragraphs: [`Monte Carlo: ${t.accepted} of ${t.samples} samples computed (generator ${t.generator}, seed ${t.seed}); each toleranced input is drawn once per sample and shared by every step that reads it. Worst case by ${t.quantities[0]?.worstCase.method ?? "corners"}.`],
      table: {
        head: ["Quantity", "Nominal", "Worst-case min", "Worst-case max", "RSS sd", "Monte Carlo 1 % .. 99 %", "Largest contributor"],
        rows: t.quantities.map((x) => {
          const top = [...x.rss.sensitivities].sort((a, b) => b.share - a.share)[0];
          return [
            x.name, q(x.nominal, x.unit), q(x.worstCase.min, x.unit), q(x.worstCase.max, x.unit), q(x.rss.sd, x.unit),
            x.monteCarlo ? `${q(x.monteCarlo.p1, x.unit)} .. ${q(x.monteCarlo.p99, x.unit)}` : "",
            top && top.share > 0 ? `${top.input} (${percent(top.share)})` : "",
          ];
        }),
      },
      list: [
        ...t.checks.map((k) => `${k.rule}: ${k.passAtNominal ? "passes" : "fails"} at nominal, ${k.passAtCorners ? "passes at every worst-case corner evaluated" : "fails at one or more worst-case corners"}${k.failureProbability !== undefined ? `; fails in ${percent(k.failureProbability)} of samples (standard error ${percent(k.standardError)})` : ""}`),
        ...t.remarks,
      ],
    });
  }
  for (const { sweep, output } of options.sweeps ?? []) {
    const passing = sweep.values.filter((_, k) => sweep.checks.every((c) => c.pass[k]));
    const failing = sweep.values.filter((_, k) => !sweep.checks.every((c) => c.pass[k]));
    const svg = sweepChartSvg(sweep, output);
    out.push({
      heading: `Sweep: ${output} against ${sweep.input}`,
      paragraphs: [
        `${sweep.values.length} points from ${q(sweep.values[0]!, sweep.unit)} to ${q(sweep.values.at(-1)!, sweep.unit)}; every check passes at ${passing.length} of them${failing.length > 0 ? ` and at least one fails at ${failing.length} (${q(Math.min(...failing), sweep.unit)} to ${q(Math.max(...failing), sweep.unit)}; red points in the chart)` : ""}.`,
      ],
      ...(svg ? { svg } : {}),
    });
  }
  const cautions = r.cautions.map((n) => `${n.step}: ${n.message}`);
  out.push({
    heading: "Cautions",
    paragraphs: [cautions.length > 0 ? "The steps raised these cautions." : "No step raised a caution.", `This calculation is an engineering aid. ${GOVERN}`],
    list: cautions,
  });
  return out;
}

function header(r: DesignResult, options: ReportOptions): { title: string; meta: string } {
  const date = options.date ?? new Date().toISOString().slice(0, 10);
  const verdict = r.checks.length === 0 ? "no checks" : r.passed ? "all checks pass" : `${r.checks.filter((k) => !k.pass).length} of ${r.checks.length} checks fail`;
  return { title: r.title, meta: `Date ${date}; emquant ${VERSION}; constants CODATA 2022; ${verdict}.` };
}

/** The calculation report as Markdown. */
export function designReportMarkdown(r: DesignResult, options: ReportOptions = {}): string {
  const cell = (s: string): string => s.replace(/\|/g, "\\|").replace(/\n/g, " ");
  const { title, meta } = header(r, options);
  const lines = [`# ${title}`, "", meta, ""];
  for (const b of blocks(r, options)) {
    lines.push(`## ${b.heading}`, "");
    for (const p of b.paragraphs ?? []) lines.push(p, "");
    if (b.table && b.table.rows.length > 0) {
      lines.push(`| ${b.table.head.join(" | ")} |`, `|${b.table.head.map(() => " --- ").join("|")}|`);
      for (const row of b.table.rows) lines.push(`| ${row.map(cell).join(" | ")} |`);
      lines.push("");
    }
    if (b.list && b.list.length > 0) {
      for (const item of b.list) lines.push(`- ${item}`);
      lines.push("");
    }
  }
  return lines.join("\n");
}

const escape = (s: string): string => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

const STYLE = `
body{font-family:"DejaVu Sans",Helvetica,Arial,sans-serif;font-size:10.5pt;color:#111;max-width:48em;margin:2em auto;padding:0 1em;line-height:1.4}
h1{font-size:16pt;margin-bottom:0.2em}h2{font-size:12.5pt;margin-top:1.4em;border-bottom:1px solid #999;page-break-after:avoid}
table{border-collapse:collapse;width:100%;margin:0.5em 0;page-break-inside:avoid}
th,td{border:1px solid #bbb;padding:0.2em 0.45em;text-align:left;vertical-align:top}th{background:#eee}
.meta{color:#444}.fail{color:#a00;font-weight:bold}.pass{color:#060}
ul{margin:0.3em 0 0.6em 1.2em;padding:0}
@page{margin:18mm}@media print{body{margin:0;max-width:none}}
`;

/** The calculation report as one self-contained, print-ready HTML file. */
export function designReportHtml(r: DesignResult, options: ReportOptions = {}): string {
  const { title, meta } = header(r, options);
  const parts = [
    "<!DOCTYPE html>", '<html lang="en"><head><meta charset="utf-8">',
    `<title>${escape(title)}</title><style>${STYLE}</style></head><body>`,
    `<h1>${escape(title)}</h1>`, `<p class="meta">${escape(meta)}</p>`,
  ];
  for (const b of blocks(r, options)) {
    parts.push(`<h2>${escape(b.heading)}</h2>`);
    for (const p of b.paragraphs ?? []) parts.push(`<p>${escape(p)}</p>`);
    if (b.table && b.table.rows.length > 0) {
      parts.push("<table><thead><tr>", ...b.table.head.map((h) => `<th>${escape(h)}</th>`), "</tr></thead><tbody>");
      for (const row of b.table.rows) {
        parts.push("<tr>", ...row.map((c) => `<td${c === "FAIL" ? ' class="fail"' : c === "pass" ? ' class="pass"' : ""}>${escape(c)}</td>`), "</tr>");
      }
      parts.push("</tbody></table>");
    }
    if (b.svg) parts.push(`<figure>${b.svg}</figure>`);
    if (b.list && b.list.length > 0) parts.push("<ul>", ...b.list.map((i) => `<li>${escape(i)}</li>`), "</ul>");
  }
  parts.push("</body></html>", "");
  return parts.join("\n");
}
