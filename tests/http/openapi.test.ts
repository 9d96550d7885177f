import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { Validator } from "@seriousme/openapi-schema-validator";
import { Ajv2020 } from "ajv/dist/2020.js";
import { describe, expect, inject, it } from "vitest";
import { listFormulas } from "../../src/core/registry.js";
import { createHandler, DEFAULT_LIMITS, openApiDocument, type HttpResponse } from "../../src/http/index.js";

const doc = openApiDocument();
const handle = createHandler();

// The document's component schemas, compiled by Ajv as JSON Schema 2020-12 (the
// dialect of OpenAPI 3.1). strict off: OpenAPI keywords (discriminator) and the
// x- annotations are not JSON Schema vocabulary and are ignored.
const ajv = new Ajv2020({ strict: false, allErrors: true });
/** A route's request schema (inline in the path item). */
function requestSchema(path: string): unknown {
  return (doc as { paths: Record<string, { post: { requestBody: { content: { "application/json": { schema: unknown } } } } }> }).paths[path]!.post.requestBody.content["application/json"].schema;
}
// One schema resource, so the request schemas' "#/components/..." references resolve.
ajv.addSchema({
  $id: "emquant-openapi",
  components: (doc as { components: unknown }).components,
  requests: Object.fromEntries(["evaluate", "solve", "tolerance", "sweep"].map((r) => [r, requestSchema(`/${r}`)])),
});
function errorsOf(pointer: string, value: unknown): string[] {
  const validate = ajv.getSchema(`emquant-openapi#${pointer}`);
  if (!validate) throw new Error(`no schema at ${pointer}`);
  return validate(value) ? [] : (validate.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
}
const check = (schema: string, value: unknown): string[] => errorsOf(`/components/schemas/${schema}`, value);
const checkRequest = (path: string, body: unknown): string[] => errorsOf(`/requests${path}`, body);

const post = (path: string, body: unknown): HttpResponse => handle({ method: "POST", path, body });
const examples = (id: string): Record<string, unknown> => {
  const f = listFormulas().find((g) => g.id === id)!;
  const specs = f.definition.inputs as Record<string, { example?: unknown }>;
  return Object.fromEntries(Object.entries(specs).filter(([, s]) => s.example !== undefined).map(([n, s]) => [n, s.example]));
};

describe("the OpenAPI document", () => {
  it("is a valid OpenAPI 3.1 document (@seriousme/openapi-schema-validator)", async () => {
    const result = await new Validator().validate(structuredClone(doc));
    expect(result.errors).toBeUndefined();
    expect(result.valid).toBe(true);
    // The validator does reject a broken document: a response without its required description.
    const broken = structuredClone(doc) as { paths: Record<string, { get?: { responses: Record<string, { description?: string }> } }> };
    delete broken.paths["/openapi.json"]!.get!.responses["200"]!.description;
    expect((await new Validator().validate(broken)).valid).toBe(false);
  });

  it("describes every registry formula with the inputs schema the catalog gives", () => {
    const ids = listFormulas().map((f) => f.id);
    const schemas = (doc as { components: { schemas: Record<string, Record<string, unknown>> } }).components.schemas;
    for (const id of ids) {
      const served = handle({ method: "GET", path: `/formulas/${id}` }).body as { inputSchema: Record<string, unknown> };
      const { $schema: _d, $id: _i, ...inputs } = served.inputSchema;
      expect(schemas[`${id}.inputs`], id).toEqual(inputs);
    }
    const evaluate = requestSchema("/evaluate") as { oneOf: unknown[]; discriminator: { mapping: Record<string, string> } };
    expect(Object.keys(evaluate.discriminator.mapping)).toEqual(ids);
    expect(evaluate.oneOf).toHaveLength(ids.length);
  });

  it("accepts each formula's example inputs and describes the answer the handler gives", () => {
    for (const f of listFormulas()) {
      const body = { formula: f.id, inputs: examples(f.id) };
      expect(checkRequest("/evaluate", body), f.id).toEqual([]);
      const r = post("/evaluate", body);
      expect(r.status, f.id).toBe(200);
      expect(check("EvaluateResult", r.body), f.id).toEqual([]);
    }
  });

  it("rejects what the handler rejects: a wrong dimension's unit aside, unknown inputs, unknown formulas and over-limit requests", () => {
    expect(checkRequest("/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: 1e-4, gap: 1e-3, colour: 1 } })).not.toEqual([]);
    expect(checkRequest("/evaluate", { formula: "noSuchFormula", inputs: {} })).not.toEqual([]);
    expect(checkRequest("/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: -1, gap: 1e-3 } })).not.toEqual([]);
    const sweep = { formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-4, to: 1e-3, points: 10_001 } }, fixed: { area: 1e-4 } };
    expect(checkRequest("/sweep", sweep)).not.toEqual([]);
    expect(post("/sweep", sweep).status).toBe(422);
    const tol = { formula: "parallelPlateCapacitance", inputs: { area: 1e-4, gap: { nominal: 1e-3, percent: 5 } }, options: { samples: 20_001 } };
    expect(checkRequest("/tolerance", tol)).not.toEqual([]);
    expect(post("/tolerance", tol).status).toBe(422);
  });

  it("describes the solve, tolerance, sweep and error answers as given", () => {
    const solve = { formula: "parallelPlateCapacitance", solveFor: "gap", target: "100 pF", inputs: { area: "1 cm^2" }, options: { decades: 12 } };
    expect(checkRequest("/solve", solve)).toEqual([]);
    expect(check("SolveResult", post("/solve", solve).body)).toEqual([]);
    const tol = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "2 mm", percent: 5 } }, options: { samples: 200 } };
    expect(checkRequest("/tolerance", tol)).toEqual([]);
    expect(check("ToleranceResult", post("/tolerance", tol).body)).toEqual([]);
    const sweep = { formula: "parallelPlateCapacitance", vary: { relativePermittivity: { from: 0, to: 4, points: 5 } }, fixed: { area: "1 cm^2", gap: "1 mm" } };
    expect(checkRequest("/sweep", sweep)).toEqual([]);
    const swept = post("/sweep", sweep);
    expect((swept.body as { notComputed: number }).notComputed).toBe(1);
    expect(check("SweepResult", swept.body)).toEqual([]);
    for (const r of [post("/evaluate", "{"), post("/sweep", { ...sweep, vary: { gap: { from: 1, to: 2, points: 1e9 } } }), handle({ method: "GET", path: "/formulas/x" })]) {
      expect(r.status).toBeGreaterThanOrEqual(400);
      expect(check("Error", r.body)).toEqual([]);
    }
    const catalog = handle({ method: "GET", path: "/formulas" }).body as unknown[];
    for (const entry of catalog) expect(check("CatalogEntry", entry)).toEqual([]);
  });

  it("states the limits the handler enforces, and the handler serves it", () => {
    const tight = createHandler({ maxSweepPoints: 77, maxSamples: 500 });
    const served = tight({ method: "GET", path: "/openapi.json" }).body;
    expect(served).toEqual(openApiDocument({ ...DEFAULT_LIMITS, maxSweepPoints: 77, maxSamples: 500 }));
    // Walks the document by keys; the shapes are checked by the validator above.
    const at = (v: unknown, ...keys: string[]): unknown => keys.reduce((o, k) => (o as Record<string, unknown>)[k], v);
    const body = (route: string): unknown => at(served, "paths", route, "post", "requestBody", "content", "application/json", "schema", "properties");
    expect(at(body("/sweep"), "vary", "additionalProperties", "properties", "points", "maximum")).toBe(77);
    expect(at(body("/tolerance"), "options", "properties", "samples", "maximum")).toBe(500);
  });

  it("is written by npm run openapi", () => {
    const out = join(mkdtempSync(join(tmpdir(), "emquant-openapi-")), "openapi.json");
    const root = resolve(import.meta.dirname, "../..");
    // scripts/openapi.ts as this run bundled it (tests/global-setup.ts): the script npm runs through tsx, without tsx's start-up.
    execFileSync(process.execPath, [join(inject("testBuild"), "openapi.js"), out], { cwd: root, stdio: "pipe" });
    expect(JSON.parse(readFileSync(out, "utf8"))).toEqual(doc);
  });
});
