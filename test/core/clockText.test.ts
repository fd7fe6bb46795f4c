/** Times and durations as written for a reader; the calendar values are checked against the JavaScript Date of the same instant (ECMA-262 time values, UTC). */
import { describe, expect, it } from 'vitest';
import { clockText, dateEntryText, dateText, durationText, isCalendarClock, isoTimeText } from '../../src/core/clockText';

describe('readable times', () => {
  it('durations in the two largest units that matter', () => {
    expect(durationText(60)).toBe('1 min');
    expect(durationText(59.5)).toBe('59.5 s');
    expect(durationText(12_000)).toBe('3 h 20 min');
    expect(durationText(7199)).toBe('1 h 59 min'); // truncated, never "1 h 60 min"
    expect(durationText(2 * 86400 + 4 * 3600 + 5)).toBe('2 d 4 h');
    expect(durationText(0.25)).toBe('0.25 s');
  });

  it('calendar times without milliseconds, seconds only when not zero', () => {
    const t = Date.UTC(2024, 2, 1, 6, 0, 10) / 1000;
    expect(dateText(t)).toBe('1 Mar 2024 06:00:10');
    expect(dateText(t - 10.4)).toBe('1 Mar 2024 06:00');
    expect(dateEntryText(t)).toBe('2024-03-01 06:00:10');
    expect(isCalendarClock(t)).toBe(true);
    expect(isCalendarClock(3600)).toBe(false);
    expect(clockText(3600, false)).toBe('1 h');
  });
});

describe('an ISO time for a reader', () => {
  it('writes the UTC minute with a short or full month name, and leaves a non-time as it is', () => {
    // The instant is built with JavaScript's own Date.UTC (the reference); seconds and milliseconds are dropped.
    const iso = new Date(Date.UTC(2026, 11, 2, 14, 41, 37, 512)).toISOString();
    expect(isoTimeText(iso)).toBe('2 Dec 2026, 14:41 UTC');
    expect(isoTimeText(iso, 'full')).toBe('2 December 2026, 14:41 UTC');
    expect(isoTimeText('not a time')).toBe('not a time');
  });
});
