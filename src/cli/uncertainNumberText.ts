/**
 * The terminal's numbers at the precision their uncertainty carries: the one rule the app's tables,
 * the figures and the report share (figures/parts/uncertainNumber.ts; JCGM 100, the GUM, §7.2.2 and
 * §7.2.6 — common practice), bound to the terminal's ASCII hyphen-minus, so its text can be searched
 * and pasted as typed. "7.7 ± 1.3", not "7.71825 ± 1.27478"; "[5.62, 10.18]", not "[5.6171, 10.175]".
 * `--json` keeps full precision.
 */
import { ASCII_MINUS, atDecimals as atDecimalsWith, intervalAtPrecision, valueInInterval } from '../figures/parts/uncertainNumber';
import { significant } from './textTable';

export { errorDecimals, rowDecimals } from '../figures/parts/uncertainNumber';

/** A number at `decimals` places, or the plain style where that is null. */
export function atDecimals(value: number | null | undefined, decimals: number | null): string {
  return atDecimalsWith(value, decimals, ASCII_MINUS);
}

/** "[5.62, 10.18]" at the interval's own precision; "—" without one. */
export function intervalText(iv: readonly [number, number] | null | undefined): string {
  return intervalAtPrecision(iv, ASCII_MINUS);
}

/** "7.72 [5.62, 10.18]": a value with its interval, by the one writer (valueInInterval); the value alone without one. */
export function valueInIntervalText(value: number | null | undefined, iv: readonly [number, number] | null | undefined): string {
  return valueInInterval(value, iv, ASCII_MINUS).text;
}

/** A diagnostic ratio (the occupancy shift): three significant digits, whole numbers from 1,000 up (toPrecision would write 4.35e+3). */
export function ratioText(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return Math.abs(v) >= 1000 && Math.abs(v) < 1e9 ? String(Math.round(v)) : significant(v, 3);
}
