import { describe, expect, it } from "vitest";
import { borrowShared, giveBackShared, keptSharedBytes } from "../../src/tools/shared-scratch.js";

// The reuse of shared buffers by the parallel entries (src/tools/shared-scratch.ts):
// a buffer given back is lent again to a call that fits in it, never to two calls at once.
describe("shared scratch buffers", () => {
  it("lends a given-back buffer again to a request that fits, and a new one while it is lent", () => {
    const a = borrowShared(1000);
    expect(a.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(a.length).toBe(1000);
    const b = borrowShared(1000);
    expect(b.buffer).not.toBe(a.buffer);
    giveBackShared(a);
    const c = borrowShared(600);
    expect(c.buffer).toBe(a.buffer);
    expect(c.length).toBe(600);
    const d = borrowShared(1001);
    expect(d.buffer).not.toBe(a.buffer);
    for (const x of [b, c, d]) giveBackShared(x);
  });

  it("keeps at most 256 MiB for reuse, dropping the largest buffers first", () => {
    // (Pages of a SharedArrayBuffer are not touched here, so these cost no memory.)
    const before = keptSharedBytes();
    expect(before).toBeLessThan(1024 * 1024);
    const big = borrowShared((200 * 1024 * 1024) / 8);
    const other = borrowShared((100 * 1024 * 1024) / 8);
    giveBackShared(big);
    giveBackShared(other);
    // The 200 MiB buffer is kept; the 100 MiB one no longer fits beside it.
    expect(keptSharedBytes()).toBe(before + 200 * 1024 * 1024);
    expect(borrowShared((150 * 1024 * 1024) / 8).buffer).toBe(big.buffer);
  });
});
