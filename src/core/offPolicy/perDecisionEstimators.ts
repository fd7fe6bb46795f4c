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

/**
 * The table's entries regrouped step by step (all episodes' step 0, then step 1, …), so that each
 * step's sums accumulate in registers: a resample then costs one sequential pass with a gather of
 * the episode multiplicity per entry, instead of scattered updates of per-step totals.
 */
export interface PerDecisionData {
  readonly horizon: number;
  readonly episodes: number;
  readonly stepOffsets: Int32Array; // horizon+1: entries of step t at stepOffsets[t] … stepOffsets[t+1]
  readonly episode: Int32Array; // n, step-major
  readonly scaled: Float64Array; // n, step-major W_{i,t} (scaled per step)
  readonly scaledBefore: Float64Array; // n, W_{i,t−1}
  readonly rewards: Float64Array; // n
  readonly actionValues: Float64Array | null; // n, Q̂(s_{i,t}, a_{i,t})
  readonly stateValues: Float64Array | null; // n, V̂(s_{i,t})
}

/** values: Q̂ and V̂ in the table's episode-major order (n each), or null for importance sampling alone. */
export function perDecisionData(table: ImportanceWeightTable, values: { actionValues: Float64Array; stateValues: Float64Array } | null): PerDecisionData {
  const { index, horizon, step } = table, n = step.length;
  const stepOffsets = new Int32Array(horizon + 1);
  for (let p = 0; p < n; p++) stepOffsets[step[p] + 1]++;
  for (let t = 0; t < horizon; t++) stepOffsets[t + 1] += stepOffsets[t];
  const next = stepOffsets.slice(0, horizon), order = new Int32Array(n), episode = new Int32Array(n);
  for (let k = 0; k < index.episodes; k++) {
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const j = next[step[p]]++;
      order[j] = p;
      episode[j] = k;
    }
  }
  const gather = (a: Float64Array) => Float64Array.from(order, (p) => a[p]);
  return {
    horizon, episodes: index.episodes, stepOffsets, episode,
    scaled: gather(table.scaled), scaledBefore: gather(table.scaledBefore), rewards: gather(table.rewards),
    actionValues: values && gather(values.actionValues), stateValues: values && gather(values.stateValues),
  };
}

export interface PerDecisionEstimates {
  readonly importanceSampling: number; // WPDIS, reward sense
  readonly doublyRobust: number | null; // WDR; null without Q̂ and V̂
}

/** WPDIS and, when the data carry Q̂ and V̂, WDR — both from one pass. multiplicities: e, default all 1. */
export function perDecisionEstimates(data: PerDecisionData, discount: number, multiplicities?: ArrayLike<number>): PerDecisionEstimates {
  if (multiplicities && multiplicities.length !== data.episodes) {
    throw new ImportanceSamplingError(`multiplicities: expected one per episode (${data.episodes}), got ${multiplicities.length}`);
  }
  // The inner loop is kept free of branches (V8 does not hoist them): absent inputs become ones and zeros.
  const c = multiplicities ? Float64Array.from(multiplicities) : new Float64Array(data.episodes).fill(1);
  const zeros = data.actionValues && data.stateValues ? null : new Float64Array(data.scaled.length);
  const q = data.actionValues ?? zeros!, v = data.stateValues ?? zeros!;
  const { stepOffsets, episode, scaled, scaledBefore, rewards } = data;
  let is = 0, correction = 0, discountPower = 1;
  for (let t = 0; t < data.horizon; t++, discountPower *= discount) {
    let reached = 0, weight = 0, weightBefore = 0, reward = 0, action = 0, state = 0;
    const end = stepOffsets[t + 1];
    for (let j = stepOffsets[t]; j < end; j++) {
      const ck = c[episode[j]], w = ck * scaled[j], before = ck * scaledBefore[j];
      reached += ck;
      weight += w;
      weightBefore += before;
      reward += w * rewards[j];
      action += w * q[j];
      state += before * v[j];
    }
    if (reached === 0) continue; // no episode of the resample reaches step t
    if (!(weight > 0 && weightBefore > 0)) {
      throw new ImportanceSamplingError(`the importance weights are zero at step ${t + 1} in every episode: the candidate gives the logged actions no probability`);
    }
    is += (discountPower * reward) / weight;
    correction += discountPower * (state / weightBefore - action / weight);
  }
  return { importanceSampling: is, doublyRobust: zeros ? null : is + correction };
}
