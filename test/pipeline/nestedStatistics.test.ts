/**
 * A lower polynomial degree reads its statistics off a higher degree's pass (linearModel.ts
 * nestedStatistics) only where that gives its own pass to the last bit. The two degrees can take
 * different routes to E_{a~π} φ: with n quadrature nodes the closed-form moments serve degrees
 * ≤ 2n − 1 and the rule serves higher ones (the Gauss rule's exactness, common practice), and the
 * two routes agree to rounding only. Then the lower degree must make its own pass.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../src/core/actionQuadrature';
import { averageForQuadrature } from '../../src/core/features/policyFeatureAverage';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';
import { buildLinearModelPaced } from '../../src/pipeline/model/linearModel';
import type { LinearFitSpec } from '../../src/pipeline/model/candidateModel';
import { projectSchema } from '../../src/project/schema';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';

const dataset = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 20, stepsPerEpisode: 50, seed: 7,
});

const project = projectSchema.parse({
  format: 'setpoint-critic-project', version: 1, name: 'nested classes', data: { path: 'none.csv' },
  columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
  discount: 0.9, quadratureNodes: 2, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 4 } },
  candidates: [{ name: 'trimmed', offset: [0], gain: [[-0.4, -0.1]], std: [0.4] }],
});

describe('a lower degree read off a higher degree\'s pass', () => {
  it('is its own pass to the last bit, also where the two degrees take different routes to the expected next features', async () => {
    const plan = planEvaluation(project, dataset);
    if (!plan.ok) throw new Error('plan');
    const p = plan.value, planned = p.candidates[0];
    const spec = (degree: number): LinearFitSpec => ({
      features: featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree }, ridge: 1e-6, tolerance: 1e-8, maxIterations: 500 }, p.data),
      ridge: 1e-6, tolerance: 1e-8, maxIterations: 500,
    });
    const high = spec(4), low = spec(3), quadrature = createActionQuadrature(planned.policy, 2);
    expect(averageForQuadrature(high.features, quadrature).route).toBe('quadrature'); // degree 4 > 2·2 − 1
    expect(averageForQuadrature(low.features, quadrature).route).toBe('moments');
    const outer = await buildLinearModelPaced(p, planned, {}, high);
    const read = await buildLinearModelPaced(p, planned, {}, low, [outer]);
    const own = await buildLinearModelPaced(p, planned, {}, low);
    expect(read.linear!.statistics).toEqual(own.linear!.statistics);
    expect(read.fit.policyValue).toBe(own.fit.policyValue);
  });
});
