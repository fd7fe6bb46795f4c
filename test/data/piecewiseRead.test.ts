/**
 * A file read in pieces (pieceSource.ts, byteWindow.ts, pieceFacts.ts) must import exactly as the
 * same bytes held whole: the whole-file path is the reference (its own tests check it against RFC
 * 4180 and the bad-input corpus). Windows far smaller than a record make every record cross a
 * window's end somewhere — inside a number, a quoted line break, a CR before its LF.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runSteps } from '../../src/core/fqe/cancellation';
import { ByteWindow } from '../../src/data/byteWindow';
import { readColumns, type ColumnRequest } from '../../src/data/columnReader';
import { readHeader } from '../../src/data/csvHeader';
import { recordBound } from '../../src/data/csvScanner';
import { readTableSteps } from '../../src/data/csvTable';
import { importDataset } from '../../src/data/importDataset';
import { pieceFactsSteps } from '../../src/data/pieceFacts';
import type { PieceSource } from '../../src/data/pieceSource';
import { RowProblems } from '../../src/data/rowProblems';
import { sourceBytes } from '../../src/data/sourceBytes';
import { memorySource } from './memorySource';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

const bytesOf = (v: ArrayBufferView) => Buffer.from(v.buffer, v.byteOffset, v.byteLength);


const CELL = fc.oneof(
  { weight: 6, arbitrary: fc.double({ noNaN: true, min: -1e6, max: 1e6 }).map((x) => String(+x.toFixed(3))) },
  fc.constantFrom('', 'abc', '"7"', '"a\nb"', '"x""y"', '"a\r\nb"', '"c" ', '"d"e', ' 5', '1e3', '2024-01-02 03:04:05', '13/04/2024 10:00', '\u00e9t\u00e9', '9'.repeat(20)),
);

const REQUESTS: ColumnRequest[] = [
  { name: 'a', field: 0, kind: 'number' }, { name: 'b', field: 1, kind: 'number' }, { name: 'c', field: 2, kind: 'label' }, { name: 'd', field: 3, kind: 'timestamp' },
];

function readWhole(bytes: Uint8Array) {
  const header = readHeader(bytes, 0, ',');
  if (!header.ok) throw new Error(header.reason);
  const problems = new RowProblems();
  const table = readColumns({ bytes, start: header.dataStart, firstLine: header.firstDataLine }, ',', '.', 4, REQUESTS, problems);
  return { table, problems: problems.inFileOrder() };
}

function readPieces(bytes: Uint8Array, windowBytes: number, chunk: number) {
  const header = readHeader(bytes, 0, ',');
  if (!header.ok) throw new Error(header.reason);
  const problems = new RowProblems();
  const window = new ByteWindow(memorySource(bytes, chunk), header.dataStart, windowBytes);
  const streamed = { window, capacity: recordBound(bytes, header.dataStart) };
  const table = readColumns({ bytes: window.view, start: 0, firstLine: header.firstDataLine, streamed }, ',', '.', 4, REQUESTS, problems);
  return { table, problems: problems.inFileOrder() };
}

describe('records read through a window = records read whole', () => {
  it('1,000 random tables with quoted line breaks, every line ending and an unclosed quote now and then', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(CELL, CELL, fc.constantFrom('A', 'B', '"C"', ''), CELL), { maxLength: 25 }), fc.constantFrom('\n', '\r\n', '\r'),
        fc.constantFrom('', '\n', '\n\n', '\r\n  \r\n', '\n"open'), fc.integer({ min: 1, max: 48 }), fc.integer({ min: 1, max: 9 }),
        (rows, lineEnd, tail, windowBytes, chunk) => {
          const text = 'a,b,c,d' + lineEnd + rows.map((r) => r.join(',')).join(lineEnd) + tail;
          const bytes = new TextEncoder().encode(text);
          expect(readPieces(bytes, windowBytes, chunk)).toEqual(readWhole(bytes));
        }),
      { seed: 11, numRuns: 1000 },
    );
  });
});

describe('the first pass over the pieces', () => {
  it('counts line breaks as recordBound does and finds UTF-8 as sourceBytes does, for any piece size', () => {
    const BYTE = fc.constantFrom(0x61, 0x0a, 0x0d, 0x22, 0x20, 0x00, 0xc3, 0xa9, 0xff, 0xef, 0xbb, 0xbf);
    fc.assert(
      fc.property(fc.array(BYTE, { minLength: 1, maxLength: 60 }), fc.integer({ min: 1, max: 9 }), (list, piece) => {
        const bytes = Uint8Array.from(list);
        const facts = runSteps(pieceFactsSteps(memorySource(bytes), piece));
        expect(facts.lineBreaks).toBe(recordBound(bytes) - 1);
        const whole = sourceBytes(bytes);
        expect(facts.plainUtf8).toBe(whole.ok && whole.bytes === bytes);
      }),
      { seed: 5, numRuns: 3000 },
    );
  });
});

const CSV: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
const ROLES: ColumnRoles = {
  states: [{ column: 'level', unit: 'm' }, { column: 'flow', unit: 'm3/h' }],
  actions: [{ column: 'valve', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'column', column: 'run' },
};

/** A semicolon, decimal-comma log of `rows` rows with a bad row now and then (seeded by the row number; invented demo data). */
function log(rows: number, lineEnd: string, fault: (i: number) => string | null = () => null): string {
  const lines = ['level;flow;valve;cost;run;note'];
  for (let i = 0; i < rows; i++) {
    const cells = [`${(i % 97) / 10}`.replace('.', ','), `${(i * 7) % 13},5`, `${50 + (i % 11)}`, `${(i % 5) / 4}`.replace('.', ','), `R${Math.floor(i / 700)}`, i % 9 === 0 ? '"two\nlines"' : 'ok'];
    lines.push(fault(i) ?? cells.join(';'));
  }
  return lines.join(lineEnd) + lineEnd;
}

function tableBothWays(bytes: Uint8Array, csv: CsvSettings = CSV, sizes = { head: 70_000, window: 333 }) {
  const whole = runSteps(readTableSteps(bytes.slice(), 'log.csv', csv, ROLES));
  const pieces = runSteps(readTableSteps(memorySource(bytes, 5000), 'log.csv', csv, ROLES, sizes));
  return { whole, pieces };
}

describe('an import read in pieces = the same file read whole', () => {
  const cases: [string, () => Uint8Array][] = [
    ['LF', () => new TextEncoder().encode(log(4000, '\n'))],
    ['CRLF with a byte-order mark', () => new TextEncoder().encode('\uFEFF' + log(4000, '\r\n'))],
    ['lone CR', () => new TextEncoder().encode(log(4000, '\r'))],
    ['bad rows: ragged, a stray quote, text in a number column, blank lines', () => new TextEncoder().encode(log(4000, '\n', (i) => (i % 501 === 7 ? '1;2' : i % 733 === 3 ? '1;"2"x;3;4;R0;n' : i % 611 === 5 ? 'a;b;c;d;R0;n' : i % 900 === 1 ? '' : null)))],
    ['a quote never closed near the end', () => new TextEncoder().encode(log(4000, '\n', (i) => (i === 3990 ? '1;2;3;4;R5;"open' : null)))],
    ['blank lines at the end', () => new TextEncoder().encode(log(4000, '\n') + '\n\n  \n')],
    ['Windows-1252 (read whole)', () => Uint8Array.from([...new TextEncoder().encode(log(4000, '\n'))].map((b, i) => (i === 5000 ? 0xe9 : b)))],
    ['a header longer than the head (read whole)', () => new TextEncoder().encode(log(10, '\n').replace('note', 'x;'.repeat(36_000) + 'note').replace(/ok\n/g, 'ok' + ';'.repeat(36_000) + '\n'))],
  ];
  for (const [name, bytesOf] of cases) {
    it(name, () => {
      const bytes = bytesOf();
      expect(bytes.length).toBeGreaterThan(70_000);
      const { whole, pieces } = tableBothWays(bytes);
      expect(pieces).toEqual(whole);
      const excluded = tableBothWays(bytes, { ...CSV, badRows: 'exclude' });
      expect(excluded.pieces).toEqual(excluded.whole);
    });
  }

  it('the transitions of a 3 MB log read with the default head and window, bit for bit', () => {
    const bytes = new TextEncoder().encode(log(140_000, '\r\n'));
    expect(bytes.length).toBeGreaterThan(2 * 1024 * 1024 + 4096);
    const whole = importDataset(bytes, 'log.csv', CSV, ROLES);
    const pieces = importDataset(memorySource(bytes, 1 << 20), 'log.csv', CSV, ROLES);
    if (!whole.ok || !pieces.ok) throw new Error('the log should import');
    expect(whole.value.transitions.count).toBeGreaterThan(100_000);
    const { transitions: a, ...restOfWhole } = whole.value, { transitions: b, ...restOfPieces } = pieces.value;
    for (const [key, value] of Object.entries(a)) {
      const other = (b as unknown as Record<string, unknown>)[key];
      if (ArrayBuffer.isView(value)) expect(bytesOf(other as ArrayBufferView).equals(bytesOf(value)), key).toBe(true);
      else expect(other, key).toEqual(value);
    }
    expect(restOfPieces).toEqual(restOfWhole);
    expect(pieces.warnings).toEqual(whole.warnings);
  });

  it('a file that ends early or gains records between the passes is refused in words, naming the file', () => {
    const bytes = new TextEncoder().encode(log(4000, '\n'));
    const short: PieceSource = { byteLength: bytes.length + 100, read: memorySource(bytes).read };
    const shortResult = runSteps(readTableSteps(short, 'log.csv', CSV, ROLES, { head: 70_000, window: 4096 }));
    expect(shortResult.ok).toBe(false);
    if (!shortResult.ok) expect(shortResult.problems[0]).toMatchObject({ kind: 'file-changed', where: 'log.csv' });
    // Same length, more line breaks after the first pass: the columns counted could not hold them.
    const more = new TextEncoder().encode(log(4000, '\n').replace(/;ok\n/g, '\n').padEnd(bytes.length, '\n'));
    let served = 0;
    const changing: PieceSource = {
      byteLength: bytes.length,
      read: (into, offset, length, position) => {
        const from = served >= 70_000 + bytes.length ? more : bytes; // after the head and the first pass
        const n = Math.min(length, bytes.length - position);
        into.set(from.subarray(position, position + n), offset);
        served += n;
        return n;
      },
    };
    const changed = runSteps(readTableSteps(changing, 'log.csv', CSV, ROLES, { head: 70_000, window: 4096 }));
    expect(changed.ok).toBe(false);
    if (!changed.ok) expect(changed.problems[0]).toMatchObject({ kind: 'file-changed', where: 'log.csv' });
  });
});
