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
 * timestamp column. A problem names a window by its number, never by its reason: the reason is a
 * note that changes without an import (data/leftOutReasons.ts), so a message would keep an old one.
 *
 * When the clock starts again in each run (a run column, and the time steps back where the run
 * changes: each run's own elapsed time), a window is a stretch of that run-relative time and takes
 * rows from every run that reaches it — 0 to 600 s leaves out the first ten minutes of each run.
 * The import report says so, and counts per window the runs it touched as well as its rows.
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

/** A window with the rows it left out and the runs those rows were in, for the import report. */
export interface LeftOutWindow extends TimeWindow {
  readonly rows: number;
  /** Runs the window took rows from: stretches of its rows not broken by a used row or a run boundary. */
  readonly runs: number;
}

/** The log's clock: its first and last readable timestamp, in seconds, and whether they are dates. */
export interface LogClock {
  readonly firstSeconds: number;
  readonly lastSeconds: number;
  readonly calendar: boolean;
  /** Times the clock stepped back where the run column changed: more than 0 when each run keeps its own time. */
  readonly runRestarts: number;
}

/**
 * The first and last readable timestamp, and how often the clock starts again at a new run.
 * seconds: records, NaN where unreadable; runCodes: records, the run column's code (none: one timeline).
 */
export function logClock(seconds: Float64Array, runCodes?: Float64Array): LogClock | undefined {
  let first = Infinity, last = -Infinity, previous = NaN, previousRun = NaN, runRestarts = 0;
  for (let r = 0; r < seconds.length; r++) {
    const t = seconds[r];
    if (Number.isNaN(t)) continue;
    if (t < first) first = t;
    if (t > last) last = t;
    if (runCodes && runCodes[r] !== previousRun && t < previous) runRestarts++;
    previous = t;
    previousRun = runCodes ? runCodes[r] : NaN;
  }
  return first <= last ? { firstSeconds: first, lastSeconds: last, calendar: isCalendarClock(first), runRestarts } : undefined;
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
      problems.push(windowProblem(i, `window ${i + 1} ends (${clockText(to, clock.calendar)}) before it starts (${clockText(from, clock.calendar)}); expected an end at or after the start`, 'to'));
    } else if (to < clock.firstSeconds || from > clock.lastSeconds) {
      problems.push(windowProblem(i, `window ${i + 1} (${clockText(from, clock.calendar)} to ${clockText(to, clock.calendar)}) lies outside the log: ${range}`));
    } else read.push({ fromSeconds: from, toSeconds: to, reason: w.reason, index: i });
  });
  const sorted = [...read].sort((a, b) => a.fromSeconds - b.fromSeconds);
  for (let k = 1; k < sorted.length; k++) {
    const [a, b] = [sorted[k - 1], sorted[k]];
    if (b.fromSeconds <= a.toSeconds) {
      problems.push(windowProblem(b.index, `window ${b.index + 1} overlaps window ${a.index + 1} (${whereOf(a.index)}); join them into one window or move an end`));
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

/**
 * How many rows each window left out, and from how many runs. A window's rows start another run's
 * stretch where a used row came between them (the log left the window and came back: on a clock
 * that restarts per run, the next run) or where `apart` says the two rows lie in different runs
 * (the run column changed, a stop in the log). inWindow, kept: records.
 */
export function leftOutWindows(
  windows: readonly TimeWindow[], inWindow: Uint16Array, kept?: Uint8Array, apart: (q: number, r: number) => boolean = () => false,
): LeftOutWindow[] {
  const rows = new Array<number>(windows.length).fill(0), runs = rows.slice();
  const last = new Int32Array(windows.length).fill(-1);
  let lastKept = -1;
  for (let r = 0; r < inWindow.length; r++) {
    const w = inWindow[r] - 1;
    if (w < 0) {
      if (kept?.[r]) lastKept = r;
      continue;
    }
    const q = last[w];
    if (q < 0 || lastKept > q || apart(q, r)) runs[w]++;
    rows[w]++;
    last[w] = r;
  }
  return windows.map((w, i) => ({ ...w, rows: rows[i], runs: runs[i] }));
}

/** "1 Mar 2024 06:00 to 1 Mar 2024 08:30, 2 h 30 min" on the log's clock. */
export function windowText(w: TimeWindow, calendar: boolean): string {
  return `${clockText(w.fromSeconds, calendar)} to ${clockText(w.toSeconds, calendar)}, ${durationText(w.toSeconds - w.fromSeconds)}`;
}

/**
 * "Time windows left out: 360 rows in all; 340 rows in 1 run for start-up (…); 20 rows in 1 run for
 * valve test (…). …", and on a clock that restarts in each run, that a window is taken from every run.
 */
export function windowReport(left: readonly LeftOutWindow[], clock: Pick<LogClock, 'calendar' | 'runRestarts'>): string[] {
  if (left.length === 0) return [];
  const total = left.reduce((sum, w) => sum + w.rows, 0);
  const each = left.map((w, i) => `${plural(w.rows, 'row')} in ${plural(w.runs, 'run')} for ${w.reason || `window ${i + 1}`} (${windowText(w, clock.calendar)})`);
  const lines = [`Time windows left out: ${plural(total, 'row')} in all; ${each.join('; ')}. Where a window lies inside a run, the rows before and after it become two runs.`];
  if (clock.runRestarts > 0) lines.push(EVERY_RUN_SENTENCE);
  return lines;
}

/** Said wherever a window is added or reported on a clock that restarts in each run (README: Time windows left out). */
export const EVERY_RUN_SENTENCE = 'This log’s clock starts again in each run, so a time window is run time: it leaves out the rows in that stretch of every run (0 to 600 s: the first ten minutes of each run).';
