// A small static file server for the built page (out/web), on 127.0.0.1 and a
// free port. Serves files under the root only; anything else is 404.
import { readFile } from "node:fs/promises";
import { createServer, type Server } from "node:http";
import { extname, join, normalize, sep } from "node:path";

const TYPES: Readonly<Record<string, string>> = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".svg": "image/svg+xml",
  ".json": "application/json",
  ".map": "application/json",
};

export async function serveStatic(root: string): Promise<{ url: string; close: () => Promise<void> }> {
  const base = normalize(root + sep);
  const server: Server = createServer((req, res) => {
    void (async () => {
      let path: string;
      try {
        path = decodeURIComponent(new URL(req.url ?? "/", "http://127.0.0.1").pathname);
      } catch {
        res.writeHead(400).end();
        return;
      }
      const file = normalize(join(base, path.endsWith("/") ? `${path}index.html` : path));
      if (!file.startsWith(base)) {
        res.writeHead(404).end();
        return;
      }
      try {
        const body = await readFile(file);
        res.writeHead(200, { "content-type": TYPES[extname(file)] ?? "application/octet-stream" }).end(body);
      } catch {
        res.writeHead(404).end();
      }
    })();
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const address = server.address();
  if (address === null || typeof address === "string") throw new Error("no port");
  return {
    url: `http://127.0.0.1:${address.port}/`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
