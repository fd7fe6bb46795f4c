/**
 * CSV files built to hurt the importer (issue "hold under hostile input"): every data row is
 * accounted for (transition + excluded + unused = rows read), a quote never closed says how much of
 * the file it swallowed, a stray quote costs one row, start states are only true first rows, and
 * huge or binary "headers" are refused quickly in words that never echo the file.
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportedDataset } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

const EXCLUDE: CsvSettings = { delimiter: ',', decimalMark: '.', badRows: 'exclude' };
const ROLES: ColumnRoles = {
  states: [{ column: 'level', unit: 'm' }],
  actions: [{ column: 'valve', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'single' },
};

function imported(text: string, roles: Partial<ColumnRoles> = {}): { value: ImportedDataset; warnings: string[] } {
  const result = importDataset(text, 'log.csv', EXCLUDE, { ...ROLES, ...roles });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return { value: result.value, warnings: (result.warnings ?? []).map((w) => w.message) };
}

/** `rows` data rows level = i, valve = 10 i, cost = i, with an optional run column. */
function lines(rows: number, run?: (i: number) => string): string[] {
  const out = [`level,valve,cost${run ? ',run' : ''}`];
  for (let i = 1; i <= rows; i++) out.push(`${i},${10 * i},${i}${run ? `,${run(i)}` : ''}`);
  return out;
}

describe('every row is accounted for', () => {
  it('rows read = transitions + excluded + unused, and the sentence says so', () => {
    const text = lines(10);
    text[4] = '4,x,4'; // line 5 (record 4) is bad: the chain 1-2-3 | 5…10
    const { value } = imported(text.join('\n'));
    // 9 kept rows in two chains (3 and 6 rows): 2 + 5 = 7 transitions, 2 unused chain ends, 1 excluded.
    expect(value.transitions.count).toBe(7);
    expect(value.episodeReport).toContain('Rows: 10 read = 7 transitions + 1 excluded + 2 unused (kept, with no next row to pair with: the last of a run, or the row before an excluded one).');
  });

  it('a quote opened at line 81 of 161 and never closed: one row excluded that holds the other 81 lines, said in words', () => {
    const text = lines(160);
    text[80] = '80,"800,80'; // line 81
    const { value, warnings } = imported(`${text.join('\n')}\n`); // the file's final line break starts no line 162
    expect(value.rowCount).toBe(80); // lines 2–80, and the row at line 81 that runs to the end
    expect(value.excluded).toHaveLength(1);
    expect(value.excluded[0]).toMatchObject({ line: 81, kind: 'quote' });
    expect(value.excluded[0].reason).toContain('never closed, so the rest of the file — 81 lines of text, to line 161 — was read into this one row');
    expect(warnings.join('\n')).toContain("the file’s 161 lines of text hold the header and 80 rows, so rows span 80 more lines than one each");
    expect(value.episodeReport).toContain('Rows: 80 read = 78 transitions + 1 excluded + 1 unused (kept, with no next row to pair with: the last of a run, or the row before an excluded one).');
  });

  it('a stray quote costs its own row only: the rows after it are read', () => {
    const text = lines(20);
    text[5] = '5,"50"x,5'; // line 6
    const { value } = imported(text.join('\n'));
    expect(value.rowCount).toBe(20);
    expect(value.excluded.map((e) => e.line)).toEqual([6]);
    expect(value.excluded[0].reason).toContain('must be written twice');
    expect(value.transitions.count).toBe(17); // chains 1–4 and 6–20 (in rows): 3 + 14
  });
});

describe('start states are true first rows only', () => {
  const run = (i: number): string => (i <= 5 ? 'A' : i <= 10 ? 'B' : 'C');

  it('an episode whose first row is excluded keeps its transitions but has no start state, and the report says so', () => {
    const text = lines(15, run);
    text[6] = '6,x,6,B'; // line 7: the first row of run B
    const { value } = imported(text.join('\n'), { episode: { kind: 'column', column: 'run' } });
    const t = value.transitions;
    expect(t.episodeCount).toBe(3);
    expect(Array.from(t.startStates)).toEqual([1, 11]); // A's and C's first rows; B's first usable row (level 7) is mid-run
    expect(Array.from(t.startEpisode ?? [])).toEqual([0, 2]);
    expect(value.episodeReport.join('\n')).toContain('1 run lost its first row to exclusion, so its first usable row (line 8) is mid-run and not a start state; the start states are the first rows of the other 2 runs.');
  });

  it('an excluded row that readably belongs to the previous episode does not cost the next its start', () => {
    const text = lines(15, run);
    text[5] = '5,x,5,A'; // line 6: the last row of run A
    const { value } = imported(text.join('\n'), { episode: { kind: 'column', column: 'run' } });
    expect(Array.from(value.transitions.startStates)).toEqual([1, 6, 11]);
    expect(value.transitions.startEpisode).toBeUndefined();
  });

  it('a single-episode file whose first row is excluded has no start state at all', () => {
    const text = lines(6);
    text[1] = '1,x,1';
    const { value } = imported(text.join('\n'));
    expect(value.transitions.startStates.length).toBe(0);
    expect(value.transitions.count).toBe(4);
  });
});

describe('files that are not CSV logs are refused in words, never echoed', () => {
  const SECRET = 'root:x:0:0:root:/root:/bin/bash';

  it('a 10 MB header line: refused at line 1 without its content', () => {
    const header = `${SECRET},`.repeat(Math.ceil(10e6 / (SECRET.length + 1)));
    const result = importDataset(`${header}\n1,2,3\n`, 'big.csv', EXCLUDE, ROLES);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]).toMatchObject({ kind: 'header-too-long', where: 'big.csv, line 1' });
    expect(result.problems[0].message).toMatch(/the first line is 10,000,\d{3} bytes long/);
    expect(result.problems[0].message).not.toContain('root');
  });

  it('a NUL byte (a binary or device file): refused with its offset only', () => {
    const bytes = new TextEncoder().encode(`PATH=/usr/bin\0HOME=/root\0${SECRET}\0`);
    const result = importDataset(bytes, 'environ', EXCLUDE, ROLES);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems[0]).toMatchObject({ kind: 'not-utf8', where: 'environ' });
    expect(result.problems[0].message).toContain('zero byte at byte 14');
    expect(JSON.stringify(result.problems)).not.toMatch(/PATH|HOME|root/);
  });

  it('a text file that is no log: the missing columns are named, with no "did you mean" from its lines', () => {
    const text = [`${SECRET}`, 'daemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin', 'bin:x:2:2:bin:/bin:/usr/sbin/nologin'].join('\n');
    const result = importDataset(text, 'passwd', { ...EXCLUDE, delimiter: 'auto' }, ROLES);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map((p) => p.message).join('\n')).toContain('no column named "level" (state 1)');
    expect(JSON.stringify(result.problems)).not.toMatch(/root|daemon|nologin/);
  });
});
