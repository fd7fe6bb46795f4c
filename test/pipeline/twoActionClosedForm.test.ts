/**
 * The whole assessment with two actions on an invented linear-Gaussian plant with a quadratic cost,
 * against the exact discounted value of each candidate (the Lyapunov closed form of src/core/lq.ts,
 * itself checked against a published example; Bertsekas, "Dynamic Programming and Optimal Control",
 * Vol. I, §4.1). One candidate moves only the SECOND action's offset, so an estimator that read the
 * first action only would give it the logged controller's value. Checked: the fitted J (within 3 of
 * its standard errors), the linear-quadratic model's closed form (1 %: its own fit's error) and the
 * model rollouts (3 %: fit plus Monte Carlo error) — the tolerances are ours.
 */
import { describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { projectSchema } from '../../src/project/schema';
import { exactPolicyValue, simulateLog, type TestController, type TestPlant } from '../core/linearGaussianPlant';

const plant: TestPlant = { n: 2, m: 2, A: [0.9, 0.1, 0, 0.8], B: [0.5, 0.1, 0.2, 0.4], noiseStd: [0.1, 0.1], Q: [1, 0, 0, 1], R: [0.1, 0, 0, 0.2] };
const logging: TestController = { offset: [0, 0], gain: [-0.3, -0.1, 0, -0.2], std: [0.5, 0.4] };
const candidates: [string, TestController][] = [
  ['both gains', { offset: [0, 0], gain: [-0.4, -0.1, 0, -0.3], std: [0.45, 0.35] }],
  ['second offset only', { offset: [0, 0.6], gain: [-0.3, -0.1, 0, -0.2], std: [0.5, 0.4] }],
];

describe('two actions against the linear-quadratic closed form', () => {
  it('gives each candidate its exact value, by the fit and by both model checks', async () => {
    const data = simulateLog(plant, logging, { episodes: 100, steps: 200, seed: 4, start: { mean: new Float64Array(2), cov: Float64Array.of(1, 0, 0, 1) } });
    const project = projectSchema.parse({
      format: 'setpoint-critic-project', version: 1, name: 'two actions', data: { path: 'none.csv' },
      columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u1' }, { column: 'u2' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
      discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
      candidates: candidates.map(([name, c]) => ({ name, offset: c.offset, gain: [c.gain.slice(0, 2), c.gain.slice(2)], std: c.std })),
    });
    const result = await assessProject({ project, dataset: data, settings: { resamples: 200, level: 0.9, seed: 4, sensitivity: false } });
    if (!result.ok) throw new Error('assessment failed');
    const logged = exactPolicyValue(plant, logging, 0.9, data.startStates);
    result.value.candidates.forEach((c, i) => {
      const exact = exactPolicyValue(plant, candidates[i][1], 0.9, data.startStates);
      expect(Math.abs(c.policyValue.value - exact)).toBeLessThan(3 * c.policyValue.standardError!);
      const closedForm = c.crossChecks.find((x) => x.method === 'linearQuadraticModel')!.estimate!.value;
      expect(Math.abs(closedForm / exact - 1)).toBeLessThan(0.01);
      const rollouts = c.crossChecks.find((x) => x.method === 'modelRollouts')!.estimate!.value;
      expect(Math.abs(rollouts / exact - 1)).toBeLessThan(0.03);
    });
    // The second candidate differs from the logged controller in its second action only, and by far more than the error.
    expect(Math.abs(exactPolicyValue(plant, candidates[1][1], 0.9, data.startStates) - logged)).toBeGreaterThan(3);
  });
});
