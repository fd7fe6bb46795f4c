/**
 * The sensitivity sweep's extra data pass (a feature size no function class fitted) runs in slices
 * like every other pass (cancellation.ts): the assessment's pace is awaited between blocks, so a
 * stop request that arrives while it runs is heard before the pass ends. Here the pace itself
 * raises the stop, as a host's message would arrive during a yield.
 */
import { describe, expect, it } from 'vitest';
import { FqeCancelledError } from '../../src/core/fqe/fqeErrors';
import { candidateWork, type AssessmentContext } from '../../src/pipeline/assessCandidate';
import { sensitivity } from '../../src/pipeline/assessSensitivity';
import { sampleRun } from '../support/sampleRun';

async function heatingRun() {
  return (await sampleRun('heating-loop')).run;
}

describe('the sensitivity sweep’s refit pass', () => {
  it('awaits the pace between blocks and stops when a stop request arrives during it', async () => {
    const run = await heatingRun();
    let paced = 0, stopped = false;
    const base = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const counting: AssessmentContext = { ...base, pace: async () => { paced++; } };
    // No function classes fitted beside the project's degree 2: degrees 1 and 3 each take a data pass.
    const check = { level: 0.9, seed: 1, resamples: 200 };
    const { sensitivity: finished } = await sensitivity(counting, [candidateWork(counting, run.models[0])], -1, check);
    expect(finished.curves.map((c) => c.parameter)).toEqual(['discount', 'polynomialDegree']);
    expect(paced).toBeGreaterThan(0);
    const stopping: AssessmentContext = { ...base, cancel: () => stopped, pace: async () => { stopped = true; } };
    await expect(sensitivity(stopping, [candidateWork(stopping, run.models[0])], -1, check)).rejects.toThrow(FqeCancelledError);
    run.dispose();
  }, 600_000); // the sweep's paired check runs the iteration on every resample (assessSweepCheck.ts): minutes on a loaded machine, like the other sweep tests
});
