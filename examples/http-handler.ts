/**
 * A JSON backend on node:http with no framework: the `emquant/http` request
 * listener (routes, limits and status codes are documented in src/http/index.ts
 * and README "In a backend"), bound to the loopback interface unless told otherwise.
 * It runs long sweeps and tolerance analyses as jobs (POST /jobs) with a job
 * store of its own, which it closes when the server closes.
 *
 * Run: npm run serve                         http://127.0.0.1:8080
 *      PORT=9000 HOST=0.0.0.0 npm run serve   every interface: put it behind a proxy you trust
 */
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { createJobStore, createRequestListener, type HandlerOptions, type JobStore } from "../src/http/index.js";

export interface ServeOptions extends HandlerOptions {
  /** Port to listen on (0: any free port). Default 8080. */
  readonly port?: number;
  /** Interface to bind. Default 127.0.0.1: only this machine can connect. */
  readonly host?: string;
}

/** Start the server; resolves once it is listening, with the address it got and its job store. */
export function serve(options: ServeOptions = {}): Promise<{ server: Server; address: AddressInfo; jobs: JobStore }> {
  const { port = 8080, host = "127.0.0.1", jobs, ...limits } = options;
  // A store passed in belongs to the caller; one made here ends with the server (close() cancels its jobs).
  const store = jobs ?? createJobStore();
  const server = createServer(createRequestListener({ ...limits, jobs: store }));
  if (jobs === undefined) server.on("close", () => void store.close());
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => resolve({ server, address: server.address() as AddressInfo, jobs: store }));
  });
}

// Started directly (not imported by tests): listen where PORT and HOST say.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const port = Number(process.env.PORT ?? 8080);
  serve({ port, ...(process.env.HOST ? { host: process.env.HOST } : {}) }).then(({ address }) => {
    const host = address.family === "IPv6" ? `[${address.address}]` : address.address;
    process.stdout.write(`emquant handler on http://${host}:${address.port}\n`);
  });
}
