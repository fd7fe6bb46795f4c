/**
 * A simulated log cut as the run-order finding advises (src/core/diagnostics/runOrderChangeWords.ts): the
 * change the finding leads with, located on the log itself as the check locates it (the limits as the
 * baseline reads them, repeated extremes, as bench/runOrderBattery.ts does); after a step, the runs from the
 * first run after it; after a drift, the latest share DRIFT_RECENT_SHARE of the runs; without a finding, all.
 * Episodes renumbered from 0, start states kept with their runs (core/bootstrap/episodeTransitions.ts).
 */
import { episodeTransitions, indexEpisodes } from '../src/core/bootstrap/episodeTransitions';
import { runOrderTrends } from '../src/core/diagnostics/runOrder';
import { shownTrends } from '../src/core/diagnostics/runOrderFinding';
import { DRIFT_RECENT_SHARE, RUN_ORDER_MIN_RUNS } from '../src/core/limits';
import { loggedActionLimits } from '../src/core/loggedActionLimits';
import type { TransitionSet } from '../src/core/transitions';

export interface KeptRuns {
  readonly data: TransitionSet;
  /** The first run kept (0-based, the log's own order) and the log's run count. */
  readonly from: number;
  readonly runs: number;
  /** What the cut follows: "step at run 125", "drift: the latest 83", or "no finding". */
  readonly why: string;
}

/** `driftShare`: the latest share kept after a drift (the words' DRIFT_RECENT_SHARE unless a bench asks another, to see the trade-off). */
export function keptRunsAfterChange(data: TransitionSet, driftShare = DRIFT_RECENT_SHARE): KeptRuns {
  const result = runOrderTrends({ ...data, actionLimits: loggedActionLimits(data.actions, data.count, data.actionDim) }, RUN_ORDER_MIN_RUNS);
  const lead = shownTrends(result)[0], runs = data.episodeCount;
  if (!lead?.change || 'reason' in result) return { data, from: 0, runs, why: 'no finding' };
  // Run positions are the log's episodes here: a simulated log has one episode per run, in order.
  const from = lead.change.kind === 'step' ? lead.change.run : runs - Math.max(1, Math.round(runs * driftShare));
  const why = lead.change.kind === 'step' ? `step at run ${from}` : `drift: the latest ${runs - from}`;
  const kept = Int32Array.from({ length: runs - from }, (_, k) => from + k);
  return { data: episodeTransitions(data, indexEpisodes(data), kept), from, runs, why };
}
