/**
 * Replicates and full-data estimates → the parts of an Assessment: per model its interval, the
 * range across function classes, cross-checks with the headline they give, diagnostics, slices and
 * warnings; the present controller as the baseline; the comparison of all policies; and the
 * warnings that concern the whole assessment.
 */
import { ditherDependenceText } from '../core/ditherDependence';
import type { LoggedActionRanges } from '../core/diagnostics/actionSupport';
import { startCoverageFinding } from '../core/diagnostics/severity';
import { startCoverage } from '../core/diagnostics/startCoverage';
import { uncoveredShare, unvisitedNeedsCaution } from '../core/diagnostics/unvisitedRegion';
import { returnConcentration, returnConcentrationFinding } from '../core/diagnostics/returnConcentration';
import { truncationSentence } from '../core/loggedReturn';
import { modelPolicyValue } from '../core/offPolicy/modelBasedValue';
import { ImportanceSamplingError, perDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import type { AssessmentWarning, CandidateAssessment, Comparison, CrossCheck, IntervalEstimate, PairedDifference, PresentControllerAssessment } from './assessment';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import { crossChecks } from './assessCrossChecks';
import { disagreementWarnings } from './crossCheckWarnings';
import { coverageDiagnostics, coverageWarnings, linearModelOf, shiftOf, type CoverageReference } from './assessDiagnostics';
import { intervalEstimate, pairedDifference, ranking, type Estimator } from './assessIntervals';
import { isModelValueFailure, type ModelCheck } from './assessModelCheck';
import type { CandidateReplicates, ReplicateSet, Replicates } from './assessResamples';
import type { RolloutOutcome } from './assessRollouts';
import type { AssessmentSettings } from './assessSettings';
import { actionSlices } from './assessSlices';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { impossibleValue } from './assessPossible';
import { networkDisagreement, notSettledMessage, possibleOf, reportedClasses, withNetworkInterval, ownInterval } from './assessClassRange';
import { surfaceVisits } from './plan/surfaceGrid';
import { completedReturnFromEnds } from './model/completedReturn';
import { FIT_STATUS_WORDS } from '../core/fqe/fitStatus';
import { UNVISITED_TOPIC, unvisitedWarningMessage } from './unvisitedWords';

/** The logged return's name wherever it is listed beside the candidates (shown through policyNames.ts). */
export const BEHAVIOUR_NAME = 'logged return';
/** More failed resamples than this share raise a caution (our rule). */
const FAILED_SHARE = 0.05;

export interface AssemblyInputs {
  context: AssessmentContext;
  works: CandidateWork[];
  baseline: CandidateWork | null;
  replicates: ReplicateSet;
  modelCheck: ModelCheck;
  modelReasons: (string | null)[];
  /** Why the closed form does not apply to the present controller, or null. */
  presentModelReason: string | null;
  rollouts: RolloutOutcome[];
  baselineRollout: RolloutOutcome | null;
  ranges: LoggedActionRanges;
  reference: CoverageReference;
  /** V̂ of the present controller's model at each run's end and the weights γ^T past time-limited ends. */
  baselineEnds: { values: Float64Array; tailWeights: Float64Array } | null;
  tailWeight: number;
  settings: AssessmentSettings;
}

export function assembleCandidates(inputs: AssemblyInputs): CandidateAssessment[] {
  const { context, works, replicates, settings } = inputs, sign = context.plan.sign;
  const possible = possibleOf(context);
  return works.map((work, j) => {
    const diagnostics = coverageDiagnostics(work, context, inputs.ranges, inputs.reference);
    const r = replicates.candidates[j];
    const policyValue = withNetworkInterval(intervalEstimate(work.model.fit.policyValue, r.fqe, settings.level, sign), work, sign, r.network);
    const { classes, cut } = reportedClasses(context, settings.level, work, r, policyValue, possible);
    const { checks, confirmation } = checksOf(inputs, work, r, inputs.modelReasons[j], inputs.rollouts[j], diagnostics.importanceWeights, classes ? classes.settled : null);
    const warnings = [
      ...coverageWarnings(diagnostics),
      ...disagreementWarnings(checks),
      ...(classes && !classes.settled ? [{ severity: 'serious' as const, topic: 'functionClass', message: notSettledMessage(classes, cut.note) }] : []),
      ...networkDisagreement(work, classes),
      ...impossibleValue(context.plan, possible, work.model, policyValue),
      ...failedWarning(policyValue),
    ];
    return {
      name: work.model.name, policyValue, reportedRange: cut.range, ...(cut.note ? { rangeCut: cut.note } : {}), settled: classes ? classes.settled : null,
      functionClasses: classes, confirmation, crossChecks: checks, diagnostics, slices: actionSlices(work.model, context.plan.data, sign), warnings,
    };
  });
}

/**
 * The baseline, assessed as a candidate is: its J, the same function classes and range to report
 * (reportedClasses), and its cross-checks read with that verdict. Where it is not settled, the
 * whole-log caution (baselineClassWarning.ts) names it.
 */
export function assemblePresentController(inputs: AssemblyInputs): PresentControllerAssessment | null {
  const { context, baseline, replicates, settings } = inputs, sign = context.plan.sign;
  if (!baseline || !replicates.presentController || !replicates.completedReturn) return null;
  const r = replicates.presentController, model = baseline.model;
  const policyValue = withNetworkInterval(intervalEstimate(model.fit.policyValue, r.fqe, settings.level, sign), baseline, sign, r.network);
  const { classes, cut } = reportedClasses(context, settings.level, baseline, r, policyValue, possibleOf(context));
  const settled = classes ? classes.settled : null;
  const { checks, confirmation } = checksOf(inputs, baseline, r, inputs.presentModelReason, inputs.baselineRollout ?? { reason: 'not computed' }, null, settled);
  const completed = completedReturnFromEnds(inputs.context.plan, inputs.baselineEnds!).value;
  return {
    name: model.name, policyValue,
    completedReturn: intervalEstimate(completed, replicates.completedReturn, settings.level, sign, 'sampling of the logged runs; the value past each time limit is held at the full-data fit'),
    occupancyShift: inputs.reference.presentControllerShift, crossChecks: checks, confirmation,
    reportedRange: cut.range, ...(cut.note ? { rangeCut: cut.note } : {}), settled, functionClasses: classes,
  };
}

function checksOf(
  inputs: AssemblyInputs, work: CandidateWork, r: CandidateReplicates, modelReason: string | null, rollout: RolloutOutcome,
  weights: CandidateAssessment['diagnostics']['importanceWeights'], settled: boolean | null,
): { checks: CrossCheck[]; confirmation: CandidateAssessment['confirmation'] } {
  const points = fullDataCrossChecks(inputs, work, modelReason);
  return crossChecks({
    work, replicates: r, points: points.values, rollout, weights, tailWeight: inputs.tailWeight,
    offPolicyReason: points.offPolicyReason, modelReason: points.modelReason, level: inputs.settings.level, sign: inputs.context.plan.sign, settled,
    // A network's fit is not paired with the checks; its own interval's standard error goes into the difference's.
    fitStandardError: work.replicate ? null : ownInterval(work, r.network)?.standardError ?? null,
  });
}

function fullDataCrossChecks(inputs: AssemblyInputs, work: CandidateWork, modelReason: string | null) {
  const { plan } = inputs.context, discount = plan.discount;
  const values = { importanceSampling: null as number | null, doublyRobust: null as number | null, model: null as number | null };
  let offPolicyReason: string | null = 'perDecision' in work.offPolicy ? null : work.offPolicy.reason;
  if ('perDecision' in work.offPolicy) {
    try {
      const estimates = perDecisionEstimates(work.offPolicy.perDecision, discount);
      values.importanceSampling = estimates.importanceSampling;
      values.doublyRobust = estimates.doublyRobust;
    } catch (error) {
      if (!(error instanceof ImportanceSamplingError)) throw error;
      offPolicyReason = error.message;
    }
  }
  let reason = modelReason;
  if (reason === null && inputs.modelCheck.fit) {
    try {
      values.model = modelPolicyValue(inputs.modelCheck.fit, work.model.policy, discount, plan.starts.states);
    } catch (error) {
      if (!isModelValueFailure(error)) throw error;
      reason = (error as Error).message;
    }
  }
  return { values, offPolicyReason, modelReason: reason };
}

function failedWarning(estimate: IntervalEstimate): AssessmentWarning[] {
  const total = estimate.replicates + estimate.failedReplicates;
  if (total === 0 || estimate.failedReplicates <= FAILED_SHARE * total) return [];
  return [{
    severity: 'caution', topic: 'bootstrap',
    message: `${estimate.failedReplicates} of ${total} resamples gave no solution of the fit; the interval uses the other ${estimate.replicates} and may be too narrow.`,
  }];
}

/**
 * Every candidate against the baseline — the present controller's model, evaluated the same way —
 * and pairwise; the ranking over the candidates and the baseline. Without a present-controller model
 * the logged return stands in and the comparison says it is biased where runs end on a time limit.
 * A fit that did not converge has no value to compare: it is left out.
 */
export function comparison(plan: EvaluationPlan, replicates: ReplicateSet, works: CandidateWork[], baseline: CandidateWork | null, level: number): Comparison {
  const sign = plan.sign;
  // A present controller whose fit did not converge has no value to compare with, as a candidate's has not:
  // no difference from it gets an interval (so none can name a trial), and the note says why.
  const settled = baseline?.model.fit.status === 'converged';
  const reference: Estimator = baseline && replicates.presentController
    ? (settled ? estimatorOf(baseline, replicates.presentController) : { name: baseline.model.name, point: baseline.model.fit.policyValue, replicates: [] })
    : { name: BEHAVIOUR_NAME, point: plan.loggedReturn.value, replicates: replicates.loggedReturn };
  const candidates: Estimator[] = works.flatMap((w, j) => (w.model.fit.status !== 'converged' ? [] : [estimatorOf(w, replicates.candidates[j])]));
  const differences: PairedDifference[] = candidates.map((c) => pairedDifference(c, reference, level, sign));
  for (let i = 0; i < candidates.length; i++) {
    for (let j = i + 1; j < candidates.length; j++) differences.push(pairedDifference(candidates[i], candidates[j], level, sign));
  }
  const kind = baseline ? 'presentController' as const : 'loggedReturn' as const;
  const note = baseline && !settled
    ? `The present controller’s model ${FIT_STATUS_WORDS[baseline.model.fit.status]} (its fit did not converge), so no difference from it has an interval and no candidate can be named for a trial against it.`
    : baseline
    ? 'Each candidate is compared with the present controller’s model, evaluated by the same fitted Q-evaluation on the same resamples; the logged return is shown as a check.'
    : 'No model of the present controller could be fitted, so the logged return stands in as the baseline: it is cut short where runs end on a time limit, which biases it toward zero.';
  return { baseline: { name: reference.name, kind, note }, differences, ranking: ranking([...candidates, reference]) };
}

/** A fit's J for the comparison: its fitted Q-evaluation replicates, or a network's on the same resamples with the bounds its differences carry. */
function estimatorOf(w: CandidateWork, r: CandidateReplicates): Estimator {
  const net = r.network;
  return { name: w.model.name, point: w.model.fit.policyValue, replicates: net ? net.replicates : r.fqe, ...(net ? { allowance: net.allowance } : {}) };
}

export function unvisitedShare(plan: EvaluationPlan): number | null {
  const grid = plan.surface;
  if (!grid) return null;
  return uncoveredShare(surfaceVisits(plan.data, grid), grid.resolution[0], grid.resolution[1]);
}

export function globalWarnings(context: AssessmentContext, candidates: CandidateAssessment[], unvisited: number | null): AssessmentWarning[] {
  const out: AssessmentWarning[] = [];
  const { plan } = context;
  if (plan.approximator.kind === 'network') {
    const none = candidates.some((c) => c.policyValue.percentile === null);
    out.push({
      severity: 'caution', topic: 'bootstrap',
      message: none
        ? 'Some candidates’ J by the network approximator has no interval; compare it with the linear classes, the cross-checks and the sensitivity to the network width.'
        : 'The network’s intervals come from resampling the runs in its last-layer solve, not from refitting the network: compare them with the linear classes, the cross-checks and the sensitivity to the network width.',
    });
  }
  if (!plan.starts.followEpisodes) {
    out.push({
      severity: 'caution', topic: 'startStates',
      message: `The candidates’ J is taken at the ${plan.starts.count} start states given in the project, the logged return at its runs’ own starts: the comparison with the logged return mixes two start distributions.`,
    });
    const coverage = startCoverage(plan.data, plan.starts.states), finding = startCoverageFinding(coverage.outside, coverage.starts);
    if (finding) out.push(finding);
  }
  const concentration = returnConcentrationFinding(returnConcentration(plan.loggedReturn.perEpisode), plan.loggedReturn.episodes, plan.loggedReturn.value < 0);
  if (concentration) out.push(concentration);
  if (!context.presentControllerModel) out.push({ severity: 'caution', topic: 'presentController', message: `The comparison uses the logged return: ${context.presentControllerReason}.` });
  const dependence = context.presentControllerModel && context.presentController?.model.ditherDependence;
  const dependenceText = dependence ? ditherDependenceText(dependence, plan.data.actionNames) : null;
  if (dependenceText) out.push({ severity: 'caution', topic: 'presentController', message: dependenceText });
  const truncation = truncationSentence(plan.loggedReturn);
  if (truncation) {
    out.push({
      severity: 'caution', topic: 'loggedReturn',
      message: `${truncation}. Comparisons use the present controller’s model instead, and the logged return completed past each end is shown as a check.`,
    });
  }
  if (unvisitedNeedsCaution(unvisited)) {
    out.push({ severity: 'caution', topic: UNVISITED_TOPIC, message: unvisitedWarningMessage(unvisited) });
  }
  for (const c of candidates) {
    const { percentile: p, basic: b } = c.policyValue;
    if (p && b && Math.abs((p[0] + p[1]) / 2 - (b[0] + b[1]) / 2) > 0.25 * (p[1] - p[0])) {
      out.push({ severity: 'caution', topic: 'bootstrap', candidate: c.name, message: `${c.name}: the percentile and basic intervals differ markedly, a sign of a skewed or biased estimator; read both.` });
    }
    if (c.confirmation.status === 'unconfirmed') out.push({ severity: 'caution', topic: 'confirmation', candidate: c.name, message: `${c.name}: ${c.confirmation.text}` });
  }
  return out;
}

/** The present controller's shift, for scale beside every candidate's. */
export function presentControllerShift(plan: EvaluationPlan, baseline: CandidateWork | null): number | null {
  const model = baseline && linearModelOf(baseline);
  return model ? shiftOf(plan, model) : null;
}

export type { Replicates };
