/**
 * emquant/http: the library behind a JSON HTTP interface, for any server.
 *
 * - `createHandler(limits)`: a plain function from `{ method, path, query?, body? }`
 *   to `{ status, headers, body }`; mount it in any framework or serverless function.
 * - `createRequestListener(limits)`: the same on node:http (`http.createServer(listener)`).
 * - `openApiDocument(limits)`: the OpenAPI 3.1 description of the routes, generated
 *   from the registry (also served at GET /openapi.json).
 *
 * Routes: GET /formulas (?category=), GET /formulas/{id}, GET /openapi.json,
 * POST /evaluate, /solve, /tolerance, /sweep, /columns, /design. Status codes: 200 result with
 * its notes; 400 bad_json / bad_request / bad_escape; 404 not_found /
 * unknown_formula (in the path); 405 method_not_allowed; 413 body_too_large;
 * 422 a FormulaError code or over_limit. User input never gives 500.
 *
 * Long requests as jobs: `createJobStore(limits)` passed as `createHandler({ jobs })`
 * adds POST /jobs (202), GET /jobs/{id} (state, progress), GET /jobs/{id}/result,
 * DELETE /jobs/{id} (cancel); the caller closes the store (`close()`) when the server stops.
 */
export { createHandler } from "./handler.js";
export type { HandlerOptions, HttpRequest, HttpResponse, JsonValue, QueryParams } from "./handler.js";
export { HTTP_ERROR_CODES } from "./codes.js";
export type { HttpErrorCode } from "./codes.js";
export { createJobStore, DEFAULT_JOB_LIMITS, JOB_KINDS, resolveJobLimits } from "./jobs.js";
export type { JobKind, JobLimits, JobState, JobStatus, JobStore } from "./jobs.js";
export { createRequestListener } from "./node.js";
export type { NodeRequestLike, NodeResponseLike } from "./node.js";
export { DEFAULT_LIMITS, resolveLimits } from "./limits.js";
export type { HandlerLimits } from "./limits.js";
export { HTTP_API_VERSION, openApiDocument } from "./openapi.js";
