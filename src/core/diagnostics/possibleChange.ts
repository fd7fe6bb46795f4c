/**
 * How far a policy value can move when only the discount changes. For one policy and one start
 * distribution, J(γ) = Σ_t γ^t m_t with m_t = E[r_t] the expected reward at step t; for γ₁ < γ₂
 *   J(γ₂) − J(γ₁) = Σ_t (γ₂^t − γ₁^t) m_t,
 * whose coefficients are ≥ 0 and sum to D = 1/(1 − γ₂) − 1/(1 − γ₁) (the geometric series; common
 * practice). With r_min ≤ r_t ≤ r_max, so r_min ≤ m_t ≤ r_max, the change lies in [r_min·D, r_max·D]:
 * with costs that are never negative, J of the cost can only grow as the horizon grows. Runs that can
 * end (an absorbing state, rewards 0 after it): m_t = E[r_t·1{t < T}] lies between min(0, r_min) and
 * max(0, r_max), so the change lies in [min(0, r_min)·D, max(0, r_max)·D].
 *
 * The premise is the same as possibleValues.ts's: the rewards the policy meets lie in the range given —
 * the logged range (then a change beyond it says the candidate would meet steps the logs do not hold,
 * or the fit extrapolates), or the reward formula's own bounds (then nothing can pass it).
 *
 * A change estimated on the same resamples at both discounts has a paired interval; one that shares no
 * point with the possible change, widened by the possible-value rule's slack (POSSIBLE_SLACK of the
 * width, possibleValues.ts), says at its own level that no possible pair of values is consistent
 * with the two estimates (the duality of intervals and tests; common practice).
 */
import { POSSIBLE_SLACK } from './possibleValues';

export interface PossibleChange {
  readonly lower: number;
  readonly upper: number;
}

/**
 * The change J(later) − J(earlier) that rewards in [lo, hi] allow, reward sense; the discounts in either order,
 * each in [0, 1): γ = 0 is J = m₀ (γ⁰ = 1), and the series' sum 1/(1 − γ) holds there too. A swept discount
 * γ^(1/f) of a project's tiny γ (the schema takes any γ above 0) underflows to exactly 0.
 */
export function possibleChange(lo: number, hi: number, earlier: number, later: number, runsCanEnd = false): PossibleChange {
  if (!(earlier >= 0 && earlier < 1 && later >= 0 && later < 1)) throw new RangeError(`possibleChange: discounts must lie in [0, 1), found ${earlier} and ${later}`);
  const d = 1 / (1 - later) - 1 / (1 - earlier);
  const [a, b] = runsCanEnd ? [Math.min(0, lo), Math.max(0, hi)] : [lo, hi];
  // D < 0 when the later discount is the smaller: the ends swap.
  return d >= 0 ? { lower: a * d, upper: b * d } : { lower: b * d, upper: a * d };
}

/**
 * True when the interval [lower, upper] of an estimated change shares no point with the possible change
 * widened by its slack: by default POSSIBLE_SLACK of the range's width; where an end is unbounded (a
 * reward bounded on one side only) the caller gives it, as POSSIBLE_SLACK of the logged rewards' range
 * times D — the margin assessPossible.ts's certain-bound rule (beyondCertain) takes for J.
 */
export function changeIntervalImpossible(lower: number, upper: number, range: PossibleChange, slack = POSSIBLE_SLACK * (range.upper - range.lower)): boolean {
  return upper < range.lower - slack || lower > range.upper + slack;
}

/** One pair of swept discounts whose change cannot be right: indices into the sweep's settings, earlier < later. */
export interface ImpossibleChange {
  readonly earlier: number;
  readonly later: number;
}

/**
 * Which points to mark when the failing pairs do not say which of their two values is wrong: the
 * fewest points that touch every failing pair (each pair needs one wrong value), and among sets of
 * that size the one farthest from the project's discount in sum — the project's own point only where
 * no set without it is as small. Exhaustive over the 2^n subsets (n is a sweep's few settings).
 */
export function fewestWrong(pairs: readonly ImpossibleChange[], n: number, projectIndex: number): boolean[] {
  if (pairs.length === 0) return new Array<boolean>(n).fill(false);
  let best = -1, bestSize = Infinity, bestReach = -Infinity;
  for (let set = 1; set < 1 << n; set++) {
    if (!pairs.every((p) => set & (1 << p.earlier) || set & (1 << p.later))) continue;
    let size = 0, reach = 0;
    for (let k = 0; k < n; k++) if (set & (1 << k)) { size++; reach += Math.abs(k - projectIndex); }
    if (size < bestSize || (size === bestSize && reach > bestReach)) [best, bestSize, bestReach] = [set, size, reach];
  }
  return Array.from({ length: n }, (_, k) => (best & (1 << k)) !== 0);
}
