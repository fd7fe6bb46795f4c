/**
 * One severity rule, one text: the thresholds that make a coverage diagnostic a "caution" or
 * "serious", and the sentences that state them. The pipeline, the command line, the app and the
 * report all take both from here, so the words a user reads are generated from the numbers the
 * code applies.
 *
 * Calibrated occupancy shift s = νᵀΣ⁻¹ν (occupancyShift.ts; 1 = like the logs). Why 4 and 10:
 *   - The estimation error of linear fitted Q-evaluation is bounded by a term proportional to √s
 *     (Duan, Jia & Wang, ICML 2020, upper bound): the logs inform the candidate as n/s transitions would
 *     inform the logged controller. 1/s is exactly the Kish effective share of the occupancy ratio
 *     projected on the features (occupancyShift.ts), the quantity the importance-weight rule below
 *     reads for the raw weights.
 *   - The same √s multiplies the approximation (misspecification) error of the feature class in
 *     that bound — the part of the error the bootstrap over episodes does not see. So s also says
 *     how far a small lack of fit on the logged states is amplified for this candidate.
 *   - Caution above 4: the bound is twice the logged controller's (effective share below 25 %).
 *     Serious above 10: more than 3.2 times, effective share below 10 % — the estimate then rests
 *     mainly on extrapolation of the fitted Q. Both limits are our choice, stated in the report.
 *   - Margin for the estimate's own error: on the linear-quadratic battery
 *     (test/core/diagnostics/occupancyShift.test.ts) the estimate is within 10 % of the exact
 *     occupancy shift, so a candidate whose exact shift is below 2 reads at most 2.2 (no flag) and
 *     one above 20 reads at least 18 (serious): a factor of about 2 on either side of the limits.
 *
 * Importance weights: Kish effective size at the effective horizon below 10 % of the episodes
 * reaching it is a caution, below 1 % serious (a common rule of thumb in importance sampling; Owen,
 * "Monte Carlo theory, methods and examples", 2013, ch. 9; section from memory). Action support: a mean share of the
 * candidate's action probability outside the logged actions above 10 % is a caution, above 25 %
 * serious (our rule; the logged controller's own share is shown beside it for scale). Start states
 * given in the project outside the logs (startCoverage.ts): more than 2 % of them a caution (above
 * the rule's own false alarms, below 0.35 % in 999 logs of 1000), more than 25 % serious (a quarter
 * of J then rests on extrapolated values; our rule).
 */

import { DEFAULT_START_COVERAGE } from './startCoverage';
import { effectiveRunsNumber, effectiveRunsText } from '../offPolicy/effectiveRunsText';
import { shareText, sharesText } from '../shareText';
import { shiftText } from './shiftText';
import { HORIZON_FORMULA } from '../formulaText';

export type SeverityLevel = 'caution' | 'serious';

/**
 * The upper percentile shown beside a coverage diagnostic's central value: the occupancy shift over
 * resamples (right-skewed) and the action probability outside the logged range over query states.
 */
export const UPPER_PERCENTILE = 90;

/** The UPPER_PERCENTILE-th of sorted values (the value at ⌊p·n⌋, the last at most). */
export function upperPercentile(sorted: ArrayLike<number>): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((UPPER_PERCENTILE / 100) * sorted.length))];
}

/** Structurally the pipeline's AssessmentWarning: a stable topic key and the sentence a reviewer reads. */
export interface SeverityFinding {
  readonly severity: SeverityLevel;
  readonly topic: string;
  readonly message: string;
}

/** Flagged above these values. */
export const OCCUPANCY_SHIFT_LIMITS = { caution: 4, serious: 10 } as const;
/** Flagged below these shares. */
export const EFFECTIVE_SHARE_LIMITS = { caution: 0.1, serious: 0.01 } as const;
/** Flagged above these shares. */
export const ACTION_SUPPORT_LIMITS = { caution: 0.1, serious: 0.25 } as const;
/** Flagged above these shares of the given start states. */
export const START_OUTSIDE_LIMITS = { caution: 0.02, serious: 0.25 } as const;

interface Limits { readonly caution: number; readonly serious: number }

/**
 * Severity of a value that is worse when larger; null at or below the caution limit. A value that
 * could not be computed (NaN) gives null: the caller reports the failure itself, never as a level.
 */
export function severityAbove(value: number, limits: Limits): SeverityLevel | null {
  if (!(value > limits.caution)) return null;
  return value > limits.serious ? 'serious' : 'caution';
}

/** Severity of a value that is worse when smaller; null at or above the caution limit (and for NaN). */
export function severityBelow(value: number, limits: Limits): SeverityLevel | null {
  if (!(value < limits.caution)) return null;
  return value < limits.serious ? 'serious' : 'caution';
}

/** `digits` places below 10,000; whole numbers from there (toPrecision would write "3.62e+4" for a shift of 36,180). */
const fixed = (v: number, digits: number): string => (Math.abs(v) >= 1e4 ? Math.round(v).toFixed(0) : v.toFixed(digits));
/** A threshold share, by the one share writer (core/shareText.ts): exact, so "10 %" beside "1 %", never "1.0 %". */
const percent = shareText;

/** The rule in words, for the method section, glossary and help. */
export function occupancyShiftRuleText(): string {
  const { caution, serious } = OCCUPANCY_SHIFT_LIMITS;
  return `Occupancy shift: how far the states and actions the candidate would visit (discounted, from the start states) lie from the logged ones, ` +
    `in the fitted model’s own terms; 1 means like the logs. The error of the estimate grows with its square root, as if the log held 1/shift of its data. ` +
    `It is read against the present controller’s own shift (at least 1; above 1 when the runs start away from where they spend their time): ` +
    `caution above ${caution} times that level (error twice the present controller’s), serious above ${serious} times (more than ${fixed(Math.sqrt(serious), 1)} times) — our rule.`;
}

/** The level a shift is read against: the present controller's own shift, at least 1 (1 without it). */
export function shiftReference(presentControllerShift: number | null): number {
  return presentControllerShift !== null && presentControllerShift > 1 ? presentControllerShift : 1;
}

/** The severity of a shift against the present controller's own level (null: supported). */
export function occupancyShiftSeverity(shift: number, presentControllerShift: number | null): SeverityLevel | null {
  return severityAbove(shift / shiftReference(presentControllerShift), OCCUPANCY_SHIFT_LIMITS);
}

/** The finding for one candidate, or null below the caution limit. loggedShift: the present controller's own value, for scale. */
export function occupancyShiftFinding(shift: number, loggedShift: number | null): SeverityFinding | null {
  const severity = occupancyShiftSeverity(shift, loggedShift);
  if (!severity) return null;
  const reference = shiftReference(loggedShift), ratio = shift / reference;
  const own = loggedShift === null ? '' : ` (the present controller: ${shiftText(loggedShift)})`;
  const limit = (severity === 'serious' ? OCCUPANCY_SHIFT_LIMITS.serious : OCCUPANCY_SHIFT_LIMITS.caution) * reference;
  return {
    severity, topic: 'occupancyShift',
    message: `Occupancy shift ${shiftText(shift)}${own}, above the ${severity} limit ${fixed(limit, limit < 100 ? 1 : 0)}: the candidate would spend its time where the logs are thin, ` +
      `so its estimate carries about ${fixed(Math.sqrt(ratio), 1)} times the error of the present controller’s and leans on extrapolating the fitted model.`,
  };
}

export function effectiveShareRuleText(): string {
  const { caution, serious } = EFFECTIVE_SHARE_LIMITS;
  return `Importance weights: the Kish effective number of runs at the effective horizon ${HORIZON_FORMULA}, as a share of the runs reaching it; ` +
    `caution below ${percent(caution)}, serious below ${percent(serious)} (a common rule of thumb).`;
}

export function effectiveShareFinding(effectiveEpisodes: number, episodes: number, step: number, notNumbers = 0): SeverityFinding | null {
  // Weights that are not numbers carry no usable weight: the size is read as 0 (which Kish's formula gives with a NaN among them).
  if (notNumbers > 0) effectiveEpisodes = 0;
  const severity = episodes > 0 ? severityBelow(effectiveEpisodes / episodes, EFFECTIVE_SHARE_LIMITS) : null;
  if (!severity) return null;
  return {
    severity, topic: 'importanceWeights',
    message: `Importance weights at step ${step}: ${effectiveEpisodes >= 1 ? `effective size ${effectiveRunsNumber(effectiveEpisodes)} of ${episodes} runs` : `${effectiveRunsText(effectiveEpisodes, notNumbers)} from ${episodes} runs`} ` +
      `(below ${percent(severity === 'serious' ? EFFECTIVE_SHARE_LIMITS.serious : EFFECTIVE_SHARE_LIMITS.caution)}): ` +
      // With no weight at all the checks are not applied (crossCheckVerdict: "not applicable"), so "a few runs" would contradict them.
      (effectiveEpisodes >= 1 ? 'the importance-sampling cross-checks rest on a few runs.'
        : effectiveEpisodes > 0 ? 'the importance-sampling cross-checks rest on less than one run.'
          : 'no logged run speaks for the candidate there, so the importance-sampling cross-checks cannot be applied.'),
  };
}

export function actionSupportRuleText(): string {
  const { caution, serious } = ACTION_SUPPORT_LIMITS;
  return `Action support: the mean share of the candidate’s action probability outside the actions logged near each state; ` +
    `caution above ${percent(caution)}, serious above ${percent(serious)} (our rule; the present controller’s own share is shown for scale).`;
}

export function actionSupportFinding(meanOutside: number, neighbours: number, loggedMeanOutside: number | null): SeverityFinding | null {
  const severity = severityAbove(meanOutside, ACTION_SUPPORT_LIMITS);
  if (!severity) return null;
  // The candidate's share and the present controller's are compared in one sentence: one precision (sharesText).
  const [mean, logged] = sharesText([meanOutside, loggedMeanOutside]);
  const own = loggedMeanOutside === null ? '' : ` (the present controller itself: ${logged})`;
  return {
    severity, topic: 'actionSupport',
    message: `On average ${mean} of the candidate’s action probability lies outside the actions logged at the ${neighbours} nearest logged states${own}: ` +
      'there Q is extrapolated to actions the logs do not hold.',
  };
}

export function startCoverageRuleText(): string {
  const { neighbours: k, calibrationStates: q } = DEFAULT_START_COVERAGE;
  return `Start states given in the project: each is scored by its distance to its ${k}th nearest logged state (states scaled by their standard deviations) ` +
    `and is outside the logs when that distance exceeds the largest among ${q} logged states scored against the other runs, a rule that flags a start drawn like the logged ones ` +
    `at most 1 in ${q + 1} times on average; more than ${percent(START_OUTSIDE_LIMITS.caution)} of the starts outside is a caution, more than ${percent(START_OUTSIDE_LIMITS.serious)} serious (our rule).`;
}

export function startCoverageFinding(outside: number, starts: number): SeverityFinding | null {
  const severity = starts > 0 ? severityAbove(outside / starts, START_OUTSIDE_LIMITS) : null;
  if (!severity) return null;
  return {
    severity, topic: 'startCoverage',
    message: `${outside} of the ${starts} start states given in the project lie outside the logged states: V there is the fitted Q extrapolated, ` +
      'where the function classes can agree and all be wrong, and the cross-checks, which rest on the logged runs, cannot confirm it. Give start states within the logs, or read J over them as an extrapolation.',
  };
}
