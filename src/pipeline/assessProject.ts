/**
 * The assessment pipeline: beside each candidate's J, the evidence a reviewer asks for — bootstrap
 * intervals over episodes, the logged behaviour's baseline on the same resamples, cross-checks by
 * importance sampling, doubly robust and linear-quadratic-model estimates, coverage diagnostics,
 * sensitivity to the discount and the features, and the paired comparison of all policies.
 * Hosts (CLI, app worker, report) call this after or beside evaluateProject; it refits what it
 * needs itself, so it depends only on the project and its transitions. A network approximator's fit
 * is the one exception worth passing in (`fits`): it is slow, and with a network no resamples are
 * drawn for the candidates (each would refit the network), so their intervals are not computed.
 */
import { BootstrapError } from '../core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../core/bootstrap/episodeTransitions';
import { loggedActionRanges } from '../core/diagnostics/actionSupport';
import { BehaviourModelError } from '../core/behaviourModel';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { loggedDiscountedReturn } from '../core/loggedReturn';
import { fittedBehaviourPolicy } from '../core/offPolicy/behaviourPolicy';
import { failure, success, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import type { ProjectDocument } from '../project/schema';
import type { Assessment } from './assessment';
import { AssessmentError, prepareCandidate, type CandidateWork, type SharedInputs } from './assessCandidate';
import type { CandidateFit } from './candidateFit';
import { assembleCandidates, comparison, globalWarnings, unvisitedShare } from './assessAssembly';
import { intervalEstimate } from './assessIntervals';
import { meanOutside } from './assessDiagnostics';
import { methodStatements } from './assessMethod';
import { checkLinearQuadraticModel, modelInapplicability } from './assessModelCheck';
import { runResamples, type ResampleProgress } from './assessResamples';
import { sensitivity } from './assessSensitivity';
import type { AssessmentSettings } from './assessSettings';
import { isEngineError } from './engineErrors';

/** Fewer episodes than this give bootstrap intervals too coarse to mean much (common practice). */
export const MIN_EPISODES = 10;

export interface AssessmentProgress {
  stage: 'preparing' | 'resampling' | 'sensitivity';
  done: number;
  total: number;
}

export interface AssessOptions {
  project: ProjectDocument;
  dataset: TransitionSet;
  settings: AssessmentSettings;
  onProgress?: (progress: AssessmentProgress) => void;
  cancel?: CancellationCheck;
  /** The host's fits of the candidates (evaluateProject's retainFit), reused for a network; they stay the host's to dispose. */
  fits?: (CandidateFit | undefined)[];
  /** Where TensorFlow.js's wasm backend finds its .wasm files, for hosts that must say (the CLI). */
  wasmPath?: string;
}

export async function assessProject(options: AssessOptions): Promise<Result<Assessment>> {
  try {
    return success(await assess(options));
  } catch (error) {
    if (error instanceof FqeCancelledError) return failure({ where: 'assessment', message: 'cancelled before it finished; no results were kept' });
    if (error instanceof AssessmentError || error instanceof BootstrapError || isEngineError(error)) {
      return failure({ where: 'assessment', message: (error as Error).message });
    }
    throw error;
  }
}

async function assess(options: AssessOptions): Promise<Assessment> {
  const shared = sharedInputs(options), works: CandidateWork[] = [];
  try {
    for (const [i, candidate] of options.project.candidates.entries()) {
      options.onProgress?.({ stage: 'preparing', done: i, total: options.project.candidates.length });
      works.push(await prepareCandidate(shared, candidate, options.fits?.[i]));
    }
    return await assembleAssessment(options, shared, works);
  } finally {
    for (const w of works) w.dispose();
  }
}

async function assembleAssessment(options: AssessOptions, shared: SharedInputs, works: CandidateWork[]): Promise<Assessment> {
  const { project, dataset: data, settings } = options;
  const sign = project.columns.reward.sense === 'cost' ? -1 : 1;
  const modelCheck = checkLinearQuadraticModel(data, shared.index);
  const modelReasons = works.map((w) => modelInapplicability(modelCheck, w.policy));
  const logged = loggedDiscountedReturn(data, project.discount);
  const model = modelCheck.regressions ? { regressions: modelCheck.regressions, applicable: modelReasons.map((r) => r === null) } : null;
  const replicates = runResamples(shared, works, logged.perEpisode, model, settings,
    (p: ResampleProgress) => options.onProgress?.({ stage: 'resampling', ...p }));
  const ranges = loggedActionRanges(data);
  const behaviourOutside = shared.behaviour ? meanOutside(shared.behaviour, ranges) : null;
  const candidates = assembleCandidates({ shared, works, replicates, modelCheck, modelReasons, ranges, behaviourOutside, settings, sign });
  options.onProgress?.({ stage: 'sensitivity', done: 0, total: 1 });
  const unvisited = unvisitedShare(project, data);
  return {
    settings: { resamples: settings.resamples, level: settings.level, seed: settings.seed, resampledUnit: 'episodes', episodes: shared.index.episodes, solver: resampleSolver(works) },
    behaviour: intervalEstimate(logged.value, replicates.behaviour, settings.level, sign),
    candidates,
    comparison: comparison(logged.value, replicates, works, settings.level, sign),
    sensitivity: settings.sensitivity ? await sensitivity(shared, works, sign) : null,
    unvisitedShare: unvisited,
    warnings: globalWarnings(shared, logged.largestTruncationWeight, candidates, unvisited),
    method: methodStatements(settings, shared.index.episodes, shared.startsFollowEpisodes, project.approximator.kind),
    valueSense: project.columns.reward.sense,
  };
}

function resampleSolver(works: CandidateWork[]): string {
  if (works.some((w) => !w.linear)) return 'no candidate resamples: each would refit the network (the logged baseline and the cross-checks are resampled)';
  return works.every((w) => w.linear!.setup.solver === 'fixedPoint')
    ? 'LSTD-Q fixed point per resample (the full-data iterations converged to it)'
    : 'the FQE iteration per resample to the project’s tolerance where the full-data iteration did not converge, else the LSTD-Q fixed point';
}

function sharedInputs(options: AssessOptions): SharedInputs {
  const { project, dataset: data } = options;
  if (data.episodeCount < MIN_EPISODES) {
    throw new AssessmentError(`the bootstrap resamples whole episodes and needs at least ${MIN_EPISODES}; the data have ${data.episodeCount}. ` +
      'Mark the episodes in the log (columns.episode: a run column, or a time gap) to get intervals');
  }
  const given = project.startStates.kind === 'given';
  let behaviour = null, behaviourReason = '', behaviourShareAtLimit: number[] = [];
  try {
    const fitted = fittedBehaviourPolicy(data);
    behaviour = fitted.policy;
    behaviourShareAtLimit = fitted.limits.shareAtLimit;
  } catch (error) {
    if (!(error instanceof BehaviourModelError)) throw error;
    behaviourReason = `no behaviour model could be fitted (${error.message})`;
  }
  return {
    project, data, index: indexEpisodes(data), cancel: options.cancel, wasmPath: options.wasmPath, behaviour, behaviourReason, behaviourShareAtLimit,
    startStates: project.startStates.kind === 'given' ? Float64Array.from(project.startStates.states.flat()) : data.startStates,
    startsFollowEpisodes: !given, startEpisode: given ? undefined : data.startEpisode,
  };
}
