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
  /** True when `bytes` reach the end of the file (a whole file, or the window's last view). */
  final: boolean;
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
  /** Records of blank lines not yet followed by content (then they are bad rows; at the end, none). */
  readonly blanks: number[];
  /** Records read so far (the next record's index). */
  record: number;
  lastContent: number;
  lastLine: number;
  /** Offset in `bytes` of the next record, and its physical line counted from the first data line (1-based). */
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
    bytes, window: data.streamed?.window, final: data.streamed === undefined || data.streamed.window.final, capacity, fieldCount, problems, sinks, others, plainTimes,
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
  const stop = g.record + limit;
  while (g.record < stop && !(g.final && g.position >= g.bytes.length)) {
    if (!readRecord(g)) advance(g);
  }
  return g.position < g.bytes.length || !g.final;
}

/**
 * The record at g.position into the sinks, by the fast path (plainRecord.ts) where it applies, else
 * by the general scanner; false, with nothing taken, when the record reaches the end of a window
 * that is not the file's last (it may be cut there).
 */
function readRecord(g: Reading): boolean {
  const after = g.fast ? plainRecord(g.fast, g.position, g.record) : -1;
  if (after >= 0) {
    if (!g.final && after >= g.bytes.length) return false;
    takePlainRecord(g, after);
    return true;
  }
  g.scanner.seek(g.position, g.line);
  g.scanner.next();
  if (!g.final && g.scanner.offset >= g.bytes.length) return false;
  takeScannedRecord(g);
  return true;
}

/** A record the fast path read (the common case: its numbers are already in their columns): the other sinks read their cells' bounds. */
function takePlainRecord(g: Reading, after: number): void {
  const r = g.record++, bytes = g.bytes, { starts, ends } = g.fast!;
  if (g.blanks.length > 0) flushBlanks(g.blanks, g.fieldCount, g.problems);
  g.lastContent = r;
  g.lastLine = g.line + g.lineOffset;
  for (const sink of g.others) sink.read(bytes, starts[sink.request.field], ends[sink.request.field], 0, r, g.problems);
  g.position = after;
  g.line++;
}

/** A record the general scanner read: a blank line waits for content after it; a faulty record fills its slots with "missing"; else every sink reads its cell. */
function takeScannedRecord(g: Reading): void {
  const { scanner, sinks, problems } = g, { starts, ends, escaped } = scanner;
  const r = g.record++;
  g.position = scanner.offset;
  g.line = scanner.nextLine;
  if (scanner.fieldCount === 1 && scanner.fault === 'none' && isBlank(g.bytes, starts[0], ends[0])) {
    g.blanks.push(r);
    for (const sink of sinks) sink.missing(r);
    return;
  }
  flushBlanks(g.blanks, g.fieldCount, problems);
  g.lastContent = r;
  g.lastLine = scanner.lastLine + g.lineOffset;
  if (!acceptFaultless(scanner, g.fieldCount, r, problems, g.lineOffset)) {
    for (const sink of sinks) sink.missing(r);
    return;
  }
  for (const sink of sinks) sink.read(g.bytes, starts[sink.request.field], ends[sink.request.field], escaped[sink.request.field], r, problems);
  if (g.plainTimes.length > 0) handBackDated(g);
}

/** Move the window on, keeping the bytes from g.position (the record not yet read), which is then 0 in the new view, also handed to the scanner and the fast path. */
function advance(g: Reading): void {
  const bytes = g.window!.advance(g.position);
  g.bytes = bytes;
  g.final = g.window!.final;
  g.position = 0;
  g.scanner.reframe(bytes);
  for (const sink of g.sinks) sink.bytesMoved();
  if (g.fast) {
    g.fast.bytes = bytes;
    g.fast.end = bytes.length;
  }
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
