/**
 * The sensitivity sweep's lower degree reads its statistics off a compared class's whole-data pass
 * (linearModel.ts wholePassStatistics) only where that is its own pass to the last bit: the class's
 * statistics must be a whole pass's (not the total of per-episode sums, summed in another order), its
 * monomials must lead, and both must take the same route to E_{a~π} φ.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../src/core/actionQuadrature';
import { runSteps } from '../../src/core/fqe/cancellation';
import { bellmanStatisticsSteps } from '../../src/core/fqe/bellmanStatistics';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';
import { buildLinearModelPaced, wholePassStatistics } from '../../src/pipeline/model/linearModel';
import type { LinearFitSpec } from '../../src/pipeline/model/candidateModel';
import { projectSchema } from '../../src/project/schema';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';

/** Invented plant; many short runs make the degree-4 class's per-episode sums too many to keep, so its pass is a whole pass. */
const plant = (episodes: number, stepsPerEpisode: number) => simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes, stepsPerEpisode, seed: 11,
});

const project = projectSchema.parse({
  format: 'setpoint-critic-project', version: 1, name: 'swept degree', data: { path: 'none.csv' },
  columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
  discount: 0.9, quadratureNodes: 5, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
  candidates: [{ name: 'trimmed', offset: [0], gain: [[-0.4, -0.1]], std: [0.4] }],
});

async function setting(episodes: number, stepsPerEpisode: number) {
  const plan = planEvaluation(project, plant(episodes, stepsPerEpisode));
  if (!plan.ok) throw new Error('plan');
  const p = plan.value, planned = p.candidates[0];
  const spec = (degree: number): LinearFitSpec => ({
    features: featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree }, ridge: 1e-6, tolerance: 1e-8, maxIterations: 500 }, p.data),
    ridge: 1e-6, tolerance: 1e-8, maxIterations: 500,
  });
  const outer = await buildLinearModelPaced(p, planned, {}, spec(4)), low = spec(1).features;
  const own = runSteps(bellmanStatisticsSteps(p.data, low, outer.quadrature));
  return { p, planned, outer, low, own };
}

describe('the sweep\'s lower degree read off a compared class\'s whole pass', () => {
  it('is its own whole pass to the last bit', async () => {
    const { p, outer, low, own } = await setting(2400, 5);
    const read = wholePassStatistics(p, low, outer.quadrature, [outer]);
    expect(read).not.toBeNull();
    expect(read).toEqual(own);
  });

  it('is not read where the class\'s statistics total its per-episode sums, or its quadrature is another policy\'s', async () => {
    const few = await setting(20, 50);
    expect(wholePassStatistics(few.p, few.low, few.outer.quadrature, [few.outer])).toBeNull();
    const many = await setting(2400, 5);
    const other = createActionQuadrature({ ...many.planned.policy }, 5);
    expect(wholePassStatistics(many.p, many.low, other, [many.outer])).toBeNull();
  });
});
