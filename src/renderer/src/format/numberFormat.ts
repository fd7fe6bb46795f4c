/**
 * Numbers as people read them on screen: a few significant digits, no trailing zeros, exponent
 * notation only for very large or very small magnitudes, and a true minus sign.
 */
import { decimalsAt, intervalDecimals } from '../../../figures/parts/tickFormat';
import { isoTimeText } from '../../../core/clockText';

export function formatNumber(x: number, significant = 4): string {
  if (Number.isNaN(x)) return '—';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (x === 0) return '0';
  const magnitude = Math.abs(x);
  const text = magnitude >= 1e6 || magnitude < 1e-4 ? exponential(x, significant) : trimZeros(x.toPrecision(significant));
  return text.replace(/^-/, '−');
}

function exponential(x: number, significant: number): string {
  const [mantissa, exponent] = x.toExponential(significant - 1).split('e');
  const trimmed = mantissa.includes('.') ? mantissa.replace(/\.?0+$/, '') : mantissa;
  return `${trimmed}e${exponent.replace(/^\+/, '')}`;
}

function trimZeros(text: string): string {
  if (text.includes('e')) return String(Number(text));
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A value as an editable field shows it: the shortest text that reads back to the same number. */
export function editableNumber(x: number | null): string {
  if (x === null || Number.isNaN(x)) return '';
  const magnitude = Math.abs(x);
  // 1e-6 reads better than 0.000001; toExponential() without digits is the shortest round trip.
  return magnitude !== 0 && (magnitude < 1e-3 || magnitude >= 1e9) ? x.toExponential().replace('e+', 'e') : String(x);
}

/** The number a field's text means, or null when it is not one (blank, "1,2", "abc"). */
export function parseNumber(text: string): number | null {
  const trimmed = text.trim().replace(/^−/, '-');
  if (!/^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(trimmed)) return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/** Milliseconds as "1 min 05 s", "12 s", "< 1 s". */
export function formatDuration(ms: number): string {
  if (!Number.isFinite(ms) || ms < 0) return '—';
  const seconds = Math.round(ms / 1000);
  if (seconds < 1) return '< 1 s';
  if (seconds < 60) return `${seconds} s`;
  const minutes = Math.floor(seconds / 60);
  if (minutes < 60) return `${minutes} min ${String(seconds % 60).padStart(2, '0')} s`;
  return `${Math.floor(minutes / 60)} h ${String(minutes % 60).padStart(2, '0')} min`;
}

/** An ISO 8601 time as people read it: "2 Dec 2026, 10:41 UTC" (no seconds, no milliseconds). */
export function readableTime(iso: string): string {
  return isoTimeText(iso);
}

/** "1 run", "40 runs", "1,200 rows": a count with its noun in the right number. */
export function plural(count: number, noun: string, pluralNoun = `${noun}s`): string {
  return `${count.toLocaleString('en-US')} ${count === 1 ? noun : pluralNoun}`;
}

/** Text as a sentence: first letter capital, and a full stop at the end. */
export function sentence(text: string): string {
  const t = text.trim();
  if (!t) return t;
  const capital = t[0].toUpperCase() + t.slice(1);
  return /[.!?…]$/.test(capital) ? capital : `${capital}.`;
}

/**
 * A value and its standard error at one precision: the error to two significant digits, the value
 * to the same decimal place (JCGM 100, the GUM, §7.2.2 — common practice). Where the value also has
 * an interval on the same screen, both go to the interval's decimal place instead (intervalDecimals,
 * figures/parts/tickFormat.ts), so one J prints alike in every table that shows it.
 */
export function estimateText(value: number, error: number | null, interval: readonly [number, number] | null = null): { value: string; error: string } {
  const decimals = intervalDecimals(interval);
  if (decimals !== null && Number.isFinite(value)) {
    const fixed = fixedToDecimals(decimals);
    return { value: fixed(value), error: error === null || !Number.isFinite(error) ? '—' : fixed(error) };
  }
  if (error === null || !Number.isFinite(error) || error <= 0 || !Number.isFinite(value)) return { value: formatNumber(value, 4), error: error === null ? '—' : formatNumber(error, 2) };
  const fixed = fixedAtPrecisionOf(error, 2);
  return { value: fixed(value), error: fixed(error) };
}

/**
 * A formatter writing numbers to the decimal place at which `scale` (> 0) has `significant`
 * significant digits (at most 10 decimals, none below the units), with a true minus sign: one
 * precision for numbers read together, such as a value and its error or an interval's two ends.
 */
export function fixedAtPrecisionOf(scale: number, significant: number): (x: number) => string {
  return fixedToDecimals(decimalsAt(scale, significant));
}

/** A formatter writing numbers to a given decimal place, with a true minus sign. */
export function fixedToDecimals(decimals: number): (x: number) => string {
  return (x) => x.toFixed(decimals).replace(/^-/, '−');
}
