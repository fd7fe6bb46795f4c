/**
 * The import's fast path: one record with no quotes, its number cells parsed while the bytes are
 * scanned (one pass, no call per cell). It handles the common case only — anything else (a quote,
 * a field count other than the header's, a cell that is not a plain number, blanks around a
 * number, more than 15 significant digits or a large exponent) returns −1 and the record is read
 * again by the general scanner (csvScanner.ts) and cell readers (columnSink.ts), which also word
 * every problem. So the fast path decides nothing the general path would decide differently; the
 * property test test/data/plainRecord.property.test.ts checks that the two agree.
 *
 * Numbers use the same exact fast path as numericBytes.ts (Clinger 1990): M < 10^15, |E| ≤ 22.
 */
import { QUOTE } from './csvScanner';

const LF = 0x0a, CR = 0x0d, PLUS = 43, MINUS = 45, ZERO = 48, NINE = 57, LOWER_E = 101, UPPER_E = 69;
const POWERS = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** The mantissa bound of the exact fast path (Clinger 1990): at most 15 significant digits. */
const MAX_EXACT_MANTISSA = 1e15;

/** What the fast path does with each field: NUMBER_BASE + k parses into number column k; BOUNDS records start/end; SKIP ignores. */
export const SKIP = -1;
export const BOUNDS = -2;

export interface PlainRecordTarget {
  /** The bytes and their end (a file read in pieces moves them along with its window). */
  bytes: Uint8Array;
  end: number;
  readonly delimiter: number;
  readonly markByte: number;
  readonly fieldCount: number;
  /** Per header field: a number column index (≥ 0), BOUNDS or SKIP. */
  readonly plan: Int32Array;
  readonly numbers: readonly Float64Array[];
  /** Filled for BOUNDS and number fields. */
  readonly starts: Int32Array;
  readonly ends: Int32Array;
  /** The last exponent read (scratch, so no object is made per cell). */
  exponent: number;
}

/** Read record `r` starting at byte `from`; the offset after its line break, or −1 for the general path. */
export function plainRecord(t: PlainRecordTarget, from: number, r: number): number {
  const { bytes: b, end, delimiter, fieldCount, plan } = t;
  let i = from;
  for (let f = 0; f < fieldCount; f++) {
    const what = plan[f], start = i;
    if (i < end && b[i] === QUOTE) return -1;
    if (what >= 0) {
      i = plainNumber(t, i, what, r);
      if (i < 0) return -1;
    } else {
      while (i < end) {
        const c = b[i];
        if (c === delimiter || c === LF || c === CR) break;
        i++;
      }
    }
    if (what !== SKIP) { // a column read both as a number and otherwise (a timestamp that is also a state) needs its bounds too
      t.starts[f] = start;
      t.ends[f] = i;
    }
    if (i < end && b[i] === delimiter) {
      i++;
      continue;
    }
    if (f !== fieldCount - 1) return -1;
    if (i < end && b[i] === CR) i++;
    if (i < end && b[i] === LF) i++;
    return i;
  }
  return -1;
}

/**
 * Parse a plain number at `from` into numbers[k][r]; the offset after it, or −1 when it is not
 * plain. Leading zeros add nothing to the mantissa M, which holds the significant digits; at most
 * 15 of them is M < 10^15 (10^(s−1) ≤ M < 10^s for s digits from the first non-zero one; more
 * digits or an overflow only make M larger), so the fast path is exact. A cell with more goes to
 * the general reader, which gives the same double (numericBytes.ts). The integer and fraction
 * digits are read by one loop that notes where the mark was: one loop exit per cell instead of two
 * (the exits are where the branch predictor misses, as cells differ in length; measured a quarter
 * off the read pass of a 10-column log).
 */
function plainNumber(t: PlainRecordTarget, from: number, k: number, r: number): number {
  const b = t.bytes, end = t.end;
  let i = from, c = i < end ? b[i] : -1;
  const negative = c === MINUS;
  if (negative || c === PLUS) c = ++i < end ? b[i] : -1;
  const digitsFrom = i, mark = t.markByte;
  let mantissa = 0, markAt = -1, d = c - ZERO;
  for (;;) {
    if (d >>> 0 <= 9) mantissa = mantissa * 10 + d; // a digit (unsigned: one comparison for both bounds)
    else if (c === mark && markAt < 0) markAt = i;
    else break;
    c = ++i < end ? b[i] : -1;
    d = c - ZERO;
  }
  const scale = markAt < 0 ? 0 : markAt + 1 - i;
  const digits = i - digitsFrom - (markAt < 0 ? 0 : 1);
  if (digits === 0 || mantissa >= MAX_EXACT_MANTISSA) return -1;
  if (c === LOWER_E || c === UPPER_E) return withExponent(t, i, k, r, negative ? -mantissa : mantissa, scale);
  if (c !== -1 && c !== t.delimiter && c !== LF && c !== CR) return -1;
  return store(t, i, k, r, negative ? -mantissa : mantissa, scale);
}

/** The value ±M·10^scale into numbers[k][r] when the fast path is exact for it (|scale| ≤ 22); `at`, or −1. */
function store(t: PlainRecordTarget, at: number, k: number, r: number, mantissa: number, scale: number): number {
  if (scale > 22 || scale < -22) return -1;
  t.numbers[k][r] = mantissa === 0 ? mantissa : scale >= 0 ? mantissa * POWERS[scale] : mantissa / POWERS[-scale];
  return at;
}

/** A plain number's exponent from the "e" at `at` on (rare in logs, so out of the hot function); the offset after the number, or −1. */
function withExponent(t: PlainRecordTarget, at: number, k: number, r: number, mantissa: number, scale: number): number {
  const i = plainExponent(t, at + 1);
  if (i < 0) return -1;
  const c = i < t.end ? t.bytes[i] : -1;
  if (c !== -1 && c !== t.delimiter && c !== LF && c !== CR) return -1;
  return store(t, i, k, r, mantissa, scale + t.exponent);
}

/** The exponent's digits from i (sign allowed, at most 4 digits) into t.exponent; the offset after them, or −1. */
function plainExponent(t: PlainRecordTarget, from: number): number {
  const { bytes: b, end } = t;
  let i = from, negative = false, exponent = 0, exponentDigits = 0;
  if (i < end && (b[i] === MINUS || b[i] === PLUS)) negative = b[i++] === MINUS;
  for (; i < end && b[i] >= ZERO && b[i] <= NINE && exponentDigits < 4; i++, exponentDigits++) exponent = exponent * 10 + (b[i] - ZERO);
  if (exponentDigits === 0) return -1;
  t.exponent = negative ? -exponent : exponent;
  return i;
}
