/**
 * A bound said in words ("never below −0.005264"), rounded outward: plainNumber's nearest rounding
 * would say "never below −0.005263" of a floor at −0.00526316, a statement a row can break. The
 * outward step is skipped where the nearest rounding moves the end inward by no more than
 * SNAP_SHARE of it, the outward widening a certain bound already carries (expressionBounds.ts
 * CERTAIN_BOUND_SLACK, 1e−12), so a floor of 4·(1 + 1e−12) still reads "4", not "4.001".
 */
import { plainNumber, TRUE_MINUS, type Minus } from './uncertainNumber';

/** An inward move of the nearest rounding up to this share of the value is taken as the value's own (ours; far above the 1e−12 widening, far below a 4-digit step). */
const SNAP_SHARE = 1e-9;

export function boundText(v: number, side: 'lower' | 'upper', digits = 4, minus: Minus = TRUE_MINUS): string {
  const nearest = plainNumber(v, digits, minus);
  if (!Number.isFinite(v) || v === 0) return nearest;
  const shown = Number(v.toPrecision(digits)), inward = side === 'lower' ? shown - v : v - shown;
  if (inward <= SNAP_SHARE * Math.abs(v)) return nearest;
  const step = 10 ** (Math.floor(Math.log10(Math.abs(v))) - (digits - 1));
  const outward = side === 'lower' ? Math.floor(v / step) * step : Math.ceil(v / step) * step;
  return plainNumber(outward, digits, minus);
}

/** The finite ends of [lo, hi] said outward as sides ("below −0.005264", "above 1"); empty where neither is finite. */
export function boundSides(lo: number, hi: number, digits = 4, minus: Minus = TRUE_MINUS): string[] {
  return [...(lo > -Infinity ? [`below ${boundText(lo, 'lower', digits, minus)}`] : []), ...(hi < Infinity ? [`above ${boundText(hi, 'upper', digits, minus)}`] : [])];
}
