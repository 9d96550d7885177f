/*
 * Reusable SharedArrayBuffers for the parallel entries' copies of a caller's
 * plain arrays. The pages of a fresh buffer are faulted in on first touch:
 * 20-100 ns per double on the 2-core VM these were measured on, so copying a
 * 1e6-point field map (3e6 doubles) into a fresh SharedArrayBuffer took
 * 300-450 ms under load, longer than computing the map (about 200 ms); into a
 * buffer touched before it took 1.4 ms (bench/parallel.ts, and the README's
 * worker-threads section). A buffer is lent to one call at a time, given back
 * when the call's tasks are all done, and dropped after KEEP_MS without use,
 * so an idle process does not hold the memory.
 */

/** Time after the last give-back at which kept buffers are dropped, ms. */
const KEEP_MS = 5000;
/** Most bytes kept for reuse; a larger buffer is dropped when given back. */
const KEEP_BYTES = 256 * 1024 * 1024;

const kept: SharedArrayBuffer[] = [];
let timer: ReturnType<typeof setTimeout> | undefined;

/** A Float64Array of `length` over a SharedArrayBuffer, reused when one that fits is kept. Contents are undefined. */
export function borrowShared(length: number): Float64Array {
  const bytes = length * 8;
  let best = -1;
  for (let i = 0; i < kept.length; i++) {
    if (kept[i]!.byteLength >= bytes && (best < 0 || kept[i]!.byteLength < kept[best]!.byteLength)) best = i;
  }
  const buffer = best >= 0 ? kept.splice(best, 1)[0]! : new SharedArrayBuffer(bytes);
  return new Float64Array(buffer, 0, length);
}

/**
 * Gives a borrowed array back for reuse. Call it only when no task can touch
 * the array any more (after every task of the call has ended); on a failed
 * call leave the array to the garbage collector instead.
 */
export function giveBackShared(a: Float64Array): void {
  kept.push(a.buffer as SharedArrayBuffer);
  // Largest first; drop what exceeds KEEP_BYTES in total.
  kept.sort((x, y) => y.byteLength - x.byteLength);
  let total = 0;
  for (let i = 0; i < kept.length;) {
    const b = kept[i]!.byteLength;
    if (total + b > KEEP_BYTES) kept.splice(i, 1);
    else {
      total += b;
      i++;
    }
  }
  if (timer !== undefined) clearTimeout(timer);
  timer = setTimeout(() => {
    kept.length = 0;
    timer = undefined;
  }, KEEP_MS);
  // The timer alone does not keep a process alive.
  (timer as { unref?: () => void }).unref?.();
}

/** Bytes kept for reuse now (for tests). */
export function keptSharedBytes(): number {
  return kept.reduce((s, b) => s + b.byteLength, 0);
}
