/**
 * A model's J across the function classes, as the assessment reports it: the class verdict with the
 * model's own class beside the compared ones (a network's own interval, its nested pointer), the
 * range to report cut to what any policy can have, and the words of a verdict that is not settled.
 * One path for a candidate and the present controller (assessAssembly.ts).
 */
import { functionClassVerdict, unpairedGap, type ClassEstimate } from '../core/diagnostics/functionClassRange';
import { nestedClassSentence, networkNestedClassSentence } from '../core/diagnostics/nestedClassPointer';
import { possibleValues } from '../core/diagnostics/possibleValues';
import type { AssessmentWarning, FunctionClassAssessment, IntervalEstimate } from './assessment';
import { ASCII_MINUS, intervalAtPrecision, valueAtPrecision } from '../figures/parts/uncertainNumber';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import { intervalEstimate } from './assessIntervals';
import type { CandidateReplicates } from './assessResamples';
import { cutToCertain } from './assessPossible';
import { NESTED_CLASS_LABELS } from './plan/approximatorLabel';
import type { NetworkRunResamples } from './networkRunResamples';
import type { ValueInterval } from '../core/fqe/networkValueEstimate';

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
export function ownInterval(work: CandidateWork, net: NetworkRunResamples | null): ValueInterval | undefined {
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

/** The values any policy can have on these logs (the reward formula's bounds), for cutting a range to report. */
export function possibleOf(context: AssessmentContext) {
  const { data, absorbingEnds, discount } = context.plan;
  return possibleValues(data.rewards, discount, absorbingEnds > 0);
}

/**
 * A model's J across its function classes and the range to report: one path for a candidate and the
 * present controller. A range past what any policy can have, whatever it does (the reward formula's
 * bounds), is cut there and says so.
 */
export function reportedClasses(
  context: AssessmentContext, level: number, work: CandidateWork, r: CandidateReplicates, policyValue: IntervalEstimate, possible: ReturnType<typeof possibleValues>,
): { classes: FunctionClassAssessment | null; cut: ReturnType<typeof cutToCertain> } {
  const sign = context.plan.sign;
  const fitted = withUnresampledOwn(classAssessment(work, r, level, sign), work, sign, r.network);
  const cut = cutToCertain(context.plan, fitted?.range ?? policyValue.percentile, policyValue.value, possible);
  return { classes: fitted && cut.range ? { ...fitted, range: cut.range } : fitted, cut };
}

