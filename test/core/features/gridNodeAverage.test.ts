import { describe, expect, it } from 'vitest';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { radialBasisGridSpec } from '../../../src/core/features/radialBasisFeatures';
import { createRandom } from '../../../src/core/random';

/**
 * The factored quadrature average of grid bumps against the plain node-by-node sum Σ_j ω_j φ(s, a_j)
 * of the same feature map (the distributive law; the two differ only by rounding).
 */
describe('radial basis grid features averaged over action nodes', () => {
  it('equals the node-by-node sum for 1–2 states, 1–2 actions, with and without linear terms', () => {
    const random = createRandom(11);
    for (const ds of [1, 2]) for (const m of [1, 2]) for (const linearTerms of [false, true]) {
      const n = ds + m, standardiser = { mean: Array.from({ length: n }, () => random.normal()), scale: Array.from({ length: n }, () => 0.5 + random.uniform()) };
      const map = createFeatureMap(radialBasisGridSpec(standardiser, { pointsPerDimension: 4, linearTerms })), d = map.dim, average = map.nodeAverage!(ds);
      const k = 6, state = Float64Array.from({ length: ds }, () => random.normal());
      const points = Float64Array.from({ length: k * m }, () => random.normal()), weights = Float64Array.from({ length: k }, () => random.uniform() / k);
      const expected = new Float64Array(d), phi = new Float64Array(d), input = new Float64Array(n);
      for (let j = 0; j < k; j++) {
        input.set(state);
        for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
        map.evaluate(input, 0, phi, 0);
        for (let e = 0; e < d; e++) expected[e] += weights[j] * phi[e];
      }
      const out = new Float64Array(d);
      average(state, 0, points, weights, k, out, 0);
      for (let e = 0; e < d; e++) expect(out[e]).toBeCloseTo(expected[e], 13);
    }
  });

  it('is offered only for centres on a full grid', () => {
    const spec = radialBasisGridSpec({ mean: [0, 0], scale: [1, 1] }, { pointsPerDimension: 3 });
    expect(createFeatureMap(spec).nodeAverage).toBeDefined();
    expect(createFeatureMap({ ...spec, centres: spec.centres.slice(1) }).nodeAverage).toBeUndefined();
  });
});
