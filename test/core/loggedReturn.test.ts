import { describe, expect, it } from 'vitest';
import { loggedDiscountedReturn } from '../../src/core/loggedReturn';
import type { TransitionSet } from '../../src/core/transitions';

function episodes(lengths: number[], reward: number): TransitionSet {
  const n = lengths.reduce((a, b) => a + b, 0);
  const episode = new Int32Array(n);
  let i = 0;
  lengths.forEach((len, k) => { for (let t = 0; t < len; t++) episode[i++] = k; });
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['x'], actionNames: ['u'],
    states: new Float64Array(n), actions: new Float64Array(n), rewards: new Float64Array(n).fill(reward),
    nextStates: new Float64Array(n), terminal: new Uint8Array(n), episode, episodeCount: lengths.length,
    startStates: new Float64Array(lengths.length), sourceLine: new Int32Array(n),
  };
}

describe('logged discounted return', () => {
  it('equals the geometric sum r(1 − γ^T)/(1 − γ) per episode', () => {
    // Finite geometric series (common practice).
    const g = 0.9;
    const result = loggedDiscountedReturn(episodes([10, 20], 2), g);
    const expected = [10, 20].map((t) => (2 * (1 - g ** t)) / (1 - g));
    expect(Array.from(result.perEpisode)).toEqual(expected.map((v) => expect.closeTo(v, 12)));
    expect(result.value).toBeCloseTo((expected[0] + expected[1]) / 2, 12);
    expect(result.largestTruncationWeight).toBeCloseTo(g ** 10, 14);
    // Two values: s.e. = |a − b| / 2.
    expect(result.standardError).toBeCloseTo(Math.abs(expected[0] - expected[1]) / 2, 12);
  });
});
