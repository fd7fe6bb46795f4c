/** Validation of the inputs of network FQE; messages name the input and its value. */
import { FqeOptionsError } from './fqeErrors';
import type { NetworkFqeInput } from './networkFqe';
import { checkNetworkSettings } from './networkSettings';
import { checkDiscount, checkQuadratureNodes } from './solveSettingChecks';
import { SEED } from '../limits';

export function checkNetworkFqeInput(input: NetworkFqeInput): void {
  const { data, policy } = input;
  if (!(data.count >= 1)) throw new FqeOptionsError('data: the transition set is empty');
  if (policy.stateDim !== data.stateDim || policy.actionDim !== data.actionDim) {
    throw new FqeOptionsError(`policy: has ${policy.stateDim} states and ${policy.actionDim} actions, the data ${data.stateDim} and ${data.actionDim}`);
  }
  checkDiscount(input.discount);
  checkQuadratureNodes(policy, input.quadratureNodes);
  if (!Number.isInteger(input.seed) || input.seed < SEED.min || input.seed > SEED.max) {
    throw new FqeOptionsError(`seed: expected a whole number from ${SEED.min} to 2^32 − 1, got ${input.seed}`);
  }
  checkNetworkSettings(input.settings);
}
