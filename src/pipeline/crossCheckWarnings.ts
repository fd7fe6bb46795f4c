/**
 * A cross-check that disagrees with fitted Q-evaluation (crossCheckVerdict.ts: beyond 3 paired
 * standard errors and 2 % of J, on a check that could see the gap) is a serious warning for its
 * candidate, one per disagreeing check, under one topic — the same fact as the headline
 * "Contradicted by …" (confirmationOf), so the answer (trialChoice.ts) names it once, as the
 * contradiction, and never again as "a serious warning".
 *
 * The same verdict on the present controller's own J — the baseline every difference and the
 * ranking are taken against — is a serious warning on the whole log (no candidate named), in the
 * verdict's own words, so the answer names no candidate for a trial (TRIAL_RULE). Adopted by the rule
 * written before measuring (test/battery/README.md, "A contradicted baseline"): on the hold-out
 * command-line rows it never fired, so it stands on the principle that a candidate's contradiction
 * already follows, not on evidence that it catches a wrong baseline.
 */
import type { AssessmentWarning, CrossCheck, PresentControllerAssessment } from './assessment';
import { policyLabel } from './policyNames';

export const CROSS_CHECK_TOPIC = 'crossCheck';
export const BASELINE_CONTRADICTED_TOPIC = 'baselineContradicted';
export const BASELINE_UNCONFIRMED_TOPIC = 'baselineUnconfirmed';

/** The serious warnings of a candidate's disagreeing checks, in the checks' order. */
export function disagreementWarnings(checks: readonly CrossCheck[]): AssessmentWarning[] {
  return checks.filter((c) => c.agreement === 'disagrees').map((c) => ({ severity: 'serious', topic: CROSS_CHECK_TOPIC, message: `${c.label}: ${c.note}` }));
}

/**
 * The whole-log warning of the present controller's confirmation: serious where a check contradicts its
 * J, a caution where nothing in the logs can confirm it (as an unconfirmed candidate's is,
 * assessAssembly.ts globalWarnings) — on the hold-out rows the baselines that missed their truth by
 * 3–19 % were all unconfirmed, and said so only in the cross-checks list; none where it is confirmed.
 * Each in the confirmation's own text, and that every difference is taken against this J.
 */
export function baselineConfirmationWarnings(present: Pick<PresentControllerAssessment, 'name' | 'confirmation'> | null): AssessmentWarning[] {
  if (!present || present.confirmation.status === 'confirmed') return [];
  const label = policyLabel(present.name), contradicted = present.confirmation.status === 'contradicted';
  return [{
    severity: contradicted ? 'serious' : 'caution', topic: contradicted ? BASELINE_CONTRADICTED_TOPIC : BASELINE_UNCONFIRMED_TOPIC,
    message: `${label.charAt(0).toUpperCase()}${label.slice(1)}: ${present.confirmation.text} Every difference from the baseline is taken against this J.`,
  }];
}
