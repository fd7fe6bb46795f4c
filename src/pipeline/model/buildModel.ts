/** A candidate's model under the plan's approximator (linearModel.ts or networkModel.ts). */
import type { EvaluationPlan, PlannedPolicy } from '../plan/evaluationPlan';
import type { CandidateModel } from './candidateModel';
import { buildLinearModelPaced } from './linearModel';
import type { ModelHooks } from './modelHooks';
import { buildNetworkModel } from './networkModel';

/** `built`: the models of other policies already built on this plan (a linear pass takes their policy-free sums). */
export function buildModel(plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}, built: readonly CandidateModel[] = []): Promise<CandidateModel> {
  return plan.approximator.kind === 'linear' ? buildLinearModelPaced(plan, planned, hooks, undefined, [], built) : buildNetworkModel(plan, planned, hooks);
}
