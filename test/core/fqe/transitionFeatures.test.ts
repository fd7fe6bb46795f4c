/**
 * The transition reader's ψ_i = E_{a'~π(·|s'_i)} φ(s'_i, a') against its definition taken node by
 * node: Σ_j ω_j φ(s'_i, a'_j) over the action quadrature (Gauss–Hermite for an unlimited policy,
 * the bounded-normal rule for a clipped one; both checked against handbook tables and brute force
 * in test/core/quadrature). Where the rule is exact for the features (degree ≤ 2n − 1; common
 * practice for Gauss rules, Davis & Rabinowitz §2.7) the reader takes the closed-form moments, and
 * the two must agree to rounding; where it is not, the reader must use the rule itself.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { averageForQuadrature } from '../../../src/core/features/policyFeatureAverage';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { createTransitionFeatureReader } from '../../../src/core/fqe/transitionFeatures';
import { createGaussianPolicy, PolicyError, type GaussianPolicySpec } from '../../../src/core/policy';
import { simulateLinearPlant } from './simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 6, stepsPerEpisode: 40, seed: 11,
});
const unlimited: GaussianPolicySpec = { offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6] };
const clipped: GaussianPolicySpec = { ...unlimited, bounds: { lo: [-0.4], hi: [0.5], mode: 'clip' } };

/** ψ at transition i, node by node: the definition. */
function psiByNodes(i: number, degree: number, spec: GaussianPolicySpec, nodes: number): Float64Array {
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, degree));
  const quadrature = createActionQuadrature(createGaussianPolicy(spec, 2), nodes), d = features.dim;
  const points = new Float64Array(quadrature.maxPoints), weights = new Float64Array(quadrature.maxPoints);
  const k = quadrature.at(data.nextStates, 2 * i, points, weights), input = new Float64Array(3), phi = new Float64Array(d), out = new Float64Array(d);
  input.set(data.nextStates.subarray(2 * i, 2 * i + 2));
  for (let j = 0; j < k; j++) {
    input[2] = points[j];
    features.evaluate(input, 0, phi, 0);
    for (let f = 0; f < d; f++) out[f] += weights[j] * phi[f];
  }
  return out;
}

describe('transition reader: expected next features', () => {
  it.each([
    ['unlimited, degree 2, 10 nodes', unlimited, 2, 10, 'moments'],
    ['clipped, degree 3, 4 nodes', clipped, 3, 4, 'moments'],
    ['unlimited, degree 4, 2 nodes (rule not exact: the rule itself)', unlimited, 4, 2, 'quadrature'],
  ] as const)('%s', (_, spec, degree, nodes, route) => {
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, degree));
    const quadrature = createActionQuadrature(createGaussianPolicy(spec, 2), nodes);
    expect(averageForQuadrature(features, quadrature).route).toBe(route);
    const reader = createTransitionFeatureReader(data, features, quadrature);
    for (const i of [0, 17, 101, 239]) {
      reader.read(i);
      const plain = psiByNodes(i, degree, spec, nodes);
      plain.forEach((v, f) => expect(Math.abs(reader.psi[f] - v)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v))));
    }
  });

  it('raises the quadrature\'s PolicyError on the moment route where the candidate\'s mean overflows at a state', () => {
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const quadrature = createActionQuadrature(createGaussianPolicy({ offset: [1.7e308], gain: [[1e308, 0]], std: [1] }, 2), 10);
    expect(averageForQuadrature(features, quadrature).route).toBe('moments');
    const reader = createTransitionFeatureReader(data, features, quadrature);
    const i = Array.from({ length: data.count }, (_, k) => k).find((k) => data.nextStates[2 * k] > 0.1)!; // 1.7e308 + 1e308·s'_1 overflows
    expect(() => reader.read(i)).toThrow(PolicyError);
  });
});
