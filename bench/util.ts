/**
 * Timing helpers for the ratio benchmarks. Every measured loop returns a value
 * that is folded into `sink`, so no work can be dropped as dead code. Runs of
 * the compared loops are interleaved and the median of several runs is used,
 * which makes a ratio from one process run meaningful on a noisy machine.
 */

/** One row of the benchmark table. */
export interface BenchRow {
  name: string;
  value: string;
  note: string;
}

let sinkValue = 0;
/** Consume a result so the engine cannot drop the computation. */
export function sink(v: number): void {
  sinkValue += v === v ? 1 : 0;
}
export function sinkTotal(): number {
  return sinkValue;
}

/** Median nanoseconds per operation of each loop, and median per-round ratios to the first loop. */
export interface Comparison {
  readonly ns: Record<string, number>;
  /** For each loop, the median over rounds of (its time / the first loop's time in the same round). */
  readonly ratio: Record<string, number>;
}

/**
 * Each loop runs `ops` operations (one count, or one per loop) and returns a number (consumed). Loops are
 * warmed up, then run `rounds` times in alternation; ratios are taken within
 * a round (paired), which keeps slow drifts in machine load out of them.
 */
export function compare(loops: Record<string, () => number>, ops: number | Record<string, number>, rounds = 21, warmup = 5): Comparison {
  const names = Object.keys(loops);
  const times: Record<string, number[]> = Object.fromEntries(names.map((n) => [n, []]));
  const ratios: Record<string, number[]> = Object.fromEntries(names.map((n) => [n, []]));
  for (let w = 0; w < warmup; w++) for (const n of names) sink(loops[n]!());
  for (let r = 0; r < rounds; r++) {
    const round: number[] = [];
    for (const n of names) {
      const t0 = process.hrtime.bigint();
      const v = loops[n]!();
      const t1 = process.hrtime.bigint();
      sink(v);
      const t = Number(t1 - t0) / (typeof ops === "number" ? ops : ops[n]!);
      times[n]!.push(t);
      round.push(t);
    }
    names.forEach((n, i) => ratios[n]!.push(round[i]! / round[0]!));
  }
  return {
    ns: Object.fromEntries(names.map((n) => [n, median(times[n]!)])),
    ratio: Object.fromEntries(names.map((n) => [n, median(ratios[n]!)])),
  };
}

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** Deterministic uniform random numbers (xorshift), so runs are comparable. */
export function randomArray(n: number, lo: number, hi: number, seed: number): Float64Array {
  const out = new Float64Array(n);
  let s = seed >>> 0 || 1;
  for (let i = 0; i < n; i++) {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    out[i] = lo + ((hi - lo) * s) / 4294967296;
  }
  return out;
}

export function times(r: number): string {
  return `${r.toFixed(2)}x`;
}

export function ns(v: number): string {
  return v >= 1000 ? `${(v / 1000).toFixed(2)} us` : `${v.toFixed(1)} ns`;
}
