import { describe, expect, it } from 'vitest';
import { createActionQuadrature, expectUnderPolicy, quadratureNodesAt } from '../../../src/core/actionQuadrature';
import { createGaussianPolicy, policyMean, sampleAction, type GaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import { normalCdf, normalDensity, normalIntervalProbability, normalSurvival } from '../../../src/core/normalDistribution';

const COVARIANCES: number[][][] = [
  [[0.64]],
  [[1.0, 0.6], [0.6, 2.0]],
  [[1.5, 0.3, -0.4], [0.3, 0.8, 0.2], [-0.4, 0.2, 1.1]],
];

function policyWithCovariance(m: number): GaussianPolicy {
  const gain = Array.from({ length: m }, (_, i) => [0.5 + i, -0.25 * i]);
  return createGaussianPolicy({ offset: Array.from({ length: m }, (_, i) => 0.1 * (i + 1)), gain, covariance: COVARIANCES[m - 1] }, 2);
}

function meanAt(policy: GaussianPolicy, state: number[]): Float64Array {
  const mean = new Float64Array(policy.actionDim);
  policyMean(policy, state, mean);
  return mean;
}

/** Σ_j w_j g(a_j) over the rule at one state. */
function integrate(policy: GaussianPolicy, state: number[], n: number, g: (a: Float64Array) => number): number {
  const { count, points, weights } = quadratureNodesAt(policy, state, n);
  const m = policy.actionDim;
  let sum = 0;
  for (let j = 0; j < count; j++) sum += weights[j] * g(points.subarray(j * m, (j + 1) * m));
  return sum;
}

describe('unbounded policies: tensor Gauss–Hermite through the covariance factor', () => {
  for (const m of [1, 2, 3]) {
    it(`m = ${m}: E[a] = μ(s), E[a aᵀ] = Σ + μμᵀ, and third moments by Isserlis' theorem`, () => {
      const policy = policyWithCovariance(m), state = [0.7, -1.3];
      const mu = meanAt(policy, state), sigma = COVARIANCES[m - 1];
      for (let i = 0; i < m; i++) {
        expect(integrate(policy, state, 3, (a) => a[i])).toBeCloseTo(mu[i], 13);
        for (let j = 0; j < m; j++) {
          // Second moment of a Gaussian vector (common practice).
          expect(integrate(policy, state, 3, (a) => a[i] * a[j])).toBeCloseTo(sigma[i][j] + mu[i] * mu[j], 13);
          for (let k = 0; k < m; k++) {
            // E[a_i a_j a_k] = μ_iμ_jμ_k + μ_iΣ_jk + μ_jΣ_ik + μ_kΣ_ij (Isserlis 1918); degree 3 ≤ 2n−1 for n = 2.
            const exact = mu[i] * mu[j] * mu[k] + mu[i] * sigma[j][k] + mu[j] * sigma[i][k] + mu[k] * sigma[i][j];
            expect(integrate(policy, state, 2, (a) => a[i] * a[j] * a[k])).toBeCloseTo(exact, 12);
          }
        }
      }
    });
  }

  it('reads the state at stateOffset in a batch and reports n^m points with weights summing to 1', () => {
    const policy = policyWithCovariance(2), quadrature = createActionQuadrature(policy, 5);
    expect(quadrature.maxPoints).toBe(25);
    const states = Float64Array.from([9, 9, 0.7, -1.3, 9]);
    const points = new Float64Array(50), weights = new Float64Array(25);
    expect(quadrature.at(states, 2, points, weights)).toBe(25);
    const direct = quadratureNodesAt(policy, [0.7, -1.3], 5);
    expect(Array.from(points)).toEqual(Array.from(direct.points));
    expect(weights.reduce((s, w) => s + w, 0)).toBeCloseTo(1, 14);
  });

  it('E exp(a) for scalar a ~ N(μ, σ²) is e^{μ+σ²/2} (lognormal mean, common practice)', () => {
    const policy = policyWithCovariance(1), state = [0.7, -1.3];
    const mu = meanAt(policy, state)[0];
    const r = expectUnderPolicy(policy, state, (a) => Math.exp(a[0]), 12);
    expect(Math.abs(r.value / Math.exp(mu + 0.32) - 1)).toBeLessThan(1e-13);
    expect(r.errorEstimate).toBeLessThan(1e-12);
    expect(r.points).toBe(12);
  });
});

describe('bounded policies: tensor product of the 1-D bounded rules', () => {
  const clipped = createGaussianPolicy({
    offset: [0.2, -0.1], gain: [[0.5, 0], [0, 1]], std: [0.8, 0.5],
    bounds: { lo: [-0.5, -Infinity], hi: [1, 0.2], mode: 'clip' },
  }, 2);

  it('clip, m = 2: marginal means match the censored-normal closed form and E[a1 a2] = E[a1]E[a2]', () => {
    const state = [0.4, 0.1], mu = meanAt(clipped, state), std = [0.8, 0.5];
    // Two-limit censored normal mean (Greene, "Econometric Analysis", censored normal).
    const clippedMean = (i: number) => {
      const lo = clipped.bounds!.lo[i], hi = clipped.bounds!.hi[i];
      const alpha = (lo - mu[i]) / std[i], beta = (hi - mu[i]) / std[i];
      const phi = (z: number) => (Number.isFinite(z) ? normalDensity(z) : 0);
      const atLo = Number.isFinite(lo) ? lo * normalCdf(alpha) : 0, atHi = Number.isFinite(hi) ? hi * normalSurvival(beta) : 0;
      return atLo + atHi + mu[i] * normalIntervalProbability(alpha, beta) + std[i] * (phi(alpha) - phi(beta));
    };
    const e1 = integrate(clipped, state, 6, (a) => a[0]), e2 = integrate(clipped, state, 6, (a) => a[1]);
    expect(e1).toBeCloseTo(clippedMean(0), 13);
    expect(e2).toBeCloseTo(clippedMean(1), 13);
    expect(integrate(clipped, state, 6, (a) => a[0] * a[1])).toBeCloseTo(e1 * e2, 13); // independence
    const quadrature = createActionQuadrature(clipped, 6);
    expect(quadrature.maxPoints).toBe(64);
    // Dimension 2 has no lower bound, so it contributes 6 + 1 points; dimension 1 all 8.
    expect(quadratureNodesAt(clipped, state, 6).count).toBe(56);
  });

  it('clip agrees with sampling from the policy (Monte Carlo, fixed seed, 4 standard errors)', () => {
    const state = [0.4, 0.1], f = (a: ArrayLike<number>) => a[0] * a[0] + Math.sin(3 * a[1]) + a[0] * a[1];
    const exact = integrate(clipped, state, 16, f);
    const rng = createRandom(7), action = new Float64Array(2), draws = 200_000;
    let sum = 0, squares = 0;
    for (let k = 0; k < draws; k++) {
      sampleAction(clipped, state, rng, action);
      const v = f(action);
      sum += v;
      squares += v * v;
    }
    const mean = sum / draws, standardError = Math.sqrt((squares / draws - mean * mean) / draws);
    expect(Math.abs(mean - exact)).toBeLessThan(4 * standardError);
  });

  it('truncate, m = 3: the rule matches rejection sampling of the policy and each marginal JKB mean', () => {
    const policy = createGaussianPolicy({
      offset: [0, 1, -1], gain: [[1], [0], [0.5]], std: [1, 0.3, 2],
      bounds: { lo: [0, 0.5, -2], hi: [Infinity, 1.2, 3], mode: 'truncate' },
    }, 1);
    const state = [0.25], mu = meanAt(policy, state), std = [1, 0.3, 2];
    const phi = (z: number) => (Number.isFinite(z) ? normalDensity(z) : 0);
    for (let i = 0; i < 3; i++) {
      const alpha = (policy.bounds!.lo[i] - mu[i]) / std[i], beta = (policy.bounds!.hi[i] - mu[i]) / std[i];
      // Truncated normal mean, Johnson, Kotz & Balakrishnan, Vol. 1, §10.1.
      const exact = mu[i] + (std[i] * (phi(alpha) - phi(beta))) / normalIntervalProbability(alpha, beta);
      expect(integrate(policy, state, 5, (a) => a[i])).toBeCloseTo(exact, 13);
    }
    expect(createActionQuadrature(policy, 5).maxPoints).toBe(343);
    expect(quadratureNodesAt(policy, state, 5).count).toBe(125);
    const f = (a: ArrayLike<number>) => a[0] * a[1] - a[2] * a[2];
    const exact = integrate(policy, state, 10, f);
    const rng = createRandom(11), action = new Float64Array(3), draws = 100_000;
    let sum = 0, squares = 0;
    for (let k = 0; k < draws; k++) {
      sampleAction(policy, state, rng, action);
      const v = f(action);
      sum += v;
      squares += v * v;
    }
    const mean = sum / draws, standardError = Math.sqrt((squares / draws - mean * mean) / draws);
    expect(Math.abs(mean - exact)).toBeLessThan(4 * standardError);
  });
});

describe('expectUnderPolicy error estimate', () => {
  it('is at rounding level for polynomials the rule integrates exactly', () => {
    const policy = policyWithCovariance(2);
    const r = expectUnderPolicy(policy, [0.7, -1.3], (a) => a[0] ** 3 * a[1] + a[1] ** 2, 3);
    expect(r.errorEstimate).toBeLessThan(1e-12);
    expect(r.points).toBe(9);
  });

  it('for smooth f tracks the true error: E cos(2a) = cos(2μ)e^{−2σ²} (normal characteristic function)', () => {
    const policy = createGaussianPolicy({ offset: [0.3], gain: [[0]], std: [1] }, 1);
    const exact = Math.cos(0.6) * Math.exp(-2);
    for (const n of [3, 4, 6, 8]) {
      const r = expectUnderPolicy(policy, [0], (a) => Math.cos(2 * a[0]), n);
      const error = Math.abs(r.value - exact);
      expect(r.errorEstimate).toBeGreaterThan(0.5 * error);
      expect(r.errorEstimate).toBeLessThan(2 * error);
    }
  });
});

describe('argument checks', () => {
  const policy = policyWithCovariance(2);
  it('rejects a state window past the end, short buffers and non-finite states', () => {
    const quadrature = createActionQuadrature(policy, 3);
    const points = new Float64Array(18), weights = new Float64Array(9);
    expect(() => quadrature.at([1, 2, 3], 2, points, weights)).toThrow(/state offset 2/);
    expect(() => quadrature.at([1, 2], 0, new Float64Array(4), weights)).toThrow(/buffers too small/);
    expect(() => quadrature.at([NaN, 2], 0, points, weights)).toThrow(/mean action 1 is NaN/);
    expect(() => createActionQuadrature(policy, 0)).toThrow(RangeError);
  });
});
