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
import type { TransitionSet } from '../transitions';

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
  const gram = new Float64Array(d * d), featureReward = new Float64Array(d), phi = new Float64Array(d);
  const input = new Float64Array(data.stateDim + data.actionDim);
  let rewardSquare = 0;
  for (let k = 0; k < index.episodes; k++) {
    if (k % 64 === 0) throwIfCancelled(options.cancel);
    const slot = perEpisode ? k * stride : -1;
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const i = index.order[p], r = data.rewards[i];
      logged(data, i, input);
      features.evaluate(input, 0, phi, 0);
      if (store) store.set(phi, p * d);
      addOuter(phi, r, d, gram, featureReward);
      rewardSquare += r * r;
      if (perEpisode) {
        addOuter(phi, r, d, perEpisode.subarray(slot, slot + d * d), perEpisode.subarray(slot + d * d, slot + d * d + d));
        perEpisode[slot + d * d + d] += r * r;
        perEpisode[slot + d * d + d + 1] += 1;
      }
    }
  }
  for (let j = 0; j < d * d; j++) gram[j] /= n;
  for (let j = 0; j < d; j++) featureReward[j] /= n;
  return { count: n, dim: d, index, features: store, gram, featureReward, rewardSquare: rewardSquare / n, episodeSums: perEpisode };
}

/** [s_i, a_i] into input. */
export function logged(data: TransitionSet, i: number, input: Float64Array): void {
  const ds = data.stateDim, m = data.actionDim;
  for (let c = 0; c < ds; c++) input[c] = data.states[i * ds + c];
  for (let c = 0; c < m; c++) input[ds + c] = data.actions[i * m + c];
}

/** gram += φφᵀ, reward += r·φ. */
function addOuter(phi: Float64Array, r: number, d: number, gram: Float64Array, reward: Float64Array): void {
  for (let a = 0; a < d; a++) {
    const pa = phi[a];
    reward[a] += r * pa;
    for (let b = 0; b < d; b++) gram[a * d + b] += pa * phi[b];
  }
}
