/**
 * columnStatistics: mean and sample standard deviation of 1..n against their closed forms
 * ((n + 1)/2 and sqrt(n(n + 1)/12), common practice), the histogram's counts adding up to the
 * rows included, and the route for "every row included" giving the general route's numbers to the
 * last bit on random columns (the general route is taken when `include` is not one flag per value).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { columnStatistics } from '../../src/data/columnStatistics';

describe('columnStatistics', () => {
  it('1..n: mean (n + 1)/2, sample standard deviation sqrt(n(n + 1)/12), 30 bins adding up to n', () => {
    const n = 1001, values = Float64Array.from({ length: n }, (_, i) => i + 1);
    const s = columnStatistics(values, new Uint8Array(n).fill(1));
    expect(s.mean).toBe((n + 1) / 2);
    expect(s.std).toBeCloseTo(Math.sqrt((n * (n + 1)) / 12), 10);
    expect(s.histogram.counts.reduce((a, b) => a + b, 0)).toBe(n);
    expect([s.min, s.max, s.count]).toEqual([1, n, n]);
  });

  it('every row included: the same numbers as the general route, bit for bit', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }), { minLength: 1, maxLength: 300 }), (list) => {
        const values = Float64Array.from(list);
        const every = columnStatistics(values, new Uint8Array(values.length).fill(1));
        const general = columnStatistics(values, new Uint8Array(values.length + 1).fill(1));
        expect(every).toEqual(general);
        expect(Object.is(every.mean, general.mean) && Object.is(every.std, general.std)).toBe(true);
      }),
      { seed: 3, numRuns: 2000 },
    );
  });
});
