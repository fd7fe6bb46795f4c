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
import {
  leadingSums, segmentSumsSteps, bellmanSumsStride, statisticsFromSums, type AccumulationHooks, type BellmanStatistics,
} from '../fqe/bellmanStatistics';
import type { TransitionSet } from '../transitions';
import { runSteps, type PassSteps } from '../fqe/cancellation';
import { BootstrapError } from './episodeMultiplicities';
import { indexEpisodes, type EpisodeIndex } from './episodeTransitions';

export interface EpisodeBellmanSums {
  readonly episodes: number; // e
  readonly dim: number; // d
  readonly stride: number; // 3d² + 2d + 2
  readonly sums: Float64Array; // e×stride
}

/** Per-episode storage above this many numbers (2 GiB of doubles / 8) is refused with a message. */
export const MAX_STORED_VALUES = 1 << 28;

/** One pass over the data in episode order (bellmanStatistics.ts), each episode's sums kept apart. */
export function episodeBellmanSums(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, hooks: AccumulationHooks = {}, index: EpisodeIndex = indexEpisodes(data),
): EpisodeBellmanSums {
  return runSteps(episodeBellmanSumsSteps(data, features, quadrature, hooks, index));
}

/**
 * episodeBellmanSums as a pass that yields after every block (cancellation.ts). policyFree: the
 * per-episode sums of another policy's pass over the same episodes with the same feature map; each
 * episode's ΦᵀΦ, Φᵀr and rᵀr are copied from it (they are this pass's to the last bit,
 * ../fqe/nextFeatureSums.ts) and only the rest is formed.
 */
export function* episodeBellmanSumsSteps(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, hooks: AccumulationHooks = {}, index: EpisodeIndex = indexEpisodes(data),
  policyFree?: EpisodeBellmanSums,
): PassSteps<EpisodeBellmanSums> {
  const e = index.episodes, d = features.dim, stride = bellmanSumsStride(d);
  if (e * stride > MAX_STORED_VALUES) {
    throw new BootstrapError(`the per-episode sums of ${e} episodes × ${d} features would need ${Math.round((e * stride * 8) / 2 ** 20)} MiB; use fewer features or join episodes`);
  }
  if (policyFree && (policyFree.episodes !== e || policyFree.dim !== d)) throw new RangeError('episodeBellmanSumsSteps: the shared sums are of another size');
  const sums = new Float64Array(e * stride);
  if (policyFree) copyPolicyFree(policyFree, sums);
  yield* segmentSumsSteps(data, features, quadrature, index, sums, hooks, policyFree !== undefined);
  return { episodes: e, dim: d, stride, sums };
}

/** Each episode's ΦᵀΦ (the first d² numbers), Φᵀr (d numbers after the three matrices) and rᵀr (after Ψᵀr). */
function copyPolicyFree(from: EpisodeBellmanSums, to: Float64Array): void {
  const { episodes: e, dim: d, stride } = from, dd = d * d;
  for (let k = 0; k < e; k++) {
    const o = k * stride;
    to.set(from.sums.subarray(o, o + dd), o);
    to.set(from.sums.subarray(o + 3 * dd, o + 3 * dd + d), o + 3 * dd);
    to[o + 3 * dd + 2 * d] = from.sums[o + 3 * dd + 2 * d];
  }
}

/**
 * The Bellman statistics of a resample: Σ_k c_k S_k / Σ_k c_k n_k. multiplicities: e. scratch, when
 * given, is a buffer of length stride reused between calls.
 */
export function resampleBellmanStatistics(
  sums: EpisodeBellmanSums, multiplicities: ArrayLike<number>, scratch: Float64Array = new Float64Array(sums.stride),
): BellmanStatistics {
  return resampleBellmanStatisticsBlock(sums, [multiplicities], [scratch])[0];
}

/** Resamples summed side by side in one sweep of a row (the inner loop is written out for this many). */
const LANES = 4;

/**
 * resampleBellmanStatistics for several resamples at once: each episode's row of sums is read once
 * for four resamples side by side (their totals interleaved), and only the entries the statistics
 * use are added (the upper triangles of the symmetric ΦᵀΦ and ΨᵀΨ; statisticsFromSums mirrors
 * them). Per resample these are the same additions in the same order as one at a time — an episode
 * a resample did not draw adds c·x = +0, which leaves a total that started at +0 unchanged — so,
 * for finite sums, the same numbers to the last bit. scratch: one buffer of length stride per
 * resample, reused between calls.
 */
export function resampleBellmanStatisticsBlock(
  sums: EpisodeBellmanSums, block: readonly ArrayLike<number>[], scratch: readonly Float64Array[],
): BellmanStatistics[] {
  const { episodes: e, dim: d, stride } = sums, count = block.length;
  if (count > scratch.length) throw new RangeError(`resampleBellmanStatisticsBlock: ${count} resamples, ${scratch.length} scratch buffers`);
  for (let r = 0; r < count; r++) {
    if (block[r].length !== e) throw new BootstrapError(`multiplicities: expected one per episode (${e}), got ${block[r].length}`);
    if (scratch[r].length < stride) throw new RangeError(`resampleBellmanStatisticsBlock: scratch of ${scratch[r].length}, need ${stride}`);
  }
  const ranges = usedRanges(d), lanes = new Float64Array(LANES * stride), none = new Uint32Array(e);
  for (let first = 0; first < count; first += LANES) {
    const group = Array.from({ length: LANES }, (_, l) => (first + l < count ? block[first + l] : none));
    addLanes(sums.sums, stride, e, ranges, group, lanes);
    for (let l = 0; l < LANES && first + l < count; l++) {
      const total = scratch[first + l];
      for (let j = 0; j < stride; j++) total[j] = lanes[j * LANES + l];
    }
  }
  return scratch.slice(0, count).map((total) => {
    if (!(total[stride - 1] > 0)) throw new BootstrapError('resample: the episodes drawn contain no transitions');
    return statisticsFromSums(total, d);
  });
}

/** totals[j·4 + l] = Σ_k c_{l,k} S_k[j] over the used entries j, four resamples l side by side. */
function addLanes(values: Float64Array, stride: number, e: number, ranges: Int32Array, c: readonly ArrayLike<number>[], totals: Float64Array): void {
  totals.fill(0);
  const [m0, m1, m2, m3] = c;
  for (let k = 0; k < e; k++) {
    const c0 = m0[k], c1 = m1[k], c2 = m2[k], c3 = m3[k];
    if (c0 === 0 && c1 === 0 && c2 === 0 && c3 === 0) continue;
    const o = k * stride;
    for (let g = 0; g < ranges.length; g += 2) {
      for (let j = ranges[g], q = j * LANES; j < ranges[g + 1]; j++, q += LANES) {
        const x = values[o + j];
        totals[q] += c0 * x;
        totals[q + 1] += c1 * x;
        totals[q + 2] += c2 * x;
        totals[q + 3] += c3 * x;
      }
    }
  }
}

/** [from, to) pairs of the entries of a row that statisticsFromSums reads: upper ΦᵀΦ, all of ΦᵀΨ, upper ΨᵀΨ, then the vectors, rᵀr and n. */
function usedRanges(d: number): Int32Array {
  const dd = d * d, out: number[] = [];
  for (let a = 0; a < d; a++) out.push(a * d + a, a * d + d);
  out.push(dd, 2 * dd);
  for (let a = 0; a < d; a++) out.push(2 * dd + a * d + a, 2 * dd + a * d + d);
  out.push(3 * dd, bellmanSumsStride(d));
  return Int32Array.from(out);
}

/** Each episode's sums of the first k features (leadingSums in bellmanStatistics.ts): a pass with the smaller nested map, to the last bit, where both maps take the same route to E_{a~π} φ (policyFeatureAverage.ts averageRoute). */
export function leadingEpisodeSums(sums: EpisodeBellmanSums, k: number): EpisodeBellmanSums {
  const stride = bellmanSumsStride(k), out = new Float64Array(sums.episodes * stride);
  for (let e = 0; e < sums.episodes; e++) leadingSums(sums.sums, e * sums.stride, sums.dim, out, e * stride, k);
  return { episodes: sums.episodes, dim: k, stride, sums: out };
}
