/**
 * The terminal's numbers at the precision their uncertainty carries, by the rule the app's tables,
 * the figures and the report share (figures/parts/tickFormat.ts: an interval's ends to the decimal
 * place that gives its width three significant digits, a value read with it to the same place, a
 * standard error to two significant digits and its value to the same place; JCGM 100 (the GUM)
 * §7.2.2 and §7.2.6 — common practice). "7.72 ± 1.3", not "7.71825 ± 1.27478"; "[5.62, 10.18]", not
 * "[5.6171, 10.175]". The terminal keeps the ASCII hyphen-minus, so its text can be searched and
 * pasted as typed. Where the rule does not apply (no usable interval or error; very large or very
 * small magnitudes) `significant` with the caller's digits, as before. `--json` keeps full precision.
 */
import { decimalsAt, intervalDecimals } from '../figures/parts/tickFormat';
import { significant } from './textTable';

/** Digits of the fallback style where no interval or error sets the precision. */
const PLAIN_DIGITS = 4;

const fixed = (x: number, decimals: number): string => (Object.is(Math.round(x * 10 ** decimals), -0) ? 0 : x).toFixed(decimals);

/** Decimal places a standard error of two significant digits needs, or null where that rule does not apply. */
export function errorDecimals(error: number | null | undefined): number | null {
  if (error === null || error === undefined || !(error > 0) || !Number.isFinite(error) || error >= 1e6 || 1 - Math.floor(Math.log10(error)) > 10) return null;
  return decimalsAt(error, 2);
}

/** A number at `decimals` places, or the plain style where that is null (or the value is too large for fixed notation). */
export function atDecimals(value: number | null | undefined, decimals: number | null): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return decimals === null || Math.abs(value) >= 1e6 ? significant(value, PLAIN_DIGITS) : fixed(value, decimals);
}

/** "[5.62, 10.18]" at the interval's own precision; "—" without one. */
export function intervalText(iv: readonly [number, number] | null | undefined): string {
  if (!iv) return '—';
  const d = intervalDecimals(iv);
  return `[${atDecimals(iv[0], d)}, ${atDecimals(iv[1], d)}]`;
}

/** The decimal places for a row read against its interval, or else against its standard error. */
export function rowDecimals(iv: readonly [number, number] | null | undefined, error?: number | null): number | null {
  return intervalDecimals(iv) ?? errorDecimals(error);
}

/** A diagnostic ratio (the occupancy shift): three significant digits, whole numbers from 1,000 up (toPrecision would write 4.35e+3). */
export function ratioText(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return Math.abs(v) >= 1000 && Math.abs(v) < 1e9 ? String(Math.round(v)) : significant(v, 3);
}
