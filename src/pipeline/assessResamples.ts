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
import { PER_DECISION_RESAMPLING } from '../core/limits';
import { linearisedPerDecision, perDecisionDerivatives, type PerDecisionDerivatives } from '../core/offPolicy/perDecisionDerivatives';
import { ImportanceSamplingError, perDecisionEstimates, type PerDecisionData, type PerDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { RESAMPLE_BLOCK } from '../core/offPolicy/perDecisionResamples';
import type { AssessmentContext, CandidateWork, OffPolicyInputs } from './assessCandidate';
import type { AssessmentSettings } from './assessSettings';
import type { GaussianPolicy } from '../core/policy';
import type { ModelJob } from './modelBlocks';
import { drawBlock } from './perDecisionBlocks';
import { openPerDecisionRoute, type PerDecisionRoute } from './perDecisionRoute';
import { networkRunResamples, type NetworkRunResamples } from './networkRunResamples';

export type Replicates = (number | null)[];

export interface CandidateReplicates {
  fqe: Replicates;
  importanceSampling: Replicates | null;
  doublyRobust: Replicates | null;
  model: Replicates | null;
  /** J in each function class of the work, its own first (the same array as fqe). */
  classes: Replicates[];
  /** A network fit's J on these same resamples (networkRunResamples.ts); null for a linear fit. */
  network: NetworkRunResamples | null;
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

/** What the resample route needs before the works exist (openResampleRoute). */
export interface RouteInputs {
  /** Per policy, the candidates then the present controller where there is one: its off-policy inputs (offPolicyInputs), or why it has none. */
  readonly offPolicy: readonly (OffPolicyInputs | { reason: string })[];
  /** The candidates' policies, in the works' order. */
  readonly policies: readonly GaussianPolicy[];
  readonly model: ResampleInputs['model'];
}

/** The loop's route, opened before the function classes are fitted; rows[k]: policy k's row in each block's per-decision share (−1: none). */
export interface ResampleRoute {
  readonly route: PerDecisionRoute;
  readonly rows: readonly number[];
  /** Per row, the full-data checks and their per-run derivatives where they are taken to first order; null where they are resampled. */
  readonly firstOrder: readonly FirstOrderChecks[] | null;
  close(): void;
}

/**
 * Open the resample loop's route — the per-decision cross-checks and the linear-quadratic model's
 * resamples, on a helper thread where the host lends one — as soon as their inputs exist: the
 * assessment opens it before it fits the candidates' other function classes, so a helper computes
 * every block's share while this thread fits, and the loop finds the shares waiting. Balance
 * (profile of the peer bench's 1,000,000 transitions, one thread, quiet machine): this thread's
 * work from here to the loop's end (the function classes' data and influence passes about 3.4 CPU s,
 * the fits' replicates about 0.6 s) is about the helper's (the candidate's per-decision blocks
 * about 2.5 s, the present controller's about 0.2 s by unitWeightSpans.ts, the model's resamples
 * about 2 s), so the model rides with the per-decision blocks. Without a helper the route runs the same functions on this thread, block by
 * block (perDecisionRoute.ts): the same numbers.
 */
export function openResampleRoute(context: AssessmentContext, inputs: RouteInputs, settings: AssessmentSettings): ResampleRoute {
  const { plan } = context;
  let row = 0;
  const rows = inputs.offPolicy.map((o) => ('perDecision' in o ? row++ : -1));
  const data = inputs.offPolicy.flatMap((o) => ('perDecision' in o ? [o.perDecision] : []));
  const firstOrder = (settings.perDecision ?? PER_DECISION_RESAMPLING.default) === 'firstOrder' ? data.map((d) => firstOrderChecks(d, plan.discount)) : null;
  // Taken to first order, the checks leave the route (and a helper thread) only the model's resamples.
  const route = openPerDecisionRoute(firstOrder ? [] : data, { discount: plan.discount, episodes: plan.episodes.episodes, seed: settings.seed, resamples: settings.resamples },
    context.helper, { model: modelJobOf(context, inputs), rollouts: null });
  return { route, rows, firstOrder, close: () => route.close() };
}

/** The full-data checks and their per-run derivatives (perDecisionDerivatives.ts), or the error that stands for every resample's. */
export type FirstOrderChecks = { point: PerDecisionEstimates; derivatives: PerDecisionDerivatives } | ImportanceSamplingError;

function firstOrderChecks(data: PerDecisionData, discount: number): FirstOrderChecks {
  try {
    return { point: perDecisionEstimates(data, discount), derivatives: perDecisionDerivatives(data, discount) };
  } catch (error) {
    if (error instanceof ImportanceSamplingError) return error;
    throw error;
  }
}

/** A resample's checks to first order on its multiplicities c. */
function linearisedChecks(checks: FirstOrderChecks, c: Uint32Array): PerDecisionEstimates | ImportanceSamplingError {
  return checks instanceof ImportanceSamplingError ? checks : linearisedPerDecision(checks.point, checks.derivatives, c);
}

/** The loop over the resamples on a route opened for the same works (openResampleRoute); the caller closes the route. */
export async function runResamples(
  context: AssessmentContext, inputs: ResampleInputs, settings: AssessmentSettings, opened: ResampleRoute, onProgress?: (p: ResampleProgress) => void,
): Promise<ReplicateSet> {
  const pace = createPacer(PACE_MS), { plan } = context, e = plan.episodes.episodes;
  const { works, baseline, baselineEnds, model } = inputs, { route, rows, firstOrder } = opened;
  const out: ReplicateSet = {
    loggedReturn: [], candidates: works.map((w, j) => emptyReplicates(w, model?.applicable[j] ?? false, networkRunResamples(w, e, settings, j))),
    presentController: baseline && emptyReplicates(baseline, model?.baselineApplicable ?? false, networkRunResamples(baseline, e, settings, works.length)),
    completedReturn: baselineEnds && [], threads: '',
  };
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(e));
  let reported = -PROGRESS_EVERY;
  for (let first = 0; first < settings.resamples; first += RESAMPLE_BLOCK) {
    await pace();
    throwIfCancelled(context.cancel);
    if (first - reported >= PROGRESS_EVERY) onProgress?.({ done: (reported = first), total: settings.resamples });
    const drawn = drawBlock(e, settings.seed, first, settings.resamples, block);
    const fqe = new Map([...works, ...(baseline ? [baseline] : [])].map((w) => [w, blockValues(w, drawn)]));
    // Asked for last, so a helper thread computing them has had this block's other work to run ahead.
    const share = await route.block(first, drawn), models = share.models;
    const perDecisionOf = (k: number, i: number) => (rows[k] < 0 ? undefined : firstOrder ? linearisedChecks(firstOrder[rows[k]], drawn[i]) : share.perDecision[rows[k]][i]);
    drawn.forEach((c, i) => {
      out.loggedReturn.push(weightedMean(plan.loggedReturn.perEpisode, c));
      works.forEach((w, j) => replicateCandidate(w, out.candidates[j], fqe.get(w)!.map((v) => v?.[i]), models?.[j]?.[i] ?? null, perDecisionOf(j, i)));
      if (baseline && out.presentController) replicateCandidate(baseline, out.presentController, fqe.get(baseline)!.map((v) => v?.[i]), null, perDecisionOf(works.length, i));
      if (baselineEnds && out.completedReturn) out.completedReturn.push(completedReturnOfResample(plan.loggedReturn.perEpisode, baselineEnds.tailWeights, baselineEnds.values, c));
    });
  }
  onProgress?.({ done: settings.resamples, total: settings.resamples });
  out.threads = route.note;
  return out;
}

function emptyReplicates(w: CandidateWork, modelApplicable: boolean, network: NetworkRunResamples | null): CandidateReplicates {
  const fqe: Replicates = [], offPolicy = 'perDecision' in w.offPolicy;
  return {
    fqe, importanceSampling: offPolicy ? [] : null, doublyRobust: offPolicy ? [] : null, model: modelApplicable ? [] : null,
    classes: w.classes.map((_, i) => (i === 0 ? fqe : [])), network,
  };
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
function modelJobOf(context: AssessmentContext, inputs: RouteInputs): (() => ModelJob) | null {
  const { model } = inputs, { plan } = context;
  if (!model) return null;
  let held: ModelRegressions | null = model.regressions;
  const policies = inputs.policies.map((policy, j) => (model.applicable[j] ? policy : null));
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
