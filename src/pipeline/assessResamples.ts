/**
 * The one loop over bootstrap resamples: each resample's episode multiplicities are drawn once and
 * every estimator is evaluated on that same resample — the logged return and its completion past
 * time-limited run ends, each model's fitted Q-evaluation in every function class compared, its
 * importance-sampling and doubly robust cross-checks and the linear-quadratic model — so any two of
 * them can be compared by a paired bootstrap (Efron & Tibshirani 1993, §14.1 on paired comparisons
 * from common resamples). Values are in reward terms.
 */
import { createPacer, throwIfCancelled } from '../core/fqe/cancellation';
import { completedReturnOfResample } from '../core/loggedReturn';
import { modelRegressions, type ModelRegressions } from '../core/offPolicy/linearQuadraticModel';
import { ImportanceSamplingError, type PerDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { RESAMPLE_BLOCK } from '../core/offPolicy/perDecisionResamples';
import type { AssessmentContext, CandidateWork, OffPolicyInputs } from './assessCandidate';
import type { AssessmentSettings } from './assessSettings';
import { modelBlock, type ModelJob } from './modelBlocks';
import { drawBlock } from './perDecisionBlocks';
import { openPerDecisionRoute, type PerDecisionRoute } from './perDecisionRoute';

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
  /** Which thread computed what (perDecisionRoute.ts), for the details of the result. */
  threads: string;
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
/** Report progress about every this many resamples. */
const PROGRESS_EVERY = 25;

export async function runResamples(
  context: AssessmentContext, inputs: ResampleInputs, settings: AssessmentSettings, onProgress?: (p: ResampleProgress) => void,
): Promise<ReplicateSet> {
  const { plan } = context, e = plan.episodes.episodes;
  const { works, baseline } = inputs;
  const withPerDecision = [...works, ...(baseline ? [baseline] : [])].filter((w) => 'perDecision' in w.offPolicy);
  // Balance (profile of the peer bench's 1,000,000 transitions, quiet machine): the per-decision blocks alone
  // cost the helper more than the fits' replicates and the closed form's model resamples cost this thread
  // (6.9 CPU s against 1.5 + 2.8 s since those resamples are summed in blocks), so the model goes to the
  // helper only where it has no per-decision work; either way modelBlock runs it.
  const modelJob = modelJobOf(context, inputs), modelOnRoute = withPerDecision.length === 0;
  const route = openPerDecisionRoute(withPerDecision.map((w) => (w.offPolicy as OffPolicyInputs).perDecision),
    { discount: plan.discount, episodes: e, seed: settings.seed, resamples: settings.resamples }, context.helper, { model: modelOnRoute ? modelJob : null, rollouts: null });
  try {
    return await resampleLoop(context, inputs, settings, { route, withPerDecision, ownModel: modelOnRoute ? null : modelJob && modelJob() }, onProgress);
  } finally {
    route.close();
  }
}

async function resampleLoop(
  context: AssessmentContext, inputs: ResampleInputs, settings: AssessmentSettings, shares: { route: PerDecisionRoute; withPerDecision: CandidateWork[]; ownModel: ModelJob | null },
  onProgress?: (p: ResampleProgress) => void,
): Promise<ReplicateSet> {
  const pace = createPacer(PACE_MS), { plan } = context, e = plan.episodes.episodes;
  const { works, baseline, baselineEnds, model } = inputs, { route, withPerDecision, ownModel } = shares;
  const out: ReplicateSet = {
    loggedReturn: [], candidates: works.map((w, j) => emptyReplicates(w, model?.applicable[j] ?? false)),
    presentController: baseline && emptyReplicates(baseline, model?.baselineApplicable ?? false), completedReturn: baselineEnds && [], threads: '',
  };
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(e));
  let reported = -PROGRESS_EVERY;
  for (let first = 0; first < settings.resamples; first += RESAMPLE_BLOCK) {
    await pace();
    throwIfCancelled(context.cancel);
    if (first - reported >= PROGRESS_EVERY) onProgress?.({ done: (reported = first), total: settings.resamples });
    const drawn = drawBlock(e, settings.seed, first, settings.resamples, block);
    const ownModels = ownModel && modelBlock(ownModel, drawn);
    const fqe = new Map([...works, ...(baseline ? [baseline] : [])].map((w) => [w, blockValues(w, drawn)]));
    // Asked for last, so a helper thread computing them has had this block's other work to run ahead.
    const share = await route.block(first, drawn);
    const perDecision = new Map(withPerDecision.map((w, k) => [w, share.perDecision[k]])), models = ownModels ?? share.models;
    drawn.forEach((c, i) => {
      out.loggedReturn.push(weightedMean(plan.loggedReturn.perEpisode, c));
      works.forEach((w, j) => replicateCandidate(w, out.candidates[j], fqe.get(w)!.map((v) => v?.[i]), models?.[j]?.[i] ?? null, perDecision.get(w)?.[i]));
      if (baseline && out.presentController) replicateCandidate(baseline, out.presentController, fqe.get(baseline)!.map((v) => v?.[i]), null, perDecision.get(baseline)?.[i]);
      if (baselineEnds && out.completedReturn) out.completedReturn.push(completedReturnOfResample(plan.loggedReturn.perEpisode, baselineEnds.tailWeights, baselineEnds.values, c));
    });
  }
  onProgress?.({ done: settings.resamples, total: settings.resamples });
  out.threads = route.note;
  return out;
}

function emptyReplicates(w: CandidateWork, modelApplicable: boolean): CandidateReplicates {
  const fqe: Replicates = [], offPolicy = 'perDecision' in w.offPolicy;
  return { fqe, importanceSampling: offPolicy ? [] : null, doublyRobust: offPolicy ? [] : null, model: modelApplicable ? [] : null, classes: w.classes.map((_, i) => (i === 0 ? fqe : [])) };
}

/**
 * J of each function class of the work (its own first) on every resample of the block, each class's
 * resamples taken together (Replicator.values); null for a class without a replicator.
 */
function blockValues(w: CandidateWork, block: readonly Uint32Array[]): ((number | null)[] | null)[] {
  return [w.replicate, ...w.classes.slice(1).map((k) => k.replicate)].map((r) => r && r.values(block));
}

/**
 * classValues: J of the work's function classes on this resample (blockValues), null for a class without a replicator;
 * modelValue: the linear-quadratic model's J on this resample (modelBlock), null where there is none;
 * perDecision: the resample's per-decision estimates (perDecisionResamples), or the error that stands for none.
 */
function replicateCandidate(
  w: CandidateWork, out: CandidateReplicates, classValues: (number | null | undefined)[],
  modelValue: number | null, perDecision: PerDecisionEstimates | ImportanceSamplingError | undefined,
): void {
  // A model without a replicator (a network) has no fqe replicates: no interval.
  if (w.replicate) out.fqe.push(classValues[0] ?? null);
  for (let k = 1; k < w.classes.length; k++) out.classes[k].push(classValues[k] ?? null);
  if (perDecision !== undefined) {
    const estimates = perDecision instanceof ImportanceSamplingError ? null : perDecision;
    out.importanceSampling!.push(estimates && estimates.importanceSampling);
    out.doublyRobust!.push(estimates && estimates.doublyRobust);
  }
  if (out.model) out.model.push(modelValue);
}

/**
 * The model's job for the resample route (modelBlocks.ts), made on demand: the first time with the
 * moments the model check formed, again from the data after a helper thread was given those
 * (the same pass, so the same numbers). Candidates the model does not apply to get no values.
 */
function modelJobOf(context: AssessmentContext, inputs: ResampleInputs): (() => ModelJob) | null {
  const { model, works } = inputs, { plan } = context;
  if (!model) return null;
  let held: ModelRegressions | null = model.regressions;
  const policies = works.map((w, j) => (model.applicable[j] ? w.model.policy : null));
  return () => {
    const regressions = held ?? modelRegressions(plan.data, plan.episodes);
    held = null;
    return { regressions, policies, discount: plan.discount, starts: plan.starts };
  };
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
