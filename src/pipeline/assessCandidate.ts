/**
 * What the assessment adds to one model (model/candidateModel.ts) before resampling: how its J is
 * taken on a resample (its per-episode sums are already in the model), the inputs of the
 * importance-sampling cross-checks — the fitted Q̂ at the logged states and actions, V̂ there and at
 * each run's end for the value past a time limit, and the importance weights against the present
 * controller's model — and its fits in other function classes. Nothing here refits the model
 * itself. Reward terms throughout.
 */
import type { UnconvergedClass } from '../core/diagnostics/functionClassRange';
import { heldImportanceReason } from '../core/diagnostics/heldActionsFinding';
import { linearFqeReplicate, linearFqeReplicateBlock, type LinearReplicateSetup, type LinearSolveSettings } from '../core/bootstrap/linearFqeReplicate';
import { linearisedReplicate } from '../core/bootstrap/linearisedReplicate';
import type { CancellationCheck } from '../core/fqe/cancellation';
import type { FittedBehaviour } from '../core/offPolicy/behaviourPolicy';
import { ImportanceRatioError } from '../core/offPolicy/importanceRatio';
import { importanceWeightTable, type ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import { ImportanceSamplingError, perDecisionData, type PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import { stateValues } from '../core/value';
import { linearStateValues } from '../core/features/linearStateValues';
import type { CandidateModel } from './model/candidateModel';
import { finalStateValues } from './model/completedReturn';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { approximatorClassLabel } from './plan/approximatorLabel';
import type { ResampleHelper } from './helperFeed';

export interface OffPolicyInputs {
  table: ImportanceWeightTable;
  /** The weights with Q̂(s_t, a_t), V̂(s_t) and the bootstrapped tails, regrouped for the per-decision estimators. */
  perDecision: PerDecisionData;
}

/** One candidate's J on a bootstrap resample (reward sense; null when the resample has no solution). */
export interface Replicator {
  readonly kind: 'exact' | 'linearised';
  value(multiplicities: Uint32Array): number | null;
  /** value() on each resample of a block, the same numbers, in one read of the per-episode sums where that is cheaper. */
  values(block: readonly Uint32Array[]): (number | null)[];
}

/** A fit of the same candidate in another function class, for the class comparison. */
export interface ClassWork {
  readonly label: string;
  readonly model: CandidateModel;
  readonly replicate: Replicator | null;
}

export interface CandidateWork {
  readonly model: CandidateModel;
  /** How the candidate's J is taken on a resample; null when it has no resamples (a network, or a fit that did not converge). */
  readonly replicate: Replicator | null;
  readonly offPolicy: OffPolicyInputs | { reason: string };
  /** The candidate in every function class compared (its own first). */
  readonly classes: ClassWork[];
  /** Other classes that were fitted but did not converge (no value to compare; the verdict reads them). */
  readonly unconvergedClasses: readonly UnconvergedClass[];
}

/** What every assessment of one run shares. */
export interface AssessmentContext {
  readonly plan: EvaluationPlan;
  /** Today's controller modelled from the log (plan/presentController.ts) and its fit; null with the reason when it could not be. */
  readonly presentController: FittedBehaviour | null;
  readonly presentControllerModel: CandidateModel | null;
  readonly presentControllerReason: string;
  readonly cancel?: CancellationCheck;
  /** Awaited between slices of the assessment's own data passes (default: a yield to the event loop about every PACE_INTERVAL_MS, cancellation.ts). */
  readonly pace?: () => Promise<void>;
  readonly wasmPath?: string;
  /** A second thread the host lends the resample loop (perDecisionRoute.ts); without one the loop keeps to its own. */
  readonly helper?: ResampleHelper;
}

export class AssessmentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AssessmentError';
  }
}

/** offPolicy: the model's offPolicyInputs where the caller formed them already (the assessment forms them before the function classes, to start the resample route's helper early). */
export function candidateWork(
  context: AssessmentContext, model: CandidateModel, classes: ClassWork[] = [], unconverged: readonly UnconvergedClass[] = [],
  offPolicy: OffPolicyInputs | { reason: string } = offPolicyInputs(context, model),
): CandidateWork {
  const replicate = replicator(context.plan, model);
  return {
    model, replicate, offPolicy, classes: [{ label: approximatorClassLabel(context.plan.approximator), model, replicate }, ...classes],
    unconvergedClasses: unconverged,
  };
}

/**
 * Exact: the resample's statistics reweight the model's per-episode sums and are solved as the
 * full data was — at its own fixed point when the full-data fit is at its fixed point (O(d³) instead
 * of hundreds of O(d²) steps), else by the same iteration from the full-data weights.
 * Linearised: to first order from per-episode influence values (linearisedReplicate.ts).
 */
export function replicator(plan: EvaluationPlan, model: CandidateModel): Replicator | null {
  const linear = model.linear;
  if (!linear) return null;
  const r = linear.resampling;
  if (r.kind === 'linearised') {
    const value = (c: Uint32Array) => linearisedReplicate(r.replicates, c);
    return { kind: 'linearised', value, values: (block) => block.map(value) };
  }
  if (r.kind === 'none') return null;
  const setup: LinearReplicateSetup = {
    ...linearSolveSettings(plan, model), sums: r.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: plan.starts.followEpisodes,
    startEpisode: plan.starts.episode,
  };
  const scratch: Float64Array[] = [];
  const room = (count: number) => {
    while (scratch.length < count) scratch.push(new Float64Array(r.sums.stride));
    return scratch;
  };
  return {
    kind: 'exact', value: (c) => linearFqeReplicate(setup, c, room(1)[0]).policyValue,
    values: (block) => linearFqeReplicateBlock(setup, block, room(block.length)).map((replicate) => replicate.policyValue),
  };
}

/** How a linear model's fit is solved on other statistics (a resample, another discount). */
export function linearSolveSettings(plan: EvaluationPlan, model: CandidateModel): LinearSolveSettings {
  const linear = model.linear;
  if (!linear) throw new AssessmentError(`"${model.name}" has no linear fit to solve again`);
  return {
    ridge: linear.ridge, constantIndex: linear.features.constantIndex, discount: plan.discount,
    solver: linear.atFixedPoint ? 'fixedPoint' : 'iteration', tolerance: linear.tolerance, maxIterations: linear.maxIterations,
    initialWeights: linear.weights,
  };
}

/** The logged states and (state, action) inputs in the episode index's order: the same for every policy's off-policy inputs. */
export interface EpisodeOrderedLog {
  readonly inputs: Float64Array; // n×(ds+m) row-major
  readonly states: Float64Array; // n×ds row-major
}

export function episodeOrderedLog(plan: EvaluationPlan): EpisodeOrderedLog {
  const { data, episodes: index } = plan, n = data.count, ds = data.stateDim, m = data.actionDim, p = ds + m;
  const inputs = new Float64Array(n * p), states = new Float64Array(n * ds);
  for (let r = 0; r < n; r++) {
    const i = index.order[r];
    for (let c = 0; c < ds; c++) inputs[r * p + c] = states[r * ds + c] = data.states[i * ds + c];
    for (let c = 0; c < m; c++) inputs[r * p + ds + c] = data.actions[i * m + c];
  }
  return { inputs, states };
}

/**
 * The importance-sampling cross-checks' inputs of one model, or why it has none. ordered: the log in
 * episode order (episodeOrderedLog), asked for only when needed, so that several models can share one.
 */
export function offPolicyInputs(context: AssessmentContext, model: CandidateModel, ordered: () => EpisodeOrderedLog = () => episodeOrderedLog(context.plan)): OffPolicyInputs | { reason: string } {
  const { plan } = context;
  if (!plan.starts.followEpisodes) return { reason: 'the project evaluates J at given start states, but importance sampling estimates J at the logged runs’ own starts' };
  if (!context.presentController) return { reason: context.presentControllerReason };
  // The law fitted on the rows not held is no logging law on the held rows (a point mass there): no weights (heldActionsFinding.ts).
  const held = plan.presentController.held;
  if (plan.presentController.lawFit.lawFittedOn === 'movingRows' && !('reason' in held)) return { reason: heldImportanceReason(held.runs) };
  let table: ImportanceWeightTable;
  try {
    table = importanceWeightTable(plan.data, plan.episodes, model.policy, context.presentController.policy);
  } catch (error) {
    if (error instanceof ImportanceRatioError) return { reason: error.message };
    throw error;
  }
  const { data } = plan, n = data.count, ds = data.stateDim, { inputs, states } = ordered();
  const actionValues = new Float64Array(n);
  model.fit.q.evaluate(inputs, n, actionValues);
  const ends = finalStateValues(plan, model);
  // A linear Q's V̂ from the policy-averaged features (the feature map's node average; the same numbers up to rounding).
  const linear = model.linear, valuesAtStates = linear ? linearStateValues(linear.features, linear.weights, model.quadrature, states, n, ds)
    : stateValues(model.fit.q, model.policy, states, n, model.quadrature);
  const values = { actionValues, stateValues: valuesAtStates };
  try {
    return { table, perDecision: perDecisionData(table, values, { finalStateValues: ends.values, tailWeights: ends.tailWeights }) };
  } catch (error) {
    if (error instanceof ImportanceSamplingError) return { reason: error.message };
    throw error;
  }
}
