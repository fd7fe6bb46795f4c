/**
 * The one-pass Bellman statistics of linear fitted Q-evaluation (../fqe/bellmanStatistics.ts),
 * kept per episode so that any bootstrap resample's statistics are a weighted sum of them.
 *
 * Why: every statistic is an average over transitions (G = ΦᵀΦ/n, M = ΦᵀΨ/n, …). A resample that
 * draws episode k c_k times therefore has sums Σ_k c_k S_k and count Σ_k c_k n_k, where S_k are
 * episode k's sums. Forming them costs O(e·d²) per resample instead of a pass over the data with
 * its quadrature and feature evaluations (O(n·K·d²)); the fit after that is the same O(d²)–O(d³)
 * solve as for the full data. The per-episode sums are computed once, by the very routine the
 * full-data fit uses, so a resample's statistics equal those of a refit on the resampled data up to
 * rounding in the order of summation.
 *
 * Layout per episode (stride = 3d² + 2d + 2): [ΦᵀΦ | ΦᵀΨ | ΨᵀΨ | Φᵀr | Ψᵀr | rᵀr | n_k].
 */
import type { ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import { accumulateBellmanStatistics, type BellmanStatistics } from '../fqe/bellmanStatistics';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import type { TransitionSet } from '../transitions';
import { BootstrapError } from './episodeMultiplicities';
import { episodeTransitions, indexEpisodes, type EpisodeIndex } from './episodeTransitions';

export interface EpisodeBellmanSums {
  readonly episodes: number; // e
  readonly dim: number; // d
  readonly stride: number; // 3d² + 2d + 2
  readonly sums: Float64Array; // e×stride
}

/** Per-episode storage above this many numbers (2 GiB of doubles / 8) is refused with a message. */
const MAX_STORED_VALUES = 1 << 28;

function bellmanSumsStride(d: number): number {
  return 3 * d * d + 2 * d + 2;
}

export function episodeBellmanSums(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, cancel?: CancellationCheck, index: EpisodeIndex = indexEpisodes(data),
): EpisodeBellmanSums {
  const e = index.episodes, d = features.dim, stride = bellmanSumsStride(d);
  if (e * stride > MAX_STORED_VALUES) {
    throw new BootstrapError(`the per-episode sums of ${e} episodes × ${d} features would need ${Math.round((e * stride * 8) / 2 ** 20)} MiB; use fewer features or join episodes`);
  }
  const sums = new Float64Array(e * stride), one = Int32Array.of(0);
  for (let k = 0; k < e; k++) {
    throwIfCancelled(cancel);
    const n = index.offsets[k + 1] - index.offsets[k];
    if (n === 0) continue; // an episode without transitions adds only its start state
    one[0] = k;
    const stats = accumulateBellmanStatistics(episodeTransitions(data, index, one), features, quadrature);
    writeSums(stats, sums, k * stride);
  }
  return { episodes: e, dim: d, stride, sums };
}

/** Averages × n back into sums, in the packed layout. */
function writeSums(stats: BellmanStatistics, out: Float64Array, offset: number): void {
  const n = stats.count;
  let o = offset;
  for (const part of [stats.gram, stats.crossNext, stats.nextGram, stats.featureReward, stats.nextFeatureReward]) {
    for (let j = 0; j < part.length; j++) out[o + j] = part[j] * n;
    o += part.length;
  }
  out[o] = stats.rewardSquare * n;
  out[o + 1] = n;
}

/**
 * The Bellman statistics of a resample: Σ_k c_k S_k / Σ_k c_k n_k. multiplicities: e. scratch, when
 * given, is a buffer of length stride reused between calls.
 */
export function resampleBellmanStatistics(
  sums: EpisodeBellmanSums, multiplicities: ArrayLike<number>, scratch: Float64Array = new Float64Array(sums.stride),
): BellmanStatistics {
  const { episodes: e, dim: d, stride } = sums;
  if (multiplicities.length !== e) throw new BootstrapError(`multiplicities: expected one per episode (${e}), got ${multiplicities.length}`);
  scratch.fill(0);
  for (let k = 0; k < e; k++) {
    const c = multiplicities[k];
    if (c === 0) continue;
    const o = k * stride;
    for (let j = 0; j < stride; j++) scratch[j] += c * sums.sums[o + j];
  }
  const n = scratch[stride - 1];
  if (!(n > 0)) throw new BootstrapError('resample: the episodes drawn contain no transitions');
  const part = (from: number, length: number) => Float64Array.from(scratch.subarray(from, from + length), (v) => v / n);
  const dd = d * d;
  return {
    count: n, dim: d, gram: part(0, dd), crossNext: part(dd, dd), nextGram: part(2 * dd, dd),
    featureReward: part(3 * dd, d), nextFeatureReward: part(3 * dd + d, d), rewardSquare: scratch[stride - 2] / n,
  };
}
