/**
 * Do the runs left out resolve the whole log's change (src/core/diagnostics/runsLeftOutReading.ts)? The
 * cases review39 found: a second coefficient that drifts while the lead steps (a setpoint moved while a pump
 * wore), a step not clear enough to cut at, and runs kept only before the change. Constructed findings; the
 * rule itself is stated in the file and in /work/notes/memory38-rule.md and clearstep38-rule.md.
 */
import { describe, expect, it } from 'vitest';
import type { CoefficientTrend, RunOrderResult } from '../../../src/core/diagnostics/runOrder';
import { readRunsLeftOut } from '../../../src/core/diagnostics/runsLeftOutReading';

const trend = (over: Partial<CoefficientTrend>): CoefficientTrend => ({
  block: 'law', output: 0, input: 0, runs: 100, rho: 0.9, z: 9, p: 1e-12, early: 0.1, late: 0.3, change: { kind: 'step', run: 50, clear: true }, ...over,
});
const result = (trends: CoefficientTrend[]): RunOrderResult => ({ runs: 100, lawSkipped: 0, modelSkipped: 0, trends, firstRows: [] });
const from = (first: number) => (p: number) => p >= first;

describe('runs left out against the whole log’s change', () => {
  it('a clear step with every run kept after it is resolved', () => {
    expect(readRunsLeftOut(result([trend({})]), from(50)).kind).toBe('resolved');
    expect(readRunsLeftOut(result([trend({})]), from(60)).kind).toBe('resolved');
  });

  it('runs kept before the step: the change stands (spanning it, or all before it)', () => {
    expect(readRunsLeftOut(result([trend({})]), from(30))).toMatchObject({ kind: 'stands', why: 'spans-step' });
    expect(readRunsLeftOut(result([trend({})]), (p) => p < 40)).toMatchObject({ kind: 'stands', why: 'before-step' });
  });

  it('a second shown coefficient that drifts keeps the finding, whatever the lead’s step', () => {
    const wear = trend({ block: 'model', input: 1, z: 6, change: { kind: 'drift', run: 30, clear: false } });
    expect(readRunsLeftOut(result([trend({}), wear]), from(50))).toMatchObject({ kind: 'stands', why: 'drift' });
  });

  it('a lead step not clear enough to cut at keeps the finding', () => {
    expect(readRunsLeftOut(result([trend({ change: { kind: 'step', run: 50, clear: false } })]), from(50))).toMatchObject({ kind: 'stands', why: 'unclear' });
  });

  it('a second shown step after the first run kept keeps the finding; one before it does not', () => {
    const later = trend({ input: -1, z: 5, change: { kind: 'step', run: 70, clear: false } });
    const earlier = trend({ input: -1, z: 5, change: { kind: 'step', run: 48, clear: false } });
    expect(readRunsLeftOut(result([trend({}), later]), from(50))).toMatchObject({ kind: 'stands', why: 'spans-step' });
    expect(readRunsLeftOut(result([trend({}), earlier]), from(50)).kind).toBe('resolved');
  });
});
