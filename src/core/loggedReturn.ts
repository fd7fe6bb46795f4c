/**
 * The value of what the plant does today: the discounted return of the logged episodes themselves,
 * G = Σ_t γ^t r_t from each episode's first step (the on-policy Monte Carlo estimate of the behaviour
 * policy's value; Sutton & Barto, "Reinforcement Learning", 2nd ed., §5.1).
 *
 * An episode that ends without a terminal state is truncated: the part of the return after its last
 * step, γ^T·V(s_T), is missing. The mean of γ^T over the episodes (0 for one that ends in a terminal
 * state) is the share of the mean return's weight that is missing, so it sizes the bias of the mean;
 * the largest γ^T says how short the shortest truncated episode is.
 *
 * The completed return puts that part back with a fitted value of the logged controller, V̂^b,
 * at each truncated episode's last state (the bootstrapped return of time-limited episodes;
 * Pardo et al., "Time limits in reinforcement learning", ICML 2018, §3; Sutton & Barto §7.1 for the
 * n-step return G_{0:T} = Σ_{t<T} γ^t r_t + γ^T V(s_T)):
 *   G_k^completed = Σ_{t<T_k} γ^t r_t + γ^{T_k} V̂^b(s_{T_k})   (the tail is 0 after a terminal state).
 * V̂^b may come from any fit (linear FQE of the fitted behaviour model, a network); with a linear
 * fit V̂^b(s) = ξ(s)ᵀw, so a bootstrap resample only swaps w (completedReturnOfResample). Its
 * standard error over episodes holds V̂^b fixed: it covers the sampling of the episodes, not the
 * error of V̂^b, which only the tails' weight γ^T carries (tailShare says how much that is).
 */
import type { TransitionSet } from './transitions';
import { sharesText } from './shareText';

export interface LoggedReturn {
  /** Mean discounted return over episodes. */
  value: number;
  /** Standard error of the mean over episodes (episodes treated as independent). */
  standardError: number;
  episodes: number;
  /** Largest γ^T over episodes that end without a terminal state (0 when all end terminally). */
  largestTruncationWeight: number;
  /** Mean of γ^T over all episodes, 0 for those that end terminally: the share of the mean return's weight that is missing. */
  meanTruncationWeight: number;
  /** Per-episode discounted returns, in episode order. */
  perEpisode: Float64Array;
}

export function loggedDiscountedReturn(data: TransitionSet, discount: number): LoggedReturn {
  return loggedDiscountedReturns(data, [discount])[0];
}

/**
 * loggedDiscountedReturn at several discounts in one pass over the transitions (the sensitivity
 * sweep's): each discount's sums are formed by the same operations in the same order as a pass of
 * its own, so each result equals loggedDiscountedReturn(data, discount) to the last bit.
 */
export function loggedDiscountedReturns(data: TransitionSet, discounts: readonly number[]): LoggedReturn[] {
  const e = data.episodeCount, g = discounts.length;
  const perEpisode = discounts.map(() => new Float64Array(e));
  const weight = new Float64Array(e * g).fill(1); // γ_j^t for the next step of each episode: weight[k·g + j]
  const endsTerminally = new Uint8Array(e);
  for (let i = 0; i < data.count; i++) {
    const k = data.episode[i], r = data.rewards[i], at = k * g;
    for (let j = 0; j < g; j++) {
      perEpisode[j][k] += weight[at + j] * r;
      weight[at + j] *= discounts[j];
    }
    if (data.terminal[i]) endsTerminally[k] = 1;
  }
  return discounts.map((_, j) => {
    let largestTruncationWeight = 0, truncationSum = 0;
    for (let k = 0; k < e; k++) {
      if (endsTerminally[k]) continue;
      largestTruncationWeight = Math.max(largestTruncationWeight, weight[k * g + j]);
      truncationSum += weight[k * g + j];
    }
    const { mean, standardError } = meanAndStandardError(perEpisode[j]);
    return { value: mean, standardError, episodes: e, largestTruncationWeight, meanTruncationWeight: e > 0 ? truncationSum / e : 0, perEpisode: perEpisode[j] };
  });
}

/** Below this mean share of the return's weight past the runs' ends the truncation is not mentioned. */
export const TRUNCATION_NOTICE = 1e-3;

/**
 * Whether the value past the runs' time-limited ends weighs enough to be said (the mean missing weight
 * above TRUNCATION_NOTICE, the sentence's own rule). Below it the logged return completed past the ends
 * differs from the cut-short one by less than that share of the values' scale, and every host shows one
 * logged-return row instead of two rows with the same number (greenhouse runs of 500 steps at γ 0.95:
 * a weight of 7 × 10⁻¹²).
 */
export function truncationMatters(r: Pick<LoggedReturn, 'meanTruncationWeight'>): boolean {
  return r.meanTruncationWeight > TRUNCATION_NOTICE;
}

/** The logged return's role beside the present controller (CLI, report): which of the two rows it is where a completed row stands beside it. */
export function loggedReturnRole(completedShown: boolean, heldStretchesIn = false): string {
  // Where the present controller's law was fitted on the rows not held, the logged return measures the months as
  // logged, held stretches included: another way of acting than the baseline's, so no check of it.
  if (heldStretchesIn) return completedShown ? 'as logged, held stretches included, cut short at time limits; not a check' : 'as logged, held stretches included; not a check';
  return completedShown ? 'check; cut short at time limits' : 'check';
}

/**
 * The sentence on truncated runs, or null when the mean missing weight is below TRUNCATION_NOTICE:
 * the mean sizes the bias of the mean logged return; one short run (a log that ends mid-run) alone
 * makes the largest weight large without biasing the mean much, so both are stated.
 */
export function truncationSentence(r: Pick<LoggedReturn, 'meanTruncationWeight' | 'largestTruncationWeight'>): string | null {
  if (!truncationMatters(r)) return null;
  const [mean, largest] = sharesText([r.meanTruncationWeight, r.largestTruncationWeight]);
  return `Logged runs are short for this discount: on average ${mean} of the return’s weight lies beyond their end ` +
    `(${largest} on the shortest run cut short, by a time limit or the end of the log), so the logged return is biased toward zero`;
}

/** Where each episode ends: its last next state and the weight of the value beyond it. */
export interface EpisodeEnds {
  readonly finalStates: Float64Array; // e×ds: s_T, the next state of each episode’s last transition (0 for an empty episode)
  /** γ^T for an episode that ends on a time limit; 0 after a terminal state or for an episode without transitions. */
  readonly tailWeights: Float64Array; // e
}

export function episodeEnds(data: TransitionSet, discount: number): EpisodeEnds {
  const e = data.episodeCount, ds = data.stateDim;
  const finalStates = new Float64Array(e * ds), tailWeights = new Float64Array(e), last = new Int32Array(e).fill(-1), steps = new Int32Array(e);
  for (let i = 0; i < data.count; i++) {
    last[data.episode[i]] = i;
    steps[data.episode[i]]++;
  }
  for (let k = 0; k < e; k++) {
    const i = last[k];
    if (i < 0) continue;
    finalStates.set(data.nextStates.subarray(i * ds, (i + 1) * ds), k * ds);
    tailWeights[k] = data.terminal[i] ? 0 : discount ** steps[k];
  }
  return { finalStates, tailWeights };
}

export interface CompletedReturn extends Omit<LoggedReturn, 'largestTruncationWeight' | 'meanTruncationWeight'> {
  /** Mean |γ^T V̂(s_T)| over mean |G^completed|: the share of the value that rests on V̂ rather than on logged rewards. */
  tailShare: number;
}

/** The logged return completed by γ^T·V̂(s_T) per time-limited episode. finalStateValues: e, V̂ at ends.finalStates. */
export function completedLoggedReturn(logged: LoggedReturn, ends: EpisodeEnds, finalStateValues: ArrayLike<number>): CompletedReturn {
  const e = logged.episodes;
  if (ends.tailWeights.length !== e || finalStateValues.length !== e) {
    throw new RangeError(`completed return: expected one end and one final value per episode (${e}), got ${ends.tailWeights.length} and ${finalStateValues.length}`);
  }
  const perEpisode = new Float64Array(e);
  let tails = 0, totals = 0;
  for (let k = 0; k < e; k++) {
    const tail = ends.tailWeights[k] === 0 ? 0 : ends.tailWeights[k] * finalStateValues[k];
    perEpisode[k] = logged.perEpisode[k] + tail;
    tails += Math.abs(tail);
    totals += Math.abs(perEpisode[k]);
  }
  const { mean, standardError } = meanAndStandardError(perEpisode);
  return { value: mean, standardError, episodes: e, perEpisode, tailShare: totals > 0 ? tails / totals : 0 };
}

/**
 * The completed return of a bootstrap resample: Σ_k c_k (G_k + γ^{T_k} V̂*(s_{T_k})) / Σ_k c_k, with
 * V̂* refitted on the resample (for a linear fit, finalStateValues = ξ(s_T)ᵀw*). All arrays: e.
 */
export function completedReturnOfResample(
  truncated: ArrayLike<number>, tailWeights: ArrayLike<number>, finalStateValues: ArrayLike<number>, multiplicities: ArrayLike<number>,
): number {
  let total = 0, count = 0;
  for (let k = 0; k < multiplicities.length; k++) {
    const c = multiplicities[k];
    if (c === 0) continue;
    total += c * (truncated[k] + (tailWeights[k] === 0 ? 0 : tailWeights[k] * finalStateValues[k]));
    count += c;
  }
  if (!(count > 0)) throw new RangeError('completed return: the resample holds no episode');
  return total / count;
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
