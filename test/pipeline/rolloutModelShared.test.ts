/**
 * The rollout check's refits of the one-step plant model on its resamples are formed once and
 * shared by every candidate and the present controller (assessRollouts.ts): the regressions do not
 * depend on the policy. Checked against the direct refit (fitPolynomialModel on the same
 * multiplicities), and that a second caller gets the very same fit.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { fitPolynomialModel } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { rolloutModel } from '../../src/pipeline/assessRollouts';
import { openProject } from '../../src/pipeline/openProject';
import { startRun } from '../../src/pipeline/projectRun';

describe('the rollout model’s resample fits', () => {
  it('equal a direct refit on the same resample and are formed once for every caller', async () => {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
    const opened = await openProject(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const run = await startRun(opened.value.project, opened.value.dataset);
    if (!run.ok) throw new Error(run.problems.map((p) => p.message).join('\n'));
    const context = { plan: run.value.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const model = rolloutModel(context);
    if ('reason' in model) throw new Error(model.reason);
    const e = run.value.plan.episodes.episodes;
    for (const b of [0, 1, 7]) {
      const c = episodeMultiplicities(e, 4, b), shared = model.resampleFit(4, b, c);
      expect(shared).toEqual(fitPolynomialModel(model.regressions, c));
      expect(model.resampleFit(4, b, episodeMultiplicities(e, 4, b))).toBe(shared);
    }
    run.value.dispose();
  });
});
