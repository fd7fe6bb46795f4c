/**
 * A cell's number read straight from the file's bytes, for the import's hot loop: the same strict
 * grammar as numericCell.ts ([+-]digits[mark digits][(e|E)[+-]digits], blanks around), without
 * making a string per cell.
 *
 * Exactness: while the significant digits form an integer M < 10^15 (below 2^53, so exact) and the
 * decimal exponent E has |E| ≤ 22 (10^E exact in binary64), M·10^E or M/10^−E is one correctly
 * rounded IEEE operation, hence the same double Number() gives (Clinger 1990, "How to read floating
 * point numbers accurately", the fast path). Any other cell is handed to Number() on its text.
 */
const PLUS = 43, MINUS = 45, ZERO = 48, NINE = 57, SPACE = 32, LOWER_E = 101, UPPER_E = 69, DOT = 46, COMMA = 44;
const POWERS = Array.from({ length: 23 }, (_, k) => 10 ** k); // exact: 10^k < 2^53·2^k for k ≤ 22
const MAX_EXACT_MANTISSA = 1e15;
/** Longer cells are not read as numbers (no log writes a number of 4,000 characters). */
export const MAX_NUMBER_BYTES = 4096;

/**
 * The value of bytes[start, end) as a number in the grammar (±Infinity when it overflows a double),
 * or NaN when it is not one. `mark` is the decimal mark, "." or ",".
 */
export function numberFromBytes(b: Uint8Array, start: number, end: number, mark: '.' | ','): number {
  return numberFromBytesWith(b, start, end, mark === '.' ? DOT : COMMA);
}

/** numberFromBytes with the decimal mark as its byte (46 ".", 44 ","), for the import's hot loop. */
export function numberFromBytesWith(b: Uint8Array, start: number, end: number, markByte: number): number {
  let i = start, e = end;
  while (i < e && b[i] <= SPACE) i++;
  while (e > i && b[e - 1] <= SPACE) e--;
  if (e - i > MAX_NUMBER_BYTES) return NaN;
  const from = i;
  let negative = false;
  if (i < e && (b[i] === PLUS || b[i] === MINUS)) negative = b[i++] === MINUS;
  let mantissa = 0, digits = 0, scale = 0, exact = true, seenMark = false;
  for (; i < e; i++) {
    const c = b[i];
    if (c >= ZERO && c <= NINE) {
      digits++;
      if (mantissa === 0 && c === ZERO) { if (seenMark) scale--; continue; }
      mantissa = mantissa * 10 + (c - ZERO);
      if (seenMark) scale--;
      if (mantissa >= MAX_EXACT_MANTISSA) exact = false;
    } else if (c === markByte && !seenMark) seenMark = true;
    else break;
  }
  if (digits === 0) return NaN;
  if (i < e && (b[i] === LOWER_E || b[i] === UPPER_E)) {
    i++;
    let exponentNegative = false, exponent = 0, exponentDigits = 0;
    if (i < e && (b[i] === PLUS || b[i] === MINUS)) exponentNegative = b[i++] === MINUS;
    for (; i < e && b[i] >= ZERO && b[i] <= NINE; i++) {
      exponentDigits++;
      if (exponent < 100_000) exponent = exponent * 10 + (b[i] - ZERO);
    }
    if (exponentDigits === 0) return NaN;
    scale += exponentNegative ? -exponent : exponent;
  }
  if (i < e) return NaN;
  if (!exact || scale > 22 || scale < -22) return slowNumber(b, from, e, markByte);
  const magnitude = mantissa === 0 ? 0 : scale >= 0 ? mantissa * POWERS[scale] : mantissa / POWERS[-scale];
  return negative ? -magnitude : magnitude;
}

/** Number() on the cell's text (already known to be in the grammar, so ASCII). */
function slowNumber(b: Uint8Array, start: number, end: number, markByte: number): number {
  let text = '';
  for (let i = start; i < end; i++) text += String.fromCharCode(b[i] === markByte ? DOT : b[i]);
  return Number(text);
}
