// The calculation report in headless Chromium (Debian's chromium via
// playwright-core, no browser download): the HTML report of each example
// design renders with its tables, prints to PDF, and leaves a screenshot and
// the PDF in test-output/. Run by `npm run test:browser`.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { chromium, type BrowserContext } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { designReportHtml, designTolerance, evaluateDesign, sweepDesign } from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const output = join(root, "test-output");
const CHROMIUM = "/usr/bin/chromium";
const ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

let context: BrowserContext;
let profile: string;

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium (.ci/run does this)`);
  mkdirSync(output, { recursive: true });
  profile = mkdtempSync(join(tmpdir(), "emquant-report-"));
  context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, headless: true, args: ARGS, viewport: { width: 1000, height: 1400 } });
}, 120_000);

afterAll(async () => {
  await context?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
});

describe("the calculation report in a browser", () => {
  for (const name of ["gapped-inductor", "level-sensor"]) {
    it(`${name}: renders every section and table, and prints to PDF`, async () => {
      const spec = JSON.parse(readFileSync(join(root, `examples/designs/${name}.json`), "utf8")) as DesignSpec;
      const result = evaluateDesign(spec);
      const plan = name === "gapped-inductor"
        ? { input: "peakCurrent", from: "3 A", to: "9 A", output: "peakFluxDensity" }
        : { input: "level", from: "0.05 m", to: "0.95 m", output: "probeCapacitance" };
      const sweeps = [{ sweep: sweepDesign(spec, { ...plan, points: 31 }), output: plan.output }];
      const html = designReportHtml(result, { tolerance: designTolerance(spec, { samples: 1000 }), sweeps, date: "2026-12-03" });
      const file = join(output, `report-${name}.html`);
      writeFileSync(file, html);
      const page = context.pages()[0] ?? (await context.newPage());
      await page.goto(pathToFileURL(file).href);
      const headings = await page.$$eval("h2", (hs) => hs.map((h) => h.textContent));
      expect(headings).toEqual(expect.arrayContaining(["Inputs", "Checks", "Tolerance", "Cautions", ...result.steps.map((s) => `Step: ${s.name} (${s.title})`)]));
      // Every check row shows its result; the tables laid out with a width (not collapsed).
      const results = await page.$$eval("h2 + table td:last-child, table td.pass, table td.fail", (tds) => tds.map((t) => t.textContent));
      expect(results.filter((t) => t === "pass" || t === "FAIL").length).toBe(result.checks.length);
      // The sweep's chart is laid out at its size with one point per value.
      const chart = await page.$eval("figure svg", (svg) => ({ width: svg.getBoundingClientRect().width, points: svg.querySelectorAll("circle").length }));
      expect(chart).toEqual({ width: 560, points: 31 });
      const width = await page.$eval("table", (t) => t.getBoundingClientRect().width);
      expect(width).toBeGreaterThan(300);
      await page.screenshot({ path: join(output, `report-${name}.png`), fullPage: true });
      await page.pdf({ path: join(output, `report-${name}.pdf`), format: "A4" });
      expect(statSync(join(output, `report-${name}.pdf`)).size).toBeGreaterThan(10_000);
      expect(readFileSync(join(output, `report-${name}.pdf`)).subarray(0, 5).toString()).toBe("%PDF-");
    });
  }
});
