/**
 * The rollout check's simulations (src/pipeline/rolloutValues.ts) form the one-step plant model's
 * refits on its resamples once for every policy (the regressions do not depend on the policy).
 * Checked against the direct route (the regressions formed from the plan's data, fitPolynomialModel
 * on the same multiplicities, then modelRolloutValue) for each policy, and that the job as a thread
 * receives it (a structured clone: the columns copied, the model formed there) gives the very same numbers.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { modelRolloutValue } from '../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, polynomialModelRegressions } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { rolloutJob, rolloutModelOptions } from '../../src/pipeline/assessRollouts';
import { rolloutValues } from '../../src/pipeline/rolloutValues';
import { sampleRun } from '../support/sampleRun';

describe('the rollout model’s resample fits', () => {
  it('equal a direct refit and rollout on the same resample, for every policy, and the same after crossing to a thread', async () => {
    const { run, settings } = await sampleRun('tank-levels');
    const context = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const { data, episodes } = run.plan, regressions = polynomialModelRegressions(data, episodes, rolloutModelOptions(data)), full = fitPolynomialModel(regressions);
    const policies = [...run.models, ...(run.presentController ? [run.presentController] : [])].map((m) => m.policy);
    const job = rolloutJob(context, policies, { ...settings, resamples: 6, seed: 4 });
    const values = rolloutValues(job), crossed = rolloutValues(structuredClone(job));
    expect(values.length).toBe(policies.length);
    expect(crossed).toEqual(values);
    const e = run.plan.episodes.episodes;
    values.forEach((v, k) => {
      if ('reason' in v) throw new Error(v.reason);
      expect(v.full).toEqual(modelRolloutValue(full, job.policies[k], job.discount, job.startStates, job.rollout));
      for (const b of [0, 2, 5]) {
        const c = episodeMultiplicities(e, 4, b);
        expect(v.resampled[b]).toBe(modelRolloutValue(fitPolynomialModel(regressions, c), job.policies[k], job.discount, job.startStates, job.rollout).value);
      }
    });
    run.dispose();
  });
});
