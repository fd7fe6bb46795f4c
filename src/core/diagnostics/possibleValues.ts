/**
 * The range a policy value can take if the rewards the candidate meets lie in the logged range:
 * J = E[Σ γ^t r_t] with r_min ≤ r_t ≤ r_max gives r_min/(1 − γ) ≤ J ≤ r_max/(1 − γ) (a bound by
 * the geometric series; common practice). An estimate outside it cannot be right under that
 * premise — typically a fit extrapolating far from the logs (e.g. a negative discounted cost when
 * every logged cost is positive). Reward sense.
 *
 * Runs that can end (an absorbing state in the log, ../absorbingEnds.ts): the return is then
 * Σ_{t<T} γ^t r_t for a random end T ≥ 1 (a start pays at least its own step), and for each T the
 * sum lies between r_min·g_T and r_max·g_T with g_T = (1 − γ^T)/(1 − γ) ∈ [1, 1/(1 − γ)] (the same
 * geometric series, cut at T). Over every T, and so for any mixture of them,
 *   min(r_min, r_min/(1 − γ)) ≤ J ≤ max(r_max, r_max/(1 − γ)):
 * with costs only (r_max < 0) a run that ends at once pays a single step, not 1/(1 − γ) of them.
 *
 * An estimate's interval: the slack below is a fixed share of the range's width, and the width is
 * set by the single most extreme logged step, so where a few large upsets dominate it can exceed J
 * itself. An interval that shares no point with the possible range says, at its own level, that no
 * possible value is consistent with the estimate and its sampling error (the duality of confidence
 * intervals and tests; common practice), whatever the width: that too marks the estimate impossible.
 */
import type { RewardBounds } from '../transitions';
export interface PossibleValues {
  readonly lower: number;
  readonly upper: number;
}

export function possibleValues(rewards: ArrayLike<number>, discount: number, runsCanEnd = false): PossibleValues {
  const { lower, upper } = loggedRewardRange(rewards);
  return discountedRange(lower, upper, discount, runsCanEnd);
}

/** The least and greatest logged reward (Infinity and −Infinity for none). */
export function loggedRewardRange(rewards: ArrayLike<number>): PossibleValues {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < rewards.length; i++) {
    const r = rewards[i];
    if (r < lo) lo = r;
    if (r > hi) hi = r;
  }
  return { lower: lo, upper: hi };
}

/**
 * The range no policy can leave, whatever it does: the same geometric bound on the rewards' certain
 * bounds (from the reward's formula, TransitionSet.rewardBounds) instead of the logged range. Either
 * end may be infinite; null when nothing is known. Any confidence interval cut to it keeps its
 * coverage, since the truth lies in it for sure: P(J ∈ C ∩ R) = P(J ∈ C) (common practice).
 */
export function certainValues(rewardBounds: RewardBounds | undefined, discount: number, runsCanEnd = false): PossibleValues | null {
  if (!rewardBounds) return null;
  return discountedRange(rewardBounds.lower, rewardBounds.upper, discount, runsCanEnd);
}

function discountedRange(lo: number, hi: number, discount: number, runsCanEnd: boolean): PossibleValues {
  const horizon = 1 / (1 - discount);
  if (!runsCanEnd) return { lower: lo * horizon, upper: hi * horizon };
  return { lower: Math.min(lo, lo * horizon), upper: Math.max(hi, hi * horizon) };
}

/** The margin of outsidePossible as a share of the range's width (round-off and small-sample slack; ours). */
export const POSSIBLE_SLACK = 0.01;

/** True when v lies outside the range by more than a relative margin (POSSIBLE_SLACK of the range's width). */
export function outsidePossible(v: number, range: PossibleValues): boolean {
  const slack = POSSIBLE_SLACK * (range.upper - range.lower);
  return v < range.lower - slack || v > range.upper + slack;
}

/** True when the interval [lower, upper] of an estimate (same sense as the range) shares no point with the range. */
export function intervalOutsidePossible(lower: number, upper: number, range: PossibleValues): boolean {
  return upper < range.lower || lower > range.upper;
}
