/**
 * Seeded pseudo-random numbers. The generator is always an explicit argument: no module state.
 * Algorithm: xoshiro128** (Blackman & Vigna 2018, "Scrambled linear pseudorandom number generators"),
 * state seeded from a 32-bit seed through SplitMix32. Uniforms carry 53 random bits (two outputs).
 * Normals by the Box–Muller transform, caching the second value.
 */
export interface Rng {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal N(0, 1). */
  normal(): number;
  /** Unsigned 32-bit integer. */
  nextUint32(): number;
}

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

export function createRng(seed: number): Rng {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new RangeError(`seed must be an integer in [0, 2^32 - 1], got ${seed}`);
  }
  const sm = splitmix32(seed);
  let s0 = sm();
  let s1 = sm();
  let s2 = sm();
  let s3 = sm();
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
  const rotl = (x: number, k: number) => ((x << k) | (x >>> (32 - k))) >>> 0;
  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5) >>> 0, 7), 9) >>> 0;
    const t = (s1 << 9) >>> 0;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    s0 >>>= 0;
    s1 >>>= 0;
    s2 >>>= 0;
    return result;
  };
  const uniform = (): number => {
    const hi = nextUint32() >>> 5; // 27 bits
    const lo = nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / 9007199254740992;
  };
  let spare: number | null = null;
  const normal = (): number => {
    if (spare !== null) {
      const v = spare;
      spare = null;
      return v;
    }
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal, nextUint32 };
}

/** Derive an independent sub-seed (e.g. per sightline in a batch) from a seed and an index. */
export function deriveSeed(seed: number, index: number): number {
  const sm = splitmix32((seed ^ Math.imul(index + 1, 0x9e3779b1)) >>> 0);
  return sm();
}
