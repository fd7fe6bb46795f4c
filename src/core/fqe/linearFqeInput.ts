/** The input of linear fitted Q-evaluation (linearFqe.ts) and its validation; messages name the option and value. */
import type { FeatureMap } from '../features/featureMap';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import type { CancellationCheck } from './cancellation';
import type { FqeIterationProgress } from './fqeIteration';
import { FqeOptionsError } from './fqeErrors';
import { checkDiscount, checkMaxIterations, checkQuadratureNodes, checkRidge, checkTolerance } from './solveSettingChecks';

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


export function checkFqeInput(input: LinearFqeInput): void {
  const { data, policy, features } = input;
  const ds = data.stateDim, m = data.actionDim;
  if (!(data.count >= 1)) throw new FqeOptionsError('data: the transition set is empty');
  if (policy.stateDim !== ds || policy.actionDim !== m) {
    throw new FqeOptionsError(`policy: has ${policy.stateDim} states and ${policy.actionDim} actions, the data ${ds} and ${m}`);
  }
  if (features.inputDim !== ds + m) throw new FqeOptionsError(`features: take ${features.inputDim} inputs, the data have ${ds} states + ${m} actions`);
  checkDiscount(input.discount);
  checkRidge(input.ridge);
  checkTolerance(input.tolerance);
  checkMaxIterations(input.maxIterations);
  checkQuadratureNodes(policy, input.quadratureNodes);
  const w0 = input.initialWeights;
  if (w0 && (w0.length !== features.dim || !Array.from(w0).every(Number.isFinite))) {
    throw new FqeOptionsError(`initialWeights: expected ${features.dim} finite numbers (one per feature)`);
  }
  const starts = input.startStates ?? data.startStates;
  if (starts.length < ds || starts.length % ds !== 0) {
    throw new FqeOptionsError(`startStates: expected at least one row of ${ds} values, got ${starts.length} values`);
  }
}
