/**
 * The time-remaining estimate on a geometric convergence w_k = w_0·ρ^k, whose iteration count to a
 * tolerance has the closed form k* = ln(tol / w_0) / ln ρ (common practice for linearly
 * convergent iterations), at a constant time per iteration.
 */
import { describe, expect, it } from 'vitest';
import { iterationsRemaining, timeRemainingMs } from '../../../src/renderer/src/screens/run/timeRemaining';
import type { RunProgress } from '../../../src/shared/workerMessages';

const RHO = 0.95, W0 = 1, TOL = 1e-10, MS_PER_ITERATION = 2;

function report(k: number, candidateIndex = 0, candidateCount = 1, startMs = 0): RunProgress {
  return {
    candidate: `c${candidateIndex}`, candidateIndex, candidateCount, elapsedMs: startMs + k * MS_PER_ITERATION,
    iteration: k === 0 ? null : { iteration: k, weightChange: W0 * RHO ** k, bellmanResidual: 1, policyValue: null, loss: null },
    maxIterations: 5000, tolerance: TOL, outerIterations: null, dataPass: null,
  };
}

describe('time remaining', () => {
  const kStar = Math.log(TOL / W0) / Math.log(RHO); // ≈ 448.9

  it('extrapolates the iterations to the tolerance from the last two reports', () => {
    expect(iterationsRemaining([report(0), report(50), report(100)])).toBe(Math.ceil(kStar - 100));
  });

  it('is capped by the iteration limit and falls back to it without a trend', () => {
    const flat = { ...report(100), iteration: { ...report(100).iteration!, weightChange: 1 } };
    expect(iterationsRemaining([{ ...report(50), iteration: { ...report(50).iteration!, weightChange: 1 } }, flat])).toBe(4900);
  });

  it('counts the later candidates as taking as long as the current one', () => {
    const reports = [report(0, 0, 2), report(50, 0, 2), report(100, 0, 2)];
    const current = Math.ceil(kStar - 100) * MS_PER_ITERATION;
    const total = 100 * MS_PER_ITERATION + current;
    expect(timeRemainingMs(reports, [0])).toBeCloseTo(current + total, 6);
  });

  it('counts down the outer iterations of a network fit', () => {
    const r: RunProgress = { ...report(10), maxIterations: null, tolerance: null, outerIterations: 40 };
    expect(iterationsRemaining([r])).toBe(30);
  });
});
