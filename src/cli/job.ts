import { createRequire } from "node:module";
import { constants } from "node:os";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import type { LongCommand } from "./args.js";
import type { ChartRequest } from "./chart.js";
import type { JobData, JobMessage } from "./job-thread.js";
import { type LineStream, ProgressLine, REDRAW_MS } from "./progress-line.js";

/*
 * A long command (sweep, tolerance, columns, design --tolerance; args.ts
 * longCommand) as the `emquant` program runs it: the work on a job thread
 * (job-thread.ts), this thread free for the progress line and the signals.
 *
 * - Progress: a line on stderr when stderr is a terminal, TERM is not "dumb"
 *   and the output is not data (--json, --csv, --chart); from about one second
 *   on, at most every REDRAW_MS, erased before anything else is written.
 * - SIGINT (Ctrl-C) or SIGTERM: the line is erased, one line on stderr says
 *   the command was cancelled, the job is cancelled through its AbortSignal
 *   (a thread that has not ended STOP_GRACE_MS later is terminated), and the
 *   exit status is 128 + the signal's number (130, 143). A second signal ends
 *   the process at once with that status. A signal that comes after the
 *   command has finished (its result written, its thread ending) only ends
 *   the thread at once: the exit status stays the command's.
 */

/** Time the job thread has to end after a cancel before it is terminated, ms. */
export const STOP_GRACE_MS = 1000;

/** What runLongCommand uses of the process (main.ts passes the real one). */
export interface JobEnv {
  out(text: string): void;
  err(text: string): void;
  /** The terminal to draw the progress line on; undefined for none. */
  readonly progress: LineStream | undefined;
  onSignal(listener: (signal: "SIGINT" | "SIGTERM") => void): () => void;
  exit(status: number): void;
  /**
   * Told how the job thread ended: "itself" (the command finished, or its call
   * stopped on the AbortSignal) or "terminated" (it had not ended STOP_GRACE_MS
   * after a cancel or its last message). For tests and diagnostics.
   */
  threadEnded?(how: "itself" | "terminated"): void;
  /** Told when the job's exit status has arrived (its output is complete; the thread is ending). For tests. */
  jobDone?(): void;
  /** STOP_GRACE_MS unless given (tests). */
  readonly graceMs?: number;
}

/**
 * The stream to draw the progress line on: stderr when it is a terminal, the
 * terminal is not "dumb" (it cannot redraw a line) and the command's output is
 * not data; else undefined (no line). NO_COLOR needs nothing: the line has no colour.
 */
export function progressStream<S extends LineStream & { readonly isTTY?: boolean }>(command: LongCommand, stderr: S, term: string | undefined): S | undefined {
  return stderr.isTTY === true && term !== "dumb" && command.progress ? stderr : undefined;
}

/** The process's environment: stdout, stderr (with the progress line when progressStream allows), SIGINT and SIGTERM. */
export function processEnv(command: LongCommand): JobEnv {
  return {
    out: (text) => process.stdout.write(`${text}\n`),
    err: (text) => process.stderr.write(`${text}\n`),
    progress: progressStream(command, process.stderr, process.env["TERM"]),
    onSignal(listener) {
      const int = (): void => listener("SIGINT");
      const term = (): void => listener("SIGTERM");
      process.on("SIGINT", int);
      process.on("SIGTERM", term);
      return () => {
        process.off("SIGINT", int);
        process.off("SIGTERM", term);
      };
    },
    exit: (status) => process.exit(status),
  };
}

/** The job thread: from source (tsx, vitest) job-thread.ts through tsx's loader; from the build, cli-job.js beside this file. */
function startJobThread(data: JobData): Worker {
  const here = import.meta.url;
  if (here.endsWith(".ts")) {
    // A worker's own loader does not take tsx's hooks from execArgv on Node 20: the
    // start is one line of CommonJS that registers tsx's require hook and loads the thread.
    const file = fileURLToPath(new URL("./job-thread.ts", here));
    const tsx = createRequire(here).resolve("tsx/cjs/api");
    return new Worker(`require(${JSON.stringify(tsx)}).register(); require(${JSON.stringify(file)});`, { eval: true, workerData: data });
  }
  return new Worker(new URL("./cli-job.js", here), { workerData: data });
}

/**
 * Runs the command line `argv` (a long command) on a job thread with a
 * progress line and cancellation; resolves to the exit status. An error the
 * command line does not report itself (a bug) rejects, as runCli throws it.
 */
export function runLongCommand(argv: readonly string[], command: LongCommand, env: JobEnv = processEnv(command)): Promise<number> {
  return new Promise<number>((resolve, reject) => {
    const stop = new Int32Array(new SharedArrayBuffer(4));
    const worker = startJobThread({ argv: [...argv], stop });
    const line = env.progress !== undefined ? new ProgressLine(command.label, env.progress) : undefined;
    let redraw: ReturnType<typeof setInterval> | undefined = line !== undefined ? setInterval(() => line.draw(), REDRAW_MS) : undefined;
    let grace: ReturnType<typeof setTimeout> | undefined;
    let terminated = false;
    const terminate = (): void => {
      terminated = true;
      void worker.terminate();
    };
    const charts: ChartRequest[] = [];
    let status: number | undefined;
    let failure: unknown;
    /** The exit status once a signal came (the job's own output is dropped from then on). */
    let cancelled: number | undefined;

    const endLine = (): void => {
      if (redraw !== undefined) clearInterval(redraw);
      redraw = undefined;
      line?.end();
    };
    const offSignal = env.onSignal((signal) => {
      const code = 128 + constants.signals[signal];
      if (status !== undefined && cancelled === undefined) {
        // The command has finished and its output is written; only the thread's
        // teardown is left. Reporting "cancelled" with 130 after a complete result
        // would be false: end the thread now and finish as the command did.
        terminate();
        return;
      }
      if (cancelled !== undefined) {
        // A second signal: no more waiting.
        env.exit(code);
        return;
      }
      cancelled = code;
      Atomics.store(stop, 0, 1);
      endLine();
      env.err(`${command.label} cancelled (${signal})`);
      if (grace !== undefined) clearTimeout(grace);
      grace = setTimeout(terminate, env.graceMs ?? STOP_GRACE_MS);
    });

    worker.on("message", (m: JobMessage) => {
      if (cancelled !== undefined) return;
      switch (m.kind) {
        case "progress":
          line?.report(m.fraction);
          return;
        case "out":
          endLine();
          env.out(m.text);
          return;
        case "err":
          endLine();
          env.err(m.text);
          return;
        case "chart":
          charts.push({ spec: m.spec, path: m.path });
          return;
        case "done":
          status = m.status;
          env.jobDone?.();
          // The thread ends by itself now; should something keep it alive, it is ended.
          grace ??= setTimeout(terminate, env.graceMs ?? STOP_GRACE_MS);
          return;
      }
    });
    worker.on("error", (e) => {
      failure ??= e;
    });
    worker.on("exit", () => {
      env.threadEnded?.(terminated ? "terminated" : "itself");
      endLine();
      offSignal();
      if (grace !== undefined) clearTimeout(grace);
      if (cancelled !== undefined) resolve(cancelled);
      else if (failure !== undefined) reject(failure);
      else if (status === undefined) reject(new Error("the job thread ended without an exit status"));
      else if (status !== 0 || charts.length === 0) resolve(status);
      else import("./chart.js").then((c) => c.writeCharts(charts, (t) => env.err(t))).then(resolve, reject);
    });
  });
}
