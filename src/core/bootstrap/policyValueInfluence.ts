/**
 * Empirical influence values of J per episode, for a linear fit taken to first order
 * (linearisedReplicate.ts): with the resample's value
 *   J_c = Σ_s c_{k(s)} j_s / Σ_s c_{k(s)} + Σ_k c_k s_k / Σ_k c_k n_k,
 * episode k's influence is l_k = (Σ_k c_k) ∂J_c/∂c_k (Davison & Hinkley 1997, §2.7.2, the
 * derivative in the direction of one more copy of unit k, scaled to the sample size):
 *   l_k = e·[ Σ_{s∈k} (j_s − j̄_c) / W_c + (s_k − n_k s̄_c) / N_c ],
 *   W_c = Σ_s c_{k(s)},  N_c = Σ_k c_k n_k,  s̄_c = Σ_k c_k s_k / N_c,  e = Σ_k c_k,
 * where s ∈ k are the start states of episode k (none when start states are not resampled with
 * the episodes). Σ_k c_k l_k = 0. Without multiplicities every episode once (the full data).
 * influenceStandardError (studentisedInterval.ts) turns them into the delta-method standard error.
 */
import { BootstrapError } from './episodeMultiplicities';
import type { LinearisedReplicates } from './linearisedReplicate';

export function policyValueInfluence(lin: LinearisedReplicates, multiplicities?: ArrayLike<number>): Float64Array {
  const e = lin.counts.length, c = (k: number) => (multiplicities ? multiplicities[k] : 1);
  if (multiplicities && multiplicities.length !== e) throw new BootstrapError(`multiplicities: expected one per episode (${e}), got ${multiplicities.length}`);
  let drawn = 0, transitions = 0, influenceTotal = 0;
  for (let k = 0; k < e; k++) {
    drawn += c(k);
    transitions += c(k) * lin.counts[k];
    influenceTotal += c(k) * lin.influence[k];
  }
  if (!(transitions > 0)) throw new BootstrapError('resample: the episodes drawn contain no transitions');
  const out = new Float64Array(e), meanInfluence = influenceTotal / transitions;
  for (let k = 0; k < e; k++) out[k] = drawn * (lin.influence[k] - lin.counts[k] * meanInfluence) / transitions;
  if (!lin.startsFollowEpisodes) return out;
  const episodeOf = (s: number) => (lin.startEpisode ? lin.startEpisode[s] : s);
  let weight = 0, total = 0;
  for (let s = 0; s < lin.startValues.length; s++) {
    weight += c(episodeOf(s));
    total += c(episodeOf(s)) * lin.startValues[s];
  }
  if (!(weight > 0)) throw new BootstrapError('start states: the resample holds none');
  const mean = total / weight;
  for (let s = 0; s < lin.startValues.length; s++) out[episodeOf(s)] += drawn * (lin.startValues[s] - mean) / weight;
  return out;
}
