/**
 * The import's trend on a clock that starts again in each run: the runs are drawn over one another,
 * so the envelope keeps RUN_TIME_GROUP_FACTOR times more groups. Group sizes worked by hand:
 * ceil(rows / groups).
 */
import { describe, expect, it } from 'vitest';
import { TREND_BUCKETS } from '../../src/core/trend/signalEnvelope';
import { RUN_TIME_GROUP_FACTOR, trendOfImport } from '../../src/data/trendSeries';
import type { ColumnRoles } from '../../src/project/schema';

const COLUMNS: ColumnRoles = {
  states: [{ column: 'x', unit: '' }], actions: [{ column: 'u', unit: '' }], reward: { kind: 'column', column: 'c', sense: 'cost', unit: '' },
  nextState: { kind: 'nextRow' }, episode: { kind: 'column', column: 'run' },
};

describe('the trend of a log on run time', () => {
  it('40 runs of 500 rows: groups of 13 on one timeline (ceil(20,000 / 1,600)), of 2 on run time (ceil(20,000 / 12,800))', () => {
    const n = 20_000, seconds = Float64Array.from({ length: n }, (_, r) => 60 * (r % 500));
    const numbers = new Map([['x', new Float64Array(n)], ['u', new Float64Array(n)]]);
    const trend = (restarts: number) => trendOfImport(COLUMNS, numbers, new Float64Array(n), seconds, n, (r) => r + 2, restarts);
    expect([TREND_BUCKETS, RUN_TIME_GROUP_FACTOR]).toEqual([1600, 8]);
    expect(trend(0).rowsPerGroup).toBe(13);
    expect(trend(39).rowsPerGroup).toBe(2);
    expect(trend(1).rowsPerGroup).toBe(7); // two runs: 2 × 1,600 groups → ceil(20,000 / 3,200)
  });
});
