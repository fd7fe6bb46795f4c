/**
 * Linear fitted Q-evaluation of a Gaussian policy from logged transitions: Q(s, a) = φ(s, a)ᵀw.
 *
 * One pass over the data collects the LSTD-Q statistics (bellmanStatistics.ts); after that both
 * the FQE iteration and the direct fixed-point solve (ridgeSystem.ts) cost O(d²)–O(d³) and never
 * touch the data again. Both answers are returned with their J so they can be compared: when the
 * iteration converges they agree, and when it diverges the fixed point may still exist.
 */
import { createActionQuadrature, type ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { policyValue, type PolicyValueEstimate } from '../value';
import { accumulateBellmanStatistics, type BellmanStatistics } from './bellmanStatistics';
import { bellmanResidual } from './bellmanResidual';
import type { CancellationCheck } from './cancellation';
import { runFqeIteration, type FqeIterationProgress, type FqeStatus, type IterationOutcome } from './fqeIteration';
import { linearActionValue, type LinearActionValue } from './linearActionValue';
import { checkFqeInput } from './linearFqeInput';
import { fixedPointWeights, iterationMatrix, ridgeGram, ridgeGramFactor } from './ridgeSystem';
import { spectralRadiusBound } from './spectralRadiusBound';

export type { FqeIterationProgress, FqeStatus } from './fqeIteration';

export interface LinearFqeInput {
  readonly data: TransitionSet;
  readonly policy: GaussianPolicy;
  readonly features: FeatureMap;
  readonly discount: number; // γ ∈ [0, 1]
  /** λ ≥ 0 per sample on the averaged normal equations; the constant feature is not penalised (ridgeSystem.ts). */
  readonly ridge: number;
  readonly quadratureNodes: number; // Gauss–Hermite nodes per action dimension
  /** Stop when the relative weight change ‖Δw‖/‖w‖ is at most this. */
  readonly tolerance: number;
  readonly maxIterations: number;
  /** w_0 (d); default 0, which makes w_1 the one-step reward regression. */
  readonly initialWeights?: ArrayLike<number>;
  /** e×ds start states for J; default data.startStates. */
  readonly startStates?: Float64Array;
  readonly onIteration?: (progress: FqeIterationProgress) => void;
  readonly onDataPass?: (rowsDone: number, rowsTotal: number) => void;
  readonly cancel?: CancellationCheck;
}

export interface LinearFqeSolution {
  readonly q: LinearActionValue; // weights and toSpec() for saving
  readonly policyValue: PolicyValueEstimate;
  /** Mean squared TD error on the data (bellmanResidual.ts). */
  readonly bellmanResidual: number;
}

export interface FixedPointSolution extends LinearFqeSolution {
  /** Why this solution deserves caution, or null when the iteration converged to it. */
  readonly warning: string | null;
}

export interface LinearFqeResult {
  readonly status: FqeStatus;
  /** Plain-language summary of how the iteration ended. */
  readonly message: string;
  /** The iterate at the end; null when the iteration diverged. */
  readonly iterative: LinearFqeSolution | null;
  /** The LSTD-Q fixed point; null when it does not exist (fixedPointMessage says why). */
  readonly fixedPoint: FixedPointSolution | null;
  readonly fixedPointMessage: string;
  readonly history: readonly FqeIterationProgress[];
  /** Upper bound on the spectral radius of γ(G + λD)⁻¹M; below 1 the iteration provably contracts. */
  readonly spectralRadiusBound: number;
  /** The one-pass sums; they depend on the policy and features but not on γ or λ. */
  readonly statistics: BellmanStatistics;
}

export function fitLinearFqe(input: LinearFqeInput): LinearFqeResult {
  checkFqeInput(input);
  const { data, policy, features, discount, ridge } = input;
  const quadrature = createActionQuadrature(policy, input.quadratureNodes);
  const statistics = accumulateBellmanStatistics(data, features, quadrature, input);
  const startStates = input.startStates ?? data.startStates;
  const a = ridgeGram(statistics, ridge, features.constantIndex);
  const factor = ridgeGramFactor(a, features.dim, ridge);
  const bound = spectralRadiusBound(iterationMatrix(statistics, factor, discount), features.dim);
  const outcome = runFqeIteration({
    stats: statistics, factor, discount, tolerance: input.tolerance, maxIterations: input.maxIterations,
    initialWeights: Float64Array.from(input.initialWeights ?? new Float64Array(features.dim)),
    spectralRadiusBound: bound, startFeatures: meanStartFeatures(features, quadrature, startStates, data.stateDim),
    onIteration: input.onIteration, cancel: input.cancel,
  });
  const solution = (w: Float64Array): LinearFqeSolution => {
    const q = linearActionValue(features, w, data.stateDim, data.actionDim);
    return { q, policyValue: policyValue(q, policy, startStates, quadrature), bellmanResidual: bellmanResidual(statistics, w, discount) };
  };
  const fixed = fixedPointWeights(statistics, a, discount);
  const fixedPoint = 'weights' in fixed ? { ...solution(fixed.weights), warning: fixedPointWarning(outcome) } : null;
  return {
    status: outcome.status,
    message: `Fitted Q-evaluation ${outcome.reason}.`,
    iterative: outcome.weights ? solution(outcome.weights) : null,
    fixedPoint,
    fixedPointMessage: 'failure' in fixed ? `No fixed-point solution: ${fixed.failure}.` : fixedPointSummary(outcome.status),
    history: outcome.history,
    spectralRadiusBound: bound,
    statistics,
  };
}

/** (1/e) Σ_s0 Σ_j ω_j φ(s0, a_j): J(w) is its inner product with w. startStates: e×ds. */
function meanStartFeatures(features: FeatureMap, quadrature: ActionQuadrature, startStates: Float64Array, ds: number): Float64Array {
  const d = features.dim, m = quadrature.actionDim, e = startStates.length / ds;
  const mean = new Float64Array(d), phi = new Float64Array(d), input = new Float64Array(ds + m);
  const points = new Float64Array(quadrature.maxPoints * m), weights = new Float64Array(quadrature.maxPoints);
  for (let s = 0; s < e; s++) {
    for (let c = 0; c < ds; c++) input[c] = startStates[s * ds + c];
    const k = quadrature.at(startStates, s * ds, points, weights);
    for (let j = 0; j < k; j++) {
      for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
      features.evaluate(input, 0, phi, 0);
      for (let f = 0; f < d; f++) mean[f] += (weights[j] * phi[f]) / e;
    }
  }
  return mean;
}

function fixedPointWarning(outcome: IterationOutcome): string | null {
  if (outcome.status === 'converged') return null;
  if (outcome.status === 'maxIterations') return 'the iteration had not reached the tolerance; compare its J with this one before relying on either';
  return 'the iteration diverges on these data, so nothing pulls the estimate towards this solution: it solves the projected ' +
    'Bellman equation exactly, but off-policy that solution can lie far from the true Q. Treat its J with caution';
}

function fixedPointSummary(status: FqeStatus): string {
  if (status === 'converged') return 'The fixed-point solution (LSTD-Q) agrees with the converged iteration up to the tolerance.';
  return 'The fixed-point solution (LSTD-Q) exists but is flagged: see its warning.';
}
