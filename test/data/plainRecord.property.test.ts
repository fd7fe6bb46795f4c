/**
 * The import's fast path (plainRecord.ts) must decide nothing the general scanner and cell readers
 * would decide differently: random tables of plain, padded, quoted, signed, exponent and long
 * numbers (and a timestamp column of plain seconds with a date now and then), in every dialect,
 * import to the same transitions, rows and problems with the fast path
 * as without it (readColumns' last argument turns it off for the reference).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readColumns } from '../../src/data/columnReader';
import { readHeader } from '../../src/data/csvHeader';
import { RowProblems } from '../../src/data/rowProblems';
import type { ColumnRequest } from '../../src/data/columnReader';

const CELL = fc.oneof(
  fc.double({ noNaN: true }).map(String), fc.integer().map(String), fc.constantFrom('1e22', '1e23', '123456789012345', '1234567890123456', '0.000', '-0', '+7', ' 5', '5 ', '"5"', '""', '5x', '', 'e5', '1e', '.5', '5.', '1.2.3', '1e-22', '1e-23', '00012', '9'.repeat(30)),
);

/** Timestamp cells: plain seconds mostly, and now and then a date (readable in one or both day/month orders) or junk. */
const TIME = fc.oneof({ weight: 4, arbitrary: CELL }, fc.constantFrom('2024-01-02 03:04:05', '03/04/2024 10:00', '13/04/2024 10:00', '04/13/2024 10:00', '31/02/2024 10:00', 'noon'));

function read(text: string, delimiter: ',' | ';', mark: '.' | ',', withFastPath: boolean) {
  const bytes = new TextEncoder().encode(text);
  const header = readHeader(bytes, 0, delimiter);
  if (!header.ok) throw new Error(header.reason);
  const requests: ColumnRequest[] = [
    { name: 'a', field: 0, kind: 'number' }, { name: 'b', field: 1, kind: 'number' }, { name: 'a', field: 0, kind: 'timestamp' }, { name: 'c', field: 2, kind: 'label' },
    { name: 'd', field: 3, kind: 'timestamp' },
  ];
  const problems = new RowProblems();
  const table = readColumns({ bytes, start: header.dataStart, firstLine: header.firstDataLine }, delimiter, mark, 4, requests, problems, withFastPath);
  return { table, problems: problems.inFileOrder() };
}

describe('fast path = general path', () => {
  it('2,000 random tables read the same numbers, labels, timestamps and problems either way', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(CELL, CELL, fc.constantFrom('A', 'B', '"C"', ''), TIME), { maxLength: 30 }), fc.constantFrom<[',' | ';', '.' | ',']>([',', '.'], [';', ','], [';', '.']), fc.constantFrom('\n', '\r\n', '\r'),
        (rows, [delimiter, mark], lineEnd) => {
          const text = ['a', 'b', 'c', 'd'].join(delimiter) + lineEnd + rows.map((r) => r.map((c) => (mark === ',' ? c.replace('.', ',') : c)).join(delimiter)).join(lineEnd);
          const fast = read(text, delimiter, mark, true);
          const general = read(text, delimiter, mark, false);
          expect(fast.table.recordCount).toBe(general.table.recordCount);
          expect(fast.table.lastTextLine).toBe(general.table.lastTextLine);
          expect(Array.from(fast.table.numbers.get('a')!)).toEqual(Array.from(general.table.numbers.get('a')!));
          expect(Array.from(fast.table.numbers.get('b')!)).toEqual(Array.from(general.table.numbers.get('b')!));
          expect(Array.from(fast.table.timestamps.get('a')!.dayFirst)).toEqual(Array.from(general.table.timestamps.get('a')!.dayFirst));
          expect(Array.from(fast.table.labels.get('c')!.codes)).toEqual(Array.from(general.table.labels.get('c')!.codes));
          const [fastTime, generalTime] = [fast.table.timestamps.get('d')!, general.table.timestamps.get('d')!];
          expect(Array.from(fastTime.dayFirst)).toEqual(Array.from(generalTime.dayFirst));
          expect(Array.from(fastTime.monthFirst)).toEqual(Array.from(generalTime.monthFirst));
          expect([...fastTime.oneOrderOnly]).toEqual([...generalTime.oneOrderOnly]);
          expect(fast.problems).toEqual(general.problems);
        }),
      { seed: 31, numRuns: 2000 },
    );
  });
});
