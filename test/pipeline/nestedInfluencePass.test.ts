/**
 * The function classes' first-order resamples (linearModel.ts buildLinearModelsPaced) take their
 * influence values for nested polynomial degrees from one pass over the data
 * (src/core/bootstrap/nestedInfluencePass.ts). Checked against the straightforward route, each
 * degree built on its own (buildLinearModelPaced, its own data pass and its own influence pass): the
 * same influence values, fits and models to the last bit, where degrees 3 and 4 share their route to
 * the expected next features (3 nodes: closed-form moments for both) and where they do not (2 nodes:
 * the rule for degree 4, the moments for degree 3; then each makes its own pass). Invented plant.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../src/core/actionQuadrature';
import { averageForQuadrature } from '../../src/core/features/policyFeatureAverage';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';
import { buildLinearModelPaced, buildLinearModelsPaced } from '../../src/pipeline/model/linearModel';
import type { LinearFitSpec } from '../../src/pipeline/model/candidateModel';
import { projectSchema } from '../../src/project/schema';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';

// Many short runs: the per-episode sums of degrees 3 and 4 exceed MAX_INFLUENCE_SUM_VALUES, so both take the influence pass.
const dataset = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 7000, stepsPerEpisode: 3, seed: 8,
});

function plannedFor(quadratureNodes: number) {
  const project = projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name: 'nested influence', data: { path: 'none.csv' },
    columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
    discount: 0.9, quadratureNodes, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
    candidates: [{ name: 'trimmed', offset: [0], gain: [[-0.4, -0.1]], std: [0.4] }],
  });
  const plan = planEvaluation(project, dataset);
  if (!plan.ok) throw new Error('plan');
  return plan.value;
}

describe('nested function classes’ influence values from one pass', () => {
  for (const nodes of [3, 2]) {
    it(`equal each class built alone (${nodes} quadrature nodes)`, async () => {
      const p = plannedFor(nodes), planned = p.candidates[0];
      const spec = (degree: number): LinearFitSpec => ({
        features: featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree }, ridge: 1e-6, tolerance: 1e-8, maxIterations: 500 }, p.data),
        ridge: 1e-6, tolerance: 1e-8, maxIterations: 500,
      });
      const specs = [4, 3, 2].map(spec), quadrature = createActionQuadrature(planned.policy, nodes);
      expect(averageForQuadrature(specs[0].features, quadrature).route).toBe(nodes === 3 ? 'moments' : 'quadrature');
      const together = await buildLinearModelsPaced(p, planned, {}, specs);
      for (let c = 0; c < specs.length; c++) {
        const outcome = together[c];
        if ('error' in outcome) throw outcome.error;
        const alone = await buildLinearModelPaced(p, planned, {}, specs[c]), got = outcome.model.linear!, want = alone.linear!;
        expect(got.resampling.kind).toBe('linearised'); // degree 2 from its per-episode sums, 3 and 4 from the pass
        expect(got.resampling).toEqual(want.resampling);
        expect(got.statistics).toEqual(want.statistics);
        expect(outcome.model.fit.policyValue).toBe(alone.fit.policyValue);
      }
    }, 60_000);
  }
});
