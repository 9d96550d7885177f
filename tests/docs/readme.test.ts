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
