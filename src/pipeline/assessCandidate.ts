/**
 * What the assessment adds to one candidate's model (model/candidateModel.ts) before resampling:
 * the replicate setup of a linear fit (its per-episode sums are already in the model), and the
 * inputs of the importance-sampling cross-checks — the fitted Q at the logged states and actions
 * and the importance weights against the fitted present-controller model — or the reason they
 * cannot be formed. Nothing here refits a candidate. Reward terms throughout.
 */
import { linearFqeReplicate, type LinearReplicateSetup, type LinearSolveSettings } from '../core/bootstrap/linearFqeReplicate';
import { linearisedReplicate } from '../core/bootstrap/linearisedReplicate';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { ImportanceRatioError } from '../core/offPolicy/importanceRatio';
import { importanceWeightTable, type ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import { perDecisionData, type PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import type { GaussianPolicy } from '../core/policy';
import { stateValues } from '../core/value';
import type { CandidateModel } from './model/candidateModel';
import type { EvaluationPlan } from './plan/evaluationPlan';

export interface OffPolicyInputs {
  table: ImportanceWeightTable;
  /** The weights with the fitted Q̂(s_t, a_t) and V̂(s_t), regrouped for the per-decision estimators. */
  perDecision: PerDecisionData;
}

export interface CandidateWork {
  readonly model: CandidateModel;
  /** How the candidate's J is taken on a resample; null when it has no resamples (a network, or a fit that did not converge). */
  readonly replicate: Replicator | null;
  readonly offPolicy: OffPolicyInputs | { reason: string };
}

/** What every candidate's assessment shares: the run's plan and the fitted present-controller model. */
export interface AssessmentContext {
  readonly plan: EvaluationPlan;
  /** The present controller as a policy: the linear-Gaussian model fitted to the logged actions (behaviourPolicy.ts). */
  readonly presentController: GaussianPolicy | null;
  readonly presentControllerReason: string;
  /** Share of logged actions at a detected actuator limit, per action (behaviourPolicy.ts). */
  readonly presentControllerShareAtLimit: number[];
  readonly cancel?: CancellationCheck;
  readonly wasmPath?: string;
}

export class AssessmentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AssessmentError';
  }
}

export function candidateWork(context: AssessmentContext, model: CandidateModel): CandidateWork {
  return { model, replicate: replicator(context.plan, model), offPolicy: offPolicyInputs(context, model) };
}

/** One candidate's J on a bootstrap resample (reward sense; null when the resample has no solution). */
export interface Replicator {
  readonly kind: 'exact' | 'linearised';
  value(multiplicities: Uint32Array): number | null;
}

/**
 * Exact: the resample's statistics reweight the model's per-episode sums and are solved as the
 * full data was — at its own fixed point when the full-data fit is at its fixed point (O(d³) instead
 * of hundreds of O(d²) steps), else by the same iteration from the full-data weights.
 * Linearised: to first order from per-episode influence values (linearisedReplicate.ts).
 */
function replicator(plan: EvaluationPlan, model: CandidateModel): Replicator | null {
  const linear = model.linear;
  if (!linear) return null;
  const r = linear.resampling;
  if (r.kind === 'linearised') return { kind: 'linearised', value: (c) => linearisedReplicate(r.replicates, c) };
  if (r.kind === 'none') return null;
  const setup: LinearReplicateSetup = { ...linearSolveSettings(plan, model), sums: r.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode };
  const scratch = new Float64Array(r.sums.stride);
  return { kind: 'exact', value: (c) => linearFqeReplicate(setup, c, scratch).policyValue };
}

/** How a linear candidate's fit is solved on other statistics (a resample, another discount or features). */
export function linearSolveSettings(plan: EvaluationPlan, model: CandidateModel): LinearSolveSettings {
  const linear = model.linear, settings = plan.approximator;
  if (!linear || settings.kind !== 'linear') throw new AssessmentError(`"${model.name}" has no linear fit to solve again`);
  return {
    ridge: settings.ridge, constantIndex: linear.features.constantIndex, discount: plan.discount,
    solver: linear.atFixedPoint ? 'fixedPoint' : 'iteration', tolerance: settings.tolerance, maxIterations: settings.maxIterations,
    initialWeights: linear.weights,
  };
}

function offPolicyInputs(context: AssessmentContext, model: CandidateModel): OffPolicyInputs | { reason: string } {
  const { plan } = context;
  if (!plan.starts.followEpisodes) return { reason: 'the project evaluates J at given start states, but importance sampling estimates J at the logged episodes’ own starts' };
  if (!context.presentController) return { reason: context.presentControllerReason };
  let table: ImportanceWeightTable;
  try {
    table = importanceWeightTable(plan.data, plan.episodes, model.policy, context.presentController);
  } catch (error) {
    if (error instanceof ImportanceRatioError) return { reason: error.message };
    throw error;
  }
  const { data, episodes: index } = plan, n = data.count, ds = data.stateDim, m = data.actionDim, p = ds + m;
  const inputs = new Float64Array(n * p), states = new Float64Array(n * ds);
  for (let r = 0; r < n; r++) {
    const i = index.order[r];
    for (let c = 0; c < ds; c++) inputs[r * p + c] = states[r * ds + c] = data.states[i * ds + c];
    for (let c = 0; c < m; c++) inputs[r * p + ds + c] = data.actions[i * m + c];
  }
  const actionValues = new Float64Array(n);
  model.fit.q.evaluate(inputs, n, actionValues);
  return { table, perDecision: perDecisionData(table, { actionValues, stateValues: stateValues(model.fit.q, model.policy, states, n, model.quadrature) }) };
}
