/**
 * The slice panel's explanation with one and with two actions. With two, the weighted mean of Q
 * over one action's nodes (the other held) is not V^π(s): for Q(s, a, b) = −a² − 2b² and independent
 * normal actions with means 0 and dithers σ_a, σ_b, V = −σ_a² − 2σ_b² (the second moment of a normal
 * law, common practice), while the slice at b = 0 averages to −σ_a². Checked here with the tool's own
 * tensor Gauss–Hermite nodes, which reproduce both closed forms.
 */
import { describe, expect, it } from 'vitest';
import { quadratureNodesAt } from '../../../src/core/actionQuadrature';
import { createGaussianPolicy } from '../../../src/core/policy';
import { sliceExplanation } from '../../../src/renderer/src/screens/findings/plotLabels';

describe('slice explanation', () => {
  it('says the nodes average to V^π(s) with one action only', () => {
    expect(sliceExplanation(1)).toMatch(/weighted mean is V\^\{π\}\(s\)/);
    expect(sliceExplanation(2)).toMatch(/other actions held at the policy’s median action/);
    expect(sliceExplanation(2)).toMatch(/is not V\^\{π\}\(s\)/);
  });

  it('is right that a two-action slice does not average to V^π(s)', () => {
    const sa = 0.3, sb = 0.5, policy = createGaussianPolicy({ offset: [0, 0], gain: [[0], [0]], std: [sa, sb] }, 1);
    const nodes = quadratureNodesAt(policy, [0], 5);
    let v = 0, slice = 0, sliceWeight = 0;
    for (let k = 0; k < nodes.count; k++) {
      const a = nodes.points[2 * k], b = nodes.points[2 * k + 1], w = nodes.weights[k];
      v += w * (-a * a - 2 * b * b);
      if (Math.abs(b) < 1e-12) { slice += w * -a * a; sliceWeight += w; } // the middle node of b: the slice at b = 0
    }
    expect(v).toBeCloseTo(-sa * sa - 2 * sb * sb, 12);
    expect(slice / sliceWeight).toBeCloseTo(-sa * sa, 12);
  });
});
