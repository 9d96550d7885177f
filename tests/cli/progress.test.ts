import { execFileSync, spawn } from "node:child_process";
import { constants } from "node:os";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { longCommand } from "../../src/cli/args.js";
import { type JobEnv, progressStream, runLongCommand } from "../../src/cli/job.js";
import { durationText, type LineStream, ProgressLine, progressText, REDRAW_MS, SHOW_AFTER_MS } from "../../src/cli/progress-line.js";
import { runCli } from "../../src/cli/run.js";
import { cliCommand, spawnCli } from "../helpers/spawn-cli.js";

// The progress line and Ctrl-C of the long commands, as a user sees them: the
// real program (node on this run's bundle of the source, tests/helpers/spawn-cli.ts) under a pseudo-terminal
// made by util-linux `script`, whose output is the bytes the terminal got.
//
// Outside references for the checks:
// - CR (0/13) returns to the start of the line; CSI K is EL, "erase in line",
//   with the default parameter 0 erasing from the cursor to the end of the
//   line: ECMA-48 5th edition (1991), 8.3.41 EL (from memory).
// - A process ended by a signal is reported by the shell as 128 + the signal's
//   number (POSIX.1-2017, Shell Command Language, 2.8.2 Exit Status for
//   Commands says "greater than 128"; 128 + n is common practice), which a
//   program that handles the signal returns itself; the numbers are the
//   system's own, from os.constants.signals (SIGINT 2, SIGTERM 15 on Linux).
// - In a terminal, the interrupt character (Ctrl-C, 0x03) makes the line
//   discipline send SIGINT to the terminal's foreground process group
//   (POSIX.1-2017, General Terminal Interface, 11.1.9 Special Characters;
//   the section numbers here are from memory).

const root = fileURLToPath(new URL("../..", import.meta.url));

/** A fake terminal that records what was written, with a width. */
function recorder(columns?: number): LineStream & { writes: string[] } {
  const writes: string[] = [];
  return { writes, columns, write: (t: string) => writes.push(t) };
}

describe("the progress line's text and drawing", () => {
  it("writes durations as whole seconds, then minutes and seconds, then hours and minutes", () => {
    expect([0, 999, 59_999, 60_000, 125_000, 3_723_000].map(durationText)).toEqual(["0 s", "0 s", "59 s", "1 min 00 s", "2 min 05 s", "1 h 02 min"]);
  });

  it("shows the label, the percentage rounded down, the time elapsed and the estimate of the rest", () => {
    expect(progressText("sweep", undefined, 3_200)).toBe("sweep  3 s elapsed");
    expect(progressText("tolerance", 0.379, 12_000, 19_600)).toBe("tolerance  37 %  12 s elapsed, about 20 s left");
    expect(progressText("sweep", 0.9999, 5_000)).toBe("sweep  99 %  5 s elapsed");
  });

  it("draws nothing in the first second, then redraws in place with CR and erase-in-line (ECMA-48 EL)", () => {
    let t = 0;
    const term = recorder(80);
    const line = new ProgressLine("tolerance", term, () => t);
    for (; t < SHOW_AFTER_MS; t += 50) line.draw();
    expect(term.writes).toEqual([]);
    line.draw();
    expect(term.writes).toEqual(["\rtolerance  1 s elapsed\x1b[K"]);
  });

  it("estimates the rest from the rate since the first report (0.1 at 1 s, 0.3 at 3 s: 0.1 per second, 7 s left)", () => {
    let t = 1000;
    const term = recorder(80);
    const line = new ProgressLine("sweep", term, () => t - 1000);
    t = 2000;
    line.report(0.1);
    t = 4000;
    line.report(0.3);
    line.draw();
    expect(term.writes.at(-1)).toBe("\rsweep  30 %  3 s elapsed, about 7 s left\x1b[K");
  });

  it("redraws at most every REDRAW_MS however often it is asked, and only when the text changed", () => {
    let t = 0;
    const term = recorder(80);
    const line = new ProgressLine("columns", term, () => t);
    // The percentage changes every 110 ms: more often than a redraw is allowed.
    for (; t <= 11_000; t += 5) {
      line.report(t / 11_000);
      line.draw();
    }
    // 10 s of drawing at most every REDRAW_MS, plus the first.
    expect(term.writes.length).toBeLessThanOrEqual(10_000 / REDRAW_MS + 1);
    expect(term.writes.length).toBeGreaterThan(10_000 / REDRAW_MS / 2);
    const still = recorder(80);
    const idle = new ProgressLine("columns", still, () => t);
    t += SHOW_AFTER_MS;
    for (let k = 0; k < 100; k++) idle.draw();
    expect(still.writes).toHaveLength(1);
  });

  it("cuts the line to one column less than the terminal's width, so it never wraps", () => {
    let t = 0;
    const term = recorder(20);
    const line = new ProgressLine("design tolerance", term, () => t);
    line.report(0.5);
    t = 61_000;
    line.draw();
    const text = term.writes[0]!.replace(/^\r/, "").replace(/\x1b\[K$/, "");
    expect(text).toBe("design tolerance  5");
    expect(text.length).toBe(19);
  });

  it("erases the line once when it ends, and draws nothing after; a line never drawn is not erased", () => {
    let t = 0;
    const term = recorder(80);
    const line = new ProgressLine("sweep", term, () => t);
    t = 1500;
    line.draw();
    line.end();
    t = 5000;
    line.draw();
    line.end();
    expect(term.writes).toEqual(["\rsweep  1 s elapsed\x1b[K", "\r\x1b[K"]);
    const quiet = recorder(80);
    new ProgressLine("sweep", quiet, () => 0).end();
    expect(quiet.writes).toEqual([]);
  });
});

describe("which commands are long, and where the line may go", () => {
  it("runs sweep, tolerance, columns and design --tolerance as long commands; help, --version and quick commands are not", () => {
    expect(longCommand(["sweep", "f", "a=1..2"])).toEqual({ label: "sweep", progress: true });
    expect(longCommand(["tolerance", "f", "--samples", "10"])).toEqual({ label: "tolerance", progress: true });
    expect(longCommand(["columns", "f", "t.csv", "--csv"])).toEqual({ label: "columns", progress: false });
    expect(longCommand(["design", "d.json", "--tolerance", "--json"])).toEqual({ label: "design tolerance", progress: false });
    expect(longCommand(["sweep", "f", "--chart"])?.progress).toBe(false);
    for (const argv of [["design", "d.json"], ["compute", "f"], ["sweep", "--help"], ["tolerance", "--version"], ["sweep", "--nonsense"], []]) {
      expect(longCommand(argv), argv.join(" ")).toBeUndefined();
    }
  });

  it("draws only on a terminal that can redraw a line, and never for data output", () => {
    const tty = { isTTY: true, write: () => true };
    const pipe = { isTTY: false, write: () => true };
    const human = { label: "sweep", progress: true };
    expect(progressStream(human, tty, "xterm")).toBe(tty);
    expect(progressStream(human, tty, undefined)).toBe(tty);
    expect(progressStream(human, tty, "dumb")).toBeUndefined();
    expect(progressStream(human, pipe, "xterm")).toBeUndefined();
    expect(progressStream({ label: "sweep", progress: false }, tty, "xterm")).toBeUndefined();
  });
});

/** Quote one word for sh. */
const sh = (w: string): string => `'${w.replace(/'/g, `'\\''`)}'`;

interface TerminalRun {
  status: number | null;
  /** Every byte the terminal got (stdout and stderr together, newlines as CR LF). */
  output: string;
}

/**
 * Runs `emquant args...` on a pseudo-terminal (util-linux script), calling
 * `onOutput` with everything seen so far and the program's pid (its process
 * group: script makes it a session leader) as output arrives.
 */
function inTerminal(args: readonly string[], onOutput?: (seen: string, pid: number, input: (t: string) => void) => void, env: Record<string, string> = {}): Promise<TerminalRun> {
  const command = `exec ${cliCommand().map(sh).join(" ")} ${args.map(sh).join(" ")}`;
  return new Promise((resolve, reject) => {
    const child = spawn("script", ["-qfec", command, "/dev/null"], { cwd: root, env: { ...process.env, TERM: "xterm", ...env } });
    let output = "";
    // Never hang the suite: a run that does not end is killed (and the test fails on its status).
    const guard = setTimeout(() => {
      for (const pid of childrenOf(child.pid!)) process.kill(pid, "SIGKILL");
      child.kill("SIGKILL");
    }, 120_000);
    child.stdout.setEncoding("utf8").on("data", (t: string) => {
      output += t;
      if (onOutput) {
        const pid = childrenOf(child.pid!)[0];
        if (pid !== undefined) onOutput(output, pid, (text) => child.stdin.write(text));
      }
    });
    child.on("error", reject);
    child.on("close", (status) => {
      clearTimeout(guard);
      resolve({ status, output });
    });
  });
}

/** Processes whose parent is `pid`. */
function childrenOf(pid: number): number[] {
  try {
    return execFileSync("ps", ["-o", "pid=", "--ppid", String(pid)], { encoding: "utf8" }).split("\n").map((s) => Number(s.trim())).filter((n) => n > 0);
  } catch {
    return []; // ps exits 1 when there are none
  }
}

/** Processes whose command line contains `marker`. */
function processesWith(marker: string): string[] {
  return execFileSync("ps", ["-eo", "args="], { encoding: "utf8" }).split("\n").filter((l) => l.includes(marker));
}

/** In-process output of the same command line (the path without a job thread): what the program printed before. */
function inProcess(args: readonly string[]): string {
  let text = "";
  runCli(args, { out: (t) => (text += `${t}\n`), err: (t) => (text += `${t}\n`) });
  return text;
}

/** A progress line as drawn: CR, "tolerance  ...elapsed...", erase to the end of the line. */
const DRAWN = /\rtolerance {2}[^\r\n]*elapsed[^\r\n]*\x1b\[K/g;

// A Monte Carlo run that takes far longer than a test may (1e6 samples of
// Grover's coaxial coils: about 20 s of CPU here), so it is always interrupted;
// the seed marks the process for the leftover check.
const longRun = (seed: number): string[] => [
  "tolerance", "coaxialCoilsMutualInductance", "turns1=100", "radius1=10 mm +- 1%", "length1=20 mm", "turns2=50",
  "radius2=15 mm", "length2=10 mm", "distance=30 mm +- 1 mm", "--samples", "1000000", "--seed", String(seed),
];
// A run that ends by itself, past the first second: 100000 samples of the coils
// above take about 2 s of CPU here (the program itself starts in 0.3 s).
const endingRun = [
  "tolerance", "coaxialCoilsMutualInductance", "turns1=100", "radius1=10 mm +- 1%", "length1=20 mm", "turns2=50",
  "radius2=15 mm", "length2=10 mm", "distance=30 mm +- 1 mm", "--samples", "100000",
];

describe("the emquant program on a terminal and on pipes", () => {
  it("shows the progress line, stops on Ctrl-C or SIGTERM with 130 or 143 and leaves no process; pipes and --json get no line", async () => {
    const seeds = [Math.floor(Math.random() * 1e9) + 1e9, Math.floor(Math.random() * 1e9) + 2e9];
    // All runs at once.
    const [interrupted, terminated, ended, json, piped] = await Promise.all([
      // Ctrl-C typed at the terminal once the first progress line is there.
      (() => {
        let sent = false;
        return inTerminal(longRun(seeds[0]!), (seen, _pid, input) => {
          if (!sent && seen.match(DRAWN)) {
            sent = true;
            input("\x03");
          }
        });
      })(),
      // SIGTERM sent to the program's process group once the first progress line is there.
      (() => {
        let sent = false;
        return inTerminal(longRun(seeds[1]!), (seen, pid) => {
          if (!sent && seen.match(DRAWN)) {
            sent = true;
            process.kill(-pid, "SIGTERM");
          }
        });
      })(),
      inTerminal(endingRun),
      inTerminal([...endingRun, "--json"]),
      spawnCli(...endingRun),
    ]);

    // Ctrl-C: at least one drawn line, then the line erased and one short message; exit 128 + SIGINT; nothing left running.
    expect(interrupted.output.match(DRAWN)?.length, interrupted.output).toBeGreaterThanOrEqual(1);
    expect(interrupted.status, interrupted.output).toBe(128 + constants.signals.SIGINT);
    expect(interrupted.status).toBe(130);
    const afterInterrupt = interrupted.output.slice(interrupted.output.lastIndexOf("elapsed"));
    expect(afterInterrupt).toMatch(/^elapsed[^\r\n]*\x1b\[K(\^C)?\r\x1b\[Ktolerance cancelled \(SIGINT\)\r\n$/);
    expect(processesWith(String(seeds[0]))).toEqual([]);

    // SIGTERM: the same, with 128 + SIGTERM.
    expect(terminated.status, terminated.output).toBe(128 + constants.signals.SIGTERM);
    expect(terminated.status).toBe(143);
    expect(terminated.output).toMatch(/\r\x1b\[Ktolerance cancelled \(SIGTERM\)\r\n$/);
    expect(processesWith(String(seeds[1]))).toEqual([]);

    // A run that ends: its lines, then the line erased, then the result exactly as printed in-process.
    const text = inProcess(endingRun);
    expect(ended.status).toBe(0);
    expect(ended.output.match(DRAWN)?.length, ended.output).toBeGreaterThanOrEqual(1);
    const result = ended.output.slice(ended.output.lastIndexOf("\r\x1b[K") + 4);
    expect(result.replace(/\r\n/g, "\n")).toBe(text);

    // --json on the same terminal: no line at all, and the JSON as printed in-process.
    expect(json.status).toBe(0);
    expect(json.output).not.toMatch(/elapsed|\x1b/);
    expect(json.output.replace(/\r\n/g, "\n")).toBe(inProcess([...endingRun, "--json"]));

    // Pipes: no line, nothing on stderr, and stdout as printed in-process.
    expect(piped.status).toBe(0);
    expect(piped.stderr).toBe("");
    expect(piped.stdout).toBe(text);
  }, 240_000);
});

describe("signals while a long command runs (in this process)", () => {
  it("cancels on the first signal through the call's AbortSignal (the thread ends by itself), and exits at once on the second", async () => {
    const out: string[] = [];
    const err: string[] = [];
    const exits: number[] = [];
    const ended: string[] = [];
    let signal: ((s: "SIGINT" | "SIGTERM") => void) | undefined;
    let sent = false;
    const env: JobEnv = {
      out: (t) => out.push(t),
      err: (t) => err.push(t),
      // The signals come once a line with a percentage is drawn: the library call is running.
      progress: {
        columns: 100,
        write: (t: string) => {
          if (!sent && / \d+ % /.test(t)) {
            sent = true;
            signal!("SIGINT");
            signal!("SIGTERM");
          }
        },
      },
      onSignal: (l) => {
        signal = l;
        return () => (signal = undefined);
      },
      exit: (s) => exits.push(s),
      threadEnded: (code) => ended.push(code),
    };
    const status = await runLongCommand(longRun(1), { label: "tolerance", progress: true }, env);
    expect(sent).toBe(true);
    expect(status).toBe(130);
    expect(exits).toEqual([143]);
    expect(err).toEqual(["tolerance cancelled (SIGINT)"]);
    expect(out).toEqual([]);
    // Not terminated: its call stopped on the aborted signal.
    expect(ended).toEqual(["itself"]);
    // The listeners are gone once the job thread has ended.
    expect(signal).toBeUndefined();
  });

  it("a signal after the command has finished (its output written, the thread ending) is not reported as a cancel", async () => {
    const out: string[] = [];
    const err: string[] = [];
    const exits: number[] = [];
    const ended: string[] = [];
    let signal: ((s: "SIGINT" | "SIGTERM") => void) | undefined;
    const env: JobEnv = {
      out: (t) => out.push(t),
      err: (t) => err.push(t),
      progress: undefined,
      onSignal: (l) => {
        signal = l;
        return () => (signal = undefined);
      },
      exit: (s) => exits.push(s),
      threadEnded: (how) => ended.push(how),
      // Ctrl-C in the window between the result and the thread's end.
      jobDone: () => signal!("SIGINT"),
    };
    const argv = ["tolerance", "parallelPlateCapacitance", "area=1 cm^2 +- 1%", "gap=0.1 mm", "--samples", "1000", "--seed", "7"];
    const status = await runLongCommand(argv, { label: "tolerance", progress: true }, env);
    expect(status).toBe(0);
    expect(err).toEqual([]);
    expect(exits).toEqual([]);
    expect(out.join("")).toMatch(/mean/i);
    // Ended at once rather than after its own teardown.
    expect(ended).toEqual(["terminated"]);
    expect(signal).toBeUndefined();
  });

  it("terminates a thread that has not ended when the grace time is over (here none: it is still starting)", async () => {
    const ended: string[] = [];
    let signal: ((s: "SIGINT" | "SIGTERM") => void) | undefined;
    const env: JobEnv = {
      out: () => {},
      err: () => {},
      progress: undefined,
      onSignal: (l) => {
        signal = l;
        return () => (signal = undefined);
      },
      exit: () => {},
      threadEnded: (code) => ended.push(code),
      graceMs: 0,
    };
    const done = runLongCommand(longRun(2), { label: "tolerance", progress: true }, env);
    signal!("SIGTERM");
    expect(await done).toBe(143);
    expect(ended).toEqual(["terminated"]);
  });
});
