/**
 * A cross-check that disagrees with fitted Q-evaluation (crossCheckVerdict.ts: beyond 3 paired
 * standard errors and 2 % of J, on a check that could see the gap) is a serious warning for its
 * candidate, one per disagreeing check, under one topic — the same fact as the headline
 * "Contradicted by …" (confirmationOf), so the answer (trialChoice.ts) names it once, as the
 * contradiction, and never again as "a serious warning".
 */
import type { AssessmentWarning, CrossCheck } from './assessment';

export const CROSS_CHECK_TOPIC = 'crossCheck';

/** The serious warnings of a candidate's disagreeing checks, in the checks' order. */
export function disagreementWarnings(checks: readonly CrossCheck[]): AssessmentWarning[] {
  return checks.filter((c) => c.agreement === 'disagrees').map((c) => ({ severity: 'serious', topic: CROSS_CHECK_TOPIC, message: `${c.label}: ${c.note}` }));
}
