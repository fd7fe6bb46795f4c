/**
 * Time windows left out of the import (data.csv.excludedTimes), on a small invented log whose
 * counts are worked by hand: 12 rows, 10 s apart (t = 0, 10, …, 110 s), one run, next state on the
 * next row. A window takes out the rows whose time lies inside it (ends included), counts them per
 * window, and cuts the run there; a window that cannot be used stops the import naming its field.
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportProblem } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings, ExcludedTime } from '../../src/project/schema';
import { dataSourceSchema } from '../../src/project/schema';

const ROLES: ColumnRoles = {
  states: [{ column: 'level_m', unit: 'm' }],
  actions: [{ column: 'valve_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost', unit: '' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'single' },
  timestamp: 'time',
};
const STOP: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };

/** t = 0…110 s; the cost of the row at badAt seconds is "n/a" (none when badAt < 0). */
function log(badAt = -1, time: (k: number) => string = (k) => String(10 * k)): string {
  const rows = ['time,level_m,valve_pct,cost'];
  for (let k = 0; k < 12; k++) rows.push(`${time(k)},${(1 + 0.01 * k).toFixed(2)},${40 + k},${10 * k === badAt ? 'n/a' : (0.5 + 0.1 * k).toFixed(1)}`);
  return `${rows.join('\n')}\n`;
}

function imported(windows: ExcludedTime[], text = log()) {
  const result = importDataset(text, 'log.csv', { ...STOP, excludedTimes: windows }, ROLES);
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}

function problems(windows: ExcludedTime[], roles: ColumnRoles = ROLES): ImportProblem[] {
  const result = importDataset(log(), 'log.csv', { ...STOP, excludedTimes: windows }, roles);
  if (result.ok) throw new Error('expected the import to stop');
  return result.problems as ImportProblem[];
}

describe('a time window left out', () => {
  it('[30 s, 50 s] takes out 3 rows and cuts the run in two: 3 + 6 rows kept → 2 + 5 = 7 transitions, 2 runs, 2 start states', () => {
    const v = imported([{ from: 30, to: 50, reason: 'valve test' }]);
    expect(v.timeWindows.map((w) => w.rows)).toEqual([3]);
    expect(v.summary.excludedRowCount).toBe(3);
    expect(v.excluded).toEqual([]); // rows in a window are counted per window, not listed as bad rows
    expect(v.transitions.count).toBe(7);
    expect(v.transitions.episodeCount).toBe(2);
    expect(v.transitions.startStates.length).toBe(2) // one state per start;
    expect(v.timeWindows.map((w) => w.runs)).toEqual([1]);
    expect(v.clock?.runRestarts).toBe(0);
    expect(v.episodeReport.join(' ')).toContain('Time windows left out: 3 rows in all; 3 rows in 1 run for valve test (30 s to 50 s, 20 s)');
    expect(v.episodeReport.join(' ')).not.toContain('starts again in each run');
    expect(v.episodeReport.join(' ')).toContain('1 run cut in two by a time window left out');
  });

  it('two windows, [30, 50] and [100, 1000] (past the log end): 3 and 2 rows; runs of 3 and 4 rows → 2 + 3 = 5 transitions', () => {
    const v = imported([{ from: 100, to: 1000, reason: 'shut-down' }, { from: 30, to: 50, reason: 'test' }]);
    expect(v.timeWindows.map((w) => [w.reason, w.rows])).toEqual([['shut-down', 2], ['test', 3]]);
    expect(v.summary.excludedRowCount).toBe(5);
    expect(v.transitions.count).toBe(5);
    expect(v.transitions.episodeCount).toBe(2);
  });

  it('a start-up window at the head leaves one run whose first kept row is a start state', () => {
    const v = imported([{ from: 0, to: 25, reason: 'start-up' }]);
    expect(v.timeWindows[0].rows).toBe(3);
    expect(v.transitions.count).toBe(8); // 9 rows, one run
    expect(v.transitions.episodeCount).toBe(1);
    expect(v.transitions.startStates.length).toBe(1) // one state per start;
  });

  it('a bad row inside a window does not stop the import and is not counted twice', () => {
    const v = imported([{ from: 30, to: 50, reason: 'test' }], log(40));
    expect(v.timeWindows[0].rows).toBe(3);
    expect(v.summary.excludedRowCount).toBe(3);
    expect(v.excluded).toEqual([]);
  });

  it('reads dates written like the timestamp column', () => {
    const iso = (k: number) => `2024-03-01T06:0${Math.floor(k / 6)}:${String((k % 6) * 10).padStart(2, '0')}`;
    const v = imported([{ from: '2024-03-01 06:00:30', to: '2024-03-01T06:00:50', reason: 'test' }], log(-1, iso));
    expect(v.timeWindows[0].rows).toBe(3);
    expect(v.clock?.calendar).toBe(true);
    expect(v.episodeReport.join(' ')).toContain('1 Mar 2024 06:00:30 to 1 Mar 2024 06:00:50, 20 s');
  });
});

/**
 * A log whose clock starts again in each run: 3 runs (column run), 6 rows each at t = 0, 10, …,
 * 50 s of run time. Worked by hand: a window [0 s, 15 s] holds t = 0 and 10 of every run (2 rows ×
 * 3 runs = 6 rows), and [20 s, 30 s] holds t = 20 and 30 of every run (6 rows) and cuts each run
 * in two (rows 0, 10 | 40, 50).
 */
function runTimeLog(): string {
  const rows = ['run,time,level_m,valve_pct,cost'];
  for (let run = 1; run <= 3; run++) {
    for (let k = 0; k < 6; k++) rows.push(`${run},${10 * k},${(1 + 0.01 * k + 0.1 * run).toFixed(2)},${40 + k + run},${(0.5 + 0.1 * k).toFixed(1)}`);
  }
  return `${rows.join('\n')}\n`;
}
const RUN_ROLES: ColumnRoles = { ...ROLES, episode: { kind: 'column', column: 'run' } };

describe('a time window on a clock that starts again in each run', () => {
  const runTime = (windows: ExcludedTime[]) => {
    const result = importDataset(runTimeLog(), 'runs.csv', { ...STOP, excludedTimes: windows }, RUN_ROLES);
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    return result.value;
  };

  it('is run time: [0 s, 15 s] takes the first two rows of each of the 3 runs, and the report says so', () => {
    const v = runTime([{ from: 0, to: 15, reason: 'start-up' }]);
    expect(v.clock?.runRestarts).toBe(2);
    expect(v.timeWindows.map((w) => [w.rows, w.runs])).toEqual([[6, 3]]);
    expect(v.transitions.episodeCount).toBe(3); // a window at each run's head trims it; it cuts none in two
    expect(v.transitions.count).toBe(9); // 4 rows left in each run → 3 transitions each
    const report = v.episodeReport.join(' ');
    expect(report).toContain('6 rows in 3 runs for start-up (0 s to 15 s, 15 s)');
    expect(report).toContain('This log’s clock starts again in each run, so a time window is run time');
  });

  it('draws the runs over one another: the trend keeps more groups (here every row: 18 rows, far under the limit) and its clock steps back at each run', () => {
    const v = runTime([]);
    expect(v.trend.rowsPerGroup).toBe(1);
    expect(Array.from(v.trend.time.slice(4, 8))).toEqual([40, 50, 0, 10]);
  });

  it('[20 s, 30 s] inside every run: 6 rows from 3 runs, each run cut in two', () => {
    const v = runTime([{ from: 20, to: 30, reason: 'test' }]);
    expect(v.timeWindows.map((w) => [w.rows, w.runs])).toEqual([[6, 3]]);
    expect(v.transitions.episodeCount).toBe(6);
    expect(v.transitions.count).toBe(6); // 6 runs of 2 rows
  });
});

describe('a time window that cannot be used stops the import, naming its field', () => {
  it('an end that is not a time', () => {
    const [p] = problems([{ from: 0, to: 'soon', reason: '' }]);
    expect(p).toMatchObject({ kind: 'bad-time-window', where: 'data.csv.excludedTimes[0].to', field: ['data', 'csv', 'excludedTimes', 0, 'to'] });
    expect(p.message).toContain('"soon" is not a time; write it like the cells of column time');
  });

  it('an end before the start', () => {
    const [p] = problems([{ from: 50, to: 30, reason: 'test' }]);
    expect(p.where).toBe('data.csv.excludedTimes[0].to');
    expect(p.message).toBe('window 1 ends (30 s) before it starts (50 s); expected an end at or after the start');
  });

  it('a window wholly outside the log', () => {
    const [p] = problems([{ from: 500, to: 600, reason: 'test' }]);
    expect(p.where).toBe('data.csv.excludedTimes[0]');
    expect(p.message).toContain('lies outside the log: the log runs from 0 s to 1 min 50 s');
  });

  it('overlapping windows: the later one is named, with the one it overlaps', () => {
    const [p] = problems([{ from: 45, to: 70, reason: 'b' }, { from: 30, to: 50, reason: 'a' }]);
    expect(p.where).toBe('data.csv.excludedTimes[0]');
    expect(p.message).toContain('window 1 overlaps window 2 (data.csv.excludedTimes[1])');
  });

  it('no timestamp column', () => {
    const { timestamp: _t, ...noClock } = ROLES;
    const [p] = problems([{ from: 0, to: 10, reason: '' }], noClock);
    expect(p.message).toContain('needs a timestamp column');
  });

  it('the project check refuses two numbers that end before they start, naming the field', () => {
    const parsed = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedTimes: [{ from: 50, to: 30 }] } });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].path).toEqual(['csv', 'excludedTimes', 0, 'to']);
  });
});
