/**
 * The reason given for a time window or a range of runs left out is a note, not data: it changes
 * no row, run or number, so an import is never redone for it (shared/runKey.ts blanks it in the
 * keys). What an import printed of it — each window's and range's `reason` and the import report's
 * sentences about them — is written again here from the current document, so the Plant log, the
 * report and `--json` say the reason the user wrote last, never the one of the last import. The
 * sentences are rebuilt whole from the current reasons and put where the import recorded them
 * (`leftOutLines`), never found by their old words, so no old reason can survive a failed search.
 *
 * An import succeeds only when every window and range was read (importDataset.ts stops at the
 * first problem of any), so the i-th window or range of an import is the document's i-th.
 */
import type { ColumnRoles, CsvSettings } from '../project/schema';
import { runRangeReport, type LeftOutRuns } from './runRanges';
import { windowReport, type LeftOutWindow, type LogClock } from './timeWindows';

/** Where an import's report holds its sentences on what was left out: from `start`, `count` of them (leftOutReport's). */
export interface LeftOutLines {
  readonly start: number;
  readonly count: number;
}

/** The parts of an import (ImportedDataset, or the app's DataImport) that say the reasons. */
export interface LeftOutNotes {
  readonly timeWindows: readonly LeftOutWindow[];
  readonly runsLeftOut: readonly LeftOutRuns[];
  readonly episodeReport: readonly string[];
  readonly leftOutLines: LeftOutLines;
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
 * The import with the current document's reasons (`csv`): each range's and window's reason, and the
 * report's sentences on what was left out written afresh from them in the place the import gave
 * them (`leftOutLines`), whatever those lines said before; the same object where nothing changed.
 */
export function withCurrentReasons<T extends LeftOutNotes>(imported: T, csv: CsvSettings, episode: ColumnRoles['episode']): T {
  const runsLeftOut = imported.runsLeftOut.map((r, i) => ({ ...r, reason: csv.excludedRuns?.[i]?.reason ?? r.reason }));
  const timeWindows = imported.timeWindows.map((w, i) => ({ ...w, reason: csv.excludedTimes?.[i]?.reason ?? w.reason }));
  const sentences = leftOutReport(runsLeftOut, timeWindows, imported.clock, episode);
  const { start, count } = imported.leftOutLines;
  const said = imported.episodeReport.slice(start, start + count);
  const same = <R extends { reason: string }>(now: readonly R[], was: readonly R[]): boolean => now.every((x, i) => x.reason === was[i].reason);
  if (same(runsLeftOut, imported.runsLeftOut) && same(timeWindows, imported.timeWindows) && sentences.length === count && sentences.every((x, k) => x === said[k])) {
    return imported;
  }
  const episodeReport = [...imported.episodeReport.slice(0, start), ...sentences, ...imported.episodeReport.slice(start + count)];
  return { ...imported, runsLeftOut, timeWindows, episodeReport, leftOutLines: { start, count: sentences.length } } as T;
}
