/**
 * The report's estimates at the precision their intervals carry: an interval's two ends to the
 * decimal place that gives its width three significant digits, the estimate to the same place
 * ("8.36 [6.58, 10.34]", not "8.3582 [6.581, 10.34]"), and a standard error to two significant
 * digits. One precision for numbers read together, as for a value and its uncertainty in JCGM 100
 * (the GUM) §7.2.2 and §7.2.6 — common practice; the app's Findings use the same rule
 * (renderer/src/screens/findings/assessmentWords.ts, intervalText), so screen and report agree; the
 * decimal place comes from figures/parts/tickFormat.ts (intervalDecimals), which the figures' labels use.
 * Without a usable interval (none, zero width, very large or very small ends) the plain number style.
 */
import { decimalsAt, intervalDecimals } from '../../figures/parts/tickFormat';
import { formatNumber } from './htmlText';

function fixed(x: number, decimals: number): string {
  return x.toFixed(decimals).replace(/^-/, '\u2212');
}

/** "[6.58, 10.34]": both ends at one decimal place; "—" without an interval. */
export function intervalAtPrecision(iv: readonly [number, number] | null | undefined): string {
  if (!iv) return '—';
  const d = intervalDecimals(iv);
  return d === null ? `[${formatNumber(iv[0], 4)}, ${formatNumber(iv[1], 4)}]` : `[${fixed(iv[0], d)}, ${fixed(iv[1], d)}]`;
}

/** A value at the decimal place of its interval's ends; without one, four significant digits. */
export function valueAtPrecision(value: number | null | undefined, iv: readonly [number, number] | null | undefined): string {
  const d = intervalDecimals(iv);
  return d === null || value === null || value === undefined || !Number.isFinite(value) ? formatNumber(value, 4) : fixed(value, d);
}

/** A value and its standard error (no interval): the error to two significant digits, the value to the same place. */
export function valueWithError(value: number | null | undefined, error: number | null | undefined): { value: string; error: string } {
  if (error === null || error === undefined || !(error > 0) || !Number.isFinite(error) || value === null || value === undefined
    || !Number.isFinite(value) || Math.abs(value) >= 1e6 || 1 - Math.floor(Math.log10(error)) > 10) return { value: formatNumber(value, 4), error: formatNumber(error, 2) };
  const d = decimalsAt(error, 2); // at most 10 here, so the error keeps its two digits
  return { value: fixed(value, d), error: fixed(error, d) };
}
