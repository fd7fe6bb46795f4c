/**
 * Action support: the logged range at the k nearest logged states (checked against a brute-force
 * sort of all distances), and the probability a candidate puts outside it against the normal
 * distribution: P(|Z| > 1.959964) = 0.05 (Abramowitz & Stegun, Table 26.5 — from memory), with
 * the point masses of a clipped action and the renormalisation of a truncated one.
 */
import { describe, expect, it } from 'vitest';
import { actionIntervalProbability } from '../../../src/core/diagnostics/actionProbability';
import { loggedActionRanges, probabilityOutsideLoggedActions } from '../../../src/core/diagnostics/actionSupport';
import { createGaussianPolicy } from '../../../src/core/policy';
import { simulateLinearPlant } from '../fqe/simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.3], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 10, stepsPerEpisode: 60, seed: 12,
});

describe('loggedActionRanges', () => {
  it('takes the action range of the k nearest logged states in standardised state space', () => {
    const k = 15, ranges = loggedActionRanges(data, { neighbours: k, referenceStates: 10_000, queryStates: 7 });
    const n = data.count, sd = [0, 1].map((c) => {
      const v = Array.from({ length: n }, (_, i) => data.states[2 * i + c]), m = v.reduce((a, b) => a + b) / n;
      return Math.sqrt(v.reduce((a, b) => a + (b - m) ** 2, 0) / n);
    });
    for (let q = 0; q < 7; q++) {
      const s = [ranges.queries[2 * q], ranges.queries[2 * q + 1]];
      const nearest = Array.from({ length: n }, (_, i) => ({ i, d: ((data.states[2 * i] - s[0]) / sd[0]) ** 2 + ((data.states[2 * i + 1] - s[1]) / sd[1]) ** 2 }))
        .sort((a, b) => a.d - b.d).slice(0, k).map((x) => data.actions[x.i]);
      expect(ranges.lo[q]).toBe(Math.min(...nearest));
      expect(ranges.hi[q]).toBe(Math.max(...nearest));
    }
  });
});

describe('actionIntervalProbability and probabilityOutsideLoggedActions', () => {
  it('give the normal tail outside ±1.959964σ', () => {
    const p = createGaussianPolicy({ offset: [1], gain: [[0, 0]], std: [2] }, 2);
    expect(actionIntervalProbability(p, 0, 1, 1 - 1.959964 * 2, 1 + 1.959964 * 2)).toBeCloseTo(0.95, 6);
    const ranges = { queries: Float64Array.of(0, 0), lo: Float64Array.of(1 - 1.959964 * 2), hi: Float64Array.of(1 + 1.959964 * 2), neighbours: 1, referenceCount: 1 };
    expect(probabilityOutsideLoggedActions(p, ranges)[0]).toBeCloseTo(0.05, 6);
  });

  it('count a clip limit’s point mass inside a range that reaches the limit, and renormalise a truncation', () => {
    const clipped = createGaussianPolicy({ offset: [0], gain: [[0, 0]], std: [1], bounds: { lo: [0], hi: [5], mode: 'clip' } }, 2);
    expect(actionIntervalProbability(clipped, 0, 0, 0, 5)).toBeCloseTo(1, 12); // atom Φ(0) = 0.5 at 0 plus the rest
    expect(actionIntervalProbability(clipped, 0, 0, 0.0001, 5)).toBeCloseTo(0.5, 3);
    const truncated = createGaussianPolicy({ offset: [0], gain: [[0, 0]], std: [1], bounds: { lo: [0], hi: [Infinity], mode: 'truncate' } }, 2);
    expect(actionIntervalProbability(truncated, 0, 0, 0, 1.959964)).toBeCloseTo(0.95, 6); // half-normal: 2(Φ(1.96) − ½)
  });
});
