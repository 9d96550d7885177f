import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Ajv2020 from "ajv/dist/2020.js";
import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";
import {
  design, designReportHtml, designReportMarkdown, designSchema, designTolerance, evaluateDesign,
} from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";
import { gappedCoreInductance, inductanceFactor, inductanceFromFactor, quantity } from "../../src/index.js";
import { VERSION } from "../../src/version.js";

const files = ["gapped-inductor", "level-sensor"];
const load = (name: string): DesignSpec => JSON.parse(readFileSync(new URL(`../../examples/designs/${name}.json`, import.meta.url), "utf8"));

describe("the design JSON Schema", () => {
  // ajv (a general-purpose JSON Schema validator from npm), draft 2020-12.
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  const validate = ajv.compile(designSchema());

  it("accepts the example design files", () => {
    for (const f of files) expect(validate(load(f)), JSON.stringify(validate.errors)).toBe(true);
  });

  it("rejects unknown keys, unknown formula inputs, bad names and non-text expressions", () => {
    const spec = load("level-sensor");
    expect(validate({ ...spec, extra: 1 })).toBe(false);
    expect(validate({ ...spec, steps: { s: { formula: "coaxialCapacitance", inputs: { radius: "rodRadius" } } } })).toBe(false);
    expect(validate({ ...spec, steps: { s: { formula: "noSuchFormula" } } })).toBe(false);
    expect(validate({ ...spec, inputs: { "bad name": "1 m" } })).toBe(false);
    expect(validate({ ...spec, derived: { x: 3 } })).toBe(false);
    expect(validate({ ...spec, inputs: { a: { nominal: "1 m" } } })).toBe(false);
  });
});

describe("the typed builder", () => {
  it("writes the same JSON a design file holds and evaluates to the same values", () => {
    const d = design("typed inductor")
      .input("pathLength", "Length", quantity(69, "mm"))
      .input("area", "Area", quantity(84, "mm^2"))
      .input("gap", "Length", quantity(0.5, "mm"))
      .input("turns", "Dimensionless", 20)
      .step("factor", inductanceFactor, (r) => ({ pathLength: r.pathLength, area: r.area, relativePermeability: 2000, gapLength: r.gap }))
      .step("inductance", inductanceFromFactor, (r) => ({ inductanceFactor: r.factor, turns: r.turns }))
      .derived("perTurnSquared", "Inductance", "inductance / turns^2")
      .check("inductance > 20 uH");
    expect(d.spec.steps!.factor).toEqual({ formula: "inductanceFactor", inputs: { pathLength: "pathLength", area: "area", relativePermeability: 2000, gapLength: "gap" } });
    const { values, result } = d.evaluate();
    const al = inductanceFactor({ pathLength: quantity(69, "mm"), area: quantity(84, "mm^2"), relativePermeability: 2000, gapLength: quantity(0.5, "mm") });
    expect(values.factor).toBe(al);
    expect(values.inductance).toBe(inductanceFromFactor({ inductanceFactor: al, turns: 20 }));
    expect(result).toEqual(evaluateDesign(JSON.parse(JSON.stringify(d.spec))));
  });
});

describe("calculation reports", () => {
  it("the Markdown report has the inputs, every step with equation and source, the checks, tolerance and the governing statement", () => {
    const spec = load("gapped-inductor");
    const r = evaluateDesign(spec);
    const md = designReportMarkdown(r, { tolerance: designTolerance(spec, { samples: 1000 }), date: "2026-12-03" });
    expect(md).toContain(`Date 2026-12-03; emquant ${VERSION}; constants CODATA 2022`);
    for (const s of r.steps) {
      expect(md).toContain(`## Step: ${s.name}`);
      expect(md).toContain(`Equation: ${s.equation}`);
    }
    for (const k of r.checks) expect(md).toContain(k.rule);
    expect(md).toContain("## Tolerance");
    expect(md).toContain("Local codes, standards and licensed practice govern");
    expect(md).toContain("Warning (fringing)");
  });

  it("the HTML report is one self-contained file: escaped text, no scripts, no external resources", () => {
    const r = evaluateDesign(load("level-sensor"));
    const html = designReportHtml(r, { date: "2026-12-03" });
    expect(html.startsWith("<!DOCTYPE html>")).toBe(true);
    expect(html).toContain("span &gt; 40 pF");
    expect(html).not.toMatch(/<script|<link|src=|href=/i);
    expect(html).toContain("@page");
  });

  it("a failing check shows as FAIL in both formats", () => {
    const spec = { ...load("level-sensor"), checks: ["span > 1 nF"] };
    const r = evaluateDesign(spec);
    expect(r.passed).toBe(false);
    expect(designReportMarkdown(r)).toContain("| FAIL |");
    expect(designReportHtml(r)).toContain('<td class="fail">FAIL</td>');
  });
});

describe("the design command", () => {
  const dir = mkdtempSync(join(tmpdir(), "emquant-design-"));
  const io = () => {
    const out: string[] = [];
    const err: string[] = [];
    const written = new Map<string, string>();
    return {
      out, err, written,
      io: {
        out: (t: string) => out.push(t), err: (t: string) => err.push(t),
        files: { readText: (p: string) => readFileSync(p, "utf8"), writeText: (p: string, t: string) => { written.set(p, t); writeFileSync(p, t); } },
      },
    };
  };

  it("evaluates a design file, prints steps and checks, and writes both reports", () => {
    const t = io();
    const file = new URL("../../examples/designs/gapped-inductor.json", import.meta.url).pathname;
    const status = runCli(["design", file, "--tolerance", "--samples", "500", "--report", join(dir, "r.html"), "--md", join(dir, "r.md"), "--date", "2026-12-03"], t.io);
    expect(status).toBe(0);
    expect(t.out.join("\n")).toMatch(/pass {2}peakFluxDensity < 0.3 T/);
    expect(t.written.get(join(dir, "r.html"))).toContain("<h2>Tolerance</h2>");
    expect(t.written.get(join(dir, "r.md"))).toContain("# Gapped-core output inductor");
  });

  it("exit status 3 when a check fails; 1 with a coded error for a bad file", () => {
    const failing = join(dir, "failing.json");
    writeFileSync(failing, JSON.stringify({ ...load("level-sensor"), checks: ["span > 1 nF"] }));
    expect(runCli(["design", failing], io().io)).toBe(3);
    const bad = join(dir, "bad.json");
    writeFileSync(bad, "{ not json");
    const t = io();
    expect(runCli(["design", bad], t.io)).toBe(1);
    expect(t.err.join("")).toContain("error [unparsable]");
    const t2 = io();
    expect(runCli(["design", join(dir, "missing.json"), "--json"], t2.io)).toBe(1);
    expect(JSON.parse(t2.out.join("")).error.code).toBe("invalid_argument");
  });
});

it("VERSION matches package.json", () => {
  expect(VERSION).toBe(JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")).version);
});

it("a derived quantity declared with the wrong dimension in the builder is wrong_dimension on evaluate", () => {
  const d = design("x").input("a", "Length", quantity(2, "m")).derived("area", "Length", "a * a");
  let code: string | undefined;
  try {
    d.evaluate();
  } catch (e) {
    code = (e as { code?: string }).code;
  }
  expect(code).toBe("wrong_dimension");
});

it("the typed example design is the JSON example design", async () => {
  const { gappedInductor } = await import("../../examples/designs/gapped-inductor.js");
  const typed = evaluateDesign(gappedInductor);
  const json = evaluateDesign(load("gapped-inductor"));
  for (const s of json.steps) expect(typed.steps.find((t) => t.name === s.name)!.value).toBe(s.value);
  expect(typed.checks.map((k) => k.pass)).toEqual(json.checks.map((k) => k.pass));
});

describe("the README's design section", () => {
  const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
  const section = readme.slice(readme.indexOf("## Designs"), readme.indexOf("## Numerical solvers"));

  it("its JSON design is valid and its check passes", () => {
    const json = section.slice(section.indexOf("```json") + 7, section.indexOf("```", section.indexOf("```json") + 7));
    const r = evaluateDesign(JSON.parse(json));
    expect(r.checks.map((k) => [k.rule, k.pass])).toEqual([["span > 40 pF", true]]);
  });

  it("its report excerpt is what the level probe's report says", () => {
    const md = designReportMarkdown(evaluateDesign(load("level-sensor")));
    const start = section.indexOf("| Check |");
    const excerpt = section.slice(start, section.indexOf("\n\n", start)).trim();
    expect(excerpt.split("\n")).toHaveLength(3);
    expect(md).toContain(excerpt);
  });

  it("its typed example evaluates with the inductance above its check", () => {
    const d = design("Choke")
      .input("gap", "Length", { nominal: quantity(0.5, "mm"), percent: 10 })
      .input("area", "Area", quantity(84, "mm^2"))
      .step("inductance", gappedCoreInductance, (r) => ({
        turns: 20, pathLength: quantity(69, "mm"), area: r.area, relativePermeability: 2000, gapLength: r.gap, fringingFactor: 1,
      }))
      .check("inductance > 50 uH");
    expect(section).toContain('.check("inductance > 50 uH");');
    expect(d.evaluate().result.passed).toBe(true);
  });
});

describe("sweep charts in the report", () => {
  it("the HTML report draws the swept output with one point per value, red where a check fails, axes in engineering units", async () => {
    const { sweepDesign } = await import("../../src/designs/index.js");
    const spec = load("gapped-inductor");
    const sweep = sweepDesign(spec, { input: "peakCurrent", from: "4 A", to: "8 A", points: 21 });
    const failing = sweep.values.filter((_, k) => !sweep.checks.every((c) => c.pass[k])).length;
    expect(failing).toBeGreaterThan(0);
    const html = designReportHtml(evaluateDesign(spec), { sweeps: [{ sweep, output: "peakFluxDensity" }], date: "2026-12-03" });
    const svg = html.slice(html.indexOf("<svg"), html.indexOf("</svg>"));
    expect(svg.match(/<circle /g)).toHaveLength(21);
    expect(svg.match(/fill="#c00"/g)).toHaveLength(failing);
    expect(svg).toContain("peakFluxDensity (mT)");
    expect(svg).toContain("peakCurrent (A)");
    const md = designReportMarkdown(evaluateDesign(spec), { sweeps: [{ sweep, output: "peakFluxDensity" }] });
    expect(md).toContain(`## Sweep: peakFluxDensity against peakCurrent`);
    expect(md).toContain(`every check passes at ${21 - failing} of them and at least one fails at ${failing}`);
  });
});

it("the typed level probe is the JSON level probe", async () => {
  const { levelProbe } = await import("../../examples/designs/level-sensor.js");
  const typed = levelProbe.evaluate().result;
  const json = evaluateDesign(load("level-sensor"));
  for (const s of [...json.steps, ...json.derived]) {
    expect([...typed.steps, ...typed.derived].find((t) => t.name === s.name)!.value).toBe(s.value);
  }
  expect(typed.checks.map((k) => [k.rule, k.pass])).toEqual(json.checks.map((k) => [k.rule, k.pass]));
});
