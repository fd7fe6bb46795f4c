/**
 * The range of values a policy can reach with rewards in the logged range: r_min/(1 − γ) to
 * r_max/(1 − γ), the geometric series (common practice). Checked on the closed form and on an
 * invented linear plant whose exact value (Lyapunov equation, src/core/lq.ts) must lie inside.
 */
import { describe, expect, it } from 'vitest';
import { outsidePossible, possibleValues } from '../../../src/core/diagnostics/possibleValues';
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
});
