/**
 * A JSON backend on node:http with no framework: the `emquant/http` request
 * listener (routes, limits and status codes are documented in src/http/index.ts
 * and README "In a backend"), bound to the loopback interface unless told otherwise.
 *
 * Run: npm run serve                         http://127.0.0.1:8080
 *      PORT=9000 HOST=0.0.0.0 npm run serve   every interface: put it behind a proxy you trust
 */
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { createRequestListener, type HandlerOptions } from "../src/http/index.js";

export interface ServeOptions extends HandlerOptions {
  /** Port to listen on (0: any free port). Default 8080. */
  readonly port?: number;
  /** Interface to bind. Default 127.0.0.1: only this machine can connect. */
  readonly host?: string;
}

/** Start the server; resolves once it is listening, with the address it got. */
export function serve(options: ServeOptions = {}): Promise<{ server: Server; address: AddressInfo }> {
  const { port = 8080, host = "127.0.0.1", ...limits } = options;
  const server = createServer(createRequestListener(limits));
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => resolve({ server, address: server.address() as AddressInfo }));
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
