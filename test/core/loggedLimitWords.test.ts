/**
 * A logged actuator limit is named with how the log showed it (core/loggedActionLimits.ts: our rule —
 * at least max(2, 0.1 % of the rows) values at the extreme, or one value exactly at a bound a
 * candidate declares), in the app, the report and the command line alike. Invented log: ten valve
 * positions in %, three at 0 and one at 100, the candidates declaring 0 to 100.
 */
import { describe, expect, it } from 'vitest';
import { loggedActionLimits } from '../../src/core/loggedActionLimits';
import { loggedLimitText } from '../../src/core/loggedLimitWords';
import { limitsText } from '../../src/cli/formatEvaluation';

const valve = Float64Array.from([0, 0, 0, 12, 35, 50, 61, 77, 88, 100]);

describe('a logged limit with its evidence', () => {
  it('tells a repeated extreme from a value at a declared bound', () => {
    const limits = loggedActionLimits(valve, 10, 1, { lo: [[0]], hi: [[100]] });
    expect(limits.evidence).toEqual({ lo: ['repeated'], hi: ['declared'] });
    const text = loggedLimitText(limits.lo[0], limits.hi[0], { lo: limits.evidence.lo[0], hi: limits.evidence.hi[0] }, '%', String);
    expect(text).toBe('lower 0 % (repeated extreme), upper 100 % (at a declared bound)');
  });

  it('says none where the log shows none, and names the limit alone for results saved without the evidence', () => {
    const limits = loggedActionLimits(valve, 10, 1, { lo: [], hi: [] }); // nothing declared: the single 100 is no limit
    expect(loggedLimitText(limits.lo[0], Number.isFinite(limits.hi[0]) ? limits.hi[0] : null, { lo: limits.evidence.lo[0], hi: limits.evidence.hi[0] }, '%', String)).toBe('lower 0 % (repeated extreme)');
    expect(loggedLimitText(null, null, undefined, '', String)).toBe('none seen');
    expect(loggedLimitText(0, 100, undefined, '%', String)).toBe('lower 0 %, upper 100 %');
  });

  it('is on the command line’s baseline line, each action named when there are several', () => {
    const model: Parameters<typeof limitsText>[0] = {
      offset: [40, 10], gain: [[1], [2]], std: [3, 1], lo: [0, null], hi: [100, 20], actions: ['hot_valve', 'cold_valve'], units: ['%', 'm³/h'],
      limitEvidence: { lo: ['repeated', 'none'], hi: ['declared', 'repeated'] },
    };
    expect(limitsText(model))
      .toBe('actuator limits read from the log: lower 0 % (repeated extreme), upper 100 % (at a declared bound) on hot_valve; upper 20 m³/h (repeated extreme) on cold_valve');
  });
});
