/**
 * One column's minimum, maximum, mean and standard deviation in the import's statistics table, all
 * at one decimal place: the place that gives the larger of |min| and |max| four significant digits.
 * Four significant digits each, trailing zeros dropped, gave rows like "1.042 · 1.355 · 1.2 · 0.02734"
 * (a mean of 1.19996 read as less precise than its neighbours). A column whose values are all tiny
 * (below 1e-4) or huge keeps the plain style, where one place would hide them or run long.
 *
 * ```ts
 * statisticsText(1.042, 1.355, 1.19996, 0.027341); // ['1.042', '1.355', '1.200', '0.027']
 * ```
 */
import { atDecimals, LARGEST_FIXED, plainNumber, SMALLEST_FIXED } from '../../../../figures/parts/uncertainNumber';

const SIGNIFICANT = 4;
const MAX_DECIMALS = 8;

export function statisticsText(min: number, max: number, mean: number, std: number): string[] {
  const values = [min, max, mean, std];
  const largest = Math.max(Math.abs(min), Math.abs(max));
  if (!values.every(Number.isFinite) || !(largest >= SMALLEST_FIXED) || largest >= LARGEST_FIXED) return values.map((v) => plainNumber(v, SIGNIFICANT));
  const decimals = Math.min(MAX_DECIMALS, Math.max(0, SIGNIFICANT - 1 - Math.floor(Math.log10(largest))));
  return values.map((v) => atDecimals(v, decimals));
}
