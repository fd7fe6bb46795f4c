/**
 * The terminal's numbers at the precision their uncertainty carries, by the rule the app's tables,
 * the figures and the report share (figures/parts/tickFormat.ts: an interval's ends to the decimal
 * place that gives its width three significant digits, a value read with it to the same place, a
 * standard error to two significant digits and its value to the same place; JCGM 100 (the GUM)
 * §7.2.2 and §7.2.6 — common practice). "7.7 ± 1.3", not "7.71825 ± 1.27478"; "[5.62, 10.18]", not
 * "[5.6171, 10.175]". The terminal keeps the ASCII hyphen-minus, so its text can be searched and
 * pasted as typed. Unlike the app's tables and the report, it stays in fixed notation for a value of a
 * million or more: the decimal place is set by the uncertainty, not by the value's size, and the
 * exponent form's four significant digits would round J = 1,234,567.9 ± 3.2 by thousands. Where the
 * rule does not apply (no usable interval or error, an uncertainty of a million or more, or one that
 * needs more than ten decimal places) `significant` with PLAIN_DIGITS digits. `--json` keeps full precision.
 */
import { decimalsAt } from '../figures/parts/tickFormat';
import { significant } from './textTable';

/** Digits of the fallback style where no interval or error sets the precision. */
const PLAIN_DIGITS = 4;
/** An uncertainty (interval width, standard error) from which the rule gives way to the fallback style. */
const LARGEST_UNCERTAINTY = 1e6;
/** Values from here on lose their units digit in a double (2⁵³ ≈ 9.0e15), so fixed notation would show digits that are not there. */
const LARGEST_FIXED = 1e15;
/** Most decimal places the rule writes (decimalsAt's cap). */
const MOST_DECIMALS = 10;

const fixed = (x: number, decimals: number): string => (Object.is(Math.round(x * 10 ** decimals), -0) ? 0 : x).toFixed(decimals);

/** Decimal places a standard error of two significant digits needs, or null where that rule does not apply. */
export function errorDecimals(error: number | null | undefined): number | null {
  return error === null || error === undefined ? null : uncertaintyDecimals(error, 2);
}

/** Decimal places that give an interval's width three significant digits, or null where that rule does not apply. */
export function widthDecimals(iv: readonly [number, number] | null | undefined): number | null {
  return iv ? uncertaintyDecimals(iv[1] - iv[0], 3) : null;
}

/** decimalsAt(scale, digits) where the scale is positive, finite, below LARGEST_UNCERTAINTY and needs at most MOST_DECIMALS places; else null. */
function uncertaintyDecimals(scale: number, digits: number): number | null {
  if (!(scale > 0) || scale >= LARGEST_UNCERTAINTY || digits - 1 - Math.floor(Math.log10(scale)) > MOST_DECIMALS) return null;
  return decimalsAt(scale, digits);
}

/** A number at `decimals` places, or the plain style where that is null (or the value is too large for fixed notation). */
export function atDecimals(value: number | null | undefined, decimals: number | null): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return decimals === null || Math.abs(value) >= LARGEST_FIXED ? significant(value, PLAIN_DIGITS) : fixed(value, decimals);
}

/** "[5.62, 10.18]" at the interval's own precision; "—" without one. */
export function intervalText(iv: readonly [number, number] | null | undefined): string {
  if (!iv) return '—';
  const d = widthDecimals(iv);
  return `[${atDecimals(iv[0], d)}, ${atDecimals(iv[1], d)}]`;
}

/** The decimal places for a row read against its interval, or else against its standard error. */
export function rowDecimals(iv: readonly [number, number] | null | undefined, error?: number | null): number | null {
  return widthDecimals(iv) ?? errorDecimals(error);
}

/** A diagnostic ratio (the occupancy shift): three significant digits, whole numbers from 1,000 up (toPrecision would write 4.35e+3). */
export function ratioText(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return Math.abs(v) >= 1000 && Math.abs(v) < 1e9 ? String(Math.round(v)) : significant(v, 3);
}
