/**
 * A small JSON-over-HTTP backend on node:http, no framework:
 *
 *   GET  /formulas            every formula's metadata (optional ?category=)
 *   GET  /formulas/:id        one formula's metadata plus the JSON Schema of its inputs
 *   POST /evaluate            { formula, inputs }                  -> { id, value, unit, warnings, cautions }
 *   POST /solve               { formula, solveFor, target, inputs } -> { value, unit, exact?, outputAtValue, ... }
 *   POST /tolerance           { formula, inputs, options }         -> worst case, RSS, Monte Carlo, sensitivities, notes
 *   POST /sweep               { formula, vary, fixed }             -> axes, output values (null = not computed), notes
 *
 * Every response with a result carries its notes: warnings and cautions at the
 * result (evaluate, solve), and for sweeps and tolerance analyses each note
 * found over the points with its count and worst point.
 *
 * Inputs are numbers in SI or unit strings ("0.2 mm"). Errors are
 * { error: { code, message, input } }: 400 unreadable JSON, 404 unknown route or
 * formula, 405 wrong method, 413 body over the limit, 422 a FormulaError
 * (bad input, no solution). User input never causes a 500.
 *
 * Run: npx tsx examples/http-handler.ts   (PORT, default 8080)
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import { pathToFileURL } from "node:url";
import { evaluate, FormulaError } from "../src/index.js";
import { catalogEntry, formulaCatalog, inputSchema, solveRequest, sweepRequest, toleranceRequest } from "../src/tools/index.js";

export interface HandlerOptions {
  /** Largest request body in bytes (default 64 kB); larger bodies get 413 and are not read further. */
  readonly maxBody?: number;
  /** Largest Monte Carlo sample count a request may ask for (default 100000). */
  readonly maxSamples?: number;
  /** Largest number of grid points a sweep request may ask for (default 10000). */
  readonly maxPoints?: number;
}

type Json = Record<string, unknown> | readonly unknown[];

class HttpError extends Error {
  constructor(readonly status: number, readonly code: string, message: string, readonly input?: string) {
    super(message);
  }
}

function send(res: ServerResponse, status: number, body: Json, headers: Record<string, string> = {}): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { "content-type": "application/json; charset=utf-8", "content-length": Buffer.byteLength(text), ...headers });
  res.end(text);
}

function sendError(res: ServerResponse, status: number, code: string, message: string, input?: string, headers: Record<string, string> = {}): void {
  send(res, status, { error: { code, message, input: input ?? null } }, headers);
}

/** Read the body as JSON, refusing more than `limit` bytes without buffering the rest. */
function readJson(req: IncomingMessage, limit: number): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const declared = Number(req.headers["content-length"]);
    if (Number.isFinite(declared) && declared > limit) {
      reject(new HttpError(413, "body_too_large", `request body over ${limit} bytes`));
      return;
    }
    const chunks: Buffer[] = [];
    let size = 0;
    let done = false;
    req.on("data", (chunk: Buffer) => {
      if (done) return;
      size += chunk.length;
      if (size > limit) {
        done = true;
        chunks.length = 0;
        reject(new HttpError(413, "body_too_large", `request body over ${limit} bytes`));
        return;
      }
      chunks.push(chunk);
    });
    req.on("end", () => {
      if (done) return;
      done = true;
      const text = Buffer.concat(chunks).toString("utf8");
      try {
        resolve(JSON.parse(text));
      } catch {
        reject(new HttpError(400, "bad_json", "the request body is not valid JSON"));
      }
    });
    req.on("error", () => {
      if (!done) {
        done = true;
        reject(new HttpError(400, "bad_request", "the request could not be read"));
      }
    });
  });
}

function object(body: unknown): Record<string, unknown> {
  if (typeof body !== "object" || body === null || Array.isArray(body)) {
    throw new HttpError(400, "bad_request", "the request body must be a JSON object");
  }
  return body as Record<string, unknown>;
}

const POST_ROUTES = new Set(["/evaluate", "/solve", "/tolerance", "/sweep"]);

/** The request handler; pass it to http.createServer or call it from another server. */
export function createHandler(options: HandlerOptions = {}): (req: IncomingMessage, res: ServerResponse) => void {
  const limit = options.maxBody ?? 64 * 1024;
  const maxSamples = options.maxSamples ?? 100_000;
  const maxPoints = options.maxPoints ?? 10_000;

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://localhost");
    const path = url.pathname.replace(/\/+$/, "") || "/";
    const method = req.method ?? "GET";

    if (path === "/formulas" || path.startsWith("/formulas/")) {
      if (method !== "GET") throw new HttpError(405, "method_not_allowed", `${method} is not allowed here; use GET`, undefined);
      if (path === "/formulas") {
        const category = url.searchParams.get("category") ?? undefined;
        send(res, 200, formulaCatalog(category));
        return;
      }
      let id: string;
      try {
        id = decodeURIComponent(path.slice("/formulas/".length));
      } catch {
        // A malformed percent-escape ("%E0%A4%A") is the client's mistake, not the server's.
        throw new HttpError(400, "bad_request", "the formula id in the path has a malformed percent-escape");
      }
      let entry;
      try {
        entry = catalogEntry(id);
      } catch (e) {
        if (e instanceof FormulaError && e.code === "unknown_formula") throw new HttpError(404, e.code, e.message);
        throw e;
      }
      send(res, 200, { ...entry, inputSchema: inputSchema(id) });
      return;
    }
    if (!POST_ROUTES.has(path)) throw new HttpError(404, "not_found", `no route ${path}`);
    if (method !== "POST") throw new HttpError(405, "method_not_allowed", `${method} is not allowed here; use POST`);

    const body = object(await readJson(req, limit));
    switch (path) {
      case "/evaluate":
        // `evaluate` is the core: unit strings in, SI value with warnings and cautions out.
        send(res, 200, evaluate(body.formula as string, (body.inputs ?? {}) as Record<string, unknown>) as unknown as Json);
        return;
      case "/solve":
        send(res, 200, solveRequest(body as never) as unknown as Json);
        return;
      case "/tolerance": {
        const opts = (body.options ?? {}) as Record<string, unknown>;
        if (typeof opts !== "object" || opts === null) throw new HttpError(400, "bad_request", "options must be an object", "options");
        const samples = opts.samples ?? 10000;
        if (typeof samples !== "number" || samples > maxSamples) {
          throw new HttpError(422, "invalid_argument", `samples must be a number up to ${maxSamples}`, "samples");
        }
        send(res, 200, toleranceRequest({ formula: body.formula as string, inputs: body.inputs as Record<string, unknown>, options: { ...opts, samples } }) as unknown as Json);
        return;
      }
      case "/sweep": {
        // Count the points before computing anything.
        const vary = body.vary;
        if (typeof vary === "object" && vary !== null) {
          let total = 1;
          for (const a of Object.values(vary)) total *= typeof a === "object" && a !== null && typeof a.points === "number" ? a.points : 1;
          if (!(total <= maxPoints)) throw new HttpError(422, "invalid_argument", `at most ${maxPoints} points per sweep`, "points");
        }
        const r = sweepRequest(body as never);
        send(res, 200, {
          formula: r.formula,
          axes: r.axes.map((a) => ({ name: a.name, unit: a.unit, scale: a.scale, values: [...a.values] })),
          // NaN is not JSON: points not computed are null.
          output: { name: r.output.name, unit: r.output.unit, values: Array.from(r.output.values, (v, k) => (r.computed[k] ? v : null)) },
          notComputed: r.notComputed,
          notes: r.notes,
        });
        return;
      }
    }
  }

  return (req, res) => {
    handle(req, res).catch((e: unknown) => {
      if (res.headersSent) {
        res.destroy();
        return;
      }
      if (e instanceof HttpError) {
        const headers: Record<string, string> = {};
        if (e.status === 405) headers.allow = e.message.endsWith("GET") ? "GET" : "POST";
        if (e.status === 413) headers.connection = "close";
        sendError(res, e.status, e.code, e.message, e.input, headers);
        // Stop reading an oversized body: close the connection once the answer is out.
        if (e.status === 413) res.on("finish", () => req.destroy());
        return;
      }
      if (e instanceof FormulaError) {
        sendError(res, 422, e.code, e.message, e.input);
        return;
      }
      // Not user input: a bug. Say so without leaking internals.
      sendError(res, 500, "internal", "internal error");
    });
  };
}

/** A server with the handler (not yet listening). */
export function createEmquantServer(options: HandlerOptions = {}): Server {
  return createServer(createHandler(options));
}

// Started directly (not imported by tests): listen.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const port = Number(process.env.PORT ?? 8080);
  createEmquantServer().listen(port, () => {
    process.stdout.write(`emquant handler on http://localhost:${port}\n`);
  });
}
