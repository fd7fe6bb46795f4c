/**
 * The logged behaviour as a Gaussian policy for importance weights: the fitted behaviour model
 * (../behaviourModel.ts), which carries the actuator limits the logs show (../loggedActionLimits.ts)
 * as a clip, so a logged action at a limit carries the point mass of the clipped Gaussian
 * (importanceRatio.ts), and is fitted there by censored maximum likelihood. A candidate seeded from
 * the same model (behaviourPolicySpec) is therefore the same policy as this one.
 */
import { behaviourPolicySpec, fitBehaviourModel, type BehaviourModel } from '../behaviourModel';
import { NO_DECLARED_BOUNDS, type DeclaredActionBounds, type LoggedActionLimits } from '../loggedActionLimits';
import { createGaussianPolicy, type GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';

export type { DeclaredActionBounds, LoggedActionLimits } from '../loggedActionLimits';

export interface FittedBehaviour {
  readonly model: BehaviourModel;
  readonly limits: LoggedActionLimits;
  readonly policy: GaussianPolicy;
}

/**
 * `declared`: the position limits the project's candidates declare (a logged extreme exactly there is a limit; ../loggedActionLimits.ts).
 * `moving`: 1 for the rows to fit the law on, where held actions were found (../behaviourModel.ts); every row without it.
 */
export function fittedBehaviourPolicy(data: TransitionSet, declared: DeclaredActionBounds = NO_DECLARED_BOUNDS, moving?: Uint8Array): FittedBehaviour {
  const { count: n, stateDim: ds, actionDim: m } = data;
  const model = fitBehaviourModel(data.states, data.actions, n, ds, m, declared, moving);
  return { model, limits: model.limits, policy: createGaussianPolicy(behaviourPolicySpec(model), ds) };
}
