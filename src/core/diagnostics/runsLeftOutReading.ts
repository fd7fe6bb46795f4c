/**
 * Do the runs a project leaves out (data.csv.excludedRuns) remove the change the run-order check finds
 * on the whole log? The runs kept cannot tell alone: a log cut from a plant that wore steadily is
 * shorter, so its own trend is weaker and may not pass the threshold, while the plant still drifts
 * through it (found on a test pump: the latest third read only a caution, and 6 of 9 candidate rows
 * were confident and wrong).
 *
 * The rule (written before measuring, /work/notes/memory38-rule.md): on the whole log, runs left out
 * included and in data order,
 *  - no coefficient changed → 'no-change': the runs kept decide by their own check;
 *  - the coefficient the finding leads with (runOrderFinding.ts shownTrends) changed in a CLEAR step at run
 *    position p (changeShape.ts, CLEAR_STEP_SHARE), every run kept lies at p or after, and every other
 *    coefficient the finding shows also changed in a step located before the first run kept → 'resolved':
 *    the runs kept decide;
 *  - otherwise (a drift in any shown coefficient — a setpoint moved while a pump wore —, a step not clear
 *    enough to cut at, a change without a shape, or a step with runs kept before it) → 'stands': the whole
 *    log's finding is the finding, with the severity it has there.
 * No threshold of its own: RUN_ORDER_ALPHA, change38's step-or-drift rule and its clear share decide (the
 * clear step and the other coefficients after review39: a noisy drift often fits a step a little better than
 * a line, /work/notes/clearstep38-rule.md).
 */
import { runNameText, type RunName } from '../runLabelText';
import type { CoefficientTrend, RunOrderResult } from './runOrder';
import { shownTrends } from './runOrderFinding';

export type RunsLeftOutReading =
  | { readonly kind: 'no-change' }
  | { readonly kind: 'resolved'; readonly lead: CoefficientTrend; readonly stepRun: number }
  | { readonly kind: 'stands'; readonly lead: CoefficientTrend; readonly why: 'spans-step' | 'before-step' | 'drift' | 'unclear' | 'no-shape' };

/** `keptAt(position)`: whether the whole log's run at that position (0-based, data order) is among the runs kept. */
export function readRunsLeftOut(whole: RunOrderResult, keptAt: (position: number) => boolean): RunsLeftOutReading {
  const shown = shownTrends(whole), lead = shown[0];
  if ('reason' in whole || !lead) return { kind: 'no-change' };
  if (!lead.change) return { kind: 'stands', lead, why: 'no-shape' };
  if (shown.some((t) => t.change?.kind === 'drift')) return { kind: 'stands', lead, why: 'drift' };
  if (!lead.change.clear) return { kind: 'stands', lead, why: 'unclear' };
  const stepRun = lead.change.run, firstKept = firstKeptAt(whole.runs, keptAt);
  if (firstKept < stepRun) return { kind: 'stands', lead, why: firstKept < 0 || lastKeptBelow(stepRun, whole.runs, keptAt) ? 'before-step' : 'spans-step' };
  if (shown.some((t) => !t.change || t.change.run > firstKept)) return { kind: 'stands', lead, why: 'spans-step' };
  return { kind: 'resolved', lead, stepRun };
}

function firstKeptAt(runs: number, keptAt: (position: number) => boolean): number {
  for (let q = 0; q < runs; q++) if (keptAt(q)) return q;
  return -1;
}

/** Whether every run kept lies before position p (the runs left out are those after the change). */
function lastKeptBelow(p: number, runs: number, keptAt: (position: number) => boolean): boolean {
  for (let q = p; q < runs; q++) if (keptAt(q)) return false;
  return true;
}

/**
 * The one sentence on the reading (null for 'no-change'), for the warning and the check's line.
 * `runs`: the whole log's runs as the check counts them; `runName`: a whole-log run position named. The runs left
 * out are not counted here: a label split by a time gap is two runs to the check and one to the import report
 * (review39), which gives their count.
 */
export function runsLeftOutSentence(reading: RunsLeftOutReading, runs: number, runName: (position: number) => RunName): string | null {
  const read = `Read on the whole log (${runs.toLocaleString('en-US')} runs, those left out by data.csv.excludedRuns included)`;
  if (reading.kind === 'no-change') return null;
  if (reading.kind === 'resolved') {
    return `${read}, the change at ${runNameText(runName(reading.stepRun))} lies before the runs kept, so the runs left out resolve it and the runs kept are checked on their own.`;
  }
  const at = reading.lead.change ? runNameText(runName(reading.lead.change.run)) : '';
  const why = {
    'spans-step': `the runs kept still span the change (some lie before ${at}), so their numbers describe a plant and controller between then and now`,
    'before-step': `every run kept lies before the change at ${at}, so their numbers describe the plant and controller as they were before it, not today’s`,
    drift: 'something the finding shows drifts steadily, through the runs kept too, so their numbers describe a plant between then and now, not today’s',
    unclear: `the change looks more like one step (at ${at}) than a steady drift, but not clearly enough to cut the log at, so the runs kept may still drift`,
    'no-shape': 'where the change lies could not be read',
  }[reading.why];
  return `${read}, leaving runs out does not remove the change: ${why}. The finding stands as on the whole log.`;
}
