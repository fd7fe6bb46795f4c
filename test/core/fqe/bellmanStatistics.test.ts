/**
 * The one-pass Bellman statistics (bellmanStatistics.ts: blocked rows, 2×2 register blocks, the
 * off-diagonal blocks of G, H and both halves of M in one pass) against the straightforward route:
 * φ_i and ψ_i read transition by transition (the same feature reader) and G = ΦᵀΦ/n, M = ΦᵀΨ/n,
 * H = ΨᵀΨ/n, Φᵀr/n, Ψᵀr/n formed one product at a time. Only the order of summation differs, so
 * they agree to rounding; checked for an even and an odd feature count (the odd one exercises the
 * blocks' edges).
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { episodeBellmanSums, leadingEpisodeSums } from '../../../src/core/bootstrap/episodeBellmanSums';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { accumulateBellmanStatistics, leadingStatistics } from '../../../src/core/fqe/bellmanStatistics';
import { createTransitionFeatureReader } from '../../../src/core/fqe/transitionFeatures';
import { createGaussianPolicy } from '../../../src/core/policy';
import { simulateLinearPlant } from './simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 20, stepsPerEpisode: 70, seed: 5,
});
const quadrature = createActionQuadrature(createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6] }, 2), 6);

describe('accumulateBellmanStatistics', () => {
  it.each([[2, 10], [4, 35]])('equals the product-at-a-time sums (polynomial degree %i in 3 inputs: %i features)', (degree, count) => {
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, degree)), d = features.dim;
    expect(d).toBe(count);
    const stats = accumulateBellmanStatistics(data, features, quadrature);
    const reader = createTransitionFeatureReader(data, features, quadrature), n = data.count;
    const g = new Float64Array(d * d), m = new Float64Array(d * d), h = new Float64Array(d * d), b = new Float64Array(d), e = new Float64Array(d);
    for (let i = 0; i < n; i++) {
      reader.read(i);
      for (let x = 0; x < d; x++) {
        b[x] += reader.phi[x] * data.rewards[i];
        e[x] += reader.psi[x] * data.rewards[i];
        for (let y = 0; y < d; y++) {
          g[x * d + y] += reader.phi[x] * reader.phi[y];
          m[x * d + y] += reader.phi[x] * reader.psi[y];
          h[x * d + y] += reader.psi[x] * reader.psi[y];
        }
      }
    }
    const same = (fast: Float64Array, plain: Float64Array) => fast.forEach((v, k) => expect(v).toBeCloseTo(plain[k] / n, 11));
    same(stats.gram, g);
    same(stats.crossNext, m);
    same(stats.nextGram, h);
    same(stats.featureReward, b);
    same(stats.nextFeatureReward, e);
  });

  it('gives a lower degree the same statistics, to the last bit, as the leading block of a higher degree (graded monomial order)', () => {
    const spec = fitStateActionStandardiser(data).spec;
    const index = indexEpisodes(data);
    for (const [low, high] of [[2, 4], [3, 4], [2, 3]]) {
      const small = createFeatureMap(polynomialFeatureSpec(spec, low)), large = createFeatureMap(polynomialFeatureSpec(spec, high));
      expect(leadingStatistics(accumulateBellmanStatistics(data, large, quadrature), small.dim)).toEqual(accumulateBellmanStatistics(data, small, quadrature));
      const perEpisode = leadingEpisodeSums(episodeBellmanSums(data, large, quadrature, {}, index), small.dim);
      expect(perEpisode).toEqual(episodeBellmanSums(data, small, quadrature, {}, index));
    }
  });

  it('the same for a clipped candidate whose dither is far wider than its limits (where some of its closed-form moments give way to the rule)', () => {
    const spec = fitStateActionStandardiser(data).spec;
    const wide = createActionQuadrature(createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [60], bounds: { lo: [-0.5], hi: [0.6], mode: 'clip' } }, 2), 6);
    for (const [low, high] of [[2, 4], [3, 4], [2, 3]]) {
      const small = createFeatureMap(polynomialFeatureSpec(spec, low)), large = createFeatureMap(polynomialFeatureSpec(spec, high));
      expect(leadingStatistics(accumulateBellmanStatistics(data, large, wide), small.dim)).toEqual(accumulateBellmanStatistics(data, small, wide));
    }
  });
});
