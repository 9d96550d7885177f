/**
 * Fuzz: the emquant/http request listener in process (fuzz-http.ts) with hostile
 * URLs (bad percent-escapes), bodies (bad JSON, 1e400, deep nesting,
 * prototype keys) and methods. Never 500; 4xx with a JSON error body for user
 * input; 2xx bodies whose numbers are all finite.
 */
import { describe, it } from "vitest";
import { driveHttp, expectClean, newDrive } from "./fuzz-drive.js";
import { CASES } from "./fuzz-runners.js";

const http = newDrive();

describe("fuzz: the emquant/http request listener", () => {
  it(`${CASES.http} requests: 2xx with finite JSON or 4xx with a JSON error, never 500`, async () => {
    await driveHttp(http, CASES.http);
    expectClean(http, CASES.http);
  });
});

