import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { createHandler, DEFAULT_LIMITS, openApiDocument, type HttpRequest, type HttpResponse } from "../../src/http/index.js";

const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
const section = readme.slice(readme.indexOf("## In a backend"), readme.indexOf("## On the command line"));
const handle = createHandler();

/** Rows of the markdown table whose header row starts with `first`. */
function table(first: string): string[][] {
  const lines = section.split("\n");
  const start = lines.findIndex((l) => l.startsWith(`| ${first} |`));
  const rows: string[][] = [];
  for (let i = start + 2; i < lines.length && lines[i]!.startsWith("|"); i++) rows.push(lines[i]!.split("|").slice(1, -1).map((c) => c.trim()));
  return rows;
}

const PLATES = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: "2 mm" } };
/** A request that gives each documented error code. */
const CAUSES: Record<string, HttpRequest> = {
  bad_json: { method: "POST", path: "/evaluate", body: "{ not json" },
  bad_request: { method: "POST", path: "/evaluate", body: "[1, 2]" },
  bad_escape: { method: "GET", path: "/formulas/%E0%A4%A" },
  not_found: { method: "GET", path: "/nowhere" },
  unknown_formula: { method: "GET", path: "/formulas/noSuchFormula" },
  method_not_allowed: { method: "GET", path: "/evaluate" },
  body_too_large: { method: "POST", path: "/evaluate", body: JSON.stringify({ ...PLATES, pad: "x".repeat(70_000) }) },
  over_limit: { method: "POST", path: "/sweep", body: { formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-3, to: 2e-3, points: 10_001 } }, fixed: { area: 1e-4 } } },
};

describe("README \"In a backend\"", () => {
  it("lists every status and error code as the handler gives them", () => {
    const rows = table("Status");
    expect(rows.length).toBeGreaterThan(8);
    for (const [status, code] of rows) {
      const literal = code!.match(/^`(\w+)`$/)?.[1];
      const request = literal ? CAUSES[literal] : { method: "POST", path: "/evaluate", body: { formula: "parallelPlateCapacitance", inputs: { area: "1 kg", gap: "1 mm" } } };
      expect(request, `a request for ${code}`).toBeDefined();
      const r = handle(request!);
      expect(String(r.status), code).toBe(status);
      expect((r.body as { error: { code: string } }).error.code).toBe(literal ?? "wrong_dimension");
    }
  });

  it("states the default limits", () => {
    const rows = table("Limit");
    expect(Object.fromEntries(rows.map(([name, value]) => [name!.replace(/`/g, ""), Number(value)]))).toEqual({ ...DEFAULT_LIMITS });
  });

  it("lists the routes the OpenAPI document describes", () => {
    const routes = table("Route").map(([r]) => r!.match(/`(?:GET|POST) (\/[^` ]*)/)![1]!);
    const slashed = table("Route").flatMap(([r]) => [...r!.matchAll(/`(\/\w+)`/g)].map((m) => m[1]!));
    expect(new Set([...routes, ...slashed])).toEqual(new Set(Object.keys((openApiDocument() as { paths: object }).paths)));
  });

  it("shows the answer the example call gives", () => {
    expect(section).toContain('answer.body { id, value: 4.427e-13, unit: "F", warnings: [{ code: "fringing", ... }], cautions: [] }');
    const answer: HttpResponse = handle({ method: "POST", path: "/evaluate", body: PLATES });
    expect(answer.status).toBe(200);
    const body = answer.body as { value: number; unit: string; warnings: { code: string }[]; cautions: unknown[] };
    // epsilon_0 A / d with CODATA 2022 epsilon_0 = 8.8541878188e-12 F/m: 4.4270939094e-13 F.
    expect(body.value).toBeCloseTo(4.427e-13, 16);
    expect(body.unit).toBe("F");
    expect(body.warnings.map((w) => w.code)).toEqual(["fringing"]);
    expect(body.cautions).toEqual([]);
  });
});
