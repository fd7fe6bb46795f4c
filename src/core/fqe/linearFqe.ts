/**
 * Linear fitted Q-evaluation of a Gaussian policy from logged transitions: Q(s, a) = φ(s, a)ᵀw.
 *
 * One pass over the data collects the LSTD-Q statistics (bellmanStatistics.ts); after that both
 * the FQE iteration and the direct fixed-point solve (linearFqeSolve.ts) cost O(d²)–O(d³) and never
 * touch the data again. Both answers are returned with their J so they can be compared: when the
 * iteration converges they agree, and when it diverges the fixed point may still exist.
 */
import { createActionQuadrature } from '../actionQuadrature';
import { startStateFeatures } from '../bootstrap/startFeatures';
import type { FeatureMap } from '../features/featureMap';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { accumulateBellmanStatistics, type BellmanStatistics } from './bellmanStatistics';
import type { CancellationCheck } from './cancellation';
import type { FqeIterationProgress } from './fqeIteration';
import { checkFqeInput } from './linearFqeInput';
import { solveLinearFqe, type LinearSolveResult } from './linearFqeSolve';

export type { FqeIterationProgress, FqeStatus } from './fqeIteration';
export type { FixedPointSolution, LinearFqeSolution } from './linearFqeSolve';

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

export interface LinearFqeResult extends LinearSolveResult {
  /** The one-pass sums; they depend on the policy and features but not on γ or λ. */
  readonly statistics: BellmanStatistics;
}

export function fitLinearFqe(input: LinearFqeInput): LinearFqeResult {
  checkFqeInput(input);
  const { data, policy, features } = input;
  const quadrature = createActionQuadrature(policy, input.quadratureNodes);
  const statistics = accumulateBellmanStatistics(data, features, quadrature, input);
  const startFeatures = startStateFeatures(features, quadrature, input.startStates ?? data.startStates, data.stateDim);
  const solved = solveLinearFqe({
    statistics, features, stateDim: data.stateDim, actionDim: data.actionDim, discount: input.discount, ridge: input.ridge,
    tolerance: input.tolerance, maxIterations: input.maxIterations, startFeatures, initialWeights: input.initialWeights,
    onIteration: input.onIteration, cancel: input.cancel,
  });
  return { ...solved, statistics };
}
