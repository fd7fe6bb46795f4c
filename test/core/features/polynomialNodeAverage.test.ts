import { describe, expect, it } from 'vitest';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { createRandom } from '../../../src/core/random';

/**
 * The factored quadrature average against the plain node-by-node sum Σ_j ω_j φ(s, a_j) of the same
 * feature map (the distributive law; the two differ only by rounding).
 */
describe('polynomial features averaged over action nodes', () => {
  it('equals the node-by-node sum for 1–3 states, 1–2 actions, degrees 0–4', () => {
    const random = createRandom(7);
    for (const ds of [1, 2, 3]) for (const m of [1, 2]) for (let degree = 0; degree <= 4; degree++) {
      const n = ds + m, spec = polynomialFeatureSpec({ mean: Array.from({ length: n }, () => random.normal()), scale: Array.from({ length: n }, () => 0.5 + random.uniform()) }, degree);
      const map = createFeatureMap(spec), d = map.dim, average = map.nodeAverage!(ds);
      const k = 5, state = Float64Array.from({ length: ds + 1 }, () => random.normal());
      const points = Float64Array.from({ length: k * m }, () => 2 * random.normal()), weights = Float64Array.from({ length: k }, () => random.uniform());
      const expected = new Float64Array(d), phi = new Float64Array(d), input = new Float64Array(n);
      for (let j = 0; j < k; j++) {
        for (let c = 0; c < ds; c++) input[c] = state[1 + c];
        for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
        map.evaluate(input, 0, phi, 0);
        for (let e = 0; e < d; e++) expected[e] += weights[j] * phi[e];
      }
      const out = new Float64Array(d + 2);
      average(state, 1, points, weights, k, out, 1);
      expect(out[0]).toBe(0);
      expect(out[d + 1]).toBe(0);
      for (let e = 0; e < d; e++) expect(out[1 + e]).toBeCloseTo(expected[e], 10 - Math.ceil(Math.log10(1 + Math.abs(expected[e]))));
    }
  });
});
