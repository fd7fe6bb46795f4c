/**
 * The parts of linear FQE's one-pass statistics that do not depend on the candidate: with
 * Q = φ(s, a)ᵀw the features of the logged pairs Φ (n×d), the rewards r, and from them
 *   G = ΦᵀΦ/n,  b = Φᵀr/n,  rr = rᵀr/n
 * (Lagoudakis & Parr, JMLR 2003, §5; bellmanStatistics.ts forms the same sums). Across the points
 * of a retune map only Ψ — the candidate-averaged next features — changes, so these are formed
 * once, and Φ is kept (row-major, in episode order) when it fits in memory, so each point's pass
 * reads it instead of evaluating the features again.
 *
 * Per episode (for the bootstrap) the same sums are kept for each episode: G_k, b_k, rr_k, n_k.
 * Shapes: n transitions, d features, e episodes.
 */
import type { FeatureMap } from '../features/featureMap';
import { indexEpisodes, type EpisodeIndex } from '../bootstrap/episodeTransitions';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import { loggedStateAction, type TransitionSet } from '../transitions';

/** Φ is kept when n·d is at most this many numbers (128 MiB of doubles). */
export const MAX_STORED_FEATURE_VALUES = 1 << 24;

export interface PolicyFreeSums {
  readonly count: number; // n
  readonly dim: number; // d
  readonly index: EpisodeIndex; // transitions grouped by episode
  /** Φ in index.order sequence, n×d row-major; null when too large to keep (features re-evaluated per pass). */
  readonly features: Float64Array | null;
  readonly gram: Float64Array; // G = ΦᵀΦ/n, d×d symmetric
  readonly featureReward: Float64Array; // b = Φᵀr/n, d
  readonly rewardSquare: number; // rᵀr/n
  /** Per episode, when asked for: [ΦᵀΦ | Φᵀr | rᵀr | n_k] sums (not averages), stride d² + d + 2. */
  readonly episodeSums: Float64Array | null;
}

export function policyFreeSums(
  data: TransitionSet, features: FeatureMap, options: { perEpisode: boolean; cancel?: CancellationCheck },
): PolicyFreeSums {
  const n = data.count, d = features.dim, index = indexEpisodes(data);
  const store = n * d <= MAX_STORED_FEATURE_VALUES ? new Float64Array(n * d) : null;
  const stride = d * d + d + 2, perEpisode = options.perEpisode ? new Float64Array(index.episodes * stride) : null;
  const gram = new Float64Array(d * d), featureReward = new Float64Array(d), rows = Math.max(32, Math.min(1024, Math.floor((1 << 16) / d)));
  const block = new Float64Array(d * rows), reward = new Float64Array(rows), phi = new Float64Array(d);
  const input = new Float64Array(data.stateDim + data.actionDim), episodeGram = new Float64Array(d * d), episodeReward = new Float64Array(d);
  let rewardSquare = 0;
  for (let k = 0; k < index.episodes; k++) {
    if (k % 64 === 0) throwIfCancelled(options.cancel);
    const target = perEpisode ? { gram: episodeGram.fill(0), reward: episodeReward.fill(0) } : { gram, reward: featureReward };
    let square = 0;
    for (let from = index.offsets[k]; from < index.offsets[k + 1]; from += rows) {
      const size = Math.min(rows, index.offsets[k + 1] - from);
      for (let t = 0; t < size; t++) {
        const i = index.order[from + t];
        loggedStateAction(data, i, input);
        features.evaluate(input, 0, phi, 0);
        if (store) store.set(phi, (from + t) * d);
        for (let a = 0; a < d; a++) block[a * rows + t] = phi[a];
        reward[t] = data.rewards[i];
        square += reward[t] * reward[t];
      }
      addGramBlock(block, reward, size, rows, d, target.gram, target.reward);
    }
    rewardSquare += square;
    if (perEpisode) {
      mirror(episodeGram, d);
      const o = k * stride;
      perEpisode.set(episodeGram, o);
      perEpisode.set(episodeReward, o + d * d);
      perEpisode[o + d * d + d] = square;
      perEpisode[o + d * d + d + 1] = index.offsets[k + 1] - index.offsets[k];
      for (let j = 0; j < d * d; j++) gram[j] += episodeGram[j];
      for (let j = 0; j < d; j++) featureReward[j] += episodeReward[j];
    }
  }
  if (!perEpisode) mirror(gram, d);
  for (let j = 0; j < d * d; j++) gram[j] /= n;
  for (let j = 0; j < d; j++) featureReward[j] /= n;
  return { count: n, dim: d, index, features: store, gram, featureReward, rewardSquare: rewardSquare / n, episodeSums: perEpisode };
}

/** gram (upper triangle) += Σ_t x_t x_tᵀ, reward += Σ_t r_t x_t over a feature-major block (blocked summation). */
function addGramBlock(x: Float64Array, r: Float64Array, size: number, rows: number, d: number, gram: Float64Array, reward: Float64Array): void {
  for (let a = 0; a < d; a++) {
    const oa = a * rows;
    let e = 0;
    for (let t = 0; t < size; t++) e += x[oa + t] * r[t];
    reward[a] += e;
    for (let b = a; b < d; b++) {
      const ob = b * rows;
      let g = 0;
      for (let t = 0; t < size; t++) g += x[oa + t] * x[ob + t];
      gram[a * d + b] += g;
    }
  }
}

/** Copy the upper triangle onto the lower. */
function mirror(m: Float64Array, d: number): void {
  for (let a = 0; a < d; a++) for (let b = a + 1; b < d; b++) m[b * d + a] = m[a * d + b];
}
