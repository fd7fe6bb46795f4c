/**
 * The present controller (the baseline) fitted in the compared function classes as a candidate is
 * (assessProject.ts workInClasses, assessAssembly.ts reportedClasses, baselineClassWarning.ts):
 *   - on a linear-quadratic log its classes agree, the verdict is settled, no whole-log caution is
 *     raised, and every class's J and the range to report sit on the exact value of the logging
 *     controller from the logged starts (closed form by the discrete Lyapunov equation: Bertsekas,
 *     "Dynamic Programming and Optimal Control", Vol. I, §4.1): each class within the 1 % the present
 *     controller's fitted model is allowed in test/pipeline/assessEvidence.test.ts (its gain and dither
 *     are estimated from the log, so its J is not the logging controller's exactly), the range holding it;
 *   - a later policy's class fits borrow an earlier policy's policy-free sums (ClassFits) and give the
 *     same statistics and J to the last bit as fitted alone, on both routes that lend (per-episode sums
 *     for exact resamples, and the whole-data total);
 *   - the whole-log caution where it is not settled: a caution, no candidate, the class verdict's own
 *     words (notSettledMessage) and the reading of the differences. Invented numbers for the wiring.
 */
import { describe, expect, it } from 'vitest';
import type { FunctionClassAssessment } from '../../src/pipeline/assessment';
import { assessProject } from '../../src/pipeline/assessProject';
import { notSettledMessage } from '../../src/pipeline/assessClassRange';
import { BASELINE_NOT_SETTLED_TOPIC, BASELINE_RANGE_READING, baselineClassWarnings } from '../../src/pipeline/baselineClassWarning';
import { buildLinearModelsPaced } from '../../src/pipeline/model/linearModel';
import type { LinearFitSpec } from '../../src/pipeline/model/candidateModel';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';
import { PRESENT_CONTROLLER_NAME } from '../../src/pipeline/plan/presentController';
import { projectSchema } from '../../src/project/schema';
import { exactPolicyValue, simulateLog } from '../core/linearGaussianPlant';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from '../core/testPlants';
import { linearProjectFor } from './linearProjectFor';

describe('the present controller in the compared function classes', () => {
  it('is settled on a linear-quadratic log, its classes and range on the exact Lyapunov value', async () => {
    const discount = 0.97, [, steady] = startLaws(cascadePlant, cascadeLogging)[0];
    const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 300, steps: 100, seed: 41, start: steady });
    const offset = Object.fromEntries(candidateFamily(cascadeLogging))['offset 2σ'];
    const result = await assessProject({
      project: linearProjectFor(data, discount, [{ name: 'offset 2σ', offset: offset.offset, gain: [offset.gain.slice(0, 3)], std: offset.std }], 'baseline classes'),
      dataset: data, settings: { resamples: 200, level: 0.9, seed: 7, sensitivity: false },
    });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    const pc = result.value.presentController!, exact = exactPolicyValue(cascadePlant, cascadeLogging, discount, data.startStates);
    const classes = pc.functionClasses!;
    console.info(`cascade baseline: exact ${exact.toFixed(3)}, range ${JSON.stringify(pc.reportedRange)}; ${classes.classes.map((k) => `${k.label} ${k.value.toFixed(3)}`).join('; ')}; ${classes.reason}`);
    expect(classes.classes.map((k) => k.label)).toEqual(['polynomial, degree 2', 'polynomial, degree 3', 'polynomial, degree 4']);
    expect(pc.settled).toBe(true);
    for (const k of classes.classes) expect(Math.abs(k.value / exact - 1)).toBeLessThan(0.01);
    const [lo, hi] = pc.reportedRange!;
    expect(lo).toBeLessThanOrEqual(exact);
    expect(hi).toBeGreaterThanOrEqual(exact);
    expect(result.value.warnings.filter((w) => w.topic === BASELINE_NOT_SETTLED_TOPIC)).toEqual([]);
  }, 120_000);
});

describe('class fits of a later policy borrowing an earlier one’s policy-free sums', () => {
  // Few long runs: degree 4's per-episode sums fit the exact-resample budget; many short runs: only the whole-data total is formed.
  for (const [route, episodes, steps] of [['exact', 40, 50], ['whole', 2400, 3]] as const) {
    it(`give the same statistics and J to the last bit (${route} route)`, async () => {
      const dataset = simulateLinearPlant({
        dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
        behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes, stepsPerEpisode: steps, seed: 8,
      });
      const project = projectSchema.parse({
        format: 'setpoint-critic-project', version: 1, name: 'lent sums', data: { path: 'none.csv' },
        columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
        discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
        candidates: [{ name: 'trimmed', offset: [0], gain: [[-0.4, -0.1]], std: [0.4] }, { name: 'wider', offset: [0.1], gain: [[-0.2, -0.1]], std: [0.6] }],
      });
      const plan = planEvaluation(project, dataset);
      if (!plan.ok) throw new Error('plan');
      const p = plan.value, settings = { ridge: 1e-6, tolerance: 1e-8, maxIterations: 500 };
      const specs: LinearFitSpec[] = [4, 3].map((degree) => ({ features: featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree }, ...settings }, p.data), ...settings }));
      const models = (outcomes: Awaited<ReturnType<typeof buildLinearModelsPaced>>) => outcomes.map((o) => {
        if ('error' in o) throw o.error;
        return o.model;
      });
      const lenders = models(await buildLinearModelsPaced(p, p.candidates[0], {}, specs));
      const lent = models(await buildLinearModelsPaced(p, p.candidates[1], {}, specs, [], lenders));
      const alone = models(await buildLinearModelsPaced(p, p.candidates[1], {}, specs));
      expect(lent[0].linear!.resampling.kind).toBe(route === 'exact' ? 'exact' : 'linearised');
      for (let c = 0; c < specs.length; c++) {
        expect(lent[c].linear!.statistics).toEqual(alone[c].linear!.statistics);
        expect(lent[c].linear!.resampling).toEqual(alone[c].linear!.resampling);
        expect(lent[c].fit.policyValue).toBe(alone[c].fit.policyValue);
      }
    }, 120_000);
  }
});

describe('the whole-log caution of a baseline not settled', () => {
  const classes = (settled: boolean): FunctionClassAssessment => ({
    classes: [{ label: 'polynomial, degree 2', value: -10, interval: [-11, -9], standardError: 0.6 }, { label: 'polynomial, degree 4', value: -13, interval: [-14, -12], standardError: 0.6 }],
    settled, range: [-14, -9], coverage: '', reason: settled ? 'Settled: invented.' : 'Not settled: invented gap.',
  });

  it('is one caution naming no candidate, in the class verdict’s words and the reading of the differences', () => {
    const present = { name: PRESENT_CONTROLLER_NAME, functionClasses: classes(false) };
    expect(baselineClassWarnings(present)).toEqual([{
      severity: 'caution', topic: BASELINE_NOT_SETTLED_TOPIC,
      message: `Present controller: ${notSettledMessage(classes(false))} ${BASELINE_RANGE_READING}`,
    }]);
  });

  it('is nothing where the baseline is settled, was not fitted in other classes, or is missing', () => {
    expect(baselineClassWarnings({ name: PRESENT_CONTROLLER_NAME, functionClasses: classes(true) })).toEqual([]);
    expect(baselineClassWarnings({ name: PRESENT_CONTROLLER_NAME, functionClasses: null })).toEqual([]);
    expect(baselineClassWarnings({ name: PRESENT_CONTROLLER_NAME })).toEqual([]);
    expect(baselineClassWarnings(null)).toEqual([]);
  });
});
