/**
 * A truncated policy whose mean lies dozens of dithers outside its limits at a state the simulated
 * plant reaches cannot have its actions drawn there (rejection from the untruncated normal: the
 * band's probability Φ(−k) is below 1e−4 of the 10,000 draws' reach already at k ≈ 4.3). The rollout
 * check then says so for that policy — naming the state, the mean and the limits — instead of stopping
 * the whole assessment (found by the screen review's polish helper on the tank-levels sample).
 * An invented policy on the tank-levels sample's log.
 */
import { describe, expect, it } from 'vitest';
import { createGaussianPolicy, PolicyError, sampleAction } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import { rolloutJob } from '../../src/pipeline/assessRollouts';
import { rolloutValues } from '../../src/pipeline/rolloutValues';
import { sampleRun } from '../support/sampleRun';

const farOutside = () => createGaussianPolicy({ offset: [500], gain: [[0, 0]], std: [0.01], bounds: { lo: [0], hi: [100], mode: 'truncate' } }, 2);

describe('actions that cannot be drawn', () => {
  it('are named with the state, the mean and the limits', () => {
    const out = new Float64Array(1);
    expect(() => sampleAction(farOutside(), [1.2, 0.8], createRandom(1), out)).toThrow(PolicyError);
    // (500 − 100)/0.01 = 40,000 dithers past the upper limit (worked by hand).
    expect(() => sampleAction(farOutside(), [1.2, 0.8], createRandom(1), out)).toThrow('at the state (1.2, 0.8) the truncated action distribution has almost no mass inside its limits: the mean (500) lies 40000 dithers outside them, so no action within 0 … 100 could be drawn in 10,000 tries');
  });

  it('say where the mean lies as measured: inside limits far narrower than the dither, not \'many dithers outside\'', () => {
    // Limits 0 … 1e−6 around a mean of 5e−7 with a dither of 1: Φ(5e−7) − Φ(−5e−7) ≈ 4e−7 of the mass inside.
    const narrow = createGaussianPolicy({ offset: [5e-7], gain: [[0, 0]], std: [1], bounds: { lo: [0], hi: [1e-6], mode: 'truncate' } }, 2);
    const out = new Float64Array(1);
    expect(() => sampleAction(narrow, [0, 0], createRandom(1), out)).toThrow('the mean (5e-7) lies within a dither of them, but they are narrow beside the dither (1), so no action within 0 … 0.000001 could be drawn in 10,000 tries');
  });

  it('leave the rollout check of that policy with a reason, and the other policies\' checks as they were', async () => {
    const { run, settings } = await sampleRun('tank-levels');
    const context = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const job = rolloutJob(context, [run.models[0].policy, farOutside()], { ...settings, resamples: 4, seed: 4 });
    const [usual, undrawable] = rolloutValues(job);
    expect('reason' in usual).toBe(false);
    expect('reason' in undrawable && undrawable.reason).toMatch(/^the simulated plant reaches a state where the policy’s actions cannot be drawn \(at the state \(/);
    const alone = rolloutValues(rolloutJob(context, [run.models[0].policy], { ...settings, resamples: 4, seed: 4 }));
    expect(alone[0]).toEqual(usual);
    run.dispose();
  });
});
