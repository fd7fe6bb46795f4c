/**
 * Linear fitted Q-evaluation of a Gaussian policy from logged transitions: Q(s, a) = φ(s, a)ᵀw.
 *
 * One pass over the data collects the LSTD-Q statistics (bellmanStatistics.ts); after that both
 * the FQE iteration and the direct fixed-point solve (linearFqeSolve.ts) cost O(d²)–O(d³) and never
 * touch the data again. Both answers are returned with their J so they can be compared: when the
 * iteration converges they agree, and when it diverges the fixed point may still exist.
 */
import { createActionQuadrature } from '../actionQuadrature';
import { startStateFeatures } from '../features/policyFeatures';
import { accumulateBellmanStatistics, type BellmanStatistics } from './bellmanStatistics';
import { checkFqeInput, type LinearFqeInput } from './linearFqeInput';

export type { LinearFqeInput } from './linearFqeInput';
import { solveLinearFqe, type LinearSolveResult } from './linearFqeSolve';

export type { FqeIterationProgress, FqeStatus } from './fqeIteration';
export type { FixedPointSolution, LinearFqeSolution } from './linearFqeSolve';

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
