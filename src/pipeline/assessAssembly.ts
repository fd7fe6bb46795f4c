/**
 * Replicates and full-data estimates → the parts of an Assessment: per model its interval, the
 * range across function classes, cross-checks with the headline they give, diagnostics, slices and
 * warnings; the present controller as the baseline; the comparison of all policies; and the
 * warnings that concern the whole assessment.
 */
import { ditherDependenceText } from '../core/ditherDependence';
import type { LoggedActionRanges } from '../core/diagnostics/actionSupport';
import { functionClassVerdict, unpairedGap, type ClassEstimate } from '../core/diagnostics/functionClassRange';
import { nestedClassSentence, networkNestedClassSentence } from '../core/diagnostics/nestedClassPointer';
import { startCoverageFinding } from '../core/diagnostics/severity';
import { startCoverage } from '../core/diagnostics/startCoverage';
import { uncoveredShare, unvisitedNeedsCaution } from '../core/diagnostics/unvisitedRegion';
import { possibleValues } from '../core/diagnostics/possibleValues';
import { returnConcentration, returnConcentrationFinding } from '../core/diagnostics/returnConcentration';
import { truncationSentence } from '../core/loggedReturn';
import { modelPolicyValue } from '../core/offPolicy/modelBasedValue';
import { ImportanceSamplingError, perDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import type {
  AssessmentWarning, CandidateAssessment, Comparison, CrossCheck, FunctionClassAssessment, IntervalEstimate, PairedDifference, PresentControllerAssessment,
} from './assessment';
import { ASCII_MINUS, intervalAtPrecision, valueAtPrecision } from '../figures/parts/uncertainNumber';
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
import { cutToCertain, impossibleValue } from './assessPossible';
import { surfaceVisits } from './plan/surfaceGrid';
import { NESTED_CLASS_LABELS } from './plan/approximatorLabel';
import { completedReturnFromEnds } from './model/completedReturn';
import type { NetworkRunResamples } from './networkRunResamples';
import type { ValueInterval } from '../core/fqe/networkValueEstimate';
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
    const { classes, cut } = reportedClasses(inputs, work, r, policyValue, possible);
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
  const { classes, cut } = reportedClasses(inputs, baseline, r, policyValue, possibleOf(context));
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

/** The values any policy can have on these logs (the reward formula's bounds), for cutting a range to report. */
function possibleOf(context: AssessmentContext) {
  const { data, absorbingEnds, discount } = context.plan;
  return possibleValues(data.rewards, discount, absorbingEnds > 0);
}

/**
 * A model's J across its function classes and the range to report: one path for a candidate and the
 * present controller. A range past what any policy can have, whatever it does (the reward formula's
 * bounds), is cut there and says so.
 */
function reportedClasses(
  inputs: AssemblyInputs, work: CandidateWork, r: CandidateReplicates, policyValue: IntervalEstimate, possible: ReturnType<typeof possibleValues>,
): { classes: FunctionClassAssessment | null; cut: ReturnType<typeof cutToCertain> } {
  const { context, settings } = inputs, sign = context.plan.sign;
  const fitted = withUnresampledOwn(classAssessment(work, r, settings.level, sign), work, sign, r.network);
  const cut = cutToCertain(context.plan, fitted?.range ?? policyValue.percentile, policyValue.value, possible);
  return { classes: fitted && cut.range ? { ...fitted, range: cut.range } : fitted, cut };
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

/** The serious warning of an estimate that is not settled across function classes: a range to report, or with one class an interval that checks nothing. */
export function notSettledMessage(classes: FunctionClassAssessment, cut: string | null = null): string {
  // The verdict's reason opens with its own "Not settled: "; the warning says it once.
  const range = rangeText(classes.range), reason = classes.reason.replace(/^Not settled: /, ''), after = cut ? ` ${cut}` : '';
  return classes.classes.length > 1
    ? `Not settled across function classes: ${reason} Report the range ${range}, not a single value.${after}`
    : `Not settled across function classes: ${reason} Its interval ${range} covers the sampling of runs only, not the error of the class: treat J as unchecked.${after}`;
}

/**
 * The candidate in every function class with an interval, and the verdict across them; null with fewer
 * than two, unless others were fitted and did not converge. A network's own class is not among them
 * (no replicates here; withUnresampledOwn adds it), so one linear class beside it already makes two:
 * without the verdict the agreement rule's "inconclusive" went unsaid and the network stood unchecked.
 * Exported for its test.
 */
export function classAssessment(work: CandidateWork, r: CandidateReplicates, level: number, sign: number): FunctionClassAssessment | null {
  const estimates: ClassEstimate[] = [];
  work.classes.forEach((c, k) => {
    const iv = intervalEstimate(c.model.fit.policyValue, r.classes[k], level, 1);
    if (iv.standardError === null || !iv.percentile) return;
    const replicates = r.classes[k].every((v) => v !== null) ? (r.classes[k] as number[]) : undefined;
    estimates.push({ label: c.label, value: c.model.fit.policyValue, standardError: iv.standardError, interval: iv.percentile, replicates });
  });
  const beside = work.model.fit.linearComparison !== undefined && !work.replicate; // a network: its own class is checked by the agreement rule
  if (estimates.length === 0 || (estimates.length < (beside ? 1 : 2) && work.unconvergedClasses.length === 0)) return null;
  // The project's own class leads the list when it was resampled; a network's own value has none here
  // (withUnresampledOwn adds it), and the linear classes are then checked among themselves only.
  const ownFirst = estimates[0]?.label === work.classes[0].label && work.replicate !== null;
  const verdict = functionClassVerdict(estimates, work.unconvergedClasses, ownFirst);
  // A linear project of degree 2 whose degrees 3 and 4 agree and both differ from it: the reason says where the gap most likely lies (range and verdict unchanged).
  const nested = ownFirst && estimates[0].label === NESTED_CLASS_LABELS.own ? nestedClassSentence(verdict, NESTED_CLASS_LABELS) : null;
  const flip = ([lo, hi]: readonly [number, number]): [number, number] => (sign > 0 ? [lo, hi] : [-hi, -lo]);
  return {
    classes: estimates.map((e) => ({ label: e.label, value: sign * e.value, interval: flip(e.interval), standardError: e.standardError })),
    settled: verdict.settled, range: flip(verdict.range), coverage: verdict.coverageText, reason: nested ? `${verdict.reason} ${nested}` : verdict.reason,
    pairs: verdict.gaps.map((g) => ({ ...g, difference: sign * g.difference })),
  };
}

/**
 * A network's J has no linear bootstrap replicates; its own interval stands in: the one on the
 * assessment's resamples at the assessment's level (networkRunResamples.ts), else the fit's own.
 * On the assessment's resamples it counts them as a linear fit's are, so resamples whose last layer
 * had no solution raise the same caution (failedWarning). Exported for its test.
 */
export function withNetworkInterval(estimate: IntervalEstimate, work: CandidateWork, sign: number, net: NetworkRunResamples | null = null): IntervalEstimate {
  const iv = ownInterval(work, net), interval = networkInterval(work, sign, net);
  if (estimate.percentile || !iv || !interval) return estimate;
  const solved = net ? net.replicates.filter((v) => v !== null).length : estimate.replicates;
  const counts = net ? { replicates: solved, failedReplicates: net.replicates.length - solved } : {};
  return { ...estimate, ...counts, percentile: interval, standardError: iv.standardError, covers: (net ? net.covers : work.model.fit.intervalCovers) ?? estimate.covers };
}

/** A network fit's own interval of J (reward sense): the one on the assessment's resamples where given, else the fit's; undefined for a fit without one. */
function ownInterval(work: CandidateWork, net: NetworkRunResamples | null): ValueInterval | undefined {
  return net?.interval ?? work.model.fit.interval;
}

/** A network fit's interval of J in the project's sense (on the assessment's resamples where given); null for a fit without one. */
function networkInterval(work: CandidateWork, sign: number, net: NetworkRunResamples | null = null): [number, number] | null {
  const iv = ownInterval(work, net);
  return !iv ? null : sign > 0 ? [iv.lower, iv.upper] : [-iv.upper, -iv.lower];
}

/**
 * The network and the linear estimate beside it (networkComparator.ts) disagree beyond their intervals: serious (approximatorAgreement.ts).
 * Said once: where the function classes' verdict is "not settled" for this very reason (withUnresampledOwn), its warning
 * already carries the same sentence, and a second serious warning would repeat it word for word. Exported for its test.
 */
export function networkDisagreement(work: CandidateWork, classes: FunctionClassAssessment | null): AssessmentWarning[] {
  const c = work.model.fit.linearComparison;
  if (!c || c.agreement.verdict !== 'disagree') return [];
  if (classes && !classes.settled && classes.reason.includes(c.agreement.message)) return [];
  return [{ severity: 'serious', topic: 'approximatorAgreement', message: c.agreement.message }];
}

/**
 * A model without resamples of its own (a network) is not in the class verdict, which needs paired
 * replicates; its value and its own interval (networkInterval.ts) must still lie in the range
 * reported, which spans every class's interval, so the range is widened to them, and the verdict is
 * "not settled" when its value lies outside the classes' range, or when the linear estimate does not
 * check it: it disagrees, or the two cannot be told apart (approximatorAgreement.ts, "inconclusive").
 * The linear classes are then compared among themselves for disagreement only, so the network's
 * own value is settled only by the agreement rule's "agree" — as a linear project's own class is
 * only by a class that could have seen a gap of 10 % (functionClassRange.ts). Exported for its test.
 */
export function withUnresampledOwn(classes: FunctionClassAssessment | null, work: CandidateWork, sign: number, net: NetworkRunResamples | null = null): FunctionClassAssessment | null {
  if (!classes || work.replicate) return classes;
  return withNetworkNestedPointer(ownBesideClasses(classes, work, sign, net), work.model.fit.status === 'converged');
}

/**
 * A network project not settled whose network, degree 3 and degree 4 agree by the class rule and all
 * differ from degree 2, the network's fit converged: the reason says where the gap most likely lies
 * (nestedClassPointer.ts; range and verdict unchanged). The network's pairs are not in the class verdict, so they are compared here
 * unpaired, by the class rule's own formula (unpairedGap).
 */
function withNetworkNestedPointer(a: FunctionClassAssessment, networkConverged: boolean): FunctionClassAssessment {
  if (a.settled || !networkConverged) return a;
  const [own, ...linear] = a.classes;
  const known = (c: (typeof a.classes)[number]) => (c.standardError === null || c.standardError === undefined ? null : { label: c.label, value: c.value, standardError: c.standardError });
  const network = known(own), others = linear.map(known);
  if (!network || others.some((c) => c === null)) return a;
  // Without the linear pairs (a verdict saved before they were kept) degree 2 is compared with nothing, and the pointer holds on none.
  const gaps = [...(a.pairs ?? []), ...others.map((c) => unpairedGap(network, c!))];
  const sentence = networkNestedClassSentence({ settled: false, gaps }, { network: network.label, ...NESTED_CLASS_LABELS });
  return sentence ? { ...a, reason: `${a.reason} ${sentence}` } : a;
}

function ownBesideClasses(classes: FunctionClassAssessment, work: CandidateWork, sign: number, net: NetworkRunResamples | null): FunctionClassAssessment {
  const own = sign * work.model.fit.policyValue, [lo, hi] = classes.range, interval = networkInterval(work, sign, net);
  const entry = { label: work.classes[0].label, value: own, interval, standardError: ownInterval(work, net)?.standardError ?? null };
  const [ownLo, ownHi] = interval ?? [own, own];
  const all = [entry, ...classes.classes];
  const widened = { ...classes, classes: all, coverage: spreadCoverage(classes.coverage, all.map((c) => c.label)), range: [Math.min(lo, ownLo, own), Math.max(hi, ownHi, own)] as [number, number] };
  const agreement = work.model.fit.linearComparison?.agreement;
  if (agreement?.verdict === 'disagree') return { ...widened, settled: false, reason: `Not settled: ${agreement.message}` };
  if (own < lo || own > hi) {
    return {
      ...widened, settled: false,
      reason: `Not settled: the ${work.classes[0].label} value ${valueAtPrecision(own, [lo, hi], ASCII_MINUS)} lies outside the range of the linear classes, ${rangeText([lo, hi])}.`,
    };
  }
  if (agreement?.verdict === 'inconclusive') return { ...widened, settled: false, reason: `Not settled: ${agreement.message}` };
  // One linear class beside the network: the verdict's "one function class only" is not so here; the agreement rule checked the network.
  if (agreement && classes.classes.length === 1 && classes.settled) {
    return { ...widened, reason: `Settled: ${agreement.message}`, coverage: oneClassBesideNetwork(classes.classes[0].label) };
  }
  return widened;
}

function oneClassBesideNetwork(label: string): string {
  return `Covers the sampling of runs, the network’s own interval and the ${label} fit beside it; a bias they share would not show.`;
}

/**
 * What the range covers, once the network's own interval is in it: the verdict's text counted and named
 * the linear classes only ("the 3 function classes fitted (polynomial, degree 2; …)") under a list that
 * shows the network as well, so it is said again over every class listed. Other texts (the sampling of
 * runs only) are kept.
 */
function spreadCoverage(coverage: string, labels: readonly string[]): string {
  if (!coverage.startsWith('Covers the sampling of runs and the spread across')) return coverage;
  return `Covers the sampling of runs and the spread across the ${labels.length} function classes fitted (${labels.join('; ')}); a bias they all share would not show.`;
}

/** The range at its own precision, as the tables beside the warning print it ("[5.62, 9.55]", not "[5.624, 9.549]"); ASCII minus, as the command line keeps. */
function rangeText(range: readonly [number, number]): string {
  return intervalAtPrecision(range, ASCII_MINUS);
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
