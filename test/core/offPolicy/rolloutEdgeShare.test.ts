/**
 * The share of the model's value collected in states held at the edge of the logged states
 * (modelRollouts.ts, rewardShareAtEdge), on hand-made models whose simulated states are held from a
 * known step on. Logged states span [0, 1], so the box is [−0.25, 1.25] (RANGE_MARGIN 0.25); the
 * model drifts s' = s + 0.1 without noise from s₀ = 0, so s_k = 0.1·k is first held at k = 13
 * (1.3 > 1.25) and every later state stays held (1.25 + 0.1 is beyond the box again).
 * - A constant reward: the discounted share of reward in held states is the geometric sum's tail,
 *   h = Σ_{t=13}^{L−1} γ^t / Σ_{t=0}^{L−1} γ^t = (γ^13 − γ^L)/(1 − γ^L) (closed form, common practice),
 *   and the share of held steps counts the transition into the first held state too:
 *   (γ^12 − γ^L)/(1 − γ^L).
 * - A reward that grows with the state (the backlash hold-out's failure: a model that runs off to
 *   costly states): h is the held rewards' share of Σ γ^t |r_t| along the known path, above the
 *   share of held steps.
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { modelRolloutValue, RANGE_MARGIN, TAIL_WEIGHT } from '../../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, polynomialModelRegressions, type PolynomialModelFit } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';

/** Logged states evenly over [0, 1] (so the edge is known exactly), any actions, reward −1. */
function loggedSpan(rows: number): TransitionSet {
  const s = Float64Array.from({ length: rows }, (_, i) => i / (rows - 1)), a = Float64Array.from({ length: rows }, (_, i) => Math.sin(i));
  return {
    count: rows, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['valve'], states: s, actions: a,
    nextStates: Float64Array.from(s), rewards: new Float64Array(rows).fill(-1), terminal: new Uint8Array(rows), episode: new Int32Array(rows), episodeCount: 1,
    startStates: new Float64Array(1), sourceLine: Int32Array.from({ length: rows }, (_, i) => i + 2),
  };
}

describe('the share of the model’s value collected at the edge of the logged states', () => {
  const data = loggedSpan(101), regressions = polynomialModelRegressions(data, indexEpisodes(data), { degree: 1, rewardDegree: 1 });
  const fitted = fitPolynomialModel(regressions), policy = createGaussianPolicy({ offset: [0], gain: [[0]], std: [0.1] }, 1);
  const discount = 0.9, steps = Math.ceil(Math.log(TAIL_WEIGHT) / Math.log(discount)), settings = { rolloutsPerStart: 2, seed: 3 };
  // Features [1, z_s, z_a] (degree 1); the drift on the constant only, no noise.
  const drifting = (rewardWeights: number[]): PolynomialModelFit => ({ ...fitted, dynamicsWeights: Float64Array.from([0.1, 0, 0]), noiseFactor: new Float64Array(1), rewardWeights: Float64Array.from(rewardWeights) });
  const firstHeld = 13;

  it('holds the path from step 13 on, as worked out above', () => {
    expect(regressions.stateLow[0]).toBe(0);
    expect(regressions.stateHigh[0]).toBe(1);
    expect(1 + RANGE_MARGIN).toBe(1.25);
    expect(steps).toBe(66);
  });

  it('is the geometric tail for a constant reward; the share of held steps counts one transition earlier', () => {
    const got = modelRolloutValue(drifting([-1, 0, 0]), policy, discount, new Float64Array([0]), settings);
    const gL = discount ** steps;
    expect(got.rewardShareAtEdge).toBeCloseTo((discount ** firstHeld - gL) / (1 - gL), 12);
    expect(got.shareOutsideLogs).toBeCloseTo((discount ** (firstHeld - 1) - gL) / (1 - gL), 12);
    expect(got.value).toBeCloseTo(-(1 - gL) / (1 - discount), 12);
  });

  it('weighs each step by the size of its reward, so a costly held part outweighs its share of steps', () => {
    // r = −(1 + 4·s) in the logged units: z_s = (s − mean)/scale, so the weights are read back through the standardiser.
    const z0 = new Float64Array(3), z1 = new Float64Array(3);
    regressions.rewardFeatures.evaluate(Float64Array.from([0, 0]), 0, z0, 0);
    regressions.rewardFeatures.evaluate(Float64Array.from([1, 0]), 0, z1, 0);
    const perUnit = 1 / (z1[1] - z0[1]), w = [-(1 + 4 * (-z0[1] * perUnit)), -4 * perUnit, 0];
    const got = modelRolloutValue(drifting(w), policy, discount, new Float64Array([0]), settings);
    let held = 0, all = 0;
    for (let t = 0; t < steps; t++) {
      const s = Math.min(0.1 * t, 1.25), size = discount ** t * (1 + 4 * s);
      all += size;
      if (t >= firstHeld) held += size;
    }
    expect(got.rewardShareAtEdge).toBeCloseTo(held / all, 9);
    expect(got.rewardShareAtEdge).toBeGreaterThan(got.shareOutsideLogs);
  });

  it('is zero where nothing is held and where no reward is collected', () => {
    const still = { ...drifting([-1, 0, 0]), dynamicsWeights: new Float64Array(3) };
    expect(modelRolloutValue(still, policy, discount, new Float64Array([0.5]), settings).rewardShareAtEdge).toBe(0);
    expect(modelRolloutValue(drifting([0, 0, 0]), policy, discount, new Float64Array([0]), settings).rewardShareAtEdge).toBe(0);
  });
});
