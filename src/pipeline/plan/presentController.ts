/**
 * Today's controller as a policy the pipeline can evaluate like any candidate: the linear-Gaussian
 * model fitted to the logged actions, clipped at the actuator limits the logs show (repeated extremes,
 * or an extreme exactly at a bound a candidate declares: declaredBounds.ts) and fitted there by
 * censored maximum likelihood (src/core/behaviourModel.ts). Evaluated by the same fitted
 * Q-evaluation as the candidates, it is the comparable baseline that comparisons and the ranking use;
 * the logged discounted return, which is cut short where runs end on a time limit, is kept as a check.
 */
import { BehaviourModelError } from '../../core/behaviourModel';
import { fittedBehaviourPolicy, type DeclaredActionBounds, type FittedBehaviour } from '../../core/offPolicy/behaviourPolicy';
import type { TransitionSet } from '../../core/transitions';
import { quadratureProblem } from '../../core/fqe/solveSettingChecks';
import type { PlannedPolicy } from './planTypes';

export const PRESENT_CONTROLLER_NAME = 'present controller (model fitted to the log)';

export interface PlannedPresentController {
  /** The policy to evaluate, index −1 (it is not one of the project's candidates); null when it cannot be formed. */
  readonly planned: PlannedPolicy | null;
  readonly fitted: FittedBehaviour | null;
  /** Why there is no present-controller model, in words; '' when there is one. */
  readonly reason: string;
}

export function planPresentController(data: TransitionSet, quadratureNodes: number, declared: DeclaredActionBounds): PlannedPresentController {
  let fitted: FittedBehaviour;
  try {
    fitted = fittedBehaviourPolicy(data, declared);
  } catch (error) {
    if (!(error instanceof BehaviourModelError)) throw error;
    return { planned: null, fitted: null, reason: `no model of the present controller could be fitted to the log (${error.message})` };
  }
  const problem = quadratureProblem(fitted.policy, quadratureNodes);
  if (problem) return { planned: null, fitted, reason: `the present controller’s model clips at the logged limits, and for it ${problem}` };
  return { planned: { index: -1, name: PRESENT_CONTROLLER_NAME, policy: fitted.policy }, fitted, reason: '' };
}
