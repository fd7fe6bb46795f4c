/**
 * Tick and tooltip number text. Fixed notation with the tick set's digits, thousands separators and
 * a true minus; a value of a million or more stays fixed ("2,500,000"), as the command line and the
 * tables write it (uncertainNumber.ts). Exponent form only where fixed notation would be wider than a
 * tick label should be (from WIDEST_FIXED_TICK, eleven digits and separators: "999,999,999") or mostly
 * zeros (below SMALLEST_FIXED). The locale is fixed ('en-US') so an exported figure reads the same on every machine.
 */
import { LARGEST_FIXED, SMALLEST_FIXED, TRUE_MINUS, intervalDecimals, valueAtPrecision, valueWithError } from './uncertainNumber';
import { exponentText, powerOfTen } from '../../core/exponentText';

/** Tick labels from here on are written in exponent form: fixed notation would run past eleven characters. */
const WIDEST_FIXED_TICK = 1e9;

/**
 * A tick label. `step` is the distance between neighbouring ticks: in exponent form the mantissa
 * keeps as many digits as tell neighbours apart (at least EXPONENT_DIGITS after the point), so a
 * narrow range far from 0 ("9.6510e−8, 9.6515e−8") never writes two ticks alike ("9.65e−8" twice,
 * the duplicate label the screen review saw on a colour bar).
 */
export function formatTick(value: number, fractionDigits: number, step?: number): string {
  if (value === 0) return (0).toFixed(Math.min(20, fractionDigits));
  const magnitude = Math.abs(value);
  if (magnitude >= WIDEST_FIXED_TICK || magnitude < SMALLEST_FIXED) return exponentText(value, mantissaDigits(magnitude, step), TRUE_MINUS, true);
  return toDecimals(value, fractionDigits);
}

/** Digits after the point of an exponent-form mantissa: fewest EXPONENT_DIGITS, more where the step is finer than that (at most 14, a double's). */
const EXPONENT_DIGITS = 2;
function mantissaDigits(magnitude: number, step: number | undefined): number {
  if (!(step !== undefined && step > 0 && Number.isFinite(step))) return EXPONENT_DIGITS;
  const needed = Math.floor(Math.log10(magnitude) + 1e-9) - Math.floor(Math.log10(step) + 1e-9);
  return Math.min(14, Math.max(EXPONENT_DIGITS, needed));
}

/** The distance between neighbouring ticks, from their values (0 with fewer than two). */
export function tickStepOf(values: readonly number[]): number {
  return values.length < 2 ? 0 : Math.abs(values[1] - values[0]);
}

/** Fixed decimals with thousands separators and a true minus, never exponent form. */
function toDecimals(value: number, decimals: number): string {
  return trueMinus(value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }));
}

/** The minus sign U+2212 for the hyphen-minus (typographic practice for numbers; ISO 80000-2). */
export function trueMinus(text: string): string {
  return text.replace(/-/g, TRUE_MINUS);
}

/** Digits a set of evenly spaced ticks needs to tell neighbours apart (Heckbert's nfrac from the step). */
export function fractionDigitsOf(values: readonly number[]): number {
  if (values.length < 2) return 0;
  const step = Math.abs(values[1] - values[0]);
  return step > 0 ? Math.min(12, Math.max(0, -Math.floor(Math.log10(step) + 1e-9))) : 0;
}

/** A decade on a log axis as 10 with a superscript exponent ("10⁻⁵"); '' for values between decades. */
export function decadeLabel(value: number): string {
  if (!(value > 0)) return '';
  const exponent = Math.log10(value), k = Math.round(exponent);
  if (Math.abs(exponent - k) > 1e-9) return '';
  return powerOfTen(k);
}

/** A grid point's label may be off its value by at most this share of it (half a unit in the third significant digit). */
export const GRID_LABEL_TOLERANCE = 0.005;

/**
 * Labels for the points of a grid (a retune map's gains and integral times, often spaced by ratio):
 * one count of decimals for the whole axis, so "300, 584, 1,136" and never "583.8" beside "1,136";
 * the fewest with which each label is within GRID_LABEL_TOLERANCE of its point and no two read
 * alike. Exponent form (formatValue) where any point is past fixed notation's range.
 */
export function gridPointLabels(values: readonly number[]): string[] {
  const finite = values.filter((v) => v !== 0 && Number.isFinite(v));
  if (finite.some((v) => Math.abs(v) >= LARGEST_FIXED || Math.abs(v) < SMALLEST_FIXED)) return values.map(formatValue);
  const distinct = new Set(values).size;
  let decimals = 0;
  for (; decimals < 12; decimals++) {
    const close = finite.every((v) => Math.abs(Number(v.toFixed(decimals)) - v) <= GRID_LABEL_TOLERANCE * Math.abs(v));
    if (close && new Set(values.map((v) => v.toFixed(decimals))).size === distinct) break;
  }
  return values.map((v) => toDecimals(v, decimals));
}

/**
 * A tuning value (a retune map point's gain or integral time) wherever it is written — the map's
 * readout, the app's headline and table, the report's caption and grid, the command line — as its
 * grid point is labelled (gridPointLabels), so the headline's "T_i (min) = 100" is the table's "100",
 * never "100.0" beside it. Callers pass the map in its shown units (tuningAxis.ts shownMap: an
 * integral time in minutes from 10 min), the units of the figure's axis. A value not on its axis
 * (never, from a map) reads as formatValue writes it.
 */
export function tuningValueTexts(axes: readonly { values: readonly number[] }[], coordinates: readonly number[]): string[] {
  return coordinates.map((v, a) => {
    const values = axes[a]?.values ?? [], i = values.indexOf(v);
    return i < 0 ? formatValue(v) : gridPointLabels(values)[i];
  });
}

/**
 * A value with four significant digits, for tooltips and text summaries: fixed notation with
 * thousands separators up to LARGEST_FIXED ("1,235,000"), as the tables keep it; exponent form
 * beyond, where a double has no units digit, and below SMALLEST_FIXED.
 */
export function formatValue(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= LARGEST_FIXED || magnitude < SMALLEST_FIXED) return exponentText(value, 3, TRUE_MINUS, true);
  return trueMinus(Number(value.toPrecision(4)).toLocaleString('en-US', { maximumFractionDigits: 10 }));
}

/**
 * A value with its standard error as "5.76 ± 0.18", by the one rule for numbers read with their
 * uncertainty (uncertainNumber.ts: the error to two significant digits and the value to its place,
 * or both to the interval's place where the value is also shown with one).
 */
export function formatEstimate(value: number, error: number | null, interval: readonly [number, number] | null = null): string {
  const text = valueWithError(value, error, interval);
  return error === null || !Number.isFinite(error) || error <= 0 ? (intervalDecimals(interval) === null ? formatValue(value) : text.value) : `${text.value} ± ${text.error}`;
}

/** A value at the decimal place of its interval ("8.36" beside [6.58, 10.34]); without one, formatValue. */
export function formatValueInInterval(value: number, interval: readonly [number, number] | null | undefined): string {
  return intervalDecimals(interval) === null || !Number.isFinite(value) ? formatValue(value) : valueAtPrecision(value, interval);
}
