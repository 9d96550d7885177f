// The browser page (examples/web), end to end in headless Chromium: Debian's
// chromium package driven by playwright-core (no browser download). Run by
// `npm run test:browser` after `npm run build:web`; leaves a screenshot in
// test-output/. Not part of `npm test` (which needs no browser).
import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { serveStatic } from "./static-server.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const site = join(root, "out/web");
const CHROMIUM = "/usr/bin/chromium";
const ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

let server: Awaited<ReturnType<typeof serveStatic>>;
let context: BrowserContext;
let page: Page;
let profile: string;
const pageErrors: string[] = [];

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium (.ci/run does this)`);
  if (!existsSync(join(site, "index.html"))) throw new Error("out/web is not built: npm run build:web");
  server = await serveStatic(site);
  profile = mkdtempSync(join(tmpdir(), "emquant-chromium-"));
  context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, headless: true, args: ARGS, viewport: { width: 1200, height: 1500 } });
  page = context.pages()[0] ?? (await context.newPage());
  page.on("pageerror", (e) => pageErrors.push(e.message));
}, 120_000);

afterAll(async () => {
  await context?.close();
  await server?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
});

async function open(id: string): Promise<void> {
  // A fresh document each time: going to the same URL with only a hash would keep the old form.
  await page.goto("about:blank");
  await page.goto(`${server.url}#${id}`);
  await page.waitForSelector("body[data-ready=true]");
  await page.waitForFunction((f) => (document.getElementById("formula") as HTMLSelectElement).value === f, id);
}

async function fill(values: Record<string, string>): Promise<void> {
  for (const [name, v] of Object.entries(values)) await page.fill(`#in-${name}`, v);
}

describe("the browser page", () => {
  it("lists the formulas by category and builds a form from the input specs", async () => {
    await open("coaxialCapacitance");
    const groups = await page.$$eval("#formula optgroup", (gs) => gs.map((g) => (g as HTMLOptGroupElement).label));
    expect(groups).toContain("capacitance");
    expect(groups.length).toBeGreaterThan(3);
    // Prefilled from the spec's example, with a prefixed unit (innerRadius example 4.5e-4 m).
    expect(await page.inputValue("#in-innerRadius")).toMatch(/^450 [uµμ]m$/);
    expect(await page.textContent("#equation")).toMatch(/ln/);
  });

  it("computes the capacitance of a 7 mm 50-ohm air line from unit strings: 1/(c Z0) per metre", async () => {
    // 7 mm precision air line: conductors 3.04 mm and 7.00 mm in diameter, Z0 = 50 ohm
    // (IEEE Std 287, from memory); an air TEM line has C' = 1/(c Z0) (D. M. Pozar,
    // Microwave Engineering, 4th ed., Sec. 2.1, from memory); c = 299 792 458 m/s exactly (SI).
    await open("coaxialCapacitance");
    await fill({ innerRadius: "1.52 mm", outerRadius: "3.5 mm", length: "1 m", relativePermittivity: "1" });
    await page.click("#compute");
    await page.waitForSelector("#result[data-value]");
    const value = JSON.parse((await page.getAttribute("#result", "data-value"))!) as number;
    const expected = 1 / (299_792_458 * 50);
    expect(Math.abs(value / expected - 1)).toBeLessThan(1e-3); // nominal 50 ohm; 3.04/7.00 gives 50.0 ohm to 0.05 %
    expect(await page.getAttribute("#result", "data-unit")).toBe("F");
    expect(await page.textContent("#result")).toMatch(/= 66\.7\d? pF/);
    expect(await page.textContent("#sources")).not.toBe("");
  });

  it("shows a hazard caution with its safety wording next to the result", async () => {
    await open("capacitorEnergy");
    await fill({ capacitance: "1000 uF", voltage: "400 V" });
    await page.click("#compute");
    await page.waitForSelector("#cautions li");
    const cautions = await page.$$eval("#cautions li", (li) => li.map((l) => ({ code: (l as HTMLElement).dataset.code, text: l.textContent ?? "" })));
    expect(cautions.map((c) => c.code)).toContain("stored_energy");
    expect(cautions.every((c) => c.text.includes("licensed practice govern"))).toBe(true);
  });

  it("reads vector inputs written as [x, y, z] unit and shows each component of a vector result", async () => {
    // F = q (E + v x B) with q = e = 1.602176634e-19 C (exact in the SI since 2019; CODATA 2022):
    // E = 1 kV/m along x gives e * 1000 N along x; v = 1e6 m/s along x in B = 1 T along z gives
    // e * 1e6 * (x cross z = -y) N, so F = [1.602176634e-16, -1.602176634e-13, 0] N.
    await open("lorentzForce");
    await fill({ charge: "1.602176634e-19 C", electricField: "[1, 0, 0] kV/m", velocity: "[1e6, 0, 0] m/s", fluxDensity: "[0, 0, 1] T" });
    await page.click("#compute");
    await page.waitForSelector("#result[data-value]");
    const [fx, fy, fz] = JSON.parse((await page.getAttribute("#result", "data-value"))!) as number[];
    expect(Math.abs(fx! / 1.602176634e-16 - 1)).toBeLessThan(1e-12);
    expect(Math.abs(fy! / -1.602176634e-13 - 1)).toBeLessThan(1e-12);
    expect(fz).toBe(0);
    expect(await page.$$eval("#result > div", (d) => d.length)).toBe(3);
  });

  it("names the bad input and marks its field instead of showing a number", async () => {
    await open("coaxialCapacitance");
    await fill({ innerRadius: "-1 mm" });
    await page.click("#compute");
    await page.waitForSelector("#result.error");
    expect(await page.textContent("#result")).toMatch(/innerRadius/);
    expect(await page.getAttribute("#in-innerRadius", "aria-invalid")).toBe("true");
    expect(await page.getAttribute("#result", "data-value")).toBeNull();
  });

  it("plots a sweep computed in a worker, with axes in mm and pF, and writes a screenshot", async () => {
    await open("coaxialCapacitance");
    await page.selectOption("#sweep-input", "outerRadius");
    await page.fill("#sweep-from", "1 mm");
    await page.fill("#sweep-to", "10 mm");
    await page.fill("#sweep-points", "37");
    await page.click("#compute");
    await page.click("#sweep-run");
    await page.waitForSelector("#plot svg path.line");
    const d = await page.getAttribute("#plot svg path.line", "d");
    // innerRadius stays at its example, 0.45 mm: every outer radius from 1 mm up is computed.
    expect(d!.match(/[ML]/g)).toHaveLength(37);
    expect(await page.$$eval("#plot svg circle", (c) => c.length)).toBe(37);
    expect(await page.textContent("#plot svg .x-title")).toBe("outerRadius (mm)");
    expect(await page.textContent("#plot svg .y-title")).toBe("coaxialCapacitance (pF)");
    expect(await page.textContent("#sweep-status")).toMatch(/37 of 37 points computed/);
    // The sweep ran in the page's Web Worker (worker.ts), not on the page's thread.
    expect(page.workers().map((w) => w.url()).some((u) => /\/assets\/worker-[^/]*\.js$/.test(u))).toBe(true);
    mkdirSync(join(root, "test-output"), { recursive: true });
    await page.screenshot({ path: join(root, "test-output/page.png"), fullPage: true });
    await page.locator("#plot svg").screenshot({ path: join(root, "test-output/plot.png") });
    expect(existsSync(join(root, "test-output/page.png"))).toBe(true);
  });

  it("reports a sweep over a domain bound point by point, breaking the line where points are not computed", async () => {
    await open("coaxialCapacitance");
    // innerRadius 0.45 mm: outer radii up to 0.45 mm break innerRadius < outerRadius.
    await page.selectOption("#sweep-input", "outerRadius");
    await page.fill("#sweep-from", "0.1 mm");
    await page.fill("#sweep-to", "1 mm");
    await page.fill("#sweep-points", "10");
    await page.click("#sweep-run");
    await page.waitForFunction(() => /points computed/.test(document.getElementById("sweep-status")!.textContent ?? ""));
    expect(await page.textContent("#sweep-status")).toMatch(/6 of 10 points computed \(4 outside/);
    const d = await page.getAttribute("#plot svg path.line", "d");
    expect(d!.match(/[ML]/g)).toHaveLength(6);
  });

  it("ran without a script error", () => {
    expect(pageErrors).toEqual([]);
  });
});
