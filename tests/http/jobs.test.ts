// Long requests as jobs: submit, poll, fetch, cancel, and the limits that
// bound a job store's memory. Jobs are sized to run well under a second or
// two each; waits poll the store and are bounded by an iteration count, never
// by a time threshold on the work.
import { readFileSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { Validator } from "@seriousme/openapi-schema-validator";
import { Ajv2020 } from "ajv/dist/2020.js";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import {
  createHandler, createJobStore, createRequestListener, DEFAULT_JOB_LIMITS, HTTP_ERROR_CODES, openApiDocument, resolveJobLimits,
  DEFAULT_LIMITS, type HttpRequest, type HttpResponse, type JobLimits, type JobStatus, type JobStore,
} from "../../src/http/index.js";
import { ERROR_CODES } from "../../src/core/errors.js";
import { closeWorkers, poolBusy } from "../../src/tools/pool.node.js";

// CODATA 2022 vacuum electric permittivity, F/m.
const EPSILON_0 = 8.8541878188e-12;
const PLATES_TOLERANCE = { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "1 mm", percent: 5 } }, options: { samples: 5000, seed: 3 } };
const PLATES_SWEEP = { formula: "parallelPlateCapacitance", vary: { gap: { from: "0.1 mm", to: "1 mm", points: 200 } }, fixed: { area: "1 cm^2" } };
const SMALL_SWEEP = { ...PLATES_SWEEP, vary: { gap: { from: "0.1 mm", to: "1 mm", points: 50 } } };
// A formula slow enough (elliptic integrals per sample) that a job runs long enough to watch and cancel.
const COILS = { turns1: 100, radius1: 0.01, length1: 0.02, turns2: 50, radius2: 0.015, length2: 0.01 };
const coilsTolerance = (samples: number): Record<string, unknown> => ({
  formula: "coaxialCoilsMutualInductance", inputs: { ...COILS, distance: { nominal: 0.03, percent: 5 } }, options: { samples, seed: 7 },
});

const stores: JobStore[] = [];
afterAll(async () => {
  for (const s of stores) await s.close();
  await closeWorkers();
});

function setUp(limits: Partial<JobLimits> = {}): { store: JobStore; handle: (r: HttpRequest) => HttpResponse } {
  const store = createJobStore(limits);
  stores.push(store);
  return { store, handle: createHandler({ jobs: store }) };
}

const body = <T = Record<string, unknown>>(r: HttpResponse): T => r.body as T;
const errorOf = (r: HttpResponse): Record<string, unknown> => body<{ error: Record<string, unknown> }>(r).error;
const submit = (handle: (r: HttpRequest) => HttpResponse, kind: string, request: unknown): HttpResponse =>
  handle({ method: "POST", path: "/jobs", body: JSON.stringify({ kind, request }) });
const turn = (ms = 5): Promise<void> => new Promise((r) => setTimeout(r, ms));

/** Polls GET /jobs/{id} until `until` holds (at most 6000 polls), returning every status seen. */
async function poll(handle: (r: HttpRequest) => HttpResponse, url: string, until: (s: JobStatus) => boolean): Promise<JobStatus[]> {
  const seen: JobStatus[] = [];
  for (let i = 0; i < 6000; i++) {
    const r = handle({ method: "GET", path: url });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const s = body<JobStatus>(r);
    seen.push(s);
    if (until(s)) return seen;
    await turn();
  }
  return expect.fail(`job ${url} never reached the state looked for; last ${JSON.stringify(seen.at(-1))}`);
}
const finishedState = (s: JobStatus): boolean => s.state !== "queued" && s.state !== "running";

describe("jobs: submit, poll, fetch", () => {
  it("runs a tolerance job to the answer POST /tolerance gives for the same request", async () => {
    const { handle } = setUp();
    const r = submit(handle, "tolerance", PLATES_TOLERANCE);
    expect(r.status).toBe(202);
    const status = body<JobStatus>(r);
    expect(r.headers.location).toBe(status.url);
    expect(status.url).toBe(`/jobs/${status.id}`);
    expect(status.resultUrl).toBe(`/jobs/${status.id}/result`);
    expect(status).toMatchObject({ kind: "tolerance", state: "queued", progress: { fraction: 0, done: 0, total: 5000 }, elapsedSeconds: 0 });
    expect(Date.parse(status.submitted)).not.toBeNaN();
    const last = (await poll(handle, status.url, finishedState)).at(-1)!;
    expect(last).toMatchObject({ state: "done", progress: { fraction: 1 } });
    // Once started, the library's count: the corner evaluations before the Monte Carlo, then its 5000 samples.
    expect(last.progress.done).toBe(last.progress.total);
    expect(last.progress.total).toBeGreaterThanOrEqual(5000);
    expect(last.expiresInSeconds).toBeLessThanOrEqual(DEFAULT_JOB_LIMITS.keepFinishedMs / 1000);
    const result = handle({ method: "GET", path: status.resultUrl });
    expect(result.status).toBe(200);
    const sync = createHandler()({ method: "POST", path: "/tolerance", body: PLATES_TOLERANCE });
    expect(result.body).toEqual(sync.body);
    // C = epsilon_0 A / d at the nominal, with CODATA 2022 epsilon_0.
    expect(body<{ nominal: number }>(result).nominal).toBeCloseTo((EPSILON_0 * 1e-4) / 1e-3, 25);
  });

  it("runs a sweep job to the answer POST /sweep gives, and serves it while the job is kept", async () => {
    const { handle } = setUp();
    const status = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    expect(status.progress.total).toBe(200);
    await poll(handle, status.url, finishedState);
    const result = handle({ method: "GET", path: status.resultUrl });
    expect(result.status).toBe(200);
    expect(result.body).toEqual(createHandler()({ method: "POST", path: "/sweep", body: PLATES_SWEEP }).body);
    // Fetched twice, the same answer: a result is kept, not handed out once.
    expect(handle({ method: "GET", path: status.resultUrl }).body).toEqual(result.body);
    const values = body<{ output: { values: number[] } }>(result).output.values;
    expect(values[0]).toBeCloseTo((EPSILON_0 * 1e-4) / 1e-4, 23);
  });

  it("checks a job when submitted, as the synchronous route does, and holds nothing for a refused one", () => {
    const { store, handle } = setUp({ maxSamples: 1000, maxSweepPoints: 50 });
    expect(errorOf(submit(handle, "columns", {}))).toMatchObject({ code: "bad_request", input: "kind" });
    expect(errorOf(submit(handle, "sweep", "gap"))).toMatchObject({ code: "bad_request", input: "request" });
    expect(errorOf(handle({ method: "POST", path: "/jobs", body: { kind: "sweep", request: PLATES_SWEEP, priority: 1 } }))).toMatchObject({ code: "bad_request", input: "priority" });
    expect(errorOf(handle({ method: "POST", path: "/jobs", body: "{ not json" })).code).toBe("bad_json");
    const wrong = { formula: "parallelPlateCapacitance", inputs: { area: "1 kg", gap: { nominal: "1 mm", percent: 5 } } };
    const refused = submit(handle, "tolerance", wrong);
    expect(refused.status).toBe(422);
    expect(refused.body).toEqual(createHandler()({ method: "POST", path: "/tolerance", body: wrong }).body);
    expect(errorOf(refused)).toMatchObject({ code: "wrong_dimension", input: "area" });
    expect(errorOf(submit(handle, "tolerance", { ...PLATES_TOLERANCE, options: { samples: 1001 } }))).toMatchObject({ code: "over_limit", input: "samples", limit: 1000 });
    expect(errorOf(submit(handle, "sweep", PLATES_SWEEP))).toMatchObject({ code: "over_limit", input: "points", limit: 50 });
    const small = SMALL_SWEEP;
    expect(errorOf(submit(handle, "sweep", { ...small, formula: "noSuchFormula" }))).toMatchObject({ code: "unknown_formula" });
    expect(errorOf(submit(handle, "sweep", { ...small, vary: { gap: small.vary.gap, area: { from: 1, to: 2, points: 1 }, distance: { from: 1, to: 2, points: 1 } } }))).toMatchObject({ code: "invalid_argument", input: "vary" });
    expect(store.counts()).toEqual({ queued: 0, running: 0, finished: 0 });
  });
});

describe("jobs: limits and forgetting", () => {
  it("refuses more unfinished jobs than maxJobs with 503 too_many_jobs, and takes one again once there is room", async () => {
    const { store, handle } = setUp({ maxJobs: 2, maxRunningJobs: 1 });
    const a = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    const b = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    const c = submit(handle, "tolerance", PLATES_TOLERANCE);
    expect(c.status).toBe(503);
    expect(errorOf(c)).toMatchObject({ code: "too_many_jobs", limit: 2 });
    expect(store.counts().queued + store.counts().running).toBe(2);
    // A queued job cancelled: gone from the queue at once, never computed.
    const cancelled = handle({ method: "DELETE", path: b.url });
    expect(body<JobStatus>(cancelled)).toMatchObject({ state: "cancelled", progress: { done: 0 } });
    expect(errorOf(handle({ method: "GET", path: b.resultUrl }))).toMatchObject({ code: "job_cancelled" });
    expect(submit(handle, "tolerance", PLATES_TOLERANCE).status).toBe(202);
    await store.idle();
    expect(body<JobStatus>(handle({ method: "GET", path: a.url })).state).toBe("done");
    expect(store.counts()).toEqual({ queued: 0, running: 0, finished: 3 });
  });

  it("answers 409 job_not_done for the result of a job still queued or running", async () => {
    const { store, handle } = setUp({ maxRunningJobs: 1 });
    const first = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    const second = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    expect(body<JobStatus>(handle({ method: "GET", path: second.url })).state).toBe("queued");
    const early = handle({ method: "GET", path: second.resultUrl });
    expect(early.status).toBe(409);
    expect(errorOf(early)).toMatchObject({ code: "job_not_done" });
    await store.idle();
    expect(handle({ method: "GET", path: first.resultUrl }).status).toBe(200);
    expect(handle({ method: "GET", path: second.resultUrl }).status).toBe(200);
  });

  it("fails a job whose result is over maxResultBytes with result_too_large, and keeps no result", async () => {
    const { store, handle } = setUp({ maxResultBytes: 2000 });
    const status = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    await store.idle();
    const failed = body<JobStatus>(handle({ method: "GET", path: status.url }));
    expect(failed).toMatchObject({ state: "failed", error: { code: "result_too_large", input: "maxResultBytes", limit: 2000 } });
    const r = handle({ method: "GET", path: status.resultUrl });
    expect(r.status).toBe(422);
    expect(errorOf(r)).toMatchObject({ code: "result_too_large", limit: 2000 });
    // The same sweep's answer is over 2000 bytes of JSON: the refusal is not spurious.
    expect(JSON.stringify(createHandler()({ method: "POST", path: "/sweep", body: PLATES_SWEEP }).body).length).toBeGreaterThan(2000);
  });

  it("forgets a finished job after keepFinishedMs, answering 410 job_gone", async () => {
    const { store, handle } = setUp({ keepFinishedMs: 1 });
    const status = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    await store.idle();
    await turn(20);
    for (const path of [status.url, status.resultUrl]) {
      const r = handle({ method: "GET", path });
      expect(r.status, path).toBe(410);
      expect(errorOf(r).code).toBe("job_gone");
    }
    expect(store.counts().finished).toBe(0);
  });

  it("keeps at most maxFinishedJobs, forgetting the one that finished first, and forgets a finished job on DELETE", async () => {
    const { store, handle } = setUp({ maxFinishedJobs: 1 });
    const first = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    await store.idle();
    const second = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    await store.idle();
    expect(errorOf(handle({ method: "GET", path: first.resultUrl })).code).toBe("job_gone");
    expect(handle({ method: "GET", path: second.resultUrl }).status).toBe(200);
    const deleted = handle({ method: "DELETE", path: second.url });
    expect(deleted.status).toBe(200);
    expect(body<JobStatus>(deleted).state).toBe("done");
    expect(handle({ method: "GET", path: second.url }).status).toBe(410);
    expect(store.counts().finished).toBe(0);
  });

  it("answers 404 unknown_job for an id it never gave, 400 for a bad escape, 405 for a wrong method", () => {
    const { handle } = setUp();
    const given = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP)).id;
    // Well formed, but numbered past every job this store has given.
    const future = `zzzzzz-${given.split("-")[1]}`;
    for (const id of ["nope", future, "x".repeat(5000), "..%2F..%2Fformulas", "%20"]) {
      for (const [method, path] of [["GET", `/jobs/${id}`], ["DELETE", `/jobs/${id}`], ["GET", `/jobs/${id}/result`]] as const) {
        const r = handle({ method, path });
        expect(r.status, `${method} ${path.slice(0, 40)}`).toBe(404);
        expect(["unknown_job", "not_found"]).toContain(errorOf(r).code);
      }
    }
    expect(errorOf(handle({ method: "GET", path: "/jobs/nope" })).code).toBe("unknown_job");
    expect(errorOf(handle({ method: "GET", path: "/jobs/%ZZ" })).code).toBe("bad_escape");
    expect(errorOf(handle({ method: "GET", path: `/jobs/${given}/other` })).code).toBe("not_found");
    const put = handle({ method: "PUT", path: `/jobs/${given}` });
    expect(put.status).toBe(405);
    expect(put.headers.allow).toBe("GET, DELETE");
    expect(handle({ method: "GET", path: "/jobs" }).headers.allow).toBe("POST");
    expect(handle({ method: "POST", path: `/jobs/${given}/result` }).headers.allow).toBe("GET");
    // Without a store there are no job routes.
    expect(errorOf(createHandler()({ method: "POST", path: "/jobs", body: { kind: "sweep", request: PLATES_SWEEP } })).code).toBe("not_found");
  });

  it("closes: cancels every job, computes nothing more, and answers 503 shutting_down after", async () => {
    const { store, handle } = setUp({ maxRunningJobs: 1 });
    const a = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    submit(handle, "tolerance", PLATES_TOLERANCE);
    await store.close();
    expect(store.counts()).toEqual({ queued: 0, running: 0, finished: 0 });
    expect(errorOf(handle({ method: "GET", path: a.url }))).toMatchObject({ code: "shutting_down" });
    const late = submit(handle, "sweep", PLATES_SWEEP);
    expect(late.status).toBe(503);
    expect(errorOf(late).code).toBe("shutting_down");
  });

  it("checks its limits and its store when created", () => {
    expect(resolveJobLimits()).toEqual(DEFAULT_JOB_LIMITS);
    expect(() => createJobStore({ maxJobs: 0 })).toThrow(RangeError);
    expect(() => createJobStore({ keepFinishedMs: 1.5 })).toThrow(RangeError);
    expect(() => createJobStore({ maxSamples: 1e6 + 1 })).toThrow(RangeError);
    expect(() => createJobStore({ queue: 3 } as never)).toThrow(/unknown job limit/);
    expect(() => createHandler({ jobs: {} as JobStore })).toThrow(RangeError);
    for (const code of ["unknown_job", "job_gone", "job_not_done", "job_cancelled", "result_too_large", "too_many_jobs", "shutting_down"]) {
      expect(HTTP_ERROR_CODES).toContain(code);
    }
  });
});

describe("jobs: hostile requests", () => {
  it("never answers 500 for random job requests, ids and methods, and every error is coded", async () => {
    const { store, handle } = setUp({ maxJobs: 4, maxSweepPoints: 100, maxSamples: 500 });
    const codes = new Set<string>([...ERROR_CODES, ...HTTP_ERROR_CODES.filter((c) => c !== "internal")]);
    const given: string[] = [];
    const request = fc.oneof(
      fc.jsonValue({ maxDepth: 3 }),
      fc.constantFrom<unknown>(PLATES_SWEEP, PLATES_TOLERANCE, { ...PLATES_TOLERANCE, options: { samples: 501 } }, { ...PLATES_TOLERANCE, options: "many" }),
      fc.record({ formula: fc.constantFrom("parallelPlateCapacitance", "x", 5), vary: fc.jsonValue({ maxDepth: 2 }), inputs: fc.jsonValue({ maxDepth: 2 }), options: fc.jsonValue({ maxDepth: 1 }) }),
    );
    const submission = fc.oneof(
      fc.record({ kind: fc.constantFrom<unknown>("sweep", "tolerance", "columns", 1, null), request }, { requiredKeys: [] }),
      fc.constantFrom({ kind: "sweep", request: SMALL_SWEEP }, { kind: "tolerance", request: { ...PLATES_TOLERANCE, options: { samples: 200 } } }),
    ).map((b) => JSON.stringify(b));
    const id = fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom("%ZZ", "%2F", "..", "__proto__", "constructor", "0-000000000000000000000000"), fc.nat({ max: 50 }).map((i) => given[i] ?? "x"));
    const call = fc.oneof(
      fc.record({ method: fc.constant("POST"), path: fc.constant("/jobs"), body: fc.oneof(submission, fc.string({ maxLength: 20 })) }),
      fc.record({ method: fc.constantFrom("GET", "DELETE", "PUT", "POST", ""), path: fc.tuple(id, fc.constantFrom("", "/result", "/x")).map(([i, tail]) => `/jobs/${i}${tail}`), body: fc.constant(undefined) }),
    );
    await fc.assert(
      fc.asyncProperty(call, async (c) => {
        const r = handle(c);
        expect(r.status, `${c.method} ${c.path} ${c.body}`).not.toBe(500);
        if (r.status === 202) given.push(body<JobStatus>(r).id);
        if (r.status >= 400) expect(codes.has(errorOf(r).code as string), `${c.method} ${c.path} ${c.body}`).toBe(true);
        expect(JSON.parse(JSON.stringify(r.body))).toEqual(r.body);
        // Now and then let the jobs run, so later calls meet running and finished ones.
        if (given.length % 3 === 0) await turn(1);
      }),
      { numRuns: 300, seed: 18 },
    );
    await store.idle();
    // The cases reached accepted jobs, not only refusals.
    expect(given.length).toBeGreaterThan(5);
    // Every job accepted ended in a known state with a coded error where it failed.
    for (const jobId of given) {
      const r = handle({ method: "GET", path: `/jobs/${jobId}` });
      if (r.status !== 200) continue;
      const s = body<JobStatus>(r);
      expect(["done", "failed", "cancelled"]).toContain(s.state);
      if (s.state === "failed") expect(codes.has(String(s.error!.code))).toBe(true);
    }
  });
});

describe("jobs: progress and cancellation through the library's signal", () => {
  it("reports progress that never goes back and ends at 1", async () => {
    const { handle } = setUp();
    const status = body<JobStatus>(submit(handle, "tolerance", coilsTolerance(12_000)));
    const seen = await poll(handle, status.url, finishedState);
    const last = seen.at(-1)!;
    expect(last).toMatchObject({ state: "done", progress: { fraction: 1 } });
    expect(last.progress.done).toBe(last.progress.total);
    const back: string[] = [];
    for (let i = 1; i < seen.length; i++) {
      const [p, q] = [seen[i - 1]!, seen[i]!];
      if (q.progress.fraction < p.progress.fraction || q.progress.done < p.progress.done || q.elapsedSeconds < p.elapsedSeconds) back.push(`${i}: ${JSON.stringify(p)} -> ${JSON.stringify(q)}`);
    }
    expect(back).toEqual([]);
    // Reported along the way, not only at the end.
    expect(seen.some((s) => s.state === "running" && s.progress.fraction > 0 && s.progress.fraction < 1)).toBe(true);
  });

  it("cancels mid-run: the library call stops early, the job is cancelled with no result, and nothing keeps computing", async () => {
    // 1e6 samples of the coils: minutes of work on the worker pool if it were not stopped.
    const { store, handle } = setUp({ workers: 1 });
    const status = body<JobStatus>(submit(handle, "tolerance", coilsTolerance(1_000_000)));
    await poll(handle, status.url, (s) => s.state === "running" && s.progress.done > 0);
    const cancelled = handle({ method: "DELETE", path: status.url });
    expect(cancelled.status).toBe(200);
    expect(body<JobStatus>(cancelled).state).toBe("cancelled");
    await store.idle();
    expect(store.counts().running).toBe(0);
    expect(poolBusy()).toBe(0);
    const after = body<JobStatus>(handle({ method: "GET", path: status.url }));
    expect(after.state).toBe("cancelled");
    // Where the work stopped: short of the end (a call that ignored the abort would report fraction 1).
    expect(after.progress.fraction).toBeLessThan(1);
    expect(errorOf(handle({ method: "GET", path: status.resultUrl }))).toMatchObject({ code: "job_cancelled" });
    // The pool is free: a new job runs to the end.
    const next = body<JobStatus>(submit(handle, "tolerance", PLATES_TOLERANCE));
    await store.idle();
    expect(body<JobStatus>(handle({ method: "GET", path: next.url })).state).toBe("done");
  });
});

describe("jobs over node:http and in the OpenAPI document", () => {
  it("submits, polls, fetches and deletes over loopback", async () => {
    const store = createJobStore();
    stores.push(store);
    const server = createServer(createRequestListener({ jobs: store }));
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const res = await fetch(`${base}/jobs`, { method: "POST", body: JSON.stringify({ kind: "tolerance", request: PLATES_TOLERANCE }) });
      expect(res.status).toBe(202);
      const location = res.headers.get("location")!;
      expect(location).toMatch(/^\/jobs\//);
      await res.json();
      let state = "queued";
      for (let i = 0; i < 2000 && (state === "queued" || state === "running"); i++) {
        await turn();
        state = ((await (await fetch(`${base}${location}`)).json()) as JobStatus).state;
      }
      expect(state).toBe("done");
      const result = await fetch(`${base}${location}/result`);
      expect(result.status).toBe(200);
      expect(await result.json()).toEqual(createHandler()({ method: "POST", path: "/tolerance", body: PLATES_TOLERANCE }).body);
      expect((await fetch(`${base}${location}`, { method: "DELETE" })).status).toBe(200);
      const gone = await fetch(`${base}${location}`);
      expect(gone.status).toBe(410);
      expect(((await gone.json()) as { error: { code: string } }).error.code).toBe("job_gone");
    } finally {
      await new Promise<void>((resolve) => server.close(() => resolve()));
    }
  });

  it("is described by the OpenAPI document when the handler has a store, with the store's limits as bounds", async () => {
    const { store, handle } = setUp({ maxSweepPoints: 300 });
    const doc = body(handle({ method: "GET", path: "/openapi.json" }));
    expect(doc).toEqual(openApiDocument(DEFAULT_LIMITS, store.limits));
    const result = await new Validator().validate(structuredClone(doc) as never);
    expect(result.errors).toBeUndefined();
    expect(Object.keys((openApiDocument() as { paths: object }).paths)).not.toContain("/jobs");
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    ajv.addSchema({ $id: "jobs", components: (doc as { components: unknown }).components });
    const check = (name: string, value: unknown): string[] => {
      const validate = ajv.getSchema(`jobs#/components/schemas/${name}`)!;
      return validate(value) ? [] : (validate.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
    };
    expect(check("JobSubmission", { kind: "sweep", request: PLATES_SWEEP })).toEqual([]);
    expect(check("JobSubmission", { kind: "sweep", request: { ...PLATES_SWEEP, vary: { gap: { from: 1, to: 2, points: 301 } } } })).not.toEqual([]);
    expect(check("JobSubmission", { kind: "columns", request: {} })).not.toEqual([]);
    const submitted = submit(handle, "sweep", PLATES_SWEEP);
    expect(check("JobStatus", submitted.body)).toEqual([]);
    await store.idle();
    const url = body<JobStatus>(submitted).url;
    expect(check("JobStatus", handle({ method: "GET", path: url }).body)).toEqual([]);
    expect(check("SweepResult", handle({ method: "GET", path: `${url}/result` }).body)).toEqual([]);
    expect(check("Error", handle({ method: "GET", path: "/jobs/nope" }).body)).toEqual([]);
  });
});

describe("README \"Long requests as jobs\"", () => {
  const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
  const section = readme.slice(readme.indexOf("### Long requests as jobs"), readme.indexOf("## In a browser"));
  const table = (first: string): string[][] => {
    const lines = section.split("\n");
    const start = lines.findIndex((l) => l.startsWith(`| ${first} |`));
    expect(start, first).toBeGreaterThan(0);
    const rows: string[][] = [];
    for (let i = start + 2; i < lines.length && lines[i]!.startsWith("|"); i++) rows.push(lines[i]!.split("|").slice(1, -1).map((c) => c.trim()));
    return rows;
  };

  it("states the default job limits", () => {
    const rows = table("Job limit");
    expect(Object.fromEntries(rows.map(([name, value]) => [name!.replace(/`/g, ""), Number(value)]))).toEqual({ ...DEFAULT_JOB_LIMITS });
  });

  it("lists the job routes the OpenAPI document describes", () => {
    const routes = table("Job route").map(([r]) => r!.match(/`(?:GET|POST|DELETE) (\/[^` ]*)`/)![1]!);
    const withJobs = Object.keys((openApiDocument(DEFAULT_LIMITS, DEFAULT_JOB_LIMITS) as { paths: object }).paths);
    const without = Object.keys((openApiDocument() as { paths: object }).paths);
    expect(new Set(routes)).toEqual(new Set(withJobs.filter((p) => !without.includes(p))));
  });

  it("lists every job error code with the status the handler gives", async () => {
    const rows = table("Job status");
    const documented = new Map(rows.map(([status, code]) => [code!.replace(/`/g, ""), Number(status)]));
    const { store, handle } = setUp({ maxJobs: 1, maxResultBytes: 100, keepFinishedMs: 60_000 });
    const seen = new Map<string, number>();
    const note = (r: HttpResponse): void => void seen.set(errorOf(r).code as string, r.status);
    note(handle({ method: "GET", path: "/jobs/nope" }));
    const big = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    note(handle({ method: "GET", path: big.resultUrl }));
    note(submit(handle, "sweep", PLATES_SWEEP));
    await store.idle();
    note(handle({ method: "GET", path: big.resultUrl }));
    const queued = body<JobStatus>(submit(handle, "sweep", PLATES_SWEEP));
    handle({ method: "DELETE", path: queued.url });
    note(handle({ method: "GET", path: queued.resultUrl }));
    handle({ method: "DELETE", path: queued.url });
    note(handle({ method: "GET", path: queued.url }));
    await store.close();
    note(handle({ method: "GET", path: queued.url }));
    expect(seen).toEqual(documented);
  });
});
