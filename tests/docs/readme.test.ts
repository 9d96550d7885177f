import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { catalogMarkdown } from "../../scripts/catalog-markdown.js";

const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");

describe("the README", () => {
  it("carries the catalog generated from the current registry (run npm run catalog)", () => {
    expect(readme).toContain(catalogMarkdown());
  });

  it("shows the two set-up commands", () => {
    expect(readme).toContain("npm ci && npm run demo");
    expect(readme).toContain("npm ci && npm test");
  });
});

describe("the README's quick start", () => {
  it("states the coaxial example's capacitance (2 pi eps0 2.25 / ln(1.47/0.45) per metre, eps0 from CODATA 2022)", async () => {
    const { coaxialCapacitance, inUnit, quantity } = await import("../../src/index.js");
    const c = coaxialCapacitance({ innerRadius: quantity(0.45, "mm"), outerRadius: quantity(1.47, "mm"), length: quantity(1, "m"), relativePermittivity: 2.25 });
    expect(readme).toContain('inUnit(c, "pF"); // ≈ 105.7');
    expect(inUnit(c, "pF")).toBeCloseTo(105.7, 1);
  });
});
