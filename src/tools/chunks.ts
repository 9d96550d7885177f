import { nextTurn, type LongRunOptions, type Ticker } from "../core/progress.js";

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
// follow real time even where a test replaces performance.now to drive the ticker's report rate.
const now: () => number = typeof performance !== "undefined" ? performance.now.bind(performance) : Date.now;

/** True when the options ask for progress or cancellation (else a long call runs its loop in one piece, as before). */
export function watched(options: LongRunOptions | undefined): boolean {
  return options !== undefined && options !== null && (options.signal !== undefined || options.onProgress !== undefined);
}

/**
 * `tick(done)` while the work is unfinished (done < total); at the end only
 * the cancellation check, so fraction 1 is reported once, by finish().
 */
export function tickBelow(t: Ticker, done: number, total: number): void {
  if (done < total) t.tick(done);
  else t.check();
}

/** Next piece size: doubled when a piece took under half the aim, halved (not below `align`) when over twice. */
function resize(size: number, ms: number, align: number): number {
  if (ms < CHUNK_MS / 2 && size < 2 ** 24) return size * 2;
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
  let size = Math.max(align, first - (first % align));
  for (let start = from; start < to;) {
    const end = Math.min(to, start + size);
    const t0 = now();
    work(start, end);
    size = resize(size, now() - t0, align);
    if (end < to) between(end);
    start = end;
  }
}

/**
 * `inPieces` for the asynchronous entries: after each piece's `between` it
 * yields one turn of the event loop (nextTurn), so an abort from a timer or
 * another event reaches the loop within one piece.
 */
export async function inPiecesAsync(from: number, to: number, work: (start: number, end: number) => void, between: (done: number) => void, first = 256, align = 1): Promise<void> {
  let size = Math.max(align, first - (first % align));
  for (let start = from; start < to;) {
    const end = Math.min(to, start + size);
    const t0 = now();
    work(start, end);
    size = resize(size, now() - t0, align);
    if (end < to) {
      between(end);
      await nextTurn();
    }
    start = end;
  }
}
