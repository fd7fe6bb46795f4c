/**
 * The Findings answer as a rule over the assessment: which candidate, if any, to take to a plant
 * trial first. A candidate qualifies when (1) the percentile interval of its paired difference
 * against the baseline (the present controller's model, or the logged return without one) lies
 * wholly on the better side of 0, (2) the assessment raised no serious warning for it, nor for the log as a
 * whole (a finding such as the plant-memory check's bears on every candidate's J), and (3) no
 * cross-check contradicts it; of those, the one with the best J is named. The rule is ours; its
 * parts are the assessment's own verdicts (paired bootstrap interval, `severity.ts`,
 * `crossCheckVerdict.ts`), so the words on screen follow the thresholds the code applies.
 * The sentence in TRIAL_RULE states it to the reader. Every host says the answer in the same words
 * (trialAnswer): the app's Findings, the command line and the report.
 */
import type { Assessment, CandidateAssessment, PairedDifference } from './assessment';
import { plural } from '../data/reportFormat';
import { shareText } from '../core/shareText';
import { intervalAtPrecision, TRUE_MINUS, valueAtPrecision, valueInInterval, type Minus } from '../figures/parts/uncertainNumber';
import { policyLabel } from './policyNames';
import { CROSS_CHECK_TOPIC } from './crossCheckWarnings';

export const TRIAL_RULE = 'A candidate is named for a trial only when the interval of its difference from the baseline lies wholly on the better side of 0, '
  + 'the assessment raised no serious warning for it or for the whole log and no cross-check contradicts it; of those, the best J is named.';

export interface TrialLine {
  readonly candidate: CandidateAssessment;
  /** The candidate − baseline difference in the project's sense, null when missing. */
  readonly difference: PairedDifference | null;
  /** The difference's interval lies wholly on the better side of 0. */
  readonly clearlyBetter: boolean;
  readonly serious: number;
  readonly cautions: number;
  /** Warnings in the whole-log list that bear on this candidate: those about it by name, and those about no one candidate. */
  readonly logSerious: number;
  readonly logCautions: number;
  /** Of those, the warnings on the whole log (about no one candidate); the rest, with its own, are "about it". */
  readonly generalSerious: number;
  readonly generalCautions: number;
  /** Why this candidate is not named, as clauses in the reader's words; empty when it qualifies. */
  readonly reasons: readonly string[];
}

export interface TrialChoice {
  /** The candidate to trial first, or null when none qualifies. */
  readonly pick: TrialLine | null;
  /** The candidate with the best J by its point estimate (it may not qualify). */
  readonly best: TrialLine | null;
  /** Candidates in the ranking's order, best first. */
  readonly lines: readonly TrialLine[];
}

/** Whether an interval of a − b lies wholly on the better side: below 0 for a cost, above 0 for a reward. */
export function whollyBetter(interval: readonly [number, number] | null, sense: 'cost' | 'reward'): boolean {
  if (!interval) return false;
  return sense === 'cost' ? interval[1] < 0 : interval[0] > 0;
}

function lineOf(assessment: Assessment, candidate: CandidateAssessment): TrialLine {
  const baseline = assessment.comparison.baseline.name;
  const difference = assessment.comparison.differences.find((d) => d.a === candidate.name && d.b === baseline) ?? null;
  const clearlyBetter = whollyBetter(difference?.difference.percentile ?? null, assessment.valueSense);
  const serious = candidate.warnings.filter((w) => w.severity === 'serious').length;
  const contradicted = candidate.confirmation.status === 'contradicted';
  const cautions = candidate.warnings.length - serious;
  const onLog = assessment.warnings.filter((w) => w.candidate === undefined || w.candidate === candidate.name);
  const logSerious = onLog.filter((w) => w.severity === 'serious').length, logCautions = onLog.length - logSerious;
  // Its own serious warnings, and those in the whole-log list about it by name. A disagreeing check's serious warning is the
  // contradiction itself, said once as the contradiction: it comes from the same disagreeing checks as the status "contradicted"
  // (assessAssembly.ts, crossCheckWarnings.ts), so leaving its topic out never drops a warning the contradiction does not say.
  const namedInLog = onLog.filter((w) => w.severity === 'serious' && w.candidate !== undefined).length;
  const otherSerious = namedInLog + candidate.warnings.filter((w) => w.severity === 'serious' && w.topic !== CROSS_CHECK_TOPIC).length;
  const reasons: string[] = [];
  if (!difference?.difference.percentile) reasons.push('its difference from the baseline has no interval');
  else if (!clearlyBetter) reasons.push('the interval of its difference from the baseline reaches 0 or the worse side');
  if (contradicted) reasons.push('a cross-check contradicts it');
  if (otherSerious > 0) reasons.push(`the assessment raised ${otherSerious === 1 ? `a${contradicted ? 'nother' : ''} serious warning` : `${otherSerious}${contradicted ? ' other' : ''} serious warnings`} for it`);
  const whole = assessment.warnings.filter((w) => w.severity === 'serious' && w.candidate === undefined).length;
  if (whole > 0) reasons.push(`the assessment raised ${whole === 1 ? 'a serious warning' : `${whole} serious warnings`} for the whole log`);
  const generalCautions = assessment.warnings.filter((w) => w.severity === 'caution' && w.candidate === undefined).length;
  return { candidate, difference, clearlyBetter, serious, cautions, logSerious, logCautions, generalSerious: whole, generalCautions, reasons };
}

export function trialChoice(assessment: Assessment): TrialChoice {
  const order = assessment.comparison.ranking.order;
  const rank = (name: string) => {
    const i = order.indexOf(name);
    return i < 0 ? order.length : i;
  };
  const lines = assessment.candidates.map((c) => lineOf(assessment, c)).sort((a, b) => rank(a.candidate.name) - rank(b.candidate.name));
  return { pick: lines.find((l) => l.reasons.length === 0) ?? null, best: lines[0] ?? null, lines };
}

/**
 * The cautions that bear on the named candidate, said beside a named trial: its own (e.g. importance
 * weights on a few runs), those in the whole-log list about it by name (an unconfirmed estimate) and
 * those on the log as a whole (the present controller's dithers moving together, extrapolated
 * surfaces). They do not stop a trial (only a serious warning does, TRIAL_RULE), but the answer read
 * alone said nothing of them. Cautions about other candidates are not counted: on the heating-loop
 * sample each candidate's "unconfirmed" caution was read as one of three "on the whole log".
 * Null when there are none.
 */
export function logCautionsText(line: TrialLine, where = 'under Coverage'): string | null {
  const { aboutIt, general } = warningGroups(line).cautions;
  const count = (n: number) => (n === 1 ? 'a caution' : `${n} cautions`);
  const parts = [aboutIt > 0 ? `${count(aboutIt)} about it` : '', general > 0 ? `${count(general)} on the whole log` : ''].filter(Boolean);
  if (parts.length === 0) return null;
  return `The assessment raised ${parts.join(' and ')}; read ${aboutIt + general === 1 ? 'it' : 'them'} ${where} before the trial.`;
}

/** Where a host shows what the answer points to: the safety cautions, and the warnings (e.g. "above", "under Coverage"); its minus sign (the terminal's is ASCII). */
export interface AnswerPlaces {
  readonly cautions: string;
  readonly warnings: string;
  readonly minus?: Minus;
}

/** The answer in words, as every host says it: a headline (shown strong) and what follows it; logCautions beside a named trial, else null. */
export interface TrialAnswer {
  readonly headline: string;
  readonly detail: string;
  readonly logCautions: string | null;
}

/**
 * The answer of trialChoice in words: the candidate to trial first with its J, interval, difference
 * from the baseline and how often it came out better, and the cautions a trial keeps; or that none is
 * named, with the best J's reasons. unit: J's unit, '' where the host has none. Null when the named
 * candidate has no difference to state (it cannot be named without one: trialChoice's rule).
 */
export function trialAnswer(assessment: Assessment, choice: TrialChoice, places: AnswerPlaces, unit = ''): TrialAnswer | null {
  const u = unit ? ` ${unit}` : '', pick = choice.pick, minus = places.minus ?? TRUE_MINUS;
  const value = (v: number, iv: readonly [number, number] | null) => valueAtPrecision(v, iv, minus), interval = (iv: readonly [number, number] | null) => intervalAtPrecision(iv, minus);
  if (pick) {
    const d = pick.difference;
    if (!d) return null;
    const j = pick.candidate.policyValue;
    return {
      headline: `Trial first: ${pick.candidate.name}.`,
      detail: `J ${valueInInterval(j.value, j.percentile, minus).text}${u}; `
        + `${value(Math.abs(d.difference.value), d.difference.percentile)}${u} ${assessment.valueSense === 'cost' ? 'lower' : 'higher'} than the ${policyLabel(assessment.comparison.baseline.name)} `
        + `(difference ${interval(d.difference.percentile)}; both ${shareText(assessment.settings.level)} intervals), better in ${shareText(d.probabilityBetter)} of resamples. `
        + `An offline estimate from the logs: a trial still goes through the site’s design review and commissioning, with the safety functions and interlocks left in place (cautions ${places.cautions}).`,
      logCautions: logCautionsText(pick, places.warnings),
    };
  }
  const best = choice.best;
  // Pointed to only where some warning bears on it: a best J held back by its interval alone has none to read (and the terminal then prints no list).
  const warned = best && best.serious + best.cautions + best.logSerious + best.logCautions > 0;
  return {
    headline: 'No candidate is named for a trial.',
    detail: best ? `The best J is ${best.candidate.name}’s (${value(best.candidate.policyValue.value, best.candidate.policyValue.percentile)}${u}), but ${best.reasons.join(', and ')}.${warned ? ` Read its warnings ${places.warnings} before any trial.` : ''}` : '',
    logCautions: null,
  };
}

/** The answer as data, for `--json`: what the text says, without the words a host places. */
export interface TrialJson {
  /** The candidate to trial first, or null when none qualifies. */
  readonly named: string | null;
  /** The candidate with the best J by its point estimate, and why it is not named (empty when it is). */
  readonly best: string | null;
  readonly reasons: readonly string[];
  /** The rule, as the text prints it under the answer. */
  readonly rule: string;
}

/** trialChoice for a JSON reader, so a script that reads `--json` need not rewrite the rule (and cannot drift from it). */
export function trialJson(assessment: Assessment): TrialJson {
  const choice = trialChoice(assessment);
  return { named: choice.pick?.candidate.name ?? null, best: choice.best?.candidate.name ?? null, reasons: choice.best?.reasons ?? [], rule: TRIAL_RULE };
}

/**
 * The warnings that bear on a candidate in the two groups the answer's lead and its table both say:
 * "about it" (its own and those in the whole-log list naming it) and "on the whole log" (naming no candidate).
 */
export function warningGroups(line: TrialLine): { serious: { aboutIt: number; general: number }; cautions: { aboutIt: number; general: number } } {
  return {
    serious: { aboutIt: line.serious + line.logSerious - line.generalSerious, general: line.generalSerious },
    cautions: { aboutIt: line.cautions + line.logCautions - line.generalCautions, general: line.generalCautions },
  };
}

/**
 * "1 serious, a caution about it; 3 cautions on the whole log" — the groups and words of the answer's lead
 * (logCautionsText), so the two count the same things; "none" only when no warning bears on the candidate.
 */
export function warningsText(line: TrialLine): string {
  const g = warningGroups(line);
  const count = (serious: number, cautions: number) => [serious ? `${serious} serious` : '', cautions ? (cautions === 1 ? 'a caution' : plural(cautions, 'caution')) : ''].filter(Boolean).join(', ');
  const about = count(g.serious.aboutIt, g.cautions.aboutIt), general = count(g.serious.general, g.cautions.general);
  if (!about && !general) return 'none';
  return [about ? `${about} about it` : '', general ? `${general} on the whole log` : ''].filter(Boolean).join('; ');
}

