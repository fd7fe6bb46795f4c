/**
 * The one loop over bootstrap resamples: each resample's episode multiplicities are drawn once and
 * every estimator is evaluated on that same resample — the logged return, each candidate's fitted
 * Q-evaluation, its importance-sampling and doubly robust cross-checks and the linear-quadratic
 * model — so any two of them can be compared by a paired bootstrap (Efron & Tibshirani 1993,
 * §14.1 on paired comparisons from common resamples). Values are in reward terms.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { startMultiplicities } from '../core/bootstrap/startMultiplicities';
import { createPacer, throwIfCancelled } from '../core/fqe/cancellation';
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
}

export interface ReplicateSet {
  loggedReturn: Replicates;
  candidates: CandidateReplicates[];
}

export interface ResampleProgress {
  done: number;
  total: number;
}

/** Yield to the event loop about this often, so a stop request or a surface query can get through. */
const PACE_MS = 50;

export async function runResamples(
  context: AssessmentContext, works: CandidateWork[], perEpisodeReturns: Float64Array, model: { regressions: ModelRegressions; applicable: boolean[] } | null,
  settings: AssessmentSettings, onProgress?: (p: ResampleProgress) => void,
): Promise<ReplicateSet> {
  const pace = createPacer(PACE_MS);
  const e = context.plan.episodes.episodes, c = new Uint32Array(e);
  const out: ReplicateSet = {
    loggedReturn: [],
    candidates: works.map((w, j) => ({
      fqe: [], importanceSampling: 'perDecision' in w.offPolicy ? [] : null, doublyRobust: 'perDecision' in w.offPolicy ? [] : null,
      model: model?.applicable[j] ? [] : null,
    })),
  };
  for (let b = 0; b < settings.resamples; b++) {
    await pace();
    throwIfCancelled(context.cancel);
    if (b % 25 === 0) onProgress?.({ done: b, total: settings.resamples });
    episodeMultiplicities(e, settings.seed, b, c);
    out.loggedReturn.push(weightedMean(perEpisodeReturns, c));
    const fitted = model ? resampleModel(model.regressions, c) : null;
    works.forEach((w, j) => replicateCandidate(context, w, out.candidates[j], c, fitted));
  }
  onProgress?.({ done: settings.resamples, total: settings.resamples });
  return out;
}

function replicateCandidate(
  context: AssessmentContext, w: CandidateWork, out: CandidateReplicates, c: Uint32Array, fitted: LinearQuadraticModelFit | null,
): void {
  const { discount, starts } = context.plan;
  // A candidate without a replicator (a network) has no fqe replicates: no interval.
  if (w.replicate) out.fqe.push(w.replicate.value(c));
  const offPolicy = w.offPolicy;
  if ('perDecision' in offPolicy) {
    const estimates = guarded(() => perDecisionEstimates(offPolicy.perDecision, discount, c));
    out.importanceSampling!.push(estimates && estimates.importanceSampling);
    out.doublyRobust!.push(estimates && estimates.doublyRobust);
  }
  if (out.model) {
    out.model.push(fitted ? modelGuarded(() => modelPolicyValue(fitted, w.model.policy, discount, starts.states, starts.followEpisodes ? startMultiplicities(c, starts.episode) : undefined)) : null);
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
