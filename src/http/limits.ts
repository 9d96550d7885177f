import { MAX_COLUMN_ROWS } from "../tools/columns-read.js";
import { SOLVE_LIMITS } from "../tools/solve.js";

/**
 * How much work one request may ask for. Every route's cost is bounded by
 * these numbers (evaluations are synchronous and cannot be interrupted, so the
 * limits are what keeps a request short); a request over a limit is refused
 * before any computing with 413 (body) or 422 `over_limit` naming the field.
 */
export interface HandlerLimits {
  /** Largest request body in bytes (default 65536). Larger bodies get 413 and are not read further. */
  readonly maxBodyBytes: number;
  /** Largest Monte Carlo sample count of a tolerance request (default 20000, twice the library default; the library allows 1e6). */
  readonly maxSamples: number;
  /** Largest number of inputs whose corners a tolerance request may ask for, 2^n corners (default 12). */
  readonly maxCornerInputs: number;
  /** Largest number of grid points of a sweep, both axes together (default 10000). */
  readonly maxSweepPoints: number;
  /** Most rows of a columns request, JSON columns or CSV (default 10000; the body size limit applies too). */
  readonly maxColumnRows: number;
  /** Widest solve search, in decades either side of the start value (default 50; the library allows 300). */
  readonly maxSolveDecades: number;
  /** Finest solve search, samples per decade (default 20; the library allows 100). */
  readonly maxSolveSamplesPerDecade: number;
}

/** The defaults (the worst request at each is timed in bench/http.ts). */
export const DEFAULT_LIMITS: HandlerLimits = Object.freeze({
  maxBodyBytes: 64 * 1024,
  maxSamples: 20_000,
  maxCornerInputs: 12,
  maxSweepPoints: 10_000,
  maxColumnRows: 10_000,
  maxSolveDecades: 50,
  maxSolveSamplesPerDecade: 20,
});

/**
 * The limits in force: the defaults with the options given, each checked to be
 * a whole number within what the library itself accepts, so a typo in a
 * server's configuration fails at start-up, not on a request.
 */
export function resolveLimits(options: Partial<HandlerLimits> = {}): HandlerLimits {
  const ceilings: Record<keyof HandlerLimits, number> = {
    maxBodyBytes: 2 ** 30,
    maxSamples: 1e6,
    maxCornerInputs: 16,
    maxSweepPoints: 4_000_000,
    maxColumnRows: MAX_COLUMN_ROWS,
    maxSolveDecades: SOLVE_LIMITS.decades.max,
    maxSolveSamplesPerDecade: SOLVE_LIMITS.samplesPerDecade.max,
  };
  return wholeNumbers("limit", DEFAULT_LIMITS, ceilings, options);
}

/**
 * `defaults` with the options given, each a whole number from its floor (0
 * unless given) to its ceiling; an unknown name or a bad value is a RangeError
 * naming it (`what` says which kind of limit).
 */
export function wholeNumbers<T extends object>(what: string, defaults: T, ceilings: Record<keyof T, number>, options: Partial<T>, floors: Partial<Record<keyof T, number>> = {}): T {
  const out: Record<string, unknown> = { ...(defaults as Record<string, unknown>) };
  for (const [name, value] of Object.entries(options)) {
    if (!Object.hasOwn(ceilings, name)) throw new RangeError(`emquant/http: unknown ${what} "${name}"`);
    if (value === undefined) continue;
    const ceiling = ceilings[name as keyof T];
    const floor = floors[name as keyof T] ?? 0;
    if (typeof value !== "number" || !Number.isInteger(value) || value < floor || value > ceiling) {
      throw new RangeError(`emquant/http: ${what} ${name} must be a whole number from ${floor} to ${ceiling}`);
    }
    out[name] = value;
  }
  return Object.freeze(out) as T;
}
