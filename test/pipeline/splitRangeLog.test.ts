/**
 * A log where one controller output drives two valves (split range: hot = u, cold = 1 − u) has
 * perfectly correlated action noise: the residual covariance of the two actions is singular (its
 * determinant σ²·σ² − (−σ²)² = 0; the conditional variance of the second action given the first,
 * the Schur complement Σ₂₂ − Σ₂₁Σ₁₁⁻¹Σ₁₂, is 0 — common practice, e.g. Greene, "Econometric
 * Analysis", 7th ed., App. B.9), so no Gaussian density of the logged actions exists. Before, the
 * fitted present controller's singular covariance made createGaussianPolicy throw and the whole
 * evaluation failed with "covariance: must be symmetric positive definite"; now the behaviour model
 * says why it cannot be formed, and the run goes on with the logged return as its baseline.
 * Two valves with their own independent dithers are still fitted, each with its own spread.
 */
import { describe, expect, it } from 'vitest';
import { BehaviourModelError, fitBehaviourModel } from '../../src/core/behaviourModel';
import { createRandom } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { projectSchema } from '../../src/project/schema';

/** x' = 0.8x + 0.5(hot − cold) + w; hot = 0.5 − 0.3x + 0.1ε, cold = 1 − hot (split) or its own dither. */
function valveLog(split: boolean): TransitionSet {
  const runs = 20, steps = 100, n = runs * steps, rng = createRandom(3);
  const states = new Float64Array(n), actions = new Float64Array(2 * n), nextStates = new Float64Array(n), rewards = new Float64Array(n);
  const episode = new Int32Array(n), startStates = new Float64Array(runs);
  for (let e = 0, i = 0; e < runs; e++) {
    let x = rng.normal();
    startStates[e] = x;
    for (let t = 0; t < steps; t++, i++) {
      const hot = 0.5 - 0.3 * x + 0.1 * rng.normal(), cold = split ? 1 - hot : 0.5 + 0.3 * x + 0.05 * rng.normal();
      states[i] = x;
      actions[2 * i] = hot;
      actions[2 * i + 1] = cold;
      rewards[i] = -(x * x);
      x = nextStates[i] = 0.8 * x + 0.5 * (hot - cold) + 0.1 * rng.normal();
      episode[i] = e;
    }
  }
  return {
    count: n, stateDim: 1, actionDim: 2, stateNames: ['x'], actionNames: ['hot', 'cold'], states, actions, nextStates, rewards,
    terminal: new Uint8Array(n), episode, episodeCount: runs, startStates, sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

describe('a split-range log (one controller output drives both valves)', () => {
  it('has no behaviour density, and the model says so, naming the action', () => {
    const log = valveLog(true);
    expect(() => fitBehaviourModel(log.states, log.actions, log.count, 1, 2)).toThrow(BehaviourModelError);
    expect(() => fitBehaviourModel(log.states, log.actions, log.count, 1, 2)).toThrow(/action 2 moves exactly with action 1/);
    const independent = valveLog(false), model = fitBehaviourModel(independent.states, independent.actions, independent.count, 1, 2);
    expect(model.std[0]).toBeCloseTo(0.1, 2);
    expect(model.std[1]).toBeCloseTo(0.05, 2);
  });

  it('names the third action when it is a blend of the first two (a singular 3×3 covariance)', () => {
    // Third valve = 0.3·hot + 0.7·cold: its conditional variance given the first two is 0 (the same Schur complement).
    const log = valveLog(false), n = log.count, three = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      three[3 * i] = log.actions[2 * i];
      three[3 * i + 1] = log.actions[2 * i + 1];
      three[3 * i + 2] = 0.3 * log.actions[2 * i] + 0.7 * log.actions[2 * i + 1];
    }
    expect(() => fitBehaviourModel(log.states, three, n, 1, 3)).toThrow(/action 3 moves exactly with actions 1 to 2/);
  });

  it('is evaluated with the logged return as the baseline instead of failing', async () => {
    const project = projectSchema.parse({
      format: 'setpoint-critic-project', version: 1, name: 'split range', data: { path: 'none.csv' },
      columns: { states: [{ column: 'x' }], actions: [{ column: 'hot' }, { column: 'cold' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
      discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
      candidates: [{ name: 'firmer', offset: [0.5, 0.5], gain: [[-0.4], [0.4]], std: [0.1, 0.1] }],
    });
    const result = await evaluateProject({ project, dataset: valveLog(true) });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('; '));
    expect(result.value.presentController).toBeNull();
    expect(result.value.presentControllerReason).toMatch(/split range/);
    expect(Number.isFinite(result.value.policies[0].policyValue)).toBe(true);
  });
});
