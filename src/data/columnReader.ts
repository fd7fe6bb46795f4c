/**
 * One streaming pass over the data records (csvScanner.ts): only the requested columns are kept,
 * as Float64Arrays sized from the file's line count, so memory grows with (rows × requested
 * columns × 8 bytes) and nothing is allocated per row or per unused cell.
 *
 * Every record keeps its slot (NaN where a cell could not be read) so that record r is file line
 * r + 2 throughout the import; problems go to a RowProblems log.
 */
import { isBlank } from './cellText';
import { ColumnSink } from './columnSink';
import type { Delimiter } from './csvDialect';
import { CsvScanner, recordBound } from './csvScanner';
import type { ByteWindow } from './byteWindow';
import { CHANGED_WHILE_READ, PieceReadError } from './pieceSource';
import { BOUNDS, plainRecord, SKIP, type PlainRecordTarget } from './plainRecord';
import type { DecimalMark } from './numericCell';
import { formatCount } from './reportFormat';
import type { RowProblems } from './rowProblems';
import { runSteps, type PassSteps } from '../core/fqe/cancellation';

export type ColumnKind = 'number' | 'flag' | 'label' | 'timestamp';

export interface ColumnRequest {
  readonly name: string;
  /** 0-based field position in the header. */
  readonly field: number;
  readonly kind: ColumnKind;
}

export interface TableColumns {
  /** Data records read; blank lines at the end of the file do not count. */
  readonly recordCount: number;
  /** Number columns; NaN where the cell could not be read. */
  readonly numbers: Map<string, Float64Array>;
  /** Flag columns (terminal) as 0/1; NaN where the cell could not be read. */
  readonly flags: Map<string, Float64Array>;
  /** Label columns as codes into `labelValues` (−1 where unreadable): episode identifiers. */
  readonly labels: Map<string, { codes: Float64Array; values: string[] }>;
  /** Timestamp columns in seconds under each day/month reading (NaN where unreadable). */
  readonly timestamps: Map<string, TimestampColumn>;
  /** Line of text (1-based, header = 1) where the last record with content ends; a quoted line break counts. */
  readonly lastTextLine: number;
}

export interface TimestampColumn {
  readonly dayFirst: Float64Array;
  readonly monthFirst: Float64Array;
  /** The text of cells that only one day/month order can read, by record, for messages. */
  readonly oneOrderOnly: Map<number, string>;
}

/** The file's bytes and where its data records start (after the header's line break). */
export interface DataBytes {
  readonly bytes: Uint8Array;
  readonly start: number;
  /** Physical line (1-based) of the first data record. */
  readonly firstLine: number;
  /**
   * A file read in pieces: the window that slides over its data records (`bytes` is its first view,
   * from `start` = 0) and the records its first pass counted (pieceFacts.ts), which size the columns.
   */
  readonly streamed?: { readonly window: ByteWindow; readonly capacity: number };
}

/** Records read between two yields of readColumnsSteps (about 5 MB of a 10-column log; a choice). */
export const RECORDS_PER_STEP = 1 << 16;

/** readColumns read straight through (tests, and hosts that need no cancel). */
export function readColumns(
  data: DataBytes, delimiter: Delimiter, decimalMark: DecimalMark, fieldCount: number,
  requests: readonly ColumnRequest[], problems: RowProblems, fastPath = true,
): TableColumns {
  return runSteps(readColumnsSteps(data, delimiter, decimalMark, fieldCount, requests, problems, fastPath));
}

/**
 * The pass as a generator that yields after every RECORDS_PER_STEP records (core/fqe/cancellation.ts),
 * so a host's stop request is heard during a large file. `fastPath` false reads every record the
 * general way (for the test that the two agree).
 */
export function* readColumnsSteps(
  data: DataBytes, delimiter: Delimiter, decimalMark: DecimalMark, fieldCount: number,
  requests: readonly ColumnRequest[], problems: RowProblems, fastPath = true,
): PassSteps<TableColumns> {
  const reading = startReading(data, delimiter, decimalMark, fieldCount, requests, problems, fastPath);
  while (readBlock(reading, RECORDS_PER_STEP)) yield;
  // More records than counted: the file changed between the passes (the columns could not hold them).
  if (reading.record > reading.capacity) throw new PieceReadError(CHANGED_WHILE_READ);
  return collect(reading.sinks, reading.lastContent + 1, reading.lastLine);
}

/** Everything the pass carries from one block of records to the next. */
interface Reading {
  /** The whole file's bytes, or the window's current view of a file read in pieces. */
  bytes: Uint8Array;
  readonly window: ByteWindow | undefined;
  readonly capacity: number;
  readonly fieldCount: number;
  readonly problems: RowProblems;
  readonly sinks: ColumnSink[];
  /** Sinks the fast path gives the bounds of their cell (labels, flags, timestamps with dates). */
  readonly others: ColumnSink[];
  /** Timestamp sinks the fast path parses as plain seconds, until their column shows a date. */
  readonly plainTimes: ColumnSink[];
  readonly scanner: CsvScanner;
  readonly fast: PlainRecordTarget | null;
  readonly lineOffset: number;
  readonly blanks: number[];
  record: number;
  lastContent: number;
  lastLine: number;
  position: number;
  line: number;
}

function startReading(
  data: DataBytes, delimiter: Delimiter, decimalMark: DecimalMark, fieldCount: number,
  requests: readonly ColumnRequest[], problems: RowProblems, fastPath: boolean,
): Reading {
  const { bytes } = data;
  const capacity = data.streamed?.capacity ?? recordBound(bytes, data.start);
  const sinks = requests.map((request) => new ColumnSink(request, capacity, decimalMark));
  const numbers = sinks.filter((s) => s.request.kind === 'number'), numberFields = new Set(numbers.map((s) => s.request.field));
  // A timestamp of plain seconds reads the same under either day/month order, so the fast path parses it like a number.
  const plainTimes = fastPath && decimalMark !== delimiter ? sinks.filter((s) => s.request.kind === 'timestamp' && !numberFields.has(s.request.field)) : [];
  const others = sinks.filter((s) => s.request.kind !== 'number' && !plainTimes.includes(s));
  return {
    bytes, window: data.streamed?.window, capacity, fieldCount, problems, sinks, others, plainTimes,
    scanner: new CsvScanner(bytes, delimiter.charCodeAt(0), fieldCount, data.start),
    fast: fastPath ? plainRecordTarget(bytes, delimiter, decimalMark, fieldCount, [...numbers, ...plainTimes], others) : null,
    lineOffset: data.firstLine - 1, blanks: [],
    record: 0, lastContent: -1, lastLine: data.firstLine - 1, position: data.start, line: 1,
  };
}

/**
 * Read up to `limit` records; false once the bytes are read to the end. A file read in pieces: a
 * record that reaches the end of the window before the file's end may be cut there (a number, a
 * quoted field, a CR before its LF), so it is read again once the window has moved on (advance);
 * at the window's very end both readers find no whole record, so the window moves on there too.
 */
function readBlock(g: Reading, limit: number): boolean {
  const { fast, others, sinks, scanner, fieldCount, problems, lineOffset, blanks } = g;
  const { starts, ends, escaped } = scanner;
  let { record, position, line, bytes } = g;
  let final = g.window === undefined || g.window.final;
  const stop = record + limit;
  while (record < stop && !(final && position >= bytes.length)) {
    const r = record;
    const after = fast ? plainRecord(fast, position, r) : -1;
    if (after < 0) {
      scanner.seek(position, line);
      scanner.next();
    }
    if (!final && (after < 0 ? scanner.offset : after) >= bytes.length) {
      bytes = advance(g, position);
      final = g.window!.final;
      position = 0;
      continue;
    }
    record++;
    if (after >= 0) { // the common case: numbers already in their columns
      if (blanks.length > 0) flushBlanks(blanks, fieldCount, problems);
      g.lastContent = r;
      g.lastLine = line + lineOffset;
      for (const sink of others) sink.read(bytes, fast!.starts[sink.request.field], fast!.ends[sink.request.field], 0, r, problems);
      position = after;
      line++;
      continue;
    }
    position = scanner.offset;
    line = scanner.nextLine;
    if (scanner.fieldCount === 1 && scanner.fault === 'none' && isBlank(bytes, starts[0], ends[0])) {
      blanks.push(r);
      for (const sink of sinks) sink.missing(r);
      continue;
    }
    flushBlanks(blanks, fieldCount, problems);
    g.lastContent = r;
    g.lastLine = scanner.lastLine + lineOffset;
    if (!acceptFaultless(scanner, fieldCount, r, problems, lineOffset)) {
      for (const sink of sinks) sink.missing(r);
      continue;
    }
    for (const sink of sinks) sink.read(bytes, starts[sink.request.field], ends[sink.request.field], escaped[sink.request.field], r, problems);
    if (g.plainTimes.length > 0) handBackDated(g);
  }
  g.record = record;
  g.position = position;
  g.line = line;
  g.bytes = bytes;
  return position < bytes.length || !final;
}

/** Move the window on, keeping the bytes from `position` (the record not yet read); the new view, also handed to the scanner and the fast path. */
function advance(g: Reading, position: number): Uint8Array {
  const bytes = g.window!.advance(position);
  g.scanner.reframe(bytes);
  for (const sink of g.sinks) sink.bytesMoved();
  if (g.fast) {
    g.fast.bytes = bytes;
    g.fast.end = bytes.length;
  }
  return bytes;
}

/**
 * A timestamp column that has shown a date keeps both day/month readings (ColumnSink.alternate), so
 * its cells go back to the sink's own reader: the fast path gives their bounds from now on.
 */
function handBackDated(g: Reading): void {
  for (const sink of g.plainTimes.filter((s) => s.alternate !== undefined)) {
    g.fast!.plan[sink.request.field] = BOUNDS;
    g.others.push(sink);
    g.plainTimes.splice(g.plainTimes.indexOf(sink), 1);
  }
}

/** Blank lines followed by content are bad rows (blank lines at the end of the file are none). */
function flushBlanks(blanks: number[], fieldCount: number, problems: RowProblems): void {
  for (const blank of blanks) problems.add(blank, undefined, 'blank-line', `the line is blank; expected ${fieldCount} fields`);
  blanks.length = 0;
}

/** The fast path's plan (`parsed`: sinks it parses plain numbers into; `others`: sinks it gives bounds), or null when it cannot apply (a decimal mark that is also the delimiter). */
function plainRecordTarget(
  bytes: Uint8Array, delimiter: Delimiter, decimalMark: DecimalMark, fieldCount: number, parsed: ColumnSink[], others: ColumnSink[],
): PlainRecordTarget | null {
  if (decimalMark === delimiter) return null;
  const plan = new Int32Array(fieldCount).fill(SKIP);
  others.forEach((sink) => { plan[sink.request.field] = BOUNDS; });
  parsed.forEach((sink, k) => { plan[sink.request.field] = k; });
  return {
    bytes, end: bytes.length, delimiter: delimiter.charCodeAt(0), markByte: decimalMark.charCodeAt(0), fieldCount, plan,
    numbers: parsed.map((sink) => sink.values), starts: new Int32Array(fieldCount), ends: new Int32Array(fieldCount), exponent: 0,
  };
}

/** False (and the problem logged) when the record has a quote fault or the wrong number of fields. */
function acceptFaultless(scanner: CsvScanner, fieldCount: number, record: number, problems: RowProblems, lineOffset: number): boolean {
  const span = scanner.lastLine - scanner.firstLine + 1;
  const spans = span > 1 ? ` (this row spans ${formatCount(span)} lines of text, ${scanner.firstLine + lineOffset}–${scanner.lastLine + lineOffset})` : '';
  if (scanner.fault === 'unclosed-quote') {
    problems.add(record, undefined, 'quote', `a field opened with a double quote is never closed, so the rest of the file — ${formatCount(span)} line${span === 1 ? '' : 's'} of text, to line ${scanner.lastLine + lineOffset} — was read into this one row; close the quote (RFC 4180 §2.5)`);
    return false;
  }
  if (scanner.fault === 'stray-quote') {
    problems.add(record, undefined, 'quote', `a double quote inside a quoted field must be written twice ("") and a quoted field must end at a delimiter (RFC 4180 §2.7)${spans}`);
    return false;
  }
  if (scanner.fieldCount !== fieldCount) {
    const which = scanner.fieldCount > fieldCount ? 'too many' : 'too few';
    problems.add(record, undefined, 'ragged-row', `${which} fields: found ${formatCount(scanner.fieldCount)}, expected ${formatCount(fieldCount)} as in the header${spans}`);
    return false;
  }
  return true;
}

function collect(sinks: ColumnSink[], recordCount: number, lastTextLine: number): TableColumns {
  const numbers = new Map<string, Float64Array>();
  const flags = new Map<string, Float64Array>();
  const labels = new Map<string, { codes: Float64Array; values: string[] }>();
  const timestamps = new Map<string, TimestampColumn>();
  for (const { request, values, alternate, codes, oneOrderOnly } of sinks) {
    const column = exactly(values, recordCount);
    if (request.kind === 'label') labels.set(request.name, { codes: column, values: [...codes!.keys()] });
    else if (request.kind === 'timestamp') timestamps.set(request.name, { dayFirst: column, monthFirst: alternate ? exactly(alternate, recordCount) : column, oneOrderOnly: oneOrderOnly! });
    else (request.kind === 'flag' ? flags : numbers).set(request.name, column);
  }
  return { recordCount, numbers, flags, labels, timestamps, lastTextLine };
}

/** The first n values: a view when the column was sized (nearly) right, else a copy that frees the rest. */
function exactly(values: Float64Array, n: number): Float64Array {
  return values.length - n <= values.length / 64 ? values.subarray(0, n) : values.slice(0, n);
}
