/** A candidate's model under the plan's approximator (linearModel.ts or networkModel.ts). */
import type { EvaluationPlan, PlannedPolicy } from '../plan/evaluationPlan';
import type { CandidateModel } from './candidateModel';
import { buildLinearModelPaced } from './linearModel';
import type { ModelHooks } from './modelHooks';
import { buildNetworkModel } from './networkModel';

export function buildModel(plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}): Promise<CandidateModel> {
  return plan.approximator.kind === 'linear' ? buildLinearModelPaced(plan, planned, hooks) : buildNetworkModel(plan, planned, hooks);
}
