/**
 * Results kept in a project file by an earlier version must never crash the Findings panels: an
 * evaluation without the present controller's baseline is shown with the reason, an assessment
 * without the class verdict, the confirmation or the occupancy shift is not shown (a rerun
 * computes it). Invented minimal results, shaped as the JSON the app writes.
 */
import { describe, expect, it } from 'vitest';
import { assessmentFromJson, evaluationFromJson } from '../../../src/renderer/src/session/savedResults';

const evaluation = {
  project: 'p', evaluatedAt: '2026-11-01T00:00:00.000Z', valueSense: 'cost', behaviour: { value: 3, standardError: 0.1, episodes: 10, largestTruncationWeight: 0 },
  policies: [{ name: 'A', policyValue: 2, standardError: 0.1, fixedPointValue: 2, status: 'converged', message: '', iterations: 5, history: [], surface: null, featureCount: 6, backend: 'linear' }],
};

describe('results saved by an earlier version', () => {
  it('shows an evaluation without a baseline, saying why', () => {
    const e = evaluationFromJson(evaluation)!;
    expect(e.presentController).toBeNull();
    expect(e.presentControllerReason).toMatch(/earlier version; run again/);
  });

  it('does not show an assessment without the current fields', () => {
    const old = { settings: {}, comparison: {}, candidates: [{ name: 'A', diagnostics: { distributionShiftStart: 2 } }] };
    expect(assessmentFromJson(old)).toBeNull();
    const current = { settings: {}, comparison: {}, presentController: null, candidates: [{ name: 'A', confirmation: { status: 'unconfirmed', text: '' }, reportedRange: null, diagnostics: { occupancyShift: 1.1 } }] };
    expect(assessmentFromJson(current)).not.toBeNull();
  });
});
