/**
 * Importance ratios with point masses at clip limits, against outside references: the normal
 * distribution function Φ(−1) = 0.158655 (Abramowitz & Stegun, Table 26.1 — from memory), and
 * the mean of a censored (clipped) normal, E[clip(X, L, U)] = L·Φ(α) + U·(1 − Φ(β)) +
 * μ(Φ(β) − Φ(α)) + σ(φ(α) − φ(β)) with α = (L − μ)/σ, β = (U − μ)/σ (Greene, "Econometric
 * Analysis", 7th ed., §19.3.2, the censored normal). The last checks E_b[ρ·a] = E_π[a] by Monte
 * Carlo under the behaviour (fixed seed, 4 standard errors), which holds only if the point masses
 * are weighted correctly.
 */
import { describe, expect, it } from 'vitest';
import { ImportanceRatioError, logImportanceRatio } from '../../../src/core/offPolicy/importanceRatio';
import { createGaussianPolicy, sampleAction } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';

const phi = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
const clip = (lo: number, hi: number) => ({ lo: [lo], hi: [hi], mode: 'clip' as const });

describe('logImportanceRatio', () => {
  it('is the ratio of the Gaussian densities for unlimited policies', () => {
    const target = createGaussianPolicy({ offset: [1], gain: [[0.5]], std: [2] }, 1);
    const behaviour = createGaussianPolicy({ offset: [0], gain: [[1]], std: [3] }, 1);
    const s = Float64Array.of(2), a = Float64Array.of(1.5);
    const expected = (phi((1.5 - 2) / 2) / 2) / (phi((1.5 - 2) / 3) / 3);
    expect(Math.exp(logImportanceRatio(target, behaviour, s, a))).toBeCloseTo(expected, 12);
  });

  it('is the ratio of the point masses for an action at a shared clip limit', () => {
    // Both at the lower limit 0: target mean 1, σ 1 → mass Φ(−1) = 0.158655; behaviour mean 0, σ 2 → Φ(0) = 0.5.
    const target = createGaussianPolicy({ offset: [1], gain: [[0]], std: [1], bounds: clip(0, 10) }, 1);
    const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [2], bounds: clip(0, 10) }, 1);
    expect(Math.exp(logImportanceRatio(target, behaviour, Float64Array.of(0), Float64Array.of(0)))).toBeCloseTo(0.158655 / 0.5, 5);
  });

  it('is 0 where only the behaviour has a point mass, and refuses a point mass only the candidate has', () => {
    const limited = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1], bounds: clip(0, 10) }, 1);
    const free = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);
    expect(logImportanceRatio(free, limited, Float64Array.of(0), Float64Array.of(0))).toBe(-Infinity);
    expect(() => logImportanceRatio(limited, free, Float64Array.of(0), Float64Array.of(0))).toThrow(ImportanceRatioError);
  });

  it('reweights clipped behaviour actions to the clipped candidate’s mean (Monte Carlo against the censored-normal mean)', () => {
    const lo = 0, hi = 10;
    const target = createGaussianPolicy({ offset: [8], gain: [[0]], std: [3], bounds: clip(lo, hi) }, 1);
    const behaviour = createGaussianPolicy({ offset: [5], gain: [[0]], std: [4], bounds: clip(lo, hi) }, 1);
    const rng = createRandom(314), n = 200_000, s = Float64Array.of(0), a = new Float64Array(1);
    let sum = 0, sumSq = 0;
    for (let i = 0; i < n; i++) {
      sampleAction(behaviour, s, rng, a);
      const v = Math.exp(logImportanceRatio(target, behaviour, s, a)) * a[0];
      sum += v;
      sumSq += v * v;
    }
    const mean = sum / n, se = Math.sqrt((sumSq / n - mean * mean) / n);
    const mu = 8, sigma = 3, alpha = (lo - mu) / sigma, beta = (hi - mu) / sigma;
    const cdf = (z: number) => 0.5 * (1 + erf(z / Math.SQRT2));
    const exact = lo * cdf(alpha) + hi * (1 - cdf(beta)) + mu * (cdf(beta) - cdf(alpha)) + sigma * (phi(alpha) - phi(beta));
    expect(Math.abs(mean - exact)).toBeLessThan(4 * se);
  });
});

/** erf by Abramowitz & Stegun 7.1.26 (|error| ≤ 1.5e-7), independent of the project's Cody erfc. */
function erf(x: number): number {
  const t = 1 / (1 + 0.3275911 * Math.abs(x));
  const y = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
  return x >= 0 ? y : -y;
}
