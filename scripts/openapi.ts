// Writes the OpenAPI 3.1 document of emquant/http (default limits) to a file:
//   npm run openapi                  -> out/openapi.json
//   npm run openapi -- path/to.json  -> that file
// The document is generated from the registry by src/http/openapi.ts; a running
// handler serves the same document (with its own limits) at GET /openapi.json.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { openApiDocument } from "../src/http/openapi.js";

const target = resolve(process.argv[2] ?? resolve(import.meta.dirname, "../out/openapi.json"));
mkdirSync(dirname(target), { recursive: true });
writeFileSync(target, `${JSON.stringify(openApiDocument(), null, 2)}\n`);
console.log(`wrote ${target}`);
