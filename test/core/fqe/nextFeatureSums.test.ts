/**
 * A second policy's pass that takes G = ΦᵀΦ, Φᵀr and rᵀr from a first policy's pass on the same
 * data and feature map (nextFeatureSums.ts) against that policy's own full pass (bellmanStatistics.ts):
 * the policy-free sums read only the logged (s, a, r), and the policy-dependent ones are summed
 * in the same rows, blocks and order, so every statistic must be equal to the last bit — for the
 * total and per episode, for an even and an odd feature count (the 2×2 blocks' edges), and with a
 * block that holds a terminal transition (ψ = 0).
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums, episodeBellmanSumsSteps } from '../../../src/core/bootstrap/episodeBellmanSums';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { accumulateBellmanStatistics, bellmanStatisticsSteps } from '../../../src/core/fqe/bellmanStatistics';
import { runSteps } from '../../../src/core/fqe/cancellation';
import { createGaussianPolicy } from '../../../src/core/policy';
import { simulateLinearPlant } from './simulatedTransitions';

const simulated = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 20, stepsPerEpisode: 70, seed: 5,
});
const data = { ...simulated, terminal: Uint8Array.from(simulated.terminal, (v, i) => (i % 97 === 96 ? 1 : v)) };
const first = createActionQuadrature(createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6] }, 2), 6);
const second = createActionQuadrature(createGaussianPolicy({ offset: [-0.2], gain: [[-0.9, 0.3]], std: [0.3] }, 2), 6);
const index = indexEpisodes(data);

describe('a pass that takes the policy-free sums from another policy', () => {
  it.each([[2, 10], [3, 20], [4, 35], [5, 56]])('equals the full pass to the last bit (polynomial degree %i: %i features)', (degree, count) => {
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, degree));
    expect(features.dim).toBe(count);
    const lender = accumulateBellmanStatistics(data, features, first);
    expect(runSteps(bellmanStatisticsSteps(data, features, second, {}, lender))).toEqual(accumulateBellmanStatistics(data, features, second));
    const lenderSums = episodeBellmanSums(data, features, first, {}, index);
    expect(runSteps(episodeBellmanSumsSteps(data, features, second, {}, index, lenderSums))).toEqual(episodeBellmanSums(data, features, second, {}, index));
  });

  it('refuses sums of another size', () => {
    const small = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const large = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 3));
    expect(() => runSteps(bellmanStatisticsSteps(data, large, second, {}, accumulateBellmanStatistics(data, small, first)))).toThrow(RangeError);
  });
});
