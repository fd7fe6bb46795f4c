/**
 * Fuzzing CSV bytes (fast-check, fixed seeds): tables under the tiny project's header whose cells
 * come from a hostile pool (quotes opened and never closed, stray quotes, NUL, CR, ANSI escapes,
 * delimiters of every dialect, huge and non-finite numbers, empty cells, very long cells), and raw
 * bytes. The importer must never throw; a success must account for every row (transitions +
 * excluded + unused = rows read) with finite transitions; every message stays short. A sample goes
 * through the command line, which must answer 0–3.
 */
import { rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importDataset } from '../../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';
import { evaluateChecked, fuzzFolder, residentMiB, type FuzzFolder } from './fuzzHarness';

const ROLES: ColumnRoles = {
  states: [{ column: 'level', unit: 'm' }],
  actions: [{ column: 'valve', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'column', column: 'run' },
};

const CELLS = [
  '1', '1.5', '-0', '1e308', '1e400', '-1e-320', '1,5', '0x10', 'NaN', '-Inf', '', ' ', '"', '""', '"a"b', '"1.5"', '"unclosed',
  'a"b', '\u0000', '\r', '\n', '\r\n', '\u001b[31m', '\u009b', '\u202e', ';', '\t', ',', 'x'.repeat(5000), '9'.repeat(400), 'ä°', '#',
  '=cmd|calc', 'A', 'B',
];

const cell = fc.oneof({ arbitrary: fc.double({ noNaN: true }).map(String), weight: 3 }, { arbitrary: fc.integer({ min: 0, max: 3 }).map(String), weight: 2 }, { arbitrary: fc.constantFrom(...CELLS), weight: 4 });
const number = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map(String), fc.integer({ min: -5, max: 5 }).map(String));
const cleanRow = fc.tuple(number, number, number, fc.constantFrom('A', 'B', 'C')).map((r) => [...r]);
const row = fc.oneof({ arbitrary: cleanRow, weight: 9 }, { arbitrary: fc.array(cell, { minLength: 3, maxLength: 5 }), weight: 1 });
const table = fc.tuple(fc.array(row, { minLength: 0, maxLength: 40 }), fc.constantFrom(',', ';', '\t'), fc.constantFrom('\n', '\r\n', '\r')).map(
  ([rows, delimiter, lineEnd]) => ['level,valve,cost,run'.replaceAll(',', delimiter), ...rows.map((r) => r.join(delimiter))].join(lineEnd),
);
const settings = fc.record({
  delimiter: fc.constantFrom<CsvSettings['delimiter']>('auto', ',', ';', '\t'),
  decimalMark: fc.constantFrom<CsvSettings['decimalMark']>('auto', '.', ','),
  badRows: fc.constantFrom<CsvSettings['badRows']>('stop', 'exclude'),
});

/** True when the import succeeded (and its accounting was checked). */
function checkImport(source: string | Uint8Array, csv: CsvSettings): boolean {
  const result = importDataset(source, 'fuzz.csv', csv, ROLES);
  if (!result.ok) {
    expect(result.problems.length).toBeGreaterThan(0);
    expect(result.problems.length).toBeLessThanOrEqual(52);
    for (const p of result.problems) expect(p.message.length + p.where.length).toBeLessThan(1000);
    return false;
  }
  const { transitions: t, episodeReport, rowCount, excluded } = result.value;
  const account = episodeReport.find((line) => line.startsWith('Rows: '))!;
  const [read, transitions, excludedRows, unused] = (account.match(/[\d,]+(?= (read|transitions|excluded|unused))/g) ?? []).map((n) => Number(n.replace(/,/g, '')));
  expect(read).toBe(rowCount);
  expect(transitions + excludedRows + unused).toBe(read);
  expect(transitions).toBe(t.count);
  expect(excludedRows).toBe(excluded.length);
  for (const x of [t.states, t.nextStates, t.actions, t.rewards, t.startStates]) expect(x.every(Number.isFinite)).toBe(true);
  for (const w of result.warnings ?? []) expect(w.message.length).toBeLessThan(1000);
  return true;
}

describe('CSV bytes', () => {
  it('2,000 hostile tables: no exception, every row accounted for, short messages, bounded memory', () => {
    const before = residentMiB();
    let imported = 0;
    fc.assert(fc.property(table, settings, (text, csv) => void (imported += checkImport(text, csv) ? 1 : 0)), { seed: 4180, numRuns: 2000 });
    expect(residentMiB() - before).toBeLessThan(300);
    expect(imported).toBeGreaterThan(100); // the accounting was checked on real successes, not only on failures
  });

  it('1,000 raw byte strings: no exception, short messages', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 4000 }), settings, (bytes, csv) => void checkImport(bytes, csv)), { seed: 4181, numRuns: 1000 });
  });

  describe('through the command line', () => {
    let f: FuzzFolder;
    beforeAll(async () => {
      f = await fuzzFolder('spc-fuzz-csv-');
    });
    afterAll(() => rm(f.folder, { recursive: true, force: true }));

    it('300 hostile tables as the project\'s data: exit 0–3', async () => {
      const project = JSON.parse(f.projectText);
      await fc.assert(
        fc.asyncProperty(table, fc.constantFrom<CsvSettings['badRows']>('stop', 'exclude'), async (text, badRows) => {
          await writeFile(join(f.folder, 'fuzz.csv'), text);
          await evaluateChecked(f, JSON.stringify({ ...project, data: { path: 'fuzz.csv', csv: { badRows } } }));
        }),
        { seed: 4182, numRuns: 300 },
      );
    });
  });
});
