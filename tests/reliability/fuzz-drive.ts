/**
 * Drives one path of the fuzz suite: draws its cases from the fixed seed
 * (tests/setup.ts), runs and judges every case and records the violations in
 * a ledger. The property itself never fails: the test asserts on the ledger,
 * so one run reports every violation class with reproducers instead of
 * stopping at the first.
 */
import fc from "fast-check";
import { expect } from "vitest";
import { Ledger } from "./fuzz-check.js";
import { RUNNERS, type RunnerKind } from "./fuzz-runners.js";

export function newDrive(): Ledger {
  return new Ledger();
}

/** Run `runs` cases of a synchronous path into the ledger. */
export function driveSync(d: Ledger, kind: Exclude<RunnerKind, "http">, runs: number): void {
  const runner = RUNNERS[kind] as { cases: fc.Arbitrary<unknown>; run: (c: unknown) => { violations: string[] } };
  fc.assert(
    fc.property(runner.cases, (c) => {
      d.record(kind, c, runner.run(c).violations);
    }),
    { numRuns: runs },
  );
}

/** Run `runs` cases of the HTTP path (asynchronous) into the ledger. */
export async function driveHttp(d: Ledger, runs: number): Promise<void> {
  const runner = RUNNERS.http;
  await fc.assert(
    fc.asyncProperty(runner.cases, async (c) => {
      d.record("http", c, (await runner.run(c)).violations);
    }),
    { numRuns: runs },
  );
}

/** The main assertion of a drive: every drawn case ran, and none broke a promise. */
export function expectClean(d: Ledger, runs: number): void {
  expect(d.cases).toBe(runs);
  expect(d.violations, `${d.violations} violations, e.g.\n${Ledger.describe(d.entries)}`).toBe(0);
}
