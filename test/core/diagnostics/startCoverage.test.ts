/**
 * The start-coverage rule (src/core/diagnostics/startCoverage.ts) against the property it states:
 * a start drawn like the logged states scores above the largest of q exchangeable logged scores at
 * most 1 time in q + 1 (the conformal p-value; Vovk, Gammerman & Shafer, "Algorithmic learning in a
 * random world", 2005, ch. 2) on average over logs; on one log the rate is Beta(1, q)-distributed
 * (the share of a continuous law above the largest of q draws; David & Nagaraja, "Order
 * statistics", 2003, §2.2), whose 99.9 % quantile is 1 − 0.001^{1/q}. Logged states here are
 * independent standard normal draws in two dimensions (exchangeable with fresh draws), labelled
 * 200 runs of 50. Then: a start six standard deviations out is flagged and the logged mean is not;
 * a single run cannot be judged (no other run to score against), so nothing is flagged; and the
 * severity limits read as stated (more than 2 % of the starts outside a caution, more than 25 % serious).
 */
import { describe, expect, it } from 'vitest';
import { startCoverageFinding, START_OUTSIDE_LIMITS } from '../../../src/core/diagnostics/severity';
import { DEFAULT_START_COVERAGE, startCoverage } from '../../../src/core/diagnostics/startCoverage';
import { createRandom } from '../../../src/core/random';

function normalStates(count: number, seed: number, scale = [1, 1], centre = [0, 0]): Float64Array {
  const rng = createRandom(seed), out = new Float64Array(count * 2);
  for (let i = 0; i < count; i++) for (let c = 0; c < 2; c++) out[i * 2 + c] = centre[c] + scale[c] * rng.normal();
  return out;
}

function log(runs: number, length: number, seed: number, scale?: number[], centre?: number[]) {
  const count = runs * length;
  return { count, stateDim: 2, states: normalStates(count, seed, scale, centre), episode: Int32Array.from({ length: count }, (_, i) => Math.floor(i / length)) };
}

describe('start states outside the logs', () => {
  it('flags fresh draws like the logged states at about the rate the rule states (at most 1 in q + 1)', () => {
    const data = log(200, 50, 3), fresh = 4000, q = DEFAULT_START_COVERAGE.calibrationStates;
    const coverage = startCoverage(data, normalStates(fresh, 99));
    expect(coverage.starts).toBe(fresh);
    // On average at most fresh/(q + 1) ≈ 2; at the yardstick's 99.9 % quantile, 1 − 0.001^{1/q} ≈ 0.35 %,
    // 4000 draws flag about 14, and the binomial's own 99.9 % quantile at that rate is about 27.
    const worstRate = 1 - 0.001 ** (1 / q);
    expect(worstRate).toBeCloseTo(0.00345, 4);
    expect(coverage.outside).toBeLessThanOrEqual(27);
    expect(Number.isFinite(coverage.yardstick)).toBe(true);
  });

  it('flags a start six standard deviations out and not the logged mean, in the logged units', () => {
    const data = log(100, 50, 5, [0.02, 40], [7, 300]); // a pH-like and a flow-like state: the scaling matters
    const coverage = startCoverage(data, Float64Array.of(7, 300, 7 + 6 * 0.02, 300 + 6 * 40, 7, 300 + 6 * 40));
    expect(coverage.outside).toBe(2);
    expect(coverage.largestScore).toBeGreaterThan(coverage.yardstick);
  });

  it('cannot judge a log of one run, so flags nothing', () => {
    const coverage = startCoverage(log(1, 500, 7), Float64Array.of(50, 50));
    expect(coverage.yardstick).toBe(Infinity);
    expect(coverage.outside).toBe(0);
  });

  it('reads the severity limits as stated: up to 2 % outside nothing, more a caution, more than 25 % serious', () => {
    expect(START_OUTSIDE_LIMITS).toEqual({ caution: 0.02, serious: 0.25 });
    expect(startCoverageFinding(0, 200)).toBeNull();
    expect(startCoverageFinding(4, 200)).toBeNull();
    expect(startCoverageFinding(5, 200)?.severity).toBe('caution');
    expect(startCoverageFinding(50, 200)?.severity).toBe('caution');
    expect(startCoverageFinding(51, 200)?.severity).toBe('serious');
    expect(startCoverageFinding(1, 3)?.severity).toBe('serious');
    expect(startCoverageFinding(7, 200)?.message).toMatch(/^7 of the 200 start states/);
  });
});
