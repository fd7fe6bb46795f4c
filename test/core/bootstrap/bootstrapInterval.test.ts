/**
 * Bootstrap intervals and sample quantiles against outside references: Hyndman & Fan (1996)
 * definition 7, the default of R's quantile() and NumPy's percentile(); the normal quantile
 * z_0.95 = 1.644854 (Abramowitz & Stegun, Table 26.5 — from memory).
 */
import { describe, expect, it } from 'vitest';
import { bootstrapInterval, sampleQuantile } from '../../../src/core/bootstrap/bootstrapInterval';
import { BootstrapError } from '../../../src/core/bootstrap/episodeMultiplicities';
import { createRandom } from '../../../src/core/random';

describe('sampleQuantile (Hyndman & Fan definition 7)', () => {
  it('matches R quantile(1:10, c(0.1, 0.5, 0.9)) = 1.9, 5.5, 9.1 (from memory; also by h = (n − 1)p)', () => {
    const x = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    expect(sampleQuantile(x, 0.1)).toBeCloseTo(1.9, 12);
    expect(sampleQuantile(x, 0.5)).toBeCloseTo(5.5, 12);
    expect(sampleQuantile(x, 0.9)).toBeCloseTo(9.1, 12);
  });

  it('matches NumPy percentile([1, 2, 3, 4, 7, 10], [25, 75]) = 2.25, 6.25 (from memory; by definition 7)', () => {
    const x = [1, 2, 3, 4, 7, 10];
    expect(sampleQuantile(x, 0.25)).toBeCloseTo(2.25, 12);
    expect(sampleQuantile(x, 0.75)).toBeCloseTo(6.25, 12);
    expect(sampleQuantile(x, 0)).toBe(1);
    expect(sampleQuantile(x, 1)).toBe(10);
  });
});

describe('bootstrapInterval', () => {
  it('gives μ ± z₀.₉₅σ for normal replicates (Monte Carlo, 4 standard errors of a quantile)', () => {
    const rng = createRandom(99), b = 40_000, mu = 3, sigma = 2;
    const reps = Float64Array.from({ length: b }, () => mu + sigma * rng.normal());
    const iv = bootstrapInterval(mu, reps, 0.9);
    // SE of the p-quantile: √(p(1 − p)/B)/f(q) with f the normal density at q (common practice).
    const density = Math.exp(-0.5 * 1.644854 ** 2) / Math.sqrt(2 * Math.PI) / sigma;
    const se = Math.sqrt(0.05 * 0.95 / b) / density;
    expect(Math.abs(iv.percentile[0] - (mu - 1.644854 * sigma))).toBeLessThan(4 * se);
    expect(Math.abs(iv.percentile[1] - (mu + 1.644854 * sigma))).toBeLessThan(4 * se);
    expect(Math.abs(iv.standardError - sigma)).toBeLessThan(4 * sigma / Math.sqrt(2 * b));
  });

  it('reflects the replicate quantiles about θ̂ for the basic interval (Davison & Hinkley 1997, eq. 5.6)', () => {
    const reps = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11];
    const iv = bootstrapInterval(4, reps, 0.8);
    const lo = sampleQuantile(reps, 0.1), hi = sampleQuantile(reps, 0.9);
    expect(iv.percentile[0]).toBeCloseTo(lo, 12);
    expect(iv.percentile[1]).toBeCloseTo(hi, 12);
    expect(iv.basic[0]).toBeCloseTo(8 - hi, 12);
    expect(iv.basic[1]).toBeCloseTo(8 - lo, 12);
    expect(iv.bias).toBeCloseTo(6 - 4, 12);
  });

  it('refuses a level outside (0, 1), too few replicates or non-finite ones', () => {
    expect(() => bootstrapInterval(0, [1, 2, 3], 1)).toThrow(/level/);
    expect(() => bootstrapInterval(0, [1], 0.9)).toThrow(BootstrapError);
    expect(() => bootstrapInterval(0, [1, NaN, 2], 0.9)).toThrow(/finite/);
  });
});
