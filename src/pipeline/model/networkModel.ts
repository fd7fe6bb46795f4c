/**
 * A candidate's model under the network approximator: the one network fit (fitNetworkCandidate.ts)
 * with the action quadrature it was fitted with. The fit request is formed here, from the plan,
 * and nowhere else; a sweep that varies a setting passes it as an override.
 */
import { createActionQuadrature } from '../../core/actionQuadrature';
import type { ApproximatorSettings } from '../../project/approximatorSchema';
import type { CandidateFitRequest } from '../candidateFit';
import { fitNetworkCandidate } from '../fitNetworkCandidate';
import type { EvaluationPlan, PlannedPolicy } from '../plan/evaluationPlan';
import type { CandidateModel } from './candidateModel';
import type { ModelHooks } from './modelHooks';

export async function buildNetworkModel(plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}): Promise<CandidateModel> {
  const fit = await fitNetworkCandidate(networkRequest(plan, planned, hooks));
  return { ...planned, quadrature: createActionQuadrature(planned.policy, plan.quadratureNodes), fit, linear: null, dispose: () => fit.dispose() };
}

/** The fit request of a candidate under the plan, optionally with other approximator settings (a sweep). */
export function networkRequest(plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}, approximator: ApproximatorSettings = plan.approximator): CandidateFitRequest {
  return {
    data: plan.data, policy: planned.policy, approximator, discount: plan.discount, quadratureNodes: plan.quadratureNodes,
    seed: plan.seed, startStates: plan.starts.states, onIteration: hooks.onIteration, cancel: hooks.cancel, wasmPath: hooks.wasmPath,
  };
}
