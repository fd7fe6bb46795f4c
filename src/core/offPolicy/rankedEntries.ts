/**
 * The per-decision entries (perDecisionEstimators.ts) laid out for many bootstrap resamples: the
 * episodes ranked longest first, so that the episodes that reach step t are ranks 0 … m_t − 1 and
 * step t's entries sit at offsets[t] + rank. Two facts then remove three of the six per-entry sums
 * of perDecisionEstimates, leaving four, read with no gather of the multiplicities by episode:
 *   - the count Σ_i c_i over the episodes that reach t is a prefix sum of the ranked multiplicities
 *     at m_t, formed once per resample in O(e);
 *   - the weight before the decision, W_{i,t−1}, is the same episode's weight at step t − 1
 *     (importanceWeights.ts scales both by step t − 1's largest weight; 1 at t = 0), so
 *     Σ_{i reaches t} c_i W_{i,t−1} is the part of step t − 1's weight sum over ranks below m_t —
 *     the weight sum is taken in two ranges and this part is kept (no subtraction, no new rounding
 *     beyond the order of addition).
 * What is left per entry: W, W·r, W·Q̂ and W_{t−1}·V̂ — the products formed once, as before.
 *
 * Shapes: n entries step-major in rank order (four Float64Array of n); e episodes; H = horizon.
 */
import { ImportanceSamplingError, type PerDecisionData } from './perDecisionEstimators';

/** What the resamples read of the data besides the ranked tables: plain numbers and small per-end arrays. */
export type RankedData = Pick<PerDecisionData, 'episodes' | 'horizon' | 'endOffsets' | 'endWeight' | 'absorbedOffsets' | 'absorbedWeight' | 'heldCarry' | 'absorbedToBefore' | 'absorbedToStep' | 'liveWeighted' | 'cutOffsets' | 'cutWeight'>;

/**
 * The ranked tables (every typed array but data's) own their buffers, so a host may transfer them to
 * another thread without copying them and without detaching anything of the data's.
 */
export interface RankedEntries {
  readonly data: RankedData;
  /** m_t: episodes that reach step t, t = 0 … H (m_H = 0); non-increasing. */
  readonly reaching: Int32Array; // H+1
  /** Step t's entries at offsets[t] … offsets[t] + reaching[t]. */
  readonly offsets: Int32Array; // H+1
  /** Rank of each episode (data episode order → rank). */
  readonly rankOf: Int32Array; // e
  readonly weight: Float64Array; // n: W_{i,t}
  readonly weightedReward: Float64Array; // n: W_{i,t} r_{i,t}
  /** W_{i,t} Q̂(s_{i,t}, a_{i,t}) and W_{i,t−1} V̂(s_{i,t}); null without Q̂ and V̂. */
  readonly weightedAction: Float64Array | null; // n
  readonly weightedState: Float64Array | null; // n
  /**
   * Every W_{i,t} is exactly 1 (the present controller weighed against itself): then c·W = c, so the
   * weight sums are the counts of the runs that reach each step, and the resamples need not read `weight`.
   */
  readonly unitWeight: boolean;
  /** Time-limited ends (data.endOffsets groups): the ending episode's rank and W_{k,T−1}·V̂(s_{k,T}). */
  readonly endRank: Int32Array;
  readonly endWeightedValue: Float64Array;
  /** Runs absorbed in an end state (data.absorbedOffsets groups): the run's rank. */
  readonly absorbedRank: Int32Array;
  /** Runs cut by a time limit (data.cutOffsets groups): the run's rank. */
  readonly cutRank: Int32Array;
}

export function rankEntries(data: PerDecisionData): RankedEntries {
  const { horizon, episodes: e, stepOffsets } = data, n = data.scaled.length;
  const reaching = new Int32Array(horizon + 1), length = new Int32Array(e);
  for (let t = 0; t < horizon; t++) reaching[t] = stepOffsets[t + 1] - stepOffsets[t];
  for (let j = 0; j < n; j++) length[data.episode[j]]++;
  const rankOf = longestFirst(length);
  const offsets = stepOffsets.slice(0, horizon + 1);
  offsets[horizon] = n;
  const weight = new Float64Array(n), weightedReward = new Float64Array(n);
  const withValues = data.actionValues !== null && data.stateValues !== null;
  const weightedAction = withValues ? new Float64Array(n) : null, weightedState = withValues ? new Float64Array(n) : null;
  const last = new Int32Array(e).fill(-1); // each episode’s entry at the step before
  for (let t = 0; t < horizon; t++) {
    for (let j = stepOffsets[t]; j < stepOffsets[t + 1]; j++) {
      const k = data.episode[j], to = stepOffsets[t] + rankOf[k];
      if (rankOf[k] >= reaching[t]) throw new ImportanceSamplingError(`episode ${k + 1}: its entries are not one per step from step 1`);
      checkWeightBefore(data, j, t === 0 ? -1 : last[k], k, t);
      last[k] = j;
      weight[to] = data.scaled[j];
      weightedReward[to] = data.scaled[j] * data.rewards[j];
      if (weightedAction && weightedState) {
        weightedAction[to] = data.scaled[j] * data.actionValues![j];
        weightedState[to] = data.scaledBefore[j] * data.stateValues![j];
      }
    }
  }
  const endRank = Int32Array.from(data.endEpisode, (k) => rankOf[k]);
  const endWeightedValue = Float64Array.from(data.endWeight, (w, j) => w * data.endValue[j]);
  const absorbedRank = Int32Array.from(data.absorbedEpisode, (k) => rankOf[k]);
  const cutRank = Int32Array.from(data.cutEpisode, (k) => rankOf[k]);
  const { endOffsets, endWeight, absorbedOffsets, absorbedWeight, heldCarry, absorbedToBefore, absorbedToStep, liveWeighted, cutOffsets, cutWeight } = data;
  const kept: RankedData = { episodes: e, horizon, endOffsets, endWeight, absorbedOffsets, absorbedWeight, heldCarry, absorbedToBefore, absorbedToStep, liveWeighted, cutOffsets, cutWeight };
  const unitWeight = weight.every((w) => w === 1);
  return { data: kept, reaching, offsets, rankOf, weight, weightedReward, weightedAction, weightedState, unitWeight, endRank, endWeightedValue, absorbedRank, cutRank };
}

/** Ranks by length, longest first; ties keep the data's episode order (a stable sort). */
function longestFirst(length: Int32Array): Int32Array {
  const order = Array.from(length, (_, k) => k).sort((a, b) => length[b] - length[a] || a - b);
  const rankOf = new Int32Array(length.length);
  order.forEach((k, r) => { rankOf[k] = r; });
  return rankOf;
}

/** The route rests on W_{i,t−1} being the same episode's weight one step earlier (1 at t = 0); refuse data where it is not. */
function checkWeightBefore(data: PerDecisionData, j: number, before: number, k: number, t: number): void {
  const expected = t === 0 ? 1 : before >= 0 ? data.scaled[before] : NaN, found = data.scaledBefore[j];
  if (found === expected || (Number.isNaN(found) && Number.isNaN(expected) && before >= 0)) return;
  throw new ImportanceSamplingError(`episode ${k + 1}, step ${t + 1}: the weight before the decision is not the weight of step ${t}`);
}
