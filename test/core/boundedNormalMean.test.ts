/**
 * The mean action behind an actuator limit, checked against closed forms found outside the
 * project and a seeded Monte Carlo run with a tolerance from its standard error.
 */
import { describe, expect, it } from 'vitest';
import { boundedNormalMean, clippedNormalMean, truncatedNormalMean } from '../../src/core/boundedNormalMean';
import { createRandom } from '../../src/core/random';

describe('mean of a normal behind a limit', () => {
  it('truncated at 0 from below: the half-normal mean σ·√(2/π) (Johnson, Kotz & Balakrishnan 1994, §10.1 / the half-normal distribution)', () => {
    expect(truncatedNormalMean(0, 1, 0, Infinity)).toBeCloseTo(Math.sqrt(2 / Math.PI), 14);
    expect(truncatedNormalMean(5, 2, 5, Infinity)).toBeCloseTo(5 + 2 * Math.sqrt(2 / Math.PI), 13);
  });

  it('clipped at 0 from below: E[max(0, Z)] = φ(0) = 1/√(2π) (the Tobit mean, Greene §19.3)', () => {
    expect(clippedNormalMean(0, 1, 0, Infinity)).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 14);
  });

  it('no limits: the mean itself; symmetric limits around the mean: the mean', () => {
    expect(clippedNormalMean(3.2, 0.7, -Infinity, Infinity)).toBeCloseTo(3.2, 14);
    expect(truncatedNormalMean(3.2, 0.7, -Infinity, Infinity)).toBeCloseTo(3.2, 14);
    expect(clippedNormalMean(50, 20, 0, 100)).toBeCloseTo(50, 12);
    expect(truncatedNormalMean(50, 20, 0, 100)).toBeCloseTo(50, 12);
  });

  it('agrees with 200 000 seeded draws within 4 standard errors, both ways, limits 0–100 %', () => {
    const random = createRandom(11), mean = 92, std = 15, lo = 0, hi = 100, n = 200_000;
    let clipSum = 0, clipSq = 0, truncSum = 0, truncSq = 0, kept = 0;
    for (let i = 0; i < n; i++) {
      const a = mean + std * random.normal(), c = Math.min(hi, Math.max(lo, a));
      clipSum += c;
      clipSq += c * c;
      if (a >= lo && a <= hi) {
        truncSum += a;
        truncSq += a * a;
        kept++;
      }
    }
    const clipMean = clipSum / n, clipSe = Math.sqrt((clipSq / n - clipMean ** 2) / n);
    const truncMean = truncSum / kept, truncSe = Math.sqrt((truncSq / kept - truncMean ** 2) / kept);
    expect(Math.abs(boundedNormalMean(mean, std, lo, hi, 'clip') - clipMean)).toBeLessThan(4 * clipSe);
    expect(Math.abs(boundedNormalMean(mean, std, lo, hi, 'truncate') - truncMean)).toBeLessThan(4 * truncSe);
  });

  it('stays inside the limits however far the mean lies beyond them (the 150 % line of the candidate chart)', () => {
    for (const mode of ['clip', 'truncate'] as const) {
      for (const mean of [-1e6, -200, -40, 150, 400, 1e9]) {
        const m = boundedNormalMean(mean, 5, 0, 100, mode);
        expect(m).toBeGreaterThanOrEqual(0);
        expect(m).toBeLessThanOrEqual(100);
      }
    }
    // Far beyond a limit the truncated mean approaches it by σ/|α| (Mills' ratio, A&S 26.2.12).
    expect(truncatedNormalMean(-200, 5, 0, 100)).toBeCloseTo(5 / 40, 3);
    expect(clippedNormalMean(150, 5, 0, 100)).toBe(100);
  });
});
