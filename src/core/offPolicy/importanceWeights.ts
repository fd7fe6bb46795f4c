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
  /** carry[t] = max_{t−1} / max_t, the scales of steps t − 1 and t (t ≥ 1; carry[0] = 1): 1 everywhere on a log without ends. */
  readonly carry: Float64Array; // horizon + 1
}

export function importanceWeightTable(data: TransitionSet, index: EpisodeIndex, target: GaussianPolicy, behaviour: GaussianPolicy): ImportanceWeightTable {
  const n = data.count, ds = data.stateDim, m = data.actionDim;
  const step = new Int32Array(n), logRatio = new Float64Array(n), logWeight = new Float64Array(n), rewards = new Float64Array(n);
  const state = new Float64Array(ds), action = new Float64Array(m);
  let horizon = 0;
  for (let k = 0; k < index.episodes; k++) {
    let total = 0;
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const i = index.order[p];
      for (let c = 0; c < ds; c++) state[c] = data.states[i * ds + c];
      for (let c = 0; c < m; c++) action[c] = data.actions[i * m + c];
      logRatio[p] = logImportanceRatio(target, behaviour, state, action);
      total += logRatio[p];
      logWeight[p] = total;
      step[p] = p - index.offsets[k];
      rewards[p] = data.rewards[i];
    }
    horizon = Math.max(horizon, index.offsets[k + 1] - index.offsets[k]);
  }
  const absorbed = absorbedRuns(data, index);
  const largest = largestWeights(index, step, logWeight, absorbed, horizon);
  const scaled = new Float64Array(n), scaledBefore = new Float64Array(n);
  for (let p = 0; p < n; p++) {
    const t = step[p];
    scaled[p] = scaledWeight(logWeight[p], largest[t + 1]);
    scaledBefore[p] = t === 0 ? 1 : scaledWeight(logWeight[p - 1], largest[t]);
  }
  const carry = new Float64Array(horizon + 1).fill(1);
  for (let t = 1; t <= horizon; t++) carry[t] = Math.min(Number.MAX_VALUE, scaledWeight(largest[t], largest[t + 1])); // finite, so 0 · carry stays 0
  return { index, horizon, step, logRatio, logWeight, scaled, scaledBefore, rewards, absorbed, carry };
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
function largestWeights(index: EpisodeIndex, step: Int32Array, logWeight: Float64Array, absorbed: Uint8Array, horizon: number): Float64Array {
  const largest = new Float64Array(horizon + 2).fill(-Infinity), absorbedFrom = new Float64Array(horizon + 1).fill(-Infinity);
  largest[0] = 0;
  for (let p = 0; p < step.length; p++) largest[step[p] + 1] = Math.max(largest[step[p] + 1], logWeight[p]);
  for (let k = 0; k < index.episodes; k++) {
    const length = index.offsets[k + 1] - index.offsets[k];
    if (absorbed[k]) absorbedFrom[length] = Math.max(absorbedFrom[length], logWeight[index.offsets[k + 1] - 1]);
  }
  for (let t = 1, held = -Infinity; t <= horizon; t++) {
    held = Math.max(held, absorbedFrom[t]);
    largest[t + 1] = Math.max(largest[t + 1], held);
  }
  return largest;
}

function scaledWeight(logW: number, logMax: number): number {
  return logMax === -Infinity ? 0 : Math.exp(logW - logMax);
}
