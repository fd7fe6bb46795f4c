/**
 * The Findings answer as a rule over the assessment: which candidate, if any, to take to a plant
 * trial first. A candidate qualifies when (1) the percentile interval of its paired difference
 * against the baseline (the present controller's model, or the logged return without one) lies
 * wholly on the better side of 0, (2) the assessment raised no serious warning for it, nor for the log as a
 * whole (a finding such as the plant-memory check's bears on every candidate's J), and (3) no
 * cross-check contradicts it; of those, the one with the best J is named. The rule is ours; its
 * parts are the assessment's own verdicts (paired bootstrap interval, `severity.ts`,
 * `crossCheckVerdict.ts`), so the words on screen follow the thresholds the code applies.
 * The sentence in TRIAL_RULE states it to the reader.
 */
import type { Assessment, CandidateAssessment, PairedDifference } from '../../../../pipeline/assessment';

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
  const cautions = candidate.warnings.length - serious;
  const reasons: string[] = [];
  if (!difference?.difference.percentile) reasons.push('its difference from the baseline has no interval');
  else if (!clearlyBetter) reasons.push('the interval of its difference from the baseline reaches 0 or the worse side');
  if (serious > 0) reasons.push(`the assessment raised ${serious === 1 ? 'a serious warning' : `${serious} serious warnings`} for it`);
  const whole = assessment.warnings.filter((w) => w.severity === 'serious').length;
  if (whole > 0) reasons.push(`the assessment raised ${whole === 1 ? 'a serious warning' : `${whole} serious warnings`} for the whole log`);
  if (candidate.confirmation.status === 'contradicted') reasons.push('a cross-check contradicts it');
  return { candidate, difference, clearlyBetter, serious, cautions, reasons };
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
 * The cautions on the log as a whole (the present controller's dithers moving together, extrapolated
 * surfaces, unconfirmed estimates), said beside a named trial: they do not stop one (only a serious
 * warning does, TRIAL_RULE), but the answer read alone said nothing of them. Null when there are none.
 */
export function logCautionsText(assessment: Assessment): string | null {
  const cautions = assessment.warnings.filter((w) => w.severity === 'caution').length;
  if (cautions === 0) return null;
  return `The assessment raised ${cautions === 1 ? 'a caution' : `${cautions} cautions`} on the whole log; read ${cautions === 1 ? 'it' : 'them'} under Coverage before the trial.`;
}
