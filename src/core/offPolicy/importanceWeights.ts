/**
 * Cumulative per-decision importance weights of logged episodes, W_{i,t} = Π_{u≤t} ρ_{i,u}
 * (Precup, Sutton & Singh, "Eligibility traces for off-policy policy evaluation", ICML 2000),
 * kept in log form and rescaled per step t by the largest weight at that step, so that products
 * over hundreds of steps neither overflow nor underflow before they are normalised. Every
 * estimator here is self-normalised per step, so the common scale cancels.
 *
 * Step t of an episode is the position of the transition within its episode in data order.
 * Arrays are in episode-major order (EpisodeIndex.order): n entries, episode k at offsets[k]…
 */
import type { EpisodeIndex } from '../bootstrap/episodeTransitions';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { logImportanceRatio } from './importanceRatio';

export interface ImportanceWeightTable {
  readonly index: EpisodeIndex;
  readonly horizon: number; // longest episode, T_max
  readonly step: Int32Array; // n: t of each entry
  readonly logRatio: Float64Array; // n: log ρ_{i,t}
  readonly logWeight: Float64Array; // n: log W_{i,t}
  /** W_{i,t} / max_j W_{j,t}: in [0, 1]. */
  readonly scaled: Float64Array; // n
  /** W_{i,t−1} / max_j W_{j,t−1} (1 at t = 0): the weight before the decision at t. */
  readonly scaledBefore: Float64Array; // n
  readonly rewards: Float64Array; // n, episode-major
  /** 1 where the run's last transition is into an absorbing state (terminal = 1): padded from its length on. */
  readonly absorbed: Uint8Array; // e
  /**
   * The scale of the absorbed runs' weights, in log form: absorbedLargest[t] = R_t, the largest last log W
   * of the runs absorbed by t (−∞ before the first), t = 0 … H. Kept apart from the step's scale, which
   * the runs still going may set far above or below it (perDecisionEstimators.ts).
   */
  readonly absorbedLargest: Float64Array; // horizon + 1
  /** Per step t (0 … H), from R_{t−1} to R_t (0 where R_{t−1} = −∞), from R_t to step t − 1's scale, and from R_t to step t's (each ≤ 1, 0 where R_t = −∞). */
  readonly heldCarry: Float64Array; // horizon + 1
  readonly absorbedToBefore: Float64Array; // horizon + 1
  readonly absorbedToStep: Float64Array; // horizon + 1
  /** 1 where some run acting at step t has a weight above 0 (log W > −∞): zero sums there are underflow, not a candidate that excludes every logged action. */
  readonly liveWeighted: Uint8Array; // horizon
}

export function importanceWeightTable(data: TransitionSet, index: EpisodeIndex, target: GaussianPolicy, behaviour: GaussianPolicy): ImportanceWeightTable {
  const n = data.count, ds = data.stateDim, m = data.actionDim;
  const step = new Int32Array(n), logRatio = new Float64Array(n), logWeight = new Float64Array(n), rewards = new Float64Array(n);
  const state = new Float64Array(ds), action = new Float64Array(m), mean = new Float64Array(m);
  let horizon = 0;
  for (let k = 0; k < index.episodes; k++) {
    let total = 0;
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const i = index.order[p];
      for (let c = 0; c < ds; c++) state[c] = data.states[i * ds + c];
      for (let c = 0; c < m; c++) action[c] = data.actions[i * m + c];
      logRatio[p] = logImportanceRatio(target, behaviour, state, action, mean);
      total += logRatio[p];
      logWeight[p] = total;
      step[p] = p - index.offsets[k];
      rewards[p] = data.rewards[i];
    }
    horizon = Math.max(horizon, index.offsets[k + 1] - index.offsets[k]);
  }
  const absorbed = absorbedRuns(data, index);
  const { largest, absorbedLargest, liveWeighted } = largestWeights(index, step, logWeight, absorbed, horizon);
  const scaled = new Float64Array(n), scaledBefore = new Float64Array(n);
  for (let p = 0; p < n; p++) {
    const t = step[p];
    scaled[p] = scaledWeight(logWeight[p], largest[t + 1]);
    scaledBefore[p] = t === 0 ? 1 : scaledWeight(logWeight[p - 1], largest[t]);
  }
  const heldCarry = new Float64Array(horizon + 1), absorbedToBefore = new Float64Array(horizon + 1), absorbedToStep = new Float64Array(horizon + 1);
  for (let t = 0; t <= horizon; t++) {
    const r = absorbedLargest[t];
    heldCarry[t] = t === 0 || absorbedLargest[t - 1] === -Infinity ? 0 : Math.exp(absorbedLargest[t - 1] - r);
    absorbedToBefore[t] = r === -Infinity ? 0 : Math.exp(r - largest[t]); // R_t ≤ largest[t]: the runs absorbed by t were going at t − 1
    absorbedToStep[t] = r === -Infinity ? 0 : Math.exp(r - largest[t + 1]);
  }
  return { index, horizon, step, logRatio, logWeight, scaled, scaledBefore, rewards, absorbed, absorbedLargest, heldCarry, absorbedToBefore, absorbedToStep, liveWeighted };
}

/** Per run, 1 where its last transition ends in an absorbing state. */
function absorbedRuns(data: TransitionSet, index: EpisodeIndex): Uint8Array {
  const absorbed = new Uint8Array(index.episodes);
  for (let k = 0; k < index.episodes; k++) {
    const last = index.offsets[k + 1] - 1;
    absorbed[k] = last >= index.offsets[k] && data.terminal[index.order[last]] !== 0 ? 1 : 0;
  }
  return absorbed;
}

/**
 * largest[t + 1] = the largest log W at step t over the runs that reach t and the runs absorbed by t
 * (their last log W), t = 0 … H (at H only absorbed runs); largest[0] = 0, the weight before step 0.
 */
function largestWeights(index: EpisodeIndex, step: Int32Array, logWeight: Float64Array, absorbed: Uint8Array, horizon: number) {
  const largest = new Float64Array(horizon + 2).fill(-Infinity), absorbedLargest = new Float64Array(horizon + 1).fill(-Infinity);
  largest[0] = 0;
  for (let p = 0; p < step.length; p++) largest[step[p] + 1] = Math.max(largest[step[p] + 1], logWeight[p]);
  const liveWeighted = Uint8Array.from({ length: horizon }, (_, t) => (largest[t + 1] > -Infinity ? 1 : 0));
  for (let k = 0; k < index.episodes; k++) {
    const length = index.offsets[k + 1] - index.offsets[k];
    if (absorbed[k]) absorbedLargest[length] = Math.max(absorbedLargest[length], logWeight[index.offsets[k + 1] - 1]);
  }
  for (let t = 1; t <= horizon; t++) {
    absorbedLargest[t] = Math.max(absorbedLargest[t - 1], absorbedLargest[t]);
    largest[t + 1] = Math.max(largest[t + 1], absorbedLargest[t]);
  }
  return { largest, absorbedLargest, liveWeighted };
}

function scaledWeight(logW: number, logMax: number): number {
  return logMax === -Infinity ? 0 : Math.exp(logW - logMax);
}
