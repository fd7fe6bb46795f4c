/**
 * The rollout check's simulations (src/pipeline/rolloutValues.ts) form the one-step plant model's
 * refits on its resamples once for every policy (the regressions do not depend on the policy).
 * Checked against the direct route (the regressions formed from the plan's data, fitPolynomialModel
 * on the same multiplicities, then modelRolloutValue) for each policy, and that the job as a thread
 * receives it (a structured clone: the columns copied, the model formed there) gives the very same numbers.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { modelRolloutValue } from '../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, polynomialModelRegressions } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { rolloutJob, rolloutModelOptions } from '../../src/pipeline/assessRollouts';
import { assessmentSettingsFor } from '../../src/pipeline/assessSettings';
import { rolloutValues } from '../../src/pipeline/rolloutValues';
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
    const { data, episodes } = run.value.plan, regressions = polynomialModelRegressions(data, episodes, rolloutModelOptions(data)), full = fitPolynomialModel(regressions);
    const policies = [...run.value.models, ...(run.value.presentController ? [run.value.presentController] : [])].map((m) => m.policy);
    const job = rolloutJob(context, policies, { ...settings.value, resamples: 6, seed: 4 });
    const values = rolloutValues(job), crossed = rolloutValues(structuredClone(job));
    expect(values.length).toBe(policies.length);
    expect(crossed).toEqual(values);
    const e = run.value.plan.episodes.episodes;
    values.forEach((v, k) => {
      if ('reason' in v) throw new Error(v.reason);
      expect(v.full).toEqual(modelRolloutValue(full, job.policies[k], job.discount, job.startStates, job.rollout));
      for (const b of [0, 2, 5]) {
        const c = episodeMultiplicities(e, 4, b);
        expect(v.resampled[b]).toBe(modelRolloutValue(fitPolynomialModel(regressions, c), job.policies[k], job.discount, job.startStates, job.rollout).value);
      }
    });
    run.value.dispose();
  });
});
