import { readFileSync } from "node:fs";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { designTolerance, sweepDesign } from "../../src/designs/index.js";
import type { DesignSpec } from "../../src/designs/spec.js";
import { expectCancelled, expectReports, expectStoppedAt, steppedClock, watch } from "../tools/progress-harness.js";

// Progress and cancellation of the design tools (synchronous, in the calling
// thread): a watched run equals the plain one bit for bit with monotone
// reports ending at 1 once; an abort from onProgress at 10 %, 50 % or 99 %
// ends the run with "cancelled" and no report after it. The clock steps so
// every tick reports (tests/tools/progress-harness.ts); the tools tick every
// 32 runs of the chain, well under 1 % of the runs here.

const inductor: DesignSpec = JSON.parse(readFileSync(new URL("../../examples/designs/gapped-inductor.json", import.meta.url), "utf8"));
let clock: { restore(): void };
beforeEach(() => {
  clock = steppedClock();
});
afterEach(() => clock.restore());

const cases = [
  { name: "designTolerance", call: (o: object | undefined) => designTolerance(inductor, { samples: 6400, seed: 9, ...o }) },
  { name: "sweepDesign", call: (o: object | undefined) => sweepDesign(inductor, { input: "turns", from: 5, to: 60, points: 3200 }, o) },
];

describe.each(cases)("$name", ({ call }) => {
  it("gives the plain result bit for bit when watched, with monotone reports ending at 1 once", () => {
    const plain = call(undefined);
    const w = watch();
    expect(call(w.options)).toStrictEqual(plain);
    expectReports(w, true);
    expect(w.reports.length).toBeGreaterThan(50);
  });

  it.each([0.1, 0.5, 0.99])("stops with 'cancelled' when aborted from onProgress at %s of the work", (at) => {
    const w = watch(at);
    expectCancelled(() => call(w.options), w);
    expectStoppedAt(w, at);
  });

  it("does no work with a signal aborted before the call", () => {
    const w = watch();
    w.controller.abort(w.reason);
    expectCancelled(() => call(w.options), w);
    expect(w.reports).toEqual([]);
  });
});
