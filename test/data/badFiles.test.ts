/**
 * The bad-input corpus (test/fixtures/bad/): every file must fail (or warn) with a precise
 * problem — its kind, where (file, line as a spreadsheet numbers it, column) and what — asserted
 * exactly, so no case can pass by any failure at all.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportProblem } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

const FIXTURES = join(__dirname, '..', 'fixtures', 'bad');

const BASE_ROLES: ColumnRoles = {
  states: [{ column: 'level_m', unit: 'm' }],
  actions: [{ column: 'valve_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'single' },
};
const STOP: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
const timeGap: Partial<ColumnRoles> = { episode: { kind: 'timeGap', column: 'time' } };

interface Case {
  file: string;
  roles?: Partial<ColumnRoles>;
  csv?: Partial<CsvSettings>;
  /** The first problem, exactly: kind and where; message must contain `message`. */
  kind: ImportProblem['kind'];
  where: string;
  message: string;
  /** Number of problems reported, when it matters. */
  problems?: number;
}

const header = (file: string): string => `${file}, header (line 1)`;

const FAILURES: Case[] = [
  { file: 'empty.csv', kind: 'empty-file', where: 'empty.csv', message: 'the file is empty' },
  { file: 'blank-lines-only.csv', kind: 'empty-file', where: 'blank-lines-only.csv', message: 'the file is empty' },
  { file: 'header-only.csv', kind: 'header-only', where: 'header-only.csv, line 2', message: 'has a header line but no data rows' },
  { file: 'blank-header.csv', kind: 'blank-header', where: 'blank-header.csv, line 1', message: 'the first line is blank; expected the header' },
  // UTF-16 and Windows-1252 files are read now (test/data/encodings.test.ts); a zero byte is still refused.
  { file: 'binary.csv', kind: 'not-utf8', where: 'binary.csv', message: 'the file holds a zero byte at byte 47' },
  { file: 'missing-column.csv', kind: 'missing-column', where: header('missing-column.csv'), message: 'no column named "level_m" (state 1); did you mean "levl_m"?' },
  { file: 'missing-episode-column.csv', roles: { episode: { kind: 'column', column: 'Run' } }, kind: 'missing-column', where: header('missing-episode-column.csv'), message: 'no column named "Run" (run column); did you mean "run"?' },
  { file: 'timegap-missing-column.csv', roles: { episode: { kind: 'timeGap', column: 'timestamp' } }, kind: 'missing-column', where: header('timegap-missing-column.csv'), message: 'no column named "timestamp" (timestamp column for runs); did you mean "time"?' },
  { file: 'missing-next-state-column.csv', roles: { nextState: { kind: 'columns', columns: ['level_nxt_m'] } }, kind: 'missing-column', where: header('missing-next-state-column.csv'), message: 'no column named "level_nxt_m" (next state 1); did you mean "level_next_m"?' },
  { file: 'duplicate-header.csv', kind: 'duplicate-column', where: header('duplicate-header.csv'), message: 'the column name "level_m" (state 1) appears in fields 2 and 4' },
  { file: 'next-state-count.csv', roles: { nextState: { kind: 'columns', columns: ['level_next_m', 'cost'] } }, kind: 'next-state-count', where: 'next-state-count.csv, next-state columns', message: 'expected 1 next-state column (one per state, in the order of the states), got 2' },
  { file: 'not-a-number.csv', kind: 'not-a-number', where: 'not-a-number.csv, line 17, column level_m', message: '"1,2.3" is not a number', problems: 1 },
  { file: 'empty-cell.csv', kind: 'empty-cell', where: 'empty-cell.csv, line 5, column valve_pct', message: 'the cell is empty; expected a number' },
  { file: 'nan-cell.csv', kind: 'not-finite', where: 'nan-cell.csv, line 4, column cost', message: '"NaN" is not a finite number' },
  { file: 'infinity-cell.csv', kind: 'not-finite', where: 'infinity-cell.csv, line 6, column level_m', message: '"-Inf" is not a finite number' },
  { file: 'overflow-cell.csv', kind: 'not-finite', where: 'overflow-cell.csv, line 3, column valve_pct', message: '"1e400" is too large for a double-precision number' },
  { file: 'hex-cell.csv', kind: 'not-a-number', where: 'hex-cell.csv, line 5, column level_m', message: '"0x1A" is not a number' },
  { file: 'wrong-decimal-mark.csv', csv: { decimalMark: '.' }, kind: 'not-a-number', where: 'wrong-decimal-mark.csv, line 2, column level_m', message: '"1,25" is not a number; expected a number such as 12.5 (the decimal mark for this file is ".", not ",")', problems: 10 },
  { file: 'too-many-fields.csv', kind: 'ragged-row', where: 'too-many-fields.csv, line 6', message: 'too many fields: found 5, expected 4 as in the header', problems: 1 },
  { file: 'too-few-fields.csv', kind: 'ragged-row', where: 'too-few-fields.csv, line 3', message: 'too few fields: found 3, expected 4 as in the header', problems: 1 },
  { file: 'blank-line-inside.csv', kind: 'blank-line', where: 'blank-line-inside.csv, line 4', message: 'the line is blank; expected 4 fields', problems: 1 },
  { file: 'unclosed-quote.csv', kind: 'quote', where: 'unclosed-quote.csv, line 5', message: 'never closed', problems: 1 },
  { file: 'stray-quote.csv', kind: 'quote', where: 'stray-quote.csv, line 4', message: 'must be written twice ("")' },
  { file: 'timestamp-unparseable.csv', roles: timeGap, kind: 'bad-timestamp', where: 'timestamp-unparseable.csv, line 7, column time', message: '"12:00 yesterday" is not a timestamp', problems: 1 },
  { file: 'timestamp-backwards.csv', roles: timeGap, kind: 'timestamp-backwards', where: 'timestamp-backwards.csv, line 5, column time', message: 'the timestamp goes backwards by 10 s from line 4', problems: 1 },
  { file: 'timestamp-invalid-date.csv', roles: timeGap, kind: 'invalid-date', where: 'timestamp-invalid-date.csv, line 3, column time', message: '"31.02.2024 12:00:00" is not a valid date or time', problems: 1 },
  { file: 'date-order-conflict.csv', roles: timeGap, kind: 'invalid-date', where: 'date-order-conflict.csv, line 6, column time', message: '"01/17/2024 12:00" is not a valid day/month/year date; this file’s dates read in that order because line 2 has a day above 12 in first place', problems: 1 },
  {
    file: 'expression-unknown-column.csv', roles: { reward: { kind: 'expression', expression: '(levl_m - 2)^2 + 0.1*valve_pct', sense: 'cost' } },
    kind: 'expression-unknown-column', where: 'expression-unknown-column.csv, cost expression',
    message: 'no column named "levl_m"; did you mean "level_m"? (character 2)\n  (levl_m - 2)^2 + 0.1*valve_pct\n   ^',
  },
  {
    file: 'expression-syntax.csv', roles: { reward: { kind: 'expression', expression: '(level_m - 2))^2', sense: 'cost' } },
    kind: 'expression-syntax', where: 'expression-syntax.csv, cost expression',
    message: 'unexpected ")"; expected an operator or the end of the expression (character 14)\n  (level_m - 2))^2\n               ^',
  },
  { file: 'expression-not-finite.csv', roles: { reward: { kind: 'expression', expression: 'log(level_m)', sense: 'cost' } }, kind: 'reward-not-finite', where: 'expression-not-finite.csv, line 4', message: 'the cost expression gives -Infinity here (level_m = 0)', problems: 1 },
  // A cost the project declares never negative (columns.reward.atLeast 0): a logged −0.3 is a bad row, not a value to trust.
  { file: 'reward-below-declared.csv', roles: { reward: { kind: 'column', column: 'cost', sense: 'cost', atLeast: 0 } }, kind: 'reward-outside-declared', where: 'reward-below-declared.csv, line 4, column cost', message: 'the cost is -0.3 here, below 0, which the project declares it never is (columns.reward.atLeast)', problems: 1 },
  { file: 'terminal-bad-flag.csv', roles: { terminal: 'done' }, kind: 'bad-flag', where: 'terminal-bad-flag.csv, line 3, column done', message: '"maybe" is not an end-of-run flag; expected 1 or 0' },
  { file: 'episode-empty.csv', roles: { episode: { kind: 'column', column: 'run' } }, kind: 'empty-episode', where: 'episode-empty.csv, line 4, column run', message: 'the run label cell is empty' },
  { file: 'single-row-episodes.csv', roles: { episode: { kind: 'column', column: 'run' } }, kind: 'no-transitions', where: 'single-row-episodes.csv', message: 'no transitions could be formed' },
];

function run(c: Pick<Case, 'file' | 'roles' | 'csv'>) {
  const bytes = new Uint8Array(readFileSync(join(FIXTURES, c.file)));
  return importDataset(bytes, c.file, { ...STOP, ...c.csv }, { ...BASE_ROLES, ...c.roles });
}

describe('bad files fail with a precise first problem', () => {
  it.each(FAILURES)('$file → $kind at "$where"', (c) => {
    const result = run(c);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const first = result.problems[0] as ImportProblem;
    expect(first.kind).toBe(c.kind);
    expect(first.where).toBe(c.where);
    expect(first.message).toContain(c.message);
    // An import stopped by rows that cannot be used closes with how to leave them out (kind 'bad-rows').
    const rows = result.problems.filter((p) => (p as ImportProblem).kind !== 'bad-rows');
    if (c.problems !== undefined) expect(rows).toHaveLength(c.problems);
    const hint = result.problems.find((p) => (p as ImportProblem).kind === 'bad-rows') as ImportProblem | undefined;
    if (hint) {
      expect(result.problems[result.problems.length - 1]).toBe(hint);
      expect(hint.message).toContain('“Rows that cannot be used” to “Leave them out and list them”');
      expect(hint.message).toContain('"badRows": "exclude"');
      expect(hint.rows).toBeGreaterThan(0);
    }
  });

  it('every case stopped by its rows (a cell, a line, a timestamp) says how to leave those rows out', () => {
    const rowKinds = new Set(['ragged-row', 'quote', 'empty-cell', 'not-a-number', 'not-finite', 'bad-flag', 'empty-episode', 'bad-timestamp', 'invalid-date', 'timestamp-backwards', 'reward-not-finite', 'reward-outside-declared', 'blank-line']);
    const stoppedByRows = FAILURES.filter((c) => rowKinds.has(c.kind) && c.csv?.badRows !== 'exclude');
    expect(stoppedByRows.length).toBeGreaterThanOrEqual(8);
    for (const c of stoppedByRows) {
      const result = run(c);
      expect(!result.ok && (result.problems.at(-1) as ImportProblem).kind, c.file).toBe('bad-rows');
    }
  });

  it('the corpus has at least 25 failing cases, each on its own fixture', () => {
    expect(new Set(FAILURES.map((c) => c.file)).size).toBeGreaterThanOrEqual(25);
  });
});

describe('long problem lists and exclusion', () => {
  it('many-bad-rows.csv lists the first 50 problems in file order, then says how many more', () => {
    const result = run({ file: 'many-bad-rows.csv' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toHaveLength(52);
    expect(result.problems[0].where).toBe('many-bad-rows.csv, line 2, column level_m');
    expect(result.problems[49].where).toBe('many-bad-rows.csv, line 51, column level_m');
    const last = result.problems[50] as ImportProblem;
    expect(last.kind).toBe('more-problems');
    expect(last.message).toContain('… and 10 more problems (60 in all, the first 50 shown)');
    // 60 problems on 60 rows (one bad cell per row): the closing hint counts rows, as data too.
    expect(result.problems[51]).toMatchObject({ kind: 'bad-rows', rows: 60, where: 'many-bad-rows.csv' });
    expect(result.problems[51].message).toMatch(/^60 rows cannot be used\. To import without them/);
  });

  it('all-rows-bad.csv with bad rows excluded: every row listed, then "no row is left"', () => {
    const result = run({ file: 'all-rows-bad.csv', csv: { badRows: 'exclude' } });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map((p) => p.where)).toEqual([2, 3, 4, 5].map((l) => `all-rows-bad.csv, line ${l}, column level_m`).concat('all-rows-bad.csv'));
    expect((result.problems[4] as ImportProblem).kind).toBe('no-usable-rows');
  });

  it('not-a-number.csv with bad rows excluded: line 17 listed, the chain split there', () => {
    const result = run({ file: 'not-a-number.csv', csv: { badRows: 'exclude' } });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { excluded, transitions, episodeReport } = result.value;
    expect(excluded).toEqual([{ line: 17, column: 'level_m', kind: 'not-a-number', reason: expect.stringContaining('"1,2.3" is not a number') }]);
    // 20 rows, one episode: 19 steps, of which 16→17 and 17→18 need the excluded row.
    expect(transitions.count).toBe(17);
    expect(Array.from(transitions.sourceLine)).not.toContain(16);
    expect(Array.from(transitions.sourceLine)).not.toContain(17);
    expect(episodeReport.join('\n')).toContain('1 stretch of excluded rows inside a run (line 17)');
    expect(result.warnings.map((w) => (w as ImportProblem).kind)).toEqual(['rows-excluded']);
  });
});

describe('suspicious but usable files warn', () => {
  it('constant-state.csv imports with a constant-state warning on column level_m', () => {
    const result = run({ file: 'constant-state.csv' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.warnings).toEqual([expect.objectContaining({ kind: 'constant-state', where: 'constant-state.csv, column level_m' })]);
  });

  it('unused-duplicate-header.csv imports and warns that "note" appears twice', () => {
    const result = run({ file: 'unused-duplicate-header.csv' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const [warning] = result.warnings as ImportProblem[];
    expect(warning.kind).toBe('unused-duplicate-column');
    expect(warning.message).toContain('"note" appears in fields 5 and 6');
  });
});
