/**
 * Kish's effective sample size (Σw)²/Σw² (Kish, "Survey Sampling", 1965, §11.7): n for equal
 * weights, 1 for a single non-zero weight, and for weights 1, 2, 3, 4 the value 100/30 (by the
 * formula, by hand); scale-free, so enormous log-weights give the same answer.
 */
import { describe, expect, it } from 'vitest';
import { effectiveSampleSizeFromLogs } from '../../../src/core/diagnostics/effectiveSampleSize';

const effectiveSampleSize = (weights: number[]) => effectiveSampleSizeFromLogs(weights.map(Math.log));

describe('effectiveSampleSize', () => {
  it('follows Kish’s formula', () => {
    expect(effectiveSampleSize([2, 2, 2, 2, 2])).toBeCloseTo(5, 12);
    expect(effectiveSampleSize([0, 0, 7, 0])).toBeCloseTo(1, 12);
    expect(effectiveSampleSize([1, 2, 3, 4])).toBeCloseTo(100 / 30, 12);
    expect(effectiveSampleSize([0, 0])).toBe(0);
  });

  it('works on log-weights far beyond the range of doubles', () => {
    expect(effectiveSampleSizeFromLogs([1000 + Math.log(1), 1000 + Math.log(2), 1000 + Math.log(3), 1000 + Math.log(4)])).toBeCloseTo(100 / 30, 10);
    expect(effectiveSampleSizeFromLogs([-2000, -2000, -Infinity])).toBeCloseTo(2, 12);
  });
});
