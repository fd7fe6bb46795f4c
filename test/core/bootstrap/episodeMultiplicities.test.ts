/**
 * Episode resampling: the multiplicities of one resample are multinomial(e; 1/e, …, 1/e), so
 * E[c_k] = 1, Var[c_k] = 1 − 1/e and Cov(c_j, c_k) = −1/e (Johnson, Kotz & Balakrishnan,
 * "Discrete Multivariate Distributions", 1997, ch. 35 — from memory; they follow from the
 * binomial margins). Checked by Monte Carlo over fixed seeds with tolerances from standard errors.
 */
import { describe, expect, it } from 'vitest';
import { BootstrapError, episodeMultiplicities, resampleSeed } from '../../../src/core/bootstrap/episodeMultiplicities';
import { createRandom } from '../../../src/core/random';

describe('episodeMultiplicities', () => {
  it('draws e episodes per resample, the same resample for the same (seed, index) in any order', () => {
    const e = 37;
    const forward = Array.from({ length: 5 }, (_, b) => Array.from(episodeMultiplicities(e, 11, b)));
    const backward = [4, 3, 2, 1, 0].map((b) => Array.from(episodeMultiplicities(e, 11, b))).reverse();
    expect(forward).toEqual(backward);
    for (const c of forward) expect(c.reduce((a, b) => a + b, 0)).toBe(e);
    expect(forward[0]).not.toEqual(forward[1]);
    expect(Array.from(episodeMultiplicities(e, 12, 0))).not.toEqual(forward[0]);
  });

  it.each([1, 2, 37, 20_000])('counts the very draws createRandom(resampleSeed(seed, b)).integer(e) makes (e = %i)', (e) => {
    for (const [seed, b] of [[1, 0], [1, 999], [2024, 7], [0xffffffff, 3]]) {
      const rng = createRandom(resampleSeed(seed, b)), expected = new Uint32Array(e);
      for (let draw = 0; draw < e; draw++) expected[rng.integer(e)]++;
      expect(episodeMultiplicities(e, seed, b)).toEqual(expected);
    }
  });

  it('has the multinomial mean, variance and covariance (Monte Carlo, 4 standard errors)', () => {
    const e = 20, resamples = 20_000;
    let sum0 = 0, sumSq0 = 0, cross = 0;
    for (let b = 0; b < resamples; b++) {
      const c = episodeMultiplicities(e, 2024, b);
      sum0 += c[0];
      sumSq0 += c[0] * c[0];
      cross += (c[0] - 1) * (c[1] - 1);
    }
    const mean = sum0 / resamples, variance = sumSq0 / resamples - mean * mean, covariance = cross / resamples;
    const varTrue = 1 - 1 / e;
    // SE of the mean √(Var/B); of the variance ≈ √((μ4 − σ⁴)/B) with μ4 ≈ 3σ⁴ + σ² for a near-Poisson count (bounded above by 4σ⁴ here).
    expect(Math.abs(mean - 1)).toBeLessThan(4 * Math.sqrt(varTrue / resamples));
    expect(Math.abs(variance - varTrue)).toBeLessThan(4 * Math.sqrt((4 * varTrue ** 2) / resamples));
    expect(Math.abs(covariance + 1 / e)).toBeLessThan(4 * Math.sqrt((2 * varTrue ** 2) / resamples));
  });

  it('mixes seeds so neighbouring (seed, index) pairs do not collide', () => {
    const seen = new Set<number>();
    for (let seed = 0; seed < 50; seed++) for (let b = 0; b < 50; b++) seen.add(resampleSeed(seed, b));
    expect(seen.size).toBe(2500);
  });

  it('refuses a bad episode count or index with a message naming it', () => {
    expect(() => episodeMultiplicities(0, 1, 0)).toThrow(BootstrapError);
    expect(() => episodeMultiplicities(5, 1, -1)).toThrow(/resample index/);
  });
});
