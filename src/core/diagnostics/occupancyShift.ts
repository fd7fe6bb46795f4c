/**
 * The calibrated distribution shift of a candidate: its normalised discounted state–action
 * occupancy, seen through the approximator's features, against the logged data's feature second
 * moment. 1 means "like the logs"; the error bound of linear fitted Q-evaluation grows with its
 * square root (Duan, Jia & Wang, "Minimax-optimal off-policy evaluation with linear function
 * approximation", ICML 2020: their upper bound and its discounted form; theorem numbering from memory).
 *
 * What is measured. The candidate's normalised discounted occupancy d^π(s, a) = (1 − γ) Σ_t γ^t
 * P^π(s_t = s, a_t = a) from the start states has the feature mean ν = E_{d^π}[φ]. Against
 * Σ = E_data[φφᵀ],
 *     shift = νᵀ Σ⁻¹ ν = sup_w (E_{d^π}[φᵀw])² / E_data[(φᵀw)²] = 1 + χ²_F(d^π ‖ data),
 * the χ² divergence restricted to the feature class (DJW 2020, §4).
 *
 * How ν is obtained without a model of the plant: successor features (Barreto et al., "Successor
 * features for transfer in reinforcement learning", NeurIPS 2017). F(s, a) = E^π[Σ_t γ^t φ(s_t, a_t)
 * | s_0 = s, a_0 = a] obeys F = φ + γ E[F(s', a')], a Bellman equation whose reward is the vector φ.
 * Fitting each component F_j ≈ φᵀu_j by the same LSTD-Q solve as linear FQE (ridgeSystem.ts) with
 * reward φ_j, whose right-hand side Φᵀφ_j/n is column j of G, gives U = A⁻¹G with
 *     A = G + λD − γM      (G = ΦᵀΦ/n, M = ΦᵀΨ/n from bellmanStatistics.ts; λ, D as in ridgeSystem.ts),
 * and ν = (1 − γ) E_{s0}[Uᵀ ξ(s0)] = (1 − γ) Uᵀ ξ̄₀, i.e.
 *     ν = (1 − γ) G z,   Aᵀ z = ξ̄₀,   shift = νᵀ (G + λD)⁻¹ ν,
 * with ξ̄₀ the mean policy-averaged start feature vector (../features/policyFeatures.ts). One solve
 * with Aᵀ, one with G + λD: the cost of one fixed-point solve, and the LU factor of A can be shared.
 *
 * Checks on the algebra (each is a test): with a constant feature c and no terminal transitions,
 * ψ_c = 1, so M e_c = G e_c and D e_c = 0 give A e_c = (1 − γ) G e_c, hence ν_c = ξ̄₀_c = 1: ν is a
 * probability mean, and by Cauchy–Schwarz with w = e_c, shift ≥ ν_c² / G_cc = 1 exactly. Transitions
 * into terminal states make ν_c < 1 (the occupancy's mass stops there). The logged controller started
 * in its own steady state has ν = E_data[φ] and shift 1.
 *
 * Relation to marginalised importance weights (Uehara, Huang & Jiang, "Minimax weight and Q-function
 * learning for off-policy evaluation", ICML 2020): ŵ = φᵀβ, β = Σ⁻¹ν is the occupancy ratio d^π/μ
 * projected on the features (E_data[ŵφ] = ν), shift = E_data[ŵ²], so 1/shift is the Kish effective
 * share of these weights (Kish, "Survey Sampling", 1965). Their value estimate E_data[ŵr]/(1 − γ)
 * = βᵀb/(1 − γ) equals the LSTD-Q fixed point ξ̄₀ᵀA⁻¹b when λ = 0 (β = (1 − γ)z): with the same
 * linear class the weights are not an independent check of FQE.
 *
 * Per bootstrap resample: pass the resample's statistics (resampleBellmanStatistics over the
 * per-episode sums, ../bootstrap/episodeBellmanSums.ts) and its ξ̄₀ (meanStartFeatures with the
 * multiplicities); a replicate costs O(e·d²) to form plus O(d³) here. The estimate is a ratio of
 * quadratic forms, so its replicates are right-skewed; read an upper percentile beside the point.
 *
 * Shapes: d features; G, M d×d row-major; ξ̄₀, ν, z: d.
 */
import { cholesky, luFactor, luSolveTransposed, SingularMatrixError, type LuFactors } from '../linalg/dense';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import { ridgeGram } from '../fqe/ridgeSystem';
import { distributionShift } from './distributionShift';

export interface OccupancyShiftInput {
  /** The candidate's one-pass sums (ψ by the candidate's action quadrature), full data or a resample. */
  readonly statistics: BellmanStatistics;
  /** ξ̄₀: mean over start states of Σ_j ω_j φ(s0, a_j), the candidate's actions. d. */
  readonly startFeatureMean: ArrayLike<number>;
  readonly discount: number; // γ ∈ [0, 1)
  readonly ridge: number; // λ, as in the fit
  readonly constantIndex: number | null;
  /** LU factors of A = G + λD − γM when the caller already has them (the fixed-point solve). */
  readonly systemFactors?: LuFactors;
}

export interface OccupancyShift {
  /** νᵀ(G + λD)⁻¹ν: 1 = like the logs. */
  readonly shift: number;
  /** ν = E_{d^π}[φ], the occupancy's feature mean. d. */
  readonly occupancyFeatures: Float64Array;
  /** ν at the constant feature: 1 without terminal transitions, below 1 with them; null without a constant. */
  readonly occupancyMass: number | null;
}

export type OccupancyShiftResult = OccupancyShift | { readonly failure: string };

export function occupancyShift(input: OccupancyShiftInput): OccupancyShiftResult {
  const { statistics: stats, discount, ridge, constantIndex } = input, d = stats.dim;
  if (input.startFeatureMean.length !== d) return { failure: `occupancy shift: expected ${d} start features, got ${input.startFeatureMean.length}` };
  if (!(discount >= 0 && discount < 1)) return { failure: `occupancy shift: the discount must lie in [0, 1), got ${discount}` };
  const sigma = ridgeGram(stats, ridge, constantIndex);
  let z: Float64Array, factor: Float64Array;
  try {
    z = luSolveTransposed(input.systemFactors ?? luFactor(bellmanSystem(stats, sigma, discount), d), input.startFeatureMean);
    factor = cholesky(sigma, d);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    return { failure: 'occupancy shift: the equations (G + λD − γM)ᵀz = ξ̄₀ or the Gram matrix are singular with these features and data' };
  }
  const nu = new Float64Array(d);
  for (let i = 0; i < d; i++) {
    let s = 0;
    for (let j = 0; j < d; j++) s += stats.gram[i * d + j] * z[j];
    nu[i] = (1 - discount) * s;
  }
  const shift = distributionShift(nu, factor, d);
  if (!Number.isFinite(shift)) return { failure: 'occupancy shift: not a finite number (the solve is too badly conditioned)' };
  return { shift, occupancyFeatures: nu, occupancyMass: constantIndex === null ? null : nu[constantIndex] };
}

/** A = G + λD − γM, from the ridge Gram G + λD. d×d row-major. */
export function bellmanSystem(stats: BellmanStatistics, ridgeGramMatrix: Float64Array, discount: number): Float64Array {
  return Float64Array.from(ridgeGramMatrix, (v, k) => v - discount * stats.crossNext[k]);
}
