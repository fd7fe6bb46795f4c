/**
 * The logged return completed past time limits gets a row of its own only where the value past the
 * runs' ends weighs enough to be said (core/loggedReturn.ts truncationMatters: the mean missing
 * weight γ^T above TRUNCATION_NOTICE, the same rule as the sentence on runs cut short). Below it the
 * two rows printed the same number (a greenhouse log of 500-step runs at γ 0.95: −21.64 twice), and
 * one row says it. The weights are the finite geometric series' tail γ^T (common practice). Invented
 * numbers.
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import { formatAssessment } from '../../src/cli/assessmentFormat';
import { loggedDiscountedReturn, TRUNCATION_NOTICE, truncationMatters } from '../../src/core/loggedReturn';
import type { Assessment } from '../../src/pipeline/assessment';
import type { Evaluation } from '../../src/pipeline/estimates';
import type { TransitionSet } from '../../src/core/transitions';

/** Runs of the given lengths, each ending on a time limit (no terminal row). */
function runs(lengths: number[]): TransitionSet {
  const n = lengths.reduce((a, b) => a + b, 0), episode = new Int32Array(n);
  let i = 0;
  lengths.forEach((len, k) => { for (let t = 0; t < len; t++) episode[i++] = k; });
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['x'], actionNames: ['u'], states: new Float64Array(n), actions: new Float64Array(n),
    rewards: new Float64Array(n).fill(-1), nextStates: new Float64Array(n), terminal: new Uint8Array(n), episode, episodeCount: lengths.length,
    startStates: new Float64Array(lengths.length), sourceLine: new Int32Array(n),
  };
}

const estimate = { status: 'converged', policyValue: -21.64, standardError: 0.21, fixedPointValue: null, iterations: 18, message: '', network: null, backend: 'cpu' };
function evaluationWith(meanTruncationWeight: number): Evaluation {
  return {
    project: 'invented bay', valueSense: 'reward', warnings: [], cautions: [], presentControllerReason: '',
    settings: { discount: 0.95, transitions: 1000, episodes: 2, startStates: 2, approximator: 'linear', quadratureNodes: 7, seed: 1 },
    policies: [{ ...estimate, name: 'firmer' }],
    presentController: {
      estimate: { ...estimate, name: 'present controller' },
      model: { offset: [6.4], gain: [[-0.3]], std: [0.15], lo: [null], hi: [null] },
      completedReturn: { value: -21.64, standardError: 0.54, tailShare: meanTruncationWeight },
    },
    behaviour: { value: -21.64, standardError: 0.54, episodes: 2, meanTruncationWeight, largestTruncationWeight: meanTruncationWeight },
  } as unknown as Evaluation;
}
const assessment = {
  settings: { level: 0.9 }, candidates: [], warnings: [],
  presentController: { name: 'present controller', policyValue: { value: -22.13, standardError: 0.33, percentile: [-22.78, -21.53], basic: null }, completedReturn: { value: -21.64, standardError: 0.55, percentile: [-22.61, -20.82], basic: null }, crossChecks: [], confirmation: { status: 'unconfirmed', text: '' }, occupancyShift: null },
  behaviour: { value: -21.64, standardError: 0.55, percentile: [-22.61, -20.82], basic: null },
  comparison: { differences: [], baseline: { name: 'present controller' }, ranking: { order: ['present controller'], frequency: null } }, sensitivity: null, plantMemory: null,
} as unknown as Assessment;

const rowsNamed = (text: string) => text.split('\n').filter((l) => l.trim().startsWith('logged return')).map((l) => l.trim().split(/\s{3,}/)[0]);

describe('the completed logged return is a row of its own only where completing it can matter', () => {
  it('decides by the mean missing weight γ^T, the truncation sentence’s own rule', () => {
    // 500-step runs at γ 0.95: 0.95^500 ≈ 7.3 × 10⁻¹², nothing to complete; 20-step runs: 0.95^20 ≈ 0.358.
    const long = loggedDiscountedReturn(runs([500, 500]), 0.95), short = loggedDiscountedReturn(runs([20, 20]), 0.95);
    expect(long.meanTruncationWeight).toBeCloseTo(0.95 ** 500, 20);
    expect(truncationMatters(long)).toBe(false);
    expect(truncationMatters(short)).toBe(true);
    expect(truncationMatters({ meanTruncationWeight: TRUNCATION_NOTICE })).toBe(false);
    expect(truncationMatters({ meanTruncationWeight: 2 * TRUNCATION_NOTICE })).toBe(true);
  });

  it('prints one logged-return row where the ends weigh nothing, two where they weigh enough (both CLI tables)', () => {
    // Before: "logged return, completed past time limits (check)" and "logged return (check; cut short at time limits)", both −21.64.
    expect(rowsNamed(formatEvaluation(evaluationWith(7.3e-12), 'bay.spcritic'))).toEqual(['logged return (check)']);
    expect(rowsNamed(formatEvaluation(evaluationWith(0.358), 'bay.spcritic'))).toEqual(['logged return, completed past time limits (check)', 'logged return (check; cut short at time limits)']);
    expect(rowsNamed(formatAssessment(assessment, false))).toEqual(['logged return (check)']);
    expect(rowsNamed(formatAssessment(assessment, true))).toEqual(['logged return (check; cut short at time limits)', 'logged return, completed past time limits (check)']);
  });
});
