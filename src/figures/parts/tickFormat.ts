/**
 * Tick and tooltip number text. Fixed notation with the tick set's digits in the usual range,
 * exponent notation for very large or very small magnitudes so labels stay short. The locale is
 * fixed ('en-US') so an exported figure reads the same on every machine.
 */
const EXPONENT_ABOVE = 1e6;
const EXPONENT_BELOW = 1e-4;

export function formatTick(value: number, fractionDigits: number): string {
  if (value === 0) return (0).toFixed(Math.min(20, fractionDigits));
  const magnitude = Math.abs(value);
  if (magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return trueMinus(value.toExponential(2).replace('e+', 'e'));
  return toDecimals(value, fractionDigits);
}

/** Fixed decimals with thousands separators and a true minus, never exponent form. */
function toDecimals(value: number, decimals: number): string {
  return trueMinus(value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }));
}

/** The minus sign U+2212 for the hyphen-minus (typographic practice for numbers; ISO 80000-2). */
export function trueMinus(text: string): string {
  return text.replace(/-/g, '−');
}

/** Digits a set of evenly spaced ticks needs to tell neighbours apart (Heckbert's nfrac from the step). */
export function fractionDigitsOf(values: readonly number[]): number {
  if (values.length < 2) return 0;
  const step = Math.abs(values[1] - values[0]);
  return step > 0 ? Math.min(12, Math.max(0, -Math.floor(Math.log10(step) + 1e-9))) : 0;
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** A decade on a log axis as 10 with a superscript exponent ("10⁻⁵"); '' for values between decades. */
export function decadeLabel(value: number): string {
  if (!(value > 0)) return '';
  const exponent = Math.log10(value), k = Math.round(exponent);
  if (Math.abs(exponent - k) > 1e-9) return '';
  return `10${String(k).split('').map((c) => SUPERSCRIPT[c]).join('')}`;
}

/** A value with four significant digits, for tooltips and text summaries. */
export function formatValue(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return trueMinus(value.toExponential(3).replace('e+', 'e'));
  return trueMinus(Number(value.toPrecision(4)).toLocaleString('en-US', { maximumFractionDigits: 10 }));
}

/**
 * A value with its standard error as "5.76 ± 0.18": the error to two significant digits and the
 * value to the same decimal place (the usual way to quote a result with its uncertainty; JCGM 100,
 * the GUM, §7.2.2 — common practice). Exponent form outside 1e-4 … 1e6. Where the value is also
 * shown with an interval, both go to the interval's decimal place (intervalDecimals), so one value
 * reads the same beside its interval and beside its error.
 */
export function formatEstimate(value: number, error: number | null, interval: readonly [number, number] | null = null): string {
  const atInterval = intervalDecimals(interval);
  if (atInterval !== null && Number.isFinite(value)) {
    const fixed = (x: number) => toDecimals(x, atInterval);
    return error === null || !Number.isFinite(error) || error <= 0 ? fixed(value) : `${fixed(value)} ± ${fixed(error)}`;
  }
  if (error === null || !Number.isFinite(error) || error <= 0) return formatValue(value);
  const magnitude = Math.max(Math.abs(value), error);
  if (magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return `${formatValue(value)} ± ${formatValue(error)}`;
  const decimals = Math.min(12, Math.max(0, 1 - Math.floor(Math.log10(error))));
  const fixed = (x: number) => toDecimals(x, decimals);
  return `${fixed(value)} ± ${fixed(error)}`;
}

/**
 * Decimal places for numbers read with an interval: those that give its width three significant
 * digits (0 to 10), so "8.36 [6.58, 10.34]" share one precision (JCGM 100 §7.2.2 — common practice;
 * the app's Findings tables and the report use the same rule). Null where it does not apply: no
 * interval, zero or negative width, or ends outside 1e-4 … 1e6 (exponent form there).
 */
export function intervalDecimals(interval: readonly [number, number] | null | undefined): number | null {
  if (!interval) return null;
  const width = interval[1] - interval[0], magnitude = Math.max(Math.abs(interval[0]), Math.abs(interval[1]));
  if (!(width > 0) || !Number.isFinite(width) || magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return null;
  return decimalsAt(width, 3);
}

/**
 * The decimal place at which `scale` (> 0) has `significant` significant digits, at most 10 and none
 * below the units: one precision for numbers read together (a value and its error, an interval's ends).
 * The app's tables (renderer format/numberFormat.ts), the figures and the report all take it from here.
 */
export function decimalsAt(scale: number, significant: number): number {
  return Math.min(10, Math.max(0, significant - 1 - Math.floor(Math.log10(scale))));
}

/** A value at the decimal place of its interval ("8.36" beside [6.58, 10.34]); without one, four significant digits. */
export function formatValueInInterval(value: number, interval: readonly [number, number] | null | undefined): string {
  const decimals = intervalDecimals(interval);
  if (decimals === null || !Number.isFinite(value)) return formatValue(value);
  return toDecimals(value, decimals);
}
