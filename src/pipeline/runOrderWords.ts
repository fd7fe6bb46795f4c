/**
 * The run-order check's one line for the app's coverage panel, the report and the command line (its
 * numbers from runOrderCheck.ts, its threshold from src/core/limits.ts). Kept apart from the check so
 * that the app's screens import the words without the regressions behind them.
 */
import { RUN_ORDER_ALPHA } from '../core/limits';
import type { RunOrderSummary } from './runOrderCheck';

/** One line, or null for an assessment made before the check. */
export function runOrderSentence(summary: RunOrderSummary | undefined): string | null {
  if (!summary) return null;
  const whole = summary.wholeLog?.sentence ? ` ${summary.wholeLog.sentence}` : '';
  if ('reason' in summary) return `Run order: not checked — ${summary.reason}.${whole}`;
  const skipped = summary.lawRunsSkipped + summary.modelRunsSkipped > 0
    ? `; runs too short or without spread skipped: ${summary.lawRunsSkipped} for the law, ${summary.modelRunsSkipped} for the plant model` : '';
  const changed = summary.changed.length;
  const verdict = changed === 0 ? 'no coefficient changed with run order' : `${changed} coefficient${changed === 1 ? '' : 's'} changed with run order (see the warning)`;
  return `Run order: the present controller’s law and the one-step plant model fitted per run, ${summary.runs.toLocaleString('en-US')} runs in the order they appear in the data; ${verdict} ` +
    `(${summary.coefficientsTested} coefficients tested, smallest corrected p ${summary.smallestCorrectedP.toPrecision(2)}; a change when it is at most ${RUN_ORDER_ALPHA}${skipped}).${whole}`;
}
