/** The exit status once results are printed (README, "Exit status"): 3 when any fit did not converge. */
import { describe, expect, it } from 'vitest';
import { EXIT, exitStatusOf } from '../../src/cli/exitStatus';
import type { Evaluation, PolicyEstimate } from '../../src/pipeline/estimates';

const withStatuses = (...statuses: PolicyEstimate['status'][]) => ({ policies: statuses.map((status) => ({ status })) }) as unknown as Evaluation;

describe('exit status', () => {
  it('is 0 only when every fit converged, 3 when one diverged or stopped at its limit', () => {
    expect(exitStatusOf(withStatuses('converged', 'converged'))).toBe(EXIT.ok);
    expect(exitStatusOf(withStatuses('converged', 'diverged'))).toBe(3);
    expect(exitStatusOf(withStatuses('maxIterations'))).toBe(3);
  });
  it('keeps the documented codes', () => {
    expect(EXIT).toEqual({ ok: 0, badInput: 1, usage: 2, notConverged: 3, cancelled: 130, outputClosed: 141, internal: 70 });
  });
});
