/**
 * Model rollouts with an end chance (modelRollouts.ts, endChanceModel.ts), on an invented level that
 * drifts (s' = 0.9 s + a + noise) and pays −1 per step:
 * - a chance of 1 ends every rollout after its first step, so J = −1 exactly (one step's reward);
 * - a constant chance p gives J = −1/(1 − γ(1 − p)) (the geometric series; common practice) within
 *   the rollouts' own Monte Carlo error and the cut-off's TAIL_WEIGHT;
 * - the share of steps held at the edge of the logged states is over the steps a run had: a run that
 *   starts far outside the logs and ends after one step spent all of it at the edge (share 1).
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { modelRolloutValue, TAIL_WEIGHT } from '../../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, polynomialModelRegressions } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

function driftingLevel(rows: number, seed: number): TransitionSet {
  const rng = createRandom(seed), s: number[] = [], a: number[] = [], next: number[] = [];
  let x = 0;
  for (let i = 0; i < rows; i++) {
    const u = 0.3 * rng.normal(), y = 0.9 * x + u + 0.1 * rng.normal();
    s.push(x); a.push(u); next.push(y);
    x = y;
  }
  return {
    count: rows, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['valve'], states: Float64Array.from(s), actions: Float64Array.from(a),
    nextStates: Float64Array.from(next), rewards: new Float64Array(rows).fill(-1), terminal: new Uint8Array(rows), episode: new Int32Array(rows), episodeCount: 1,
    startStates: new Float64Array(1), sourceLine: Int32Array.from({ length: rows }, (_, i) => i + 2),
  };
}

describe('model rollouts that end', () => {
  const data = driftingLevel(5_000, 2), regressions = polynomialModelRegressions(data, indexEpisodes(data), { degree: 1, rewardDegree: 2 });
  const model = fitPolynomialModel(regressions), policy = createGaussianPolicy({ offset: [0], gain: [[-0.2]], std: [0.3] }, 1);
  const constantChance = (logOdds: number) => ({ features: regressions.rewardFeatures, weights: Float64Array.from({ length: regressions.rewardFeatures.dim }, (_, j) => (j === 0 ? logOdds : 0)) });
  const settings = { rolloutsPerStart: 50, seed: 9 }, discount = 0.9;

  it('pays one step when every step ends the run, and the geometric series for a constant chance', () => {
    expect(modelRolloutValue(model, policy, discount, new Float64Array([0, 0.5]), settings, null, constantChance(60)).value).toBeCloseTo(-1, 9);
    const p = 0.2, chance = constantChance(Math.log(p / (1 - p))), got = modelRolloutValue(model, policy, discount, new Float64Array(40), settings, null, chance);
    const truth = -1 / (1 - discount * (1 - p));
    expect(Math.abs(got.value - truth)).toBeLessThan(3 * got.monteCarloError + TAIL_WEIGHT * 10);
  });

  it('counts the steps held at the edge of the logs over the steps a run had', () => {
    const far = new Float64Array([1e3]);
    expect(modelRolloutValue(model, policy, discount, far, settings, null, constantChance(60)).shareOutsideLogs).toBeCloseTo(1, 9);
    // Without an end the run goes on L steps and comes back inside: only its first steps are held.
    expect(modelRolloutValue(model, policy, discount, far, settings).shareOutsideLogs).toBeLessThan(0.5);
  });
});
