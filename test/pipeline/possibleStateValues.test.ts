/**
 * Impossible values state by state, in whole assessments of the hold-out surge drum
 * (test/battery/holdout/surgeDrumPlant.ts: rare, large feed upsets; every logged step costs), seed 1.
 * Outside facts: with every logged reward below 0, no policy's J nor its value at any state can be
 * above r_max/(1 − γ) < 0 (the geometric series; common practice); and the present controller's own
 * J is the mean discounted return of the logged runs (on-policy Monte Carlo; Sutton & Barto,
 * "Reinforcement Learning", 2nd ed., §5.1), so a candidate that is the present controller has a
 * known answer with its standard error.
 * - 'feedforward' (within the logged actions between upsets): the default linear fit puts J above 0,
 *   yet inside the old slack (1 % of a width set by one extreme step) and with an interval that
 *   still reaches a possible value; V̂ is above 0 on almost every logged state: the new rule fires.
 * - 'logged' (the present controller as a candidate): its truth lies within a few hundredths of a
 *   percent of the range's width from the upper end — a plant that costs almost nothing in most
 *   states — and its right estimate must not be called impossible (its V̂ passes the end on about
 *   15 % of the logged states, by a probe of the same log: the level of a right fit's wiggle there).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { possibleValues, outsidePossible, intervalOutsidePossible } from '../../src/core/diagnostics/possibleValues';
import { loggedDiscountedReturn } from '../../src/core/loggedReturn';
import type { TransitionSet } from '../../src/core/transitions';
import type { Assessment, CandidateAssessment } from '../../src/pipeline/assessment';
import { assessedProject } from '../support/assessedProject';
import { plantProject } from '../support/plantProject';
import { surgeDrumPlant } from '../battery/holdout/surgeDrumPlant';

const plant = surgeDrumPlant();

function drumProject() {
  const [feedforward] = plant.candidates;
  return plantProject(plant, 'surge drum', [{ name: 'feedforward', ...feedforward.spec }, { name: 'logged', ...plant.behaviour }]);
}

const impossible = (c: CandidateAssessment) => c.warnings.filter((w) => w.topic === 'impossibleValue');

describe('impossible values state by state on the surge drum', () => {
  let data: TransitionSet, a: Assessment;
  beforeAll(async () => {
    data = plant.simulate({ transitions: 100_000, seed: 1, runStarts: 'steady' });
    a = await assessedProject({ project: drumProject(), dataset: data, settings: { resamples: 100, level: 0.9, seed: 1, sensitivity: false } });
  }, 300_000);

  it('marks a positive J on a plant that only costs, which the check on J alone lets pass', () => {
    let best = -Infinity;
    for (let i = 0; i < data.count; i++) best = Math.max(best, data.rewards[i]);
    expect(best).toBeLessThan(0); // every logged step costs: no possible value is above best/(1 − γ) < 0
    const range = possibleValues(data.rewards, plant.discount), feedforward = a.candidates[0];
    expect(feedforward.policyValue.value).toBeGreaterThan(0); // impossible by the geometric series
    // The old rules do not see it: J is inside the slack (1 % of a width set by the most extreme step) and the interval reaches a possible value.
    expect(outsidePossible(feedforward.policyValue.value, range)).toBe(false);
    const [lo, hi] = feedforward.policyValue.percentile!;
    expect(intervalOutsidePossible(lo, hi, range)).toBe(false);
    const [finding] = impossible(feedforward);
    expect(finding).toMatchObject({ severity: 'serious', message: expect.stringMatching(/on most of the logged states.*above the possible range/) });
  });

  it('does not mark the present controller run as a candidate, a right estimate at the edge of the range', () => {
    const truth = loggedDiscountedReturn(data, plant.discount), range = possibleValues(data.rewards, plant.discount);
    expect(Math.abs(truth.value - range.upper) / (range.upper - range.lower)).toBeLessThan(0.001); // the truth is at the edge
    const logged = a.candidates[1], se = Math.hypot(logged.policyValue.standardError!, truth.standardError);
    expect(Math.abs(logged.policyValue.value - truth.value)).toBeLessThan(3 * se); // a right estimate
    expect(impossible(logged)).toEqual([]);
  });

  it('states the rules among the method statements, and says that a few runs carry the cost', () => {
    expect(a.method.some((m) => /at most of the logged states.*more than one standard error of J/.test(m))).toBe(true);
    expect(a.method.some((m) => /costliest 10\u00a0% of the runs/.test(m))).toBe(true);
    // The drum was defined so that the costliest tenth of the runs carry about half of the cost or more (surgeDrumPlant.ts); on seed 1, 50.4 %.
    expect(a.warnings.find((w) => w.topic === 'runConcentration')).toMatchObject({ severity: 'caution', message: expect.stringMatching(/25 costliest of the 250 logged runs carry 50\.4\u00a0% of the logged discounted cost/) });
  });
});
