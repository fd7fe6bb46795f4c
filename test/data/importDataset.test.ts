/**
 * importDataset on clean files: how rows become transitions under each rule for next states,
 * episodes and terminals, with expected counts worked out by hand from the row layout, and the
 * summary statistics checked against closed forms (sample variance of 1..n is n(n+1)/12).
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportedDataset } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

const CSV: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
const ROLES: ColumnRoles = {
  states: [{ column: 'level', unit: 'm' }],
  actions: [{ column: 'valve', unit: '%' }],
  reward: { kind: 'column', column: 'reward', sense: 'reward' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'single' },
};

function imported(text: string | Uint8Array, roles: Partial<ColumnRoles> = {}, csv: Partial<CsvSettings> = {}): ImportedDataset {
  const result = importDataset(text, 'log.csv', { ...CSV, ...csv }, { ...ROLES, ...roles });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}

/** level = 1, 2, 3, …; valve = 10·level; reward = −level; extra columns from `extra(i)`. */
function table(n: number, extraHeader = '', extra: (i: number) => string = () => ''): string {
  const lines = [`level,valve,reward${extraHeader}`];
  for (let i = 1; i <= n; i++) lines.push(`${i},${10 * i},${-i}${extra(i)}`);
  return lines.join('\n') + '\n';
}

describe('next state from the next row', () => {
  it('one episode of n rows gives n − 1 transitions; the last row has no successor', () => {
    const { transitions: t, rowCount, episodeReport } = imported(table(5));
    expect(rowCount).toBe(5);
    expect(t.count).toBe(4);
    expect(Array.from(t.states)).toEqual([1, 2, 3, 4]);
    expect(Array.from(t.nextStates)).toEqual([2, 3, 4, 5]);
    expect(Array.from(t.actions)).toEqual([10, 20, 30, 40]);
    expect(Array.from(t.rewards)).toEqual([-1, -2, -3, -4]);
    expect(Array.from(t.sourceLine)).toEqual([2, 3, 4, 5]);
    expect(Array.from(t.startStates)).toEqual([1]);
    expect(t.episodeCount).toBe(1);
    expect(episodeReport).toContain('Next states from the next row of the same run: 4 transitions; the last row of each run has no successor.');
  });

  it('a cost is negated into a reward', () => {
    const { transitions: t } = imported(table(3), { reward: { kind: 'column', column: 'reward', sense: 'cost' } });
    expect(Array.from(t.rewards)).toEqual([1, 2]);
  });

  it('a reward expression is evaluated per row over its columns', () => {
    const { transitions: t } = imported(table(3), { reward: { kind: 'expression', expression: '-(level - 2)^2 - 0.01*valve', sense: 'reward' } });
    expect(Array.from(t.rewards)).toEqual([-1 - 0.1, 0 - 0.2]);
  });
});

describe('episodes', () => {
  const runs = ['A', 'A', 'B', 'B', 'B', 'A', 'A'];
  const byRun = table(7, ',run', (i) => `,${runs[i - 1]}`);

  it('from a column: contiguous runs; a value that reappears later starts a new episode, and the report says so', () => {
    const { transitions: t, episodeReport } = imported(byRun, { episode: { kind: 'column', column: 'run' } });
    expect(t.episodeCount).toBe(3);
    expect(t.count).toBe(1 + 2 + 1); // runs of 2, 3 and 2 rows
    expect(Array.from(t.episode)).toEqual([0, 1, 1, 2]);
    expect(Array.from(t.startStates)).toEqual([1, 3, 6]);
    expect(episodeReport).toContain('Runs from column run: 3 runs (a new run wherever the value changes).');
    expect(episodeReport).toContain('1 value of run reappears after other values and starts a new run there: "A" at line 7.');
  });

  const timed = (times: number[]): string => table(times.length, ',t', (i) => `,${times[i - 1]}`);

  it('from timestamp gaps: a step over 3× the median period starts a new episode', () => {
    const { transitions: t, summary, episodeReport } = imported(timed([0, 10, 20, 30, 75, 85, 95]), { episode: { kind: 'timeGap', column: 't' } });
    expect(summary.samplingPeriodSeconds).toBe(10);
    expect(t.episodeCount).toBe(2); // 45 s > 30 s
    expect(t.count).toBe(3 + 2);
    expect(Array.from(t.startStates)).toEqual([1, 5]);
    expect(episodeReport).toContain('Runs from timestamp gaps in column t: a step longer than 30 s (3 × the median sampling period of 10 s) starts a new run; 1 gap → 2 runs.');
  });

  it('from timestamp gaps with maxGapSeconds set: the same 45 s step stays inside one episode under a 60 s limit', () => {
    const { transitions: t } = imported(timed([0, 10, 20, 30, 75, 85, 95]), { episode: { kind: 'timeGap', column: 't', maxGapSeconds: 60 } });
    expect(t.episodeCount).toBe(1);
    expect(t.count).toBe(6);
  });

  it('a terminal row is a transition with done = 1 and ends its episode; s′ is a copy of s', () => {
    const done = [0, 0, 1, 0, 0, 1];
    const { transitions: t, episodeReport } = imported(table(6, ',done', (i) => `,${done[i - 1]}`), { terminal: 'done' });
    // Episode 1: rows 1–3 (2 chained + 1 terminal), episode 2: rows 4–6 (same).
    expect(t.count).toBe(6);
    expect(Array.from(t.terminal)).toEqual([0, 0, 1, 0, 0, 1]);
    expect(Array.from(t.nextStates)).toEqual([2, 3, 3, 5, 6, 6]);
    expect(t.episodeCount).toBe(2);
    expect(episodeReport).toContain('End-of-run column: 2 transitions end a run (the plant stopped or was reset there; no value is added past it).');
    expect(episodeReport).toContain('1 end-of-run flag ended a run before the run rule did; the following row starts a new run.');
  });
});

describe('next state from columns on the same row', () => {
  it('every row is a transition; s′ is read from the named columns', () => {
    const { transitions: t, episodeReport } = imported(table(4, ',level_next', (i) => `,${i + 0.5}`), { nextState: { kind: 'columns', columns: ['level_next'] } });
    expect(t.count).toBe(4);
    expect(Array.from(t.nextStates)).toEqual([1.5, 2.5, 3.5, 4.5]);
    expect(episodeReport).toContain('Next states from the next-state columns of the same row: 4 transitions.');
  });
});

describe('excluding rows never joins their neighbours', () => {
  it('two adjacent bad rows inside an episode cut the chain there; the report names the lines', () => {
    const runs = ['A', 'A', 'A', 'A', 'A', 'A', 'B', 'B'];
    const text = table(8, ',run', (i) => `,${runs[i - 1]}`).replace('\n3,30,-3,A', '\n3,x,-3,A').replace('\n4,40,-4,A', '\n4,40,,A');
    const { transitions: t, excluded, episodeReport, summary } = imported(text, { episode: { kind: 'column', column: 'run' } }, { badRows: 'exclude' });
    expect(excluded.map((e) => [e.line, e.column, e.kind])).toEqual([[4, 'valve', 'not-a-number'], [5, 'reward', 'empty-cell']]);
    // Rows 1–2 (one transition), rows 5–6 (one), rows 7–8 (one): nothing spans rows 3–4.
    expect(t.count).toBe(3);
    expect(Array.from(t.states)).toEqual([1, 5, 7]);
    expect(Array.from(t.nextStates)).toEqual([2, 6, 8]);
    expect(t.episodeCount).toBe(2);
    expect(Array.from(t.startStates)).toEqual([1, 7]);
    expect(episodeReport).toContain('1 stretch of excluded rows inside a run (lines 4–5): the rows on either side are not joined into a transition; the run is split there into separate chains of steps but keeps its one start state.');
    expect(summary.excludedRowCount).toBe(2);
    expect(summary.excludedFraction).toBe(2 / 8);
  });
});

describe('dialects and encodings', () => {
  const expectLevels = (d: ImportedDataset, levels: number[]): void => {
    expect(Array.from(d.transitions.states)).toEqual(levels.slice(0, -1));
  };

  it('UTF-8 bytes with a byte-order mark and CRLF line ends', () => {
    const bytes = new TextEncoder().encode('\uFEFFlevel,valve,reward\r\n1.5,1,0\r\n2.5,2,0\r\n');
    expectLevels(imported(bytes), [1.5, 2.5]);
  });

  it('semicolons with decimal commas are detected and reported', () => {
    const d = imported('level;valve;reward\n1,5;1;0\n2,25;2;0\n');
    expectLevels(d, [1.5, 2.25]);
    expect(d.episodeReport[0]).toBe('Fields separated by semicolon (detected); decimal mark "," (detected).');
  });

  it('tabs are detected; a chosen delimiter and decimal mark are used as set', () => {
    expectLevels(imported('level\tvalve\treward\n1.5\t1\t0\n2.5\t2\t0\n'), [1.5, 2.5]);
    const d = imported('level;valve;reward\n1;1;0\n2;2;0\n', {}, { delimiter: ';', decimalMark: ',' });
    expect(d.episodeReport[0]).toBe('Fields separated by semicolon (as set); decimal mark "," (as set).');
  });

  it('blank lines at the end are not rows', () => {
    expect(imported(table(3) + '\n\n').rowCount).toBe(3);
  });
});

describe('dataset summary', () => {
  it('count, min, max, mean and the sample std of 1..30 (closed form n(n+1)/12), 30 bins of one value each', () => {
    const { summary } = imported(table(30));
    const level = summary.columns.find((c) => c.name === 'level')!;
    expect(level.roles).toEqual(['state']);
    expect([level.count, level.min, level.max, level.mean]).toEqual([30, 1, 30, 15.5]);
    expect(level.std).toBeCloseTo(Math.sqrt((30 * 31) / 12), 12);
    expect(level.histogram.counts).toEqual(new Array(30).fill(1));
    expect(level.histogram.edges).toHaveLength(31);
    expect(level.histogram.edges[0]).toBe(1);
    expect(level.histogram.edges[30]).toBe(30);
    expect(summary.reward.mean).toBe(-15.5);
    expect([summary.rowCount, summary.transitionCount, summary.episodeCount, summary.excludedFraction]).toEqual([30, 29, 1, 0]);
    expect(summary.samplingPeriodSeconds).toBeNull();
  });
});
