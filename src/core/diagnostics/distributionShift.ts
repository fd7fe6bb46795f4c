/**
 * The distribution-shift statistic of linear off-policy evaluation, νᵀΣ⁻¹ν, with ν = E_π[φ]
 * the candidate's mean feature vector and Σ = E_data[φφᵀ] the logged feature second moment
 * (Duan, Jia & Wang, "Minimax-optimal off-policy evaluation with linear function approximation",
 * ICML 2020: the estimation error of fitted Q-evaluation scales with √(νᵀΣ⁻¹ν), which equals
 * 1 + χ² divergence of the candidate's distribution from the data's, restricted to the features).
 *
 * With a constant feature, ν = E_data[φ] gives exactly 1: ν is then column c of Σ, so
 * νᵀΣ⁻¹ν = e_cᵀΣe_c = 1. Values above 1 measure how far the candidate's features leave what
 * the logs cover. Σ here is the ridge-regularised G + λD of the fit (ridgeSystem.ts), whose
 * Cholesky factor the caller already has.
 *
 * ν is taken over two state distributions we can form without a model of the plant:
 *   start states:  ν₀ = mean over start states of Σ_j ω_j φ(s0, a_j)            (startFeatures.ts)
 *   next states:   ν' = mean over logged transitions of ψ_i = Σ_j ω_j φ(s'_i, a'_ij)
 * both with the candidate's actions by the action quadrature (nodes a_j, weights ω_j).
 */
import type { BellmanStatistics } from '../fqe/bellmanStatistics';

export class DistributionShiftError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DistributionShiftError';
  }
}

/** ‖L⁻¹ν‖² for Σ = LLᵀ (factor: lower d×d row-major). */
export function distributionShift(nu: ArrayLike<number>, factor: Float64Array, d: number): number {
  if (nu.length !== d || factor.length !== d * d) throw new DistributionShiftError(`distribution shift: expected ν of ${d} and a ${d}×${d} factor`);
  const y = new Float64Array(d);
  let total = 0;
  for (let i = 0; i < d; i++) {
    let s = nu[i];
    for (let k = 0; k < i; k++) s -= factor[i * d + k] * y[k];
    y[i] = s / factor[i * d + i];
    total += y[i] * y[i];
  }
  return total;
}

/**
 * ν' = mean ψ over the logged transitions: row c of M = ΦᵀΨ/n when feature c is the constant 1
 * (φ_c = 1 makes (ΦᵀΨ)_{c,b} = Σ_i ψ_ib). Null without a constant feature.
 * Transitions into a terminal state have ψ = 0 and so count as zero features.
 */
export function nextStateFeatureMean(stats: BellmanStatistics, constantIndex: number | null): Float64Array | null {
  if (constantIndex === null) return null;
  const d = stats.dim;
  return stats.crossNext.slice(constantIndex * d, (constantIndex + 1) * d);
}
