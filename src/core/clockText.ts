/**
 * Times and durations of a log as an engineer reads them: "1 Mar 2024 06:00:10", "3 h 20 min",
 * "60 s". Used by the import report, the Plant log step's statistics and the trend chart's time
 * axis, so the three say a time the same way.
 *
 * A timestamp column is read as seconds (src/data/timestampCell.ts): seconds since 1970 for
 * dates, or a plain count of seconds. Dates without a zone are the log's own wall clock on a
 * uniform scale, so they are written back in UTC arithmetic without a zone name.
 */

/** 1973-03-03 in seconds since 1970: a clock past this is taken for calendar time (a log of plain elapsed seconds rarely runs three years). A choice. */
export const CALENDAR_SECONDS = 1e8;

/** True when seconds on this clock are calendar dates rather than elapsed time. */
export function isCalendarClock(firstSeconds: number): boolean {
  return Number.isFinite(firstSeconds) && firstSeconds > CALENDAR_SECONDS;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const MONTHS_IN_FULL = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const two = (n: number): string => String(n).padStart(2, '0');

/**
 * An ISO 8601 time as people read it, to the minute in UTC: "2 Dec 2026, 10:41 UTC", or with the
 * month in full for a document ("2 December 2026, 10:41 UTC"); the text itself when it is not a time.
 */
export function isoTimeText(iso: string, month: 'short' | 'full' = 'short'): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const name = (month === 'full' ? MONTHS_IN_FULL : MONTHS)[d.getUTCMonth()];
  return `${d.getUTCDate()} ${name} ${d.getUTCFullYear()}, ${two(d.getUTCHours())}:${two(d.getUTCMinutes())} UTC`;
}

/** "1 Mar 2024 06:00:10" (seconds shown only when not zero; fractions of a second rounded). */
export function dateText(secondsSince1970: number): string {
  if (!Number.isFinite(secondsSince1970)) return '—';
  const d = new Date(Math.round(secondsSince1970) * 1000);
  const time = `${two(d.getUTCHours())}:${two(d.getUTCMinutes())}${d.getUTCSeconds() ? `:${two(d.getUTCSeconds())}` : ''}`;
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()} ${time}`;
}

/** "2024-03-01 06:00:10": a date and time as the importer reads it back (ISO 8601 with a space). */
export function dateEntryText(secondsSince1970: number): string {
  const d = new Date(Math.round(secondsSince1970) * 1000);
  return `${d.getUTCFullYear()}-${two(d.getUTCMonth() + 1)}-${two(d.getUTCDate())} ${two(d.getUTCHours())}:${two(d.getUTCMinutes())}:${two(d.getUTCSeconds())}`;
}

/**
 * A duration in the two largest units that matter: "45 s", "1.5 s", "12 min 30 s", "3 h 20 min",
 * "2 d 4 h". Below a minute it keeps up to three significant digits; above, whole units, the
 * smaller one truncated.
 */
export function durationText(seconds: number): string {
  if (!Number.isFinite(seconds)) return '—';
  const sign = seconds < 0 ? '−' : '', s = Math.abs(seconds);
  if (s < 60) return `${sign}${+s.toPrecision(3)} s`;
  const whole = Math.round(s);
  const units: [number, string][] = [[86400, 'd'], [3600, 'h'], [60, 'min'], [1, 's']];
  const i = units.findIndex(([size]) => whole >= size);
  const [big, bigName] = units[i], [small, smallName] = units[i + 1];
  const first = Math.floor(whole / big), rest = Math.floor((whole - first * big) / small); // truncated, never "1 h 60 min"
  return rest === 0 ? `${sign}${first} ${bigName}` : `${sign}${first} ${bigName} ${rest} ${smallName}`;
}

/** A time on the log's clock: a date for a calendar clock, else elapsed time ("3 h 20 min", "0 s"). */
export function clockText(seconds: number, calendar: boolean): string {
  return calendar ? dateText(seconds) : durationText(seconds);
}
