/**
 * Runs left out of the import by label (data.csv.excludedRuns), on a small invented log whose counts
 * are worked by hand: a run column, runs of 5 rows each, next state on the next row, so each run kept
 * gives 4 transitions. Behaviour only; the numbers are counts.
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportProblem } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings, ExcludedRun } from '../../src/project/schema';
import { dataSourceSchema } from '../../src/project/schema';
import { MAX_RUN_LABEL_LENGTH, MAX_RUN_RANGES_LEFT_OUT } from '../../src/core/limits';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

const ROLES: ColumnRoles = {
  states: [{ column: 'level_m', unit: 'm' }],
  actions: [{ column: 'valve_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost', unit: '' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'column', column: 'run' },
};
const STOP: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
const ROWS_PER_RUN = 5;

/** One run per label, in the order given, 5 rows each; the clock starts again in each run. */
function log(labels: readonly string[], bad?: { run: string; row: number }): string {
  const rows = ['run,time,level_m,valve_pct,cost'];
  labels.forEach((label, k) => {
    for (let i = 0; i < ROWS_PER_RUN; i++) {
      const cost = bad && bad.run === label && bad.row === i ? 'n/a' : (0.5 + 0.1 * i).toFixed(1);
      rows.push(`${label},${10 * i},${(1 + 0.01 * i + 0.1 * k).toFixed(2)},${40 + i + k},${cost}`);
    }
  });
  return `${rows.join('\n')}\n`;
}
const NUMBERED = Array.from({ length: 10 }, (_, k) => String(k + 1)); // "1" … "10"

function imported(ranges: ExcludedRun[], text = log(NUMBERED), roles = ROLES) {
  const result = importDataset(text, 'log.csv', { ...STOP, excludedRuns: ranges }, roles);
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}

function problems(ranges: ExcludedRun[], text = log(NUMBERED), roles = ROLES): ImportProblem[] {
  const result = importDataset(text, 'log.csv', { ...STOP, excludedRuns: ranges }, roles);
  if (result.ok) throw new Error('expected the import to stop');
  return result.problems as ImportProblem[];
}

describe('a range of runs left out', () => {
  it('"1" to "4" of ten runs: 4 runs and 20 rows left out, 6 runs kept → 24 transitions, 6 start states', () => {
    const v = imported([{ from: '1', to: '4', reason: 'before the retune' }]);
    expect(v.runsLeftOut).toEqual([{ from: '1', to: '4', reason: 'before the retune', runs: 4, rows: 20 }]);
    expect(v.summary.excludedRowCount).toBe(20);
    expect(v.excluded).toEqual([]); // counted per range, not listed as rows that cannot be used
    expect(v.transitions.episodeCount).toBe(6);
    expect(v.transitions.count).toBe(24);
    expect(v.transitions.startStates.length).toBe(6);
    expect(v.episodeReport.join(' ')).toContain('Runs left out by label (column run): 4 runs and 20 rows in all; 4 runs, "1" to "4", 20 rows: before the retune.');
    expect(v.runLabels).toEqual(NUMBERED);
  });

  it('`to` omitted is that one run; two ranges are counted each', () => {
    const v = imported([{ from: '7', reason: 'trip test' }, { from: '1', to: '2', reason: '' }]);
    expect(v.runsLeftOut.map((r) => [r.from, r.to, r.runs, r.rows])).toEqual([['7', '7', 1, 5], ['1', '2', 2, 10]]);
    expect(v.transitions.episodeCount).toBe(7);
    expect(v.episodeReport.join(' ')).toContain('3 runs and 15 rows in all; 1 run, "7", 5 rows: trip test; 2 runs, "1" to "2", 10 rows.');
  });

  it('takes the runs in the order they appear in the data, not by the labels’ value or text', () => {
    const order = ['10', '9', '1', '2', '20']; // "9" to "2" is the 2nd to 4th run
    const v = imported([{ from: '9', to: '2', reason: '' }], log(order));
    expect(v.runsLeftOut[0]).toMatchObject({ runs: 3, rows: 15 });
    expect(v.transitions.episodeCount).toBe(2);
  });

  it('a numeric label is the cell as written: "007" is named "007", and "7" is offered it', () => {
    const order = ['005', '006', '007'];
    expect(imported([{ from: '007', reason: '' }], log(order)).runsLeftOut[0].rows).toBe(5);
    const [p] = problems([{ from: '7', reason: '' }], log(order));
    expect(p).toMatchObject({ kind: 'bad-run-range', where: 'data.csv.excludedRuns[0].from', field: ['data', 'csv', 'excludedRuns', 0, 'from'] });
    expect(p.message).toContain('no run of column run is labelled "7"');
    expect(p.message).toContain('did you mean "007"?');
  });

  it('a row that cannot be used inside a run left out neither stops the import nor is listed', () => {
    const v = imported([{ from: '3', reason: '' }], log(NUMBERED, { run: '3', row: 2 }));
    expect(v.excluded).toEqual([]);
    expect(v.runsLeftOut[0].rows).toBe(5);
  });

  it('a label kept on both sides of a run left out is two runs there (as the label reappearing would be)', () => {
    const v = imported([{ from: 'B', reason: '' }], log(['A', 'B', 'A', 'C']));
    expect(v.transitions.episodeCount).toBe(3); // A | A | C, never A joined across B
    expect(v.transitions.count).toBe(12);
  });

  it('a run left out is counted by its range only, not also by a time window it lies in', () => {
    const result = importDataset(log(NUMBERED), 'log.csv', { ...STOP, excludedRuns: [{ from: '1', reason: '' }], excludedTimes: [{ from: 0, to: 10, reason: 'start' }] }, { ...ROLES, timestamp: 'time' });
    if (!result.ok) throw new Error(result.problems[0].message);
    expect(result.value.runsLeftOut[0].rows).toBe(5);
    expect(result.value.timeWindows[0].rows).toBe(18); // the first two rows of the 9 runs kept
    expect(result.value.summary.excludedRowCount).toBe(23);
  });
});

describe('a range of runs that cannot be used stops the import, naming its field', () => {
  it('without a run column: time gaps or a single run', () => {
    const [gaps] = problems([{ from: '1', reason: '' }], log(NUMBERED), { ...ROLES, episode: { kind: 'timeGap', column: 'time' } });
    expect(gaps).toMatchObject({ kind: 'bad-run-range', where: 'data.csv.excludedRuns[0]' });
    expect(gaps.message).toContain('leave out time windows instead (data.csv.excludedTimes)');
    const [single] = problems([{ from: '1', reason: '' }], log(NUMBERED), { ...ROLES, episode: { kind: 'single' } });
    expect(single.message).toContain('single run, which cannot be cut by label');
  });

  it('a label not in the log names the closest label; none close says so without echoing a cell', () => {
    const [p] = problems([{ from: '1', to: '100', reason: '' }]);
    expect(p.where).toBe('data.csv.excludedRuns[0].to');
    expect(p.message).toContain('did you mean "10"?');
    const [far] = problems([{ from: 'before the retune', reason: '' }]);
    expect(far.message).toContain('none of its 10 labels is close');
  });

  it('`to` before `from` in the data', () => {
    const [p] = problems([{ from: '5', to: '3', reason: '' }]);
    expect(p.where).toBe('data.csv.excludedRuns[0].to');
    expect(p.message).toContain('run "3" (to) appears in the data before run "5" (from)');
  });

  it('overlapping ranges', () => {
    const [p] = problems([{ from: '1', to: '4', reason: 'a' }, { from: '4', to: '6', reason: 'b' }]);
    expect(p.where).toBe('data.csv.excludedRuns[1]');
    expect(p.message).toContain('range 2 overlaps range 1 (data.csv.excludedRuns[0])');
  });

  it('ranges that leave no run', () => {
    const [p] = problems([{ from: '1', to: '5', reason: '' }, { from: '6', to: '10', reason: '' }]);
    expect(p.where).toBe('data.csv.excludedRuns[1]');
    expect(p.message).toContain('all 10 runs of column run');
  });
});

// MAX_RUN_LABEL_LENGTH counts code points, in the cell and in the field alike (core/limits.ts). U+1F6E2
// (an oil drum) is one code point, two UTF-16 code units and four UTF-8 bytes (RFC 3629 §3; Unicode
// code chart 1F680–1F6FF, from memory), so a label of them at the limit is 4,096 bytes and 2,048 units.
describe('a run label of 4-byte characters at the limit and one over', () => {
  const DRUM = '\u{1F6E2}';
  const atLimit = DRUM.repeat(MAX_RUN_LABEL_LENGTH), over = DRUM.repeat(MAX_RUN_LABEL_LENGTH + 1);
  it('the character is what the comment says it is', () => {
    expect([DRUM.length, new TextEncoder().encode(DRUM).length, [...DRUM].length]).toEqual([2, 4, 1]);
  });

  it('at the limit: read from the log, named in the field, and its run left out', () => {
    const labels = ['1', atLimit, '3', '4'];
    expect(imported([]).runLabels).toEqual(NUMBERED); // the helper's own log, for contrast
    const parsed = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedRuns: [{ from: atLimit }] } });
    expect(parsed.success).toBe(true);
    const v = imported([{ from: atLimit, reason: '' }], log(labels));
    expect(v.runLabels).toEqual(labels);
    expect(v.runsLeftOut).toEqual([{ from: atLimit, to: atLimit, reason: '', runs: 1, rows: ROWS_PER_RUN }]);
  });

  it('at the limit with blanks around it in the cell: read, as the field trims its labels', () => {
    const labels = ['1', ` ${atLimit}\t`, '3', '4'];
    const v = imported([{ from: atLimit, reason: '' }], log(labels));
    expect(v.runLabels).toEqual(['1', atLimit, '3', '4']);
    expect(v.runsLeftOut).toEqual([{ from: atLimit, to: atLimit, reason: '', runs: 1, rows: ROWS_PER_RUN }]);
  });

  it('one over: the field is refused at its path, and the cell is a bad cell named by its line and column', () => {
    const parsed = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedRuns: [{ from: over }] } });
    expect(parsed.error?.issues[0].path).toEqual(['csv', 'excludedRuns', 0, 'from']);
    expect(parsed.error?.issues[0].message).toBe(`expected a run label of at most ${MAX_RUN_LABEL_LENGTH} characters`);
    const [p] = problems([], log(['1', over, '3', '4']));
    expect(p.where).toBe('log.csv, line 7, column run'); // the header is line 1, run "1" lines 2–6
    // 4,100 bytes: past the bound that holds every label (4 × 1,024), so not decoded.
    expect(p.message).toContain('the run label cell holds more than 1,024 characters; expected a run or batch label of at most 1,024');
    const [q] = problems([], log(['1', '2', 'x'.repeat(MAX_RUN_LABEL_LENGTH + 1)]));
    expect(q.where).toBe('log.csv, line 12, column run');
    expect(q.message).toContain('the run label cell holds 1,025 characters; expected a run or batch label of at most 1,024');
  });
});

describe('the field in the project document', () => {
  it('trims labels, fills the reason, and holds its limits (core/limits.ts)', () => {
    const parsed = dataSourceSchema.parse({ path: 'x.csv', csv: { excludedRuns: [{ from: ' 3 ', to: '5' }] } });
    expect(parsed.csv.excludedRuns).toEqual([{ from: '3', to: '5', reason: '' }]);
    const tooMany = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedRuns: Array.from({ length: MAX_RUN_RANGES_LEFT_OUT + 1 }, () => ({ from: '1' })) } });
    expect(tooMany.success).toBe(false);
    const long = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedRuns: [{ from: 'x'.repeat(MAX_RUN_LABEL_LENGTH + 1) }] } });
    expect(long.error?.issues[0].path).toEqual(['csv', 'excludedRuns', 0, 'from']);
    const numeric = dataSourceSchema.safeParse({ path: 'x.csv', csv: { excludedRuns: [{ from: 40 }] } });
    expect(numeric.error?.issues[0].message).toContain('expected a run label in quotes');
  });

  it('a project with the field round-trips through save and open unchanged', () => {
    const sample = JSON.parse(readFileSync(resolve(__dirname, '../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'));
    sample.data.csv = { ...sample.data.csv, excludedRuns: [{ from: '1', to: '15', reason: 'before the retune of 3 March' }, { from: '27', reason: 'trip test' }] };
    const first = parseProjectText(JSON.stringify(sample), 'p.spcritic');
    if (!first.ok) throw new Error(first.problems[0].message);
    const saved = serializeProject(first.value.document);
    const again = parseProjectText(saved, 'p.spcritic');
    if (!again.ok) throw new Error(again.problems[0].message);
    expect(again.value.document).toEqual(first.value.document);
    expect(serializeProject(again.value.document)).toBe(saved);
    expect(JSON.parse(saved).data.csv.excludedRuns).toEqual(sample.data.csv.excludedRuns);
  });

  it('a misspelt field is refused naming the closest known one', () => {
    const sample = JSON.parse(readFileSync(resolve(__dirname, '../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'));
    sample.data.csv = { ...sample.data.csv, excludedRun: [{ from: '1' }] };
    const loaded = parseProjectText(JSON.stringify(sample), 'p.spcritic');
    expect(loaded.ok).toBe(false);
    if (!loaded.ok) expect(loaded.problems[0].message).toContain('did you mean "excludedRuns"?');
  });
});
