/**
 * A small seeded generator for reproducible Monte Carlo: xoshiro128** 1.1
 * (D. Blackman and S. Vigna, "Scrambled linear pseudorandom number generators",
 * ACM TOMS 47 (2021); public-domain reference algorithm), seeded through
 * splitmix32 so any 32-bit seed gives a well-mixed non-zero state.
 */
export interface Random {
  /** Uniform in [0, 1) with 32 random bits. */
  next(): number;
  /** Standard normal (Box-Muller; polar form not needed at these sample counts). */
  normal(): number;
}

/** Create a seeded generator. The same seed always yields the same sequence. */
export function createRandom(seed: number): Random {
  let z = seed >>> 0;
  const splitmix = (): number => {
    z = (z + 0x9e3779b9) >>> 0;
    let t = z;
    t = Math.imul(t ^ (t >>> 16), 0x85ebca6b) >>> 0;
    t = Math.imul(t ^ (t >>> 13), 0xc2b2ae35) >>> 0;
    return (t ^ (t >>> 16)) >>> 0;
  };
  let s0 = splitmix();
  let s1 = splitmix();
  let s2 = splitmix();
  let s3 = splitmix();
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
  const nextU32 = (): number => {
    const r = Math.imul(rotl(Math.imul(s1, 5) >>> 0, 7), 9) >>> 0;
    const t = (s1 << 9) >>> 0;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3 >>> 0, 11);
    s0 >>>= 0; s1 >>>= 0; s2 >>>= 0;
    return r;
  };
  let spare: number | undefined;
  const next = (): number => nextU32() / 4294967296;
  return {
    next,
    normal(): number {
      if (spare !== undefined) {
        const s = spare;
        spare = undefined;
        return s;
      }
      // 1 - u lies in (0, 1], so the logarithm is finite.
      const r = Math.sqrt(-2 * Math.log(1 - next()));
      const th = 2 * Math.PI * next();
      spare = r * Math.sin(th);
      return r * Math.cos(th);
    },
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

/**
 * Monte Carlo samples per random stream. Sample s draws from stream
 * floor(s / MONTE_CARLO_BLOCK), starting where that stream starts, so a
 * sample's draws depend on its index only: any split of the samples (worker
 * chunks, shards) draws exactly what one run in order draws.
 */
export const MONTE_CARLO_BLOCK = 1024;

/**
 * xoshiro128**'s jump polynomial: the state after 2^64 calls of next(), from
 * the reference implementation (Blackman and Vigna, xoshiro128starstar.c,
 * `jump`). Stream b starts b jumps after the seeded state, so streams do not
 * overlap for fewer than 2^64 draws each.
 */
const JUMP = [0x8764000b, 0xf542d2d3, 0x6fa035c3, 0x77f2db5b] as const;

/** The seeded xoshiro128** state, as createRandom makes it. */
export function seededState(seed: number): Uint32Array {
  let z = seed >>> 0;
  const s = new Uint32Array(4);
  for (let i = 0; i < 4; i++) {
    z = (z + 0x9e3779b9) >>> 0;
    let t = z;
    t = Math.imul(t ^ (t >>> 16), 0x85ebca6b) >>> 0;
    t = Math.imul(t ^ (t >>> 13), 0xc2b2ae35) >>> 0;
    s[i] = (t ^ (t >>> 16)) >>> 0;
  }
  if ((s[0]! | s[1]! | s[2]! | s[3]!) === 0) s[0] = 1;
  return s;
}

/** One xoshiro128** step on `s` in place; returns the 32-bit output. */
export function step(s: Uint32Array): number {
  const r = Math.imul(rotl(Math.imul(s[1]!, 5) >>> 0, 7), 9) >>> 0;
  const t = s[1]! << 9;
  // A Uint32Array stores each result modulo 2^32.
  s[2] = s[2]! ^ s[0]!;
  s[3] = s[3]! ^ s[1]!;
  s[1] = s[1]! ^ s[2]!;
  s[0] = s[0]! ^ s[3]!;
  s[2] = s[2]! ^ t;
  s[3] = rotl(s[3]!, 11);
  return r;
}

/** Advances `s` in place by 2^64 steps (the reference `jump`: 128 steps and xors). */
export function jump(s: Uint32Array): void {
  let a = 0;
  let b = 0;
  let c = 0;
  let d = 0;
  for (let i = 0; i < 4; i++) {
    for (let bit = 0; bit < 32; bit++) {
      if ((JUMP[i]! >>> bit) & 1) {
        a ^= s[0]!;
        b ^= s[1]!;
        c ^= s[2]!;
        d ^= s[3]!;
      }
      step(s);
    }
  }
  s[0] = a;
  s[1] = b;
  s[2] = c;
  s[3] = d;
}

/** A generator over a given state (used in place; the caller owns it). */
function randomOn(s: Uint32Array): Random {
  let spare: number | undefined;
  const next = (): number => step(s) / 4294967296;
  return {
    next,
    normal(): number {
      if (spare !== undefined) {
        const v = spare;
        spare = undefined;
        return v;
      }
      const r = Math.sqrt(-2 * Math.log(1 - next()));
      const th = 2 * Math.PI * next();
      spare = r * Math.sin(th);
      return r * Math.cos(th);
    },
  };
}

/**
 * The Monte Carlo streams of one seed, visited in increasing block order:
 * `at(b)` returns the generator of stream b, fresh at its start (jumps from the
 * last stream visited, so a run over blocks b0..b1 costs b1 jumps in all, about
 * 0.1 ms per 100 blocks).
 */
export class BlockStreams {
  private readonly base: Uint32Array;
  private block = 0;

  constructor(seed: number) {
    this.base = seededState(seed);
  }

  /** Stream `b` (b at least the last one asked for), positioned at its start. */
  at(b: number): Random {
    if (b < this.block) throw new RangeError("streams are visited in increasing order");
    // Bounded by b - block, itself at most the number of blocks of the run.
    for (; this.block < b; this.block++) jump(this.base);
    return randomOn(Uint32Array.from(this.base));
  }
}
