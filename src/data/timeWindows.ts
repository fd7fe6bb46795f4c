/**
 * Time windows the project leaves out of the import (data.csv.excludedTimes): a start-up, a plant
 * test, a period under another controller. Each window's ends are written like the timestamp
 * column's cells (a number of seconds, or a date and time in the file's forms and day/month order,
 * timestampCell.ts) and are included. A row whose timestamp falls in a window is left out with
 * that window's reason: counted per window and listed, never dropped silently; the run it was in
 * is cut there, so the rows before and after become two runs (episodes.ts).
 *
 * A window stops the import with a problem naming its field when it cannot be read, ends before
 * it starts, lies wholly outside the log, or overlaps another window; and every window needs a
 * timestamp column.
 */
import type { ExcludedTime } from '../project/schema';
import { clockText, durationText, isCalendarClock } from '../core/clockText';
import type { DateOrder } from './dateOrder';
import { importProblem, type ImportProblem } from './importProblem';
import { plural } from './reportFormat';
import { readTimestamp, TIMESTAMP_FORMS } from './timestampCell';

export interface TimeWindow {
  readonly fromSeconds: number;
  readonly toSeconds: number;
  readonly reason: string;
}

/** A window with the rows it left out, for the import report. */
export interface LeftOutWindow extends TimeWindow {
  readonly rows: number;
}

/** The log's clock: its first and last readable timestamp, in seconds, and whether they are dates. */
export interface LogClock {
  readonly firstSeconds: number;
  readonly lastSeconds: number;
  readonly calendar: boolean;
}

/** The first and last readable timestamp. seconds: records, NaN where unreadable. */
export function logClock(seconds: Float64Array): LogClock | undefined {
  let first = Infinity, last = -Infinity;
  for (const t of seconds) {
    if (t < first) first = t;
    if (t > last) last = t;
  }
  return first <= last ? { firstSeconds: first, lastSeconds: last, calendar: isCalendarClock(first) } : undefined;
}

const fieldOf = (i: number, end?: 'from' | 'to') => ['data', 'csv', 'excludedTimes', i, ...(end ? [end] : [])];
const whereOf = (i: number, end?: 'from' | 'to') => `data.csv.excludedTimes[${i}]${end ? `.${end}` : ''}`;

function windowProblem(i: number, message: string, end?: 'from' | 'to'): ImportProblem {
  return { ...importProblem('bad-time-window', whereOf(i, end), message), field: fieldOf(i, end) };
}

function secondsOf(value: number | string, order: DateOrder): number {
  if (typeof value === 'number') return value;
  const reading = readTimestamp(value, '.');
  return reading ? reading[order] : NaN;
}

const label = (w: ExcludedTime | TimeWindow, i: number) => (w.reason ? `“${w.reason}”` : `${i + 1}`);

/** The windows in seconds on the timestamp column's clock, or the problems that stop the import. */
export function readTimeWindows(
  windows: readonly ExcludedTime[], timestampColumn: string | undefined, order: DateOrder, clock: LogClock | undefined,
): { windows: TimeWindow[]; problems: ImportProblem[] } {
  if (windows.length === 0) return { windows: [], problems: [] };
  if (timestampColumn === undefined || clock === undefined) {
    return { windows: [], problems: [windowProblem(0, 'a time window left out needs a timestamp column: give a column the role “Timestamp”, or remove the window')] };
  }
  const problems: ImportProblem[] = [], read: (TimeWindow & { index: number })[] = [];
  const range = `the log runs from ${clockText(clock.firstSeconds, clock.calendar)} to ${clockText(clock.lastSeconds, clock.calendar)}`;
  windows.forEach((w, i) => {
    const from = secondsOf(w.from, order), to = secondsOf(w.to, order);
    for (const [end, value, seconds] of [['from', w.from, from], ['to', w.to, to]] as const) {
      if (Number.isNaN(seconds)) problems.push(windowProblem(i, `"${value}" is not a time; write it like the cells of column ${timestampColumn}: ${TIMESTAMP_FORMS}`, end));
    }
    if (Number.isNaN(from) || Number.isNaN(to)) return;
    if (to < from) {
      problems.push(windowProblem(i, `window ${label(w, i)} ends (${clockText(to, clock.calendar)}) before it starts (${clockText(from, clock.calendar)}); expected an end at or after the start`, 'to'));
    } else if (to < clock.firstSeconds || from > clock.lastSeconds) {
      problems.push(windowProblem(i, `window ${label(w, i)} (${clockText(from, clock.calendar)} to ${clockText(to, clock.calendar)}) lies outside the log: ${range}`));
    } else read.push({ fromSeconds: from, toSeconds: to, reason: w.reason, index: i });
  });
  const sorted = [...read].sort((a, b) => a.fromSeconds - b.fromSeconds);
  for (let k = 1; k < sorted.length; k++) {
    const [a, b] = [sorted[k - 1], sorted[k]];
    if (b.fromSeconds <= a.toSeconds) {
      problems.push(windowProblem(b.index, `window ${label(b, b.index)} overlaps window ${label(a, a.index)} (${whereOf(a.index)}); join them into one window or move an end`));
    }
  }
  return { windows: read.map(({ fromSeconds, toSeconds, reason }) => ({ fromSeconds, toSeconds, reason })), problems };
}

/** For each record, 1 + the index of the window holding its timestamp, or 0. seconds: records. */
export function recordsInWindows(windows: readonly TimeWindow[], seconds: Float64Array | undefined, recordCount: number): Uint16Array {
  const inWindow = new Uint16Array(recordCount);
  if (!seconds || windows.length === 0) return inWindow;
  for (let r = 0; r < recordCount; r++) {
    const t = seconds[r];
    if (Number.isNaN(t)) continue;
    const w = windows.findIndex((x) => t >= x.fromSeconds && t <= x.toSeconds);
    if (w >= 0) inWindow[r] = w + 1;
  }
  return inWindow;
}

/** How many rows each window left out. */
export function leftOutWindows(windows: readonly TimeWindow[], inWindow: Uint16Array): LeftOutWindow[] {
  const counts = new Array<number>(windows.length).fill(0);
  for (const w of inWindow) if (w > 0) counts[w - 1]++;
  return windows.map((w, i) => ({ ...w, rows: counts[i] }));
}

/** "1 Mar 2024 06:00 to 1 Mar 2024 08:30, 2 h 30 min" on the log's clock. */
export function windowText(w: TimeWindow, calendar: boolean): string {
  return `${clockText(w.fromSeconds, calendar)} to ${clockText(w.toSeconds, calendar)}, ${durationText(w.toSeconds - w.fromSeconds)}`;
}

/** "Time windows left out: 360 rows in all; 340 rows for start-up (…), 20 rows for valve test (…)." */
export function windowReport(left: readonly LeftOutWindow[], calendar: boolean): string[] {
  if (left.length === 0) return [];
  const total = left.reduce((sum, w) => sum + w.rows, 0);
  const each = left.map((w, i) => `${plural(w.rows, 'row')} for ${w.reason || `window ${i + 1}`} (${windowText(w, calendar)})`);
  return [`Time windows left out: ${plural(total, 'row')} in all; ${each.join('; ')}. Each window cuts its run in two.`];
}
