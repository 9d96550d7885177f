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
