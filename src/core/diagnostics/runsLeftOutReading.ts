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
 *  - the coefficient the finding leads with (runOrderFinding.ts shownTrends) changed in a STEP at run
 *    position p (changeShape.ts) and every run kept lies at p or after → 'resolved': the runs kept decide;
 *  - otherwise (a drift, a change without a shape, or a step with runs kept before it) → 'stands': the
 *    whole log's finding is the finding, with the severity it has there.
 * No threshold of its own: RUN_ORDER_ALPHA and change38's step-or-drift rule decide.
 */
import { runNameText, type RunName } from '../runLabelText';
import type { CoefficientTrend, RunOrderResult } from './runOrder';
import { shownTrends } from './runOrderFinding';

export type RunsLeftOutReading =
  | { readonly kind: 'no-change' }
  | { readonly kind: 'resolved'; readonly lead: CoefficientTrend; readonly stepRun: number }
  | { readonly kind: 'stands'; readonly lead: CoefficientTrend; readonly why: 'spans-step' | 'drift' | 'no-shape' };

/** `keptAt(position)`: whether the whole log's run at that position (0-based, data order) is among the runs kept. */
export function readRunsLeftOut(whole: RunOrderResult, keptAt: (position: number) => boolean): RunsLeftOutReading {
  const lead = shownTrends(whole)[0];
  if ('reason' in whole || !lead) return { kind: 'no-change' };
  if (lead.change?.kind !== 'step') return { kind: 'stands', lead, why: lead.change ? 'drift' : 'no-shape' };
  const stepRun = lead.change.run;
  for (let q = 0; q < stepRun; q++) if (keptAt(q)) return { kind: 'stands', lead, why: 'spans-step' };
  return { kind: 'resolved', lead, stepRun };
}

/**
 * The one sentence on the reading (null for 'no-change'), for the warning and the check's line.
 * `runs`/`leftOut`: the whole log's runs and how many of them are left out; `runName`: a whole-log run position named.
 */
export function runsLeftOutSentence(reading: RunsLeftOutReading, runs: number, leftOut: number, runName: (position: number) => RunName): string | null {
  const read = `Read on the whole log (${runs.toLocaleString('en-US')} runs, the ${leftOut.toLocaleString('en-US')} left out by data.csv.excludedRuns included)`;
  if (reading.kind === 'no-change') return null;
  if (reading.kind === 'resolved') {
    return `${read}, the change at ${runNameText(runName(reading.stepRun))} lies before the runs kept, so the runs left out resolve it and the runs kept are checked on their own.`;
  }
  const why = reading.why === 'spans-step'
    ? `the runs kept still span the change (some lie before ${runNameText(runName((reading.lead.change as { run: number }).run))}), so their numbers describe a plant and controller between then and now`
    : 'the plant drifts through the runs kept too, so their numbers describe a plant between then and now, not today’s';
  return `${read}, leaving runs out does not remove the change: ${why}. The finding stands as on the whole log.`;
}
