/**
 * Everything one candidate's assessment computes once from the full data before resampling: for
 * the linear approximator the per-episode sums and the full-data solution; for a network the one
 * network fit (its resamples would each refit the network, so none are drawn); for both the fitted
 * Q at the logged states and actions (for the doubly robust estimator) and the importance weights
 * against the fitted behaviour — or the reason a piece cannot be formed. Reward terms throughout.
 */
import { createActionQuadrature, type ActionQuadrature } from '../core/actionQuadrature';
import type { ActionValueFunction } from '../core/actionValue';
import { episodeBellmanSums, resampleBellmanStatistics } from '../core/bootstrap/episodeBellmanSums';
import { unitMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import type { EpisodeIndex } from '../core/bootstrap/episodeTransitions';
import { linearFqeReplicate, type LinearReplicateSetup } from '../core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../core/bootstrap/startFeatures';
import type { FeatureMap } from '../core/features/featureMap';
import type { BellmanStatistics } from '../core/fqe/bellmanStatistics';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { linearActionValue } from '../core/fqe/linearActionValue';
import { ImportanceRatioError } from '../core/offPolicy/importanceRatio';
import { importanceWeightTable, type ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import { perDecisionData, type PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import type { GaussianPolicy } from '../core/policy';
import type { TransitionSet } from '../core/transitions';
import { stateValues } from '../core/value';
import type { CandidateSpec, ProjectDocument } from '../project/schema';
import type { CandidateFit } from './candidateFit';
import { candidatePolicy } from './candidatePolicy';
import { featureMapFor } from './featureMapFor';
import { fitCandidate } from './fitCandidate';

export interface OffPolicyInputs {
  table: ImportanceWeightTable;
  /** The weights with the fitted Q̂(s_t, a_t) and V̂(s_t), regrouped for the per-decision estimators. */
  perDecision: PerDecisionData;
}

/** The linear fit's one-pass material: resamples reweight `setup.sums`. */
export interface LinearWork {
  features: FeatureMap;
  setup: LinearReplicateSetup;
  fullStatistics: BellmanStatistics;
}

export interface CandidateWork {
  name: string;
  policy: GaussianPolicy;
  quadrature: ActionQuadrature;
  q: ActionValueFunction;
  /** J on the full data, reward sense. */
  policyValue: number;
  /** Null for a network approximator. */
  linear: LinearWork | null;
  offPolicy: OffPolicyInputs | { reason: string };
  /** Releases the network fit this assessment made (a no-op otherwise). */
  dispose(): void;
}

export interface SharedInputs {
  project: ProjectDocument;
  data: TransitionSet;
  index: EpisodeIndex;
  startStates: Float64Array;
  startsFollowEpisodes: boolean;
  /** Episode of each start state when some episode has none (TransitionSet.startEpisode). */
  startEpisode?: Int32Array;
  behaviour: GaussianPolicy | null;
  behaviourReason: string;
  /** Share of logged actions at a detected actuator limit, per action (behaviourPolicy.ts). */
  behaviourShareAtLimit: number[];
  cancel?: CancellationCheck;
  wasmPath?: string;
}

export class AssessmentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AssessmentError';
  }
}

/** fit: the host's own fit of this candidate (network), reused rather than refitted; it stays the host's to dispose. */
export async function prepareCandidate(shared: SharedInputs, candidate: CandidateSpec, fit?: CandidateFit): Promise<CandidateWork> {
  const policy = candidatePolicy(candidate, shared.data.stateDim);
  const quadrature = createActionQuadrature(policy, shared.project.quadratureNodes);
  if (shared.project.approximator.kind === 'linear') return linearWork(shared, candidate.name, policy, quadrature);
  const own = fit ? null : await fitCandidate({
    data: shared.data, policy, approximator: shared.project.approximator, discount: shared.project.discount, quadratureNodes: shared.project.quadratureNodes,
    seed: shared.project.seed, startStates: shared.startStates, cancel: shared.cancel, wasmPath: shared.wasmPath,
  });
  const used = (fit ?? own)!;
  return {
    name: candidate.name, policy, quadrature, q: used.q, policyValue: used.policyValue, linear: null,
    offPolicy: offPolicyInputs(shared, policy, used.q, quadrature), dispose: () => own?.dispose(),
  };
}

function linearWork(shared: SharedInputs, name: string, policy: GaussianPolicy, quadrature: ActionQuadrature): CandidateWork {
  const { project, data } = shared, settings = project.approximator;
  if (settings.kind !== 'linear') throw new AssessmentError('linearWork: expected linear approximator settings');
  const features = featureMapFor(settings, data);
  const sums = episodeBellmanSums(data, features, quadrature, shared.cancel, shared.index);
  const setup: LinearReplicateSetup = {
    sums, startFeatures: startStateFeatures(features, quadrature, shared.startStates, data.stateDim), startsFollowEpisodes: shared.startsFollowEpisodes, startEpisode: shared.startEpisode,
    ridge: settings.ridge, constantIndex: features.constantIndex, discount: project.discount, solver: 'iteration',
    tolerance: settings.tolerance, maxIterations: settings.maxIterations, initialWeights: new Float64Array(features.dim),
  };
  const ones = unitMultiplicities(shared.index.episodes);
  const full = linearFqeReplicate(setup, ones); // the pipeline's own fit: the iteration from zero weights
  if (full.policyValue === null || full.weights === null) throw new AssessmentError(`the fit of "${name}" has no solution on the full data (${full.status})`);
  const q = linearActionValue(features, full.weights, data.stateDim, data.actionDim);
  // Resamples start from the full-data weights. When the full-data iteration converged, its
  // iterate is the LSTD-Q fixed point up to the tolerance (linearFqe.ts), so each resample is
  // solved directly at its fixed point (O(d³) instead of hundreds of O(d²) steps).
  const resampleSetup: LinearReplicateSetup = { ...setup, initialWeights: full.weights, solver: full.status === 'converged' ? 'fixedPoint' : 'iteration' };
  return {
    name, policy, quadrature, q, policyValue: full.policyValue,
    linear: { features, setup: resampleSetup, fullStatistics: resampleBellmanStatistics(sums, ones) },
    offPolicy: offPolicyInputs(shared, policy, q, quadrature), dispose: () => undefined,
  };
}

function offPolicyInputs(shared: SharedInputs, policy: GaussianPolicy, q: ActionValueFunction, quadrature: ActionQuadrature): OffPolicyInputs | { reason: string } {
  if (!shared.startsFollowEpisodes) return { reason: 'the project evaluates J at given start states, but importance sampling estimates J at the logged episodes’ own starts' };
  if (!shared.behaviour) return { reason: shared.behaviourReason };
  let table: ImportanceWeightTable;
  try {
    table = importanceWeightTable(shared.data, shared.index, policy, shared.behaviour);
  } catch (error) {
    if (error instanceof ImportanceRatioError) return { reason: error.message };
    throw error;
  }
  const { data, index } = shared, n = data.count, ds = data.stateDim, m = data.actionDim, p = ds + m;
  const inputs = new Float64Array(n * p), states = new Float64Array(n * ds);
  for (let r = 0; r < n; r++) {
    const i = index.order[r];
    for (let c = 0; c < ds; c++) inputs[r * p + c] = states[r * ds + c] = data.states[i * ds + c];
    for (let c = 0; c < m; c++) inputs[r * p + ds + c] = data.actions[i * m + c];
  }
  const actionValues = new Float64Array(n);
  q.evaluate(inputs, n, actionValues);
  return { table, perDecision: perDecisionData(table, { actionValues, stateValues: stateValues(q, policy, states, n, quadrature) }) };
}
