/**
 * The logged return completed past each time-limited run's end by γ^T·V̂(s_T), V̂ the fitted state
 * value of a model (src/core/loggedReturn.ts: completedLoggedReturn): the present controller's for
 * the baseline check. The final states' values are taken once from the model.
 */
import { completedLoggedReturn, episodeEnds, type CompletedReturn } from '../../core/loggedReturn';
import { stateValues } from '../../core/value';
import type { EvaluationPlan } from '../plan/evaluationPlan';
import type { CandidateModel } from './candidateModel';

/** V̂ at each run's last next state (e), and the weights γ^T of the value past time-limited ends (0 after a terminal state). */
export function finalStateValues(plan: EvaluationPlan, model: CandidateModel): { values: Float64Array; tailWeights: Float64Array } {
  const ends = episodeEnds(plan.data, plan.discount), e = plan.data.episodeCount;
  return { values: stateValues(model.fit.q, model.policy, ends.finalStates, e, model.quadrature), tailWeights: ends.tailWeights };
}

export function completedReturnOf(plan: EvaluationPlan, model: CandidateModel): CompletedReturn {
  return completedReturnFromEnds(plan, finalStateValues(plan, model));
}

/** The same from final-state values already taken (finalStateValues). */
export function completedReturnFromEnds(plan: EvaluationPlan, ends: { values: Float64Array; tailWeights: Float64Array }): CompletedReturn {
  return completedLoggedReturn(plan.loggedReturn, { finalStates: new Float64Array(0), tailWeights: ends.tailWeights }, ends.values);
}
