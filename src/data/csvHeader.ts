/**
 * The header record: column names, and where the data records start. Bounded before anything is
 * decoded — a "header" longer than MAX_HEADER_BYTES or with more than MAX_COLUMNS fields is not
 * one (a binary file, a log written as one line), and is refused in words, without echoing it.
 */
import { cellText } from './cellText';
import type { Delimiter } from './csvDialect';
import { CsvScanner } from './csvScanner';
import { formatCount } from './reportFormat';

/** Limits of a header line (choices: far above any plant log's, far below what hurts). */
export const MAX_HEADER_BYTES = 1 << 20;
export const MAX_COLUMNS = 10_000;
/**
 * Bytes of a file's head: a header of the longest length allowed with room to spare, and the
 * dialect's sample (sourceBytes.ts sampleText). The import reads a large file's header from it
 * (csvTable.ts) and the app's first look decodes no more than it (dataInspection.ts).
 */
export const HEAD_BYTES = 2 * MAX_HEADER_BYTES;

export type CsvHeader =
  | { ok: true; names: string[]; dataStart: number; firstDataLine: number }
  | { ok: false; reason: string };

export function readHeader(bytes: Uint8Array, start: number, delimiter: Delimiter): CsvHeader {
  const scanner = new CsvScanner(bytes, delimiter.charCodeAt(0), MAX_COLUMNS, start);
  scanner.next();
  const length = scanner.recordEnd - scanner.recordStart;
  if (scanner.fault === 'unclosed-quote') {
    return { ok: false, reason: 'the header line opens a double quote that is never closed, so the whole file reads as one header; close the quote (RFC 4180 §2.5)' };
  }
  if (length > MAX_HEADER_BYTES) {
    return { ok: false, reason: `the first line is ${formatCount(length)} bytes long; a header of column names is at most ${formatCount(MAX_HEADER_BYTES)} bytes here. Is this the CSV export of the log, with one record per line?` };
  }
  if (scanner.fieldCount > MAX_COLUMNS) {
    return { ok: false, reason: `the header has ${formatCount(scanner.fieldCount)} fields; at most ${formatCount(MAX_COLUMNS)} columns can be read` };
  }
  const names: string[] = [];
  for (let k = 0; k < scanner.fieldCount; k++) names.push(cellText(bytes, scanner.starts[k], scanner.ends[k], scanner.escaped[k]).trim());
  return { ok: true, names, dataStart: scanner.offset, firstDataLine: scanner.lastLine + 1 };
}
