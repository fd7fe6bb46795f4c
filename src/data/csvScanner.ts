/**
 * CSV records straight from the file's bytes (RFC 4180 §2, "Common Format and MIME Type for CSV
 * Files", 2005): one pass, no string per cell and no array per row. Each call to next() finds one
 * record and leaves the byte bounds of its first `capacity` fields in `starts`/`ends`; fields past
 * that are only counted, so a row of a million fields costs no memory. The reader decodes only the
 * cells it needs.
 *
 * Choices, each named as a choice:
 *   - Line breaks: LF, CRLF or a lone CR (Python's csv module does the same; old spreadsheet
 *     exports end lines with CR).
 *   - A field is quoted only when its first byte is a double quote (as papaparse and Python's csv
 *     module read it); a quote later in an unquoted field is an ordinary character.
 *   - Spaces between a closing quote and the delimiter are allowed (common practice).
 *   - A closing quote followed by anything else is a stray quote (RFC 4180 §2.7): the record is
 *     marked and the field goes on to the next delimiter or line break, so one bad quote costs one
 *     row, not the rest of the file.
 *   - A quote never closed runs to the end of the file (there is nowhere else it can end); the
 *     record is marked and says how many lines of the file it holds.
 *
 * Delimiter, quote, CR and LF are ASCII, so scanning UTF-8 bytes for them is exact (RFC 3629 §3:
 * no byte of a multi-byte sequence is below 0x80).
 */
import { lineBreakScan } from './lineBreakScan';

export const QUOTE = 0x22;
const LF = 0x0a, CR = 0x0d, SPACE = 0x20, TAB = 0x09;

export type RecordFault = 'none' | 'stray-quote' | 'unclosed-quote';

export class CsvScanner {
  /** Byte bounds of field k's content (inside the quotes for a quoted field), k < capacity. */
  readonly starts: Int32Array;
  readonly ends: Int32Array;
  /** 1 where field k was quoted and holds a doubled quote ("") that must be unescaped. */
  readonly escaped: Uint8Array;
  /** Fields in the record just read (all of them, also those past `capacity`). */
  fieldCount = 0;
  fault: RecordFault = 'none';
  /** Physical lines (1-based) where the record just read begins and ends. */
  firstLine = 1;
  lastLine = 1;
  /** Byte offsets of the record just read: [recordStart, recordEnd), line break excluded. */
  recordStart = 0;
  recordEnd = 0;
  private position: number;
  private line = 1;

  constructor(
    private bytes: Uint8Array, private readonly delimiter: number,
    readonly capacity: number, start = 0, private end = bytes.length,
  ) {
    this.starts = new Int32Array(capacity);
    this.ends = new Int32Array(capacity);
    this.escaped = new Uint8Array(capacity);
    this.position = start;
  }

  /** True while there are bytes left to read a record from. */
  get more(): boolean {
    return this.position < this.end;
  }

  /** Byte offset where the next record starts. */
  get offset(): number {
    return this.position;
  }

  /** Physical line (1-based) where the next record starts. */
  get nextLine(): number {
    return this.line;
  }

  /** Go on from byte `position`, which starts physical line `line` (after a record read elsewhere). */
  seek(position: number, line: number): void {
    this.position = position;
    this.line = line;
  }

  /** Read from `bytes` (to their end) from now on: the next view of a file read in pieces (byteWindow.ts); seek() says where. */
  reframe(bytes: Uint8Array): void {
    this.bytes = bytes;
    this.end = bytes.length;
  }

  /** Read the next record; false at the end of the input. */
  next(): boolean {
    if (this.position >= this.end) return false;
    this.fieldCount = 0;
    this.fault = 'none';
    this.firstLine = this.line;
    this.recordStart = this.position;
    let i = this.position;
    for (;;) {
      i = this.bytes[i] === QUOTE ? this.quotedField(i) : this.plainField(i);
      if (i >= this.end || this.bytes[i] !== this.delimiter) break;
      i++;
      if (i >= this.end) { // a delimiter at the very end: one more, empty field
        this.addField(i, i, 0);
        break;
      }
    }
    this.recordEnd = i;
    this.lastLine = this.line;
    this.position = this.skipLineBreak(i);
    return true;
  }

  private addField(start: number, end: number, escaped: number): void {
    const k = this.fieldCount++;
    if (k < this.capacity) {
      this.starts[k] = start;
      this.ends[k] = end;
      this.escaped[k] = escaped;
    }
  }

  private plainField(from: number): number {
    const { bytes, delimiter, end } = this;
    let i = from;
    while (i < end) {
      const c = bytes[i];
      if (c === delimiter || c === LF || c === CR) break;
      i++;
    }
    this.addField(from, i, 0);
    return i;
  }

  /** From the opening quote at `from`; returns the offset of the byte after the field. */
  private quotedField(from: number): number {
    const { bytes, end } = this;
    const start = from + 1;
    let i = start, escaped = 0;
    for (;;) {
      const close = bytes.indexOf(QUOTE, i);
      if (close < 0 || close >= end) {
        // The file's final line break ends its last line; it does not start another.
        const last = bytes[end - 1] === LF ? (bytes[end - 2] === CR ? end - 2 : end - 1) : bytes[end - 1] === CR ? end - 1 : end;
        this.countLines(start, Math.max(start, last));
        this.fault = 'unclosed-quote';
        this.addField(start, end, escaped);
        return end;
      }
      if (close + 1 < end && bytes[close + 1] === QUOTE) {
        escaped = 1;
        i = close + 2;
        continue;
      }
      this.countLines(start, close);
      return this.afterClosingQuote(start, close, escaped);
    }
  }

  /** Spaces may follow the closing quote; anything else but a delimiter or line break is a stray quote. */
  private afterClosingQuote(start: number, close: number, escaped: number): number {
    const { bytes, end, delimiter } = this;
    let i = close + 1;
    while (i < end && (bytes[i] === SPACE || (bytes[i] === TAB && delimiter !== TAB))) i++;
    if (i >= end || bytes[i] === delimiter || bytes[i] === LF || bytes[i] === CR) {
      this.addField(start, close, escaped);
      return i;
    }
    this.fault = 'stray-quote';
    while (i < end && bytes[i] !== delimiter && bytes[i] !== LF && bytes[i] !== CR) i++;
    this.addField(start, i, escaped);
    return i;
  }

  private countLines(from: number, to: number): void {
    const { bytes } = this;
    for (let i = from; i < to; i++) {
      const c = bytes[i];
      if (c === LF || (c === CR && bytes[i + 1] !== LF)) this.line++;
    }
  }

  private skipLineBreak(i: number): number {
    if (i >= this.end) return i;
    this.line++;
    return this.bytes[i] === CR && i + 1 < this.end && this.bytes[i + 1] === LF ? i + 2 : i + 1;
  }
}

/**
 * Upper bound on the records in bytes[start, end): line breaks + 1 (an LF, or a CR not before an
 * LF; counted four bytes at a time by lineBreakScan.ts).
 */
export function recordBound(bytes: Uint8Array, start = 0, end = bytes.length): number {
  return lineBreakScan(bytes, start, end).lineBreaks + 1;
}
