/**
 * Where the plant-memory finding is serious, the checks that simulate a one-step model of the plant
 * (the model rollouts and the linear-quadratic closed form) are not applied: they assume the next state
 * depends on the present state and action only, exactly what the finding says the log contradicts, so
 * they would share the estimate's blind spot and could "confirm" a J the missing memory has moved. The
 * log is the battery's dead-time vessel (test/battery/deadTimePlant.ts: a linear-quadratic plant whose
 * valve acts d samples late, logged without the earlier valve positions); without the dead time the same
 * plant is Markov and the checks run. Importance sampling needs only the logged controller's action
 * probabilities, not a Markov state (per-decision importance sampling; Precup, Sutton & Singh 2000, from
 * memory), so it is not ruled out.
 */
import { describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import type { Assessment } from '../../src/pipeline/assessment';
import { MODEL_CHECKS_REASON } from '../../src/pipeline/plantMemoryCheck';
import { deadTimeLog, deadTimeProject } from '../battery/deadTimePlant';

async function assessed(delay: number): Promise<Assessment> {
  const result = await assessProject({ project: deadTimeProject(), dataset: deadTimeLog(delay, 100, 7).logged, settings: { resamples: 40, level: 0.9, seed: 2, sensitivity: false } });
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return result.value;
}

const modelChecks = (checks: Assessment['candidates'][number]['crossChecks']) =>
  checks.filter((c) => c.method === 'modelRollouts' || c.method === 'linearQuadraticModel');

describe('the checks that simulate a one-step plant model, beside the plant-memory finding', () => {
  it('are not applied where the finding is serious (a dead time of 3 samples), for the candidate and the present controller', async () => {
    const a = await assessed(3);
    expect(a.warnings.find((w) => w.topic === 'plantMemory')?.severity).toBe('serious');
    const rows = [a.candidates[0].crossChecks, a.presentController!.crossChecks];
    for (const checks of rows) {
      expect(modelChecks(checks)).toHaveLength(2);
      for (const c of modelChecks(checks)) expect(c).toMatchObject({ agreement: 'notApplicable', note: `Not applicable: ${MODEL_CHECKS_REASON}.` });
      expect(checks.filter((c) => c.note.includes(MODEL_CHECKS_REASON))).toHaveLength(2);
    }
  }, 120_000);

  it('run as before on the same plant without the dead time', async () => {
    const a = await assessed(0);
    expect(a.warnings.filter((w) => w.topic === 'plantMemory')).toEqual([]);
    for (const c of modelChecks(a.candidates[0].crossChecks)) expect(c.note).not.toContain(MODEL_CHECKS_REASON);
    expect(a.candidates[0].crossChecks.find((c) => c.method === 'modelRollouts')?.agreement).not.toBe('notApplicable');
  }, 120_000);
});
