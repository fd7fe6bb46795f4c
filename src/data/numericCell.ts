/**
 * Reading one cell as a number, strictly: digits with one decimal mark and an optional exponent.
 * Number() alone is too lenient for measurement logs ("" → 0, "0x1A" → 26, "1,2.3" → NaN with no
 * hint), so cells are checked against the grammar first and every refusal says why.
 */
import type { ImportProblemKind } from './importProblem';

export type DecimalMark = '.' | ',';

const NON_FINITE = /^[+-]?(?:nan|inf|infinity|∞)$/i;

/** The value of a cell, or a reason it is not a number. */
export type CellReading = { ok: true; value: number } | { ok: false; kind: CellProblemKind; reason: string };

export type CellProblemKind = Extract<ImportProblemKind, 'empty-cell' | 'not-a-number' | 'not-finite' | 'bad-flag'>;

const PLUS = 43, MINUS = 45, DOT = 46, COMMA = 44, ZERO = 48, NINE = 57, SPACE = 32, LOWER_E = 101, UPPER_E = 69;

/**
 * The cell's value if it is a number in the grammar [+-]digits[mark digits][(e|E)[+-]digits]
 * (surrounding blanks allowed; ±Infinity when it overflows a double), else NaN. A hand-written
 * scan, because this runs once per cell and a regex plus a result object per cell dominated the
 * import time of large files.
 */
function scanNumber(text: string, mark: number): number {
  let i = 0, end = text.length;
  while (i < end && text.charCodeAt(i) <= SPACE) i++;
  while (end > i && text.charCodeAt(end - 1) <= SPACE) end--;
  let c = text.charCodeAt(i);
  if (c === PLUS || c === MINUS) c = text.charCodeAt(++i);
  let digits = 0, markAt = -1;
  for (; i < end; c = text.charCodeAt(++i)) {
    if (c >= ZERO && c <= NINE) digits++;
    else if (c === mark && markAt < 0) markAt = i;
    else break;
  }
  if (digits === 0) return NaN;
  if (i < end && (c === LOWER_E || c === UPPER_E)) {
    c = text.charCodeAt(++i);
    if (c === PLUS || c === MINUS) c = text.charCodeAt(++i);
    let exponentDigits = 0;
    for (; i < end && c >= ZERO && c <= NINE; c = text.charCodeAt(++i)) exponentDigits++;
    if (exponentDigits === 0) return NaN;
  }
  if (i < end) return NaN;
  return Number(markAt >= 0 && mark === COMMA ? text.replace(',', '.') : text);
}

/** The cell's value, or NaN when it is not a finite number (the fast path of readNumber). */
export function numberOrNaN(text: string, decimalMark: DecimalMark): number {
  const value = scanNumber(text, decimalMark === '.' ? DOT : COMMA);
  return Number.isFinite(value) ? value : NaN;
}

export function readNumber(text: string, decimalMark: DecimalMark): CellReading {
  const value = scanNumber(text, decimalMark === '.' ? DOT : COMMA);
  if (Number.isFinite(value)) return { ok: true, value };
  const cell = text.trim();
  if (!Number.isNaN(value)) return { ok: false, kind: 'not-finite', reason: `"${shorten(cell)}" is too large for a double-precision number` };
  if (cell === '') return { ok: false, kind: 'empty-cell', reason: 'the cell is empty; expected a number' };
  if (NON_FINITE.test(cell)) return { ok: false, kind: 'not-finite', reason: `"${cell}" is not a finite number; NaN and infinity cannot be used` };
  return { ok: false, kind: 'not-a-number', reason: explainNotANumber(cell, decimalMark) };
}

function explainNotANumber(cell: string, decimalMark: DecimalMark): string {
  const example = decimalMark === '.' ? '12.5' : '12,5';
  const other = decimalMark === '.' ? ',' : '.';
  const hint = cell.includes(other) && !cell.includes(decimalMark)
    ? ` (the decimal mark for this file is "${decimalMark}", not "${other}")`
    : '';
  return `"${shorten(cell)}" is not a number; expected a number such as ${example}${hint}`;
}

/** Long cells (a swallowed line, a pasted note) are cut so messages stay one screen wide. */
export function shorten(text: string, limit = 40): string {
  const oneLine = text.replace(/\r?\n/g, '⏎');
  return oneLine.length <= limit ? oneLine : `${oneLine.slice(0, limit - 1)}…`;
}

const TRUE_WORDS = new Set(['1', 'true', 'yes', 'y', 't']);
const FALSE_WORDS = new Set(['0', 'false', 'no', 'n', 'f', '']);

/** A terminal flag: 1/true/yes mark a terminal next state; 0/false/no or an empty cell do not. */
export function readFlag(text: string): CellReading {
  const cell = text.trim().toLowerCase();
  if (TRUE_WORDS.has(cell)) return { ok: true, value: 1 };
  if (FALSE_WORDS.has(cell)) return { ok: true, value: 0 };
  return { ok: false, kind: 'bad-flag', reason: `"${shorten(text.trim())}" is not an end-of-run flag; expected 1 or 0 (or true/false, yes/no, or empty for 0)` };
}
