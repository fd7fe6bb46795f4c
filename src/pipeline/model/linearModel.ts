/**
 * A candidate's model under the linear approximator: one pass over the data forms the Bellman
 * statistics — kept per episode when that is affordable (episodeBellmanSums.ts), so that every
 * bootstrap resample is a reweighting of them — and the FQE iteration and the LSTD-Q fixed point are
 * solved from their total (linearFqeSolve.ts). When per-episode sums would be too many
 * (MAX_EXACT_RESAMPLE_VALUES), the total is formed in the same one pass and, once the fixed point is
 * known, a second, lighter pass forms the per-episode influence values of the linearised bootstrap.
 *
 * Which solution is reported, and when it is called converged (our rule, stated to the user):
 *   - the iteration met the tolerance: its iterate, "converged";
 *   - it stopped at the iteration limit but provably contracts (spectral-radius bound ρ < 1): its
 *     limit is the unique fixed point (Banach), which is solved directly and reported, "converged";
 *   - it stopped at the limit without a proof of contraction: its last iterate, "maxIterations"
 *     (not converged; the fixed point is shown beside it);
 *   - it diverged: the fixed point with its warning when one exists, "diverged"; else an error.
 */
import { createActionQuadrature, type ActionQuadrature } from '../../core/actionQuadrature';
import { episodeBellmanSumsSteps, leadingEpisodeSums, resampleBellmanStatistics, type EpisodeBellmanSums } from '../../core/bootstrap/episodeBellmanSums';
import { unitMultiplicities } from '../../core/bootstrap/episodeMultiplicities';
import {
  influenceSetup, linearisedReplicatesFromSums, linearisedReplicatesSteps, type InfluenceSetup, type LinearisationInput, type LinearisedReplicates,
} from '../../core/bootstrap/linearisedReplicate';
import { nestedInfluenceSteps } from '../../core/bootstrap/nestedInfluencePass';
import { createPacer, PACE_INTERVAL_MS, runSteps, runStepsPaced, throwIfCancelled, type PassSteps } from '../../core/fqe/cancellation';
import { averageRoute } from '../../core/features/policyFeatureAverage';
import { leadsPolynomial } from '../../core/features/polynomialFeatures';
import { startStateFeatures } from '../../core/features/policyFeatures';
import { bellmanStatisticsSteps, bellmanSumsStride, blockRowsFor, leadingStatistics, checkStatisticsFinite, type BellmanStatistics } from '../../core/fqe/bellmanStatistics';
import { solveLinearFqe } from '../../core/fqe/linearFqeSolve';
import { MAX_EXACT_RESAMPLE_VALUES, MAX_INFLUENCE_SUM_VALUES } from '../../core/limits';
import type { CandidateFit } from '../candidateFit';
import type { FitIteration } from '../estimates';
import type { EvaluationPlan, PlannedPolicy } from '../plan/evaluationPlan';
import type { FeatureMap } from '../../core/features/featureMap';
import type { CandidateModel, LinearFitSpec, LinearResampling } from './candidateModel';
import type { ModelHooks } from './modelHooks';
import { reportedSolution } from './reportedSolution';

/** The plan's own linear fit (its features and settings); only for a plan with the linear approximator. */
export function planLinearFit(plan: EvaluationPlan): LinearFitSpec {
  const settings = plan.approximator, features = plan.features;
  if (settings.kind !== 'linear' || !features) throw new Error('planLinearFit: the plan is not for the linear approximator');
  return { features, ridge: settings.ridge, tolerance: settings.tolerance, maxIterations: settings.maxIterations };
}

export function buildLinearModel(plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}, settings: LinearFitSpec = planLinearFit(plan)): CandidateModel {
  return runSteps(linearModelSteps(plan, planned, hooks, settings));
}

/**
 * buildLinearModel awaiting hooks.pace (default: a yield to the event loop about every PACE_INTERVAL_MS) between slices, so a host's cancel is heard during a data pass.
 * `others`: models of other policies already built on this plan; one with the same feature map lends its policy-free sums (G, b, rr) to this one's pass.
 */
export function buildLinearModelPaced(
  plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks = {}, settings: LinearFitSpec = planLinearFit(plan), enclosing: readonly CandidateModel[] = [],
  others: readonly CandidateModel[] = [],
): Promise<CandidateModel> {
  return runStepsPaced(linearModelSteps(plan, planned, hooks, settings, enclosing, others), hooks.pace ?? createPacer(PACE_INTERVAL_MS));
}

/** `enclosing`: models of the same policy already built; one whose features lead with these (nestedStatistics) serves this one's pass. */
function* linearModelSteps(
  plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks, settings: LinearFitSpec, enclosing: readonly CandidateModel[] = [], others: readonly CandidateModel[] = [],
): PassSteps<CandidateModel> {
  const fitted = yield* linearFitSteps(plan, planned, hooks, settings, enclosing.flatMap(nestOf), others);
  return fitted.finish(fitted.pass && (yield* linearisedReplicatesSteps(fitted.pass)));
}

/** What a class nested in another reads of it (nestedStatistics): its features and rule, its statistics, its per-episode sums where its resamples reweight them. */
interface NestSource {
  readonly features: FeatureMap;
  readonly quadrature: ActionQuadrature;
  readonly statistics: BellmanStatistics;
  readonly exactSums: EpisodeBellmanSums | null;
}

function nestOf(model: CandidateModel): NestSource[] {
  const l = model.linear;
  return l ? [{ features: l.features, quadrature: model.quadrature, statistics: l.statistics, exactSums: l.resampling.kind === 'exact' ? l.resampling.sums : null }] : [];
}

/** A fit whose first-order resamples may still wait for their influence pass over the data (pass: its input; null when they need none). */
interface FittedLinear {
  readonly pass: LinearisationInput | null;
  readonly nest: NestSource;
  /** The model, given the pass's influence values where it has a pass. */
  finish(replicates: LinearisedReplicates | null): CandidateModel;
}

function* linearFitSteps(
  plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks, settings: LinearFitSpec, enclosing: readonly NestSource[], others: readonly CandidateModel[],
): PassSteps<FittedLinear> {
  const { features } = settings, { data } = plan;
  const quadrature = createActionQuadrature(planned.policy, plan.quadratureNodes);
  const nested = enclosing.reduce<ReturnType<typeof nestedStatistics>>((found, outer) => found ?? nestedStatistics(plan, features, quadrature, outer), null);
  const lender = others.find((m) => m.linear?.features === features)?.linear ?? undefined;
  const { statistics, sums, exact } = nested ?? (yield* dataPass(plan, features, quadrature, hooks, lender));
  const startFeatures = startStateFeatures(features, quadrature, plan.starts.states, data.stateDim);
  const solved = solveLinearFqe({
    statistics, features, stateDim: data.stateDim, actionDim: data.actionDim, discount: plan.discount, ridge: settings.ridge,
    tolerance: settings.tolerance, maxIterations: settings.maxIterations, startFeatures, cancel: hooks.cancel,
    onIteration: hooks.onIteration && ((p) => hooks.onIteration!(fitIteration(p))),
  });
  const reported = reportedSolution(solved, settings.tolerance);
  const weights = reported.solution.q.weights, atFixedPoint = reported.status === 'converged';
  const fit: CandidateFit = {
    q: reported.solution.q, status: reported.status, message: reported.message, history: solved.history.map(fitIteration),
    policyValue: reported.solution.policyValue.value, standardError: reported.solution.policyValue.standardError,
    fixedPointValue: solved.fixedPoint?.policyValue.value ?? null, featureCount: features.dim,
    backend: 'linear least squares (double precision)', warnings: reported.warnings, dispose: () => undefined,
  };
  const linearisation: LinearisationInput = {
    data, index: plan.episodes, features, quadrature, statistics, weights, ridge: settings.ridge, discount: plan.discount,
    startFeatures, startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode, cancel: hooks.cancel,
  };
  const fixed: LinearResampling | null = exact && sums ? { kind: 'exact', sums }
    : !atFixedPoint ? { kind: 'none', reason: 'the fit did not converge, so there is no fixed point to take resamples around' }
    : sums ? { kind: 'linearised', replicates: linearisedReplicatesFromSums(linearisation, sums) } : null;
  const model = (resampling: LinearResampling): CandidateModel => ({
    ...planned, quadrature, fit, dispose: () => undefined, linear: { ...settings, resampling, statistics, startFeatures, weights, atFixedPoint },
  });
  return {
    pass: fixed ? null : linearisation, nest: { features, quadrature, statistics, exactSums: exact ? sums : null },
    finish: (replicates) => model(fixed ?? { kind: 'linearised', replicates: replicates! }),
  };
}

/** A model of buildLinearModelsPaced, or what its fit threw. */
export type LinearOutcome = { readonly model: CandidateModel } | { readonly error: unknown };

/**
 * Several linear fits of one policy (the function classes: polynomial degrees, highest first), as
 * buildLinearModelPaced would make each with the models before it as `enclosing`, save that the
 * influence passes of those whose features nest are one pass (../../core/bootstrap/nestedInfluencePass.ts):
 * the same models. Per spec, in order, its model or what its fit threw (a failed fit encloses none).
 */
export function buildLinearModelsPaced(
  plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks, specs: readonly LinearFitSpec[], enclosing: readonly CandidateModel[] = [],
  others: readonly CandidateModel[] = [],
): Promise<LinearOutcome[]> {
  return runStepsPaced(linearModelsSteps(plan, planned, hooks, specs, enclosing, others), hooks.pace ?? createPacer(PACE_INTERVAL_MS));
}

/** `others`: models of other policies on this plan; one with a spec's very feature map lends that fit's pass its policy-free sums (buildLinearModelPaced). */
function* linearModelsSteps(
  plan: EvaluationPlan, planned: PlannedPolicy, hooks: ModelHooks, specs: readonly LinearFitSpec[], enclosing: readonly CandidateModel[], others: readonly CandidateModel[],
): PassSteps<LinearOutcome[]> {
  const nests = enclosing.flatMap(nestOf), fits: (FittedLinear | { error: unknown })[] = [];
  for (const spec of specs) {
    throwIfCancelled(hooks.cancel);
    try {
      const fitted = yield* linearFitSteps(plan, planned, hooks, spec, nests, others);
      fits.push(fitted);
      nests.push(fitted.nest);
    } catch (error) {
      fits.push({ error });
    }
  }
  const replicates = yield* sharedInfluencePasses(fits.flatMap((f) => ('pass' in f && f.pass ? [f.pass] : [])));
  return fits.map((f) => {
    if ('error' in f) return f;
    const r = f.pass ? replicates.get(f.pass)! : null;
    return r && 'error' in r ? r : { model: f.finish(r) };
  });
}

/**
 * The influence passes of several fits: each group of fits whose features lead the first's (the
 * highest degree left) with the same route to the expected next features, on one pass; a fit whose
 * setup throws (a singular system) gives its error and stays out of the pass.
 */
function* sharedInfluencePasses(inputs: LinearisationInput[]): PassSteps<Map<LinearisationInput, LinearisedReplicates | { error: unknown }>> {
  const out = new Map<LinearisationInput, LinearisedReplicates | { error: unknown }>(), setups = new Map<LinearisationInput, InfluenceSetup>();
  for (const input of inputs) {
    try {
      setups.set(input, influenceSetup(input));
    } catch (error) {
      out.set(input, { error });
    }
  }
  let left = inputs.filter((input) => setups.has(input));
  while (left.length > 0) {
    const outer = left[0], group = left.filter((input) => input === outer || nestsIn(input, outer));
    left = left.filter((input) => !group.includes(input));
    const values = yield* nestedInfluenceSteps(group, group.map((input) => setups.get(input)!));
    group.forEach((input, c) => out.set(input, values[c]));
  }
  return out;
}

/** True when a pass over `outer`'s features gives `inner`'s φ and ψ as their leading parts, to the last bit. */
function nestsIn(inner: LinearisationInput, outer: LinearisationInput): boolean {
  const q = inner.quadrature, r = outer.quadrature;
  return q.policy === r.policy && q.nodesPerDimension === r.nodesPerDimension && leadsPolynomial(inner.features, outer.features)
    && averageRoute(inner.features, q) === averageRoute(outer.features, r);
}

/** A pass's statistics, with the per-episode sums when it kept them; `exact`: the resamples reweight those sums. */
interface PassResult {
  statistics: BellmanStatistics;
  sums: EpisodeBellmanSums | null;
  exact: boolean;
}

/**
 * The one pass: per episode when the sums are affordable (their total is the full data's; kept for
 * exact resamples up to MAX_EXACT_RESAMPLE_VALUES, else up to MAX_INFLUENCE_SUM_VALUES only for the
 * first-order resamples' influence values), else the total only. lender: another policy's model with
 * this feature map, whose policy-free sums this pass takes instead of forming them
 * (../../core/fqe/nextFeatureSums.ts; the same numbers to the last bit).
 */
function* dataPass(
  plan: EvaluationPlan, features: FeatureMap, quadrature: ActionQuadrature, hooks: ModelHooks, lender?: NonNullable<CandidateModel['linear']>,
): PassSteps<PassResult> {
  const { data } = plan, passHooks = { cancel: hooks.cancel, onDataPass: hooks.onDataPass };
  const route = passRoute(plan, features.dim), exact = route === 'exact';
  if (route === 'whole') {
    const shared = lender && lender.resampling.kind !== 'exact' ? lender.statistics : undefined;
    return { statistics: yield* bellmanStatisticsSteps(data, features, quadrature, passHooks, shared), sums: null, exact: false };
  }
  const shared = lender?.resampling.kind === 'exact' ? lender.resampling.sums : undefined;
  const sums = yield* episodeBellmanSumsSteps(data, features, quadrature, passHooks, plan.episodes, shared);
  const statistics = resampleBellmanStatistics(sums, unitMultiplicities(plan.episodes.episodes));
  checkStatisticsFinite(statistics, data, features, quadrature);
  return { statistics, sums, exact };
}

/** How a pass with d features over the plan's episodes is made (dataPass): its per-episode sums reweighted, kept for the influence values, or the total only. */
function passRoute(plan: EvaluationPlan, d: number): 'exact' | 'episodes' | 'whole' {
  const values = plan.episodes.episodes * bellmanSumsStride(d);
  return values <= MAX_EXACT_RESAMPLE_VALUES ? 'exact' : values <= MAX_INFLUENCE_SUM_VALUES ? 'episodes' : 'whole';
}

/**
 * The statistics of a polynomial map read off an enclosing model's (a higher degree on the same
 * standardised inputs, so these monomials lead; leadingStatistics), when its pass is the one this
 * map would make: the same route (total or per episode, by MAX_EXACT_RESAMPLE_VALUES), the same
 * rows per block and the same route to the expected next features (averageRoute). Then they are
 * this map's own pass to the last bit; else null (make the pass).
 */
function nestedStatistics(plan: EvaluationPlan, features: FeatureMap, quadrature: ActionQuadrature, outer: NestSource): PassResult | null {
  const k = features.dim;
  if (!leadsPolynomial(features, outer.features) || blockRowsFor(k) !== blockRowsFor(outer.features.dim)) return null;
  // The same route to E_{a~π} φ (closed-form moments serve degrees ≤ 2n − 1 only; the two routes agree to rounding, not to the bit).
  if (averageRoute(features, quadrature) !== averageRoute(outer.features, outer.quadrature)) return null;
  const route = passRoute(plan, k);
  if (route === 'episodes') return null; // its own pass keeps per-episode sums that no enclosing model keeps
  if (route === 'whole') {
    if (passRoute(plan, outer.features.dim) !== 'whole') return null; // its total came from per-episode sums, in another order
    const statistics = leadingStatistics(outer.statistics, k);
    checkStatisticsFinite(statistics, plan.data, features, quadrature);
    return { statistics, sums: null, exact: false };
  }
  if (!outer.exactSums) return null;
  const sums = leadingEpisodeSums(outer.exactSums, k), statistics = resampleBellmanStatistics(sums, unitMultiplicities(plan.episodes.episodes));
  checkStatisticsFinite(statistics, plan.data, features, quadrature);
  return { statistics, sums, exact: true };
}

/**
 * The statistics of a whole-data pass with these features and quadrature (bellmanStatisticsSteps), read
 * off one of `models` where that gives them to the last bit, else null (make the pass). A model
 * qualifies when its own statistics are a whole pass's (its route is 'whole': its own pass, or read
 * off another whole pass), its polynomial features lead with these on the same standardised inputs,
 * its passes have as many rows per block and its quadrature takes the same route to E_{a~π} φ
 * (nestedStatistics states why each condition matters). The sensitivity sweep's lower degree reads a
 * function class's pass this way.
 */
export function wholePassStatistics(plan: EvaluationPlan, features: FeatureMap, quadrature: ActionQuadrature, models: readonly CandidateModel[]): BellmanStatistics | null {
  const k = features.dim;
  for (const model of models) {
    const outer = model.linear, q = model.quadrature;
    if (!outer || passRoute(plan, outer.features.dim) !== 'whole' || q.policy !== quadrature.policy || q.nodesPerDimension !== quadrature.nodesPerDimension) continue;
    if (!leadsPolynomial(features, outer.features) || blockRowsFor(k) !== blockRowsFor(outer.features.dim)) continue;
    if (averageRoute(features, quadrature) !== averageRoute(outer.features, q)) continue;
    const statistics = leadingStatistics(outer.statistics, k);
    checkStatisticsFinite(statistics, plan.data, features, quadrature);
    return statistics;
  }
  return null;
}

function fitIteration(p: { iteration: number; weightChange: number; bellmanResidual: number; policyValue: number }): FitIteration {
  return { iteration: p.iteration, weightChange: p.weightChange, bellmanResidual: p.bellmanResidual, policyValue: p.policyValue, loss: null };
}
