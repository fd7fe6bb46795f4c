/**
 * A share as a percentage, written once for every host: the coverage findings, the app's sentences
 * and tables, the report and the command line all call shareText, so one share never reads "6.3 %" in the report and
 * "6.29 %" on screen. SHARE_DIGITS significant digits, trailing zeros dropped ("73 %", "6.29 %",
 * "0.42 %"), and no finer than SMALLEST_SHARE_SHOWN (src/core/limits.ts): a smaller share is "below
 * 0.01 %". A share of exactly 0 or 1 reads "0 %" or "100 %", and only such a share: one below 1
 * whose SHARE_DIGITS would round it to "100 %" (1999 of 2000 resamples, 0.9995) takes the decimals
 * that keep it below ("99.95 %"), and one closer to 1 than SMALLEST_SHARE_SHOWN is "above 99.99 %",
 * as a share that close to 0 is "below 0.01 %": "better in 100 % of resamples" says none went the
 * other way.
 *
 * Shares set side by side (one sentence, one table row: a candidate's share beside the present
 * controller's, a mean beside its percentile and its largest; one table column: how often each
 * candidate came out better, read down the app's, the report's and the CLI's comparison tables) are
 * compared digit by digit, so they share one precision (sharesText): the most decimals any of them
 * takes alone, never finer than SMALLEST_SHARE_SHOWN's place — "6.29 %" beside "6.20 %", never
 * beside "6.2 %". Exactly 0 or 1 and "below 0.01 %" stay as they read alone: they are exact, or a
 * bound, not a rounded number.
 *
 * The number and its "%" are held together by a no-break space (U+00A0; SI Brochure §5.4.7 puts a
 * space before % — common practice), so a line in the app or the report never ends at "2.8" with the
 * "%" on the next. The command line writes it as a plain space (cli/terminal.ts, terminalText): a
 * terminal wraps at the column whatever the space, and its text is searched and pasted as typed. Both
 * are one character, so the terminal's columns, which count characters, line up either way.
 */
import { NO_BREAK_SPACE } from './exponentText';
import { SMALLEST_SHARE_SHOWN } from './limits';

/** Between a share's number and its "%": the no-break space. */
const BEFORE_PERCENT = `${NO_BREAK_SPACE}%`;

/** Significant digits of a share written as a percentage. */
export const SHARE_DIGITS = 3;

/** Decimals of SMALLEST_SHARE_SHOWN as a percentage (2 for 0.01 %): the finest place a share is written at. */
const FINEST_DECIMALS = decimalsOf(digits(SMALLEST_SHARE_SHOWN * 100));

/** "73 %" from 0.73, "6.29 %" from 0.06291, "below 0.01 %" from 5.7e−8; a dash for null or not a number. */
export function shareText(share: number | null | undefined): string {
  if (share === null || share === undefined || !Number.isFinite(share)) return '—';
  if (share > 0 && share < SMALLEST_SHARE_SHOWN) return `below ${digits(SMALLEST_SHARE_SHOWN * 100)}${BEFORE_PERCENT}`;
  if (share < 1 && digits(share * 100) === '100') return `${belowWhole(share)}${BEFORE_PERCENT}`;
  return `${digits(share * 100)}${BEFORE_PERCENT}`;
}

/** A share below 1 that three digits would write "100": the fewest decimals, up to SMALLEST_SHARE_SHOWN's place, that keep it below; "above 99.99" past that. */
function belowWhole(share: number): string {
  for (let d = 1; d <= FINEST_DECIMALS; d++) {
    const text = (share * 100).toFixed(d);
    if (Number(text) < 100) return text;
  }
  return `above ${(100 - SMALLEST_SHARE_SHOWN * 100).toFixed(FINEST_DECIMALS)}`;
}

/**
 * Shares read side by side, at one count of decimals: [0.0629, 0.062] → ["6.29 %", "6.20 %"];
 * [0.269, 0.028] → ["26.9 %", "2.8 %"]; [0.9995, 0.503] → ["99.95 %", "50.30 %"]. Each entry as shareText
 * writes it where it is not a rounded number (a dash, "0 %", "100 %", "below 0.01 %", "above 99.99 %").
 */
export function sharesText(shares: readonly (number | null | undefined)[]): string[] {
  // A bound ("below 0.01 %", "above 99.99 %") is not a rounded number either.
  const rounded = (s: number | null | undefined): s is number => s !== null && s !== undefined && Number.isFinite(s) && s !== 0 && s !== 1 && !/^(below|above) /.test(shareText(s));
  // Each share's decimals as shareText writes it alone (so "99.95 %" keeps two): at as many or more, none reads "100".
  const decimals = Math.min(FINEST_DECIMALS, Math.max(0, ...shares.filter(rounded).map((s) => decimalsOf(shareText(s).slice(0, -BEFORE_PERCENT.length)))));
  return shares.map((s) => (rounded(s) ? `${(s * 100).toFixed(decimals)}${BEFORE_PERCENT}` : shareText(s)));
}

/**
 * Work done as a percentage, for a progress line ("reading the data 42 %"): whole percents, rounded
 * down, so it reads "100 %" only when the work is done; the same no-break space before "%".
 */
export function progressText(fraction: number): string {
  return `${Number.isFinite(fraction) ? Math.max(0, Math.min(100, Math.floor(100 * fraction))) : 0}${BEFORE_PERCENT}`;
}

/** SHARE_DIGITS significant digits, trailing zeros dropped; fixed notation, which a percentage from 0.01 up always allows (the plain style of figures/parts/uncertainNumber.ts there). */
function digits(percent: number): string {
  return String(Number(percent.toPrecision(SHARE_DIGITS)));
}

function decimalsOf(text: string): number {
  const point = text.indexOf('.');
  return point < 0 ? 0 : text.length - point - 1;
}
