/**
 * Where the cells of one requested column go while the file streams past: numbers, terminal
 * flags, episode labels (as codes) or timestamps (under both day/month readings), one slot per
 * record (NaN, or −1 for a label, where a cell could not be read) so that record r stays file line
 * r + 2 throughout the import. Problems go to the RowProblems log with the cell's text, shortened.
 */
import { MAX_RUN_LABEL_BYTES, MAX_RUN_LABEL_LENGTH } from '../core/limits';
import { runLabelLength } from '../core/runLabelText';
import { cellText, sameBytes } from './cellText';
import type { ColumnRequest } from './columnReader';
import { numberFromBytes } from './numericBytes';
import { readFlag, readNumber, shorten, type DecimalMark } from './numericCell';
import type { RowProblems } from './rowProblems';
import { readTimestamp, TIMESTAMP_FORMS } from './timestampCell';

/** Bytes of a cell decoded for a message at most (messages show 40 characters). */
const MESSAGE_BYTES = 256;
const DIGIT_ZERO = 0x30;

const LABEL_LIMIT_TEXT = MAX_RUN_LABEL_LENGTH.toLocaleString('en-US');

/**
 * Why a run column's cell is no run label, or null where it is one: empty, or longer than
 * MAX_RUN_LABEL_LENGTH code points (null: a cell past MAX_RUN_LABEL_BYTES, not decoded).
 */
function notALabel(label: string | null): string | null {
  if (label === '') return 'the run label cell is empty; expected a run or batch label';
  const length = label === null ? null : runLabelLength(label);
  if (length !== null && length <= MAX_RUN_LABEL_LENGTH) return null;
  const held = length === null ? `more than ${LABEL_LIMIT_TEXT}` : length.toLocaleString('en-US');
  return `the run label cell holds ${held} characters; expected a run or batch label of at most ${LABEL_LIMIT_TEXT}`;
}

export class ColumnSink {
  /** One slot per record; `capacity` must bound the records (csvScanner.recordBound). */
  readonly values: Float64Array;
  /**
   * Month-first reading of a timestamp column: allocated at the first cell that is not a plain
   * number (plain seconds read the same either way, so a numeric column needs no second copy).
   */
  alternate?: Float64Array;
  readonly decimalMark: DecimalMark;
  readonly codes?: Map<string, number>;
  readonly oneOrderOnly?: Map<number, string>;
  private previousLabel = { start: 0, end: -1, code: -1 };

  constructor(readonly request: ColumnRequest, capacity: number, decimalMark: DecimalMark) {
    this.decimalMark = decimalMark;
    this.values = new Float64Array(capacity);
    if (request.kind === 'timestamp') this.oneOrderOnly = new Map();
    if (request.kind === 'label') this.codes = new Map();
  }

  /** The bytes moved (a file read in pieces, byteWindow.ts): the previous label's offsets no longer point at it. */
  bytesMoved(): void {
    this.previousLabel = { start: 0, end: -1, code: -1 };
  }

  missing(record: number): void {
    this.values[record] = this.request.kind === 'label' ? -1 : NaN;
    if (this.alternate) this.alternate[record] = NaN;
  }

  /** The month-first column, made on first need as a copy of the day-first values read so far. */
  private monthFirst(): Float64Array {
    if (!this.alternate) this.alternate = Float64Array.from(this.values);
    return this.alternate;
  }

  read(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    const kind = this.request.kind;
    if (kind === 'number') this.readNumberCell(bytes, start, end, escaped, record, problems);
    else if (kind === 'flag') this.readFlagCell(bytes, start, end, escaped, record, problems);
    else if (kind === 'label') this.readLabelCell(bytes, start, end, escaped, record, problems);
    else this.readTimestampCell(bytes, start, end, escaped, record, problems);
  }

  private readNumberCell(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    const value = escaped ? NaN : numberFromBytes(bytes, start, end, this.decimalMark);
    if (Number.isFinite(value)) this.values[record] = value;
    else this.notANumber(bytes, start, end, escaped, record, problems);
  }

  /** A number cell the fast reading refused: NaN in its slot, and the reason in the log. */
  notANumber(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    this.values[record] = NaN;
    const reading = readNumber(cellText(bytes, start, end, escaped, MESSAGE_BYTES), this.decimalMark);
    if (!reading.ok) problems.add(record, this.request.name, reading.kind, reading.reason);
    else if (end - start > MESSAGE_BYTES) problems.add(record, this.request.name, 'not-a-number', `the cell holds ${end - start} characters; expected a number`);
  }

  /**
   * A flag cell. A lone "0" or "1" (nearly every cell of a logged flag) is its own value, as readFlag
   * reads it, without decoding a string per cell (a million short strings cost more than the rest of
   * the record); any other cell is decoded and read by readFlag.
   */
  private readFlagCell(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    const only = end - start === 1 ? bytes[start] - DIGIT_ZERO : -1;
    if (!escaped && (only === 0 || only === 1)) {
      this.values[record] = only;
      return;
    }
    const reading = readFlag(cellText(bytes, start, end, escaped, MESSAGE_BYTES));
    this.values[record] = reading.ok ? reading.value : NaN;
    if (!reading.ok) problems.add(record, this.request.name, reading.kind, reading.reason);
  }

  private readLabelCell(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    const previous = this.previousLabel;
    if (!escaped && end - start === previous.end - previous.start && sameBytes(bytes, start, previous.start, end - start)) {
      this.values[record] = previous.code;
      return;
    }
    // A cell past the byte bound that holds every label is not decoded at all (core/limits.ts); the blanks
    // around it (trimmed from the label, as the field's labels are) do not count toward that bound.
    let first = start, last = end;
    while (first < last && bytes[first] <= 0x20) first++;
    while (last > first && bytes[last - 1] <= 0x20) last--;
    const label = last - first > MAX_RUN_LABEL_BYTES ? null : cellText(bytes, start, end, escaped).trim();
    const reason = notALabel(label);
    if (label === null || reason !== null) {
      problems.add(record, this.request.name, 'empty-episode', reason ?? '');
      this.values[record] = -1;
      this.previousLabel = { start: 0, end: -1, code: -1 };
      return;
    }
    const code = codeOf(this.codes!, label);
    this.values[record] = code;
    this.previousLabel = escaped ? { start: 0, end: -1, code: -1 } : { start, end, code };
  }

  private readTimestampCell(bytes: Uint8Array, start: number, end: number, escaped: number, record: number, problems: RowProblems): void {
    const seconds = escaped ? NaN : numberFromBytes(bytes, start, end, this.decimalMark);
    if (Number.isFinite(seconds)) {
      this.values[record] = seconds;
      if (this.alternate) this.alternate[record] = seconds;
      return;
    }
    const cell = cellText(bytes, start, end, escaped, MESSAGE_BYTES).trim();
    const reading = end - start > MESSAGE_BYTES ? undefined : readTimestamp(cell, this.decimalMark);
    this.values[record] = reading ? reading.dayFirst : NaN;
    this.monthFirst()[record] = reading ? reading.monthFirst : NaN;
    const name = this.request.name;
    if (!reading) problems.add(record, name, 'bad-timestamp', `"${shorten(cell)}" is not a timestamp; expected ${TIMESTAMP_FORMS}`);
    else if (Number.isNaN(reading.dayFirst) && Number.isNaN(reading.monthFirst)) {
      problems.add(record, name, 'invalid-date', `"${shorten(cell)}" is not a valid date or time (a day, month, hour, minute or zone offset out of range)`);
    } else if (Number.isNaN(reading.dayFirst) !== Number.isNaN(reading.monthFirst)) this.oneOrderOnly!.set(record, cell);
  }
}

function codeOf(codes: Map<string, number>, label: string): number {
  let code = codes.get(label);
  if (code === undefined) {
    code = codes.size;
    codes.set(label, code);
  }
  return code;
}
