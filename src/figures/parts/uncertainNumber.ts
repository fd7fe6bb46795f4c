/**
 * Numbers read with their uncertainty, written once for every host: the app's tables, the figures'
 * labels and tooltips, the report and the command line all call these. A value with its interval has
 * one writer, valueInInterval: "8.36 [6.58, 10.34]", never a value and an interval each written by its
 * own rule.
 *
 * The rule (common practice: enough significant digits that an interval's ends differ, and no more than
 * its width can carry; JCGM 100, the GUM, §7.2.2 and §7.2.6): the interval's width sets the decimal place,
 * at which it has three significant digits, so its two ends differ by at least 100 units of the last
 * digit shown; the value goes to the same place. Worked by hand:
 *   8.35823 in [6.5808, 10.3412]: width 3.76, three digits at 2 decimals   → "8.36 [6.58, 10.34]"
 *   −5.3612 in [−5.7031, −5.0329]: width 0.670, at 3 decimals               → "−5.361 [−5.703, −5.033]"
 *   1234555.55 in [1234500.2, 1234600.7]: width 100.5, never below the units → "1234556 [1234500, 1234601]"
 * So a J and its difference from the baseline, read side by side, may differ in their count of
 * decimals: the paired difference is known more closely than J itself, and each keeps what its own
 * interval carries. A standard error alone goes to two significant digits and its value to the same
 * place ("7.7 ± 1.3"); read beside an interval, to the interval's place ("7.72 ± 1.27 [5.62, 10.18]"),
 * so one J and its s.e. read alike in the app, the report and on the terminal.
 *
 * The decimal place is set by the uncertainty, never by the value's size, so a value of a million or
 * more stays in fixed notation (J = 1234567.9 ± 3.2, not 1.235e6 ± 3.2, which would round by
 * thousands beside an error of 3). No grouping separators: inside "[a, b]" a comma would read as the
 * list's. Where the rule does not apply (no usable interval or error, an uncertainty of a million or
 * more, or one that needs more than ten decimal places) the plain style: PLAIN_DIGITS significant digits.
 * The minus sign is a parameter: U+2212 where the text is typeset (app, figures, report), the ASCII
 * hyphen-minus on the terminal, whose text is searched and pasted as typed; it also picks the exponent
 * form, "1.235 × 10⁻⁵" typeset and "1.235e-5" on the terminal (core/exponentText.ts, the one writer).
 */
import { ASCII_MINUS, exponentText, TRUE_MINUS, type Minus } from '../../core/exponentText';
import { shareText } from '../../core/shareText';

export { ASCII_MINUS, TRUE_MINUS, type Minus };

/** Significant digits of the plain style, where no interval or error sets the precision. */
export const PLAIN_DIGITS = 4;
/** An uncertainty (interval width, standard error) from which the rule gives way to the plain style. */
const LARGEST_UNCERTAINTY = 1e6;
/** Values from here on lose their units digit in a double (2⁵³ ≈ 9.0e15): fixed notation would show digits that are not there. */
export const LARGEST_FIXED = 1e15;
/** Below this magnitude the plain style writes exponent form ("1.2 × 10⁻⁵"), where fixed notation would be mostly zeros. */
export const SMALLEST_FIXED = 1e-4;
/** Most decimal places the rule writes. */
const MOST_DECIMALS = 10;

/**
 * The decimal place at which `scale` (> 0) has `significant` significant digits, at most 10 and none
 * below the units: one precision for numbers read together (a value and its error, an interval's ends).
 */
export function decimalsAt(scale: number, significant: number): number {
  return Math.min(MOST_DECIMALS, Math.max(0, significant - 1 - Math.floor(Math.log10(scale))));
}

/** decimalsAt(scale, digits) where the scale is positive, finite, below LARGEST_UNCERTAINTY and needs at most MOST_DECIMALS places; else null. */
function uncertaintyDecimals(scale: number, digits: number): number | null {
  if (!(scale > 0) || !(scale < LARGEST_UNCERTAINTY) || digits - 1 - Math.floor(Math.log10(scale)) > MOST_DECIMALS) return null;
  return decimalsAt(scale, digits);
}

/** Decimal places that give an interval's width three significant digits, or null where the rule does not apply. */
export function intervalDecimals(iv: readonly [number, number] | null | undefined): number | null {
  return iv && Number.isFinite(iv[0]) && Number.isFinite(iv[1]) ? uncertaintyDecimals(iv[1] - iv[0], 3) : null;
}

/** Decimal places a standard error of two significant digits needs, or null where the rule does not apply. */
export function errorDecimals(error: number | null | undefined): number | null {
  return error === null || error === undefined ? null : uncertaintyDecimals(error, 2);
}

/** The decimal places for numbers read against an interval, or else against a standard error. */
export function rowDecimals(iv: readonly [number, number] | null | undefined, error?: number | null): number | null {
  return intervalDecimals(iv) ?? errorDecimals(error);
}

/**
 * The plain style: `digits` significant digits, trailing zeros dropped, fixed notation from
 * SMALLEST_FIXED up to LARGEST_FIXED ("1235000", "0.01235"), exponent form outside it ("1.235 × 10⁻⁵", on
 * the terminal "1.235e-5"); "—" for none.
 */
export function plainNumber(v: number | null | undefined, digits = PLAIN_DIGITS, minus: Minus = TRUE_MINUS): string {
  if (v === null || v === undefined || Number.isNaN(v)) return '—';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : `${minus}∞`;
  if (v === 0) return '0';
  const magnitude = Math.abs(v);
  if (magnitude >= LARGEST_FIXED || magnitude < SMALLEST_FIXED) return exponentText(v, digits - 1, minus);
  const text = Number(v.toPrecision(digits)).toFixed(Math.max(0, digits - 1 - Math.floor(Math.log10(magnitude)))).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
  return text.replace(/-/g, minus);
}

/** A number at `decimals` places (never "−0.00"), or the plain style where that is null or the value too large for fixed notation. */
export function atDecimals(value: number | null | undefined, decimals: number | null, minus: Minus = TRUE_MINUS): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (decimals === null || Math.abs(value) >= LARGEST_FIXED) return plainNumber(value, PLAIN_DIGITS, minus);
  const zero = Object.is(Math.round(value * 10 ** decimals), -0) || Math.round(value * 10 ** decimals) === 0;
  return (zero ? 0 : value).toFixed(decimals).replace(/^-/, minus);
}

/** "[6.58, 10.34]" at the interval's own precision; "—" without one. */
export function intervalAtPrecision(iv: readonly [number, number] | null | undefined, minus: Minus = TRUE_MINUS): string {
  if (!iv) return '—';
  const d = intervalDecimals(iv);
  return `[${atDecimals(iv[0], d, minus)}, ${atDecimals(iv[1], d, minus)}]`;
}

/** A value at the decimal place of its interval's ends ("8.36" beside [6.58, 10.34]); without one, the plain style. A value shown with that interval: valueInInterval. */
export function valueAtPrecision(value: number | null | undefined, iv: readonly [number, number] | null | undefined, minus: Minus = TRUE_MINUS): string {
  return atDecimals(value, intervalDecimals(iv), minus);
}

/** A value and its interval as read together, both at the interval's place: { value: "8.36", interval: "[6.58, 10.34]", text: "8.36 [6.58, 10.34]" }; without an interval, the value in the plain style and the text without brackets. */
export function valueInInterval(
  value: number | null | undefined, iv: readonly [number, number] | null | undefined, minus: Minus = TRUE_MINUS,
): { value: string; interval: string; text: string } {
  const shown = valueAtPrecision(value, iv, minus);
  if (!iv) return { value: shown, interval: '—', text: shown };
  const interval = intervalAtPrecision(iv, minus);
  return { value: shown, interval, text: `${shown} ${interval}` };
}

/**
 * A value with its interval read at its level: "6.74, 90 % interval [4.88, 8.88]" (the level by shareText).
 * Without a level (results saved before it was kept) the value and the interval alone, "6.74 [4.88, 8.88]";
 * without an interval, the value in the plain style. The one writer of a headline's J, whatever the host.
 */
export function valueInLevelledInterval(
  value: number | null | undefined, iv: readonly [number, number] | null | undefined, level: number | undefined, minus: Minus = TRUE_MINUS,
): string {
  const shown = valueInInterval(value, iv, minus);
  return iv && level !== undefined ? `${shown.value}, ${shareText(level)} interval ${shown.interval}` : shown.text;
}

/**
 * A value and its standard error at one precision: at the interval's place where the value is also
 * shown with one (so one J reads alike beside its interval and beside its error), else the error to
 * two significant digits and the value to the same place; without either, the plain style (the error to two digits).
 */
export function valueWithError(
  value: number | null | undefined, error: number | null | undefined, iv: readonly [number, number] | null = null, minus: Minus = TRUE_MINUS,
): { value: string; error: string } {
  const usable = error !== null && error !== undefined && Number.isFinite(error) && error > 0 ? error : null;
  const d = rowDecimals(iv, usable);
  if (d === null) return { value: atDecimals(value, null, minus), error: error === null || error === undefined ? '—' : plainNumber(error, 2, minus) };
  return { value: atDecimals(value, d, minus), error: error === null || error === undefined || !Number.isFinite(error) ? '—' : atDecimals(error, d, minus) };
}
