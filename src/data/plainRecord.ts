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
/** Significant digits (from the first non-zero one) a plain number may have on the fast path: then its mantissa is below 10^15 (Clinger 1990). */
const MAX_SIGNIFICANT_DIGITS = 15;

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
  for (let f = 0; ; f++) {
    if (f >= fieldCount || (i < end && b[i] === QUOTE)) return -1;
    const what = plan[f];
    if (what >= 0) {
      const start = i;
      i = plainNumber(t, i, what, r);
      if (i < 0) return -1;
      t.starts[f] = start; // a column read both as a number and otherwise (a timestamp that is also a state)
      t.ends[f] = i;
    } else {
      const start = i;
      while (i < end) {
        const c = b[i];
        if (c === delimiter || c === LF || c === CR) break;
        i++;
      }
      if (what === BOUNDS) {
        t.starts[f] = start;
        t.ends[f] = i;
      }
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
}

/**
 * Parse a plain number at i into numbers[k][r]; the offset after it, or −1 when it is not plain.
 * The integer and fraction digits are read in tight loops; at most 15 significant digits (leading
 * zeros skipped) keep the mantissa below 10^15, so the fast path is exact. A cell with more goes
 * to the general reader, which gives the same double (numericBytes.ts).
 */
function plainNumber(t: PlainRecordTarget, from: number, k: number, r: number): number {
  const { bytes: b, end } = t;
  let i = from, negative = false, c = i < end ? b[i] : -1;
  if (c === MINUS || c === PLUS) {
    negative = c === MINUS;
    c = ++i < end ? b[i] : -1;
  }
  const digitsFrom = i;
  while (c === ZERO) c = ++i < end ? b[i] : -1; // leading zeros: no value, and not significant
  const significantFrom = i;
  let mantissa = 0;
  while (c >= ZERO && c <= NINE) {
    mantissa = mantissa * 10 + (c - ZERO);
    c = ++i < end ? b[i] : -1;
  }
  let digits = i - digitsFrom, significant = i - significantFrom, scale = 0;
  if (c === t.markByte) {
    const fractionFrom = ++i;
    c = i < end ? b[i] : -1;
    if (mantissa === 0) while (c === ZERO) c = ++i < end ? b[i] : -1; // a value below 1: its leading zeros only scale it
    const fractionSignificantFrom = i;
    while (c >= ZERO && c <= NINE) {
      mantissa = mantissa * 10 + (c - ZERO);
      c = ++i < end ? b[i] : -1;
    }
    scale = fractionFrom - i;
    digits += i - fractionFrom;
    significant += i - fractionSignificantFrom;
  }
  if (digits === 0 || significant > MAX_SIGNIFICANT_DIGITS) return -1;
  if (c === LOWER_E || c === UPPER_E) {
    i = plainExponent(t, i + 1);
    if (i < 0) return -1;
    scale += t.exponent;
    c = i < end ? b[i] : -1;
  }
  if (c !== -1 && c !== t.delimiter && c !== LF && c !== CR) return -1;
  if (scale > 22 || scale < -22) return -1;
  const magnitude = mantissa === 0 ? 0 : scale >= 0 ? mantissa * POWERS[scale] : mantissa / POWERS[-scale];
  t.numbers[k][r] = negative ? -magnitude : magnitude;
  return i;
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
