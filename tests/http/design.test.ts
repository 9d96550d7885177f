import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { evaluateDesign } from "../../src/designs/index.js";
import { createHandler } from "../../src/http/index.js";

// POST /design: the same result as the library, reports on request, limits and coded errors.
const handle = createHandler({ maxSamples: 2000 });
const probe = JSON.parse(readFileSync(new URL("../../examples/designs/level-sensor.json", import.meta.url), "utf8"));
const post = (body: unknown) => handle({ method: "POST", path: "/design", body: JSON.stringify(body) });

describe("POST /design", () => {
  it("answers the design evaluated as the library evaluates it", () => {
    const a = post({ design: probe });
    expect(a.status).toBe(200);
    expect(JSON.parse(JSON.stringify((a.body as { design: unknown }).design))).toEqual(JSON.parse(JSON.stringify(evaluateDesign(probe))));
  });

  it("adds tolerance through the chain and a Markdown or HTML report when asked", () => {
    const a = post({ design: probe, tolerance: { samples: 500, seed: 3 }, report: "markdown" });
    const body = a.body as { tolerance: { samples: number; checks: unknown[] }; report: string };
    expect(body.tolerance.samples).toBe(500);
    expect(body.tolerance.checks).toHaveLength(3);
    expect(body.report).toContain("## Tolerance");
    expect((post({ design: probe, report: "html" }).body as { report: string }).report.startsWith("<!DOCTYPE html>")).toBe(true);
  });

  it("refuses samples over the limit (422 over_limit), unknown fields and report kinds (400), bad designs with their code (422)", () => {
    const over = post({ design: probe, tolerance: { samples: 5000 } });
    expect([over.status, (over.body as { error: { code: string } }).error.code]).toEqual([422, "over_limit"]);
    expect(post({ design: probe, extra: 1 }).status).toBe(400);
    expect(post({ design: probe, report: "pdf" }).status).toBe(400);
    const bad = post({ design: { ...probe, checks: ["span > 1 m"] } });
    expect([bad.status, (bad.body as { error: { code: string } }).error.code]).toEqual([422, "wrong_dimension"]);
    const cycle = post({ design: { inputs: { a: "1 m" }, derived: { x: "y", y: "x" } } });
    expect([cycle.status, (cycle.body as { error: { code: string } }).error.code]).toEqual([422, "invalid_argument"]);
    expect(post({ design: "nonsense" }).status).toBe(422);
  });
});
