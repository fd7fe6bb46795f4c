/**
 * ψ(s) = C·χ(s) for an affine Gaussian policy and polynomial features: the coefficient matrix C,
 * built by polynomial algebra on the normal moments, against the per-state closed-form moments
 * (policyFeatureAverage.ts, itself checked against the action quadrature).
 */
import { describe, expect, it } from 'vitest';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { createGaussianPolicy } from '../../../src/core/policy';
import { featureStructure, nextFeatureCoefficients } from '../../../src/core/retune/nextFeatureCoefficients';
import { createPolicyFeatureAverage } from '../../../src/core/features/policyFeatureAverage';
import { evaluateMonomials, statePolynomialRing } from '../../../src/core/retune/statePolynomials';

describe('candidate-averaged features as a polynomial in the state', () => {
  it.each([
    ['one action', { offset: [40], gain: [[3, -1, 0.2]], std: [4] }, 1, 3],
    ['two actions', { offset: [45, 1], gain: [[2, -1], [0, 0.5]], std: [3, 1.5] }, 2, 4],
  ] as const)('C·χ(s) equals the moments at every state (%s)', (_, spec, m, degree) => {
    const ds = 4 - m, standardiser = { mean: [1, -2, 50, 3], scale: [0.5, 2, 10, 4] };
    const policy = createGaussianPolicy({ offset: [...spec.offset], gain: spec.gain.map((r) => [...r]), std: [...spec.std] }, ds);
    const featureSpec = polynomialFeatureSpec(standardiser, degree), features = createFeatureMap(featureSpec);
    const ring = statePolynomialRing(ds, degree)!;
    const c = nextFeatureCoefficients(featureSpec, ring, featureStructure(featureSpec, ring, ds, m), policy);
    const moments = createPolicyFeatureAverage(features, policy, 10);
    const chi = new Float64Array(ring.size), z = new Float64Array(ds), viaMoments = new Float64Array(features.dim);
    for (const state of [[1.2, -3, 48], [0.4, 0, 52], [1.8, 4.9, 30], [1, -7, 60]]) {
      const s = state.slice(0, ds);
      s.forEach((v, i) => { z[i] = (v - standardiser.mean[i]) / standardiser.scale[i]; });
      evaluateMonomials(ring, z, chi);
      moments.average(s, 0, viaMoments, 0);
      for (let j = 0; j < features.dim; j++) {
        let v = 0;
        for (let b = 0; b < ring.size; b++) v += c[j * ring.size + b] * chi[b];
        expect(Math.abs(v - viaMoments[j])).toBeLessThan(1e-10 * Math.max(1, Math.abs(viaMoments[j])));
      }
    }
  });
});
