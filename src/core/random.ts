/**
 * Seeded pseudo-random numbers for simulators, sampling and bootstrap.
 *
 * xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number generators", 2021),
 * seeded through splitmix32 so that nearby seeds give unrelated streams. Pure 32-bit integer
 * arithmetic, so Node, a browser worker and the renderer produce the same numbers for a seed.
 */
export interface RandomSource {
  /** Uniform on [0, 1), 53 random bits. */
  uniform(): number;
  /** Standard normal N(0, 1) by the Box–Muller transform (Box & Muller, 1958). */
  normal(): number;
  /** Uniform integer in [0, n). */
  integer(n: number): number;
}

function splitmix32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/** A generator whose whole stream is fixed by `seed` (any finite number; its low 32 bits are used). */
export function createRandom(seed: number): RandomSource {
  let [s0, s1, s2, s3] = initialState(seed);
  const next32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5) >>> 0, 7), 9) >>> 0;
    const t = (s1 << 9) >>> 0;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
    s3 = rotl(s3 >>> 0, 11);
    s0 >>>= 0; s1 >>>= 0; s2 >>>= 0;
    return result;
  };
  let spareNormal: number | null = null;
  const uniform = (): number => ((next32() >>> 5) * 67108864 + (next32() >>> 6)) / 9007199254740992;
  return {
    uniform,
    normal() {
      if (spareNormal !== null) {
        const z = spareNormal;
        spareNormal = null;
        return z;
      }
      let u = uniform();
      while (u === 0) u = uniform();
      const radius = Math.sqrt(-2 * Math.log(u));
      const angle = 2 * Math.PI * uniform();
      spareNormal = radius * Math.sin(angle);
      return radius * Math.cos(angle);
    },
    integer(n: number) {
      return Math.floor(uniform() * n);
    },
  };
}

/** The four xoshiro128** state words a stream seeded with `seed` starts from. */
function initialState(seed: number): [number, number, number, number] {
  const init = splitmix32(seed);
  const s0 = init(), s1 = init(), s2 = init(), s3 = init();
  return (s0 | s1 | s2 | s3) === 0 ? [1, s1, s2, s3] : [s0, s1, s2, s3]; // the all-zero state is a fixed point of xoshiro
}

/**
 * How often each of 0 … n − 1 comes up in `draws` calls of createRandom(seed).integer(n), added into
 * out[0 … n): the same stream and arithmetic as those calls (each takes two 32-bit outputs for a
 * 53-bit uniform), with the generator's state in local variables, which is several times faster
 * in the bootstrap's multiplicities (episodeMultiplicities.ts) than calling integer() per draw.
 */
export function addIntegerCounts(seed: number, n: number, draws: number, out: Uint32Array): void {
  let [s0, s1, s2, s3] = initialState(seed);
  for (let draw = 0; draw < draws; draw++) {
    let r = Math.imul(s1, 5);
    const high = Math.imul((r << 7) | (r >>> 25), 9) >>> 0;
    let t = s1 << 9;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t; s3 = (s3 << 11) | (s3 >>> 21);
    r = Math.imul(s1, 5);
    const low = Math.imul((r << 7) | (r >>> 25), 9) >>> 0;
    t = s1 << 9;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t; s3 = (s3 << 11) | (s3 >>> 21);
    out[Math.floor((((high >>> 5) * 67108864 + (low >>> 6)) / 9007199254740992) * n)]++;
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
