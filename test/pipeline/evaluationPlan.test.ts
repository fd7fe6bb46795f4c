/**
 * The plan refuses, with the field named, what the schema accepts but the engine cannot run:
 * quadrature beyond the bounded-normal rule's limit or the per-state point budget, and a discount
 * whose horizon is longer than the logs. Limits are the engine's own (src/core/limits.ts).
 */
import { describe, expect, it } from 'vitest';
import { MAX_BOUNDED_NORMAL_NODES, MAX_QUADRATURE_POINTS } from '../../src/core/limits';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { projectSchema } from '../../src/project/schema';
import { sweptDiscount } from '../../src/pipeline/assessSensitivity';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';

const dataset = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 20, stepsPerEpisode: 50, seed: 7,
});

function project(changes: Record<string, unknown>) {
  return projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name: 'plan checks', data: { path: 'none.csv' },
    columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
    discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
    candidates: [{ name: 'limited', offset: [0], gain: [[-0.4, -0.1]], std: [0.4], bounds: { lo: [-1], hi: [1], mode: 'clip' } }],
    ...changes,
  });
}

describe('planEvaluation', () => {
  it('accepts the schema default and the bounded-rule limit', () => {
    expect(planEvaluation(project({}), dataset).ok).toBe(true);
    expect(planEvaluation(project({ quadratureNodes: MAX_BOUNDED_NORMAL_NODES }), dataset).ok).toBe(true);
  });

  it('refuses 33–64 nodes for a candidate with actuator limits, naming the setting and the candidate', () => {
    for (const nodes of [MAX_BOUNDED_NORMAL_NODES + 1, 40, 64]) {
      const plan = planEvaluation(project({ quadratureNodes: nodes }), dataset);
      expect(plan).toMatchObject({ ok: false, problems: [{ field: ['quadratureNodes'], where: expect.stringContaining('"limited"'), message: expect.stringContaining(`at most ${MAX_BOUNDED_NORMAL_NODES}`) }] });
    }
  });

  it('refuses more quadrature points per state than a data pass can afford (three actions)', () => {
    const threeActions = simulateLinearPlant({
      dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2, 0.1, 0.1, 0.3, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1],
      actionWeight: [0.1, 0, 0, 0, 0.1, 0, 0, 0, 0.1], behaviourGain: [-0.3, -0.1, 0, -0.2, -0.1, 0], behaviourStd: [0.5, 0.5, 0.5],
      startStd: 1, episodes: 20, stepsPerEpisode: 50, seed: 8,
    });
    const doc = (nodes: number) => project({
      quadratureNodes: nodes,
      columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u1' }, { column: 'u2' }, { column: 'u3' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
      candidates: [{ name: 'three', offset: [0, 0, 0], gain: [[-0.4, -0.1], [0, -0.3], [0, 0]], std: [0.4, 0.4, 0.4] }],
    });
    const largest = Math.floor(Math.cbrt(MAX_QUADRATURE_POINTS) + 1e-9);
    expect(planEvaluation(doc(largest), threeActions).ok).toBe(true);
    expect(planEvaluation(doc(64), threeActions)).toMatchObject({
      ok: false, problems: [{ field: ['quadratureNodes'], message: expect.stringContaining(`use at most ${largest} nodes per action`) }],
    });
  });

  it('refuses a discount whose horizon 1/(1 − γ) exceeds the logged transitions', () => {
    const plan = planEvaluation(project({ discount: 0.999999 }), dataset);
    expect(plan).toMatchObject({ ok: false, problems: [{ field: ['discount'], message: expect.stringMatching(/1,000,000|1\.00e\+6/) }] });
    expect(planEvaluation(project({ discount: 1 - 1 / dataset.count }), dataset).ok).toBe(true);
  });
});

describe('the discount sweep', () => {
  it('stays inside (0, 1) for every discount, where 1 − (1 − γ)/f did not (γ = 0.3, f = ½ gave −0.4)', () => {
    for (const g of [0.01, 0.3, 0.5, 0.9, 0.99, 0.999999]) {
      for (const f of [0.5, 0.75, 1, 1.5, 2]) {
        const swept = sweptDiscount(g, f);
        expect(swept).toBeGreaterThan(0);
        expect(swept).toBeLessThan(1);
      }
      expect(sweptDiscount(g, 1)).toBe(g);
    }
    // Near 1 it scales the effective horizon 1/(1 − γ) by f, as the old formula meant to.
    expect(1 / (1 - sweptDiscount(0.999, 2)) / (1 / (1 - 0.999))).toBeCloseTo(2, 2);
  });
});
