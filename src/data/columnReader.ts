/**
 * One streaming pass over the CSV text: papaparse hands over one record at a time (RFC 4180
 * quoting, CRLF or LF) and only the requested columns are kept, as Float64Arrays. No per-row
 * object survives the callback, so memory grows with (rows × requested columns × 8 bytes).
 *
 * Every record keeps its slot (NaN where a cell could not be read) so that record r is file
 * line r + 2 throughout the import; problems go to a RowProblems log.
 */
import Papa from 'papaparse';
import { GrowableColumn } from './growableColumn';
import { numberOrNaN, readFlag, readNumber, shorten, type CellReading, type DecimalMark } from './numericCell';
import { readTimestamp, TIMESTAMP_FORMS } from './timestampCell';
import type { Delimiter } from './csvDialect';
import type { RowProblems } from './rowProblems';

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
}

export interface TimestampColumn {
  readonly dayFirst: Float64Array;
  readonly monthFirst: Float64Array;
  /** The text of cells that only one day/month order can read, by record, for messages. */
  readonly oneOrderOnly: Map<number, string>;
}

interface Sink {
  request: ColumnRequest;
  values: GrowableColumn;
  alternate?: GrowableColumn; // month-first reading of a timestamp
  codes?: Map<string, number>;
  oneOrderOnly?: Map<number, string>;
}

export function readColumns(
  text: string, delimiter: Delimiter, decimalMark: DecimalMark, fieldCount: number,
  requests: readonly ColumnRequest[], problems: RowProblems,
): TableColumns {
  const reader = new RecordReader(requests, decimalMark, fieldCount, problems);
  let record = -2; // incremented before use: the header is record −1
  Papa.parse<string[]>(text, {
    delimiter,
    skipEmptyLines: false,
    step: (results) => {
      if (++record >= 0) reader.accept(record, results.data, results.errors);
    },
  });
  return reader.finish();
}

/** Takes records one at a time into the sinks; blank lines count as bad only when content follows. */
class RecordReader {
  private readonly sinks: Sink[];
  private readonly blanks: number[] = [];
  private lastContent = -1;

  constructor(
    requests: readonly ColumnRequest[], private readonly decimalMark: DecimalMark,
    private readonly fieldCount: number, private readonly problems: RowProblems,
  ) {
    this.sinks = requests.map((request) => ({
      request,
      values: new GrowableColumn(),
      alternate: request.kind === 'timestamp' ? new GrowableColumn() : undefined,
      codes: request.kind === 'label' ? new Map() : undefined,
      oneOrderOnly: request.kind === 'timestamp' ? new Map() : undefined,
    }));
  }

  accept(record: number, row: string[], errors: readonly { code: string }[]): void {
    const { fieldCount, problems } = this;
    if (row.length === 1 && row[0].trim() === '' && errors.length === 0) {
      this.blanks.push(record);
      pushMissing(this.sinks);
      return;
    }
    for (const blank of this.blanks) problems.add(blank, undefined, 'blank-line', `the line is blank; expected ${fieldCount} fields`);
    this.blanks.length = 0;
    this.lastContent = record;
    if (errors.length > 0) {
      problems.add(record, undefined, 'quote', quoteProblem(errors[0].code));
      pushMissing(this.sinks);
    } else if (row.length !== fieldCount) {
      const which = row.length > fieldCount ? 'too many' : 'too few';
      problems.add(record, undefined, 'ragged-row', `${which} fields: found ${row.length}, expected ${fieldCount} as in the header`);
      pushMissing(this.sinks);
    } else {
      for (const sink of this.sinks) readCell(sink, row[sink.request.field], record, this.decimalMark, problems);
    }
  }

  /** The columns, cut after the last record with content (blank lines at the end are no rows). */
  finish(): TableColumns {
    return collect(this.sinks, this.lastContent + 1);
  }
}

function quoteProblem(code: string): string {
  if (code === 'MissingQuotes') {
    return 'a field opened with a double quote is never closed, so the rest of the file was read into it; close the quote (RFC 4180 §2.5)';
  }
  return 'a double quote inside a quoted field must be written twice ("") and a quoted field must end at a delimiter (RFC 4180 §2.7)';
}

function pushMissing(sinks: Sink[]): void {
  for (const sink of sinks) {
    sink.values.push(sink.request.kind === 'label' ? -1 : NaN);
    sink.alternate?.push(NaN);
  }
}

function readCell(sink: Sink, cell: string, record: number, decimalMark: DecimalMark, problems: RowProblems): void {
  const { name, kind } = sink.request;
  if (kind === 'number') {
    const value = numberOrNaN(cell, decimalMark);
    sink.values.push(value);
    if (Number.isNaN(value)) reportCell(readNumber(cell, decimalMark), record, name, problems);
  } else if (kind === 'flag') {
    const reading = readFlag(cell);
    sink.values.push(reading.ok ? reading.value : NaN);
    reportCell(reading, record, name, problems);
  } else if (kind === 'label') {
    const label = cell.trim();
    if (label === '') problems.add(record, name, 'empty-episode', 'the episode cell is empty; expected an episode identifier');
    sink.values.push(label === '' ? -1 : codeOf(sink.codes!, label));
  } else {
    const reading = readTimestamp(cell, decimalMark);
    sink.values.push(reading ? reading.dayFirst : NaN);
    sink.alternate!.push(reading ? reading.monthFirst : NaN);
    if (!reading) problems.add(record, name, 'bad-timestamp', `"${shorten(cell.trim())}" is not a timestamp; expected ${TIMESTAMP_FORMS}`);
    else if (Number.isNaN(reading.dayFirst) && Number.isNaN(reading.monthFirst)) {
      problems.add(record, name, 'invalid-date', `"${shorten(cell.trim())}" is not a valid date or time (a day, month, hour or minute out of range)`);
    } else if (Number.isNaN(reading.dayFirst) !== Number.isNaN(reading.monthFirst)) sink.oneOrderOnly!.set(record, cell.trim());
  }
}

function reportCell(reading: CellReading, record: number, column: string, problems: RowProblems): void {
  if (!reading.ok) problems.add(record, column, reading.kind, reading.reason);
}

function codeOf(codes: Map<string, number>, label: string): number {
  let code = codes.get(label);
  if (code === undefined) {
    code = codes.size;
    codes.set(label, code);
  }
  return code;
}

function collect(sinks: Sink[], recordCount: number): TableColumns {
  const numbers = new Map<string, Float64Array>();
  const flags = new Map<string, Float64Array>();
  const labels = new Map<string, { codes: Float64Array; values: string[] }>();
  const timestamps = new Map<string, TimestampColumn>();
  for (const { request, values, alternate, codes, oneOrderOnly } of sinks) {
    const column = values.toArray(recordCount);
    if (request.kind === 'label') labels.set(request.name, { codes: column, values: [...codes!.keys()] });
    else if (request.kind === 'timestamp') timestamps.set(request.name, { dayFirst: column, monthFirst: alternate!.toArray(recordCount), oneOrderOnly: oneOrderOnly! });
    else (request.kind === 'flag' ? flags : numbers).set(request.name, column);
  }
  return { recordCount, numbers, flags, labels, timestamps };
}
