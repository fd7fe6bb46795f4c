/**
 * Self-normalised per-decision estimators of J(π) from logged episodes and importance weights
 * (importanceWeights.ts), with episode multiplicities c_i so a bootstrap resample costs one O(n)
 * pass and no copy:
 *
 * Weighted per-decision importance sampling (Precup, Sutton & Singh 2000; weighted form as in
 * Thomas & Brunskill, "Data-efficient off-policy policy evaluation for reinforcement learning",
 * ICML 2016, §3):
 *   WPDIS = Σ_t γ^t Σ_i w̄_{i,t} r_{i,t},         w̄_{i,t} = c_i W_{i,t} / Σ_j c_j W_{j,t}
 *
 * Weighted doubly robust (Thomas & Brunskill 2016, eq. 10, the weighted form of the doubly
 * robust estimator of Jiang & Li, "Doubly robust off-policy value evaluation for reinforcement
 * learning", ICML 2016):
 *   WDR = WPDIS − Σ_t γ^t Σ_i ( w̄_{i,t} Q̂(s_{i,t}, a_{i,t}) − w̄_{i,t−1} V̂(s_{i,t}) ),  w̄_{i,−1} = c_i/Σ_j c_j
 *
 * Episodes of unequal length: each step t is normalised over the episodes that reach step t
 * (so an episode that ends early stops contributing rather than counting as zero reward).
 * Both estimators cover Σ_{t<T} γ^t r_t: the part of the return beyond the logged episodes'
 * ends is missing, as for the logged return itself (loggedReturn.ts).
 */
import type { ImportanceWeightTable } from './importanceWeights';

export class ImportanceSamplingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ImportanceSamplingError';
  }
}

/** Per-step sums over the resample's episodes; grown once and reused across calls. */
interface StepSums {
  reached: Float64Array; // Σ_i c_i over episodes reaching step t
  weight: Float64Array; // Σ_i c_i W_{i,t}
  weightBefore: Float64Array; // Σ_i c_i W_{i,t−1} over episodes reaching t
  weighted: Float64Array; // Σ_i c_i W_{i,t} (r − Q̂)   or   Σ_i c_i W_{i,t} r
  weightedBefore: Float64Array; // Σ_i c_i W_{i,t−1} V̂(s_{i,t})
}

function stepSums(horizon: number): StepSums {
  return { reached: new Float64Array(horizon), weight: new Float64Array(horizon), weightBefore: new Float64Array(horizon), weighted: new Float64Array(horizon), weightedBefore: new Float64Array(horizon) };
}

/** WPDIS (reward sense). multiplicities: e, default all 1. */
export function weightedPerDecisionImportanceSampling(table: ImportanceWeightTable, discount: number, multiplicities?: ArrayLike<number>): number {
  return perDecisionEstimate(table, discount, multiplicities, null, null);
}

/** WDR (reward sense). actionValues Q̂(s_t, a_t) and stateValues V̂(s_t): n, in the table's episode-major order. */
export function weightedDoublyRobust(
  table: ImportanceWeightTable, discount: number, actionValues: Float64Array, stateValues: Float64Array, multiplicities?: ArrayLike<number>,
): number {
  return perDecisionEstimate(table, discount, multiplicities, actionValues, stateValues);
}

function perDecisionEstimate(
  table: ImportanceWeightTable, discount: number, multiplicities: ArrayLike<number> | undefined,
  actionValues: Float64Array | null, stateValues: Float64Array | null,
): number {
  const sums = accumulate(table, multiplicities, actionValues, stateValues);
  let total = 0, discountPower = 1;
  for (let t = 0; t < table.horizon; t++, discountPower *= discount) {
    if (sums.reached[t] === 0) continue; // no episode of the resample reaches step t
    if (!(sums.weight[t] > 0 && sums.weightBefore[t] > 0)) {
      throw new ImportanceSamplingError(`the importance weights are zero at step ${t + 1} in every episode: the candidate gives the logged actions no probability`);
    }
    total += discountPower * sums.weighted[t] / sums.weight[t];
    if (stateValues) total += discountPower * sums.weightedBefore[t] / sums.weightBefore[t];
  }
  return total;
}

function accumulate(
  table: ImportanceWeightTable, multiplicities: ArrayLike<number> | undefined, actionValues: Float64Array | null, stateValues: Float64Array | null,
): StepSums {
  const { index, step, scaled, scaledBefore, rewards } = table, sums = stepSums(table.horizon);
  for (let k = 0; k < index.episodes; k++) {
    const c = multiplicities ? multiplicities[k] : 1;
    if (c === 0) continue;
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const t = step[p], w = c * scaled[p], before = c * scaledBefore[p];
      sums.reached[t] += c;
      sums.weight[t] += w;
      sums.weightBefore[t] += before;
      sums.weighted[t] += w * (actionValues ? rewards[p] - actionValues[p] : rewards[p]);
      if (stateValues) sums.weightedBefore[t] += before * stateValues[p];
    }
  }
  return sums;
}
