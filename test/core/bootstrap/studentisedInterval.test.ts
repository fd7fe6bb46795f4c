/**
 * The studentised (bootstrap-t) interval and the delta-method standard error against outside
 * references: for the mean of a normal sample the bootstrap-t interval approaches Student's t
 * interval x̄ ± t_{0.95, n−1} s/√n (Davison & Hinkley 1997, §5.2.1 and Example 5.1; Efron &
 * Tibshirani 1993, §12.5), with t_{0.95, 29} = 1.699 (Abramowitz & Stegun, Table 26.10 — from
 * memory); the influence values of a mean are x_k − x̄ and v_L = (n − 1)s²/n² (D&H §2.7.2).
 */
import { describe, expect, it } from 'vitest';
import { BootstrapError, episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { influenceStandardError, studentisedInterval } from '../../../src/core/bootstrap/studentisedInterval';
import { createRandom } from '../../../src/core/random';

/** The bootstrap-t interval of a sample's mean, v* from each resample's own influence values. */
function meanInterval(x: Float64Array, resamples: number, seed: number, level: number) {
  const n = x.length, mean = x.reduce((s, v) => s + v, 0) / n, influence = x.map((v) => v - mean);
  const values: number[] = [], errors: number[] = [];
  for (let b = 0; b < resamples; b++) {
    const c = episodeMultiplicities(n, seed, b);
    let total = 0;
    for (let k = 0; k < n; k++) total += c[k] * x[k];
    values.push(total / n);
    errors.push(influenceStandardError(influence, c));
  }
  return studentisedInterval(mean, influenceStandardError(influence), values, errors, level);
}

describe('influenceStandardError (nonparametric delta method)', () => {
  it('is the plug-in standard error of a mean, √((n − 1)/n)·s/√n, and the same on a resample as on its expanded sample', () => {
    const x = [2, 4, 4, 5, 7, 9], n = x.length, mean = 31 / 6, l = x.map((v) => v - mean);
    const s2 = x.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1);
    expect(influenceStandardError(l)).toBeCloseTo(Math.sqrt(((n - 1) / n) * s2 / n), 14);
    // Drawn c = (2, 0, 1, 0, 3, 0): the sample 2, 2, 4, 7, 7, 7, whose mean's plug-in standard error it must be.
    const c = [2, 0, 1, 0, 3, 0], y = [2, 2, 4, 7, 7, 7], ym = 29 / 6;
    const plugIn = Math.sqrt(y.reduce((s, v) => s + (v - ym) ** 2, 0) / n) / Math.sqrt(n);
    expect(influenceStandardError(l, c)).toBeCloseTo(plugIn, 14);
  });

  it('refuses multiplicities of the wrong length or none drawn', () => {
    expect(() => influenceStandardError([1, -1], [1])).toThrow(BootstrapError);
    expect(() => influenceStandardError([1, -1], [0, 0])).toThrow(/no units/);
  });
});

describe('studentisedInterval (bootstrap-t)', () => {
  it('approaches Student’s t interval for the mean of normal samples (n = 30, 200 samples, B = 999)', () => {
    const rng = createRandom(7), n = 30, t = 1.699, ratios: number[] = [];
    let covered = 0;
    for (let r = 0; r < 200; r++) {
      const x = Float64Array.from({ length: n }, () => 10 + 3 * rng.normal());
      const mean = x.reduce((s, v) => s + v, 0) / n, s = Math.sqrt(x.reduce((q, v) => q + (v - mean) ** 2, 0) / (n - 1));
      const { interval, used } = meanInterval(x, 999, 1000 + r, 0.9);
      expect(used).toBe(999);
      ratios.push((interval[1] - interval[0]) / (2 * t * s / Math.sqrt(n)));
      if (interval[0] <= 10 && 10 <= interval[1]) covered++;
    }
    // Average width within 5 % of Student's; each sample's within 30 % (the bootstrap-t's own spread at n = 30, B = 999).
    const average = ratios.reduce((a, b) => a + b, 0) / ratios.length;
    expect(Math.abs(average - 1)).toBeLessThan(0.05);
    expect(Math.min(...ratios)).toBeGreaterThan(0.7);
    expect(Math.max(...ratios)).toBeLessThan(1.3);
    // Coverage of μ: 90 % ± 3 binomial standard errors of 200 samples (0.021).
    expect(Math.abs(covered / 200 - 0.9)).toBeLessThan(3 * 0.0212);
  });

  it('is θ̂ − v^{1/2}·[q(0.95), q(0.05)] of z* = (θ* − θ̂)/v*^{1/2} (D&H eq. 5.7), leaving out a replicate without a standard error', () => {
    // z* = −2, −1, 0, 1, 4 (and one with v* = 0, left out): q(0.05) = −1.8, q(0.95) = 3.4 by Hyndman & Fan definition 7.
    const { interval, used } = studentisedInterval(5, 0.5, [3, 4, 5, 5.5, 7, 9], [1, 1, 1, 0.5, 0, 1], 0.9);
    expect(used).toBe(5);
    expect(interval[0]).toBeCloseTo(5 - 0.5 * 3.4, 12);
    expect(interval[1]).toBeCloseTo(5 + 0.5 * 1.8, 12);
  });

  it('refuses a bad level, mismatched lengths and too few usable replicates', () => {
    expect(() => studentisedInterval(0, 1, [1, 2], [1, 1], 1)).toThrow(/level/);
    expect(() => studentisedInterval(0, 1, [1, 2], [1], 0.9)).toThrow(/one per replicate/);
    expect(() => studentisedInterval(0, 1, [1, 2], [0, Number.NaN], 0.9)).toThrow(/at least 2/);
  });
});
