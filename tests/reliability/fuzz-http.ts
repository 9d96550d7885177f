/**
 * The emquant/http request listener driven in process: a request object (a readable stream with
 * method, url and headers) and a response object that records what the handler
 * writes, so thousands of requests cost no sockets. The handler sees what
 * node:http would give it: the body arrives as Buffer chunks, then "end".
 */
import { EventEmitter } from "node:events";
import { Readable } from "node:stream";
import type { IncomingMessage, ServerResponse } from "node:http";
import fc from "fast-check";
import { createRequestListener } from "../../src/http/index.js";
import { resetLoopCount } from "../helpers/loop-count.js";
import { FORBIDDEN, loopViolations, userStrings, withoutEchoes, type Verdict } from "./fuzz-check.js";

export interface HttpCase {
  readonly method: string;
  readonly url: string;
  /** The raw body text (undefined: no body). */
  readonly body?: string | undefined;
  /** Declared content-length, when it is itself hostile. */
  readonly contentLength?: string | undefined;
}

const ROUTES = ["/evaluate", "/solve", "/tolerance", "/sweep", "/columns"] as const;

const HOSTILE_URLS = [
  "/formulas/%E0%A4%A", "/formulas/%", "/formulas/%ZZ", "/formulas/%C0%AF", "/formulas/%00", "/formulas/__proto__", "/formulas/constructor",
  "/formulas/toString", "/formulas/", "/formulas//", "/formulas?category=%E0%A4%A", "/formulas?category=__proto__", "/formulas?category=",
  "/evaluate?x=%ZZ", "//evaluate", "/evaluate/", "/evaluate/../solve", "/%2e%2e/evaluate", "/EVALUATE", "/", "", "*", "/formulas/parallelPlateCapacitance%00",
  `/formulas/${"a".repeat(5000)}`, "/formulas/%F0%9F%98%80", "/formulas/\u00b5", "http://other.host/evaluate", "/sweep?points=1e9",
];

const HOSTILE_BODIES = [
  "", " ", "{", "}", "{ not json", "null", "true", "1", "1e400", "-1e400", '"text"', "[]", "[1,2]", "{}", '{"formula":null}',
  '{"formula":"parallelPlateCapacitance","inputs":{"area":1e999,"gap":1e-999}}', '{"formula":"parallelPlateCapacitance","inputs":{"area":-1e400,"gap":1}}',
  '{"formula":"parallelPlateCapacitance","inputs":{"__proto__":{"area":1},"gap":1}}', '{"__proto__":{"formula":"parallelPlateCapacitance"}}',
  '{"formula":"parallelPlateCapacitance","inputs":{"area":1,"area":"x","gap":1}}', '\ufeff{"formula":"parallelPlateCapacitance","inputs":{"area":1,"gap":1}}',
  `{"formula":"parallelPlateCapacitance","inputs":${"[".repeat(5000)}${"]".repeat(5000)}}`, `${"[".repeat(20000)}${"]".repeat(20000)}`,
  `{"a":${"{\"a\":".repeat(3000)}1${"}".repeat(3000)}}`, `{"formula":"parallelPlateCapacitance","inputs":{"area":${"9".repeat(400)},"gap":1}}`,
  '{"formula":"parallelPlateCapacitance","inputs":{"area":"1 cm^2","gap":"0.1 mm"},"options":null}', '{"formula":"x","options":5}',
  '{"formula":"parallelPlateCapacitance","vary":{"gap":{"from":1,"to":2,"points":1e400}}}', '{"formula":"parallelPlateCapacitance","vary":{"gap":{"from":1,"to":2,"points":-1e400}},"fixed":{"area":1}}',
  '{"formula":"parallelPlateCapacitance","inputs":{"area":1,"gap":1},"options":{"samples":1e400}}', '{"formula":"parallelPlateCapacitance","inputs":{"area":1,"gap":{"nominal":1,"percent":1e400}},"options":{"samples":4}}',
  '{"formula":"parallelPlateCapacitance","solveFor":"gap","target":1e400,"inputs":{"area":1}}', "\u0000", "{\"formula\":\"\ud800\"}",
  // Over the 64 kB limit: 413 without reading on.
  `{"formula":"parallelPlateCapacitance","inputs":{"area":"${"1".repeat(70_000)}"}}`, "[".repeat(70_000),
];

/** Requests: well-formed bodies from the path arbitraries, hostile URLs, bodies and methods. */
export function httpCase(bodies: Record<(typeof ROUTES)[number] extends `/${infer R}` ? R : never, fc.Arbitrary<unknown>>): fc.Arbitrary<HttpCase> {
  const method = fc.oneof({ weight: 8, arbitrary: fc.constant("POST") }, { weight: 1, arbitrary: fc.constantFrom("GET", "PUT", "DELETE", "HEAD", "OPTIONS", "PATCH", "", "post", "POST ", "\u00e9") });
  // JSON carries no NaN, Infinity or functions: what a client can send of each case.
  const asJson = (route: "evaluate" | "solve" | "tolerance" | "sweep" | "columns"): fc.Arbitrary<string | undefined> =>
    bodies[route].map((c) => {
      const r = c as Record<string, unknown>;
      const b = route === "evaluate" || route === "columns" ? { formula: r.id, inputs: r.inputs } : route === "solve"
        ? { formula: r.id, solveFor: r.solveFor, target: r.target, inputs: r.inputs, options: r.options }
        : route === "tolerance" ? { formula: r.id, inputs: r.inputs, options: r.options } : { formula: r.id, vary: r.vary, fixed: r.fixed };
      try {
        return JSON.stringify(b, (_k, v: unknown) => (typeof v === "bigint" ? String(v) : v));
      } catch {
        return "{}";
      }
    });
  const post = fc.oneof(
    ...ROUTES.map((route) => fc.record({ method, url: fc.constant(route as string), body: asJson(route.slice(1) as "evaluate") })),
  );
  return fc.oneof(
    { weight: 12, arbitrary: post },
    { weight: 2, arbitrary: fc.record({ method, url: fc.constantFrom(...ROUTES), body: fc.constantFrom(...HOSTILE_BODIES) }) },
    { weight: 2, arbitrary: fc.record({ method: fc.constantFrom("GET", "GET", "POST", "HEAD"), url: fc.oneof(fc.constantFrom(...HOSTILE_URLS), fc.string({ maxLength: 16 }).map((s) => `/formulas/${s}`)), body: fc.constant(undefined) }) },
    { weight: 1, arbitrary: fc.record({ method, url: fc.constantFrom(...ROUTES), body: fc.constantFrom('{"formula":"parallelPlateCapacitance"}'), contentLength: fc.constantFrom("abc", "-1", "1e400", "99999999999", "0", "") }) },
  );
}

const handler = createRequestListener({ maxBodyBytes: 64 * 1024 });

/** A response that records the status, headers and body the handler writes. */
class RecordingResponse extends EventEmitter {
  headersSent = false;
  status = 0;
  body = "";
  destroyed = false;
  readonly done: Promise<void>;
  private finish!: () => void;
  constructor() {
    super();
    this.done = new Promise((resolve) => (this.finish = resolve));
  }
  writeHead(status: number): this {
    this.status = status;
    this.headersSent = true;
    return this;
  }
  end(chunk?: string | Uint8Array): this {
    this.body = typeof chunk === "string" ? chunk : chunk === undefined ? "" : new TextDecoder().decode(chunk);
    this.finish();
    this.emit("finish");
    return this;
  }
  destroy(): void {
    this.destroyed = true;
    this.finish();
  }
}

function request(c: HttpCase): IncomingMessage {
  const chunks = c.body === undefined ? [] : [Buffer.from(c.body, "utf8")];
  const req = Readable.from(chunks) as unknown as IncomingMessage & { method: string; url: string; headers: Record<string, string> };
  req.method = c.method;
  req.url = c.url;
  req.headers = { host: "localhost" };
  if (c.body !== undefined) req.headers["content-type"] = "application/json";
  if (c.contentLength !== undefined) req.headers["content-length"] = c.contentLength;
  else if (c.body !== undefined) req.headers["content-length"] = String(Buffer.byteLength(c.body));
  return req;
}

// null marks a sweep point not computed or a failed row in output values (and columns' components),
// and a row that computed in a columns answer's errors (documented in the OpenAPI document).
const NULL_ALLOWED = /^result\.(output\.values\[\d+\]|output\.components\.\w+\[\d+\]|errors\[\d+\])$/;

/** Every number finite; null only where a sweep marks a point not computed or a columns row failed (or, in errors, computed). */
function jsonViolations(v: unknown, path: string, out: string[], depth = 0): void {
  if (out.length > 5 || depth > 40) return;
  if (v === null) {
    if (!NULL_ALLOWED.test(path) && !/\.(input|error\.input)$/.test(path)) out.push(`${path} is null`);
  } else if (typeof v === "number") {
    if (!Number.isFinite(v)) out.push(`${path} = ${v}`);
  } else if (Array.isArray(v)) {
    v.forEach((x, i) => jsonViolations(x, `${path}[${i}]`, out, depth + 1));
  } else if (typeof v === "object") {
    for (const [k, x] of Object.entries(v as object)) jsonViolations(x, `${path}.${k}`, out, depth + 1);
  }
}

/**
 * Evaluations a request may cause, for its loop bound (see EVALUATIONS in
 * fuzz-runners.ts; the handler itself caps samples at 2e4 and points at 1e4).
 */
function evaluationsFor(url: string): number {
  if (url.startsWith("/solve")) return 100_000;
  if (url.startsWith("/tolerance")) return 200_000;
  if (url.startsWith("/sweep")) return 10_000;
  return 1;
}

/** Run one request through the handler and judge the answer: never 500, 4xx with a JSON error, 2xx finite JSON. */
export async function runHttp(c: HttpCase): Promise<{ violations: string[]; code?: string }> {
  const strings = userStrings(c);
  if (c.body !== undefined) {
    try {
      userStrings(JSON.parse(c.body), strings);
    } catch {
      // not JSON: nothing to echo
    }
  }
  const res = new RecordingResponse();
  resetLoopCount();
  handler(request(c), res as unknown as ServerResponse);
  await res.done;
  const v: string[] = [...loopViolations(evaluationsFor(c.url))];
  if (res.destroyed) v.push("the connection was destroyed without an answer");
  if (res.status >= 500) v.push(`status ${res.status}: ${res.body.slice(0, 160)}`);
  let json: unknown;
  try {
    json = JSON.parse(res.body);
  } catch {
    v.push(`the body is not JSON: ${JSON.stringify(res.body.slice(0, 80))}`);
  }
  if (res.status >= 400 && res.status < 500) {
    const e = (json as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
    if (typeof e?.code !== "string" || typeof e.message !== "string") v.push(`status ${res.status} without { error: { code, message } }`);
  } else if (res.status >= 200 && res.status < 300 && c.url !== "/formulas" && !c.url.startsWith("/formulas")) {
    jsonViolations(json, "result", v);
  }
  const text = withoutEchoes(res.body, strings);
  if (FORBIDDEN.test(text)) v.push(`body says ${JSON.stringify(text.match(new RegExp(`.{0,60}(${FORBIDDEN.source}).{0,60}`))?.[0])}`);
  return { violations: v, code: String(res.status) };
}
