/**
 * A flag cell's lone "0" or "1" is read straight from its byte (columnSink.ts); every other cell goes
 * through readFlag (numericCell.ts). On random flag columns — 0 and 1, the other words readFlag
 * takes, padded, quoted, empty and junk cells — each value and each problem is the one readFlag
 * gives for the cell's text, through the fast record path and the general one alike.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readColumns } from '../../src/data/columnReader';
import { readFlag } from '../../src/data/numericCell';
import { RowProblems } from '../../src/data/rowProblems';

const CELL = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom('0', '1') },
  fc.constantFrom('true', 'FALSE', 'yes', 'n', 'T', 'f', '', ' 1', '0 ', '"1"', '"0"', '2', '01', '10', '-1', '1.0', 'x', 'maybe'),
);

/** The flag column read from `cells` (second field, after a number) with or without the fast record path. */
function readFlags(cells: string[], fastPath: boolean) {
  const text = `x,flag\n${cells.map((c, r) => `${r},${c}`).join('\n')}\n`;
  const requests = [{ name: 'x', field: 0, kind: 'number' as const }, { name: 'flag', field: 1, kind: 'flag' as const }];
  const problems = new RowProblems();
  const table = readColumns({ bytes: new TextEncoder().encode(text), start: 7, firstLine: 2 }, ',', '.', 2, requests, problems, fastPath);
  return { values: Array.from(table.flags.get('flag')!), problems: problems.inFileOrder() };
}

describe('flag cells', () => {
  it('2,000 random flag columns read as readFlag reads each cell', () => {
    fc.assert(
      fc.property(fc.array(CELL, { minLength: 1, maxLength: 40 }), fc.boolean(), (cells, fastPath) => {
        const { values, problems } = readFlags(cells, fastPath);
        cells.forEach((cell, r) => {
          const reading = readFlag(cell.startsWith('"') ? cell.slice(1, -1) : cell);
          expect(values[r]).toBe(reading.ok ? reading.value : NaN);
          expect(problems.some((p) => p.record === r && p.kind === 'bad-flag')).toBe(!reading.ok);
        });
      }),
      { seed: 35, numRuns: 2000 },
    );
  });
});
