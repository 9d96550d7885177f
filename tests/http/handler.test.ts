import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { listFormulas } from "../../src/core/registry.js";
import { createHandler, DEFAULT_LIMITS, HTTP_ERROR_CODES, resolveLimits, type HttpRequest, type HttpResponse } from "../../src/http/index.js";
import { ERROR_CODES } from "../../src/core/errors.js";

const handle = createHandler();
// CODATA 2022 vacuum electric permittivity, F/m.
const EPSILON_0 = 8.8541878188e-12;
const PLATES = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: "2 mm" } };

function post(path: string, body: unknown): HttpResponse {
  return handle({ method: "POST", path, body: typeof body === "string" ? body : JSON.stringify(body) });
}
const errorOf = (r: HttpResponse): Record<string, unknown> => (r.body as { error: Record<string, unknown> }).error;

describe("the framework-neutral handler", () => {
  it("answers a result with status 200, a JSON content type and its notes", () => {
    const r = post("/evaluate", PLATES);
    expect(r.status).toBe(200);
    expect(r.headers["content-type"]).toBe("application/json; charset=utf-8");
    const body = r.body as { value: number; unit: string; warnings: { code: string }[] };
    // C = epsilon_0 A / d (parallel plates, fringing neglected) with CODATA 2022 epsilon_0.
    expect(body.value).toBeCloseTo((EPSILON_0 * 1e-4) / 2e-3, 25);
    expect(body.unit).toBe("F");
    expect(body.warnings.map((w) => w.code)).toEqual(["fringing"]);
  });

  it("takes the body as text, as UTF-8 bytes, or as a value a framework has parsed", () => {
    const text = JSON.stringify(PLATES);
    const fromText = post("/evaluate", text);
    const fromBytes = handle({ method: "POST", path: "/evaluate", body: new TextEncoder().encode(text) });
    const fromParsed = handle({ method: "POST", path: "/evaluate", body: PLATES });
    expect(fromBytes).toEqual(fromText);
    expect(fromParsed).toEqual(fromText);
  });

  it("serves the catalog, one formula with its input schema, and the OpenAPI document", () => {
    const all = handle({ method: "GET", path: "/formulas" });
    expect((all.body as { id: string }[]).map((e) => e.id)).toEqual(listFormulas().map((f) => f.id));
    const inductance = handle({ method: "GET", path: "/formulas?category=inductance" });
    const expected = listFormulas().filter((f) => f.definition.category === "inductance").map((f) => f.id);
    expect((inductance.body as { id: string }[]).map((e) => e.id)).toEqual(expected);
    // The same from a framework's decoded query object and from URLSearchParams.
    expect(handle({ method: "GET", path: "/formulas", query: { category: "inductance" } }).body).toEqual(inductance.body);
    expect(handle({ method: "GET", path: "/formulas", query: new URLSearchParams("category=inductance") }).body).toEqual(inductance.body);
    // A null-prototype object (as some frameworks build) and a repeated parameter (an array: the first counts).
    const bare = Object.assign(Object.create(null) as Record<string, string>, { category: "inductance" });
    expect(handle({ method: "GET", path: "/formulas", query: bare }).body).toEqual(inductance.body);
    expect(handle({ method: "GET", path: "/formulas", query: { category: ["inductance", "flux"] } }).body).toEqual(inductance.body);
    // A percent-escaped space in the query: "magnetic circuit".
    const circuit = handle({ method: "GET", path: "/formulas?category=magnetic%20circuit" });
    expect((circuit.body as unknown[]).length).toBe(listFormulas().filter((f) => f.definition.category === "magnetic circuit").length);
    const one = handle({ method: "GET", path: "/formulas/parallelPlateCapacitance/" });
    expect(one.status).toBe(200);
    expect((one.body as { inputSchema: { required: string[] } }).inputSchema.required).toEqual(["area", "gap"]);
    const doc = handle({ method: "GET", path: "/openapi.json" });
    expect((doc.body as { openapi: string }).openapi).toBe("3.1.0");
  });

  it("answers 404 for an unknown route or a formula id in the path that does not exist", () => {
    const route = handle({ method: "GET", path: "/nowhere" });
    expect(route.status).toBe(404);
    expect(errorOf(route).code).toBe("not_found");
    const formula = handle({ method: "GET", path: "/formulas/noSuchFormula" });
    expect(formula.status).toBe(404);
    expect(errorOf(formula).code).toBe("unknown_formula");
    expect(handle({ method: "GET", path: "formulas" }).status).toBe(404);
  });

  it("answers 422 unknown_formula when the unknown id is in a request body", () => {
    const r = post("/evaluate", { formula: "noSuchFormula", inputs: {} });
    expect(r.status).toBe(422);
    expect(errorOf(r).code).toBe("unknown_formula");
  });

  it("answers 400 for a malformed percent-escape in the path or the query", () => {
    for (const path of ["/formulas/%E0%A4%A", "/formulas/%ZZ", "/formulas/%", "/formulas?category=%E0%A4%A", "/formulas?%ZZ=1"]) {
      const r = handle({ method: "GET", path });
      expect(r.status, path).toBe(400);
      expect(errorOf(r).code, path).toBe("bad_escape");
    }
  });

  it("answers 400 for a body that is not JSON, not a JSON object or not UTF-8", () => {
    expect(errorOf(post("/evaluate", "{ not json"))).toMatchObject({ code: "bad_json", input: null });
    expect(post("/evaluate", "").status).toBe(400);
    expect(handle({ method: "POST", path: "/evaluate" }).status).toBe(400);
    expect(errorOf(post("/evaluate", "[1, 2]")).code).toBe("bad_request");
    expect(errorOf(handle({ method: "POST", path: "/evaluate", body: [1, 2] })).code).toBe("bad_request");
    // 0xC3 0x28: an invalid two-byte UTF-8 sequence (Unicode 15.0, table 3-7 well-formed sequences).
    expect(errorOf(handle({ method: "POST", path: "/evaluate", body: new Uint8Array([0x7b, 0xc3, 0x28, 0x7d]) })).code).toBe("bad_request");
    expect(errorOf(handle(null as unknown as HttpRequest)).code).toBe("bad_request");
  });

  it("answers 405 with an allow header for a wrong method", () => {
    const get = handle({ method: "GET", path: "/evaluate" });
    expect(get.status).toBe(405);
    expect(get.headers.allow).toBe("POST");
    const del = handle({ method: "DELETE", path: "/formulas" });
    expect(del.status).toBe(405);
    expect(del.headers.allow).toBe("GET");
    expect(errorOf(del).code).toBe("method_not_allowed");
    expect(handle({ method: "post", path: "/evaluate", body: "{}" }).status).toBe(405);
  });

  it("answers 422 with the library's code and the input's name for bad input", () => {
    const r = post("/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: "1 kg", gap: "1 mm" } });
    expect(r.status).toBe(422);
    expect(errorOf(r)).toMatchObject({ code: "wrong_dimension", input: "area", formula: "parallelPlateCapacitance", expected: "Area", received: "Mass" });
    const none = post("/solve", { formula: "parallelPlateCapacitance", solveFor: "relativePermittivity", target: "1 pF", inputs: { area: "1 cm^2", gap: "0.1 mm" } });
    expect(none.status).toBe(422);
    expect(errorOf(none).code).toBe("no_solution");
  });

  it("answers 413 for a body over the size limit, counted in UTF-8 bytes", () => {
    const small = createHandler({ maxBodyBytes: 100 });
    const pad = (s: string): string => JSON.stringify({ ...PLATES, pad: s });
    const base = pad("").length;
    // 'µ' is two bytes in UTF-8: a string of fewer characters than the limit can be over it.
    const chars = Math.ceil((101 - base) / 2);
    const over = small({ method: "POST", path: "/evaluate", body: pad("\u00b5".repeat(chars)) });
    expect(pad("\u00b5".repeat(chars)).length).toBeLessThanOrEqual(100);
    expect(over.status).toBe(413);
    expect(errorOf(over).code).toBe("body_too_large");
    expect(small({ method: "POST", path: "/evaluate", body: pad("x".repeat(100 - base)) }).status).toBe(200);
    expect(small({ method: "POST", path: "/evaluate", body: new Uint8Array(101) }).status).toBe(413);
  });

  it("refuses work over each limit with 422 over_limit naming the field, before computing", () => {
    const tight = createHandler({ maxSamples: 50, maxCornerInputs: 2, maxSweepPoints: 20, maxSolveDecades: 5, maxSolveSamplesPerDecade: 4 });
    const send = (path: string, body: unknown): HttpResponse => tight({ method: "POST", path, body });
    const tol = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "1 mm", percent: 5 } } };
    expect(errorOf(send("/tolerance", { ...tol, options: { samples: 51 } }))).toMatchObject({ code: "over_limit", input: "samples", limit: 50 });
    expect(errorOf(send("/tolerance", { ...tol, options: { maxCornerInputs: 3 } }))).toMatchObject({ code: "over_limit", input: "maxCornerInputs" });
    // Unset, the sample count is the library default lowered to the limit.
    const within = send("/tolerance", tol);
    expect(within.status).toBe(200);
    expect((within.body as { monteCarlo: { samples: number } }).monteCarlo.samples).toBe(50);
    const sweep = { formula: "parallelPlateCapacitance", fixed: { gap: "1 mm" } };
    expect(send("/sweep", { ...sweep, vary: { area: { from: "1 cm^2", to: "2 cm^2", points: 20 } } }).status).toBe(200);
    expect(errorOf(send("/sweep", { ...sweep, vary: { area: { from: "1 cm^2", to: "2 cm^2", points: 21 } } }))).toMatchObject({ code: "over_limit", input: "points" });
    const grid = { formula: "parallelPlateCapacitance", vary: { area: { from: 1e-4, to: 2e-4, points: 5 }, gap: { from: 1e-3, to: 2e-3, points: 5 } } };
    expect(errorOf(send("/sweep", grid))).toMatchObject({ code: "over_limit", input: "points" });
    const solve = { formula: "parallelPlateCapacitance", solveFor: "gap", target: "100 pF", inputs: { area: "1 cm^2" } };
    expect(errorOf(send("/solve", { ...solve, options: { decades: 6 } }))).toMatchObject({ code: "over_limit", input: "decades", limit: 5 });
    expect(errorOf(send("/solve", { ...solve, options: { samplesPerDecade: 5 } }))).toMatchObject({ code: "over_limit", input: "samplesPerDecade" });
    expect(send("/solve", { ...solve, options: { decades: 5, samplesPerDecade: 4 } }).status).toBe(200);
    // Not a number: left to the library, which names the option.
    expect(errorOf(send("/solve", { ...solve, options: { decades: "many" } }))).toMatchObject({ code: "invalid_argument", input: "decades" });
  });

  it("returns a sweep's vector components with null where a point was not computed", () => {
    type Spec = { dimension?: string; vector?: boolean; example?: unknown };
    const specs = (f: (typeof all)[number]): [string, Spec][] => Object.entries(f.definition.inputs as Record<string, Spec>);
    const all = listFormulas();
    // A formula with a vector output and a scalar quantity input to sweep.
    const f = all.find((g) => g.definition.output.components && specs(g).some(([, s]) => s.dimension && !s.vector && typeof s.example === "number"))!;
    expect(f).toBeDefined();
    const [name, spec] = specs(f).find(([, s]) => s.dimension && !s.vector && typeof s.example === "number")!;
    const example = spec.example as number;
    const fixed = Object.fromEntries(specs(f).filter(([n, s]) => n !== name && s.example !== undefined).map(([n, s]) => [n, s.example]));
    const r = post("/sweep", { formula: f.id, vary: { [name]: { from: example, to: 2 * example, points: 3 } }, fixed });
    expect(r.status).toBe(200);
    const out = (r.body as { output: { components: Record<string, unknown[]> } }).output;
    expect(Object.keys(out.components)).toEqual([...f.definition.output.components!]);
    for (const values of Object.values(out.components)) expect(values).toHaveLength(3);
  });

  it("checks its limits when created", () => {
    expect(resolveLimits()).toEqual(DEFAULT_LIMITS);
    expect(() => createHandler({ maxSamples: -1 })).toThrow(RangeError);
    expect(() => createHandler({ maxSweepPoints: 1.5 })).toThrow(RangeError);
    expect(() => createHandler({ maxSolveDecades: 301 })).toThrow(RangeError);
    expect(() => createHandler({ maxBody: 10 } as never)).toThrow(/unknown limit/);
  });

  it("never answers 500 for random methods, paths and bodies, and every error is coded", () => {
    const codes = new Set<string>([...ERROR_CODES, ...HTTP_ERROR_CODES.filter((c) => c !== "internal")]);
    const segment = fc.oneof(
      fc.constantFrom("formulas", "evaluate", "solve", "tolerance", "sweep", "openapi.json", "parallelPlateCapacitance", "%", "%E0%A4%A", "%2F", "..", ""),
      fc.string({ maxLength: 12 }),
    );
    const path = fc.tuple(fc.array(segment, { maxLength: 4 }), fc.option(fc.string({ maxLength: 16 }))).map(([parts, query]) => `/${parts.join("/")}${query === null ? "" : `?${query}`}`);
    const body = fc.oneof(
      fc.string({ maxLength: 40 }),
      fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)),
      fc.record({ formula: fc.constantFrom("parallelPlateCapacitance", "coaxialCapacitance", "x"), inputs: fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 1 })) }).map((v) => JSON.stringify(v)),
      fc.constant(undefined),
    );
    const method = fc.constantFrom("GET", "POST", "PUT", "DELETE", "", "get");
    fc.assert(
      fc.property(method, path, body, (m, p, b) => {
        const r = handle({ method: m, path: p, body: b });
        expect(r.status, `${m} ${p} ${b}`).toBeLessThan(500);
        if (r.status >= 400) expect(codes.has(errorOf(r).code as string), `${m} ${p} ${b}`).toBe(true);
        // The body survives JSON: no NaN or Infinity turned into null on the way out.
        expect(JSON.parse(JSON.stringify(r.body))).toEqual(r.body);
      }),
      { numRuns: 1500, seed: 12 },
    );
  });
});
