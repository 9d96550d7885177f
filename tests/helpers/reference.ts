import { expect } from "vitest";

/** One reference check: what went in, what is expected, how close, and where the value comes from. */
export interface ReferenceCase<I = Record<string, unknown>> {
  readonly name?: string;
  readonly input: I;
  readonly expected: number;
  /** Relative tolerance (|got - expected| / |expected|); absolute when expected is 0. */
  readonly tolerance: number;
  /** Where the expected value comes from: table, edition, equation; or "common practice" / "from memory". */
  readonly source: string;
}

/** Relative error, or absolute error when the expected value is zero. */
export function relativeError(got: number, expected: number): number {
  return expected === 0 ? Math.abs(got) : Math.abs(got - expected) / Math.abs(expected);
}

/**
 * Assert `got` is within the case's tolerance; on failure the message shows
 * input, got, expected, relative error, tolerance and source.
 */
export function expectClose(got: number, c: Omit<ReferenceCase<unknown>, "input"> & { input?: unknown }): void {
  const err = relativeError(got, c.expected);
  const ok = Number.isFinite(got) && err <= c.tolerance;
  if (!ok) {
    const msg =
      `${c.name ?? "reference case"}: input ${JSON.stringify(c.input)}\n` +
      `  got      ${got}\n  expected ${c.expected}\n  rel.err  ${err.toExponential(3)} > tolerance ${c.tolerance}\n  source   ${c.source}`;
    expect.fail(msg);
  }
}

/** Run every case through `fn` and check it. */
export function checkCases<I>(cases: readonly ReferenceCase<I>[], fn: (input: I) => number): void {
  for (const c of cases) expectClose(fn(c.input), c);
}
