/**
 * The mean squared temporal-difference (Bellman) error of linear weights w, from the one-pass
 * statistics in O(d²):
 *   δ_i = r_i + γ ψ_iᵀw − φ_iᵀw,
 *   mean δ² = rr + wᵀGw + γ² wᵀHw − 2 bᵀw + 2γ eᵀw − 2γ wᵀMw
 * (expand the square and average term by term; common practice).
 *
 * ψ_i averages over the policy's next action exactly (quadrature) but over the next state only
 * through the one logged s'_i, so this residual has a floor at the one-step variance of
 * r + γV(s') — it shrinks as Q improves but does not reach 0 on noisy plants.
 */
import type { BellmanStatistics } from './bellmanStatistics';

export function bellmanResidual(stats: BellmanStatistics, w: ArrayLike<number>, discount: number): number {
  const { dim: d, gram, nextGram, crossNext, featureReward, nextFeatureReward, rewardSquare } = stats;
  let quadratic = 0, linear = 0;
  for (let a = 0; a < d; a++) {
    let g = 0, h = 0, m = 0;
    for (let b = 0; b < d; b++) {
      g += gram[a * d + b] * w[b];
      h += nextGram[a * d + b] * w[b];
      m += crossNext[a * d + b] * w[b];
    }
    quadratic += w[a] * (g + discount * discount * h - 2 * discount * m);
    linear += w[a] * (discount * nextFeatureReward[a] - featureReward[a]);
  }
  // The terms can be large and nearly cancel; a tiny negative total is round-off, not a negative square.
  return Math.max(0, rewardSquare + quadratic + 2 * linear);
}
