/**
 * The value of what the plant does today: the discounted return of the logged episodes themselves,
 * G = Σ_t γ^t r_t from each episode's first step (the on-policy Monte Carlo estimate of the behaviour
 * policy's value; Sutton & Barto, "Reinforcement Learning", 2nd ed., §5.1).
 *
 * An episode that ends without a terminal state is truncated: the part of the return after its last
 * step, γ^T·V(s_T), is missing. The largest such weight γ^T is reported so the reader can judge it.
 */
import type { TransitionSet } from './transitions';

export interface LoggedReturn {
  /** Mean discounted return over episodes. */
  value: number;
  /** Standard error of the mean over episodes (episodes treated as independent). */
  standardError: number;
  episodes: number;
  /** Largest γ^T over episodes that end without a terminal state (0 when all end terminally). */
  largestTruncationWeight: number;
  /** Per-episode discounted returns, in episode order. */
  perEpisode: Float64Array;
}

export function loggedDiscountedReturn(data: TransitionSet, discount: number): LoggedReturn {
  const e = data.episodeCount;
  const perEpisode = new Float64Array(e);
  const weight = new Float64Array(e).fill(1); // γ^t for the next step of each episode
  const endsTerminally = new Uint8Array(e);
  for (let i = 0; i < data.count; i++) {
    const k = data.episode[i];
    perEpisode[k] += weight[k] * data.rewards[i];
    weight[k] *= discount;
    if (data.terminal[i]) endsTerminally[k] = 1;
  }
  let largestTruncationWeight = 0;
  for (let k = 0; k < e; k++) if (!endsTerminally[k]) largestTruncationWeight = Math.max(largestTruncationWeight, weight[k]);
  const { mean, standardError } = meanAndStandardError(perEpisode);
  return { value: mean, standardError, episodes: e, largestTruncationWeight, perEpisode };
}

/** Sample mean and its standard error s/√n (n − 1 in the variance); SE is 0 for fewer than 2 values. */
export function meanAndStandardError(values: ArrayLike<number>): { mean: number; standardError: number } {
  const n = values.length;
  if (n === 0) return { mean: NaN, standardError: NaN };
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i];
  mean /= n;
  if (n < 2) return { mean, standardError: 0 };
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  return { mean, standardError: Math.sqrt(ss / (n - 1) / n) };
}
