import { FormulaError } from "../core/errors.js";
import type { LongRunOptions } from "../core/progress.js";
import { type Parsed, parseArgs, UsageError } from "./args.js";
import { evaluate } from "../core/evaluate.js";
import { getFormula, listFormulas } from "../core/registry.js";
import type { InputSpec, Note } from "../core/spec.js";
import { didYouMean } from "../core/suggest.js";
import { catalogEntry, inputShapeText, outputText } from "../tools/catalog.js";
import type { NoteSummary } from "../tools/notes.js";
import { solveRequest } from "../tools/solve.js";
import { sweepRequest, sweepToCsv, sweepToVegaLite } from "../tools/sweep.js";
import { toleranceRequest } from "../tools/tolerance.js";
import { columnsCommand } from "./columns.js";
import { DIMENSIONS } from "../units/dimensions.js";
import { engineering, formatBoth, formatQuantity } from "../units/display.js";
import { type DesignFiles, designCommand } from "./design.js";
import { formatNumber } from "../core/format.js";
import { VERSION } from "../version.js";

/** Where the command line writes. */
export interface CliIO {
  out(text: string): void;
  err(text: string): void;
  /** File access for `design` (main.ts passes node:fs); without it the command refuses. */
  files?: DesignFiles;
  /**
   * Takes the chart a sweep asked for with `--svg FILE` (rendered and written by
   * runCliWithCharts in chart.ts, which loads vega). Without it, `--svg` is a usage error.
   */
  chart?(spec: Record<string, unknown>, path: string): void;
  /**
   * Cancellation and progress for the long commands (sweep, tolerance, columns,
   * design --tolerance), passed to the library call; the job thread (job.ts)
   * sets it. Without it those calls run as before.
   */
  longRun?: LongRunOptions;
}

const USAGE = `emquant: electromagnetics formulas with units

Usage:
  emquant list [category]                     formulas, by category
  emquant show <formula>                      inputs, units, defaults, domain, example, equation, source
  emquant compute <formula> name=value ...    evaluate, e.g. compute parallelPlateCapacitance area="1 cm^2" gap="0.1 mm"
  emquant solve <formula> <input> target=value name=value ...
                                              the input value that gives the target output
  emquant tolerance <formula> name=value ...  worst case, RSS and Monte Carlo; a value may be
                                              "0.1 mm +- 0.01 mm", "4.4 +- 5%", "normal(0.1 mm, 3 um)"
                                              or "uniform(0.09 mm, 0.11 mm)"
  emquant sweep <formula> name=from..to [name=from..to] name=value ...
                                              a table over one or two inputs
  emquant columns <formula> <file.csv> [name=value ...]
                                              every row of a CSV table (header: input names, a unit
                                              in parentheses optional, "gap (mm)"); name=value pairs
                                              are the same for every row; a bad row gets an error
                                              code, the others are computed; exit status 4 when
                                              a row fails
  emquant design <file.json> [--tolerance] [--report out.html] [--md out.md]
                                              evaluate a design file (steps, derived quantities,
                                              checks); exit status 3 when a check fails
  emquant help
  emquant --version

Options:
  --json            machine-readable output (errors too)
  --samples N       Monte Carlo samples for tolerance (default 10000)
  --seed N          Monte Carlo seed (default 1)
  --range lo..hi    solve: search only this range of the input, e.g. --range "0 V..1 kV"
  --points N        points per swept input (default 11)
  --log             geometric spacing for sweeps
  --csv             sweep or columns as CSV (the notes go to stderr)
  --chart           sweep as a Vega-Lite chart specification (JSON; notes to stderr)
  --tolerance       design: also run tolerance through the chain (uses --samples, --seed)
  --report FILE     design: write the calculation report as HTML
  --md FILE         design: write the calculation report as Markdown
  --date YYYY-MM-DD design: the date printed on the report (default today)
  --svg FILE        sweep: also draw the chart to an SVG file (axes in mm, pF, ...)

Values are numbers in SI units or numbers with a unit ("0.2 mm", "4.7 uF", "4.7 µF");
vectors as "[1000, 0, 0] V/m" or "[1 kV/m, 0 V/m, 0 V/m]"; a series (a waveform over
one period) the same way with any number of samples: waveform="[0, 0.1, 0, -0.1] T"
or waveform=0,0.1,0,-0.1 (plain numbers are SI).
Warnings and cautions are printed with every result; sweeps and tolerance
analyses say how many points raised each one and where it was worst.`;

function intFlag(p: Parsed, name: string): number | undefined {
  const v = p.flags.get(name);
  if (v === undefined) return undefined;
  const n = Number(v);
  if (typeof v !== "string" || !Number.isInteger(n)) throw new UsageError(`--${name} needs a whole number, got ${String(v)}`);
  return n;
}

/** SI unit symbol of a quantity input ("" for choices and dimensionless). */
function unitOf(spec: InputSpec | undefined): string {
  return spec && !("choices" in spec) ? DIMENSIONS[spec.dimension].unit : "";
}

// A bare number: it takes the unit written after the brackets, if any.
const BARE_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * A command-line value for an input. Vectors and series as `show` prints them,
 * "[1000, 0, 0] V/m" (the unit after the brackets applies to every bare
 * number), or with a unit per component "[1 kV/m, 0 V/m, 0 V/m]", or
 * "1000, 0, 0"; other values as typed.
 */
export function inputValue(spec: InputSpec | undefined, text: string): unknown {
  if (spec && !("choices" in spec) && (spec.vector || spec.series)) {
    const m = /^\s*\[(.*)\]\s*(.*?)\s*$/.exec(text);
    const [inner, unit] = m ? [m[1]!, m[2]!] : [text, ""];
    return inner.split(",").map((s) => s.trim()).map((c) => (unit && BARE_NUMBER.test(c) ? `${c} ${unit}` : c));
  }
  return text.trim();
}

function inputsFrom(id: string, pairs: readonly [string, string][]): Record<string, unknown> {
  const specs = getFormula(id).definition.inputs as Readonly<Record<string, InputSpec>>;
  const out: Record<string, unknown> = {};
  for (const [k, v] of pairs) out[k] = inputValue(Object.hasOwn(specs, k) ? specs[k] : undefined, v);
  return out;
}

/** "0.1 mm +- 0.01 mm", "4.4 +- 5%", "normal(m, sd)", "uniform(a, b)", or a plain value. */
export function parseToleranceText(text: string): unknown {
  const fn = /^\s*(normal|uniform)\s*\((.*)\)\s*$/i.exec(text);
  if (fn) {
    const parts = fn[2]!.split(",").map((s) => s.trim());
    if (parts.length !== 2) throw new UsageError(`${fn[1]}(...) takes two values: ${text}`);
    return fn[1]!.toLowerCase() === "normal"
      ? { distribution: "normal", mean: parts[0], sd: parts[1] }
      : { distribution: "uniform", min: parts[0], max: parts[1] };
  }
  const pm = text.split(/\s*(?:\+-|\+\/-|±)\s*/);
  if (pm.length === 2) {
    const [nominal, band] = pm as [string, string];
    const pc = /^([0-9.eE+-]+)\s*%$/.exec(band);
    if (pc) return { nominal: nominal.trim(), percent: Number(pc[1]) };
    return { nominal: nominal.trim(), plusMinus: band.trim() };
  }
  if (pm.length > 2) throw new UsageError(`one "+-" per value: ${text}`);
  return text.trim();
}

function notesText(warnings: readonly Note[], cautions: readonly Note[]): string[] {
  return [
    ...cautions.map((c) => `CAUTION [${c.code}]: ${c.message}`),
    ...warnings.map((w) => `warning [${w.code}]: ${w.message}`),
  ];
}

/**
 * Note summaries of a sweep or tolerance analysis, one line each: the worst
 * point's message, then how many points raised it and where the worst was.
 */
function summaryText(summaries: readonly NoteSummary[], over: number, units: Readonly<Record<string, string>>, what = "points"): string[] {
  const ordered = [...summaries.filter((s) => s.kind === "caution"), ...summaries.filter((s) => s.kind === "warning")];
  return ordered.map((s) => {
    const at = Object.entries(s.worst.inputs).map(([k, v]) => `${k} = ${formatQuantity(v, units[k] ?? "")}`).join(", ");
    const head = s.kind === "caution" ? `CAUTION [${s.code}]` : `warning [${s.code}]`;
    return `${head}: ${s.worst.message} (at ${s.count} of ${over} ${what}; ${s.worst.measure !== undefined ? "worst" : "first"} at ${at})`;
  });
}

function need(p: Parsed, n: number, what: string): void {
  if (p.positional.length < n) throw new UsageError(`missing ${what}`);
}

/**
 * Run the command line with the given arguments (without "node" and the script).
 * Returns the exit status: 0 done, 1 a FormulaError (bad input, no solution),
 * 2 a usage error.
 */
export function runCli(argv: readonly string[], io: CliIO): number {
  let json = argv.includes("--json");
  try {
    const p = parseArgs(argv);
    json = p.flags.has("json");
    const [command, ...rest] = p.positional;
    if (p.flags.has("version")) {
      io.out(json ? JSON.stringify({ version: VERSION }) : `emquant ${VERSION}`);
      return 0;
    }
    if (command === "help" || p.flags.has("help")) {
      io.out(USAGE);
      return 0;
    }
    if (command === undefined) throw new UsageError("no command given");
    p.positional = rest;
    switch (command) {
      case "list":
        return list(p, io, json);
      case "show":
        return show(p, io, json);
      case "compute":
        return compute(p, io, json);
      case "solve":
        return solveCommand(p, io, json);
      case "tolerance":
        return toleranceCommand(p, io, json);
      case "sweep":
        return sweepCommand(p, io, json);
      case "columns": {
        need(p, 2, "formula id and a CSV file");
        if (!io.files) throw new UsageError("columns needs file access");
        const id = p.positional[0]!;
        return columnsCommand(
          { formula: id, file: p.positional[1]!, fixed: inputsFrom(id, p.pairs), json, csv: p.flags.has("csv"), longRun: io.longRun },
          io.files,
          io,
          (r) => summaryText(r.notes, r.rows - r.failed, Object.fromEntries(Object.entries(getFormula(id).definition.inputs as Record<string, InputSpec>).map(([k, s]) => [k, unitOf(s)])), "rows"),
        );
      }
      case "design": {
        need(p, 1, "a design file");
        if (!io.files) throw new UsageError("design needs file access");
        const date = p.flags.get("date");
        if (date !== undefined && (typeof date !== "string" || !/^\d{4}-\d{2}-\d{2}$/.test(date))) throw new UsageError("--date needs YYYY-MM-DD");
        return designCommand(
          {
            file: p.positional[0]!, json, tolerance: p.flags.has("tolerance"), samples: intFlag(p, "samples"), seed: intFlag(p, "seed"),
            report: p.flags.get("report") as string | undefined, markdown: p.flags.get("md") as string | undefined, date: date as string | undefined,
            longRun: io.longRun,
          },
          io.files,
          (t) => io.out(t),
        );
      }
      default:
        throw new UsageError(`unknown command "${command}"${hintFor(command, COMMANDS)}`);
    }
  } catch (e) {
    if (e instanceof FormulaError) {
      if (json) io.out(JSON.stringify({ error: { code: e.code, message: e.message, input: e.input ?? null } }, null, 2));
      else io.err(`error [${e.code}]: ${e.message}`);
      return 1;
    }
    if (e instanceof UsageError) {
      if (json) io.out(JSON.stringify({ error: { code: "usage", message: e.message, input: null } }, null, 2));
      // The message, then the usage once, both on stderr: stdout stays for results.
      else io.err(`usage: ${e.message}\n\n${USAGE}`);
      return 2;
    }
    throw e;
  }
}

const COMMANDS = ["list", "show", "compute", "solve", "tolerance", "sweep", "columns", "design", "help"];

/** '; did you mean "show"?' or "". */
function hintFor(word: string, candidates: readonly string[]): string {
  const h = didYouMean(word, candidates);
  return h ? `; ${h}` : "";
}

function list(p: Parsed, io: CliIO, json: boolean): number {
  const category = p.positional[0];
  const all = listFormulas().filter((f) => category === undefined || f.definition.category === category);
  if (category !== undefined && all.length === 0) {
    const cats = [...new Set(listFormulas().map((f) => f.definition.category))].join(", ");
    throw new UsageError(`no formulas in category "${category}"${hintFor(category, cats.split(", "))} (categories: ${cats})`);
  }
  if (json) {
    io.out(JSON.stringify(all.map((f) => ({ id: f.id, title: f.definition.title, category: f.definition.category })), null, 2));
    return 0;
  }
  let last = "";
  const lines: string[] = [];
  const width = Math.max(...all.map((f) => f.id.length));
  for (const f of all) {
    if (f.definition.category !== last) {
      last = f.definition.category;
      lines.push(`${lines.length ? "\n" : ""}${last}`);
    }
    lines.push(`  ${f.id.padEnd(width)}  ${f.definition.title}`);
  }
  io.out(lines.join("\n"));
  return 0;
}

function show(p: Parsed, io: CliIO, json: boolean): number {
  need(p, 1, "formula id");
  const e = catalogEntry(p.positional[0]!);
  if (json) {
    io.out(JSON.stringify(e, null, 2));
    return 0;
  }
  const lines = [`${e.title} (${e.id}, ${e.category})`, "", e.description, "", `  ${e.equation}`, "", "Inputs:"];
  for (const i of e.inputs) {
    const facts: string[] = [];
    if (i.kind === "choice") facts.push(`one of ${i.choices!.join(", ")}`);
    else facts.push(`${i.dimension}${i.unit ? ` [${i.unit}]` : ""}${inputShapeText(i)}`);
    if (i.domain) facts.push(i.domain.rule);
    if (i.default !== undefined) facts.push(`default ${typeof i.default === "number" ? formatQuantity(i.default, i.unit ?? "") : i.default}`);
    else facts.push("required");
    if (i.example !== undefined) {
      facts.push(`e.g. ${exampleText(i)}`);
    }
    lines.push(`  ${i.name}: ${i.description}`, `      ${facts.join("; ")}`);
  }
  lines.push("", `Output: ${e.output.description} (${outputText(e.output)})${e.output.components ? `, components ${e.output.components.join(", ")}` : ""}`);
  if (e.relations.length) lines.push("", "Relations:", ...e.relations.map((r) => `  ${r}`));
  if (e.validity.length) lines.push("", "Validity warnings:", ...e.validity.map((v) => `  [${v.code}] ${v.message ?? "(text depends on the inputs)"}`));
  if (e.cautions.length) lines.push("", "Cautions:", ...e.cautions.map((v) => `  [${v.code}] ${v.message ?? "(text depends on the inputs)"}${v.always ? " (always)" : ""}`));
  lines.push("", "Source:", ...e.sources.map((s) => `  ${s.authors}${s.year ? ` (${s.year})` : ""}, ${s.title}${s.locator ? `, ${s.locator}` : ""}`));
  // Every input with an example, written so that the line runs as printed: values in
  // shortest round-trip digits (the example itself), vectors in the form shown above.
  const example = e.inputs.filter((i) => i.example !== undefined).map((i) => `${i.name}="${exampleText(i)}"`);
  if (example.length) lines.push("", `Try: emquant compute ${e.id} ${example.join(" ")}`);
  io.out(lines.join("\n"));
  return 0;
}

/** An input's example as the command line reads it: "450 um", "[1000, 0, 0] V/m", "square". */
function exampleText(i: ReturnType<typeof catalogEntry>["inputs"][number]): string {
  const unit = i.unit ?? "";
  if (typeof i.example === "number") return formatQuantity(i.example, unit, "shortest");
  if (Array.isArray(i.example)) return `[${i.example.map((v) => formatQuantity(v as number, "", "shortest")).join(", ")}]${unit ? ` ${unit}` : ""}`;
  return String(i.example);
}

function compute(p: Parsed, io: CliIO, json: boolean): number {
  need(p, 1, "formula id");
  const id = p.positional[0]!;
  const r = evaluate(id, inputsFrom(id, p.pairs));
  if (json) {
    io.out(JSON.stringify(r, null, 2));
    return 0;
  }
  const f = getFormula(id);
  const comps = f.definition.output.components as readonly string[] | undefined;
  const lines: string[] = [];
  if (Array.isArray(r.value)) {
    lines.push(`${f.definition.output.description}:`);
    (r.value as number[]).forEach((v, i) => lines.push(`  ${comps?.[i] ?? i} = ${formatBoth(v, r.unit)}`));
  } else {
    lines.push(`${f.definition.output.description} = ${formatBoth(r.value as number, r.unit)}`);
  }
  lines.push(...notesText(r.warnings, r.cautions));
  io.out(lines.join("\n"));
  return 0;
}

function solveCommand(p: Parsed, io: CliIO, json: boolean): number {
  need(p, 2, "formula id and the input to solve for");
  const [id, solveFor] = p.positional as [string, string];
  const target = p.pairs.find(([k]) => k === "target");
  if (!target) throw new UsageError('give the output wanted as target=value, e.g. target="100 pF"');
  const inputs = inputsFrom(id, p.pairs.filter(([k]) => k !== "target"));
  const rangeText = p.flags.get("range");
  let range: [string, string] | undefined;
  if (typeof rangeText === "string") {
    const m = /^(.*?)\.\.(.*)$/.exec(rangeText);
    if (!m) throw new UsageError('--range is low..high, e.g. --range "1 mm..10 mm"');
    range = [m[1]!.trim(), m[2]!.trim()];
  }
  const r = solveRequest({ formula: id, solveFor, target: target[1].trim(), inputs, ...(range ? { options: { range } } : {}) });
  if (json) {
    io.out(JSON.stringify(r, null, 2));
    return 0;
  }
  const lines = [`${r.input} = ${formatBoth(r.value, r.unit, 6)}`];
  if (r.exact !== undefined) lines.push(`  rounded to a whole number from ${formatNumber(r.exact, 6)}`);
  lines.push(`  output there: ${formatQuantity(r.outputAtValue, r.outputUnit, 6)} (target ${formatQuantity(r.target, r.outputUnit, 6)})`);
  lines.push(...notesText(r.warnings, r.cautions));
  io.out(lines.join("\n"));
  return 0;
}

function toleranceCommand(p: Parsed, io: CliIO, json: boolean): number {
  need(p, 1, "formula id");
  const id = p.positional[0]!;
  const specs = getFormula(id).definition.inputs as Readonly<Record<string, InputSpec>>;
  const inputs: Record<string, unknown> = {};
  for (const [k, v] of p.pairs) {
    const s = Object.hasOwn(specs, k) ? specs[k] : undefined;
    inputs[k] = s && !("choices" in s) && !s.vector && !s.series ? parseToleranceText(v) : inputValue(s, v);
  }
  const samples = intFlag(p, "samples");
  const seed = intFlag(p, "seed");
  const r = toleranceRequest({ formula: id, inputs, options: { ...(samples !== undefined ? { samples } : {}), ...(seed !== undefined ? { seed } : {}) } }, io.longRun);
  if (json) {
    io.out(JSON.stringify(r, null, 2));
    return 0;
  }
  const q = (v: number): string => formatQuantity(v, r.unit, 4);
  // v / |nominal| - sign(nominal): no difference of two huge values; left out if it overflows.
  const pct = (v: number): string => {
    const p = (v / Math.abs(r.nominal) - Math.sign(r.nominal)) * 100;
    return r.nominal !== 0 && p - p === 0 ? ` (${p.toFixed(2)} %)` : "";
  };
  const lines = [
    `nominal      ${q(r.nominal)}`,
    `worst case   ${q(r.worstCase.min)}${pct(r.worstCase.min)} to ${q(r.worstCase.max)}${pct(r.worstCase.max)}   [${r.worstCase.method}, ${r.worstCase.evaluated} evaluated]`,
    `RSS          +- ${q(r.rss.plusMinus)} (band), sd ${q(r.rss.sd)}`,
  ];
  const mc = r.monteCarlo;
  if (mc) {
    lines.push(
      `Monte Carlo  ${mc.accepted} of ${mc.samples} samples (seed ${mc.seed}; ${mc.rejected} rejected)`,
      `  mean ${q(mc.mean)}, sd ${q(mc.sd)}`,
      `  p1 ${q(mc.p1)}  p5 ${q(mc.p5)}  p50 ${q(mc.p50)}  p95 ${q(mc.p95)}  p99 ${q(mc.p99)}`,
    );
  }
  if (r.sensitivities.length) {
    lines.push("share of variance:");
    for (const s of r.sensitivities) lines.push(`  ${s.input.padEnd(24)} ${(100 * s.share).toFixed(1).padStart(5)} %   slope ${engineering(s.derivative, 4)} ${s.derivativeUnit}`);
  }
  for (const m of r.remarks) lines.push(`note: ${m}`);
  const spec = getFormula(id).definition.inputs as Readonly<Record<string, InputSpec>>;
  const units = Object.fromEntries(r.sensitivities.map((s) => [s.input, unitOf(spec[s.input])]));
  lines.push(...summaryText(r.notes, r.notesOver, units));
  io.out(lines.join("\n"));
  return 0;
}

function sweepCommand(p: Parsed, io: CliIO, json: boolean): number {
  need(p, 1, "formula id");
  const id = p.positional[0]!;
  const points = intFlag(p, "points") ?? 11;
  const scale = p.flags.has("log") ? "log" : "linear";
  const vary: Record<string, { from: string; to: string; points: number; scale: "log" | "linear" }> = {};
  const fixedPairs: [string, string][] = [];
  for (const [k, v] of p.pairs) {
    const m = /^(.*?)\.\.(.*)$/.exec(v);
    if (m) vary[k] = { from: m[1]!.trim(), to: m[2]!.trim(), points, scale };
    else fixedPairs.push([k, v]);
  }
  if (Object.keys(vary).length === 0) throw new UsageError('give one or two inputs as name=from..to, e.g. gap="0.1 mm..1 mm"');
  const svg = p.flags.get("svg");
  if (typeof svg === "string" && !io.chart) throw new UsageError("--svg is available from the emquant command (runCliWithCharts)");
  const r = sweepRequest({ formula: id, vary, fixed: inputsFrom(id, fixedPairs) }, io.longRun);
  if (typeof svg === "string") io.chart!(sweepToVegaLite(r), svg);
  const units = Object.fromEntries(r.axes.map((a) => [a.name, a.unit]));
  const summary = summaryText(r.notes, r.computed.length - r.notComputed, units);
  if (p.flags.has("csv") || p.flags.has("chart")) {
    // The data stays data only; the notes go beside it, on stderr.
    io.out(p.flags.has("csv") ? sweepToCsv(r).trimEnd() : JSON.stringify(sweepToVegaLite(r), null, 2));
    if (summary.length) io.err(["notes found on the grid:", ...summary].join("\n"));
    return 0;
  }
  if (json) {
    io.out(JSON.stringify({
      formula: r.formula,
      axes: r.axes.map((a) => ({ name: a.name, unit: a.unit, scale: a.scale, values: [...a.values] })),
      output: { name: r.output.name, unit: r.output.unit, values: [...r.output.values].map((v, k) => (r.computed[k] ? v : null)) },
      notComputed: r.notComputed,
      notes: r.notes,
    }, null, 2));
    return 0;
  }
  const n1 = r.axes.length === 2 ? r.axes[1]!.values.length : 1;
  const lines = [r.axes.map((a) => `${a.name}${a.unit ? ` (${a.unit})` : ""}`).concat(`${r.output.name}`).join("\t")];
  for (let k = 0; k < r.output.values.length; k++) {
    const row = [formatQuantity(r.axes[0]!.values[Math.floor(k / n1)]!, r.axes[0]!.unit)];
    if (r.axes.length === 2) row.push(formatQuantity(r.axes[1]!.values[k % n1]!, r.axes[1]!.unit));
    row.push(r.computed[k] ? formatQuantity(r.output.values[k]!, r.output.unit) : "not computed");
    lines.push(row.join("\t"));
  }
  if (r.notComputed) lines.push(`note: ${r.notComputed} points not computed (outside a domain or breaking a relation)`);
  // Every note on the grid with its count and worst point, so a hazard at one end is not missed.
  if (summary.length) lines.push("notes found on the grid:", ...summary);
  io.out(lines.join("\n"));
  return 0;
}

