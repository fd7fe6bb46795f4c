/**
 * Property tests (fast-check, fixed seeds): tables written in any supported dialect — delimiter,
 * decimal mark, RFC 4180 quoting (minimal, all, or at random), CRLF or LF, with or without BOM
 * and final line break — read back to exactly the same doubles; and arbitrary bytes or CSV-like
 * noise never throw, only fail with readable problems.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { importDataset } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

const NAMES = ['level, upper', 's_next', 'valve', 'reward'];
const ROLES: ColumnRoles = {
  states: [{ column: 'level, upper', unit: 'm' }],
  actions: [{ column: 'valve', unit: '%' }],
  reward: { kind: 'column', column: 'reward', sense: 'reward' },
  nextState: { kind: 'columns', columns: ['s_next'] },
  episode: { kind: 'single' },
};

const finiteDouble = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }).map((v) => (v === 0 ? 0 : v));
const noteText = fc.string({ unit: fc.constantFrom('a', 'Z', ' ', ',', ';', '\t', '"', '\n', '\r\n', 'ä', '°'), maxLength: 8 });

const dialect = fc.record({
  delimiter: fc.constantFrom(',', ';', '\t'),
  decimalMark: fc.constantFrom('.', ','),
  quoting: fc.constantFrom('minimal', 'all', 'random'),
  lineEnd: fc.constantFrom('\n', '\r\n'),
  bom: fc.boolean(),
  finalLineEnd: fc.boolean(),
  asBytes: fc.boolean(),
  declare: fc.boolean(), // pass delimiter and decimal mark, or let them be detected
});

const table = fc.record({
  rows: fc.array(fc.tuple(finiteDouble, finiteDouble, finiteDouble, finiteDouble), { minLength: 1, maxLength: 25 }),
  notes: fc.array(noteText, { minLength: 25, maxLength: 25 }),
  withNotes: fc.boolean(),
  quoteCoins: fc.array(fc.boolean(), { minLength: 160, maxLength: 160 }),
});

type Dialect = typeof dialect extends fc.Arbitrary<infer D> ? D : never;

/** One field as RFC 4180 §2.5–2.7 allows: quoted when it must be, or always, or by coin toss. */
function field(text: string, d: Dialect, coin: boolean): string {
  const mustQuote = text.includes(d.delimiter) || text.includes('"') || text.includes('\n') || text.includes('\r');
  const quote = mustQuote || d.quoting === 'all' || (d.quoting === 'random' && coin);
  return quote ? `"${text.replace(/"/g, '""')}"` : text;
}

function writeTable(t: typeof table extends fc.Arbitrary<infer T> ? T : never, d: Dialect): string {
  let coin = 0;
  const line = (cells: string[]): string => cells.map((c) => field(c, d, t.quoteCoins[coin++ % t.quoteCoins.length])).join(d.delimiter);
  const number = (v: number): string => (d.decimalMark === '.' ? String(v) : String(v).replace('.', ','));
  const lines = [line(t.withNotes ? [...NAMES, 'note'] : NAMES)];
  t.rows.forEach((row, i) => lines.push(line([...row.map(number), ...(t.withNotes ? [t.notes[i]] : [])])));
  return (d.bom ? '\uFEFF' : '') + lines.join(d.lineEnd) + (d.finalLineEnd ? d.lineEnd : '');
}

describe('round trip', () => {
  it('random tables in random dialects parse back to the same numbers', () => {
    fc.assert(
      fc.property(table, dialect, (t, d) => {
        const text = writeTable(t, d);
        const csv: CsvSettings = d.declare
          ? { delimiter: d.delimiter, decimalMark: d.decimalMark, badRows: 'stop' }
          : { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
        const result = importDataset(d.asBytes ? new TextEncoder().encode(text) : text, 'random.csv', csv, ROLES);
        if (!result.ok) throw new Error(`${JSON.stringify(text)}\n${result.problems.map((p) => `${p.where}: ${p.message}`).join('\n')}`);
        const tr = result.value.transitions;
        expect(result.value.rowCount).toBe(t.rows.length);
        expect(Array.from(tr.states)).toEqual(t.rows.map((r) => r[0]));
        expect(Array.from(tr.nextStates)).toEqual(t.rows.map((r) => r[1]));
        expect(Array.from(tr.actions)).toEqual(t.rows.map((r) => r[2]));
        expect(Array.from(tr.rewards)).toEqual(t.rows.map((r) => r[3]));
      }),
      { seed: 4180, numRuns: 400 },
    );
  });
});

describe('garbage in, readable problems out', () => {
  const readable = (problems: readonly { where: string; message: string }[]): void => {
    expect(problems.length).toBeGreaterThan(0);
    for (const p of problems) {
      expect(p.where.startsWith('noise.csv')).toBe(true);
      expect(p.message.length).toBeGreaterThan(10);
      expect(p.message).not.toMatch(/undefined|\[object/);
    }
  };

  it('random bytes never throw: they fail with problems naming the file', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 3000 }), fc.constantFrom<CsvSettings['badRows']>('stop', 'exclude'), (bytes, badRows) => {
        const result = importDataset(bytes, 'noise.csv', { delimiter: 'auto', decimalMark: 'auto', badRows }, ROLES);
        expect(result.ok).toBe(false);
        if (!result.ok) readable(result.problems);
      }),
      { seed: 1979, numRuns: 300 },
    );
  });

  it('CSV-like noise under a valid header never throws; successes account for every row', () => {
    const noise = fc.string({ unit: fc.constantFrom('0', '1', '7', '.', ',', ';', '\t', '"', '\n', '\r\n', ' ', '-', 'e', 'x'), maxLength: 400 });
    fc.assert(
      fc.property(noise, fc.constantFrom<CsvSettings['badRows']>('stop', 'exclude'), (body, badRows) => {
        const text = `${NAMES.map((n) => `"${n}"`).join(',')}\n${body}`;
        const result = importDataset(text, 'noise.csv', { delimiter: ',', decimalMark: 'auto', badRows }, ROLES);
        if (!result.ok) return readable(result.problems);
        const { transitions: t, excluded, rowCount, summary } = result.value;
        expect(t.count + excluded.length).toBe(rowCount); // next-state columns: every kept row is a transition
        expect(summary.excludedRowCount).toBe(excluded.length);
        for (const x of [t.states, t.nextStates, t.actions, t.rewards]) expect(x.every(Number.isFinite)).toBe(true);
        for (const e of excluded) expect(e.line >= 2 && e.line <= rowCount + 1).toBe(true);
      }),
      { seed: 8080, numRuns: 400 },
    );
  });
});
