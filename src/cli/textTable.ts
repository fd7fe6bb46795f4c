/** What the terminal formatters share: a number to so many significant digits, and a plain text table. */
import { ASCII_MINUS, exponentText } from '../core/exponentText';

/**
 * `digits` significant digits with trailing zeros dropped; "—" for none. With `exponent`,
 * magnitudes of 1e6 and above or below 1e-3 are written in the terminal's exponent form, "1.23e-5"
 * (core/exponentText.ts; digits − 2 decimals).
 */
export function significant(v: number | null, digits: number, exponent = true): string {
  if (v === null || !Number.isFinite(v)) return '—';
  const magnitude = Math.abs(v);
  if (exponent && magnitude !== 0 && (magnitude >= 1e6 || magnitude < 1e-3)) return exponentText(v, digits - 2, ASCII_MINUS, true);
  return v.toPrecision(digits).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
}

/**
 * Columns three spaces apart, right-aligned; the first left-aligned unless `firstLeft` is false; a
 * last column of words (a marker such as "◀ best supported") left-aligned when `lastLeft`. No line
 * ends in spaces (a row whose last cells are empty, or padding after the widest cell).
 */
export function textTable(rows: string[][], firstLeft = true, lastLeft = false): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length))), last = rows[0].length - 1;
  const cellText = (cell: string, c: number): string => ((c === 0 && firstLeft) || (c === last && lastLeft) ? cell.padEnd(widths[c]) : cell.padStart(widths[c]));
  return rows.map((r) => r.map(cellText).join('   ').trimEnd()).join('\n');
}
