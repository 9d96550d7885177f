/**
 * Drives one path of the fuzz suite: draws its cases from the fixed seed
 * (tests/setup.ts), skips the known non-terminating classes (fuzz-known.ts),
 * runs and judges every other case and sorts the violations into the ledger.
 * The property itself never fails: the tests assert on the ledger, so one run
 * reports every class with reproducers instead of stopping at the first.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Ledger } from "./fuzz-check.js";
import { KNOWN_CLASSES, knownHang } from "./fuzz-known.js";
import { RUNNERS, type RunnerKind } from "./fuzz-runners.js";

export interface Drive {
  readonly ledger: Ledger;
  /** Cases skipped as known hangs, by hang class. */
  readonly skipped: Map<string, number>;
}

export function newDrive(): Drive {
  return { ledger: new Ledger(KNOWN_CLASSES), skipped: new Map() };
}

function skip(d: Drive, kind: RunnerKind, c: unknown): boolean {
  const h = knownHang(kind, c);
  if (h) d.skipped.set(h.name, (d.skipped.get(h.name) ?? 0) + 1);
  return h !== undefined;
}

/** Run `runs` cases of a synchronous path into the drive. */
export function driveSync(d: Drive, kind: Exclude<RunnerKind, "http">, runs: number): void {
  const runner = RUNNERS[kind] as { cases: fc.Arbitrary<unknown>; run: (c: unknown) => { violations: string[] } };
  fc.assert(
    fc.property(runner.cases, (c) => {
      if (skip(d, kind, c)) return;
      d.ledger.record(kind, c, runner.run(c).violations);
    }),
    { numRuns: runs },
  );
}

/** Run `runs` cases of the HTTP path (asynchronous) into the drive. */
export async function driveHttp(d: Drive, runs: number): Promise<void> {
  const runner = RUNNERS.http;
  await fc.assert(
    fc.asyncProperty(runner.cases, async (c) => {
      if (skip(d, "http", c)) return;
      d.ledger.record("http", c, (await runner.run(c)).violations);
    }),
    { numRuns: runs },
  );
}

/** Cases run plus skipped. */
export function drawn(d: Drive): number {
  return d.ledger.cases + [...d.skipped.values()].reduce((a, b) => a + b, 0);
}

/**
 * Register the tests of the known classes for these drives: each fails while
 * any case of its class fails, and names the cause and reproducers. Run after
 * the drives' own tests (vitest runs a file's tests in order).
 */
export function describeKnown(path: string, drives: () => readonly Drive[]): void {
  describe(`awaiting fixes elsewhere (${path}): classes whose cause is in files this suite does not own`, () => {
    for (const cls of KNOWN_CLASSES) {
      it(`${cls.name} [cause: ${cls.cause}]`, () => {
        const entries = drives().flatMap((d) => d.ledger.known.get(cls.name) ?? []);
        const count = drives().reduce((n, d) => n + (d.ledger.counts.get(cls.name) ?? 0), 0);
        expect(count, `${count} violations, e.g.\n${Ledger.describe(entries, 3)}`).toBe(0);
      });
    }
  });
}

/** The main assertion of a drive: every drawn case was run or skipped, and no violation is outside the known classes. */
export function expectClean(d: Drive, runs: number): void {
  expect(drawn(d)).toBe(runs);
  const u = d.ledger.unknown;
  expect(d.ledger.counts.get("") ?? 0, `${d.ledger.counts.get("") ?? 0} violations outside the known classes, e.g.\n${Ledger.describe(u)}`).toBe(0);
}
