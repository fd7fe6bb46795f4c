/** Validation of the options of linear fitted Q-evaluation; messages name the option and value. */
import { FqeOptionsError } from './fqeErrors';
import type { LinearFqeInput } from './linearFqe';

export function checkFqeInput(input: LinearFqeInput): void {
  const { data, policy, features } = input;
  const ds = data.stateDim, m = data.actionDim;
  if (!(data.count >= 1)) throw new FqeOptionsError('data: the transition set is empty');
  if (policy.stateDim !== ds || policy.actionDim !== m) {
    throw new FqeOptionsError(`policy: has ${policy.stateDim} states and ${policy.actionDim} actions, the data ${ds} and ${m}`);
  }
  if (features.inputDim !== ds + m) throw new FqeOptionsError(`features: take ${features.inputDim} inputs, the data have ${ds} states + ${m} actions`);
  if (!(input.discount >= 0 && input.discount <= 1)) throw new FqeOptionsError(`discount: expected a number from 0 to 1, got ${input.discount}`);
  if (!(input.ridge >= 0) || !Number.isFinite(input.ridge)) throw new FqeOptionsError(`ridge: expected a number ≥ 0, got ${input.ridge}`);
  if (!(input.tolerance > 0) || !Number.isFinite(input.tolerance)) throw new FqeOptionsError(`tolerance: expected a positive number, got ${input.tolerance}`);
  if (!Number.isInteger(input.maxIterations) || input.maxIterations < 1) {
    throw new FqeOptionsError(`maxIterations: expected a whole number ≥ 1, got ${input.maxIterations}`);
  }
  if (!Number.isInteger(input.quadratureNodes) || input.quadratureNodes < 1) {
    throw new FqeOptionsError(`quadratureNodes: expected a whole number ≥ 1, got ${input.quadratureNodes}`);
  }
  const w0 = input.initialWeights;
  if (w0 && (w0.length !== features.dim || !Array.from(w0).every(Number.isFinite))) {
    throw new FqeOptionsError(`initialWeights: expected ${features.dim} finite numbers (one per feature)`);
  }
  const starts = input.startStates ?? data.startStates;
  if (starts.length < ds || starts.length % ds !== 0) {
    throw new FqeOptionsError(`startStates: expected at least one row of ${ds} values, got ${starts.length} values`);
  }
}
