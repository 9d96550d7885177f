/**
 * Long requests as jobs: a sweep or a tolerance analysis too large for a
 * synchronous answer is submitted, polled for its progress, fetched once done,
 * or cancelled. The store is an object its owner creates with
 * `createJobStore(limits)`, passes to `createHandler({ jobs })` (or
 * `createRequestListener`) and closes with `close()`, which cancels every job.
 *
 * The work runs through the library's asynchronous entries (`sweepParallel`,
 * `toleranceParallel`): on the worker pool above their thresholds, in this
 * thread below them, yielding between chunks, so the server keeps answering
 * while a job runs. Each job carries an AbortController: cancelling aborts the
 * library call, which ends within one chunk and leaves no pool task running.
 *
 * Memory is bounded by the limits, never by the traffic: at most `maxJobs`
 * jobs held unfinished (each holding its request, within the body limit), at
 * most `maxFinishedJobs` finished ones, each result at most `maxResultBytes`
 * of JSON; a finished job is forgotten `keepFinishedMs` after it ends. A
 * result over the size limit is refused (the job fails with
 * `result_too_large`), not streamed: a job's result is kept for clients that
 * poll and fetch it later, so a result too large to answer in one body is too
 * large to keep, and refusing it keeps every answer a plain JSON value that
 * any framework can send (a stream would need each adapter to support one).
 */
import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, nextTurn, type Progress } from "../core/progress.js";
import { type ParallelOptions, sweepParallel, toleranceParallel } from "../tools/parallel.js";
import { planShards } from "../tools/shards.js";
import type { SweepSpec } from "../tools/sweep.js";
import type { ToleranceOptions, ToleranceValue } from "../tools/tolerance.js";
import { wholeNumbers } from "./limits.js";
import { formulaErrorBody, HttpError, httpErrorBody, isObject } from "./refusal.js";
import { checkSweep, checkTolerance, sweepAnswer } from "./requests.js";

/** The kinds of work a job runs: the body of `POST /jobs` is `{ kind, request }`, request as the route of that name takes it. */
export const JOB_KINDS = ["sweep", "tolerance"] as const;
export type JobKind = (typeof JOB_KINDS)[number];

/** Where a job is: waiting its turn, computing, or finished one of three ways. */
export type JobState = "queued" | "running" | "done" | "failed" | "cancelled";

/** How many jobs a store holds and how large each may be. */
export interface JobLimits {
  /** Most jobs not yet finished (queued and running together, default 8); a submission beyond is 503 `too_many_jobs`. */
  readonly maxJobs: number;
  /** Most jobs computing at once (default 1: one job already uses every core through the worker pool); the rest wait in order. */
  readonly maxRunningJobs: number;
  /** Most finished jobs kept with their results (default 8); the one that finished first is forgotten first. */
  readonly maxFinishedJobs: number;
  /** How long a finished job is kept after it ends, ms (default 600000, ten minutes); then its id answers 410 `job_gone`. */
  readonly keepFinishedMs: number;
  /** Largest result kept, in bytes of its JSON (default 16 MiB); a larger result fails the job with `result_too_large`. */
  readonly maxResultBytes: number;
  /** Largest Monte Carlo sample count of a tolerance job (default 1e6, the library's own limit). */
  readonly maxSamples: number;
  /** Most toleranced inputs whose 2^n corners a tolerance job evaluates (default 12, the library default; the corners are computed before the Monte Carlo, in the calling thread). */
  readonly maxCornerInputs: number;
  /** Most grid points of a sweep job, both axes together (default 250000: about 6 MB of JSON for a scalar output). */
  readonly maxSweepPoints: number;
  /** Worker threads per job: 0 for the library's default (the cores Node reports), else 1 to 64. */
  readonly workers: number;
}

/** The defaults. Finished results take at most maxFinishedJobs x maxResultBytes (128 MiB of JSON) at once. */
export const DEFAULT_JOB_LIMITS: JobLimits = Object.freeze({
  maxJobs: 8,
  maxRunningJobs: 1,
  maxFinishedJobs: 8,
  keepFinishedMs: 600_000,
  maxResultBytes: 16 * 1024 * 1024,
  maxSamples: 1_000_000,
  maxCornerInputs: 12,
  maxSweepPoints: 250_000,
  workers: 0,
});

const JOB_CEILINGS: Record<keyof JobLimits, number> = {
  maxJobs: 10_000,
  maxRunningJobs: 64,
  maxFinishedJobs: 10_000,
  keepFinishedMs: 7 * 24 * 3600 * 1000,
  maxResultBytes: 2 ** 30,
  maxSamples: 1e6,
  maxCornerInputs: 16,
  maxSweepPoints: 4_000_000,
  workers: 64,
};

/**
 * The job limits in force: the defaults with the options given, each checked
 * to be a whole number within what the library accepts (maxJobs and
 * maxRunningJobs at least 1), so a bad configuration fails at start-up.
 */
export function resolveJobLimits(options: Partial<JobLimits> = {}): JobLimits {
  return wholeNumbers("job limit", DEFAULT_JOB_LIMITS, JOB_CEILINGS, options, { maxJobs: 1, maxRunningJobs: 1 });
}

/** A job as `GET /jobs/{id}` answers it. */
export interface JobStatus {
  readonly id: string;
  readonly kind: JobKind;
  readonly state: JobState;
  /**
   * How far the work got, as the library reports it at most every 100 ms:
   * items done of total, in the library call's own count (grid points; for a
   * tolerance analysis, its corner evaluations then its Monte Carlo samples),
   * which it gives once the job starts; while queued, total is the points or
   * samples asked for. Fraction and done never decrease; fraction 1 once
   * done. For a cancelled job, where it stopped.
   */
  readonly progress: Progress;
  /** Seconds spent computing so far (0 while queued), to the millisecond. */
  readonly elapsedSeconds: number;
  /** When the job was submitted (ISO 8601, UTC). */
  readonly submitted: string;
  /** For a finished job: seconds until it is forgotten. */
  readonly expiresInSeconds?: number;
  /** This status, relative to where the handler is mounted: /jobs/{id}. */
  readonly url: string;
  /** The result: /jobs/{id}/result. */
  readonly resultUrl: string;
  /** For a failed job: why, as the synchronous route would have answered. */
  readonly error?: Readonly<Record<string, unknown>>;
}

/** What the store's owner sees and does. */
export interface JobStore {
  /** The limits in force. */
  readonly limits: JobLimits;
  /** Jobs now waiting, computing (a cancelled job counts until its library call has ended), and finished jobs kept. */
  counts(): { readonly queued: number; readonly running: number; readonly finished: number };
  /** Resolves once no job is computing (every library call has ended). */
  idle(): Promise<void>;
  /**
   * Cancels every queued and running job, refuses new ones (503
   * `shutting_down`), forgets every job and resolves once every library call
   * has ended. Call it when the server stops.
   */
  close(): Promise<void>;
}

/** A failure as an answer: the status and the error body the synchronous route gives. */
interface Failure {
  readonly status: number;
  readonly error: Readonly<Record<string, unknown>>;
}

interface Job {
  readonly id: string;
  readonly kind: JobKind;
  readonly submittedAt: number;
  readonly controller: AbortController;
  /** The library call, until it starts. */
  run: ((options: LongRunOptions) => Promise<unknown>) | undefined;
  state: JobState;
  progress: Progress;
  startedAt: number | undefined;
  finishedAt: number | undefined;
  result: unknown;
  failure: Failure | undefined;
}

const ID = /^([0-9a-z]{1,10})-([0-9a-f]{24})$/;

function randomHex(bytes: number): string {
  const b = new Uint8Array(bytes);
  globalThis.crypto.getRandomValues(b);
  let s = "";
  for (const x of b) s += x.toString(16).padStart(2, "0");
  return s;
}

/** Bytes of `text` in UTF-8, counted exactly only when the quick bound (3 per UTF-16 unit) is over `limit`. */
function utf8Over(text: string, limit: number): boolean {
  return text.length > limit || (text.length * 3 > limit && new TextEncoder().encode(text).length > limit);
}

/** The store's operations the handler calls; not public API (the routes are). */
export interface JobRoutes {
  submit(body: Record<string, unknown>): JobStatus;
  status(id: string): JobStatus;
  result(id: string): { status: number; body: unknown };
  cancel(id: string): JobStatus;
}

const ROUTES = new WeakMap<JobStore, JobRoutes>();

/** The handler's way into a store made by createJobStore (undefined for anything else). */
export function jobRoutes(store: unknown): JobRoutes | undefined {
  return typeof store === "object" && store !== null ? ROUTES.get(store as JobStore) : undefined;
}

/**
 * A job store for `createHandler({ jobs })`: holds, runs and forgets jobs
 * within the limits (a bad limit throws a RangeError at once). The caller owns
 * it: `close()` it when the server stops.
 *
 * @example
 * const jobs = createJobStore({ maxJobs: 4 });
 * const server = createServer(createRequestListener({ jobs }));
 * server.on("close", () => void jobs.close());
 */
export function createJobStore(options: Partial<JobLimits> = {}): JobStore {
  const limits = resolveJobLimits(options);
  const jobs = new Map<string, Job>();
  const queue: Job[] = [];
  /** Jobs whose library call has not ended (running, or cancelled and winding down). */
  const active = new Map<Job, Promise<void>>();
  /** Finished jobs in the order they finished: the first is the first to go. */
  const finished = new Map<string, Job>();
  let nextSeq = 0;
  let closed = false;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let timerAt = Infinity;

  const statusOf = (job: Job, now = Date.now()): JobStatus => {
    const url = `/jobs/${job.id}`;
    const end = job.finishedAt ?? now;
    return {
      id: job.id,
      kind: job.kind,
      state: job.state,
      progress: { ...job.progress },
      elapsedSeconds: job.startedAt === undefined ? 0 : Math.max(0, end - job.startedAt) / 1000,
      submitted: new Date(job.submittedAt).toISOString(),
      ...(job.finishedAt !== undefined ? { expiresInSeconds: Math.max(0, job.finishedAt + limits.keepFinishedMs - now) / 1000 } : {}),
      url,
      resultUrl: `${url}/result`,
      ...(job.state === "failed" && job.failure ? { error: job.failure.error } : {}),
    };
  };

  /** Forgets finished jobs past their time, and arms one timer for the next (it never keeps a process alive). */
  const expire = (now = Date.now()): void => {
    for (const job of finished.values()) {
      if (job.finishedAt! + limits.keepFinishedMs > now) break;
      forget(job);
    }
    const first = finished.values().next();
    const at = first.done ? Infinity : first.value.finishedAt! + limits.keepFinishedMs;
    if (at === timerAt) return;
    if (timer !== undefined) clearTimeout(timer);
    timer = undefined;
    timerAt = at;
    if (at === Infinity) return;
    timer = setTimeout(() => {
      timer = undefined;
      timerAt = Infinity;
      expire();
    }, Math.max(0, at - now) + 1);
    (timer as { unref?: () => void }).unref?.();
  };

  const forget = (job: Job): void => {
    finished.delete(job.id);
    jobs.delete(job.id);
    job.result = undefined;
  };

  const finish = (job: Job, state: "done" | "failed" | "cancelled"): void => {
    job.state = state;
    job.finishedAt = Date.now();
    job.run = undefined;
    finished.set(job.id, job);
    // Over the count: the job that finished first goes first.
    for (const old of finished.values()) {
      if (finished.size <= limits.maxFinishedJobs) break;
      forget(old);
    }
    expire(job.finishedAt);
  };

  /** The answer a failed library call gives, as the synchronous route gives it. */
  const failureOf = (e: unknown): Failure => {
    if (e instanceof HttpError) return { status: e.status, error: httpErrorBody(e) };
    if (e instanceof FormulaError) return { status: 422, error: formulaErrorBody(e) };
    return { status: 500, error: { code: "internal", message: "internal error", input: null } };
  };

  const settle = (job: Job, outcome: { value: unknown } | { error: unknown }): void => {
    // Cancelled while the call wound down: whatever it returned is dropped.
    if (job.state !== "running") return;
    if ("error" in outcome) {
      if (outcome.error instanceof FormulaError && outcome.error.code === "cancelled") {
        finish(job, "cancelled");
        return;
      }
      job.failure = failureOf(outcome.error);
      finish(job, "failed");
      return;
    }
    // Measured once, as the JSON a client would receive.
    const text = JSON.stringify(outcome.value);
    if (utf8Over(text, limits.maxResultBytes)) {
      const e = new HttpError(422, "result_too_large", `the result is over this server's limit of ${limits.maxResultBytes} bytes of JSON; ask for fewer points or samples`, "maxResultBytes", limits.maxResultBytes);
      job.failure = failureOf(e);
      finish(job, "failed");
      return;
    }
    job.result = outcome.value;
    job.progress = { fraction: 1, done: job.progress.total, total: job.progress.total };
    finish(job, "done");
  };

  const start = (job: Job): void => {
    const run = job.run!;
    job.run = undefined;
    const onProgress = (p: Progress): void => {
      // Counts never go back, and keep coming until the call ends: a
      // cancelled job shows where it stopped.
      const done = Math.max(job.progress.done, p.done);
      job.progress = { fraction: Math.max(job.progress.fraction, p.fraction), done, total: p.total };
    };
    const work = (async (): Promise<void> => {
      // Started on the next turn, so the submission is answered first; it holds its slot meanwhile.
      await nextTurn();
      // Cancelled (or the store closed) before it began.
      if (job.state !== "queued") return;
      job.state = "running";
      job.startedAt = Date.now();
      let outcome: { value: unknown } | { error: unknown };
      try {
        outcome = { value: await run({ signal: job.controller.signal, onProgress }) };
      } catch (error) {
        outcome = { error };
      }
      settle(job, outcome);
    })().finally(() => {
      active.delete(job);
      pump();
    });
    active.set(job, work);
  };

  const pump = (): void => {
    while (!closed && active.size < limits.maxRunningJobs && queue.length > 0) start(queue.shift()!);
  };

  const find = (id: string): Job => {
    if (closed) throw shuttingDown();
    expire();
    const job = jobs.get(id);
    if (job !== undefined) return job;
    const m = ID.exec(id);
    if (m && Number.parseInt(m[1]!, 36) < nextSeq) {
      throw new HttpError(410, "job_gone", `job ${id} is no longer kept: finished jobs are kept ${limits.keepFinishedMs / 1000} s, at most ${limits.maxFinishedJobs} at once, and a deleted one at once forgotten`);
    }
    throw new HttpError(404, "unknown_job", `no job ${id.length > 64 ? `${id.slice(0, 64)}...` : id} here`);
  };

  const shuttingDown = (): HttpError => new HttpError(503, "shutting_down", "this server is shutting down and takes no jobs");

  /** The library call of a job, checked now as one run checks it; its total count of items. */
  const plan = (kind: JobKind, request: Record<string, unknown>): { run: Job["run"]; total: number } => {
    const threads: ParallelOptions = limits.workers > 0 ? { workers: limits.workers } : {};
    if (kind === "sweep") {
      checkSweep(request, limits);
      const spec: SweepSpec = { vary: request.vary as SweepSpec["vary"], ...(request.fixed !== undefined ? { fixed: request.fixed as SweepSpec["fixed"] } : {}) };
      const formula = request.formula as string;
      const total = planShards({ kind: "sweep", formula, ...spec }, 1)[0]!.end;
      return { total, run: async (long) => sweepAnswer(await sweepParallel(formula, spec, withLongRun(threads, long))) };
    }
    const options = checkTolerance(request, limits);
    const formula = request.formula as string;
    const inputs = request.inputs as Record<string, ToleranceValue>;
    const total = planShards({ kind: "tolerance", formula, inputs, options: options as ToleranceOptions }, 1)[0]!.end;
    // The client's options, with this store's threads, signal and progress over anything of those names.
    const { workers: _w, signal: _s, onProgress: _p, ...own } = options as Record<string, unknown>;
    return { total, run: (long) => toleranceParallel(formula, inputs, withLongRun({ ...own, ...threads } as ToleranceOptions & ParallelOptions, long)) };
  };

  const routes: JobRoutes = {
    submit(body) {
      if (closed) throw shuttingDown();
      for (const key of Object.keys(body)) {
        if (key !== "kind" && key !== "request") throw new HttpError(400, "bad_request", `unknown field "${key}"; a job is { kind, request }`, key);
      }
      const kind = body.kind;
      if (typeof kind !== "string" || !(JOB_KINDS as readonly string[]).includes(kind)) {
        throw new HttpError(400, "bad_request", `kind is one of ${JOB_KINDS.map((k) => `"${k}"`).join(", ")}`, "kind");
      }
      const request = body.request;
      if (!isObject(request)) throw new HttpError(400, "bad_request", `request is the body POST /${kind} takes, a JSON object`, "request");
      expire();
      if (queue.length + active.size >= limits.maxJobs) {
        throw new HttpError(503, "too_many_jobs", `this server holds at most ${limits.maxJobs} unfinished jobs; try again when one has finished`, undefined, limits.maxJobs);
      }
      const { run, total } = plan(kind as JobKind, request);
      const seq = nextSeq++;
      const job: Job = {
        id: `${seq.toString(36)}-${randomHex(12)}`,
        kind: kind as JobKind,
        submittedAt: Date.now(),
        controller: new AbortController(),
        run,
        state: "queued",
        progress: { fraction: total === 0 ? 1 : 0, done: 0, total },
        startedAt: undefined,
        finishedAt: undefined,
        result: undefined,
        failure: undefined,
      };
      jobs.set(job.id, job);
      queue.push(job);
      pump();
      return statusOf(job);
    },
    status(id) {
      return statusOf(find(id));
    },
    result(id) {
      const job = find(id);
      if (job.state === "done") return { status: 200, body: job.result };
      if (job.state === "failed") return { status: job.failure!.status, body: { error: job.failure!.error } };
      if (job.state === "cancelled") throw new HttpError(409, "job_cancelled", `job ${id} was cancelled; it has no result`);
      throw new HttpError(409, "job_not_done", `job ${id} is ${job.state}; poll /jobs/${id} until its state is done`);
    },
    cancel(id) {
      const job = find(id);
      if (job.state === "queued") {
        // Waiting in the queue, or taken from it and about to start.
        const at = queue.indexOf(job);
        if (at >= 0) queue.splice(at, 1);
        finish(job, "cancelled");
      } else if (job.state === "running") {
        // The library call ends within one chunk; it stays counted as running until then.
        job.controller.abort();
        finish(job, "cancelled");
      } else {
        // Finished: forget it now, result and all.
        const last = statusOf(job);
        forget(job);
        return last;
      }
      return statusOf(job);
    },
  };

  const store: JobStore = {
    limits,
    counts: () => ({ queued: queue.length, running: active.size, finished: finished.size }),
    idle: async () => {
      // Each round waits for the calls running now; queued jobs start as those end, and there are at most maxJobs.
      while (active.size > 0) await Promise.all(active.values());
    },
    async close() {
      closed = true;
      for (const job of queue.splice(0)) finish(job, "cancelled");
      for (const job of active.keys()) {
        if (job.state === "running" || job.state === "queued") {
          job.controller.abort();
          finish(job, "cancelled");
        }
      }
      if (timer !== undefined) clearTimeout(timer);
      timer = undefined;
      await store.idle();
      jobs.clear();
      finished.clear();
    },
  };
  ROUTES.set(store, routes);
  return store;
}

/** The options of one library call: the store's threads and the job's signal and progress callback. */
function withLongRun<T extends ParallelOptions>(options: T, long: LongRunOptions): T & LongRunOptions {
  return { ...options, signal: long.signal, onProgress: long.onProgress } as T & LongRunOptions;
}
