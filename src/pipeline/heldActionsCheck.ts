/**
 * The held-actions check on a project's log (src/core/diagnostics/heldActions.ts), once per project, not per
 * candidate: rows whose action repeats the row before exactly, away from the actuator limits, and how far they
 * pull the present controller's fitted law. Read in the plan, before that law is fitted: where the rule says the
 * held rows pull it (heldLawRepaired), the law is fitted on the rows not held (plan/presentController.ts). Its rule
 * and words come from src/core/diagnostics/heldActionsFinding.ts; its numbers go to the assessment as `heldActions`.
 */
import { heldActionEffect, heldRowMask, heldStretches, type ActionLimits, type HeldActionData, type HeldEffect, type HeldStretches } from '../core/diagnostics/heldActions';
import { heldActionsFinding, heldLawRepaired, heldSeverity, type HeldRuns } from '../core/diagnostics/heldActionsFinding';
import type { AssessmentWarning } from './assessment';

/** The check's reading of a log: the held-row mask (n), its counts, the effect, and the runs with a held row. */
export type HeldActionsRead =
  | { readonly held: Uint8Array; readonly stretches: HeldStretches; readonly effect: HeldEffect; readonly runs: HeldRuns }
  | { readonly reason: string };

/** Where the present controller's law was fitted: on every row, or on the rows not held (and how many rows that was). */
export interface HeldLawFit {
  readonly lawFittedOn: 'everyRow' | 'movingRows';
  readonly rowsUsed: number | null;
  /** Why the fit on the rows not held failed where the rule called for it (then the fit on every row stands). */
  readonly repairFailed?: string;
}

/** The check's numbers (plain JSON): held rows, maximal stretches, their share of the rows, the longest, the effect E, the rule's severity and where the law was fitted. */
export type HeldActionsSummary =
  | ({ readonly rows: number; readonly stretches: number; readonly share: number; readonly longest: number; readonly effect: number | null; readonly severity: 'caution' | 'serious' | null } & HeldLawFit)
  | { readonly reason: string };

/** `limits`: the actuator limits the baseline reads from the log (loggedActionLimits.ts, with the candidates' declared bounds) and the logged extremes. */
export function readHeldActions(data: HeldActionData, limits: ActionLimits): HeldActionsRead {
  if (data.count < 2 || data.actionDim < 1) return { reason: 'the log has fewer than two transitions' };
  const held = heldRowMask(data, limits);
  return { held, stretches: heldStretches(held), effect: heldActionEffect(data, limits, held), runs: heldRuns(data.episode, held) };
}

/** Whether the read calls for the present controller's law to be fitted on the rows not held (the rule: heldActionsFinding.ts). */
export function repairsLaw(read: HeldActionsRead): boolean {
  return !('reason' in read) && heldLawRepaired(read.stretches, read.effect);
}

export function heldActionsAssessment(read: HeldActionsRead, fit: HeldLawFit): { summary: HeldActionsSummary; warnings: AssessmentWarning[] } {
  if ('reason' in read) return { summary: { reason: read.reason }, warnings: [] };
  const { stretches, effect, runs } = read, repaired = fit.lawFittedOn === 'movingRows' && fit.rowsUsed !== null ? { rowsUsed: fit.rowsUsed, runs } : null;
  const finding = heldActionsFinding(stretches, effect, repaired, fit.repairFailed ?? '');
  return {
    summary: { ...stretches, effect: 'reason' in effect ? null : effect.effect, severity: heldSeverity(stretches, effect), ...fit },
    warnings: finding ? [finding] : [],
  };
}

/** Runs (distinct episode labels) and how many hold at least one held row. */
function heldRuns(episode: ArrayLike<number>, held: Uint8Array): HeldRuns {
  const all = new Set<number>(), withHeld = new Set<number>();
  for (let i = 0; i < held.length; i++) {
    all.add(episode[i]);
    if (held[i]) withHeld.add(episode[i]);
  }
  return { withHeld: withHeld.size, total: all.size };
}

/** The held rows the present controller's law was fitted without: the read's held rows where the repair applied, 0 otherwise (the evaluation's model and the import summary say it). */
export function heldRowsLeftOut(read: HeldActionsRead, fit: HeldLawFit): number {
  return fit.lawFittedOn === 'movingRows' && !('reason' in read) ? read.stretches.rows : 0;
}

/** Whether the present controller's law was fitted on the rows not held (then the logged return is no check of it). */
export function lawFittedOnMovingRows(summary: HeldActionsSummary | undefined): boolean {
  return !!summary && 'lawFittedOn' in summary && summary.lawFittedOn === 'movingRows';
}
