/**
 * The ticks of a log axis. The axis runs from the power of ten at or below the smallest value to the one at
 * or above the largest, so every decade the data reach is on it, and each decade gets a labelled tick. Where
 * fewer than LOG_TICK_RULE.fewDecades decade ticks stand on the axis, the ticks at 2 and 5 times each power of
 * ten are labelled as well, so the axis never reads from two numbers alone (common practice for log axes;
 * Cleveland, "The Elements of Graphing Data", 1985, on labelling log scales — from memory). Past
 * LOG_TICK_RULE.maxLabels decades every k-th decade is labelled, so labels never pack on a short axis.
 * Labels are one notation: "10⁻³", "2 × 10⁻³", "5 × 10⁻³".
 */
import { powerOfTen } from '../../core/exponentText';

export const LOG_TICK_RULE = { fewDecades: 3, between: [2, 5], maxLabels: 8 } as const;

export interface LogTick {
  readonly value: number;
  readonly label: string;
}

/** The axis's ends: whole powers of ten around the positive, finite values; null where there are none. */
export function logAxisRange(values: readonly number[]): { min: number; max: number } | null {
  const shown = values.filter((v) => Number.isFinite(v) && v > 0);
  if (shown.length === 0) return null;
  const low = Math.floor(Math.log10(Math.min(...shown)) + 1e-9), high = Math.ceil(Math.log10(Math.max(...shown)) - 1e-9);
  return { min: decade(low), max: decade(Math.max(high, low + 1)) };
}

/** The labelled ticks between two powers of ten (min < max, as logAxisRange gives them). */
export function logAxisTicks(min: number, max: number): LogTick[] {
  return logTickValues(min, max).map((value) => ({ value, label: logTickLabel(value) }));
}

/**
 * The values of LOG_TICK_RULE between any two positive ends (0 < min < max): each power of ten on the
 * axis (every k-th past maxLabels), and 2 and 5 × 10^k on it as well where fewer than fewDecades powers
 * of ten stand between the ends. Between whole-decade ends these are logAxisTicks' ticks; the retune
 * map's tuning axes (tuningAxis.ts) take them between their own ends.
 */
export function logTickValues(min: number, max: number): number[] {
  const low = Math.ceil(Math.log10(min) - 1e-9), high = Math.floor(Math.log10(max) + 1e-9), decades = Math.max(0, high - low + 1);
  const every = Math.max(1, Math.ceil(decades / LOG_TICK_RULE.maxLabels)), inside = (v: number) => v >= min * (1 - 1e-12) && v <= max * (1 + 1e-12);
  const values: number[] = [];
  for (let k = low - 1; k <= high; k++) {
    if (k >= low && (k - low) % every === 0) values.push(decade(k));
    if (decades < LOG_TICK_RULE.fewDecades) for (const m of LOG_TICK_RULE.between) if (inside(Number(`${m}e${k}`))) values.push(Number(`${m}e${k}`));
  }
  return values;
}

/** "10⁻³" for a power of ten, "2 × 10⁻³" for 2 and 5 times one. */
function logTickLabel(value: number): string {
  const k = Math.floor(Math.log10(value) + 1e-9), m = Math.round(value / Number(`1e${k}`));
  return m === 1 ? powerOfTen(k) : `${m} × ${powerOfTen(k)}`;
}

/** 10^k exactly as the decimal literal reads (10 ** −5 is 0.000009999999999999999 in floating point). */
function decade(k: number): number {
  return Number(`1e${k}`);
}
