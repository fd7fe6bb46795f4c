/**
 * The network's last layer kept within the possible values by raising the hidden ridge
 * (src/core/fqe/networkRidgeLadder.ts). Outside facts: a 2×2 ridge-regularised system solved by
 * hand (v_h = b_h / (ε + λ·G_hh·(1 + 10⁻³)), the floor of networkLastLayer.ts on one hidden
 * feature), and, end to end, the invented steam-drum hold-out (test/battery/holdout/steamDrumPlant.ts)
 * whose first iterate left the range max|r|/(1 − γ) bounds (Bertsekas & Tsitsiklis, "Neuro-Dynamic
 * Programming", §2.1: |V| ≤ max|r|/(1 − γ) for bounded rewards) and stopped the whole fit.
 */
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fitNetworkFqe } from '../../../src/core/fqe/networkFqe';
import { solveLastLayer } from '../../../src/core/fqe/networkLastLayer';
import { climbRidgeLadder, RIDGE_LADDER_FACTOR, RIDGE_LADDER_RUNGS, ridgeLadderSentence } from '../../../src/core/fqe/networkRidgeLadder';
import { defaultNetworkSettings } from '../../../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../../../src/core/policy';
import { steamDrumPlant } from '../../battery/holdout/steamDrumPlant';

const wasmPath = `${resolve('node_modules/@tensorflow/tfjs-backend-wasm/dist')}/`;

/** Packed sums (networkLastLayerSums.ts layout, n = 1) of G = diag(1, 1), M = diag(0, 1 − ε), b = (1, 1): d = 2, one quadratic and one hidden feature. */
function nearlySingular(epsilon: number): { sums: Float64Array; dim: number; linearDim: number } {
  const d = 2, width = 2 * d + 1, sums = new Float64Array(d * width + 1);
  sums.set([1, 0, 0, 0, 1], 0); // row 0: G, M, b
  sums.set([0, 1, 0, 1 - epsilon, 1], width); // row 1
  sums[sums.length - 1] = 1;
  return { sums, dim: d, linearDim: 1 };
}

const hiddenWeight = (ridge: number, epsilon: number) => 1 / (epsilon + ridge * (1 + 1e-3 + 1e-12));

describe('the hidden-ridge ladder', () => {
  const measure = (l: { hidden: Float64Array }) => Math.abs(l.hidden[0]);

  it('keeps the default ridge, with the very weights of one solve, where they pass', () => {
    const system = nearlySingular(0.5), step = climbRidgeLadder(system, 1e-2, (l) => l, () => true);
    const plain = solveLastLayer(system.sums, 2, 1, 1e-2);
    if (!('lastLayer' in step) || 'failure' in plain) throw new Error('expected a solution');
    expect(step.hiddenRidge).toBe(1e-2);
    expect([...step.lastLayer.linear, ...step.lastLayer.hidden]).toEqual([...plain.weights]);
  });

  it('climbs ×10 per rung to the first ridge whose values pass, as solved by hand', () => {
    const epsilon = 1e-6, step = climbRidgeLadder(nearlySingular(epsilon), 1e-2, measure, (v) => v < 20);
    if (!('lastLayer' in step)) throw new Error('expected a rung to pass');
    expect(hiddenWeight(1e-2, epsilon)).toBeGreaterThan(20); // about 99.9: the default fails
    expect(step.hiddenRidge).toBeCloseTo(1e-2 * RIDGE_LADDER_FACTOR, 15);
    expect(step.values).toBeCloseTo(hiddenWeight(1e-1, epsilon), 10); // about 9.99
    expect(step.lastLayer.linear[0]).toBeCloseTo(1, 12);
  });

  it('reports the default rung when no rung passes', () => {
    const step = climbRidgeLadder(nearlySingular(1e-6), 1e-2, measure, () => false);
    if (!('failing' in step)) throw new Error('expected no rung to pass');
    expect(step.failing.hiddenRidge).toBe(1e-2);
    expect(step.failing.values).toBeCloseTo(hiddenWeight(1e-2, 1e-6), 8);
  });

  it('says where it was climbed, in words from the same constants', () => {
    expect(ridgeLadderSentence([], 0.01)).toBeNull();
    const one = ridgeLadderSentence([{ iteration: 1, hiddenRidge: 0.1 }], 0.01)!;
    expect(one).toMatch(/^At outer iteration 1 the last layer/);
    expect(one).toContain(`×${RIDGE_LADDER_FACTOR} per step, at most ${RIDGE_LADDER_RUNGS} steps`);
    // As λ_h grows the hidden weights go to 0: the polynomial part's own fixed point, whatever its degree (quadratic only by default).
    expect(one).toContain("toward the polynomial part’s own fixed point");
    expect(ridgeLadderSentence([1, 4, 7, 9].map((iteration) => ({ iteration, hiddenRidge: 0.1 })), 0.01)).toMatch(/^At 4 outer iterations \(the first at iteration 1\)/);
  });
});

describe('the steam-drum hold-out, whose first iterate left the possible values at the default ridge', () => {
  it('keeps fitting instead of stopping the whole fit with no value, and says the ridge was raised', async () => {
    const plant = steamDrumPlant(), firmer = plant.candidates[0];
    const data = plant.simulate({ transitions: 100_000, seed: 1, runStarts: 'steady' });
    const fit = await fitNetworkFqe({
      data, policy: createGaussianPolicy(firmer.spec, plant.stateDim), discount: plant.discount, quadratureNodes: 10, seed: 1, wasmPath,
      startStates: data.startStates, settings: { ...defaultNetworkSettings, outerIterations: 2 },
      // The polynomial part at degree 2, where this log's first iterate leaves the possible values; the default choice takes 4 on it (by the criterion), whose first iterate stays inside.
      method: { linearPartDegree: 2 },
    });
    try {
      expect(fit.history.length).toBe(2);
      expect(fit.status).not.toBe('converged');
      expect(fit.message).toMatch(/At outer iterations? 1\b.* the last layer gave values no policy can have/);
      let largest = 0;
      for (const r of data.rewards) largest = Math.max(largest, Math.abs(r));
      for (const h of fit.history) expect(Math.abs(h.policyValue)).toBeLessThanOrEqual(largest / (1 - plant.discount));
    } finally {
      fit.dispose();
    }
  }, 300_000);
});
