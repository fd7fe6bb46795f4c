/**
 * The comparison's baseline is the present controller's model only when its fit converged: a fit
 * stopped at its iteration limit has no value to compare (src/core/fqe/fitStatus.ts), as a
 * candidate's has not (comparison() leaves those out). Before, its resamples were paired all the
 * same — a linear fit's exact resamples iterate from the unconverged weights, a network's last layer
 * is re-solved on its unconverged features — so a candidate could be named for a trial on a
 * difference from a number the fit had not settled.
 *
 * Invented numbers: the replicates are chosen so the difference lies far from 0 (the rule under test
 * is which differences get an interval, not the interval's arithmetic, which assessIntervals' own tests cover).
 */
import { describe, expect, it } from 'vitest';
import { comparison } from '../../src/pipeline/assessAssembly';
import type { CandidateWork } from '../../src/pipeline/assessCandidate';
import type { ReplicateSet } from '../../src/pipeline/assessResamples';
import type { EvaluationPlan } from '../../src/pipeline/plan/evaluationPlan';
import type { FitStatus } from '../../src/core/fqe/fitStatus';

const work = (name: string, policyValue: number, status: FitStatus) => ({ model: { name, fit: { policyValue, status } } }) as unknown as CandidateWork;
const spread = (centre: number) => Array.from({ length: 50 }, (_, b) => centre + 0.01 * (b - 25));
const plan = { sign: 1, loggedReturn: { value: -30 } } as unknown as EvaluationPlan;
const replicates = (): ReplicateSet => ({
  loggedReturn: spread(-30),
  candidates: [{ fqe: spread(-10), importanceSampling: null, doublyRobust: null, model: null, classes: [], network: null }],
  presentController: { fqe: spread(-20), importanceSampling: null, doublyRobust: null, model: null, classes: [], network: null },
  completedReturn: [], threads: '',
}) as unknown as ReplicateSet;

describe('the comparison with a present controller whose fit did not converge', () => {
  it('with a converged present controller, the candidate’s difference has an interval wholly above 0 (the control case)', () => {
    const c = comparison(plan, replicates(), [work('tuned', -10, 'converged')], work('today', -20, 'converged'), 0.9);
    expect(c.differences[0].difference.percentile![0]).toBeGreaterThan(0);
  });

  it.each(['maxIterations', 'diverged'] as const)('present controller %s: no difference from it has an interval, and the note says why', (status) => {
    const c = comparison(plan, replicates(), [work('tuned', -10, 'converged')], work('today', -20, status), 0.9);
    expect(c.baseline.name).toBe('today');
    expect(c.differences[0].difference.percentile).toBeNull();
    expect(c.differences[0].probabilityBetter).toBeNull();
    expect(c.baseline.note).toMatch(/did not converge/);
  });
});

describe('paired replicates against an estimate that was not resampled', () => {
  it('are missing, not NaN: “better in” has no share rather than 0 % (a share of NaN differences)', async () => {
    const { pairedDifference, pairedReplicates } = await import('../../src/pipeline/assessIntervals');
    expect(pairedReplicates([1, 2, null], [])).toEqual([null, null, null]);
    const d = pairedDifference({ name: 'a', point: 1, replicates: spread(1) }, { name: 'b', point: 0, replicates: [] }, 0.9, 1);
    expect(d.probabilityBetter).toBeNull();
    expect(d.difference.percentile).toBeNull();
  });

  it('leave the ranking without a frequency rather than “the order holds in 0 %”', async () => {
    const { ranking } = await import('../../src/pipeline/assessIntervals');
    const r = ranking([{ name: 'a', point: 1, replicates: spread(1) }, { name: 'b', point: 0, replicates: [] }]);
    expect(r.frequency).toBeNull();
    expect(r.neighbours[0].frequency).toBeNull();
  });
});
