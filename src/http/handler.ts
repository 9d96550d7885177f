/**
 * The framework-neutral request handler: a plain function from a request
 * (method, path, query, body) to a response (status, headers, JSON body). It
 * reads no socket and imports nothing from Node, so any server, a serverless
 * function or a test can call it; `createRequestListener` (node.ts) adapts it
 * to node:http.
 *
 * Status codes (each tested in tests/http/handler.test.ts):
 * - 200 a result (with its warnings and cautions, or its note summaries)
 * - 400 `bad_json` the body is not JSON; `bad_request` the body is not a JSON
 *   object or not UTF-8; `bad_escape` a malformed percent-escape in the path or query
 * - 404 `not_found` no such route; `unknown_formula` no such formula in the path
 * - 405 `method_not_allowed` (with an `allow` header)
 * - 413 `body_too_large` the body is over `maxBodyBytes`
 * - 422 a FormulaError from the library (its code: `wrong_dimension`,
 *   `unknown_formula` named in a body, `no_solution`, ...) or `over_limit`
 *   (a request asking for more work than the handler's limits allow)
 * User input never gives 500; 500 `internal` means a bug in the library.
 *
 * With a job store (`createHandler({ jobs })`, see jobs.ts), also:
 * - 202 a job submitted (POST /jobs), its URL in `location`
 * - 404 `unknown_job`; 410 `job_gone` a job no longer kept
 * - 409 `job_not_done` or `job_cancelled` when fetching a result there is not
 * - 422 `result_too_large` a job's result over the size limit
 * - 503 `too_many_jobs`, or `shutting_down` once the store is closed
 */
import { designReportHtml, designReportMarkdown } from "../designs/report.js";
import type { DesignSpec } from "../designs/spec.js";
import { type DesignToleranceResult, designTolerance, evaluateDesign } from "../designs/tools.js";
import { evaluate } from "../core/evaluate.js";
import { FormulaError } from "../core/errors.js";
import { catalogEntry, formulaCatalog, inputSchema } from "../tools/catalog.js";
import { solveRequest } from "../tools/solve.js";
import { sweepRequest } from "../tools/sweep.js";
import { columnsToJson, evaluateColumns } from "../tools/columns.js";
import { columnsToCsv, evaluateCsv, readCsvTable } from "../tools/columns-csv.js";
import { toleranceRequest } from "../tools/tolerance.js";
import { jobRoutes, type JobRoutes, type JobStore } from "./jobs.js";
import { resolveLimits, type HandlerLimits } from "./limits.js";
import { openApiDocument } from "./openapi.js";
import { formulaErrorBody, HttpError, httpErrorBody, isObject, overLimit } from "./refusal.js";
import { checkSweep, checkTolerance, sweepAnswer } from "./requests.js";

/** What the handler needs of a request. */
export interface HttpRequest {
  /** The HTTP method, e.g. "GET" or "POST" (compared as given: methods are case-sensitive). */
  readonly method: string;
  /**
   * The request target as received, percent-escapes intact ("/formulas/coaxialCapacitance"); it may
   * carry a query string, which is read when `query` is absent.
   */
  readonly path: string;
  /**
   * The query when a framework has already decoded it (a URLSearchParams, or an object of strings);
   * otherwise it is read from `path`. Typed by shape so the declarations need no DOM or Node types.
   */
  readonly query?: QueryParams | Readonly<Record<string, string | readonly string[] | undefined>>;
  /**
   * The body: its raw text (a string, or UTF-8 bytes such as a Buffer), or a value a framework has
   * already parsed from JSON. Absent or empty for GET.
   */
  readonly body?: unknown;
}

/** What the handler uses of a URLSearchParams. */
export interface QueryParams {
  get(name: string): string | null;
}

/** A JSON value as the handler returns it. */
export type JsonValue = null | boolean | number | string | readonly JsonValue[] | { readonly [key: string]: JsonValue };

/** What the handler answers: send `body` as JSON (`JSON.stringify`) with the status and headers. */
export interface HttpResponse {
  readonly status: number;
  /** Lower-case header names: always `content-type`, plus `allow` on 405 and `location` on 202 (a job submitted). */
  readonly headers: Readonly<Record<string, string>>;
  readonly body: JsonValue;
}


const JSON_TYPE = "application/json; charset=utf-8";

function ok(body: unknown): HttpResponse {
  return { status: 200, headers: { "content-type": JSON_TYPE }, body: body as JsonValue };
}

/** The error body every 4xx and 5xx carries: `{ error: { code, message, input, ... } }`. */
function errorResponse(status: number, error: Record<string, unknown>, headers: Record<string, string> = {}): HttpResponse {
  return { status, headers: { "content-type": JSON_TYPE, ...headers }, body: { error } as JsonValue };
}

function fromFormulaError(e: FormulaError, status: number): HttpResponse {
  return errorResponse(status, formulaErrorBody(e));
}

const GET_ROUTES = new Set(["/formulas", "/openapi.json"]);
const POST_ROUTES = new Set(["/evaluate", "/solve", "/tolerance", "/sweep", "/columns", "/design"]);

function decode(text: string, what: string): string {
  try {
    return decodeURIComponent(text);
  } catch {
    // A malformed escape ("%E0%A4%A", "%ZZ") is the client's mistake, not the server's.
    throw new HttpError(400, "bad_escape", `the ${what} has a malformed percent-escape`);
  }
}

/** The first value of a query parameter, from a query string or a framework's decoded query. */
function queryValue(request: HttpRequest, search: string, name: string): string | undefined {
  const q = request.query;
  if (q !== undefined) {
    // A URLSearchParams (or anything with its get); else a plain or null-prototype object.
    if (typeof q.get === "function") return (q as QueryParams).get(name) ?? undefined;
    const v = Object.hasOwn(q, name) ? (q as Readonly<Record<string, unknown>>)[name] : undefined;
    const first = typeof v === "string" ? v : Array.isArray(v) ? v[0] : undefined;
    return typeof first === "string" ? first : undefined;
  }
  // Decoded here, strictly: URLSearchParams would pass a malformed escape through as text.
  for (const pair of search.split("&")) {
    const eq = pair.indexOf("=");
    const key = decode((eq < 0 ? pair : pair.slice(0, eq)).replace(/\+/g, " "), "query");
    if (key === name) return decode((eq < 0 ? "" : pair.slice(eq + 1)).replace(/\+/g, " "), "query");
  }
  return undefined;
}

/** The body as a JSON value: raw text or bytes are parsed (within the size limit); a parsed value is taken as is. */
function readBody(body: unknown, limits: HandlerLimits): Record<string, unknown> {
  let value = body;
  if (typeof body === "string" || body instanceof Uint8Array) {
    let text: string;
    if (typeof body === "string") {
      // At most 3 UTF-8 bytes per UTF-16 unit: encode to count exactly only when that bound is over the limit.
      if (body.length * 3 > limits.maxBodyBytes && new TextEncoder().encode(body).length > limits.maxBodyBytes) throw tooLarge(limits);
      text = body;
    } else {
      if (body.byteLength > limits.maxBodyBytes) throw tooLarge(limits);
      try {
        text = new TextDecoder("utf-8", { fatal: true }).decode(body);
      } catch {
        throw new HttpError(400, "bad_request", "the request body is not UTF-8 text");
      }
    }
    try {
      value = JSON.parse(text);
    } catch {
      // Also a nesting too deep for the parser's stack: still unreadable JSON.
      throw new HttpError(400, "bad_json", "the request body is not valid JSON");
    }
  }
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw new HttpError(400, "bad_request", "the request body must be a JSON object");
  }
  return value as Record<string, unknown>;
}

function tooLarge(limits: HandlerLimits): HttpError {
  return new HttpError(413, "body_too_large", `the request body is over ${limits.maxBodyBytes} bytes`);
}

/**
 * Refuse work over the limits before computing. Only numbers are compared
 * here; a value of the wrong type or shape is left to the library, whose
 * checks name it with a FormulaError code.
 */
function checkSolve(body: Record<string, unknown>, limits: HandlerLimits): void {
  const o = body.options;
  if (!isObject(o)) return;
  if (typeof o.decades === "number" && !(o.decades <= limits.maxSolveDecades)) throw overLimit("decades", limits.maxSolveDecades, "decades");
  if (typeof o.samplesPerDecade === "number" && !(o.samplesPerDecade <= limits.maxSolveSamplesPerDecade)) {
    throw overLimit("samplesPerDecade", limits.maxSolveSamplesPerDecade, "samples per decade");
  }
}

/**
 * A formula over columns: `inputs` holds the columns (arrays, one value per
 * row) and the inputs fixed for every row; or `csv` holds the table as CSV
 * text and `inputs` only the fixed inputs. Rows over the limit are refused
 * before computing; `format: "csv"` answers the result table as CSV text.
 */
function columnsAnswer(body: Record<string, unknown>, limits: HandlerLimits): unknown {
  for (const key of Object.keys(body)) {
    if (key !== "formula" && key !== "inputs" && key !== "csv" && key !== "format") {
      throw new HttpError(400, "bad_request", `unknown field "${key}"; a columns request has formula, inputs, csv and format`);
    }
  }
  const format = body.format ?? "json";
  if (format !== "json" && format !== "csv") throw new HttpError(400, "bad_request", 'format is "json" or "csv"');
  const inputs = body.inputs ?? {};
  let result;
  if (body.csv !== undefined) {
    if (typeof body.csv !== "string") throw new HttpError(400, "bad_request", "csv is the table as CSV text");
    // The body limit bounds the text; the rows are counted before any computing.
    const table = readCsvTable(body.csv);
    if (table.rows > limits.maxColumnRows) throw overLimit("csv", limits.maxColumnRows, "rows");
    result = evaluateCsv(body.formula as string, table, inputs as Record<string, unknown>);
  } else {
    if (isObject(inputs)) {
      for (const [name, v] of Object.entries(inputs)) {
        const n = Array.isArray(v) ? v.length : isObject(v) && Array.isArray(v.values) ? v.values.length : 0;
        if (n > limits.maxColumnRows) throw overLimit(name, limits.maxColumnRows, "rows");
      }
    }
    result = evaluateColumns(body.formula as string, inputs as Record<string, unknown>);
  }
  if (format === "csv") return { csv: columnsToCsv(result), failed: result.failed, rowErrors: result.rowErrors, notes: result.notes };
  return columnsToJson(result);
}

/** A design evaluated, with tolerance through the chain and the report when asked; samples within the limit. */
function designAnswer(body: Record<string, unknown>, limits: HandlerLimits): unknown {
  for (const key of Object.keys(body)) {
    if (key !== "design" && key !== "tolerance" && key !== "report") throw new HttpError(400, "bad_request", `unknown field "${key}"; a design request has design, tolerance and report`);
  }
  const result = evaluateDesign(body.design as DesignSpec);
  let tolerance: DesignToleranceResult | undefined;
  if (body.tolerance !== undefined) {
    if (!isObject(body.tolerance)) throw new HttpError(400, "bad_request", "tolerance is an object { samples, seed }");
    const o = body.tolerance;
    const samples = o.samples === undefined ? Math.min(10_000, limits.maxSamples) : o.samples;
    if (typeof samples === "number" && samples > limits.maxSamples) throw overLimit("samples", limits.maxSamples, "Monte Carlo samples");
    tolerance = designTolerance(body.design as DesignSpec, { ...o, samples, maxCornerInputs: Math.min(10, limits.maxCornerInputs) } as never);
  }
  const report = body.report;
  if (report !== undefined && report !== "markdown" && report !== "html") throw new HttpError(400, "bad_request", 'report is "markdown" or "html"');
  const options = tolerance ? { tolerance } : {};
  return {
    design: result,
    ...(tolerance ? { tolerance } : {}),
    ...(report === "markdown" ? { report: designReportMarkdown(result, options) } : report === "html" ? { report: designReportHtml(result, options) } : {}),
  };
}

/**
 * The job routes: POST /jobs submits (202, with the job's URL in `location`),
 * GET /jobs/{id} polls, GET /jobs/{id}/result fetches, DELETE /jobs/{id}
 * cancels (or forgets a finished job).
 */
function jobRoute(request: HttpRequest, rawPath: string, jobs: JobRoutes, limits: HandlerLimits): HttpResponse {
  const method = request.method;
  if (rawPath === "/jobs") {
    if (method !== "POST") throw HttpError.method(method, "POST");
    const status = jobs.submit(readBody(request.body, limits));
    return { status: 202, headers: { "content-type": JSON_TYPE, location: status.url }, body: status as unknown as JsonValue };
  }
  const rest = rawPath.slice("/jobs/".length);
  const slash = rest.indexOf("/");
  const id = decode(slash < 0 ? rest : rest.slice(0, slash), "job id in the path");
  if (slash >= 0) {
    if (rest.slice(slash) !== "/result") throw new HttpError(404, "not_found", "no such route; a job has /jobs/{id} and /jobs/{id}/result");
    if (method !== "GET") throw HttpError.method(method, "GET");
    const answer = jobs.result(id);
    return { status: answer.status, headers: { "content-type": JSON_TYPE }, body: answer.body as JsonValue };
  }
  if (method === "GET") return ok(jobs.status(id));
  if (method === "DELETE") return ok(jobs.cancel(id));
  throw HttpError.method(method, "GET, DELETE");
}

function route(request: HttpRequest, limits: HandlerLimits, document: () => unknown, jobs: JobRoutes | undefined): HttpResponse {
  const method = request.method;
  const target = request.path;
  const q = target.indexOf("?");
  const rawPath = (q < 0 ? target : target.slice(0, q)).replace(/\/+$/, "") || "/";
  const search = q < 0 ? "" : target.slice(q + 1).split("#")[0]!;
  if (!rawPath.startsWith("/")) throw new HttpError(404, "not_found", "the path must start with /");

  if (jobs !== undefined && (rawPath === "/jobs" || rawPath.startsWith("/jobs/"))) return jobRoute(request, rawPath, jobs, limits);
  const isFormula = rawPath.startsWith("/formulas/");
  if (GET_ROUTES.has(rawPath) || isFormula) {
    if (method !== "GET") throw HttpError.method(method, "GET");
    if (rawPath === "/openapi.json") return ok(document());
    if (rawPath === "/formulas") return ok(formulaCatalog(queryValue(request, search, "category")));
    const id = decode(rawPath.slice("/formulas/".length), "formula id in the path");
    try {
      return ok({ ...catalogEntry(id), inputSchema: inputSchema(id) });
    } catch (e) {
      // An unknown id in the path names a resource that does not exist: 404, not 422.
      if (e instanceof FormulaError && e.code === "unknown_formula") return fromFormulaError(e, 404);
      throw e;
    }
  }
  if (!POST_ROUTES.has(rawPath)) throw new HttpError(404, "not_found", "no such route; see GET /openapi.json");
  if (method !== "POST") throw HttpError.method(method, "POST");
  const body = readBody(request.body, limits);
  switch (rawPath) {
    case "/evaluate":
      return ok(evaluate(body.formula as string, (body.inputs ?? {}) as Record<string, unknown>));
    case "/solve":
      checkSolve(body, limits);
      return ok(solveRequest(body as never));
    case "/tolerance": {
      const options = checkTolerance(body, limits);
      return ok(toleranceRequest({ formula: body.formula as string, inputs: body.inputs as Record<string, unknown>, options: options as never }));
    }
    case "/design":
      return ok(designAnswer(body, limits));
    case "/columns":
      return ok(columnsAnswer(body, limits));
    default:
      checkSweep(body, limits);
      return ok(sweepAnswer(sweepRequest(body as never)));
  }
}

/** Options of `createHandler` and `createRequestListener`: the limits (see HandlerLimits for the defaults), and a job store. */
export interface HandlerOptions extends Partial<HandlerLimits> {
  /**
   * A store made by `createJobStore`: adds the routes POST /jobs, GET and DELETE
   * /jobs/{id}, GET /jobs/{id}/result. The caller owns it and closes it.
   */
  readonly jobs?: JobStore;
}

/** The limits and the job store of the options, each checked (a bad limit or a store not made by createJobStore: RangeError). */
export function readHandlerOptions(options: HandlerOptions): { limits: HandlerLimits; jobs: JobRoutes | undefined; store: JobStore | undefined } {
  const { jobs: store, ...rest } = options ?? {};
  const limits = resolveLimits(rest);
  const jobs = store === undefined ? undefined : jobRoutes(store);
  if (store !== undefined && jobs === undefined) throw new RangeError("emquant/http: jobs must be a store made by createJobStore");
  return { limits, jobs, store };
}

/**
 * The handler: a function from a request to a response, with the limits
 * checked once here (a bad limit throws a RangeError at once).
 *
 * Routes: `GET /formulas` (`?category=`), `GET /formulas/{id}`, `GET /openapi.json`,
 * `POST /evaluate`, `/solve`, `/tolerance`, `/sweep`, `/columns`, `/design`. The answer never throws.
 *
 * @example
 * const handle = createHandler({ maxSweepPoints: 2000 });
 * handle({ method: "POST", path: "/evaluate", body: '{"formula":"parallelPlateCapacitance","inputs":{"area":"1 cm^2","gap":"2 mm"}}' });
 * // { status: 200, headers: { "content-type": ... }, body: { id, value: 4.427e-13, unit: "F", warnings: [{ code: "fringing", ... }], cautions: [] } }
 */
export function createHandler(options: HandlerOptions = {}): (request: HttpRequest) => HttpResponse {
  const { limits, jobs, store } = readHandlerOptions(options);
  // Built on first request for it: it depends only on the limits and the registry.
  let doc: unknown;
  const document = (): unknown => (doc ??= openApiDocument(limits, store?.limits));
  return (request) => {
    try {
      if (typeof request !== "object" || request === null || typeof request.method !== "string" || typeof request.path !== "string") {
        throw new HttpError(400, "bad_request", "the request needs a method and a path");
      }
      return route(request, limits, document, jobs);
    } catch (e) {
      if (e instanceof HttpError) {
        return errorResponse(e.status, httpErrorBody(e), e.headers);
      }
      if (e instanceof FormulaError) return fromFormulaError(e, 422);
      // Not user input: a bug. Say so without leaking internals.
      return errorResponse(500, { code: "internal", message: "internal error", input: null });
    }
  };
}
