/**
 * The assessment: beside each candidate's J, the evidence a reviewer asks for — bootstrap
 * intervals over episodes, the logged behaviour's baseline on the same resamples, cross-checks by
 * importance sampling, doubly robust and linear-quadratic-model estimates, coverage diagnostics,
 * sensitivity to the discount and the features, and the paired comparison of all policies. It
 * extends the run's models (projectRun.ts): a linear candidate's resamples reweight the per-episode
 * sums its model already holds, and a network candidate is never refitted (no resamples are drawn
 * for it, so its J has no interval).
 */
import { BootstrapError } from '../core/bootstrap/episodeMultiplicities';
import { loggedActionRanges } from '../core/diagnostics/actionSupport';
import { BehaviourModelError } from '../core/behaviourModel';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { fittedBehaviourPolicy } from '../core/offPolicy/behaviourPolicy';
import { failure, success, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import type { ProjectDocument } from '../project/schema';
import type { Assessment } from './assessment';
import { AssessmentError, candidateWork, type AssessmentContext, type CandidateWork } from './assessCandidate';
import { assembleCandidates, comparison, globalWarnings, unvisitedShare } from './assessAssembly';
import { intervalEstimate } from './assessIntervals';
import { meanOutside } from './assessDiagnostics';
import { methodStatements } from './assessMethod';
import { checkLinearQuadraticModel, modelInapplicability } from './assessModelCheck';
import { runResamples, type ResampleProgress } from './assessResamples';
import { sensitivity } from './assessSensitivity';
import type { AssessmentSettings } from './assessSettings';
import { isEngineError } from './engineErrors';
import { CANCELLED_PROBLEM, startRun, type ProjectRun } from './projectRun';

/** Fewer episodes than this give bootstrap intervals too coarse to mean much (common practice). */
export const MIN_EPISODES = 10;

export interface AssessmentProgress {
  stage: 'preparing' | 'resampling' | 'sensitivity';
  done: number;
  total: number;
}

export interface AssessRunOptions {
  settings: AssessmentSettings;
  onProgress?: (progress: AssessmentProgress) => void;
  cancel?: CancellationCheck;
  /** Where TensorFlow.js's wasm backend finds its .wasm files, for hosts that must say (the CLI). */
  wasmPath?: string;
}

/** Assess a run the host holds; the run stays the host's to dispose. */
export async function assessRun(run: ProjectRun, options: AssessRunOptions): Promise<Result<Assessment>> {
  try {
    return success(await assess(run, options));
  } catch (error) {
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    if (error instanceof AssessmentError || error instanceof BootstrapError || isEngineError(error)) {
      return failure({ where: 'assessment', message: (error as Error).message });
    }
    throw error;
  }
}

/** Plan, fit and assess a project in one go (for hosts and tests that need nothing else). */
export async function assessProject(options: AssessRunOptions & { project: ProjectDocument; dataset: TransitionSet }): Promise<Result<Assessment>> {
  const started = await startRun(options.project, options.dataset, { cancel: options.cancel, wasmPath: options.wasmPath });
  if (!started.ok) return started;
  try {
    return await assessRun(started.value, options);
  } finally {
    started.value.dispose();
  }
}

async function assess(run: ProjectRun, options: AssessRunOptions): Promise<Assessment> {
  const context = assessmentContext(run, options);
  const works: CandidateWork[] = run.models.map((model, i) => {
    options.onProgress?.({ stage: 'preparing', done: i, total: run.models.length });
    return candidateWork(context, model);
  });
  const { plan } = run, { data, sign } = plan, { settings } = options;
  const modelCheck = checkLinearQuadraticModel(data, plan.episodes);
  const modelReasons = works.map((w) => modelInapplicability(modelCheck, w.model.policy));
  const logged = plan.loggedReturn;
  const model = modelCheck.regressions ? { regressions: modelCheck.regressions, applicable: modelReasons.map((r) => r === null) } : null;
  const replicates = await runResamples(context, works, logged.perEpisode, model, settings,
    (p: ResampleProgress) => options.onProgress?.({ stage: 'resampling', ...p }));
  const ranges = loggedActionRanges(data);
  const behaviourOutside = context.presentController ? meanOutside(context.presentController, ranges) : null;
  const candidates = assembleCandidates({ context, works, replicates, modelCheck, modelReasons, ranges, behaviourOutside, settings, sign });
  options.onProgress?.({ stage: 'sensitivity', done: 0, total: 1 });
  const unvisited = unvisitedShare(plan);
  return {
    settings: { resamples: settings.resamples, level: settings.level, seed: settings.seed, resampledUnit: 'episodes', episodes: plan.episodes.episodes, solver: resampleSolver(works) },
    behaviour: intervalEstimate(logged.value, replicates.loggedReturn, settings.level, sign),
    candidates,
    comparison: comparison(logged.value, replicates, works, settings.level, sign),
    sensitivity: settings.sensitivity ? await sensitivity(context, works, sign) : null,
    unvisitedShare: unvisited,
    warnings: globalWarnings(context, logged.largestTruncationWeight, candidates, unvisited),
    method: methodStatements(settings, plan.episodes.episodes, plan.starts.followEpisodes, plan.approximator.kind),
    valueSense: plan.sense,
  };
}

function resampleSolver(works: CandidateWork[]): string {
  const kinds = new Set(works.map((w) => w.replicate?.kind ?? 'none'));
  const words: string[] = [];
  if (kinds.has('exact')) words.push('each resample reweights the fit’s per-episode sums and is solved again');
  if (kinds.has('linearised')) words.push('each resample is taken to first order around the full-data fixed point from per-episode influence values (the per-episode sums would be too many)');
  if (kinds.has('none')) words.push('candidates whose fit is a network, or did not converge, are not resampled (the logged baseline and the cross-checks are)');
  return words.join('; ');
}

function assessmentContext(run: ProjectRun, options: AssessRunOptions): AssessmentContext {
  const { plan } = run, data = plan.data;
  if (data.episodeCount < MIN_EPISODES) {
    throw new AssessmentError(`the bootstrap resamples whole episodes and needs at least ${MIN_EPISODES}; the data have ${data.episodeCount}. ` +
      'Mark the episodes in the log (columns.episode: a run column, or a time gap) to get intervals');
  }
  let presentController = null, presentControllerReason = '', presentControllerShareAtLimit: number[] = [];
  try {
    const fitted = fittedBehaviourPolicy(data);
    presentController = fitted.policy;
    presentControllerShareAtLimit = fitted.limits.shareAtLimit;
  } catch (error) {
    if (!(error instanceof BehaviourModelError)) throw error;
    presentControllerReason = `no behaviour model could be fitted (${error.message})`;
  }
  return { plan, presentController, presentControllerReason, presentControllerShareAtLimit, cancel: options.cancel, wasmPath: options.wasmPath };
}
