/**
 * The one loop over bootstrap resamples: each resample's episode multiplicities are drawn once and
 * every estimator is evaluated on that same resample — the logged return and its completion past
 * time-limited run ends, each model's fitted Q-evaluation in every function class compared, its
 * importance-sampling and doubly robust cross-checks and the linear-quadratic model — so any two of
 * them can be compared by a paired bootstrap (Efron & Tibshirani 1993, §14.1 on paired comparisons
 * from common resamples). Values are in reward terms.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { startMultiplicities } from '../core/bootstrap/startMultiplicities';
import { createPacer, throwIfCancelled } from '../core/fqe/cancellation';
import { completedReturnOfResample } from '../core/loggedReturn';
import { fitLinearQuadraticModel, ModelFitError, type LinearQuadraticModelFit, type ModelRegressions } from '../core/offPolicy/linearQuadraticModel';
import { modelPolicyValue } from '../core/offPolicy/modelBasedValue';
import { ImportanceSamplingError, perDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { isModelValueFailure } from './assessModelCheck';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import type { AssessmentSettings } from './assessSettings';

export type Replicates = (number | null)[];

export interface CandidateReplicates {
  fqe: Replicates;
  importanceSampling: Replicates | null;
  doublyRobust: Replicates | null;
  model: Replicates | null;
  /** J in each function class of the work, its own first (the same array as fqe). */
  classes: Replicates[];
}

export interface ReplicateSet {
  loggedReturn: Replicates;
  candidates: CandidateReplicates[];
  /** The present controller's model (the baseline), and the logged return completed by its fitted value. */
  presentController: CandidateReplicates | null;
  completedReturn: Replicates | null;
}

export interface ResampleProgress {
  done: number;
  total: number;
}

export interface ResampleInputs {
  works: CandidateWork[];
  baseline: CandidateWork | null;
  /** V̂ of the baseline at each run's end and the tail weights γ^T (0 after a terminal state), for the completed return. */
  baselineEnds: { values: Float64Array; tailWeights: Float64Array } | null;
  model: { regressions: ModelRegressions; applicable: boolean[]; baselineApplicable: boolean } | null;
}

/** Yield to the event loop about this often, so a stop request or a surface query can get through. */
const PACE_MS = 50;

export async function runResamples(
  context: AssessmentContext, inputs: ResampleInputs, settings: AssessmentSettings, onProgress?: (p: ResampleProgress) => void,
): Promise<ReplicateSet> {
  const pace = createPacer(PACE_MS), { plan } = context, e = plan.episodes.episodes, c = new Uint32Array(e);
  const { works, baseline, baselineEnds, model } = inputs;
  const out: ReplicateSet = {
    loggedReturn: [], candidates: works.map((w, j) => emptyReplicates(w, model?.applicable[j] ?? false)),
    presentController: baseline && emptyReplicates(baseline, model?.baselineApplicable ?? false), completedReturn: baselineEnds && [],
  };
  for (let b = 0; b < settings.resamples; b++) {
    await pace();
    throwIfCancelled(context.cancel);
    if (b % 25 === 0) onProgress?.({ done: b, total: settings.resamples });
    episodeMultiplicities(e, settings.seed, b, c);
    out.loggedReturn.push(weightedMean(plan.loggedReturn.perEpisode, c));
    const fitted = model ? resampleModel(model.regressions, c) : null;
    works.forEach((w, j) => replicateCandidate(context, w, out.candidates[j], c, fitted));
    if (baseline && out.presentController) replicateCandidate(context, baseline, out.presentController, c, null);
    if (baselineEnds && out.completedReturn) out.completedReturn.push(completedReturnOfResample(plan.loggedReturn.perEpisode, baselineEnds.tailWeights, baselineEnds.values, c));
  }
  onProgress?.({ done: settings.resamples, total: settings.resamples });
  return out;
}

function emptyReplicates(w: CandidateWork, modelApplicable: boolean): CandidateReplicates {
  const fqe: Replicates = [], offPolicy = 'perDecision' in w.offPolicy;
  return { fqe, importanceSampling: offPolicy ? [] : null, doublyRobust: offPolicy ? [] : null, model: modelApplicable ? [] : null, classes: w.classes.map((_, i) => (i === 0 ? fqe : [])) };
}

function replicateCandidate(
  context: AssessmentContext, w: CandidateWork, out: CandidateReplicates, c: Uint32Array, fitted: LinearQuadraticModelFit | null,
): void {
  const { discount, starts } = context.plan;
  // A model without a replicator (a network) has no fqe replicates: no interval.
  if (w.replicate) out.fqe.push(w.replicate.value(c));
  for (let k = 1; k < w.classes.length; k++) out.classes[k].push(w.classes[k].replicate?.value(c) ?? null);
  const offPolicy = w.offPolicy;
  if ('perDecision' in offPolicy) {
    const estimates = guarded(() => perDecisionEstimates(offPolicy.perDecision, discount, c));
    out.importanceSampling!.push(estimates && estimates.importanceSampling);
    out.doublyRobust!.push(estimates && estimates.doublyRobust);
  }
  if (out.model) {
    const weights = starts.followEpisodes ? startMultiplicities(c, starts.episode) : undefined;
    out.model.push(fitted ? modelGuarded(() => modelPolicyValue(fitted, w.model.policy, discount, starts.states, weights)) : null);
  }
}

/** Σ c_k G_k / Σ c_k: the mean of the resample's per-episode values. */
function weightedMean(values: Float64Array, c: ArrayLike<number>): number {
  let total = 0, count = 0;
  for (let k = 0; k < values.length; k++) {
    total += c[k] * values[k];
    count += c[k];
  }
  return total / count;
}

function resampleModel(regressions: ModelRegressions, c: Uint32Array): LinearQuadraticModelFit | null {
  try {
    return fitLinearQuadraticModel(regressions, c);
  } catch (error) {
    if (error instanceof ModelFitError) return null;
    throw error;
  }
}

function guarded<T>(estimate: () => T): T | null {
  try {
    return estimate();
  } catch (error) {
    if (error instanceof ImportanceSamplingError) return null;
    throw error;
  }
}

function modelGuarded(estimate: () => number): number | null {
  try {
    return estimate();
  } catch (error) {
    if (isModelValueFailure(error)) return null;
    throw error;
  }
}
