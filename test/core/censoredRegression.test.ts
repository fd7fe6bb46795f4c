/**
 * Censored normal regression (Tobit; Tobin 1958) and the behaviour model that uses it for a clipped
 * actuator. Outside references: the known parameters of the simulated law (Monte Carlo, tolerances
 * from the reported standard errors), the spread of the estimates over independent repetitions
 * (which the delta-method standard errors must match; Greene, "Econometric Analysis", 7th ed.,
 * ch. 19, from memory), the censored-normal probability of sitting at a limit, Φ((lo − μ)/σ) (a closed form), and
 * the well-known attenuation of least squares on clipped responses (Greene, same chapter).
 */
import { describe, expect, it } from 'vitest';
import { behaviourPolicySpec, fitBehaviourModel } from '../../src/core/behaviourModel';
import { fitCensoredRegression } from '../../src/core/censoredRegression';
import { loggedActionLimits } from '../../src/core/loggedActionLimits';
import { normalCdf, normalSurvival } from '../../src/core/normalDistribution';
import { fittedBehaviourPolicy } from '../../src/core/offPolicy/behaviourPolicy';
import { logImportanceRatio } from '../../src/core/offPolicy/importanceRatio';
import { createGaussianPolicy, policyMean } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import { simulateLog } from './linearGaussianPlant';
import { cascadePlant, stationaryLaw } from './testPlants';

const TRUE = { beta: [1, 0.8, -0.5], sigma: 0.7, lo: -0.5, hi: 2 };

function sample(n: number, seed: number): { x: Float64Array; y: Float64Array } {
  const rng = createRandom(seed), x = new Float64Array(n * 3), y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x.set([1, rng.normal(), rng.normal()], i * 3);
    const latent = TRUE.beta[0] + TRUE.beta[1] * x[i * 3 + 1] + TRUE.beta[2] * x[i * 3 + 2] + TRUE.sigma * rng.normal();
    y[i] = Math.min(TRUE.hi, Math.max(TRUE.lo, latent));
  }
  return { x, y };
}

describe('fitCensoredRegression', () => {
  it('recovers the simulated coefficients and σ within 3 of its standard errors, where least squares is attenuated', () => {
    const n = 20000, { x, y } = sample(n, 7);
    const fit = fitCensoredRegression(x, y, n, 3, TRUE.lo, TRUE.hi, { coefficients: [0, 0, 0], sigma: 1 });
    expect(fit.censoredLow + fit.censoredHigh).toBeGreaterThan(0.2 * n); // a fifth or more of the rows at a limit
    const se = (j: number) => Math.sqrt(fit.covariance[j * 4 + j]);
    TRUE.beta.forEach((b, j) => expect(Math.abs(fit.coefficients[j] - b)).toBeLessThan(3 * se(j)));
    expect(Math.abs(fit.sigma - TRUE.sigma)).toBeLessThan(3 * se(3));
    // Least squares on the clipped values: the slope toward zero by far more than its error.
    let sxy = 0, sxx = 0;
    for (let i = 0; i < n; i++) { sxy += x[i * 3 + 1] * y[i]; sxx += x[i * 3 + 1] ** 2; }
    expect(sxy / sxx).toBeLessThan(TRUE.beta[1] - 20 * se(1));
  });

  it('reports standard errors that match the spread of the estimates over 40 independent samples (within 25 %)', () => {
    const n = 1500, estimates: number[][] = [], reported: number[][] = [];
    for (let r = 0; r < 40; r++) {
      const { x, y } = sample(n, 100 + r);
      const fit = fitCensoredRegression(x, y, n, 3, TRUE.lo, TRUE.hi, { coefficients: [0.5, 0, 0], sigma: 0.5 });
      estimates.push([...fit.coefficients, fit.sigma]);
      reported.push([0, 1, 2, 3].map((j) => Math.sqrt(fit.covariance[j * 4 + j])));
    }
    for (let j = 0; j < 4; j++) {
      const values = estimates.map((e) => e[j]), mean = values.reduce((a, v) => a + v, 0) / values.length;
      const spread = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
      const meanReported = reported.reduce((a, s) => a + s[j], 0) / reported.length;
      expect(Math.abs(meanReported / spread - 1)).toBeLessThan(0.25);
    }
  });

  it('leaves an unclipped sample at the least-squares answer (no limits: the Gaussian likelihood)', () => {
    const n = 3000, { x } = sample(n, 9), rng = createRandom(10), y = new Float64Array(n);
    for (let i = 0; i < n; i++) y[i] = 0.3 + 0.2 * x[i * 3 + 1] + rng.normal();
    const fit = fitCensoredRegression(x, y, n, 3, -Infinity, Infinity, { coefficients: [0, 0, 0], sigma: 2 });
    let s1 = 0, s11 = 0, sy = 0, s1y = 0; // regression on x1 alone is enough to compare its slope: x2 is independent noise
    for (let i = 0; i < n; i++) { const v = x[i * 3 + 1]; s1 += v; s11 += v * v; sy += y[i]; s1y += v * y[i]; }
    const slope = (s1y - (s1 * sy) / n) / (s11 - (s1 * s1) / n);
    expect(fit.coefficients[1]).toBeCloseTo(slope, 1);
    expect(fit.censoredLow + fit.censoredHigh).toBe(0);
  });
});

describe('the behaviour model of a clipped logging controller', () => {
  const logging = { offset: [0.3], gain: [-0.3, -0.4, -0.3], std: [0.5], lo: [-0.4], hi: [0.9] };
  const start = stationaryLaw(cascadePlant, logging);
  const data = simulateLog(cascadePlant, logging, { episodes: 200, steps: 100, seed: 3, start });

  it('carries the limits it detects as a clip, and the seeded candidate reproduces the logged share at each limit', () => {
    const model = fitBehaviourModel(data.states, data.actions, data.count, 3, 1);
    expect(model.bounds).toEqual({ lo: [-0.4], hi: [0.9], mode: 'clip' });
    expect(model.limits).toEqual(loggedActionLimits(data.actions, data.count, 1));
    const policy = createGaussianPolicy(behaviourPolicySpec(model), 3); // what "start a candidate from the behaviour model" builds
    expect(policy.bounds?.mode).toBe('clip');
    // Predicted shares at the limits, Φ((lo − μ)/σ) and 1 − Φ((hi − μ)/σ), averaged over the logged states.
    const mu = new Float64Array(1);
    let low = 0, high = 0, seenLow = 0, seenHigh = 0;
    for (let i = 0; i < data.count; i++) {
      policyMean(policy, data.states, mu, i * 3);
      low += normalCdf((-0.4 - mu[0]) / model.std[0]) / data.count;
      high += normalSurvival((0.9 - mu[0]) / model.std[0]) / data.count;
      if (data.actions[i] === -0.4) seenLow++;
      if (data.actions[i] === 0.9) seenHigh++;
    }
    const share = (k: number) => k / data.count, se = (p: number) => Math.sqrt((p * (1 - p)) / data.count);
    console.info(`at the lower limit: predicted ${(100 * low).toFixed(2)} %, logged ${(100 * share(seenLow)).toFixed(2)} %; upper: ${(100 * high).toFixed(2)} % vs ${(100 * share(seenHigh)).toFixed(2)} %`);
    // Binomial standard error, doubled for the correlation of shares within episodes.
    expect(Math.abs(low - share(seenLow))).toBeLessThan(3 * 2 * se(low));
    expect(Math.abs(high - share(seenHigh))).toBeLessThan(3 * 2 * se(high));
    // And the fitted law is the simulated one: gains and dither within 3 standard errors.
    logging.gain.forEach((g, p) => expect(Math.abs(model.gain[0][p] - g)).toBeLessThan(3 * model.gainStandardError[0][p]));
    expect(Math.abs(model.std[0] - 0.5)).toBeLessThan(0.02);
  });

  it('is the same policy the importance-sampling check uses: the seeded candidate gives every logged action ratio 1', () => {
    const fitted = fittedBehaviourPolicy(data), model = fitBehaviourModel(data.states, data.actions, data.count, 3, 1);
    expect(Array.from(fitted.policy.offset)).toEqual(model.offset);
    expect(Array.from(fitted.policy.bounds!.lo)).toEqual([-0.4]);
    expect(fitted.limits.shareAtLimit[0]).toBeGreaterThan(0.05);
    const seeded = createGaussianPolicy(behaviourPolicySpec(model), 3);
    for (let i = 0; i < data.count; i += 7) {
      expect(logImportanceRatio(seeded, fitted.policy, data.states.subarray(3 * i, 3 * i + 3), data.actions.subarray(i, i + 1))).toBe(0);
    }
  });
});
