/**
 * The held-actions check on a project's log (src/core/diagnostics/heldActions.ts), once per project, not per
 * candidate: rows whose action repeats the row before exactly, away from the actuator limits, and how far they
 * pull the present controller's fitted law. Its rule and words come from
 * src/core/diagnostics/heldActionsFinding.ts; its numbers go to the assessment as `heldActions`.
 */
import { heldActionEffect, heldRowMask, heldStretches, type ActionLimits, type HeldActionData } from '../core/diagnostics/heldActions';
import { heldActionsFinding, heldSeverity } from '../core/diagnostics/heldActionsFinding';
import { loggedActionLimits } from '../core/loggedActionLimits';
import type { AssessmentWarning } from './assessment';

/** The check's numbers (plain JSON): held rows, maximal stretches, their share of the rows, the longest, the effect E and the rule's severity. */
export type HeldActionsSummary =
  | { readonly rows: number; readonly stretches: number; readonly share: number; readonly longest: number; readonly effect: number | null; readonly severity: 'caution' | 'serious' | null }
  | { readonly reason: string };

/**
 * `limits`: the actuator limits the baseline read from the log (its fitted model's, core/behaviourModel.ts, with the
 * candidates' declared bounds); read from the log alone where there is no fitted baseline.
 */
export function heldActionsAssessment(data: HeldActionData, limits?: ActionLimits): { summary: HeldActionsSummary; warnings: AssessmentWarning[] } {
  if (data.count < 2 || data.actionDim < 1) return { summary: { reason: 'the log has fewer than two transitions' }, warnings: [] };
  const read = limits ?? loggedActionLimits(data.actions, data.count, data.actionDim);
  const held = heldRowMask(data, read), stretches = heldStretches(held), effect = heldActionEffect(data, read, held);
  const finding = heldActionsFinding(stretches, effect);
  return {
    summary: { ...stretches, effect: 'reason' in effect ? null : effect.effect, severity: heldSeverity(stretches, effect) },
    warnings: finding ? [finding] : [],
  };
}
