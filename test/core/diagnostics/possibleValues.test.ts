/**
 * The range of values a policy can reach with rewards in the logged range: r_min/(1 − γ) to
 * r_max/(1 − γ), the geometric series (common practice). Checked on the closed form and on an
 * invented linear plant whose exact value (Lyapunov equation, src/core/lq.ts) must lie inside.
 * Runs that can end: a run paying r = −1 per step that ends after each step with probability p has
 * J = −1/(1 − γ(1 − p)) (the geometric series with ratio γ(1 − p); common practice), which lies
 * outside the range of a plant that goes on and must lie inside the range with ends.
 * An interval wholly outside the range: with every logged reward ≤ 0 no value is positive (the same
 * series), so an interval above 0 excludes every possible value however wide the range (and its
 * slack) is; one that reaches a possible value does not.
 */
import { describe, expect, it } from 'vitest';
import { intervalOutsidePossible, outsidePossible, possibleValues } from '../../../src/core/diagnostics/possibleValues';
import { exactPolicyValue, simulateLog } from '../linearGaussianPlant';
import { cascadeLogging, cascadePlant, startLaws } from '../testPlants';

describe('possible values', () => {
  it('is the geometric series of the logged extremes', () => {
    const range = possibleValues([-3, -1, -2.5], 0.9);
    expect(range.lower).toBeCloseTo(-30, 12);
    expect(range.upper).toBeCloseTo(-10, 12);
    expect(outsidePossible(-20, range)).toBe(false);
    expect(outsidePossible(5, range)).toBe(true); // a positive reward sum from negative rewards (a negative cost)
    expect(outsidePossible(-9.9, range)).toBe(false); // within the 1 % slack of the width
  });

  it('holds the exact value of the logging controller on an invented linear plant', () => {
    const [, steady] = startLaws(cascadePlant, cascadeLogging)[0];
    const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 50, steps: 100, seed: 3, start: steady });
    const exact = exactPolicyValue(cascadePlant, cascadeLogging, 0.97, data.startStates);
    expect(outsidePossible(exact, possibleValues(data.rewards, 0.97))).toBe(false);
  });

  it('takes in a run that ends after a single step where the log holds end states', () => {
    const discount = 0.9, endChance = 0.5, exact = -1 / (1 - discount * (1 - endChance)); // −1.818…
    const rewards = [-1, -1, -1];
    expect(outsidePossible(exact, possibleValues(rewards, discount))).toBe(true); // −10 is all a plant that goes on can pay
    const withEnds = possibleValues(rewards, discount, true);
    expect(withEnds.lower).toBeCloseTo(-10, 12);
    expect(withEnds.upper).toBeCloseTo(-1, 12); // one step, then the end
    expect(outsidePossible(exact, withEnds)).toBe(false);
    const mixed = possibleValues([-2, 3], discount, true); // rewards of both signs: the series' ends, as without ends
    expect([mixed.lower, mixed.upper]).toEqual([expect.closeTo(-20, 12), expect.closeTo(30, 12)]);
  });

  it('marks an interval that shares no point with the range, whatever the slack', () => {
    // One large upset among small costs: the range is −1000…0 and its 1 % slack (10) exceeds the estimate.
    const range = possibleValues([-0.01, -0.02, -30], 0.97);
    expect(range.upper).toBeCloseTo(-1 / 3, 12);
    expect(outsidePossible(6, range)).toBe(false); // within the slack of the width
    expect(intervalOutsidePossible(1.3, 11.3, range)).toBe(true); // no possible value is consistent with it
    expect(intervalOutsidePossible(-0.5, 12.3, range)).toBe(false); // reaches possible values
    expect(intervalOutsidePossible(-2000, -1500, range)).toBe(true); // below the range
  });
});
