/**
 * The two routes to ψ(s) = E_{a~π} φ(s, a) give the same numbers: closed-form moments of the
 * (clipped) normal against the action quadrature, which is itself checked against handbook and
 * brute-force rules elsewhere (test/core/quadrature, test/core/policy/formQuadrature.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import { createPolicyFeatureAverage, quadratureAverage } from '../../../src/core/features/policyFeatureAverage';
import { clippedGaussianMoments, gaussianMoments } from '../../../src/core/features/actionMoments';
import { bruteForceExpectation } from '../policy/bruteForce';

const standardiser = { mean: [1, -2, 50, 3], scale: [0.5, 2, 10, 4] }; // 3 states, 1 action … or 2 states, 2 actions
const schedule = { action: 0, state: 1, breakpoints: [-5, 0, 5], values: [70, 50, 20] };

const cases: [string, GaussianPolicySpec, number][] = [
  ['unlimited affine, one action', { offset: [40], gain: [[3, -1, 0.2]], std: [4] }, 1],
  ['scheduled and clipped', { offset: [0], gain: [[5, 0, 0]], std: [6], schedules: [schedule], bounds: { lo: [30], hi: [60], mode: 'clip' } }, 1],
  ['rate limited around a previous action', { offset: [45], gain: [[2, -1, 0]], std: [3], rateLimit: { previousActionState: [2], maxStep: [2] } }, 1],
  ['two actions, one clipped', { offset: [45, 1], gain: [[2, -1], [0, 0.5]], std: [3, 1.5], bounds: { lo: [40, -Infinity], hi: [52, Infinity], mode: 'clip' } }, 2],
];

describe('policy-averaged features: moments against quadrature', () => {
  it.each(cases)('%s', (_, spec, m) => {
    const ds = 4 - m, policy = createGaussianPolicy(spec, ds);
    for (const degree of [2, 4]) {
      const features = createFeatureMap(polynomialFeatureSpec(standardiser, degree));
      const moments = createPolicyFeatureAverage(features, policy, 10), nodes = quadratureAverage(features, policy, 10);
      expect(moments.route).toBe('moments');
      for (const state of [[1.2, -3, 48], [0.4, 0, 52], [1.8, 4.9, 30], [1, -7, 60]]) {
        const s = state.slice(0, ds), a = new Float64Array(features.dim), b = new Float64Array(features.dim);
        moments.average(s, 0, a, 0);
        nodes.average(s, 0, b, 0);
        for (let j = 0; j < features.dim; j++) expect(Math.abs(a[j] - b[j])).toBeLessThan(1e-11 * Math.max(1, Math.abs(b[j])));
      }
    }
  });

  it('takes the quadrature route where the rule is not exact for the degree, or the law is truncated', () => {
    const features = createFeatureMap(polynomialFeatureSpec(standardiser, 4));
    expect(createPolicyFeatureAverage(features, createGaussianPolicy(cases[0][1], 3), 2).route).toBe('quadrature');
    const truncated = createGaussianPolicy({ offset: [40], gain: [[0, 0, 0]], std: [4], bounds: { lo: [30], hi: [50], mode: 'truncate' } }, 3);
    expect(createPolicyFeatureAverage(features, truncated, 10).route).toBe('quadrature');
  });

  it('clipped moments agree with a brute-force rule from the definitions', () => {
    const out = new Float64Array(7), partial = new Float64Array(7);
    for (const [mean, lo, hi] of [[10, 8, 13], [10, -Infinity, 9], [10, 12, Infinity], [0, -0.5, 0.5]]) {
      expect(clippedGaussianMoments(mean, 2, lo, hi, 9, 3, 6, out, partial)).toBe(7);
      for (let k = 0; k <= 6; k++) {
        const reference = bruteForceExpectation((a) => ((a - 9) / 3) ** k, mean, 2, lo, hi, 'clip');
        expect(out[k]).toBeCloseTo(reference, 9);
      }
    }
  });
});


describe('normal raw moments', () => {
  // E X^k of X ~ N(μ, σ²), k ≤ 6: the binomial expansion with E ξ^l = (l − 1)!! (standard-normal
  // moments; common practice, written from memory and re-derived by hand).
  const raw = (mu: number, s: number) => [1, mu, mu ** 2 + s ** 2, mu ** 3 + 3 * mu * s ** 2, mu ** 4 + 6 * mu ** 2 * s ** 2 + 3 * s ** 4,
    mu ** 5 + 10 * mu ** 3 * s ** 2 + 15 * mu * s ** 4, mu ** 6 + 15 * mu ** 4 * s ** 2 + 45 * mu ** 2 * s ** 4 + 15 * s ** 6];
  it.each([[0.3, 1.2], [-2, 0.5], [0, 1], [5, 3]])('gaussianMoments(μ = %d, σ = %d) of the standardised action', (mu, s) => {
    const out = new Float64Array(7), centre = 0.7, scale = 2.5;
    gaussianMoments(mu, s, centre, scale, 6, out);
    raw((mu - centre) / scale, s / scale).forEach((v, k) => expect(out[k]).toBeCloseTo(v, 12));
  });
});

describe('clipped moments where the dither is far wider than the band between the limits', () => {
  // The band holds a sliver of the normal's mass, so the interior terms of the binomial sum are huge
  // and cancel; the moments must still be those of the censored normal (the rule serves there).
  // Reference: E z^k = Φ(α) z_L^k + (1 − Φ(β)) z_U^k + ∫_L^U z(a)^k N(a; μ, σ²) da, evaluated with
  // mpmath 1.3 (ncdf, npdf, quad) at 50 digits, z = a here (centre 0, scale 1).
  const censored: [number, number[]][] = [
    [0, [1, 0, 0.99946807701265705, 0, 0.9993616924273467]],
    [1000, [1, 0.68268941148018579, 0.99967737236730781, 0.68268934695466847, 0.99961284684076937]],
  ];
  it.each(censored)('mean %d, σ = 1000, limits ±1', (mean, reference) => {
    const features = createFeatureMap(polynomialFeatureSpec({ mean: [0, 0], scale: [1, 1] }, 4));
    const policy = createGaussianPolicy({ offset: [mean], gain: [[0]], std: [1000], bounds: { lo: [-1], hi: [1], mode: 'clip' } }, 1);
    const average = createPolicyFeatureAverage(features, policy, 10);
    expect(average.route).toBe('moments');
    const psi = new Float64Array(features.dim), phi = new Float64Array(features.dim);
    average.average([0], 0, psi, 0);
    features.evaluate([0, 2], 0, phi, 0); // at s = 0 only the powers a^k are non-zero: 2^k marks a^k
    for (let k = 0; k <= 4; k++) expect(Math.abs(psi[phi.indexOf(2 ** k)] - reference[k])).toBeLessThan(1e-12);
  });

  it('the closed form says from which moment on it cannot be trusted', () => {
    const out = new Float64Array(5), partial = new Float64Array(5);
    expect(clippedGaussianMoments(0, 1000, -1, 1, 0, 1, 4, out, partial)).toBeLessThan(5);
    expect(clippedGaussianMoments(0, 1, -1, 1, 0, 1, 4, out, partial)).toBe(5);
  });

  it('a mean far beyond a limit (1e200, finite) gives the limit\'s features, as the rule does (the closed form made 0·∞ = NaN)', () => {
    // Clipping puts all the mass at U = 1 (censored normal, definition): E z^k = 1 for every k.
    const features = createFeatureMap(polynomialFeatureSpec({ mean: [0, 0], scale: [1, 1] }, 2));
    const policy = createGaussianPolicy({ offset: [1e200], gain: [[0]], std: [1], bounds: { lo: [-1], hi: [1], mode: 'clip' } }, 1);
    const psi = new Float64Array(features.dim), phi = new Float64Array(features.dim);
    createPolicyFeatureAverage(features, policy, 10).average([0.5], 0, psi, 0);
    features.evaluate([0.5, 1], 0, phi, 0);
    expect(Array.from(psi)).toEqual(Array.from(phi));
  });

  it('a rate limit of 0.002 under a dither of 300 (75 action scales), degree 6: the quadrature\'s numbers', () => {
    const policy = createGaussianPolicy({ offset: [45], gain: [[2, -1, 0]], std: [300], rateLimit: { previousActionState: [2], maxStep: [0.002] } }, 3);
    const features = createFeatureMap(polynomialFeatureSpec(standardiser, 6));
    const moments = createPolicyFeatureAverage(features, policy, 10), nodes = quadratureAverage(features, policy, 10);
    expect(moments.route).toBe('moments');
    for (const s of [[1.2, -3, 48], [0.4, 0, 52], [1.8, 4.9, 30], [1, -7, 60]]) {
      const a = new Float64Array(features.dim), b = new Float64Array(features.dim);
      moments.average(s, 0, a, 0);
      nodes.average(s, 0, b, 0);
      for (let j = 0; j < features.dim; j++) expect(Math.abs(a[j] - b[j])).toBeLessThan(1e-11 * Math.max(1, Math.abs(b[j])));
    }
  });
});
