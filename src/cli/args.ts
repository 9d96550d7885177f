// The command line's words: flags, name=value pairs and positional words.
// Kept apart from run.ts, with no library imports, so main.ts can tell a long
// command (run on the job thread, job.ts) from a quick one without loading the
// formulas.

/** The command line, read. */
export interface Parsed {
  positional: string[];
  pairs: [string, string][];
  flags: Map<string, string | true>;
}

const VALUE_FLAGS = new Set(["samples", "seed", "points", "range", "report", "md", "date", "svg"]);
const BOOL_FLAGS = new Set(["json", "log", "csv", "chart", "help", "version", "tolerance"]);

/** A mistake in the command line itself (exit status 2). */
export class UsageError extends Error {}

export function parseArgs(argv: readonly string[]): Parsed {
  const positional: string[] = [];
  const pairs: [string, string][] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a.startsWith("--")) {
      const [k, inline] = a.slice(2).split("=", 2) as [string, string | undefined];
      if (VALUE_FLAGS.has(k)) {
        const v = inline ?? argv[++i];
        if (v === undefined) throw new UsageError(`--${k} needs a value`);
        flags.set(k, v);
      } else if (BOOL_FLAGS.has(k)) {
        flags.set(k, true);
      } else {
        throw new UsageError(`unknown option --${k}`);
      }
    } else if (a === "-h") {
      flags.set("help", true);
    } else if (/^[A-Za-z_][A-Za-z0-9_]*=/.test(a)) {
      const eq = a.indexOf("=");
      pairs.push([a.slice(0, eq), a.slice(eq + 1)]);
    } else {
      positional.push(a);
    }
  }
  return { positional, pairs, flags };
}

/** What main.ts needs to know of a long command: its name and whether a progress line may be drawn. */
export interface LongCommand {
  /** "sweep", "tolerance", "columns" or "design tolerance": the progress line's label. */
  readonly label: string;
  /** False for output that is data (--json, --csv, --chart): no progress line then, even on a terminal. */
  readonly progress: boolean;
}

/**
 * The long command this command line runs (sweep, tolerance, columns, design
 * with --tolerance), or undefined for a quick one, for help and --version, and
 * for a command line with a usage error (run.ts reports it).
 */
export function longCommand(argv: readonly string[]): LongCommand | undefined {
  let p: Parsed;
  try {
    p = parseArgs(argv);
  } catch {
    return undefined;
  }
  if (p.flags.has("help") || p.flags.has("version")) return undefined;
  const command = p.positional[0];
  const label =
    command === "sweep" || command === "tolerance" || command === "columns" ? command
    : command === "design" && p.flags.has("tolerance") ? "design tolerance"
    : undefined;
  if (label === undefined) return undefined;
  return { label, progress: !(p.flags.has("json") || p.flags.has("csv") || p.flags.has("chart")) };
}
