/**
 * V̂(s) = ξ(s)ᵀw from the feature map's node average (linearStateValues.ts) against value.ts's
 * stateValues (Q evaluated at every quadrature node, then the weighted sum): the same quadrature
 * and the same algebra by linearity, so equal up to rounding — for polynomial and radial-basis
 * features, with and without actuator limits (clipped: point masses; truncated: renormalised rule).
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { linearStateValues } from '../../../src/core/features/linearStateValues';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { radialBasisGridSpec } from '../../../src/core/features/radialBasisFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { linearActionValue } from '../../../src/core/fqe/linearActionValue';
import { createGaussianPolicy } from '../../../src/core/policy';
import { stateValues } from '../../../src/core/value';
import { simulateLinearPlant } from '../fqe/simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 5, stepsPerEpisode: 60, seed: 9,
});
const standardiser = fitStateActionStandardiser(data).spec;
const policies = {
  unlimited: createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6] }, 2),
  clipped: createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6], bounds: { lo: [-0.4], hi: [0.5], mode: 'clip' } }, 2),
  truncated: createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6], bounds: { lo: [-0.4], hi: [0.5], mode: 'truncate' } }, 2),
};
const maps = {
  'polynomial degree 3': createFeatureMap(polynomialFeatureSpec(standardiser, 3)),
  'radial basis 4 per input': createFeatureMap(radialBasisGridSpec(standardiser, { pointsPerDimension: 4 })),
};

describe('linear state values from the policy-averaged features', () => {
  for (const [mapName, features] of Object.entries(maps)) {
    it.each(Object.keys(policies))(`equal Q at every node, summed (${mapName}, %s policy)`, (name) => {
      const policy = policies[name as keyof typeof policies], quadrature = createActionQuadrature(policy, 8);
      const weights = Float64Array.from({ length: features.dim }, (_, f) => Math.sin(1 + f));
      const plain = stateValues(linearActionValue(features, weights, 2, 1), policy, data.states, data.count, quadrature);
      const fast = linearStateValues(features, weights, quadrature, data.states, data.count, 2);
      const scale = Math.max(...plain.map(Math.abs));
      fast.forEach((v, i) => expect(Math.abs(v - plain[i])).toBeLessThan(1e-12 * scale));
    });
  }
});
