import { describe, expect, it } from 'vitest';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { FeatureSpecError } from '../../../src/core/features/featureSpecError';
import { radialBasisGridSpec } from '../../../src/core/features/radialBasisFeatures';

describe('radial basis features', () => {
  const standardiser = { mean: [10, 0], scale: [2, 0.5] };

  it('places a grid of centres and evaluates exp(−r²/(2w²)) in standardised units', () => {
    // Gaussian basis function definition: Bishop, PRML (2006), eq. 3.4.
    const spec = radialBasisGridSpec(standardiser, { pointsPerDimension: 3, halfRange: 1, linearTerms: true });
    expect(spec.centres.length).toBe(9);
    expect(spec.width).toBe(1); // the grid spacing
    const map = createFeatureMap(spec);
    expect(map.dim).toBe(1 + 2 + 9);
    const out = new Float64Array(map.dim);
    map.evaluate([12, 0.5], 0, out, 0); // z = (1, 1): exactly the last grid centre
    expect(out[0]).toBe(1);
    expect(out[1]).toBe(1);
    expect(out[2]).toBe(1);
    expect(out[3 + 8]).toBe(1);
    // Centre (1, 0) is one width away: exp(−1/2).
    const j = spec.centres.findIndex((c) => c[0] === 1 && c[1] === 0);
    expect(out[3 + j]).toBeCloseTo(Math.exp(-0.5), 15);
    // Centre (−1, −1): r² = 8, exp(−4).
    expect(out[3]).toBeCloseTo(Math.exp(-4), 15);
  });

  it('round-trips through JSON and rejects bad specs by field', () => {
    const map = createFeatureMap({ kind: 'radialBasis', centres: [[0, 0], [1, -1]], width: 0.7, linearTerms: false, standardiser });
    const again = createFeatureMap(JSON.parse(JSON.stringify(map.toSpec())));
    const a = new Float64Array(map.dim), b = new Float64Array(map.dim);
    map.evaluate([9, 0.2], 0, a, 0);
    again.evaluate([9, 0.2], 0, b, 0);
    expect(Array.from(b)).toEqual(Array.from(a));
    expect(() => createFeatureMap({ kind: 'radialBasis', centres: [[0]], width: 1, linearTerms: false, standardiser })).toThrow(/centre 1/);
    expect(() => createFeatureMap({ kind: 'radialBasis', centres: [[0, 0]], width: -1, linearTerms: false, standardiser })).toThrow(FeatureSpecError);
  });
});

describe('radial basis features on a tensor grid', () => {
  it('give the same values by products of one-dimensional factors as by the direct Gaussian, and a scattered set stays direct', () => {
    const standardiser = { mean: [0.5, -1, 2], scale: [2, 0.5, 1] };
    const grid = radialBasisGridSpec(standardiser, { pointsPerDimension: 4, width: 0.9, linearTerms: true });
    // The same centres in a scrambled order are not an odometer grid: the map evaluates each Gaussian directly.
    const scrambled = { ...grid, centres: [...grid.centres].reverse() };
    const fast = createFeatureMap(grid), direct = createFeatureMap(scrambled);
    const a = new Float64Array(fast.dim), b = new Float64Array(direct.dim);
    for (const x of [[0.5, -1, 2], [3, 0, -1], [-2.5, -1.7, 2.2]]) {
      fast.evaluate(x, 0, a, 0);
      direct.evaluate(x, 0, b, 0);
      const first = 4, c = grid.centres.length;
      for (let j = 0; j < c; j++) {
        // Direct Gaussian of centre j by hand (Bishop 2006, eq. 3.4), in standardised units.
        const z = x.map((v, i) => (v - standardiser.mean[i]) / standardiser.scale[i]);
        const r2 = grid.centres[j].reduce((s, cj, i) => s + (z[i] - cj) ** 2, 0);
        expect(a[first + j]).toBeCloseTo(Math.exp(-r2 / (2 * 0.81)), 14);
        expect(b[first + (c - 1 - j)]).toBeCloseTo(a[first + j], 14);
      }
    }
  });
});
