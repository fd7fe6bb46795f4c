/**
 * Importance ratios and action support with two actions, each clipped at its own limits (the
 * blending tank hold-out's hot and cold valves), against outside references: with independent
 * action noise the candidate's and the behaviour's laws are products over the actions, so the
 * Radon–Nikodym derivative is the product of the per-action ones (Billingsley, "Probability and
 * Measure", 3rd ed., §18 and §32) — a mass ratio where a valve sits at its limit, a density ratio
 * where it does not; Φ(−1) = 0.158655 and Φ(0) = ½ (Abramowitz & Stegun Table 26.1, from memory);
 * and E_b[ρ·f(a)] = E_π[f(a)] by Monte Carlo (fixed seed, 4 standard errors) for f = a_hot·a_cold,
 * whose mean under π is the product of the clipped normals' means (independence; the censored
 * normal's mean, Greene, "Econometric Analysis", 7th ed., §19.3.2).
 */
import { describe, expect, it } from 'vitest';
import { probabilityOutsideLoggedActions } from '../../../src/core/diagnostics/actionSupport';
import { logImportanceRatio } from '../../../src/core/offPolicy/importanceRatio';
import { createGaussianPolicy, sampleAction } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';

const phi = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
const valves = { lo: [0, 0], hi: [1, 1], mode: 'clip' as const };
/** Hot valve mean 0.1 (σ 0.1: shut with probability Φ(−1)), cold valve 0.9. */
const candidate = createGaussianPolicy({ offset: [0.1, 0.9], gain: [[0], [0]], std: [0.1, 0.1], bounds: valves }, 1);
/** The behaviour as fitted from such a log: hot limited below only, cold above only, means at the limits. */
const behaviour = createGaussianPolicy({ offset: [0, 1], gain: [[0], [0]], std: [0.2, 0.2], bounds: { lo: [0, -Infinity], hi: [Infinity, 1], mode: 'clip' } }, 1);
const s = Float64Array.of(0);

describe('two clipped actions', () => {
  it('take the mass ratio on the valve at its limit and the density ratio on the other, multiplied', () => {
    // Hot shut (masses Φ(−1) and Φ(0)), cold at 0.85 (densities φ(−0.5)/0.1 and φ(−0.75)/0.2).
    const expected = (0.158655 / 0.5) * ((phi(-0.5) / 0.1) / (phi(-0.75) / 0.2));
    expect(Math.exp(logImportanceRatio(candidate, behaviour, s, Float64Array.of(0, 0.85)))).toBeCloseTo(expected, 5);
    // Both at their limits: hot shut, cold fully open (masses Φ(−1)/Φ(0) each).
    expect(Math.exp(logImportanceRatio(candidate, behaviour, s, Float64Array.of(0, 1)))).toBeCloseTo((0.158655 / 0.5) ** 2, 5);
  });

  it('reweight the behaviour’s actions to the candidate’s mean of a_hot·a_cold (Monte Carlo)', () => {
    const rng = createRandom(21), n = 200_000, a = new Float64Array(2);
    let sum = 0, squares = 0;
    for (let i = 0; i < n; i++) {
      sampleAction(behaviour, s, rng, a);
      const v = Math.exp(logImportanceRatio(candidate, behaviour, s, a)) * a[0] * a[1];
      sum += v;
      squares += v * v;
    }
    const mean = sum / n, se = Math.sqrt((squares / n - mean * mean) / n);
    const cdf = (z: number) => 0.5 * (1 + erfApprox(z / Math.SQRT2));
    const censoredMean = (mu: number, sigma: number) => {
      const alpha = -mu / sigma, beta = (1 - mu) / sigma;
      return 1 - cdf(beta) + mu * (cdf(beta) - cdf(alpha)) + sigma * (phi(alpha) - phi(beta));
    };
    expect(Math.abs(mean - censoredMean(0.1, 0.1) * censoredMean(0.9, 0.1))).toBeLessThan(4 * se);
  });

  it('put outside the logged actions 1 − the product of each valve’s inside probability', () => {
    // Logged near the state: hot in [0, 0.2], cold in [0.8, 1]. Inside: hot Φ(1) (its mass at 0 included), cold 1 − Φ(−1) = Φ(1).
    const ranges = { queries: Float64Array.of(0), lo: Float64Array.of(0, 0.8), hi: Float64Array.of(0.2, 1), neighbours: 1, referenceCount: 1 };
    expect(probabilityOutsideLoggedActions(candidate, ranges)[0]).toBeCloseTo(1 - (1 - 0.158655) ** 2, 5);
  });
});

/** erf by Abramowitz & Stegun 7.1.26 (|error| < 1.5e-7). */
function erfApprox(x: number): number {
  const t = 1 / (1 + 0.3275911 * Math.abs(x));
  const y = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
  return x >= 0 ? y : -y;
}
