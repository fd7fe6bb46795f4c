/**
 * An occupancy shift as the engineer reads it, written once for every host: the coverage sentence,
 * the warnings, the report's diagnostics and retune-map cells, the retune map's notes and the command
 * line. Three significant digits in fixed notation, trailing zeros kept, so shifts read side by side
 * compare digit for digit and one shift reads alike everywhere: the present controller's "4.40" in
 * the coverage sentence beside a candidate's "4.89", as the retune map's note writes it (before: "4.4"
 * there and "4.40" here); "17.6", "44.0", "3790" (never "3.79e+3").
 *
 * ```ts
 * shiftText(4.4); // "4.40"
 * shiftText(3787.4); // "3790"
 * ```
 */

/** Significant digits of an occupancy shift. */
export const SHIFT_DIGITS = 3;

/** "4.40" from 4.4, "17.6", "3790" from 3787.4; a dash for null or not a number. */
export function shiftText(shift: number | null | undefined): string {
  if (shift === null || shift === undefined || !Number.isFinite(shift)) return '—';
  const rounded = Number(shift.toPrecision(SHIFT_DIGITS));
  if (rounded === 0) return '0';
  const decimals = Math.max(0, SHIFT_DIGITS - 1 - Math.floor(Math.log10(Math.abs(rounded))));
  return rounded.toFixed(decimals);
}
