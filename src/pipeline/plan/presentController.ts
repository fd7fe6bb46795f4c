/**
 * Today's controller as a policy the pipeline can evaluate like any candidate: the linear-Gaussian
 * model fitted to the logged actions, clipped at the actuator limits the logs show (repeated extremes,
 * or an extreme exactly at a bound a candidate declares: declaredBounds.ts) and fitted there by
 * censored maximum likelihood (src/core/behaviourModel.ts). Evaluated by the same fitted
 * Q-evaluation as the candidates, it is the comparable baseline that comparisons and the ranking use;
 * the logged discounted return, which is cut short where runs end on a time limit, is kept as a check.
 *
 * Held actions (../heldActionsCheck.ts) are read first, with the same limits: where the rule says the held
 * rows pull the law (heldActionsFinding.ts, heldLawRepaired), the law is fitted on the rows not held — the law
 * that ran between the stretches — and on every row otherwise (then bit for bit as without the check). Should
 * the fit on the rows not held fail, the fit on every row stands (and the finding keeps its words for that).
 */
import { BehaviourModelError } from '../../core/behaviourModel';
import { loggedActionLimits } from '../../core/loggedActionLimits';
import { fittedBehaviourPolicy, type DeclaredActionBounds, type FittedBehaviour } from '../../core/offPolicy/behaviourPolicy';
import type { TransitionSet } from '../../core/transitions';
import { quadratureProblem } from '../../core/fqe/solveSettingChecks';
import { readHeldActions, repairsLaw, type HeldActionsRead, type HeldLawFit } from '../heldActionsCheck';
import type { PlannedPolicy } from './planTypes';

export const PRESENT_CONTROLLER_NAME = 'present controller (model fitted to the log)';

export interface PlannedPresentController {
  /** The policy to evaluate, index −1 (it is not one of the project's candidates); null when it cannot be formed. */
  readonly planned: PlannedPolicy | null;
  readonly fitted: FittedBehaviour | null;
  /** Why there is no present-controller model, in words; '' when there is one. */
  readonly reason: string;
  /** The held-actions check's reading of the log, and the rows the law was fitted on. */
  readonly held: HeldActionsRead;
  readonly lawFit: HeldLawFit;
}

/** The present controller's law as the plan fits it (held actions read first, the repair where the rule says so), or why it could not be fitted; the import summary shows the same law. */
export function fitPresentControllerLaw(data: TransitionSet, declared: DeclaredActionBounds): { fitted: FittedBehaviour | null; error: string; held: HeldActionsRead; lawFit: HeldLawFit } {
  const held = readHeldActions(data, loggedActionLimits(data.actions, data.count, data.actionDim, declared));
  const moving = repairsLaw(held) && !('reason' in held) ? held.held.map((h) => 1 - h) : undefined;
  const attempt = moving ? fitOrReason(() => fittedBehaviourPolicy(data, declared, moving)) : null;
  const repaired = attempt && 'fitted' in attempt ? attempt.fitted : null;
  const repairFailed = attempt && 'reason' in attempt ? { repairFailed: attempt.reason } : {};
  try {
    const fitted = repaired ?? fittedBehaviourPolicy(data, declared);
    return { fitted, error: '', held, lawFit: { lawFittedOn: repaired ? 'movingRows' : 'everyRow', rowsUsed: fitted.model.count, ...repairFailed } };
  } catch (error) {
    if (!(error instanceof BehaviourModelError)) throw error;
    return { fitted: null, error: error.message, held, lawFit: { lawFittedOn: 'everyRow', rowsUsed: null } };
  }
}

export function planPresentController(data: TransitionSet, quadratureNodes: number, declared: DeclaredActionBounds): PlannedPresentController {
  const { fitted, error, held, lawFit } = fitPresentControllerLaw(data, declared);
  if (!fitted) return { planned: null, fitted: null, reason: `no model of the present controller could be fitted to the log (${error})`, held, lawFit };
  const problem = quadratureProblem(fitted.policy, quadratureNodes);
  if (problem) return { planned: null, fitted, reason: `the present controller’s model clips at the logged limits, and for it ${problem}`, held, lawFit };
  return { planned: { index: -1, name: PRESENT_CONTROLLER_NAME, policy: fitted.policy }, fitted, reason: '', held, lawFit };
}

function fitOrReason(fit: () => FittedBehaviour): { fitted: FittedBehaviour } | { reason: string } {
  try {
    return { fitted: fit() };
  } catch (error) {
    if (error instanceof BehaviourModelError) return { reason: error.message };
    throw error;
  }
}
