/**
 * Reading a timestamp cell as seconds. Accepted forms:
 *   plain numbers (seconds, the file's decimal mark), ISO 8601 `yyyy-mm-ddThh:mm[:ss[.fff]]`
 *   with "T" or a space and an optional zone (Z, ±hh:mm, ±hhmm), `yyyy-mm-dd`,
 *   and the local forms `dd.mm.yyyy hh:mm[:ss]` and `dd/mm/yyyy hh:mm[:ss]`.
 * Times without a zone are read as wall-clock times on one uniform clock (no daylight-saving
 * shifts), which is what differences between samples need.
 *
 * The local forms may be day-first or month-first; a cell is read both ways here and the file
 * as a whole decides (see dateOrder.ts).
 */
import { readNumber, type DecimalMark } from './numericCell';

/** Seconds since 1970-01-01 under each day/month reading; NaN where that reading is not a date. */
export interface TimestampReading {
  dayFirst: number;
  monthFirst: number;
}

const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const LOCAL = /^(\d{1,2})([./])(\d{1,2})\2(\d{4})(?:[ T](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?)?$/;

/** Both readings of a cell, or undefined when it is no timestamp in any accepted form. */
export function readTimestamp(text: string, decimalMark: DecimalMark): TimestampReading | undefined {
  const cell = text.trim();
  const plain = readNumber(cell, decimalMark);
  if (plain.ok) return { dayFirst: plain.value, monthFirst: plain.value };
  const iso = ISO.exec(cell);
  if (iso) {
    const [, y, mo, d, h, mi, s, frac, zone] = iso;
    const seconds = civilSeconds(+y, +mo, +d, h, mi, s, frac) - zoneOffsetSeconds(zone);
    return { dayFirst: seconds, monthFirst: seconds };
  }
  const local = LOCAL.exec(cell);
  if (local) {
    const [, a, , b, y, h, mi, s, frac] = local;
    return { dayFirst: civilSeconds(+y, +b, +a, h, mi, s, frac), monthFirst: civilSeconds(+y, +a, +b, h, mi, s, frac) };
  }
  return undefined;
}

export const TIMESTAMP_FORMS = 'seconds, 2024-03-01T12:00:00 (ISO 8601, optional zone), 01.03.2024 12:00:00 or 01/03/2024 12:00';

/** Seconds of a calendar date and time, or NaN when a field is out of range (e.g. month 13). */
function civilSeconds(year: number, month: number, day: number, h?: string, mi?: string, s?: string, frac?: string): number {
  const hours = h === undefined ? 0 : +h, minutes = mi === undefined ? 0 : +mi, seconds = s === undefined ? 0 : +s;
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return NaN;
  if (hours > 23 || minutes > 59 || seconds > 60) return NaN;
  const fraction = frac === undefined ? 0 : Number(`0.${frac}`);
  return Date.UTC(year, month - 1, day, hours, minutes, seconds) / 1000 + fraction;
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** Seconds east of UTC; NaN for an offset outside hours 00–23, minutes 00–59 (RFC 3339 §5.6, time-numoffset). */
function zoneOffsetSeconds(zone: string | undefined): number {
  if (zone === undefined || zone.toUpperCase() === 'Z') return 0;
  const digits = zone.replace(':', '');
  const sign = digits[0] === '-' ? -1 : 1;
  const hours = Number(digits.slice(1, 3)), minutes = Number(digits.slice(3, 5));
  if (hours > 23 || minutes > 59) return NaN;
  return sign * (hours * 3600 + minutes * 60);
}
