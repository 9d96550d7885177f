import { nextTurn, type Ticker } from "../core/progress.js";

/*
 * Chunks of a long loop, for progress and cancellation: a loop over an index
 * range runs in pieces and calls `between(done)` after each piece but the
 * last (the caller ticks there; the last piece is followed by finish()).
 * Pieces are sized by time, not count: the cost of one item runs from a few
 * nanoseconds (a plate capacitance) to microseconds (elliptic integrals), so
 * a fixed count would be either far too fine or far too coarse. Every split
 * gives the same results (the loops here are over independent items), so the
 * sizes may follow the clock.
 */

/** Aimed duration of one piece, ms: long enough that a tick costs nothing measurable, short enough that a cancel lands promptly. */
export const CHUNK_MS = 4;

// The clock as it is when this module loads (bound, not looked up per call): piece sizes
// follow real time even where a test replaces performance.now to drive the ticker's report
// rate. In Node, process.hrtime: the first read of the global `performance` loads
// perf_hooks, which `import "emquant"` need not pay.
const now: () => number =
  typeof process === "object" && typeof process.hrtime?.bigint === "function"
    ? () => Number(process.hrtime.bigint()) / 1e6
    : typeof performance !== "undefined"
      ? performance.now.bind(performance)
      : Date.now;

/**
 * `tick(done)` while the work is unfinished (done < total); at the end only
 * the cancellation check, so fraction 1 is reported once, by finish().
 */
export function tickBelow(t: Ticker, done: number, total: number): void {
  if (done < total) t.tick(done);
  else t.check();
}

/**
 * Most items in one piece. A test seam, not exported from the package: tests
 * lower it (and restore it) to get a piece boundary near any fraction of the
 * work whatever the machine's speed.
 */
export const pieceLimit = { items: 2 ** 24 };

/** The largest piece: pieceLimit on a multiple of `align` (at least `align`). */
function largest(align: number): number {
  return Math.max(align, pieceLimit.items - (pieceLimit.items % align));
}

/** Next piece size: doubled when a piece took under half the aim, halved (not below `align`) when over twice. */
function resize(size: number, ms: number, align: number): number {
  if (ms < CHUNK_MS / 2) return Math.min(largest(align), size * 2);
  if (ms > CHUNK_MS * 2 && size > align) return Math.max(align, Math.floor(size / 2 / align) * align);
  return size;
}

/**
 * Runs `work(start, end)` over [from, to) in pieces, calling `between(end)`
 * after every piece that is not the last. Pieces start at `first` items (a
 * multiple of `align`) and adapt to take about CHUNK_MS; inner boundaries lie
 * on from + multiples of `align`. Bounded: every piece covers at least one item.
 */
export function inPieces(from: number, to: number, work: (start: number, end: number) => void, between: (done: number) => void, first = 256, align = 1): void {
  let size = firstSize(first, align);
  for (let start = from; start < to;) {
    const end = Math.min(to, start + size);
    size = timed(work, start, end, size, align);
    if (end < to) between(end);
    start = end;
  }
}

function firstSize(first: number, align: number): number {
  return Math.min(largest(align), Math.max(align, first - (first % align)));
}

/** Runs one piece and returns the size of the next. */
function timed(work: (start: number, end: number) => void, start: number, end: number, size: number, align: number): number {
  const t0 = now();
  work(start, end);
  return resize(size, now() - t0, align);
}

/**
 * `inPieces` for the asynchronous entries: after each piece's `between` it
 * yields one turn of the event loop (nextTurn), so an abort from a timer or
 * another event reaches the loop within one piece.
 */
export async function inPiecesAsync(from: number, to: number, work: (start: number, end: number) => void, between: (done: number) => void, first = 256, align = 1): Promise<void> {
  let size = firstSize(first, align);
  for (let start = from; start < to; ) {
    const end = Math.min(to, start + size);
    size = timed(work, start, end, size, align);
    if (end === to) break;
    between(end);
    await nextTurn();
    start = end;
  }
}

/** CPU time spent timing the first items of a call that may go to the pool, ms. */
export const SAMPLE_MS = 1;

// The process's CPU time, ms, where Node gives it: the work a piece took whatever share of a
// core the machine's load left this thread (the clock counted the waits too, and a loaded
// machine sent small jobs to the pool). Elsewhere the clock.
const cpuUsage = (globalThis as { process?: { cpuUsage?: () => { user: number; system: number } } }).process?.cpuUsage;
const cpuNow: () => number = typeof cpuUsage === "function"
  ? () => {
      const c = cpuUsage();
      return (c.user + c.system) / 1000;
    }
  : now;

/**
 * The first items of [0, total) in the calling thread, timed: pieces double
 * from `first` items (inner boundaries on multiples of `align`) until they
 * have taken SAMPLE_MS of CPU time or an eighth of the items are done, and
 * `between(done)` follows each piece. Returns the items done and the CPU time
 * the rest would take here at the rate measured, ms. Items are independent, so the work done here
 * is part of the result whichever way the rest goes. Bounded: the pieces
 * double, so there are at most log2(total) of them.
 */
export function timedHead(total: number, work: (start: number, end: number) => void, between: (done: number) => void, align = 1, first = 256): { done: number; restMs: number } {
  const cap = Math.min(total, Math.max(align, Math.floor(total / 8 / align) * align));
  const t0 = cpuNow();
  let done = 0;
  for (let size = firstSize(first, align); done < cap; size = Math.min(largest(align), size * 2)) {
    const end = Math.min(cap, done + size);
    work(done, end);
    done = end;
    between(done);
    if (cpuNow() - t0 >= SAMPLE_MS) break;
  }
  return { done, restMs: done === 0 ? 0 : ((cpuNow() - t0) * (total - done)) / done };
}
