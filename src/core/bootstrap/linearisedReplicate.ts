/**
 * Bootstrap replicates of linear fitted Q-evaluation to first order in the resample weights, for
 * fits whose per-episode sums (episodeBellmanSums.ts: 3d² + 2d + 2 numbers per episode) would not
 * fit in memory or take too long to reweight — the delta method applied to each resample, i.e. the
 * linearised (infinitesimal-jackknife) bootstrap (Efron, "The Jackknife, the Bootstrap and Other
 * Resampling Plans", 1982, §6; Efron & Tibshirani 1993, §21.3).
 *
 * At the full data's fixed point (G + λD − γM)w = b, a resample that draws episode k c_k times has
 * A_c w_c = b_c with A_c = G_c + λD − γM_c; to first order
 *   w_c − w ≈ A⁻¹(b_c − A_c w) = A⁻¹ Σ_k c_k u_k / N_c,   N_c = Σ_k c_k n_k,
 *   u_k = Σ_{i∈k} φ_i δ_i − n_k λDw,   δ_i = r_i + γψ_iᵀw − φ_iᵀw   (Σ_k u_k = 0 at the fixed point),
 * and with v = A⁻ᵀξ̄ (ξ̄ the mean start feature) the value of the resample is
 *   J_c ≈ Σ_k c_k j_k / Σ_k c_k + Σ_k c_k s_k / N_c,   s_k = vᵀu_k,   j_k = ξ(s0_k)ᵀw,
 * so each resample costs O(e) after one more pass over the data that forms the scalars s_k. The
 * terms left out are of second order, O(1/N); the test compares it with the exact reweighting.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import { runSteps, type CancellationCheck, type PassSteps } from '../fqe/cancellation';
import { ridgeGram } from '../fqe/ridgeSystem';
import { dot, luFactor, luSolve, transpose } from '../linalg/dense';
import type { TransitionSet } from '../transitions';
import type { EpisodeBellmanSums } from './episodeBellmanSums';
import { BootstrapError } from './episodeMultiplicities';
import type { EpisodeIndex } from './episodeTransitions';
import { nestedInfluenceSteps } from './nestedInfluencePass';

export interface LinearisedReplicates {
  /** s_k per episode (reward units per transition). */
  readonly influence: Float64Array; // e
  /** n_k per episode. */
  readonly counts: Float64Array; // e
  /** j_k = ξ(s0_k)ᵀw per start state. */
  readonly startValues: Float64Array;
  /** True when the start states are episodes' first states, so they are resampled with their episodes. */
  readonly startsFollowEpisodes: boolean;
  /** Episode of each start state (TransitionSet.startEpisode); absent when start state k is episode k's. */
  readonly startEpisode?: Int32Array;
}

export interface LinearisationInput {
  readonly data: TransitionSet;
  readonly index: EpisodeIndex;
  readonly features: FeatureMap;
  readonly quadrature: ActionQuadrature;
  /** The full data's statistics and the fixed-point weights solved from them. */
  readonly statistics: BellmanStatistics;
  readonly weights: Float64Array; // w, d
  readonly ridge: number;
  readonly discount: number;
  /** ξ(s0) per start state, count×d. */
  readonly startFeatures: Float64Array;
  readonly startsFollowEpisodes: boolean;
  readonly startEpisode?: Int32Array;
  /** ξ̄ of a resample (its start states weighted by their multiplicities); absent: the plain mean of startFeatures. */
  readonly meanStartFeatures?: Float64Array;
  readonly cancel?: CancellationCheck;
}

export function linearisedReplicates(input: LinearisationInput): LinearisedReplicates {
  return runSteps(linearisedReplicatesSteps(input));
}

/** What both routes to the influence values share: v = A⁻ᵀξ̄, the ridge's share per transition and j_k. */
export interface InfluenceSetup {
  readonly v: Float64Array; // d
  readonly ridgeTerm: number;
  readonly startValues: Float64Array;
}

export function influenceSetup(input: LinearisationInput): InfluenceSetup {
  const { features, statistics, weights: w, discount } = input, d = features.dim;
  const starts = input.startFeatures.length / d, xiBar = new Float64Array(d), startValues = new Float64Array(starts);
  for (let s = 0; s < starts; s++) {
    const xi = input.startFeatures.subarray(s * d, (s + 1) * d);
    startValues[s] = dot(xi, w);
    for (let f = 0; f < d; f++) xiBar[f] += xi[f] / starts;
  }
  if (input.meanStartFeatures) xiBar.set(input.meanStartFeatures);
  const system = ridgeGram(statistics, input.ridge, features.constantIndex);
  for (let k = 0; k < d * d; k++) system[k] -= discount * statistics.crossNext[k];
  const v = luSolve(luFactor(transpose(system, d, d), d), xiBar); // v = A⁻ᵀ ξ̄
  // n_k λ vᵀDw: the ridge's share of u_k per transition (D = I but 0 at the constant feature).
  let ridgeTerm = 0;
  for (let f = 0; f < d; f++) if (f !== features.constantIndex) ridgeTerm += input.ridge * v[f] * w[f];
  return { v, ridgeTerm, startValues };
}

/** linearisedReplicates as a pass that yields now and then (cancellation.ts): the nested classes' pass with one class. */
export function* linearisedReplicatesSteps(input: LinearisationInput): PassSteps<LinearisedReplicates> {
  return (yield* nestedInfluenceSteps([input], [influenceSetup(input)]))[0];
}

/**
 * The same influence values from each episode's Bellman sums (episodeBellmanSums.ts), with no pass
 * over the data: Σ_{i∈k} δ_i φ_iᵀv = vᵀ(Φᵀr)_k + γ vᵀ(ΦᵀΨ)_k w − vᵀ(ΦᵀΦ)_k w (distributive law), so
 * each episode costs O(d²). Equal to the pass up to rounding in the order of summation; the test
 * compares the two. ΦᵀΦ is read from its upper triangle (the packed sums keep only that).
 */
export function linearisedReplicatesFromSums(input: LinearisationInput, sums: EpisodeBellmanSums): LinearisedReplicates {
  const { weights: w, discount } = input, { episodes: e, dim: d, stride } = sums, dd = d * d;
  if (d !== input.features.dim || e !== input.index.episodes) throw new BootstrapError('linearised replicates: the per-episode sums are of another size');
  const { v, ridgeTerm, startValues } = influenceSetup(input);
  const influence = new Float64Array(e), counts = new Float64Array(e);
  for (let k = 0; k < e; k++) {
    const o = k * stride, n = sums.sums[o + stride - 1];
    let s = 0;
    for (let a = 0; a < d; a++) {
      let gw = 0, mw = 0;
      for (let b = 0; b < d; b++) {
        gw += sums.sums[o + (a <= b ? a * d + b : b * d + a)] * w[b];
        mw += sums.sums[o + dd + a * d + b] * w[b];
      }
      s += v[a] * (sums.sums[o + 3 * dd + a] + discount * mw - gw);
    }
    influence[k] = s - n * ridgeTerm;
    counts[k] = n;
  }
  return { influence, counts, startValues, startsFollowEpisodes: input.startsFollowEpisodes, startEpisode: input.startEpisode };
}

/** J of the resample with episode multiplicities c (reward sense); null when it holds no episode with a start state. */
export function linearisedReplicate(lin: LinearisedReplicates, multiplicities: ArrayLike<number>): number | null {
  const e = lin.counts.length;
  if (multiplicities.length !== e) throw new BootstrapError(`multiplicities: expected one per episode (${e}), got ${multiplicities.length}`);
  if (lin.startsFollowEpisodes && !lin.startEpisode && lin.startValues.length === e) return oneStartPerEpisode(lin, multiplicities);
  let influence = 0, transitions = 0;
  for (let k = 0; k < e; k++) {
    influence += multiplicities[k] * lin.influence[k];
    transitions += multiplicities[k] * lin.counts[k];
  }
  if (!(transitions > 0)) throw new BootstrapError('resample: the episodes drawn contain no transitions');
  const starts = startMean(lin, multiplicities);
  return starts === null ? null : starts + influence / transitions;
}

/**
 * linearisedReplicate where start state k is episode k's (the common case): the four sums in one
 * loop over the multiplicities instead of two, each still summed over k in order, so the same bits.
 */
function oneStartPerEpisode(lin: LinearisedReplicates, c: ArrayLike<number>): number | null {
  const e = lin.counts.length, { influence: s, counts: n, startValues: j } = lin;
  let influence = 0, transitions = 0, total = 0, weight = 0;
  for (let k = 0; k < e; k++) {
    const m = c[k];
    influence += m * s[k];
    transitions += m * n[k];
    total += m * j[k];
    weight += m;
  }
  if (!(transitions > 0)) throw new BootstrapError('resample: the episodes drawn contain no transitions');
  return weight > 0 ? total / weight + influence / transitions : null;
}

function startMean(lin: LinearisedReplicates, c: ArrayLike<number>): number | null {
  let total = 0, weight = 0;
  for (let s = 0; s < lin.startValues.length; s++) {
    const m = lin.startsFollowEpisodes ? c[lin.startEpisode ? lin.startEpisode[s] : s] : 1;
    total += m * lin.startValues[s];
    weight += m;
  }
  return weight > 0 ? total / weight : null;
}
