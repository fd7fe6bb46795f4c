/**
 * The range a policy value can take if the rewards the candidate meets lie in the logged range:
 * J = E[Σ γ^t r_t] with r_min ≤ r_t ≤ r_max gives r_min/(1 − γ) ≤ J ≤ r_max/(1 − γ) (a bound by
 * the geometric series; common practice). An estimate outside it cannot be right under that
 * premise — typically a fit extrapolating far from the logs (e.g. a negative discounted cost when
 * every logged cost is positive). Reward sense.
 */
export interface PossibleValues {
  readonly lower: number;
  readonly upper: number;
}

export function possibleValues(rewards: ArrayLike<number>, discount: number): PossibleValues {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < rewards.length; i++) {
    const r = rewards[i];
    if (r < lo) lo = r;
    if (r > hi) hi = r;
  }
  return { lower: lo / (1 - discount), upper: hi / (1 - discount) };
}

/** True when v lies outside the range by more than a relative margin (round-off and small-sample slack; 1 % of the range's width, ours). */
export function outsidePossible(v: number, range: PossibleValues): boolean {
  const slack = 0.01 * (range.upper - range.lower);
  return v < range.lower - slack || v > range.upper + slack;
}
