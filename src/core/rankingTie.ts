/**
 * When two J of a sweep are tied, so that neither ranks above the other (pipeline/sweepRanking.ts):
 *
 *   |Ja − Jb| ≤ RANKING_TIE_RELATIVE · max(|Ja|, |Jb|, S),   S = mean |r| / (1 − γ)
 *
 * The rule is for rounding: two J of the same value reached by sums in another order. Rounding of
 * a sum is bounded relative to the size of its terms, about n·2^−53 of Σ|xᵢ| (Higham, "Accuracy
 * and Stability of Numerical Algorithms", 2nd ed., §4.2, quoted from memory), not relative to the
 * sum: a J near 0 because gains and costs cancel carries rounding of its terms' size. Taken
 * relative to max(|Ja|, |Jb|) alone, the tolerance shrinks with J and vanishes at 0 — two equal J
 * a few units in the last place of their terms apart, one each side of 0, were then ranked and a
 * turn that was rounding named (the tests show (0.1 + 0.2) − 0.3 against 0.1 + (0.2 − 0.3)).
 * S is the size of the terms a J sums: the logged rewards' mean magnitude over the discounted
 * horizon 1/(1 − γ). It is 0 only when every reward is 0, where every J is 0 and ties anyway.
 * Where J is far from 0 (|J| ≥ S) the rule is the relative one it was. Two J of opposite sign
 * differ by at least the larger magnitude, so they tie only when both lie within
 * RANKING_TIE_RELATIVE · S of 0. Adopted by the rule written before measuring
 * (test/battery/README.md, "The sweep ranking's tie scale").
 */
import { RANKING_TIE_RELATIVE } from './limits';

/** S = (1/n) Σ |rᵢ| / (1 − γ): the size of the terms a J at discount γ sums. rewards: n. */
export function rewardTermScale(rewards: ArrayLike<number>, discount: number): number {
  let sum = 0;
  for (let i = 0; i < rewards.length; i++) sum += Math.abs(rewards[i]);
  return rewards.length > 0 ? sum / rewards.length / (1 - discount) : 0;
}

/** Whether J values x and y are tied by the rule above; termScale: S (0: the relative rule alone). */
export function tiedValues(x: number, y: number, termScale: number): boolean {
  return Math.abs(x - y) <= RANKING_TIE_RELATIVE * Math.max(Math.abs(x), Math.abs(y), termScale);
}
