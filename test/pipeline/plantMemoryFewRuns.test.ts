/**
 * The plant-memory check needs runs of 9 rows or more, not 10 runs: it reads one run as well as many.
 * On a log of fewer than 10 runs the assessment (intervals, cross-checks, diagnostics) is not computed,
 * while the command line and the app still print each candidate's J; the plant-memory finding must not
 * be lost with the rest. Data: the battery's dead-time vessel (test/battery/deadTimePlant.ts; invented),
 * a dead time of 3 samples (serious on 100 runs, plantMemoryGate.test.ts), here marked as one run.
 */
import { describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { deadTimeLog, deadTimeProject } from '../battery/deadTimePlant';

describe('plant memory on a log of one run', () => {
  it('is reported even where the assessment cannot resample runs', async () => {
    const project = deadTimeProject();
    const logged = deadTimeLog(3, 20, 7).logged;
    // one run (the 20 simulated runs end to end; the check's chain rule skips the joins)
    const dataset = { ...logged, episode: new Int32Array(logged.count), episodeCount: 1, startStates: logged.startStates.slice(0, logged.stateDim), startEpisode: Int32Array.of(0) };
    const result = await assessProject({ project, dataset, settings: { resamples: 40, level: 0.9, seed: 2, sensitivity: false } });
    const said = result.ok ? result.value.warnings.map((w) => w.message).join(' ') : result.problems.map((p) => p.message).join(' ');
    expect(said).toMatch(/plant’s memory/);
  }, 120_000);
});
