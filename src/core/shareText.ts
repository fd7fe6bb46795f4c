/**
 * A share as a percentage, written once for every host: the coverage findings, the app's sentences
 * and tables, the report and the command line all call shareText, so one share never reads "6.3 %" in the report and
 * "6.29 %" on screen. SHARE_DIGITS significant digits, trailing zeros dropped ("73 %", "6.29 %",
 * "0.42 %"), and no finer than SMALLEST_SHARE_SHOWN (src/core/limits.ts): a smaller share is "below
 * 0.01 %". A share of exactly 0 or 1 reads "0 %" or "100 %".
 */
import { SMALLEST_SHARE_SHOWN } from './limits';

/** Significant digits of a share written as a percentage. */
export const SHARE_DIGITS = 3;

/** "73 %" from 0.73, "6.29 %" from 0.06291, "below 0.01 %" from 5.7e−8; a dash for null or not a number. */
export function shareText(share: number | null | undefined): string {
  if (share === null || share === undefined || !Number.isFinite(share)) return '—';
  if (share > 0 && share < SMALLEST_SHARE_SHOWN) return `below ${digits(SMALLEST_SHARE_SHOWN * 100)} %`;
  return `${digits(share * 100)} %`;
}

/** SHARE_DIGITS significant digits, trailing zeros dropped; fixed notation, which a percentage from 0.01 up always allows (the plain style of figures/parts/uncertainNumber.ts there). */
function digits(percent: number): string {
  return String(Number(percent.toPrecision(SHARE_DIGITS)));
}
