/**
 * The assessment: beside each candidate's J, the evidence a reviewer asks for — bootstrap
 * intervals over runs, the candidate in other function classes, the present controller's model as
 * the comparable baseline (with the logged return, completed past time limits, as a check),
 * cross-checks by importance sampling, doubly robust, model rollouts and the linear-quadratic
 * model, coverage diagnostics, sensitivity to the discount and the features, and the paired
 * comparison of all policies. It extends the run's models (projectRun.ts): a linear model's
 * resamples reweight the per-run sums it already holds, and a network is never refitted here.
 */
import { BootstrapError } from '../core/bootstrap/episodeMultiplicities';
import { loggedActionRanges } from '../core/diagnostics/actionSupport';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { episodeEnds, meanAndStandardError } from '../core/loggedReturn';
import { failure, success, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import type { ProjectDocument } from '../project/schema';
import type { Assessment, AssessmentWarning } from './assessment';
import { AssessmentError, candidateWork, episodeOrderedLog, offPolicyInputs, type AssessmentContext, type CandidateWork, type EpisodeOrderedLog } from './assessCandidate';
import { assembleCandidates, assemblePresentController, comparison, globalWarnings, presentControllerShift, unvisitedShare, type AssemblyInputs } from './assessAssembly';
import { classFits, classWorks, type ClassFits } from './assessClasses';
import { baselineConfirmationWarnings } from './crossCheckWarnings';
import { baselineClassWarnings } from './baselineClassWarning';
import { openRolloutSimulations, rolloutCheck, type RolloutOutcome } from './assessRollouts';
import { finalStateValues } from './model/completedReturn';
import type { CandidateModel } from './model/candidateModel';
import { intervalEstimate } from './assessIntervals';
import { meanOutside } from './assessDiagnostics';
import { methodStatements } from './assessMethod';
import { modelChecksReason, plantMemoryAssessment, type PlantMemorySummary } from './plantMemoryCheck';
import { runOrderAssessment, type RunOrderSummary } from './runOrderCheck';
import { heldActionsAssessment, type HeldActionsSummary } from './heldActionsCheck';
import { checkLinearQuadraticModel, modelInapplicability } from './assessModelCheck';
import { openResampleRoute, runResamples, type ReplicateSet, type ResampleProgress } from './assessResamples';
import type { ResampleHelper } from './helperFeed';
import { threadsNote, type PerDecisionRoute } from './perDecisionRoute';
import { sensitivity } from './assessSensitivity';
import type { AssessmentSettings } from './assessSettings';
import { isEngineError } from './engineErrors';
import { CANCELLED_PROBLEM, startRun, type ProjectRun } from './projectRun';
import { MIN_EPISODES } from '../core/limits';

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
  /** A second thread for the resample loop, where the host has one (the CLI's: src/cli/helperThread.ts). */
  helper?: ResampleHelper;
}

/** Assess a run the host holds; the run stays the host's to dispose. */
export async function assessRun(run: ProjectRun, options: AssessRunOptions): Promise<Result<Assessment>> {
  try {
    return success(await assess(run, options));
  } catch (error) {
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    if (error instanceof AssessmentError || error instanceof BootstrapError || isEngineError(error)) {
      // The plant-memory check needs no resampling: its finding is not lost with the rest (J is still shown).
      const memory = plantMemoryAssessment(run.plan.data).warnings.map((w) => ({ where: 'plant memory', message: w.message }));
      const order = runOrderAssessment(run.plan.data, run.plan.presentController.fitted?.limits).warnings.map((w) => ({ where: 'run order', message: w.message }));
      const held = heldActionsAssessment(run.plan.presentController.held, run.plan.presentController.lawFit).warnings.map((w) => ({ where: 'held actions', message: w.message }));
      return failure({ where: 'assessment', message: (error as Error).message }, ...memory, ...order, ...held);
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
  // Read first: a serious finding rules out the checks that simulate a one-step model (plantMemoryCheck.ts).
  const memory = plantMemoryAssessment(run.plan.data), memoryReason = modelChecksReason(memory);
  // Whole-log, like the plant memory: a serious run-order finding stops a trial (trialChoice.ts) and bears on every J.
  const runOrder = runOrderAssessment(run.plan.data, run.plan.presentController.fitted?.limits);
  // Whole-log too: held rows (a loop in manual), read in the plan, where the present controller's law was then fitted on the rows not held; a serious finding stops a trial.
  const heldActions = heldActionsAssessment(run.plan.presentController.held, run.plan.presentController.lawFit);
  // Opened next, so that a helper thread forms the one-step model and simulates while this thread fits the function classes.
  const simulations = memoryReason !== null ? { reason: memoryReason } : openRolloutSimulations(context, everyModel(run).map((m) => m.policy), options.settings);
  try {
    return await assessWith(run, options, context, simulations, { ...memory, modelReason: memoryReason, runOrder, heldActions });
  } finally {
    if (!('reason' in simulations)) simulations.close();
  }
}

/** The plant-memory check's numbers and warnings, and why it rules out the model checks (null when it does not). */
interface PlantMemoryRead {
  readonly summary: PlantMemorySummary;
  readonly warnings: AssessmentWarning[];
  readonly modelReason: string | null;
  /** The run-order check's numbers and warnings (runOrderCheck.ts), carried with it: both are read once, before any fit. */
  readonly runOrder: { readonly summary: RunOrderSummary; readonly warnings: AssessmentWarning[] };
  /** The held-actions check's numbers and warnings (heldActionsCheck.ts), read with them. */
  readonly heldActions: { readonly summary: HeldActionsSummary; readonly warnings: AssessmentWarning[] };
}

/** The candidates' models, then the present controller's where there is one: the order of every per-policy list. */
function everyModel(run: ProjectRun): ProjectRun['models'] {
  return [...run.models, ...(run.presentController ? [run.presentController] : [])];
}

async function assessWith(
  run: ProjectRun, options: AssessRunOptions, context: AssessmentContext, simulations: PerDecisionRoute | { reason: string }, memory: PlantMemoryRead,
): Promise<Assessment> {
  const { plan } = run, { data, sign } = plan, { settings } = options;
  const total = everyModel(run).length;
  const progress = (done: number) => options.onProgress?.({ stage: 'preparing', done, total });
  // The off-policy inputs and the model check first: they are all the resample route needs, so a
  // helper thread computes the loop's per-decision and model shares while this one fits the other
  // function classes (assessResamples.ts, openResampleRoute).
  let ordered: EpisodeOrderedLog | null = null; // formed once, for every policy that has off-policy inputs
  const offPolicy = everyModel(run).map((m) => offPolicyInputs(context, m, () => (ordered ??= episodeOrderedLog(plan))));
  const modelCheck = checkLinearQuadraticModel(data, plan.episodes, plan.absorbingEnds);
  const modelReasons = run.models.map((m) => memory.modelReason ?? modelInapplicability(modelCheck, m.policy));
  const presentModelReason = run.presentController && (memory.modelReason ?? modelInapplicability(modelCheck, run.presentController.policy));
  const model = modelCheck.regressions ? {
    regressions: modelCheck.regressions, applicable: modelReasons.map((r) => r === null),
    baselineApplicable: run.presentController !== null && presentModelReason === null,
  } : null;
  const route = openResampleRoute(context, { offPolicy, policies: run.models.map((m) => m.policy), model }, settings);
  let replicates: ReplicateSet, works: CandidateWork[], baseline: CandidateWork | null, baselineEnds: ReturnType<typeof finalStateValues> | null;
  try {
    works = [];
    const shared = classFits();
    for (const [i, m] of run.models.entries()) {
      progress(i);
      works.push(await workInClasses(context, m, offPolicy[i], shared));
    }
    progress(run.models.length);
    // The baseline in the same function classes as a candidate, so its J gets the same verdict and range (test/battery/README.md, "The baseline in other function classes").
    baseline = run.presentController ? await workInClasses(context, run.presentController, offPolicy[run.models.length], shared) : null;
    baselineEnds = run.presentController ? finalStateValues(plan, run.presentController) : null;
    replicates = await runResamples(context, { works, baseline, baselineEnds, model }, settings, route,
      (p: ResampleProgress) => options.onProgress?.({ stage: 'resampling', ...p }));
  } finally {
    route.close();
  }
  const simulated = 'reason' in simulations ? simulations : await simulations.rollouts(context.cancel);
  const rolloutOf = (w: CandidateWork, k: number): RolloutOutcome =>
    (simulated === null ? { reason: 'the model rollouts were not run' } : 'reason' in simulated ? simulated : rolloutCheck(context, w, simulated[k], settings));
  const rollouts = works.map(rolloutOf), baselineRollout = baseline && rolloutOf(baseline, works.length);
  const threads = threadsNote(replicates.threads, 'reason' in simulations ? null : simulations.note);
  const ranges = loggedActionRanges(data);
  const reference = {
    presentControllerShift: presentControllerShift(plan, baseline),
    presentControllerOutside: context.presentController ? meanOutside(context.presentController.policy, ranges) : null,
  };
  const inputs: AssemblyInputs = {
    context, works, baseline, replicates, modelCheck, modelReasons, presentModelReason, rollouts, baselineRollout, ranges, reference, baselineEnds,
    tailWeight: meanAndStandardError((baselineEnds ?? episodeEnds(data, plan.discount)).tailWeights).mean, settings,
  };
  const candidates = assembleCandidates(inputs);
  options.onProgress?.({ stage: 'sensitivity', done: 0, total: 1 });
  const swept = settings.sensitivity ? await sensitivity(context, works, sign, settings) : null;
  swept?.warnings.forEach((w, c) => candidates[c].warnings.push(...w));
  const unvisited = unvisitedShare(plan), solver = resampleSolver(works), presentController = assemblePresentController(inputs);
  return {
    settings: { resamples: settings.resamples, level: settings.level, seed: settings.seed, resampledUnit: 'episodes', episodes: plan.episodes.episodes, solver, threads },
    behaviour: intervalEstimate(plan.loggedReturn.value, replicates.loggedReturn, settings.level, sign,
      'sampling of the logged runs; cut short where runs end on a time limit'),
    presentController,
    candidates,
    comparison: comparison(plan, replicates, works, baseline, settings.level),
    sensitivity: swept?.sensitivity ?? null,
    unvisitedShare: unvisited,
    plantMemory: memory.summary,
    runOrder: memory.runOrder.summary,
    heldActions: memory.heldActions.summary,
    // A contradicted or unconfirmed baseline: every difference is taken against its J (crossCheckWarnings.ts).
    warnings: [...memory.warnings, ...memory.runOrder.warnings, ...memory.heldActions.warnings, ...globalWarnings(context, candidates, unvisited), ...baselineConfirmationWarnings(presentController), ...baselineClassWarnings(presentController)],
    method: methodStatements(settings, plan.episodes.episodes, plan.starts.followEpisodes, solver),
    valueSense: plan.sense,
  };
}

/** A model's work with its fits in the other function classes (classWorks): one path for a candidate and the present controller. */
async function workInClasses(context: AssessmentContext, model: CandidateModel, offPolicy: CandidateWork['offPolicy'], shared: ClassFits): Promise<CandidateWork> {
  const others = await classWorks(context, model, shared);
  return candidateWork(context, model, others.fitted, others.unconverged, offPolicy);
}

function resampleSolver(works: CandidateWork[]): string {
  const network = (w: CandidateWork) => w.model.fit.resampleByRuns !== undefined;
  const kinds = new Set(works.map((w) => w.replicate?.kind ?? (network(w) ? 'network' : 'none')));
  const words: string[] = [];
  if (kinds.has('exact')) words.push('each resample reweights the fit’s per-run sums and is solved again');
  if (kinds.has('linearised')) words.push('each resample is taken to first order around the full-data fixed point from per-run influence values (the per-run sums would be too many)');
  if (kinds.has('network')) words.push('for a network, each resample reweights the per-run sums of its last layer on the learned features and solves it again, with a draw of the training’s own spread added, so its differences pair with the present controller’s');
  if (kinds.has('none')) words.push('candidates whose fit did not converge are not resampled (the logged baseline and the cross-checks are)');
  return words.join('; ');
}

function assessmentContext(run: ProjectRun, options: AssessRunOptions): AssessmentContext {
  const { plan } = run, data = plan.data;
  if (data.episodeCount < MIN_EPISODES) {
    throw new AssessmentError(`the bootstrap resamples whole runs and needs at least ${MIN_EPISODES}; the data have ${data.episodeCount}. ` +
      'Mark the runs in the log (columns.episode: a run column, or a time gap) to get intervals');
  }
  return {
    plan, presentController: plan.presentController.fitted, presentControllerModel: run.presentController,
    presentControllerReason: run.presentControllerReason, cancel: options.cancel, wasmPath: options.wasmPath, helper: options.helper,
  };
}
