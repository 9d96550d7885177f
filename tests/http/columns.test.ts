// POST /columns: JSON columns or CSV text, the limits, and answers that
// match the OpenAPI document's schemas (checked with Ajv, JSON Schema 2020-12).
import { Ajv2020 } from "ajv/dist/2020.js";
import { describe, expect, it } from "vitest";
import { evaluate } from "../../src/core/evaluate.js";
import { createHandler, DEFAULT_LIMITS, openApiDocument, type HttpResponse } from "../../src/http/index.js";

const doc = openApiDocument();
const handle = createHandler();
const post = (body: unknown, h = handle): HttpResponse => h({ method: "POST", path: "/columns", body: typeof body === "string" ? body : JSON.stringify(body) });

const ajv = new Ajv2020({ strict: false, allErrors: true });
const paths = (doc as { paths: Record<string, { post: { requestBody: { content: { "application/json": { schema: unknown } } } } }> }).paths;
ajv.addSchema({ $id: "emquant-openapi", components: (doc as { components: unknown }).components, request: paths["/columns"]!.post.requestBody.content["application/json"].schema });
function errorsOf(pointer: string, value: unknown): string[] {
  const validate = ajv.getSchema(`emquant-openapi#${pointer}`)!;
  return validate(value) ? [] : (validate.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
}

describe("POST /columns", () => {
  it("evaluates JSON columns row by row, with null and a code for a bad row, as the document describes", () => {
    const request = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: ["0.1 mm", -1] } };
    expect(errorsOf("/request", request)).toEqual([]);
    const r = post(request);
    expect(r.status).toBe(200);
    expect(errorsOf("/components/schemas/ColumnsResult", r.body)).toEqual([]);
    const body = r.body as { output: { values: (number | null)[] }; errors: (string | null)[]; rowErrors: { code: string }[] };
    expect(body.output.values).toEqual([evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" }).value, null]);
    expect(body.errors).toEqual([null, "out_of_domain"]);
    expect(body.rowErrors[0]!.code).toBe("out_of_domain");
  });

  it("evaluates CSV text with the fixed inputs beside it, and answers CSV when asked", () => {
    const request = { formula: "parallelPlateCapacitance", csv: "gap (mm)\n0.1\n0.2\nthin\n", inputs: { area: "1 cm^2" }, format: "csv" };
    expect(errorsOf("/request", request)).toEqual([]);
    const r = post(request);
    expect(r.status).toBe(200);
    expect(errorsOf("/components/schemas/ColumnsCsvResult", r.body)).toEqual([]);
    const v = (gap: string): number => evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap }).value as number;
    expect((r.body as { csv: string }).csv).toBe(`parallelPlateCapacitance (F),error\n${v("0.1 mm")},\n${v("0.2 mm")},\n,unparsable\n`);
  });

  it("refuses more rows than the server's limit before computing, naming the column or the csv", () => {
    const small = createHandler({ maxColumnRows: 2 });
    const a = post({ formula: "parallelPlateCapacitance", inputs: { area: 1e-4, gap: [1e-4, 2e-4, 3e-4] } }, small);
    expect(a.status).toBe(422);
    expect(a.body).toMatchObject({ error: { code: "over_limit", input: "gap", limit: 2 } });
    const b = post({ formula: "parallelPlateCapacitance", csv: "area,gap\n1,1\n1,1\n1,1\n" }, small);
    expect(b.body).toMatchObject({ error: { code: "over_limit", input: "csv", limit: 2 } });
    expect((openApiDocument({ ...DEFAULT_LIMITS, maxColumnRows: 2 }) as { paths: Record<string, { post: { summary: string } }> }).paths["/columns"]!.post.summary).toContain("at most 2 rows");
  });

  it("answers whole-request problems with coded errors: columns of different lengths, unknown fields, a bad csv", () => {
    expect(post({ formula: "parallelPlateCapacitance", inputs: { area: [1, 2], gap: [1] } })).toMatchObject({ status: 422, body: { error: { code: "invalid_argument", input: "gap" } } });
    expect(post({ formula: "parallelPlateCapacitance", columns: {} })).toMatchObject({ status: 400, body: { error: { code: "bad_request" } } });
    expect(post({ formula: "parallelPlateCapacitance", csv: "gap\n1\n", inputs: "area" })).toMatchObject({ status: 422, body: { error: { code: "wrong_type", input: "inputs" } } });
    expect(post({ formula: "parallelPlateCapacitance", inputs: "area" })).toMatchObject({ status: 422, body: { error: { code: "wrong_type", input: "inputs" } } });
    expect(post({ formula: "parallelPlateCapacitance", csv: 5 })).toMatchObject({ status: 400, body: { error: { code: "bad_request" } } });
    expect(post({ formula: "parallelPlateCapacitance", csv: "area,gap\n" })).toMatchObject({ status: 422, body: { error: { code: "invalid_argument", input: "csv" } } });
    expect(post({ formula: "parallelPlateCapacitance", csv: "area,gap\n1,1\n", format: "xml" })).toMatchObject({ status: 400 });
    expect(post({ formula: "nope", inputs: { a: [1] } })).toMatchObject({ status: 422, body: { error: { code: "unknown_formula" } } });
    expect(handle({ method: "GET", path: "/columns" })).toMatchObject({ status: 405 });
  });
});
