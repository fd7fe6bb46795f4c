/** The min/max envelope, worked by hand on 10 rows in groups of 3. */
import { describe, expect, it } from 'vitest';
import { signalEnvelope } from '../../../src/core/trend/signalEnvelope';

describe('min/max envelope of a logged signal', () => {
  it('groups 10 rows into 4 groups (3, 3, 3, 1), keeping each group’s extremes and first time, skipping unreadable cells', () => {
    const values = Float64Array.from([1, 5, 3, 2, NaN, 8, -4, 0, 0, 7]);
    const time = Float64Array.from({ length: 10 }, (_, r) => 10 * r);
    const trend = signalEnvelope([{ name: 'level', role: 'state', unit: 'm', values }], time, 'seconds', false, 4);
    expect(trend.rowsPerGroup).toBe(3);
    expect(Array.from(trend.time)).toEqual([0, 30, 60, 90]);
    expect(trend.endTime).toBe(90);
    expect(Array.from(trend.signals[0].lo)).toEqual([1, 2, -4, 7]);
    expect(Array.from(trend.signals[0].hi)).toEqual([5, 8, 0, 7]);
  });

  it('a million rows become at most 1,600 groups and a single spike survives', () => {
    const n = 1_000_000, values = new Float64Array(n);
    values[654_321] = 99;
    const trend = signalEnvelope([{ name: 'v', role: 'action', unit: '', values }], Float64Array.from({ length: n }, (_, r) => r), 'seconds', false);
    expect(trend.time.length).toBeLessThanOrEqual(1600);
    expect(Math.max(...trend.signals[0].hi)).toBe(99);
  });
});
