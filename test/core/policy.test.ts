import { describe, expect, it } from 'vitest';
import { createGaussianPolicy, logDensity, policyMean, PolicyError, sampleAction } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import { normalCdf } from '../../src/core/normalDistribution';

// 1/√(2π) = 0.3989422804014327 (the standard normal density at 0; common practice).
const LOG_PHI0 = Math.log(0.3989422804014327);

describe('Gaussian policy', () => {
  const policy = createGaussianPolicy({ offset: [1], gain: [[2, -1]], std: [0.5] }, 2);

  it('has the affine mean offset + G·s', () => {
    const out = new Float64Array(1);
    policyMean(policy, [3, 4], out);
    expect(out[0]).toBe(1 + 6 - 4);
  });

  it('log-density equals the normal density formula', () => {
    // At a = μ + σ·z: log φ(z) − log σ with φ(z) = φ(0)·exp(−z²/2).
    const z = 1.3;
    expect(logDensity(policy, [3, 4], [3 + 0.5 * z])).toBeCloseTo(LOG_PHI0 - z * z / 2 - Math.log(0.5), 12);
  });

  it('clipped bounds put mass Φ(α) at the lower limit', () => {
    const clipped = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1], bounds: { lo: [-1], hi: [2], mode: 'clip' } }, 1);
    expect(logDensity(clipped, [0], [-1])).toBeCloseTo(Math.log(normalCdf(-1)), 12);
    expect(logDensity(clipped, [0], [-1.5])).toBe(-Infinity);
  });

  it('full-covariance log-density matches the bivariate normal formula', () => {
    // Bivariate normal density with correlation ρ (any probability text, e.g. Papoulis, §6-3).
    const s1 = 2, s2 = 0.5, rho = 0.6;
    const p = createGaussianPolicy({ offset: [0, 0], gain: [[0], [0]], covariance: [[s1 * s1, rho * s1 * s2], [rho * s1 * s2, s2 * s2]] }, 1);
    const [x, y] = [0.7, -0.3];
    const q = (x * x) / (s1 * s1) - (2 * rho * x * y) / (s1 * s2) + (y * y) / (s2 * s2);
    const expected = -Math.log(2 * Math.PI * s1 * s2 * Math.sqrt(1 - rho * rho)) - q / (2 * (1 - rho * rho));
    expect(logDensity(p, [0], [x, y])).toBeCloseTo(expected, 12);
  });

  it('samples with the right mean and standard deviation (within 4 standard errors)', () => {
    const rng = createRandom(7);
    const n = 40_000, out = new Float64Array(1);
    let sum = 0, sumSq = 0;
    for (let i = 0; i < n; i++) {
      sampleAction(policy, [3, 4], rng, out);
      sum += out[0];
      sumSq += out[0] * out[0];
    }
    const mean = sum / n, variance = sumSq / n - mean * mean;
    expect(Math.abs(mean - 3)).toBeLessThan(4 * 0.5 / Math.sqrt(n));
    // SE of the sample variance ≈ σ²·√(2/n) for a normal (common practice).
    expect(Math.abs(variance - 0.25)).toBeLessThan(4 * 0.25 * Math.sqrt(2 / n));
  });

  it('rejects shapes that do not fit, naming the field', () => {
    expect(() => createGaussianPolicy({ offset: [0], gain: [[1]], std: [1] }, 2)).toThrow(/gain row 1: expected 2 entries/);
    expect(() => createGaussianPolicy({ offset: [0], gain: [[1]], std: [0] }, 1)).toThrow(PolicyError);
  });
});
