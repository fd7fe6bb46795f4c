/**
 * Numbers as people read them on screen: a few significant digits, no trailing zeros, exponent
 * notation only for very large or very small magnitudes, and a true minus sign.
 */
import { plainNumber } from '../../../figures/parts/uncertainNumber';
import { isoTimeText } from '../../../core/clockText';
import { EDITABLE_DIGITS } from '../../../core/limits';
import { NO_BREAK_SPACE, powerOfTen, TRUE_MINUS } from '../../../core/exponentText';

/** The one plain number style (figures/parts/uncertainNumber.ts): fixed notation up to 1e15, exponent form beyond and below 1e-4. */
export function formatNumber(x: number, significant = 4): string {
  return plainNumber(x, significant);
}

/**
 * A value as an editable field shows it: the shortest text of the value at EDITABLE_DIGITS significant
 * digits (src/core/limits.ts), so floating-point noise from a script ("0.30000000000000004") reads
 * "0.3". Any value of 15 significant digits or fewer reads back exactly; the stored value is never
 * rewritten by showing it (NumberField commits only what the user types).
 */
export function editableNumber(x: number | null): string {
  if (x === null || Number.isNaN(x)) return '';
  if (Number.isFinite(x)) x = Number(x.toPrecision(EDITABLE_DIGITS));
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

/**
 * A message from the pipeline (written for the terminal too) as the screen typesets it: "9.92e-11" as
 * "9.92 × 10⁻¹¹" (a leading minus as the app writes it, U+2212), the app's one exponent form (core/exponentText.ts), whose no-break spaces keep it on one
 * line. The terminal's form was shown as it was, and Chromium broke "1.00e-" | "10)" across two lines (Run step).
 */
export function screenMessage(text: string): string {
  return text.replace(/(^|[^\w.])(-?)(\d+(?:\.\d+)?)e([+-]?\d+)\b/g, (_, before: string, sign: string, mantissa: string, exponent: string) =>
    `${before}${sign ? TRUE_MINUS : ''}${mantissa}${NO_BREAK_SPACE}×${NO_BREAK_SPACE}${powerOfTen(Number(exponent))}`);
}

/** Text as a sentence: first letter capital, and a full stop at the end. */
export function sentence(text: string): string {
  const t = text.trim();
  if (!t) return t;
  const capital = t[0].toUpperCase() + t.slice(1);
  return /[.!?…]$/.test(capital) ? capital : `${capital}.`;
}
