/**
 * The rollout check's simulations (src/pipeline/rolloutValues.ts) form the one-step plant model's
 * refits on its resamples once for every policy (the regressions do not depend on the policy).
 * Checked against the direct route (fitPolynomialModel on the same multiplicities, then
 * modelRolloutValue) for each policy, and that the job sent to a thread (feature maps as specs,
 * rebuilt there) gives the very same numbers.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { modelRolloutValue } from '../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { rolloutJob, rolloutModel } from '../../src/pipeline/assessRollouts';
import { assessmentSettingsFor } from '../../src/pipeline/assessSettings';
import { receiveRolloutJob, rolloutValues, sendRolloutJob } from '../../src/pipeline/rolloutValues';
import { openProject } from '../../src/pipeline/openProject';
import { startRun } from '../../src/pipeline/projectRun';

describe('the rollout model’s resample fits', () => {
  it('equal a direct refit and rollout on the same resample, for every policy, and the same after crossing to a thread', async () => {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
    const opened = await openProject(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const run = await startRun(opened.value.project, opened.value.dataset), settings = assessmentSettingsFor(opened.value.project);
    if (!run.ok || !settings.ok) throw new Error('setup failed');
    const context = { plan: run.value.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const model = rolloutModel(context);
    if ('reason' in model) throw new Error(model.reason);
    const policies = [...run.value.models, ...(run.value.presentController ? [run.value.presentController] : [])].map((m) => m.policy);
    const job = rolloutJob(context, policies, model.regressions, { ...settings.value, resamples: 3, seed: 4 });
    const values = rolloutValues(job), crossed = rolloutValues(receiveRolloutJob(structuredClone(sendRolloutJob(job))));
    expect(values.length).toBe(policies.length);
    expect(crossed).toEqual(values);
    const e = run.value.plan.episodes.episodes;
    values.forEach((v, k) => {
      if ('reason' in v) throw new Error(v.reason);
      expect(v.full).toEqual(modelRolloutValue(model.fit, job.policies[k], job.discount, job.startStates, job.rollout));
      for (const b of [0, 2]) {
        const c = episodeMultiplicities(e, 4, b);
        expect(v.resampled[b]).toBe(modelRolloutValue(fitPolynomialModel(model.regressions, c), job.policies[k], job.discount, job.startStates, job.rollout).value);
      }
    });
    run.value.dispose();
  });
});
