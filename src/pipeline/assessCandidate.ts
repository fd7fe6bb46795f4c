/**
 * Everything one candidate's assessment computes once from the full data before resampling: the
 * linear fit's per-episode sums and its full-data solution, the fitted Q at the logged states and
 * actions (for the doubly robust estimator), and the importance weights against the fitted
 * behaviour — or the reason a piece cannot be formed. Values are in reward terms here.
 */
import { createActionQuadrature, type ActionQuadrature } from '../core/actionQuadrature';
import { episodeBellmanSums, resampleBellmanStatistics } from '../core/bootstrap/episodeBellmanSums';
import { unitMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import type { EpisodeIndex } from '../core/bootstrap/episodeTransitions';
import { linearFqeReplicate, type LinearReplicate, type LinearReplicateSetup } from '../core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../core/bootstrap/startFeatures';
import type { FeatureMap } from '../core/features/featureMap';
import type { BellmanStatistics } from '../core/fqe/bellmanStatistics';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { linearActionValue, type LinearActionValue } from '../core/fqe/linearActionValue';
import { ImportanceRatioError } from '../core/offPolicy/importanceRatio';
import { importanceWeightTable, type ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import { perDecisionData, type PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import type { GaussianPolicy } from '../core/policy';
import type { TransitionSet } from '../core/transitions';
import { stateValues } from '../core/value';
import type { CandidateSpec, ProjectDocument } from '../project/schema';
import { candidatePolicy } from './candidatePolicy';
import { featureMapFor } from './featureMapFor';

export interface OffPolicyInputs {
  table: ImportanceWeightTable;
  /** The weights with the fitted Q̂(s_t, a_t) and V̂(s_t), regrouped for the per-decision estimators. */
  perDecision: PerDecisionData;
}

export interface CandidateWork {
  name: string;
  policy: GaussianPolicy;
  features: FeatureMap;
  quadrature: ActionQuadrature;
  setup: LinearReplicateSetup;
  full: LinearReplicate & { weights: Float64Array; policyValue: number };
  fullStatistics: BellmanStatistics;
  q: LinearActionValue;
  offPolicy: OffPolicyInputs | { reason: string };
}

export interface SharedInputs {
  project: ProjectDocument;
  data: TransitionSet;
  index: EpisodeIndex;
  startStates: Float64Array;
  startsFollowEpisodes: boolean;
  behaviour: GaussianPolicy | null;
  behaviourReason: string;
  /** Share of logged actions at a detected actuator limit, per action (behaviourPolicy.ts). */
  behaviourShareAtLimit: number[];
  cancel?: CancellationCheck;
}

export class AssessmentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AssessmentError';
  }
}

export function prepareCandidate(shared: SharedInputs, candidate: CandidateSpec): CandidateWork {
  const { project, data } = shared;
  const settings = project.approximator;
  if (settings.kind !== 'linear') throw new AssessmentError('intervals and cross-checks are computed for the linear approximator only');
  const policy = candidatePolicy(candidate, data.stateDim);
  const features = featureMapFor(settings, data), quadrature = createActionQuadrature(policy, project.quadratureNodes);
  const sums = episodeBellmanSums(data, features, quadrature, shared.cancel, shared.index);
  const setup: LinearReplicateSetup = {
    sums, startFeatures: startStateFeatures(features, quadrature, shared.startStates, data.stateDim), startsFollowEpisodes: shared.startsFollowEpisodes,
    ridge: settings.ridge, constantIndex: features.constantIndex, discount: project.discount, solver: 'iteration',
    tolerance: settings.tolerance, maxIterations: settings.maxIterations, initialWeights: new Float64Array(features.dim),
  };
  const ones = unitMultiplicities(shared.index.episodes);
  const full = linearFqeReplicate(setup, ones);
  if (full.policyValue === null || full.weights === null) throw new AssessmentError(`the fit of "${candidate.name}" has no solution on the full data (${full.status})`);
  const q = linearActionValue(features, full.weights, data.stateDim, data.actionDim);
  return {
    name: candidate.name, policy, features, quadrature, q,
    // Resamples start from the full-data weights. When the full-data iteration converged, its
    // iterate is the LSTD-Q fixed point up to the tolerance (linearFqe.ts), so each resample is
    // solved directly at its fixed point (O(d³) instead of hundreds of O(d²) steps).
    setup: { ...setup, initialWeights: full.weights, solver: full.status === 'converged' ? 'fixedPoint' : 'iteration' },
    full: { ...full, weights: full.weights, policyValue: full.policyValue },
    fullStatistics: resampleBellmanStatistics(sums, ones),
    offPolicy: offPolicyInputs(shared, policy, q, quadrature),
  };
}

function offPolicyInputs(shared: SharedInputs, policy: GaussianPolicy, q: LinearActionValue, quadrature: ActionQuadrature): OffPolicyInputs | { reason: string } {
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
