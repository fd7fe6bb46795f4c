/**
 * Linear fitted Q-evaluation on given one-pass statistics (bellmanStatistics.ts), without touching
 * the data: the FQE iteration w_{k+1} = (G + λD)⁻¹(b + γMw_k) and the direct LSTD-Q fixed point
 * (G + λD − γM)w = b (ridgeSystem.ts), each with J = mean over start states of ξ(s0)ᵀw, where
 * ξ(s0) = Σ_j ω_j φ(s0, a_j) is the policy-averaged start feature (startFeatures.ts; V^π(s0) = ξᵀw
 * by linearity of Q in w).
 *
 * Split from the data pass so that every host forms the statistics once — from the whole data in
 * one pass, or as the sum of per-episode sums kept for the bootstrap — and solves from them.
 */
import type { FeatureMap } from '../features/featureMap';
import { dot } from '../linalg/dense';
import type { PolicyValueEstimate } from '../value';
import type { BellmanStatistics } from './bellmanStatistics';
import { bellmanResidual } from './bellmanResidual';
import type { CancellationCheck } from './cancellation';
import { runFqeIteration, type FqeIterationProgress, type FqeStatus, type IterationOutcome } from './fqeIteration';
import { linearActionValue, type LinearActionValue } from './linearActionValue';
import { fixedPointWeights, iterationMatrix, ridgeGram, ridgeGramFactor } from './ridgeSystem';
import { spectralRadiusBound } from './spectralRadiusBound';

export interface LinearSolveInput {
  readonly statistics: BellmanStatistics;
  readonly features: FeatureMap;
  readonly stateDim: number; // ds
  readonly actionDim: number; // m
  readonly discount: number;
  readonly ridge: number;
  readonly tolerance: number;
  readonly maxIterations: number;
  /** ξ(s0) per start state: count×d row-major (startFeatures.ts). */
  readonly startFeatures: Float64Array;
  /** w_0 (d); default 0, which makes w_1 the one-step reward regression. */
  readonly initialWeights?: ArrayLike<number>;
  readonly onIteration?: (progress: FqeIterationProgress) => void;
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

export interface LinearSolveResult {
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
}

export function solveLinearFqe(input: LinearSolveInput): LinearSolveResult {
  const { statistics, features, discount, ridge } = input, d = features.dim;
  const a = ridgeGram(statistics, ridge, features.constantIndex);
  const factor = ridgeGramFactor(a, d, ridge);
  const bound = spectralRadiusBound(iterationMatrix(statistics, factor, discount), d);
  const outcome = runFqeIteration({
    stats: statistics, factor, discount, tolerance: input.tolerance, maxIterations: input.maxIterations,
    initialWeights: Float64Array.from(input.initialWeights ?? new Float64Array(d)),
    spectralRadiusBound: bound, startFeatures: meanRows(input.startFeatures, d),
    onIteration: input.onIteration, cancel: input.cancel,
  });
  const solution = (w: Float64Array): LinearFqeSolution => ({
    q: linearActionValue(features, w, input.stateDim, input.actionDim),
    policyValue: startValue(input.startFeatures, w),
    bellmanResidual: bellmanResidual(statistics, w, discount),
  });
  const fixed = fixedPointWeights(statistics, a, discount);
  return {
    status: outcome.status,
    message: `Fitted Q-evaluation ${outcome.reason}.`,
    iterative: outcome.weights ? solution(outcome.weights) : null,
    fixedPoint: 'weights' in fixed ? { ...solution(fixed.weights), warning: fixedPointWarning(outcome) } : null,
    fixedPointMessage: 'failure' in fixed ? `No fixed-point solution: ${fixed.failure}.` : fixedPointSummary(outcome.status),
    history: outcome.history,
    spectralRadiusBound: bound,
  };
}

/** J and its start-state standard error from ξ(s0)ᵀw per start state (startFeatures: count×d). */
export function startValue(startFeatures: Float64Array, w: ArrayLike<number>): PolicyValueEstimate {
  const d = w.length, e = startFeatures.length / d;
  const values = new Float64Array(e);
  let sum = 0;
  for (let s = 0; s < e; s++) {
    values[s] = dot(startFeatures.subarray(s * d, (s + 1) * d), w);
    sum += values[s];
  }
  const mean = sum / e;
  if (e < 2) return { value: mean, standardError: null, count: e };
  let squares = 0; // two-pass sample variance (Chan, Golub & LeVeque, 1983)
  for (let s = 0; s < e; s++) squares += (values[s] - mean) ** 2;
  return { value: mean, standardError: Math.sqrt(squares / (e - 1) / e), count: e };
}

/** Mean of the rows of a count×d matrix. */
function meanRows(rows: Float64Array, d: number): Float64Array {
  const e = rows.length / d, mean = new Float64Array(d);
  for (let s = 0; s < e; s++) for (let f = 0; f < d; f++) mean[f] += rows[s * d + f] / e;
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
