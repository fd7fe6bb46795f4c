/**
 * The reason given for a time window or a range of runs left out is a note, not data: it changes
 * no row, run or number, so an import is never redone for it (shared/runKey.ts blanks it in the
 * keys). What an import printed of it — each window's and range's `reason` and the import report's
 * sentences about them — is written again here from the current document, so the Plant log, the
 * report and `--json` say the reason the user wrote last, never the one of the last import.
 *
 * An import succeeds only when every window and range was read (importDataset.ts stops at the
 * first problem of any), so the i-th window or range of an import is the document's i-th.
 */
import type { ColumnRoles, CsvSettings } from '../project/schema';
import { runRangeReport, type LeftOutRuns } from './runRanges';
import { windowReport, type LeftOutWindow, type LogClock } from './timeWindows';

/** The parts of an import (ImportedDataset, or the app's DataImport) that say the reasons. */
export interface LeftOutNotes {
  readonly timeWindows: readonly LeftOutWindow[];
  readonly runsLeftOut: readonly LeftOutRuns[];
  readonly episodeReport: readonly string[];
  readonly clock?: LogClock;
}

const NO_CLOCK = { calendar: false, runRestarts: 0 };

/** The import report's sentences on the runs and the time windows left out, in that order. */
export function leftOutReport(
  runs: readonly LeftOutRuns[], windows: readonly LeftOutWindow[], clock: Pick<LogClock, 'calendar' | 'runRestarts'> | undefined, episode: ColumnRoles['episode'],
): string[] {
  return [...runRangeReport(runs, episode.kind === 'column' ? episode.column : undefined), ...windowReport(windows, clock ?? NO_CLOCK)];
}

/**
 * The import with the current document's reasons (`csv`), its report's sentences on what was left
 * out written again; the same object where no reason changed.
 */
export function withCurrentReasons<T extends LeftOutNotes>(imported: T, csv: CsvSettings, episode: ColumnRoles['episode']): T {
  const reasonOf = (given: readonly { reason: string }[] | undefined, i: number, was: string): string => given?.[i]?.reason ?? was;
  const runsLeftOut = imported.runsLeftOut.map((r, i) => ({ ...r, reason: reasonOf(csv.excludedRuns, i, r.reason) }));
  const timeWindows = imported.timeWindows.map((w, i) => ({ ...w, reason: reasonOf(csv.excludedTimes, i, w.reason) }));
  if (runsLeftOut.every((r, i) => r.reason === imported.runsLeftOut[i].reason) && timeWindows.every((w, i) => w.reason === imported.timeWindows[i].reason)) {
    return imported;
  }
  const before = leftOutReport(imported.runsLeftOut, imported.timeWindows, imported.clock, episode);
  const after = leftOutReport(runsLeftOut, timeWindows, imported.clock, episode);
  const at = imported.episodeReport.indexOf(before[0]);
  const episodeReport = at < 0 ? [...imported.episodeReport] : [...imported.episodeReport.slice(0, at), ...after, ...imported.episodeReport.slice(at + before.length)];
  return { ...imported, runsLeftOut, timeWindows, episodeReport } as T;
}
