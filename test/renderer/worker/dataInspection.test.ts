/**
 * The app's first look at a data file decodes only its head (src/renderer/src/worker/dataInspection.ts)
 * and must find what decoding the whole file found before: the same dialect, encoding, header,
 * preview rows and problems. The reference below is that earlier reading, kept here as the check:
 * the whole file through sourceText, the dialect from its text, five rows by Papa Parse.
 * Files are longer than the head (HEAD_BYTES), so the head is what the first look reads.
 */
import Papa from 'papaparse';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { resolveDialect } from '../../../src/data/csvDialect';
import { HEAD_BYTES } from '../../../src/data/csvHeader';
import { sourceText } from '../../../src/data/sourceText';
import type { CsvSettings } from '../../../src/project/schema';
import { inspectData } from '../../../src/renderer/src/worker/dataInspection';

const AUTO: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } as CsvSettings;

function wholeFileReading(bytes: Uint8Array, csv: CsvSettings) {
  const decoded = sourceText(bytes);
  if (!decoded.ok) return { problem: decoded.reason };
  const dialect = resolveDialect(decoded.text, csv.delimiter, csv.decimalMark);
  const rows = Papa.parse<string[]>(decoded.text, { delimiter: dialect.delimiter, preview: 6, skipEmptyLines: true }).data;
  const header = (rows[0] ?? []).map((n) => n.trim());
  if (header.every((n) => n === '')) return { problem: 'the header line has no column names' };
  return { header, previewRows: rows.slice(1), delimiter: dialect.delimiter, decimalMark: dialect.decimalMark, encoding: { name: decoded.encoding, how: decoded.how } };
}

/** Bytes of the longest single decode during the first look: at most the head when only the head was decoded. */
let longestDecode = 0;

afterEach(() => { vi.restoreAllMocks(); });

function firstLook(bytes: Uint8Array, csv = AUTO) {
  const decode = TextDecoder.prototype.decode;
  longestDecode = 0;
  vi.spyOn(TextDecoder.prototype, 'decode').mockImplementation(function (this: TextDecoder, input?: AllowSharedBufferSource, options?: TextDecodeOptions) {
    longestDecode = Math.max(longestDecode, input?.byteLength ?? 0);
    return decode.call(this, input, options);
  });
  const result = inspectData(bytes, 'log.csv', csv);
  vi.restoreAllMocks();
  if (!result.ok) return { problem: result.problems[0].message };
  const { header, previewRows, delimiter, decimalMark, encoding } = result.value;
  return { header, previewRows, delimiter, decimalMark, encoding };
}

/** A log of `rows` records of `line(i)` below `header`, with `newline`, long enough to pass the head. */
function log(header: string, line: (i: number) => string, newline = '\n', prefix: number[] = []): Uint8Array {
  const parts = [header];
  let length = header.length;
  for (let i = 0; length < HEAD_BYTES * 1.5; i++) {
    const text = line(i);
    parts.push(text);
    length += text.length + newline.length;
  }
  const body = new TextEncoder().encode(parts.join(newline) + newline);
  const out = new Uint8Array(prefix.length + body.length);
  out.set(prefix);
  out.set(body, prefix.length);
  return out;
}

describe('the first look at a data file longer than its head', () => {
  it('finds the comma dialect, header and five rows of a plain UTF-8 log', () => {
    const bytes = log('time,level,valve', (i) => `${i},${(i * 0.25).toFixed(2)},${i % 7}.5`);
    expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
    expect(longestDecode).toBeLessThanOrEqual(HEAD_BYTES);
    expect(firstLook(bytes)).toMatchObject({ header: ['time', 'level', 'valve'], delimiter: ',', decimalMark: '.', previewRows: [['0', '0.00', '0.5'], ['1', '0.25', '1.5'], ['2', '0.50', '2.5'], ['3', '0.75', '3.5'], ['4', '1.00', '4.5']] });
  });

  it('finds semicolons and decimal commas after a byte-order mark, with CR LF line ends', () => {
    const bytes = log('Zeit;Füllstand €;Ventil', (i) => `${i};${i},5;${i % 3},25`, '\r\n', [0xef, 0xbb, 0xbf]);
    expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
    expect(longestDecode).toBeLessThanOrEqual(HEAD_BYTES);
    expect(firstLook(bytes)).toMatchObject({ header: ['Zeit', 'Füllstand €', 'Ventil'], delimiter: ';', decimalMark: ',', encoding: { name: 'UTF-8', how: 'byte-order mark' } });
  });

  it('reads the same when a multi-byte character is cut by the head end', () => {
    const line = (i: number) => `${i},€${i},${'x'.repeat(40)}`;
    const plain = log('t,wert', line);
    const euro = plain.lastIndexOf(0xe2, HEAD_BYTES - 3); // € is E2 82 AC (RFC 3629 §3)
    for (const kept of [1, 2]) {
      const bytes = log('t,wert', line, '\n', Array.from({ length: HEAD_BYTES - kept - euro }, () => 0x20));
      expect(bytes[HEAD_BYTES - kept]).toBe(0xe2);
      expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
      expect(longestDecode).toBeLessThanOrEqual(HEAD_BYTES);
    }
  });

  it('keeps the user\'s dialect where given', () => {
    const bytes = log('a\tb', (i) => `${i}\t${i},5`);
    const tab: CsvSettings = { ...AUTO, delimiter: '\t', decimalMark: '.' };
    expect(firstLook(bytes, tab)).toEqual(wholeFileReading(bytes, tab));
    expect(longestDecode).toBeLessThanOrEqual(HEAD_BYTES);
  });

  it('reads the whole file where the dialect\'s sample does not end inside the head (records of 64 KiB)', () => {
    const long = 'x'.repeat(64 * 1024);
    const bytes = log('id,note', (i) => `${i},${long}`);
    expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
    expect(longestDecode).toBe(bytes.length);
  });

  it('words a blank head over a header further down as the whole file did', () => {
    const bytes = log('\n'.repeat(HEAD_BYTES + 10) + 'a,b', (i) => `${i},${i}`);
    expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
  });

  it('words a head of lines holding only spaces as the whole file did (a blank header line, not an empty file)', () => {
    const bytes = log(' \n'.repeat(HEAD_BYTES) + 'a,b', (i) => `${i},${i}`);
    const look = firstLook(bytes);
    expect(look).toEqual(wholeFileReading(bytes, AUTO));
    expect(look.problem).toBe('the header line has no column names');
  });

  it('refuses a zero byte past the head with the whole file\'s words', () => {
    const bytes = log('a,b', (i) => `${i},${i}`);
    bytes[bytes.length - 3] = 0;
    const look = firstLook(bytes);
    expect(look).toEqual(wholeFileReading(bytes, AUTO));
    expect(look.problem).toContain('zero byte');
  });

  it('reports Windows-1252 where a byte past the head is not UTF-8, as the whole file did', () => {
    const bytes = log('a,b', (i) => `${i},${i}`);
    bytes[bytes.length - 3] = 0xe9;
    expect(firstLook(bytes)).toEqual(wholeFileReading(bytes, AUTO));
    expect(firstLook(bytes)).toMatchObject({ encoding: { name: 'Windows-1252', how: 'detected' } });
  });
});
