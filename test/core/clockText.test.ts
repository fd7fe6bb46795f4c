/** Times and durations as written for a reader; the calendar values are checked against the JavaScript Date of the same instant (ECMA-262 time values, UTC). */
import { describe, expect, it } from 'vitest';
import { clockText, dateEntryText, dateText, durationText, isCalendarClock } from '../../src/core/clockText';

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
