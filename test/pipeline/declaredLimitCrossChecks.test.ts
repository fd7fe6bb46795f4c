/**
 * Importance sampling on a log whose valve reaches its end on one row of 10,000: the hold-out batch
 * kettle (test/battery/holdout/kettlePlant.ts), 10,000 transitions, seed 3, runs logged from wide
 * charges. Both candidates clip the steam valve at [0, 1], so each has a point mass at 1; below the
 * 0.1 % floor the present controller's model had none there, the importance ratio did not exist on
 * that row (Billingsley, "Probability and Measure", §32: a point mass of π needs one of b) and both
 * importance-sampling checks read "not applicable" for the whole log. With the declared-bound rule
 * (src/core/loggedActionLimits.ts) they apply. Outside facts: that rule of measure theory, and the
 * plant's truth by seeded rollouts over the logged charges (test/battery/rolloutTruth.ts, with its
 * standard error): a check may not call a range that holds the truth wrong.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { LIMIT_SHARE, loggedLimitRuleText } from '../../src/core/loggedActionLimits';
import type { TransitionSet } from '../../src/core/transitions';
import type { Assessment } from '../../src/pipeline/assessment';
import { assessedProject } from '../support/assessedProject';
import { plantProject } from '../support/plantProject';
import { planEvaluation } from '../../src/pipeline/plan/evaluationPlan';
import { kettleDynamics, kettlePlant } from '../battery/holdout/kettlePlant';
import { rolloutTruth } from '../battery/rolloutTruth';

const plant = kettlePlant();

function kettleProject(withBounds = true) {
  return plantProject(plant, 'kettle', plant.candidates.map((c) => {
    const { bounds, ...rest } = c.spec;
    return { name: c.name, ...rest, ...(withBounds && bounds ? { bounds: { lo: Array.from(bounds.lo), hi: Array.from(bounds.hi), mode: bounds.mode } } : {}) };
  }));
}

describe('importance sampling on a valve at its declared end on one row of 10,000', () => {
  let data: TransitionSet, a: Assessment;
  beforeAll(async () => {
    data = plant.simulate({ transitions: 10_000, seed: 3, runStarts: 'wide' });
    a = await assessedProject({ project: kettleProject(), dataset: data, settings: { resamples: 20, level: 0.9, seed: 3, sensitivity: false } });
  }, 300_000);

  it('reads the valve end as a limit of the present controller only because the candidates declare it', () => {
    const atEnd = data.actions.reduce((k, v) => k + (v === 1 ? 1 : 0), 0);
    expect(atEnd).toBe(1);
    expect(atEnd).toBeLessThan(LIMIT_SHARE * data.count); // below the floor: the old rule saw no limit
    const plan = planEvaluation(kettleProject(), data), bare = planEvaluation(kettleProject(false), data);
    if (!plan.ok || !bare.ok) throw new Error('the kettle project should plan');
    expect(plan.value.presentController.fitted!.limits.hi).toEqual([1]);
    expect(plan.value.presentController.fitted!.limits.evidence.hi).toEqual(['declared']);
    expect(bare.value.presentController.fitted!.limits.hi).toEqual([Infinity]);
  });

  it('applies both importance-sampling checks, neither calling a range that holds the rollout truth wrong', () => {
    const starts = { name: 'charges', description: 'logged charges', states: data.startStates, count: data.startStates.length / 2 };
    for (const c of a.candidates) {
      const spec = plant.candidates.find((k) => k.name === c.name)!.spec;
      const truth = rolloutTruth(kettleDynamics, spec, plant.discount, starts, { rolloutsPerStart: 20, seed: 7 });
      const [lo, hi] = c.reportedRange!;
      const holds = lo - 2 * truth.standardError <= truth.value && truth.value <= hi + 2 * truth.standardError;
      for (const method of ['weightedImportanceSampling', 'weightedDoublyRobust'] as const) {
        const check = c.crossChecks.find((x) => x.method === method)!;
        expect(check.agreement, `${c.name} ${method}: ${check.note}`).not.toBe('notApplicable');
        if (holds) expect(check.agreement, `${c.name} ${method}: ${check.note}`).not.toBe('disagrees');
      }
    }
  });

  it('names the rule in the method text and in the assumption of importance sampling', () => {
    expect(a.method.join(' ')).toContain(loggedLimitRuleText());
    const assumption = a.candidates[0].crossChecks.find((x) => x.method === 'weightedImportanceSampling')!.assumption;
    expect(assumption).toContain('an extreme exactly at a bound a candidate declares');
  });
});
