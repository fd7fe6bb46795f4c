/**
 * Resampling whole episodes with replacement: the nonparametric bootstrap over independent units
 * (Efron & Tibshirani, "An Introduction to the Bootstrap", 1993, ch. 6), applied to fitted
 * Q-evaluation by resampling trajectories (Hao et al., "Bootstrapping Fitted Q-Evaluation for
 * Off-Policy Inference", ICML 2021). Transitions inside an episode are dependent; episodes are
 * taken as independent, so the episode is the unit that is drawn.
 *
 * A resample is stored as its multiplicities c_k (how often episode k was drawn; Σ c_k = e), so
 * every estimator can reweight its per-episode sums instead of copying data. Resample b draws
 * from its own stream seeded by resampleSeed(seed, b): the same b gives the same resample in
 * whichever worker and order it is computed, so resamples can be split across workers freely.
 */
import { addIntegerCounts } from '../random';

export class BootstrapError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'BootstrapError';
  }
}

/**
 * A 32-bit seed for resample `index` of a run seeded with `seed`: the finaliser of MurmurHash3
 * (Appleby, 2011; common practice for seed mixing) applied twice, so neighbouring (seed, index)
 * pairs give unrelated streams.
 */
export function resampleSeed(seed: number, index: number): number {
  return fmix32((fmix32(seed >>> 0) ^ Math.imul(index + 1, 0x9e3779b9)) >>> 0);
}

function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/**
 * Multiplicities of one resample of `episodeCount` episodes: e draws with replacement, so the
 * counts are multinomial(e; 1/e, …, 1/e). Written to out (length ≥ e) and returned.
 */
export function episodeMultiplicities(episodeCount: number, seed: number, index: number, out = new Uint32Array(episodeCount)): Uint32Array {
  if (!Number.isInteger(episodeCount) || episodeCount < 1) throw new BootstrapError(`episodes: expected a whole number ≥ 1, got ${episodeCount}`);
  if (!Number.isInteger(index) || index < 0) throw new BootstrapError(`resample index: expected a whole number ≥ 0, got ${index}`);
  if (out.length < episodeCount) throw new BootstrapError(`multiplicities: room for ${out.length} episodes, need ${episodeCount}`);
  out.fill(0, 0, episodeCount);
  addIntegerCounts(resampleSeed(seed, index), episodeCount, episodeCount, out); // draw k is createRandom(resampleSeed(seed, index)).integer(e)
  return out;
}

/** Multiplicities of the original sample: every episode once (the full-data fit). */
export function unitMultiplicities(episodeCount: number): Uint32Array {
  return new Uint32Array(episodeCount).fill(1);
}
