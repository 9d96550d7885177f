/**
 * The OpenAPI 3.1 description of the handler's routes, generated from the
 * registry: each formula's inputs schema is `inputSchema(id)` (JSON Schema
 * 2020-12, the dialect OpenAPI 3.1 uses), so adding a formula adds it here
 * with no edit. The request limits appear as bounds (samples, points,
 * decades), taken from the limits the handler runs with; the job routes appear
 * when the handler has a job store, with the store's limits.
 */
import { designSchema } from "../designs/schema.js";
import { ERROR_CODES } from "../core/errors.js";
import { listFormulas } from "../core/registry.js";
import { inputSchema } from "../tools/catalog.js";
import { HTTP_ERROR_CODES } from "./codes.js";
import { JOB_KINDS, type JobLimits } from "./jobs.js";
import { DEFAULT_LIMITS, type HandlerLimits } from "./limits.js";

/**
 * Version of the HTTP interface (routes, request and response shapes), apart
 * from the package version: it changes when a route or shape changes.
 */
export const HTTP_API_VERSION = "1.0.0";

type Schema = Record<string, unknown>;

const ref = (name: string): Schema => ({ $ref: `#/components/schemas/${name}` });
const json = (schema: Schema, description: string): Schema => ({ description, content: { "application/json": { schema } } });

/** Shapes shared by several routes. */
function sharedSchemas(): Record<string, Schema> {
  const number = { type: "number" };
  const si = (description: string): Schema => ({ type: "number", description });
  const quantity = { anyOf: [number, { type: "string", minLength: 1 }], description: "a number in SI or a unit string such as \"0.2 mm\"" };
  const note = { type: "object", required: ["code", "message"], properties: { code: { type: "string" }, message: { type: "string" } } };
  const notes = { type: "array", items: ref("Note") };
  return {
    Note: note,
    NoteSummary: {
      type: "object",
      required: ["code", "kind", "count", "worst"],
      description: "a warning or caution raised over many points: how many raised it and the worst one",
      properties: {
        code: { type: "string" }, kind: { enum: ["warning", "caution"] }, count: { type: "integer", minimum: 1 },
        worst: {
          type: "object", required: ["index", "inputs", "message"],
          properties: { index: { type: "integer", minimum: 0 }, inputs: { type: "object", additionalProperties: number }, measure: number, message: { type: "string" } },
        },
      },
    },
    Error: {
      type: "object",
      required: ["error"],
      properties: {
        error: {
          type: "object",
          required: ["code", "message", "input"],
          properties: {
            code: { enum: [...ERROR_CODES, ...HTTP_ERROR_CODES] },
            message: { type: "string" },
            input: { type: ["string", "null"], description: "the input, option or field the error is about" },
            formula: { type: "string" }, expected: { type: "string" }, received: { type: "string" }, rule: { type: "string" },
            limit: { type: "integer", description: "for over_limit: the server's limit" },
          },
        },
      },
    },
    Quantity: quantity,
    ToleranceValue: {
      description: "a value held at nominal, or a band: nominal +- plusMinus, nominal +- percent, a normal or a uniform distribution",
      anyOf: [
        ref("Quantity"),
        { type: "array", items: ref("Quantity"), minItems: 3, maxItems: 3 },
        { type: "object", required: ["nominal", "plusMinus"], properties: { nominal: ref("Quantity"), plusMinus: ref("Quantity") }, additionalProperties: false },
        { type: "object", required: ["nominal", "percent"], properties: { nominal: ref("Quantity"), percent: number }, additionalProperties: false },
        { type: "object", required: ["distribution", "mean", "sd"], properties: { distribution: { const: "normal" }, mean: ref("Quantity"), sd: ref("Quantity") }, additionalProperties: false },
        { type: "object", required: ["distribution", "min", "max"], properties: { distribution: { const: "uniform" }, min: ref("Quantity"), max: ref("Quantity") }, additionalProperties: false },
      ],
    },
    EvaluateResult: {
      type: "object",
      required: ["id", "value", "unit", "warnings", "cautions"],
      properties: {
        id: { type: "string" },
        value: { anyOf: [si("the value in SI"), { type: "array", items: number, description: "components in SI" }] },
        unit: { type: "string", description: "SI unit symbol (empty when dimensionless)" },
        warnings: notes, cautions: notes,
      },
    },
    SolveResult: {
      type: "object",
      required: ["formula", "input", "value", "unit", "outputAtValue", "target", "outputUnit", "searched", "warnings", "cautions"],
      properties: {
        formula: { type: "string" }, input: { type: "string" }, value: si("the input value that reaches the target"), unit: { type: "string" },
        exact: si("for whole-number inputs: the value before rounding"), outputAtValue: number, target: number, outputUnit: { type: "string" },
        searched: { type: "array", items: number, minItems: 2, maxItems: 2 }, warnings: notes, cautions: notes,
      },
    },
    ToleranceResult: {
      type: "object",
      required: ["formula", "unit", "nominal", "worstCase", "rss", "sensitivities", "remarks", "warnings", "cautions", "notes", "notesOver"],
      properties: {
        formula: { type: "string" }, unit: { type: "string" }, nominal: number,
        worstCase: { type: "object", required: ["min", "max", "method"], properties: { min: number, max: number, method: { enum: ["corners", "derivative signs"] }, evaluated: { type: "integer" }, rejected: { type: "integer" } } },
        rss: { type: "object", required: ["sd", "plusMinus"], properties: { sd: number, plusMinus: number } },
        monteCarlo: { type: "object", required: ["seed", "samples", "accepted", "rejected"], properties: { generator: { type: "string" }, seed: { type: "integer" }, samples: { type: "integer" }, accepted: { type: "integer" }, rejected: { type: "integer" } } },
        sensitivities: { type: "array", items: { type: "object", required: ["input", "derivative", "derivativeUnit", "sd", "share"], properties: { input: { type: "string" }, derivative: number, derivativeUnit: { type: "string" }, sd: number, share: { type: "number", minimum: 0, maximum: 1 } } } },
        remarks: { type: "array", items: { type: "string" } },
        warnings: notes, cautions: notes,
        notes: { type: "array", items: ref("NoteSummary") }, notesOver: { type: "integer", minimum: 0 },
      },
    },
    SweepResult: {
      type: "object",
      required: ["formula", "axes", "output", "notComputed", "notes"],
      properties: {
        formula: { type: "string" },
        axes: {
          type: "array", minItems: 1, maxItems: 2,
          items: { type: "object", required: ["name", "unit", "scale", "values"], properties: { name: { type: "string" }, unit: { type: "string" }, scale: { enum: ["linear", "log"] }, values: { type: "array", items: number } } },
        },
        output: {
          type: "object", required: ["name", "unit", "values"],
          description: "row-major for two axes (index = i * n1 + j); null where a point was not computed",
          properties: {
            name: { type: "string" }, description: { type: "string" }, unit: { type: "string" },
            values: { type: "array", items: { type: ["number", "null"] } },
            components: { type: "object", additionalProperties: { type: "array", items: { type: ["number", "null"] } } },
          },
        },
        notComputed: { type: "integer", minimum: 0 },
        notes: { type: "array", items: ref("NoteSummary") },
      },
    },
    ColumnsResult: {
      type: "object",
      required: ["formula", "rows", "output", "errors", "failed", "rowErrors", "notes"],
      properties: {
        formula: { type: "string" },
        rows: { type: "integer", minimum: 1 },
        output: {
          type: "object", required: ["name", "unit", "values"],
          description: "one value per row in SI; null where the row failed (its code is in errors)",
          properties: {
            name: { type: "string" }, description: { type: "string" }, unit: { type: "string" },
            values: { type: "array", items: { type: ["number", "null"] }, description: "for formulas with components: the first component" },
            components: { type: "object", additionalProperties: { type: "array", items: { type: ["number", "null"] } } },
          },
        },
        errors: { type: "array", items: { anyOf: [{ type: "null" }, { enum: [...ERROR_CODES] }] }, description: "per row: null, or the code of why it failed" },
        failed: { type: "integer", minimum: 0 },
        rowErrors: {
          type: "array",
          description: "per error code met: how many rows, and the first (row numbers from 0) with its message",
          items: {
            type: "object", required: ["code", "count", "first"],
            properties: {
              code: { enum: [...ERROR_CODES] }, count: { type: "integer", minimum: 1 },
              first: { type: "object", required: ["row", "message"], properties: { row: { type: "integer", minimum: 0 }, input: { type: "string" }, message: { type: "string" } } },
            },
          },
        },
        notes: { type: "array", items: ref("NoteSummary") },
      },
    },
    ColumnsCsvResult: {
      type: "object",
      required: ["csv", "failed", "rowErrors", "notes"],
      properties: {
        csv: { type: "string", description: "the result table: the output (a column per component) and an error column, one line per row" },
        failed: { type: "integer", minimum: 0 },
        rowErrors: { type: "array", items: { type: "object" } },
        notes: { type: "array", items: ref("NoteSummary") },
      },
    },
    CatalogEntry: {
      type: "object",
      required: ["id", "title", "category", "description", "equation", "inputs", "output", "relations", "validity", "cautions", "sources"],
      properties: {
        id: { type: "string" }, title: { type: "string" }, category: { type: "string" }, description: { type: "string" }, equation: { type: "string" },
        inputs: { type: "array", items: { type: "object", required: ["name", "description", "kind", "required"], properties: { name: { type: "string" }, kind: { enum: ["quantity", "choice"] }, required: { type: "boolean" } } } },
        output: { type: "object", required: ["dimension", "unit", "description"], properties: { byChoice: { type: "object", description: "when a choice input decides the output: { input, dimensions: { choice: { dimension, unit } } }; dimension and unit above are the first choice's" } } },
        relations: { type: "array", items: { type: "string" } },
        validity: { type: "array", items: { type: "object", required: ["code", "always"] } },
        cautions: { type: "array", items: { type: "object", required: ["code", "always"] } },
        sources: { type: "array", items: { type: "object", required: ["authors", "title"] } },
      },
    },
  };
}

/** An inputs schema as a component: the dialect and id are the document's, so they are left out. */
function inputsComponent(id: string): Schema {
  const { $schema: _dialect, $id: _id, ...schema } = inputSchema(id);
  return schema;
}

/**
 * The OpenAPI 3.1 document of the HTTP handler, as served at GET /openapi.json.
 * Pass the handler's limits so the bounds it states are the ones enforced.
 */
export function openApiDocument(limits: HandlerLimits = DEFAULT_LIMITS, jobs?: JobLimits): Record<string, unknown> {
  const ids = listFormulas().map((f) => f.id);
  const categories = [...new Set(listFormulas().map((f) => f.definition.category))].sort();
  const schemas: Record<string, Schema> = sharedSchemas();
  const { $schema: _s, $id: _i, ...design } = designSchema();
  schemas.Design = design;
  schemas.DesignAnswer = {
    type: "object",
    required: ["design"],
    properties: {
      design: { type: "object", description: "DesignResult: inputs, steps (value, unit, inputs, equation, source, notes), derived quantities, checks with margins, notes naming their steps" },
      tolerance: { type: "object", description: "DesignToleranceResult: worst case, RSS sensitivities and Monte Carlo per quantity; failure probability per check" },
      report: { type: "string" },
    },
  };
  const evaluateMapping: Record<string, string> = {};
  for (const id of ids) {
    const inputs = inputsComponent(id);
    schemas[`${id}.inputs`] = inputs;
    const needsInputs = Array.isArray(inputs.required) && inputs.required.length > 0;
    schemas[`${id}.evaluate`] = {
      type: "object",
      required: needsInputs ? ["formula", "inputs"] : ["formula"],
      properties: { formula: { const: id }, inputs: ref(`${id}.inputs`) },
    };
    evaluateMapping[id] = `#/components/schemas/${id}.evaluate`;
  }
  const formula = { type: "string", enum: ids, description: "a formula id (GET /formulas lists them)" };
  const toleranceBody = (maxSamples: number, maxCornerInputs: number): Schema => ({
    type: "object",
    required: ["formula", "inputs"],
    properties: {
      formula,
      inputs: { type: "object", additionalProperties: ref("ToleranceValue") },
      options: {
        type: "object",
        additionalProperties: false,
        properties: {
          samples: { type: "integer", minimum: 0, maximum: maxSamples },
          seed: { type: "integer" },
          maxCornerInputs: { type: "integer", minimum: 0, maximum: maxCornerInputs },
        },
      },
    },
  });
  const sweepBody = (maxPoints: number): Schema => ({
    type: "object",
    required: ["formula", "vary"],
    properties: {
      formula,
      vary: {
        type: "object", minProperties: 1, maxProperties: 2,
        additionalProperties: {
          type: "object", required: ["from", "to", "points"], additionalProperties: false,
          properties: { from: ref("Quantity"), to: ref("Quantity"), points: { type: "integer", minimum: 1, maximum: maxPoints }, scale: { enum: ["linear", "log"] } },
        },
      },
      fixed: { type: "object", description: "the other inputs, as in the formula's inputs schema" },
    },
  });
  const errors = (...statuses: number[]): Record<string, Schema> => Object.fromEntries(statuses.map((s) => [String(s), { $ref: `#/components/responses/${s}` }]));
  const post = (summary: string, request: Schema, result: string): Schema => ({
    post: {
      summary,
      requestBody: { required: true, content: { "application/json": { schema: request } } },
      responses: { 200: json(ref(result), "the result with its notes"), ...errors(400, 405, 413, 422) },
    },
  });
  const paths: Record<string, Schema> = {
    "/formulas": {
      get: {
        summary: "Every formula's metadata, sorted by category then id",
        parameters: [{ name: "category", in: "query", required: false, schema: { type: "string", enum: categories } }],
        responses: { 200: json({ type: "array", items: ref("CatalogEntry") }, "the catalog"), ...errors(400, 405) },
      },
    },
    "/formulas/{id}": {
      get: {
        summary: "One formula's metadata with the JSON Schema of its inputs",
        parameters: [{ name: "id", in: "path", required: true, schema: formula }],
        responses: {
          200: json({ allOf: [ref("CatalogEntry"), { type: "object", required: ["inputSchema"], properties: { inputSchema: { type: "object" } } }] }, "the formula"),
          ...errors(400, 404, 405),
        },
      },
    },
    "/openapi.json": {
      get: { summary: "This document", responses: { 200: json({ type: "object" }, "the OpenAPI document"), ...errors(405) } },
    },
    "/evaluate": post("Evaluate a formula", { oneOf: ids.map((id) => ref(`${id}.evaluate`)), discriminator: { propertyName: "formula", mapping: evaluateMapping } }, "EvaluateResult"),
    "/solve": post(
      "Find the value of one input that makes the output reach a target",
      {
        type: "object",
        required: ["formula", "solveFor", "target"],
        properties: {
          formula, solveFor: { type: "string", description: "the input to solve for (not given in inputs)" },
          target: ref("Quantity"), inputs: { type: "object", description: "the other inputs, as in the formula's inputs schema" },
          options: {
            type: "object",
            additionalProperties: false,
            properties: {
              decades: { type: "integer", minimum: 1, maximum: limits.maxSolveDecades },
              samplesPerDecade: { type: "integer", minimum: 2, maximum: limits.maxSolveSamplesPerDecade },
              range: { type: "array", items: ref("Quantity"), minItems: 2, maxItems: 2 },
            },
          },
        },
      },
      "SolveResult",
    ),
    "/tolerance": post(
      "Worst case, RSS and Monte Carlo of a formula's output over toleranced inputs",
      toleranceBody(limits.maxSamples, limits.maxCornerInputs),
      "ToleranceResult",
    ),
    "/sweep": post(
      `Evaluate a formula over a grid of one or two inputs (at most ${limits.maxSweepPoints} points)`,
      sweepBody(limits.maxSweepPoints),
      "SweepResult",
    ),
    "/columns": {
      post: {
        summary: `Evaluate a formula row by row over columns of inputs, as JSON arrays or CSV text (at most ${limits.maxColumnRows} rows); a bad row gets an error code and the others are computed`,
        requestBody: {
          required: true,
          content: {
            "application/json": {
              schema: {
                type: "object",
                required: ["formula"],
                additionalProperties: false,
                properties: {
                  formula,
                  inputs: {
                    type: "object",
                    description: "per input: one value for every row (a number in SI, a unit string, a choice word), a column (an array, one number, unit string or choice word per row), or { values, unit } for bare numbers in a unit; with csv, only the inputs fixed for every row",
                    additionalProperties: {
                      anyOf: [
                        ref("Quantity"),
                        { type: "array", maxItems: limits.maxColumnRows, items: { anyOf: [{ type: "number" }, { type: "string" }] } },
                        { type: "object", required: ["values", "unit"], additionalProperties: false, properties: { values: { type: "array", maxItems: limits.maxColumnRows, items: { anyOf: [{ type: "number" }, { type: "string" }] } }, unit: { type: "string" } } },
                      ],
                    },
                  },
                  csv: { type: "string", description: 'the table as CSV text: a header of input names, a unit in parentheses optional ("gap (mm)"), then one line per row; cells may carry their own units ("0.2 mm")' },
                  format: { enum: ["json", "csv"], description: "csv: answer the result table as CSV text (default json)" },
                },
              },
            },
          },
        },
        responses: {
          200: json({ oneOf: [ref("ColumnsResult"), ref("ColumnsCsvResult")] }, "the rows' values and error codes with the notes"),
          ...errors(400, 405, 413, 422),
        },
      },
    },
    "/design": post(
      "Evaluate a design (a chain of formulas with checks), optionally with tolerance through the chain and a calculation report",
      {
        type: "object",
        required: ["design"],
        additionalProperties: false,
        properties: {
          design: ref("Design"),
          tolerance: {
            type: "object",
            additionalProperties: false,
            properties: { samples: { type: "integer", minimum: 0, maximum: limits.maxSamples }, seed: { type: "integer", minimum: 0, maximum: 4294967295 } },
          },
          report: { enum: ["markdown", "html"], description: "also return the calculation report as text" },
        },
      },
      "DesignAnswer",
    ),
  };
  const responses: Record<string, Schema> = {
    400: json(ref("Error"), "unreadable request: bad_json, bad_request, bad_escape"),
    404: json(ref("Error"), "not_found (route) or unknown_formula (formula id in the path)"),
    405: { ...json(ref("Error"), "method_not_allowed"), headers: { allow: { description: "the method to use", schema: { type: "string" } } } },
    413: json(ref("Error"), `body_too_large: the body is over ${limits.maxBodyBytes} bytes`),
    422: json(ref("Error"), "a library error code (wrong_dimension, out_of_domain, no_solution, ...) or over_limit"),
  };
  if (jobs !== undefined) addJobs(paths, schemas, responses, jobs, { toleranceBody, sweepBody, errors });
  return {
    openapi: "3.1.0",
    info: {
      title: "emquant",
      version: HTTP_API_VERSION,
      summary: "Electromagnetics engineering formulas over HTTP: evaluate, solve, tolerance analysis and sweeps, with unit strings.",
      description:
        "Inputs are numbers in SI or unit strings (\"0.2 mm\"). Every result carries its notes: warnings (where a formula's assumptions " +
        "weaken) and cautions (hazards; local codes and licensed practice govern). Errors are { error: { code, message, input } }: " +
        "400 unreadable request, 404 unknown route or formula, 405 wrong method, 413 body too large, 422 bad input or over a limit. " +
        "User input never causes a 500.",
      license: { name: "MIT", identifier: "MIT" },
    },
    paths,
    components: {
      schemas,
      responses,
    },
  };
}

/** The job routes and their shapes, with the store's limits as bounds. */
function addJobs(
  paths: Record<string, Schema>,
  schemas: Record<string, Schema>,
  responses: Record<string, Schema>,
  jobs: JobLimits,
  parts: { toleranceBody: (samples: number, corners: number) => Schema; sweepBody: (points: number) => Schema; errors: (...s: number[]) => Record<string, Schema> },
): void {
  const { errors } = parts;
  const bodies: Record<string, Schema> = {
    sweep: parts.sweepBody(jobs.maxSweepPoints),
    tolerance: parts.toleranceBody(jobs.maxSamples, jobs.maxCornerInputs),
  };
  schemas.JobSubmission = {
    description: "a long request as a job: kind names the route whose body request is (with the job limits as bounds)",
    oneOf: JOB_KINDS.map((kind) => ({
      type: "object", required: ["kind", "request"], additionalProperties: false,
      properties: { kind: { const: kind }, request: bodies[kind] },
    })),
  };
  const seconds = { type: "number", minimum: 0 };
  schemas.JobStatus = {
    type: "object",
    required: ["id", "kind", "state", "progress", "elapsedSeconds", "submitted", "url", "resultUrl"],
    properties: {
      id: { type: "string" },
      kind: { enum: [...JOB_KINDS] },
      state: { enum: ["queued", "running", "done", "failed", "cancelled"] },
      progress: {
        type: "object", required: ["fraction", "done", "total"],
        description: "items done of total in the library call's count (grid points; corner evaluations then Monte Carlo samples), reported once the job starts; never decreasing, fraction 1 once done; for a cancelled job, where it stopped",
        properties: { fraction: { type: "number", minimum: 0, maximum: 1 }, done: { type: "integer", minimum: 0 }, total: { type: "integer", minimum: 0 } },
      },
      elapsedSeconds: { ...seconds, description: "time spent computing (0 while queued)" },
      submitted: { type: "string", format: "date-time" },
      expiresInSeconds: { ...seconds, description: `for a finished job: time until it is forgotten (kept ${jobs.keepFinishedMs / 1000} s)` },
      url: { type: "string", description: "this status, relative to where the handler is mounted" },
      resultUrl: { type: "string" },
      error: { type: "object", description: "for a failed job: the error the synchronous route would have answered" },
    },
  };
  const id = [{ name: "id", in: "path", required: true, schema: { type: "string" } }];
  const status = (description: string): Schema => json(ref("JobStatus"), description);
  paths["/jobs"] = {
    post: {
      summary: `Submit a long sweep (at most ${jobs.maxSweepPoints} points) or tolerance analysis (at most ${jobs.maxSamples} samples) as a job`,
      requestBody: { required: true, content: { "application/json": { schema: ref("JobSubmission") } } },
      responses: {
        202: { ...status("the job, queued; poll its url"), headers: { location: { description: "the job's url", schema: { type: "string" } } } },
        ...errors(400, 405, 413, 422, 503),
      },
    },
  };
  paths["/jobs/{id}"] = {
    get: { summary: "A job's state and progress", parameters: id, responses: { 200: status("the job"), ...errors(400, 404, 405, 410, 503) } },
    delete: {
      summary: "Cancel a queued or running job (its computing stops within one chunk), or forget a finished one and its result",
      parameters: id,
      responses: { 200: status("the job after the call"), ...errors(400, 404, 405, 410, 503) },
    },
  };
  paths["/jobs/{id}/result"] = {
    get: {
      summary: "A finished job's result: the answer the synchronous route gives for the same request (for a failed job, its error)",
      parameters: id,
      responses: { 200: json({ oneOf: [ref("SweepResult"), ref("ToleranceResult")] }, "the result with its notes"), ...errors(400, 404, 405, 409, 410, 422, 503) },
    },
  };
  responses[404] = json(ref("Error"), "not_found (route), unknown_formula (formula id in the path) or unknown_job (job id in the path)");
  responses[409] = json(ref("Error"), "job_not_done (still queued or running) or job_cancelled (no result)");
  responses[410] = json(ref("Error"), `job_gone: the job is no longer kept (finished jobs are kept ${jobs.keepFinishedMs / 1000} s, at most ${jobs.maxFinishedJobs}; a deleted one is forgotten at once)`);
  responses[422] = json(ref("Error"), `a library error code (wrong_dimension, out_of_domain, no_solution, ...), over_limit, or result_too_large (a job's result over ${jobs.maxResultBytes} bytes of JSON)`);
  responses[503] = json(ref("Error"), `too_many_jobs (at most ${jobs.maxJobs} unfinished) or shutting_down`);
}
