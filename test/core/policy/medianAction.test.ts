/**
 * medianAction against outside facts: the median of a normal law is its mean; clipping is monotone,
 * so the median of a clipped normal is the clipped mean (common practice), which a seeded sample of
 * the policy's own clipped actions confirms (half of them on each side); the truncated normal's
 * median on [0, ∞) with μ = 0, σ = 1 is the half-normal's, Φ⁻¹(0.75) = 0.6744897502 (upper quartile
 * of the standard normal; Abramowitz & Stegun Table 26.1, value from memory), and on a band
 * symmetric about μ it is μ.
 */
import { describe, expect, it } from 'vitest';
import { createGaussianPolicy, sampleAction } from '../../../src/core/policy';
import { medianAction } from '../../../src/core/policy/medianAction';
import { createRandom } from '../../../src/core/random';

describe('medianAction: the value each action is held at in a slice', () => {
  it('is the mean without limits, and the mean clipped into each action’s own limits with a clip', () => {
    const free = createGaussianPolicy({ offset: [-0.3, 1.4], gain: [[0], [0]], std: [0.1, 0.2] }, 1);
    const out = new Float64Array(2);
    medianAction(free, [5], out);
    expect(Array.from(out)).toEqual([-0.3, 1.4]);
    const valves = createGaussianPolicy({ offset: [-0.3, 1.4], gain: [[0], [0]], std: [0.1, 0.2], bounds: { lo: [0, 0], hi: [1, 1], mode: 'clip' } }, 1);
    medianAction(valves, [5], out);
    expect(Array.from(out)).toEqual([0, 1]);
    const inside = createGaussianPolicy({ offset: [0.2, 0.7], gain: [[0.1], [0]], std: [0.1, 0.2], bounds: { lo: [0, 0], hi: [1, 1], mode: 'clip' } }, 1);
    medianAction(inside, [1], out);
    expect(out[0]).toBeCloseTo(0.3, 15);
    expect(out[1]).toBeCloseTo(0.7, 15);
  });

  it('splits a seeded sample of the clipped actions in half, per action', () => {
    const policy = createGaussianPolicy({ offset: [0.05, 0.9], gain: [[0], [0]], std: [0.1, 0.3], bounds: { lo: [0, 0], hi: [1, 1], mode: 'clip' } }, 1);
    const median = new Float64Array(2), a = new Float64Array(2), rng = createRandom(5), n = 40_000;
    medianAction(policy, [0], median);
    const below = [0, 0], above = [0, 0];
    for (let i = 0; i < n; i++) {
      sampleAction(policy, [0], rng, a);
      for (let j = 0; j < 2; j++) {
        if (a[j] <= median[j]) below[j]++;
        if (a[j] >= median[j]) above[j]++;
      }
    }
    for (let j = 0; j < 2; j++) {
      expect(below[j] / n).toBeGreaterThan(0.5 - 4 * Math.sqrt(0.25 / n));
      expect(above[j] / n).toBeGreaterThan(0.5 - 4 * Math.sqrt(0.25 / n));
    }
  });

  it('gives the truncated normal’s median: the half-normal’s upper quartile, and μ on a symmetric band', () => {
    const out = new Float64Array(2);
    const truncated = createGaussianPolicy({ offset: [0, 3], gain: [[0], [0]], std: [1, 2], bounds: { lo: [0, 1], hi: [Infinity, 5], mode: 'truncate' } }, 1);
    medianAction(truncated, [0], out);
    expect(out[0]).toBeCloseTo(0.6744897502, 9);
    expect(out[1]).toBeCloseTo(3, 12);
  });
});
