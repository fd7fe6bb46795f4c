/**
 * The advice after a run-order change (src/core/diagnostics/runOrderChangeWords.ts): English ordinals
 * (common practice: 11th–13th whatever their last digit), and the runs named by label or by line.
 */
import { describe, expect, it } from 'vitest';
import type { CoefficientTrend } from '../../../src/core/diagnostics/runOrder';
import { changeAdvice, ordinal } from '../../../src/core/diagnostics/runOrderChangeWords';
import { runOrderFinding } from '../../../src/core/diagnostics/runOrderFinding';

const trend = (change: CoefficientTrend['change']): CoefficientTrend => ({ block: 'law', output: 0, input: 0, runs: 12, rho: 0.9, z: 3, p: 0.001, early: 0.1, late: 0.3, change });

describe('run-order change advice', () => {
  it('writes ordinals', () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 101, 111, 112, 1001].map(ordinal)).toEqual(
      ['1st', '2nd', '3rd', '4th', '11th', '12th', '13th', '21st', '22nd', '23rd', '101st', '111th', '112th', '1,001st']);
  });

  it('names a step’s runs by label, or by line where the log has no run column', () => {
    const labelled = changeAdvice(trend({ kind: 'step', run: 3, clear: true }), 'the gain', 12, (p) => ({ label: `R${p}`, line: 2 + 10 * p }));
    expect(labelled).toBe('The gain changed around run "R3" (the 4th of 12 in the data), in one step rather than a steady drift. ' +
      'To evaluate the runs since the change, leave out runs "R0" to "R2" (project field data.csv.excludedRuns; in the app, Plant log → Runs left out); ' +
      'that keeps 9 runs, too few for this check to read on their own (it needs 10), so log more runs under the present plant and controller before trusting a trial.');
    const lined = changeAdvice(trend({ kind: 'step', run: 1, clear: true }), 'the gain', 12, (p) => ({ label: null, line: 2 + 10 * p }));
    expect(lined).toContain('changed around the run from line 12 (the 2nd of 12');
    expect(lined).toContain('leave out the rows above line 12');
  });

  it('after a drift, names no runs to leave out: no part of the log is today’s plant, fresh logs after the cause is mended; nothing without a shape', () => {
    const drift = changeAdvice(trend({ kind: 'drift', run: 6, clear: false }), 'the gain', 12, (p) => ({ label: `R${p}`, line: 2 + 10 * p }));
    expect(drift).toContain('no part of the log describes the plant as it is now');
    expect(drift).toContain('Leaving out earlier runs narrows the gap but does not close it');
    expect(drift).toContain('about 11\u00a0% instead of 24\u00a0%');
    expect(drift).toContain('fresh logs, in a file of their own, taken after the cause (wear, fouling, an instrument) is found and mended');
    expect(drift).not.toMatch(/leave out runs|"R\d+"/);
    expect(changeAdvice(trend(null), 'the gain', 12, () => ({ label: null, line: 2 }))).toBeNull();
  });

  it('a step not clear enough to cut at (review39: a noisy drift often fits one step a little better than a line) advises no cut', () => {
    const unclear = changeAdvice(trend({ kind: 'step', run: 6, clear: false }), 'the gain', 40, (p) => ({ label: `R${p}`, line: 2 + 10 * p }));
    expect(unclear).toContain('not clearly enough to cut the log at');
    expect(unclear).not.toContain('leave out runs');
  });
});

describe('an offset alone', () => {
  const offset = (change: CoefficientTrend['change'], block: CoefficientTrend['block'] = 'law') => ({
    runs: 12, lawSkipped: 0, modelSkipped: 0, firstRows: [], trends: [{ ...trend(change), block, input: -1, p: 1e-9 }],
  });
  const names = { stateNames: ['level'], actionNames: ['valve'], runName: (p: number) => ({ label: `R${p}`, line: 2 + 10 * p }) };

  it('the law’s, in one step (a setpoint moved?): serious, located, with the runs since it (offset38)', () => {
    const finding = runOrderFinding(offset({ kind: 'step', run: 5, clear: true }), names);
    expect(finding?.severity).toBe('serious');
    expect(finding?.message).toContain('output level moved in one step');
    expect(finding?.message).toContain('changed around run "R5" (the 6th of 12 in the data)');
  });

  it('the plant model’s, in one step (a disturbance’s level?): a caution, located, with the runs since it', () => {
    const finding = runOrderFinding(offset({ kind: 'step', run: 5, clear: true }, 'model'), names);
    expect(finding?.severity).toBe('caution');
    expect(finding?.message).toContain('changed around run "R5" (the 6th of 12 in the data)');
  });

  it('that drifted (a slow disturbance?) is not cut again to its latest runs', () => {
    const finding = runOrderFinding(offset({ kind: 'drift', run: 5, clear: false }), names);
    expect(finding?.severity).toBe('caution');
    expect(finding?.message).not.toContain('latest third');
  });
});
