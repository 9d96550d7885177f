/**
 * `emquant sweep ... --svg FILE`: the sweep's Vega-Lite chart rendered to SVG
 * in Node by vega and vega-lite, without a browser.
 *
 * vega and vega-lite are optional dependencies (installed with the package by
 * default; `npm i --omit=optional` leaves them out). They are loaded here, by
 * dynamic import, only when a chart is written: no library import path and no
 * other command loads them.
 */
import { writeFileSync } from "node:fs";
import { runCli, type CliIO } from "./run.js";

/** A chart the command line asked for: the Vega-Lite spec and the file to write. */
export interface ChartRequest {
  readonly spec: Record<string, unknown>;
  readonly path: string;
}

interface VegaModules {
  readonly vega: typeof import("vega");
  readonly vegaLite: typeof import("vega-lite");
}

async function loadVega(): Promise<VegaModules> {
  try {
    const [vega, vegaLite] = await Promise.all([import("vega"), import("vega-lite")]);
    return { vega, vegaLite };
  } catch (e) {
    const why = e instanceof Error ? e.message : String(e);
    throw new Error(`--svg needs the packages vega and vega-lite (optional dependencies of emquant; install them with "npm i vega vega-lite"): ${why}`);
  }
}

/** SVG text of a Vega-Lite specification, rendered headless (no canvas, no browser). */
export async function vegaLiteToSvg(spec: Record<string, unknown>): Promise<string> {
  const { vega, vegaLite } = await loadVega();
  const compiled = vegaLite.compile(spec as unknown as Parameters<typeof vegaLite.compile>[0]).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: "none" });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

/**
 * The command line with charts: runs `runCli`, then renders and writes the
 * charts it asked for (`--svg FILE` on a sweep). Returns the exit status; a
 * chart that cannot be written (vega missing, a bad path) is status 1 with the
 * reason on stderr.
 */
export async function runCliWithCharts(argv: readonly string[], io: CliIO): Promise<number> {
  const charts: ChartRequest[] = [];
  const status = runCli(argv, { ...io, chart: (spec, path) => charts.push({ spec, path }) });
  if (status !== 0) return status;
  return writeCharts(charts, (t) => io.err(t));
}

/**
 * Renders and writes the charts a command asked for, saying so on stderr.
 * Returns 0, or 1 with the reason on stderr when one cannot be written.
 */
export async function writeCharts(charts: readonly ChartRequest[], err: (text: string) => void): Promise<number> {
  for (const c of charts) {
    try {
      writeFileSync(c.path, await vegaLiteToSvg(c.spec));
    } catch (e) {
      err(`error: cannot write the chart to ${c.path}: ${e instanceof Error ? e.message : String(e)}`);
      return 1;
    }
    err(`chart written to ${c.path}`);
  }
  return 0;
}
