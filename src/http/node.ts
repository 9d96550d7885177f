/**
 * The handler on node:http: a request listener for `http.createServer`
 * (or `https`, or a framework that hands over Node's request and response).
 * It reads the body within the size limit, calls the framework-neutral
 * handler and writes its JSON answer. It imports nothing from Node, not even
 * types: the request and response are described by the few members used, so
 * the declarations type-check for consumers without @types/node.
 */
import { createHandler, type HandlerOptions, type HttpResponse, readHandlerOptions } from "./handler.js";

/** What the listener uses of node:http's IncomingMessage. */
export interface NodeRequestLike {
  readonly method?: string | undefined;
  readonly url?: string | undefined;
  readonly headers: { readonly [name: string]: string | readonly string[] | undefined };
  on(event: "data", listener: (chunk: Uint8Array) => void): unknown;
  on(event: "end", listener: () => void): unknown;
  on(event: "error", listener: (error: Error) => void): unknown;
  destroy(): unknown;
}

/** What the listener uses of node:http's ServerResponse. */
export interface NodeResponseLike {
  readonly headersSent: boolean;
  writeHead(status: number, headers: Record<string, string | number>): unknown;
  end(body: Uint8Array): unknown;
  on(event: "finish", listener: () => void): unknown;
  destroy(): unknown;
}

function errorOf(status: number, code: string, message: string): HttpResponse {
  return { status, headers: { "content-type": "application/json; charset=utf-8" }, body: { error: { code, message, input: null } } };
}

/**
 * Read the body as bytes, refusing more than `limit` bytes without buffering
 * the rest: a declared length over the limit is refused before reading, and a
 * chunked body is counted as it arrives. Resolves to the bytes or to an error answer.
 */
function readBody(req: NodeRequestLike, limit: number): Promise<Uint8Array | HttpResponse> {
  const tooLarge = (): HttpResponse => errorOf(413, "body_too_large", `the request body is over ${limit} bytes`);
  return new Promise((resolve) => {
    const declared = Number(req.headers["content-length"]);
    if (Number.isFinite(declared) && declared > limit) {
      resolve(tooLarge());
      return;
    }
    const chunks: Uint8Array[] = [];
    let size = 0;
    let done = false;
    const finish = (result: Uint8Array | HttpResponse): void => {
      if (done) return;
      done = true;
      chunks.length = 0;
      resolve(result);
    };
    req.on("data", (chunk: Uint8Array) => {
      if (done) return;
      size += chunk.length;
      if (size > limit) finish(tooLarge());
      else chunks.push(chunk);
    });
    req.on("end", () => {
      if (done) return;
      const all = new Uint8Array(size);
      let at = 0;
      for (const c of chunks) all.set(c, (at += c.length) - c.length);
      finish(all);
    });
    req.on("error", () => finish(errorOf(400, "bad_request", "the request could not be read")));
  });
}

function send(req: NodeRequestLike, res: NodeResponseLike, answer: HttpResponse): void {
  const bytes = new TextEncoder().encode(JSON.stringify(answer.body));
  const headers: Record<string, string | number> = { ...answer.headers, "content-length": bytes.length };
  // An oversized body is not read on: close the connection once the answer is out.
  if (answer.status === 413) {
    headers.connection = "close";
    res.on("finish", () => req.destroy());
  }
  res.writeHead(answer.status, headers);
  res.end(bytes);
}

/**
 * A node:http request listener around `createHandler(options)`: routes,
 * limits and status codes as documented there.
 *
 * @example
 * import { createServer } from "node:http";
 * import { createRequestListener } from "emquant/http";
 * createServer(createRequestListener({ maxSweepPoints: 2000 })).listen(8080, "127.0.0.1");
 */
export function createRequestListener(options: HandlerOptions = {}): (req: NodeRequestLike, res: NodeResponseLike) => void {
  const handle = createHandler(options);
  const limit = readHandlerOptions(options).limits.maxBodyBytes;
  return (req, res) => {
    const method = req.method ?? "GET";
    const path = req.url ?? "/";
    // A GET carries no body: answer at once without waiting for one.
    const body = method === "POST" ? readBody(req, limit) : Promise.resolve(undefined);
    body
      .then((b) => send(req, res, b === undefined || b instanceof Uint8Array ? handle({ method, path, body: b }) : b))
      .catch(() => {
        // Only a failure to write (a closed socket) gets here: nothing left to answer.
        if (!res.headersSent) res.destroy();
      });
  };
}
