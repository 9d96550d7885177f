// `emquant sweep ... --svg FILE`: the chart rendered to SVG in Node by vega and
// vega-lite. Checked as a reader would: the file is well-formed XML (parsed by
// @xmldom/xmldom, a general-purpose W3C DOM parser), it has the axis titles with
// engineering units, and it draws one mark per computed point.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { DOMParser, type Document, type Element } from "@xmldom/xmldom";
import { build } from "esbuild";
import { afterAll, describe, expect, it } from "vitest";
import { runCliWithCharts } from "../../src/cli/chart.js";
import { runCli } from "../../src/cli/run.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const dir = mkdtempSync(join(tmpdir(), "emquant-chart-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function cli(...args: string[]): Promise<{ status: number; out: string; err: string }> {
  let out = "";
  let err = "";
  const status = await runCliWithCharts(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  return { status, out, err };
}

/** The SVG file as a DOM; any XML error fails the parse. */
function parseSvg(path: string): Document {
  return new DOMParser({ onError: (level, message) => { throw new Error(`${level}: ${message}`); } })
    .parseFromString(readFileSync(path, "utf8"), "image/svg+xml");
}

/** Elements with a class attribute containing `cls`, under `doc`. */
function byClass(doc: Document, tag: string, cls: string): Element[] {
  return Array.from(doc.getElementsByTagName(tag)).filter((e) => (e.getAttribute("class") ?? "").split(" ").includes(cls));
}

/** The text of every <text> element (axis titles, tick labels, chart title). */
function texts(doc: Document): string[] {
  return Array.from(doc.getElementsByTagName("text")).map((t) => t.textContent ?? "");
}

/** Number of drawn data marks (<path> children) in the data-mark groups of a given class (not legends or axes). */
function markCount(doc: Document, cls: string): number {
  return byClass(doc, "g", cls).filter((g) => (g.getAttribute("class") ?? "").split(" ").includes("role-mark")).reduce((n, g) => n + Array.from(g.getElementsByTagName("path")).length, 0);
}

describe("sweep charts as SVG", () => {
  it("draws a one-input sweep with its axes in mm and pF and one point per value (the README's example)", async () => {
    const readme = readFileSync(join(root, "README.md"), "utf8");
    expect(readme).toContain('emquant sweep parallelPlateCapacitance gap="0.1 mm..1 mm" area="1 cm^2" --svg gap.svg');
    const file = join(dir, "gap.svg");
    // 11 points is the default.
    const r = await cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--svg", file);
    expect(r.status).toBe(0);
    expect(r.err).toContain(`chart written to ${file}`);
    // The table is printed as without --svg: a header and 11 rows.
    expect(r.out.split("\n").filter((l) => /^\d/.test(l))).toHaveLength(11);
    const doc = parseSvg(file);
    expect(doc.documentElement?.nodeName).toBe("svg");
    const t = texts(doc);
    expect(t).toContain("gap (mm)");
    expect(t).toContain("parallelPlateCapacitance (pF)");
    // Tick labels in mm: the sweep spans 0.1-1 mm, so "0.5" is a tick and no label reads in metres.
    expect(t).toContain("0.5");
    expect(t.some((s) => /e-\d/.test(s))).toBe(false);
    expect(markCount(doc, "mark-symbol")).toBe(11);
    expect(markCount(doc, "mark-line")).toBe(1);
  });

  it("leaves out points not computed and draws a heatmap cell per computed point of a two-input sweep", async () => {
    const file = join(dir, "grid.svg");
    // relativePermittivity 0 is outside its domain (at least 1): the row at 0 is not computed.
    const r = await cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "relativePermittivity=0..6", "area=1 cm^2", "--points", "4", "--svg", file);
    expect(r.status).toBe(0);
    expect(r.out).toMatch(/4 points not computed/);
    const doc = parseSvg(file);
    expect(markCount(doc, "mark-rect")).toBe(12);
    expect(texts(doc)).toContain("gap (mm)");
    // The colour legend's title carries the unit in full (not cut short).
    expect(texts(doc)).toContain("parallelPlateCapacitance (pF)");
  });

  it("says --svg needs the command's chart writer when runCli is called without one", () => {
    let err = "";
    const status = runCli(["sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--svg", join(dir, "x.svg")], { out: () => {}, err: (t) => (err += t) });
    expect(status).toBe(2);
    expect(err).toMatch(/--svg/);
  });

  it("reports a chart it cannot write with status 1 and the path", async () => {
    const file = join(dir, "no-such-dir", "x.svg");
    const r = await cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--svg", file);
    expect(r.status).toBe(1);
    expect(r.err).toContain(`cannot write the chart to ${file}`);
  });

  it("keeps vega off every library import path: the CLI entry loads it by dynamic import only", async () => {
    const graph = async (entry: string) => {
      const { metafile } = await build({
        entryPoints: [join(root, entry)], bundle: true, write: false, metafile: true, platform: "node", format: "esm",
        external: ["mathjs", "decimal.js", "vega", "vega-lite"], logLevel: "silent",
      });
      return Object.values(metafile.inputs).flatMap((i) => i.imports).filter((i) => /^vega(-lite)?$/.test(i.path));
    };
    expect(await graph("src/index.ts")).toEqual([]);
    const cliImports = await graph("src/cli/main.ts");
    expect(cliImports.map((i) => i.path).sort()).toEqual(["vega", "vega-lite"]);
    expect(cliImports.every((i) => i.kind === "dynamic-import")).toBe(true);
  });
});
