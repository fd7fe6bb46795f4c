/**
 * The held-actions repair in the pipeline, on a small manual log: the cooling tower with 10 % of its rows in
 * manual stretches (test/battery/holdout/manualStretchPlants.ts; 20,000 rows, seed 1). The log's automatic law is
 * known in closed form — u = 0.5 + 0.3·(T − 28), dither 0.1 (coolingTowerPlant.ts; the fan command is clipped at
 * [0, 1], which the clipped fit accounts for) — so the law fitted on the rows not held must find its gain 0.3 where
 * the fit on every row finds a smaller one. The rule (/work/notes/held42-rule.md): the importance-sampling checks
 * are then not applicable for every policy (on a held row the logging law is a point mass), and the finding stays.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { fitBehaviourModel } from '../../src/core/behaviourModel';
import type { TransitionSet } from '../../src/core/transitions';
import type { Assessment } from '../../src/pipeline/assessment';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { heldRowsLeftOutText } from '../../src/core/diagnostics/heldActionsFinding';
import { fitPresentControllerLaw } from '../../src/pipeline/plan/presentController';
import { declaredActionBounds } from '../../src/pipeline/plan/declaredBounds';
import { assessedProject } from '../support/assessedProject';
import { plantProject } from '../support/plantProject';
import { coolingTowerManualPlant } from '../battery/holdout/manualStretchPlants';

const plant = coolingTowerManualPlant(0.1);
const project = plantProject(plant, 'tower-manual', plant.candidates.map((c) => {
  const { bounds, ...rest } = c.spec;
  return { name: c.name, ...rest, ...(bounds ? { bounds: { lo: Array.from(bounds.lo), hi: Array.from(bounds.hi), mode: bounds.mode } } : {}) };
}));

describe('the present controller where actions were held', () => {
  let data: TransitionSet, a: Assessment;
  beforeAll(async () => {
    data = plant.simulate({ transitions: 20_000, seed: 1 });
    a = await assessedProject({ project, dataset: data, settings: { resamples: 20, level: 0.9, seed: 3, sensitivity: false } });
  }, 300_000);

  it('fits the law on the rows not held: its gain is the automatic law’s, where every row’s is pulled toward zero', () => {
    const plan = planEvaluation(project, data);
    if (!plan.ok) throw new Error('the project should plan');
    const { fitted, lawFit } = plan.value.presentController;
    expect(lawFit.lawFittedOn).toBe('movingRows');
    expect(fitted!.model.count).toBe(lawFit.rowsUsed);
    expect(lawFit.rowsUsed).toBeLessThan(data.count * 0.92);
    const gain = fitted!.model.gain[0][0], pooled = fitBehaviourModel(data.states, data.actions, data.count, 2, 1).gain[0][0];
    expect(Math.abs(gain - 0.3)).toBeLessThan(0.01);
    expect(pooled).toBeLessThan(gain - 0.02);
    expect(fitted!.model.std[0]).toBeGreaterThan(0.09);
    expect(fitted!.model.std[0]).toBeLessThan(0.11);
  });

  it('gives the import summary the same law as the plan (the Candidates step shows the law the evaluation uses)', () => {
    const plan = planEvaluation(project, data);
    if (!plan.ok) throw new Error('the project should plan');
    const shown = fitPresentControllerLaw(data, declaredActionBounds(project, 1));
    expect(shown.lawFit).toEqual(plan.value.presentController.lawFit);
    expect(shown.fitted!.model.gain).toEqual(plan.value.presentController.fitted!.model.gain);
    expect(shown.fitted!.model.std).toEqual(plan.value.presentController.fitted!.model.std);
  });

  it('gives the evaluation’s present controller the held rows its law was fitted without, and the words that say so', async () => {
    const evaluation = await evaluateProject({ project, dataset: data });
    if (!evaluation.ok) throw new Error('the project should evaluate');
    const plan = planEvaluation(project, data);
    if (!plan.ok || 'reason' in plan.value.presentController.held) throw new Error('the project should plan, with held rows read');
    const rows = plan.value.presentController.held.stretches.rows;
    expect(evaluation.value.presentController?.model.heldRowsLeftOut).toBe(rows);
    expect(heldRowsLeftOutText(rows)).toBe(` without its ${rows.toLocaleString('en-US')} held rows`);
    expect(heldRowsLeftOutText(undefined)).toBe('');
  }, 300_000);

  it('leaves out the importance-sampling checks for every policy, and keeps the plant-model checks', () => {
    for (const c of [...a.candidates, a.presentController!]) {
      for (const method of ['weightedImportanceSampling', 'weightedDoublyRobust'] as const) {
        const check = c.crossChecks.find((x) => x.method === method)!;
        expect(check.agreement, `${c.name} ${method}`).toBe('notApplicable');
        expect(check.note).toMatch(/^Not applicable: actions were held in \d+ of 50 runs, and on a held row the logged action came from no law with dither/);
      }
      expect(c.crossChecks.find((x) => x.method === 'modelRollouts')!.agreement, c.name).not.toBe('notApplicable');
    }
  });

  it('keeps the finding serious, says where the law was fitted, in the --json summary too', () => {
    const finding = a.warnings.filter((w) => w.topic === 'heldActions');
    expect(finding).toHaveLength(1);
    expect(finding[0].severity).toBe('serious');
    expect(finding[0].message).toContain('rows not held; fitted Q-evaluation still uses every row.');
    expect(a.heldActions).toMatchObject({ lawFittedOn: 'movingRows', rowsUsed: expect.any(Number) });
  });
});
